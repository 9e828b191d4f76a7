"""druse: type A crystals on tableaux, Demazure characters, Schur and key polynomials, exactly."""

from druse.axioms import AxiomReport, Violation, check_crystal
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
    key_expansions,
    positivity,
    schur_expansion,
)
from druse.io import load_crystal, save_crystal
from druse.key import (
    atom,
    demazure_atom_operator,
    divided_difference,
    isobaric_divided_difference,
    key,
)
from druse.lr import LRTable, lr, lr_by_crystal, lr_table
from druse.pipe_crystal import (
    FactorizationCrystal,
    PipeDreamCrystal,
    factorization_crystal,
    pipe_dream_crystal,
)
from druse.pipe_dreams import (
    PipeDreams,
    compatible_sequence,
    count_pipe_dreams,
    draw_pipe_dream,
    iter_pipe_dreams,
    pipe_dream_from_compatible,
    pipe_dream_of_mask,
    pipe_dreams,
)
from druse.poly import Poly
from druse.recognition import (
    DemazurePiece,
    DemazureRecognition,
    DemazureWitness,
    demazure_recognition,
)
from druse.schubert import all_schuberts, schubert, schubert_by_divided_differences
from druse.schubert_keys import (
    all_schubert_key_expansions,
    schubert_key_expansion,
    stanley_schur_expansion,
)
from druse.schur import kostka, schur
from druse.structure import Component, decompose, tableau_isomorphism
from druse.tableau_keys import (
    left_key,
    left_key_weights,
    left_keys,
    right_key,
    right_key_weights,
    right_keys,
)
from druse.tableaux import count_by_enumeration, count_tableaux, iter_tableaux
from druse.tensor import TensorCrystal, tensor_product
from druse.user_crystal import LabelledCrystal, crystal_from_edges, crystal_from_operators

__all__ = [
    "AxiomReport",
    "Component",
    "Crystal",
    "DemazurePiece",
    "DemazureRecognition",
    "DemazureWitness",
    "FactorizationCrystal",
    "InternalError",
    "LRTable",
    "LabelledCrystal",
    "PipeDreamCrystal",
    "PipeDreams",
    "Poly",
    "Positivity",
    "TableauCrystal",
    "TensorCrystal",
    "TooLargeError",
    "Violation",
    "all_demazure_masks",
    "all_permutations",
    "all_schubert_key_expansions",
    "all_schuberts",
    "atom",
    "atom_expansion",
    "atom_mask",
    "bruhat_le",
    "check_crystal",
    "compatible_sequence",
    "count_by_enumeration",
    "count_pipe_dreams",
    "count_tableaux",
    "crystal",
    "crystal_from_edges",
    "crystal_from_operators",
    "decompose",
    "demazure_atom_operator",
    "demazure_mask",
    "demazure_mask_of",
    "demazure_product",
    "demazure_recognition",
    "divided_difference",
    "draw_pipe_dream",
    "factorization_crystal",
    "isobaric_divided_difference",
    "iter_pipe_dreams",
    "iter_tableaux",
    "key",
    "key_expansion",
    "key_expansions",
    "kostka",
    "left_key",
    "left_key_weights",
    "left_keys",
    "load_crystal",
    "lr",
    "lr_by_crystal",
    "lr_table",
    "pipe_dream_crystal",
    "pipe_dream_from_compatible",
    "pipe_dream_of_mask",
    "pipe_dreams",
    "positivity",
    "reduced_word",
    "right_key",
    "right_key_weights",
    "right_keys",
    "save_crystal",
    "schubert",
    "schubert_by_divided_differences",
    "schubert_key_expansion",
    "schur",
    "schur_expansion",
    "stanley_schur_expansion",
    "tableau_isomorphism",
    "tensor_product",
    "word_permutation",
]

__version__ = "0.1.0"
