"""``coldroom serve``: the project file and its answers side by side in a local browser page.

A view on the commands' own outputs (:mod:`coldroom.output.produce`): it computes nothing of its
own. :mod:`.app` is the Starlette application (token, Host/Origin checks, bounded bodies, the API);
:mod:`.run` binds 127.0.0.1 and runs uvicorn. Starlette and uvicorn are the optional extra
``pip install ".[serve]"`` and are imported only when the command runs.

May import: every stage (it sits at the top, beside the CLI); the CLI imports it only inside ``serve``.
"""
