"""What the user gets: files written atomically and never over an input
(:mod:`~coldroom.output.files`), the terminal text (:mod:`~coldroom.output.terminal`) and
the PDF documents (:mod:`coldroom.output.pdf`) and the JSON documents: their envelope
(:mod:`~coldroom.output.json_contract`) and schema (:mod:`~coldroom.output.json_schema`). Output only presents results; it computes
nothing new.

Stage 7. May import: every stage below it; only the CLI imports it.
"""
