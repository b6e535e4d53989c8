"""Sourced tables: insulation materials and surface films, refrigerants (safety class, GWP,
LFL, model limits), copper tube series; the product table's YAML (read by
:mod:`coldroom.physics.products`) and the starter project. Each entry names its source.

Stage 1 of the layout. May import: the foundation (``errors``, ``constants``, ``units``,
``registry``, ``results``, ``rules``) only.
"""
