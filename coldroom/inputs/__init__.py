"""Everything a command reads: the hardened YAML reader, the project file's pydantic models
(units → SI), the cross-field physical checks and warnings, options, the equipment
catalogue and weather files; :func:`coldroom.inputs.opening.open_project` is the one way a
command opens a project.

Stage 5. May import: the foundation, ``data``, ``physics``, ``loads`` and ``equipment``
(the physical checks use the same site pressure and U-values the loads use). Nothing below
it imports it.
"""
