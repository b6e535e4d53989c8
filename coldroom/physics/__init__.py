"""Physics on plain numbers: refrigerant properties (the only CoolProp importer), the
vapour-compression cycle, p–h chart data, psychrometrics, food properties and the product
table, refrigerant line sizing and the refrigerant charge.

Stage 2. May import: the foundation and ``data``. Never the project file's models
(``inputs``): everything arrives as floats, names and records.
"""
