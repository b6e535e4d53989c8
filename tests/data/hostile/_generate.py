"""Regenerate the hostile project-file corpus in this folder.

Run by hand (``python tests/data/hostile/_generate.py``); the files it writes
are committed. Each case is a variant of BASE (a small valid project) or raw
bytes. ``expected.yaml`` (written by hand, next to this script) says which
error each file must produce. The > 1 MiB file is made by the test itself.
"""

from __future__ import annotations

from pathlib import Path

HERE = Path(__file__).resolve().parent

BASE = """\
# Hostile-input corpus: a small valid project, varied one mistake at a time (invented data).
project:
  name: Hostile base
  units: SI
design:
  outdoor_temperature: 30 °C
  outdoor_rh: 50 %
  ground_temperature: 12 °C
constructions:
  panel:
    layers:
      - material: pur_panel
        thickness: 100 mm
rooms:
  - name: Cooler
    temperature: 2 °C
    rh: 85 %
    dimensions:
      length: 4 m
      width: 3 m
      height: 2.6 m
    envelope:
      walls: {construction: panel, facing: space, temperature: 20 °C}
      ceiling: {construction: panel, facing: space, temperature: 25 °C}
      floor: {construction: panel, facing: ground}
    doors:
      - name: main
        wall: north
        width: 0.9 m
        height: 2.0 m
        passages_per_day: 40
    products:
      - product: apples
        daily_intake: 200 kg
        entering_temperature: 15 °C
        final_temperature: 3 °C
    fans:
      count: 1
      power: 60 W
      in_air_stream: true
    defrost:
      type: off_cycle
      per_day: 4
      duration: 30 min
    refrigeration:
      refrigerant: R-448A
"""


def variant(*pairs: tuple[str, str]) -> str:
    text = BASE
    for old, new in pairs:
        assert text.count(old) == 1, old
        text = text.replace(old, new)
    return text


EXISTING_UNIT = """\
      refrigerant: R-448A
    existing_unit:
      refrigerant: R-448A
      rated_point:
        capacity: 4.5 kW
        evaporating_temperature: -10 °C
        condensing_temperature: 45 °C
        power: 2.2 kW
"""

BOMB = "project: {name: bomb}\n" + "a0: &a0 [lol, lol, lol, lol, lol, lol, lol, lol, lol]\n" + "".join(
    f"a{i}: &a{i} [{', '.join([f'*a{i - 1}'] * 9)}]\n" for i in range(1, 10)
)

