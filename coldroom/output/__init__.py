"""What the user gets: files written atomically and never over an input
(:mod:`~coldroom.output.files`), the terminal text (:mod:`~coldroom.output.terminal`) and
the PDF documents (:mod:`coldroom.output.pdf`). Output only presents results; it computes
nothing new.

Stage 7. May import: every stage below it; only the CLI imports it.
"""
