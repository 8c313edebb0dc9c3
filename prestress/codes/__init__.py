"""Published models, one module (or package) per code and edition.

Each function implements one equation, is named after the code's symbols,
cites its clause in the first docstring line and states its arguments' units.
Functions here work in the code's own units; the engine converts once.
"""