CASES: dict[str, str | bytes] = {
    # --- keys ---------------------------------------------------------------------------
    "unknown_key_in_room.yaml": variant(("    rh: 85 %\n", "    rh: 85 %\n    humidty: 80 %\n")),
    "unknown_key_top_level.yaml": BASE + "roms: []\n",
    "missing_outdoor_temperature.yaml": variant(("  outdoor_temperature: 30 °C\n", "")),
    "missing_rooms.yaml": BASE.split("rooms:\n")[0],
    "empty_rooms_list.yaml": BASE.split("rooms:\n")[0] + "rooms: []\n",
    "duplicate_key.yaml": variant(("    rh: 85 %\n", "    rh: 85 %\n    temperature: 4 °C\n")),
    "merge_key.yaml": variant(
        ("      floor: {construction: panel, facing: ground}\n",
         "      floor: {construction: panel, facing: ground}\n      north:\n        <<: {construction: panel}\n        facing: outdoors\n")
    ),
    "non_text_key.yaml": BASE + "1: one\n",
    # --- units and numbers --------------------------------------------------------------------
    "wrong_unit_kind_length.yaml": variant(("      height: 2.6 m\n", "      height: 2.6 kg\n")),
    "wrong_unit_kind_temperature.yaml": variant(("    temperature: 2 °C\n", "    temperature: 2 kW\n")),
    "unknown_unit.yaml": variant(("        thickness: 100 mm\n", "        thickness: 100 parsecs\n")),
    "not_a_number.yaml": variant(("        passages_per_day: 40\n", "        passages_per_day: many\n")),
    "negative_length.yaml": variant(("      length: 4 m\n", "      length: -4 m\n")),
    "zero_width.yaml": variant(("      width: 3 m\n", "      width: 0 m\n")),
    "zero_thickness.yaml": variant(("        thickness: 100 mm\n", "        thickness: 0 mm\n")),
    "nan.yaml": variant(("    temperature: 2 °C\n", "    temperature: .nan\n")),
    "inf.yaml": variant(("      length: 4 m\n", "      length: .inf\n")),
    "nan_in_quantity_text.yaml": variant(("    temperature: 2 °C\n", "    temperature: nan °C\n")),
    "huge_exponent.yaml": variant(("      length: 4 m\n", "      length: 1e999\n")),
    "long_digit_string.yaml": variant(("        passages_per_day: 40\n", "        passages_per_day: " + "9" * 5000 + "\n")),
    "yes_no_boolean.yaml": variant(("      in_air_stream: true\n", "      in_air_stream: yes\n")),
    "no_as_country_code.yaml": variant(("  units: SI\n", "  units: SI\n  site: no\n")),
    "octal.yaml": variant(("        passages_per_day: 40\n", "        passages_per_day: 040\n")),
    "sexagesimal.yaml": variant(("      duration: 30 min\n", "      duration: 1:30\n")),
    "underscore_number.yaml": variant(("        daily_intake: 200 kg\n", "        daily_intake: 1_200\n")),
    "bad_date.yaml": variant(("  units: SI\n", "  units: SI\n  date: 2026-13-45\n")),
    "list_instead_of_mapping.yaml": variant(
        ("    dimensions:\n      length: 4 m\n      width: 3 m\n      height: 2.6 m\n", "    dimensions: [4, 3, 2.6]\n")
    ),
    "rh_above_100.yaml": variant(("    rh: 85 %\n", "    rh: 120 %\n")),
    "name_is_a_number.yaml": variant(("  name: Hostile base\n", "  name: 12\n")),
    "rooms_is_a_mapping.yaml": BASE.split("rooms:\n")[0] + "rooms: {name: Cooler}\n",
    "bad_choice.yaml": variant(("      floor: {construction: panel, facing: ground}\n", "      floor: {construction: panel, facing: earth}\n")),
    "thousands_separator.yaml": variant(("        daily_intake: 200 kg\n", "        daily_intake: 1,000 kg\n")),
    "decimal_comma.yaml": variant(("      power: 60 W\n", "      power: 0,06 kW\n")),
    "milli_for_mega.yaml": variant(("      power: 60 W\n", "      power: 60 mW\n")),
    "pulldown_instant.yaml": variant(("        final_temperature: 3 °C\n", "        final_temperature: 3 °C\n        pulldown_time: 1e-5 h\n")),
    "pulldown_denormal.yaml": variant(("        final_temperature: 3 °C\n", "        final_temperature: 3 °C\n        pulldown_time: 4.9e-324 h\n")),
    "rated_power_denormal.yaml": variant(("      refrigerant: R-448A\n", EXISTING_UNIT.replace("power: 2.2 kW", "power: 2.2e-308 kW"))),
    "rated_capacity_with_comma.yaml": variant(("      refrigerant: R-448A\n", EXISTING_UNIT.replace("capacity: 4.5 kW", "capacity: '15,000 Btu/h'"))),
    "co2_unit_rated_at_45.yaml": variant(("      refrigerant: R-448A\n", EXISTING_UNIT.replace("existing_unit:\n      refrigerant: R-448A", "existing_unit:\n      refrigerant: R-744"))),
    # --- YAML attacks and broken files ------------------------------------------------------------
    "billion_laughs.yaml": BOMB,
    "deep_nesting.yaml": "project: " + "[" * 200 + "]" * 200 + "\n",
    "deep_nesting_block.yaml": "".join("  " * i + f"k{i}:\n" for i in range(60)) + "  " * 60 + "v: 1\n",
    "python_tag_apply.yaml": variant(("  name: Hostile base\n", "  name: !!python/object/apply:os.system [\"echo owned > owned.txt\"]\n")),
    "python_tag_name.yaml": variant(("  - name: Cooler\n", "  - name: !!python/name:os.system\n")),
    "custom_tag.yaml": variant(("  panel:\n", "  panel: !include other.yaml\n  other:\n")),
    "syntax_unclosed_bracket.yaml": variant(("      walls: {construction: panel, facing: space, temperature: 20 °C}\n",
                                             "      walls: {construction: panel, facing: space, temperature: 20 °C\n")),
    "tab_indentation.yaml": variant(("    rh: 85 %\n", "\trh: 85 %\n")),
    "non_utf8_latin1.yaml": variant(("    temperature: 2 °C\n", "    temperature: 2 \udcb0C\n")).encode("utf-8", "surrogateescape"),
    "utf16_bom.yaml": BASE.encode("utf-16"),
    "utf8_bom_then_error.yaml": b"\xef\xbb\xbf" + variant(("    rh: 85 %\n", "    rh: 85 %\n    humidty: 80 %\n")).encode(),
    "control_character.yaml": variant(("  name: Hostile base\n", "  name: Hostile\x07 base\n")),
    "name_escape_sequence.yaml": variant(("  - name: Cooler\n", '  - name: "Cooler\\e[2J\\e]0;owned\\a"\n')),
    "key_escape_sequence.yaml": BASE + '"roms\\e[2J\\e]0;owned\\a": []\n',
    "name_nul.yaml": variant(("  name: Hostile base\n", '  name: "Hostile\\0 base"\n')),
    "empty.yaml": "",
    "only_comments.yaml": "# nothing here but a comment\n\n",
    "top_level_list.yaml": "- project: {name: x}\n- rooms: []\n",
    "top_level_scalar.yaml": "just some text\n",
    "several_documents.yaml": BASE + "---\n" + BASE,
    # --- physically impossible --------------------------------------------------------------------
    "room_warmer_than_outdoors.yaml": variant(("    temperature: 2 °C\n", "    temperature: 20 °C\n"), ("  outdoor_temperature: 30 °C\n", "  outdoor_temperature: 18 °C\n")),
    "final_above_entering.yaml": variant(("        final_temperature: 3 °C\n", "        final_temperature: 18 °C\n")),
    "final_below_room.yaml": variant(("        final_temperature: 3 °C\n", "        final_temperature: -5 °C\n")),
    "door_wider_than_wall.yaml": variant(("        width: 0.9 m\n", "        width: 5 m\n")),
    "door_taller_than_room.yaml": variant(("        height: 2.0 m\n", "        height: 3.0 m\n")),
    "doors_fill_more_than_wall.yaml": variant(
        ("        passages_per_day: 40\n",
         "        passages_per_day: 40\n      - {name: second, wall: north, width: 3.5 m, height: 2.5 m}\n      - {name: third, wall: north, width: 3.0 m, height: 2.5 m}\n")
    ),
    "door_open_more_than_a_day.yaml": variant(("        passages_per_day: 40\n", "        passages_per_day: 10000\n        passage_time: 60 s\n")),
    "tiny_room.yaml": variant(("      length: 4 m\n      width: 3 m\n", "      length: 0.2 m\n      width: 0.2 m\n")),
    "unknown_product.yaml": variant(("      - product: apples\n", "      - product: aples\n")),
    "unknown_material.yaml": variant(("      - material: pur_panel\n", "      - material: pur_pannel\n")),
    "unknown_refrigerant.yaml": variant(("      refrigerant: R-448A\n", "      refrigerant: R-448\n")),
    "construction_not_defined.yaml": variant(("      ceiling: {construction: panel,", "      ceiling: {construction: panell,")),
    "wet_bulb_above_dry_bulb.yaml": variant(("  outdoor_rh: 50 %\n", "  outdoor_wet_bulb: 32 °C\n")),
    "wet_bulb_too_low.yaml": variant(("  outdoor_rh: 50 %\n", "  outdoor_wet_bulb: -20 °C\n")),
    "rh_and_wet_bulb.yaml": variant(("  outdoor_rh: 50 %\n", "  outdoor_rh: 50 %\n  outdoor_wet_bulb: 22 °C\n")),
    "condenser_air_below_room.yaml": variant(("      refrigerant: R-448A\n", "      refrigerant: R-448A\n      condenser_air_temperature: 0 °C\n")),
    "co2_below_triple_point.yaml": variant(
        ("    temperature: 2 °C\n", "    temperature: -40 °C\n"),
        ("        final_temperature: 3 °C\n", "        final_temperature: -18 °C\n"),
        ("      floor: {construction: panel, facing: ground}\n", "      floor: {construction: panel, facing: heated_slab, temperature: 5 °C}\n"),
        ("      refrigerant: R-448A\n", "      refrigerant: R-744\n      evaporator_td: 20 K\n      condenser_air_temperature: 10 °C\n"),
    ),
    "r404a_above_critical.yaml": variant(
        ("      refrigerant: R-448A\n", "      refrigerant: R-404A\n      condenser_air_temperature: 50 °C\n      condenser_td: 25 K\n")
    ),
    "defrost_longer_than_a_day.yaml": variant(("      per_day: 4\n      duration: 30 min\n", "      per_day: 20\n      duration: 90 min\n")),
    "colour_on_inside_wall.yaml": variant(("      walls: {construction: panel, facing: space, temperature: 20 °C}\n",
                                           "      walls: {construction: panel, facing: space, temperature: 20 °C, colour: dark}\n")),
    "ground_with_temperature.yaml": variant(("      floor: {construction: panel, facing: ground}\n",
                                             "      floor: {construction: panel, facing: ground, temperature: 15 °C}\n")),
    "wall_without_temperature.yaml": variant(("      walls: {construction: panel, facing: space, temperature: 20 °C}\n",
                                              "      walls: {construction: panel, facing: space}\n")),
}


def main() -> None:
    for old in HERE.glob("*.yaml"):
        if old.name != "expected.yaml":
            old.unlink()
    for name, content in CASES.items():
        data = content if isinstance(content, bytes) else content.encode("utf-8")
        (HERE / name).write_bytes(data)
    print(f"wrote {len(CASES)} files")


if __name__ == "__main__":
    main()
