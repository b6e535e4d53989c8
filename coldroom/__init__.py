"""coldroom: heat loads and refrigeration-cycle sizing for walk-in coolers and freezers.

Importing this package is cheap: CoolProp and reportlab are imported only by
the modules that need them (``coldroom.physics.refrigerant`` and ``coldroom.output.pdf``).
"""

from __future__ import annotations

__version__ = "0.1.0"

__all__ = ["__version__"]
