"""`coldroom products [TEXT]`: lists and searches the product table (command-line behaviour)."""

from __future__ import annotations

import subprocess
import sys

from typer.testing import CliRunner

from coldroom.cli import app
from coldroom.physics.products import load_products

runner = CliRunner()


def test_lists_every_product_with_header():
    result = runner.invoke(app, ["products"])
    assert result.exit_code == 0, result.output
    lines = result.output.strip().splitlines()
    assert lines[0].split()[:3] == ["key", "name", "category"]
    assert len(lines) == 1 + len(load_products())
    assert any(line.startswith("ice_cream ") for line in lines)


def test_search_by_substring_of_key_name_alias_category():
    out = runner.invoke(app, ["products", "berr"]).output
    keys = [line.split()[0] for line in out.strip().splitlines()[1:]]
    assert keys == ["strawberries", "blueberries"]
    flowers = runner.invoke(app, ["products", "cut flowers"]).output
    assert "roses" in flowers and "carnations" in flowers and "apples" not in flowers
    prawn = runner.invoke(app, ["products", "Prawn"]).output  # alias, any case
    assert "shrimp" in prawn


def test_row_shows_freezing_point_storage_range_and_rh():
    out = runner.invoke(app, ["products", "strawberries"]).output
    row = out.strip().splitlines()[1]
    assert "-0.8" in row and "0 … 0.5" in row and "90-95" in row


def test_no_match_is_exit_1_with_message_on_stderr():
    result = subprocess.run(
        [sys.executable, "-m", "coldroom", "products", "zzzz"], capture_output=True, text=True
    )
    assert result.returncode == 1
    assert "no product matches 'zzzz'" in result.stderr
    assert result.stdout == ""


def test_products_command_imports_neither_coolprop_nor_reportlab():
    code = (
        "import sys\n"
        "from typer.testing import CliRunner\n"
        "from coldroom.cli import app\n"
        "r = CliRunner().invoke(app, ['products'])\n"
        "assert r.exit_code == 0, r.output\n"
        "bad = [m for m in sys.modules if m.split('.')[0] in ('CoolProp', 'reportlab')]\n"
        "print(','.join(bad))\n"
    )
    result = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True)
    assert result.returncode == 0, result.stderr
    assert result.stdout.strip() == ""
