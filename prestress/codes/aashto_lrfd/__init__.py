"""AASHTO LRFD Bridge Design Specifications, 9th Edition (2020).

Equations in US customary units as printed in the specification (ksi, kip,
in, ft, kcf) unless a docstring says otherwise.
"""
