"""Demazure crystals and Demazure atoms as vertex masks, and the permutations that index them.

Conventions (the contract): a permutation is its one-line notation, a tuple of 1..n; a word
(i1, ..., ik) with letters in 1..n-1 means w = s_{i1} ... s_{ik}, permutations composed as
functions. The Demazure crystal of a word is D_{i1}(... D_{ik}(X0) ...), D_{ik} applied first,
where D_i(X) = {f_i^k x : x in X, k >= 0} and X0 holds the highest weight vertices (for
B(lambda), the single vertex u_lambda). For a reduced word of w its character is the key
polynomial of w.lambda, where (w.lambda)_{w(j)} = lambda_j (Kashiwara, "The crystal base and
Littelmann's refined Demazure character formula", 1993; Littelmann, "Crystal graphs and Young
tableaux", 1995).

A word that is not reduced gives the Demazure crystal of its Demazure product in the 0-Hecke
monoid (s_i * s_i = s_i), since D_i D_i = D_i; `demazure_product` computes it.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import check_budget, check_int, check_positive_int
from druse.crystal import Crystal, TableauCrystal

BoolArray = npt.NDArray[np.bool_]
Perm = tuple[int, ...]


def _int_tuple(x: Any, name: str) -> tuple[int, ...]:
    if isinstance(x, (str, bytes)) or not isinstance(x, (Sequence, np.ndarray)):
        raise TypeError(f"{name} must be a sequence of integers; got {type(x).__name__} {x!r}")
    return tuple(check_int(v, f"{name}[{k}]") for k, v in enumerate(list(x)))


def check_word(word: Any, n: int, name: str = "word") -> tuple[int, ...]:
    """A word in the simple transpositions of S_n: integers in 1..n-1."""
    letters = _int_tuple(word, name)
    for k, i in enumerate(letters):
        if not 1 <= i <= n - 1:
            raise ValueError(f"{name}[{k}] must be a letter in 1..{n - 1} (n = {n}); got {i}")
    return letters


def check_perm(perm: Any, name: str = "perm", n: int | None = None) -> Perm:
    """A permutation in one-line notation, a tuple of 1..n; a 0-based one is named as such."""
    w = _int_tuple(perm, name)
    if sorted(w) != list(range(1, len(w) + 1)):
        if sorted(w) == list(range(len(w))):
            raise ValueError(
                f"{name} must be a permutation of 1..{len(w)} in one-line notation; got {w}, "
                "which is 0-based: add 1 to each entry"
            )
        raise ValueError(
            f"{name} must be a permutation of 1..{len(w)} in one-line notation; got {w}"
        )
    if n is not None and len(w) != n:
        raise ValueError(f"{name} must have n = {n} entries; got {len(w)}")
    return w


def _crystal(C: Any) -> Crystal:
    if not isinstance(C, Crystal):
        raise TypeError(f"C must be a druse Crystal; got {type(C).__name__}")
    return C


def _table(C: Crystal) -> tuple[list[npt.NDArray[np.int64]], list[int]]:
    if isinstance(C, TableauCrystal) and C.n > 1 and any(i not in C._f for i in range(1, C.n)):
        C.lowering_tables()  # all f_i in one pass: faster than one i at a time
    ops = [C.f(i) for i in range(1, C.n)]
    if isinstance(C, TableauCrystal):  # connected: u_lambda is found by rank, without a scan
        return ops, [C.highest_weight()] if len(C) else []
    return ops, [int(v) for v in C.highest_weights()]


def _frozen(a: BoolArray) -> BoolArray:
    a.flags.writeable = False
    return a


def demazure_mask(C: Crystal, word: Sequence[int]) -> BoolArray:
    """The Demazure crystal D_{i1}(... D_{ik}(X0)) of a word, as a bool mask of length len(C).

    X0 is the set of highest weight vertices (for B(lambda) the vertex u_lambda; for a crystal
    with several components, the Demazure crystals of all components at once). A non-reduced
    word gives the Demazure crystal of its Demazure product (see `demazure_product`).

    Parameters
    ----------
    C : Crystal
        Any crystal table (only its f_i arrays are read).
    word : sequence of int
        Letters in 1..n-1; (i1, ..., ik) means w = s_{i1} ... s_{ik}, D_{ik} applied first.

    Returns
    -------
    numpy.ndarray of bool, shape (len(C),), read-only

    Raises
    ------
    TypeError, ValueError
        If a letter is not an integer in 1..n-1.

    Examples
    --------
    >>> import druse
    >>> from druse.demazure import demazure_mask
    >>> C = druse.crystal((1,), 3)
    >>> demazure_mask(C, (2, 1)).tolist()
    [True, True, True]
    >>> demazure_mask(C, (1, 2)).tolist()
    [True, True, False]
    """
    letters = check_word(word, _crystal(C).n)
    ops, start = _table(C)
    return _frozen(_core.demazure_closure(ops, len(C), start, list(letters)))


def demazure_mask_of(C: Crystal, perm: Sequence[int]) -> BoolArray:
    """The Demazure crystal of the permutation w (druse's canonical reduced word, see
    `reduced_word`), as a bool mask of length len(C). Its character is key(w.lambda)."""
    return demazure_mask(C, reduced_word(check_perm(perm, "perm", _crystal(C).n)))


def atom_mask(C: Crystal, perm: Sequence[int]) -> BoolArray:
    """The Demazure atom of w: the Demazure crystal of w minus those of all v < w (Bruhat).

    Computed as mask(w) minus the masks of the w t (t a transposition) with l(w t) = l(w) - 1,
    which suffices by the chain property of Bruhat order (Bjorner-Brenti, "Combinatorics of
    Coxeter Groups", 2005, Thm. 2.2.6). For B(lambda), the non-empty atoms are those of the
    minimal coset representatives w (w(j) < w(j+1) wherever lambda_j = lambda_{j+1}), one per
    distinct composition w.lambda, and they partition B(lambda) (Lascoux-Schutzenberger, "Keys
    and standard bases", 1990; Mason, "An explicit construction of type A Demazure atoms",
    2009); for any other w the atom is empty, because its Demazure crystal equals that of a
    shorter w s_j.
    """
    w = check_perm(perm, "perm", _crystal(C).n)
    ops, start = _table(C)
    return _frozen(_core.demazure_atom(ops, len(C), start, list(w)))


def all_demazure_masks(C: Crystal) -> BoolArray:
    """The Demazure crystals of every w in S_n at once, as an (n!, len(C)) bool array.

    Row k belongs to the k-th permutation in lexicographic order of one-line notation, the
    order of `all_permutations(n)` (and of ``itertools.permutations(range(1, n + 1))``). The
    masks are built along a tree, mask(w) = D_i(mask(s_i w)) for the smallest left descent i
    of w, one closure step per permutation.
    """
    rows = _factorial(_crystal(C).n)
    check_budget(rows * max(len(C), 1), f"the {rows} Demazure masks", "use demazure_mask_of")
    ops, start = _table(C)
    return _frozen(_core.demazure_all(ops, len(C), start))


def all_permutations(n: int) -> list[Perm]:
    """All permutations of S_n in lexicographic order of their one-line notation."""
    import itertools

    n = check_positive_int(n, "n")
    check_budget(_factorial(n) * n * 8, f"the {_factorial(n)} permutations of S_{n}", "iterate")
    return list(itertools.permutations(range(1, n + 1)))


def _factorial(n: int) -> int:
    out = 1
    for k in range(2, n + 1):
        out *= k
    return out


def length(perm: Sequence[int]) -> int:
    """The Coxeter length l(w): the number of inversions a < b, w(a) > w(b)."""
    return int(_core.perm_length(list(check_perm(perm))))


def reduced_word(perm: Sequence[int]) -> tuple[int, ...]:
    """druse's canonical reduced word of w (letters in 1..n-1).

    It is found by removing right descents: repeatedly replace w by w s_d, d the smallest
    position with w(d) > w(d+1), until w is the identity; if d1, ..., dk are the letters
    removed, w = s_dk ... s_d1 and the word returned is (dk, ..., d1).

    Examples
    --------
    >>> from druse.demazure import reduced_word
    >>> reduced_word((3, 2, 1))
    (1, 2, 1)
    >>> reduced_word((1, 2, 3))
    ()
    """
    return tuple(_core.perm_reduced_word(list(check_perm(perm))))


def word_permutation(word: Sequence[int], n: int) -> Perm:
    """The permutation s_{i1} ... s_{ik} of S_n, in one-line notation."""
    n = check_positive_int(n, "n")
    return tuple(_core.perm_of_word(list(check_word(word, n)), n, False))


def demazure_product(word: Sequence[int], n: int) -> Perm:
    """The Demazure product of a word in the 0-Hecke monoid of S_n.

    w * s_i = w s_i if l(w s_i) > l(w) and w otherwise (so s_i * s_i = s_i); for a reduced word
    it is the ordinary product (Norton, "0-Hecke algebras", 1979).

    Examples
    --------
    >>> from druse.demazure import demazure_product
    >>> demazure_product((1, 1, 2, 1), 3)
    (3, 2, 1)
    """
    n = check_positive_int(n, "n")
    return tuple(_core.perm_of_word(list(check_word(word, n)), n, True))


def bruhat_le(u: Sequence[int], v: Sequence[int]) -> bool:
    """u <= v in the Bruhat order of S_n, by the tableau criterion (Ehresmann 1934;
    Bjorner-Brenti, "Combinatorics of Coxeter Groups", 2005, Thm. 2.6.3): for every k the
    sorted first k entries of u are entrywise at most those of v."""
    a, b = check_perm(u, "u"), check_perm(v, "v")
    if len(a) != len(b):
        raise ValueError(f"u and v must lie in the same S_n; got lengths {len(a)} and {len(b)}")
    return bool(_core.perm_bruhat_le(list(a), list(b)))
