"""The design of the job: the existing-unit glue (a project room → its check), sizing (the
orchestrator: loads → cycle → systems → pull-down), systems of several rooms, pipework and
charge of a system, the way forward for an old unit, selection from a catalogue, annual
energy and TEWI.

Stage 6. May import: every stage below it (foundation, ``data``, ``physics``, ``loads``,
``equipment``, ``inputs``); never ``output`` or the CLI.
"""
