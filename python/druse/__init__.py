"""druse: type A crystals on tableaux, Demazure characters, Schur and key polynomials, exactly."""

from druse.crystal import Crystal, TableauCrystal, crystal
from druse.errors import InternalError, TooLargeError
from druse.poly import Poly
from druse.schur import kostka, schur
from druse.tableaux import count_by_enumeration, count_tableaux, iter_tableaux

__all__ = [
    "Crystal",
    "InternalError",
    "Poly",
    "TableauCrystal",
    "TooLargeError",
    "count_by_enumeration",
    "count_tableaux",
    "crystal",
    "iter_tableaux",
    "kostka",
    "schur",
]

__version__ = "0.1.0"
