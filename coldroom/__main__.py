"""``python -m coldroom`` runs the command-line interface."""

from coldroom.cli import main

if __name__ == "__main__":  # pragma: no cover
    main()
