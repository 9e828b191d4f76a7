"""druse: type A crystals on tableaux, Demazure characters, Schur and key polynomials, exactly."""

from druse.crystal import Crystal, TableauCrystal, crystal
from druse.demazure import (
    all_demazure_masks,
    all_permutations,
    atom_mask,
    bruhat_le,
    demazure_mask,
    demazure_mask_of,
    demazure_product,
    reduced_word,
    word_permutation,
)
from druse.errors import InternalError, TooLargeError
from druse.expansion import (
    Positivity,
    atom_expansion,
    key_expansion,
    positivity,
    schur_expansion,
)
from druse.key import (
    atom,
    demazure_atom_operator,
    divided_difference,
    isobaric_divided_difference,
    key,
)
from druse.poly import Poly
from druse.schur import kostka, schur
from druse.tableau_keys import (
    left_key,
    left_key_weights,
    left_keys,
    right_key,
    right_key_weights,
    right_keys,
)
from druse.tableaux import count_by_enumeration, count_tableaux, iter_tableaux

__all__ = [
    "Crystal",
    "InternalError",
    "Poly",
    "Positivity",
    "TableauCrystal",
    "TooLargeError",
    "all_demazure_masks",
    "all_permutations",
    "atom",
    "atom_expansion",
    "atom_mask",
    "bruhat_le",
    "count_by_enumeration",
    "count_tableaux",
    "crystal",
    "demazure_atom_operator",
    "demazure_mask",
    "demazure_mask_of",
    "demazure_product",
    "divided_difference",
    "isobaric_divided_difference",
    "iter_tableaux",
    "key",
    "key_expansion",
    "kostka",
    "left_key",
    "left_key_weights",
    "left_keys",
    "positivity",
    "reduced_word",
    "right_key",
    "right_key_weights",
    "right_keys",
    "schur",
    "schur_expansion",
    "word_permutation",
]

__version__ = "0.1.0"
