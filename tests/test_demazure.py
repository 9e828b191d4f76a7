"""Demazure crystals and atoms as vertex masks, and the permutations of S_n that index them.

Key polynomials are computed here independently with sympy from the isobaric divided
differences pi_i f = (x_i f - x_{i+1} s_i f) / (x_i - x_{i+1}) (Demazure, "Une nouvelle formule
des caracteres", 1974; Lascoux-Schutzenberger, "Keys and standard bases", 1990), never with
druse's own key polynomials.
"""

from __future__ import annotations

import itertools
from functools import cache
from typing import Any

import numpy as np
import pytest
import sympy  # type: ignore[import-untyped]
from hypothesis import given
from hypothesis import strategies as st

import druse
from druse import demazure as dm

Perm = tuple[int, ...]


def shapes_up_to(size: int, rows: int) -> list[tuple[int, ...]]:
    """Partitions with at most `rows` parts and at most `size` cells."""
    out: list[tuple[int, ...]] = [()]
    for total in range(1, size + 1):
        for parts in itertools.product(range(total + 1), repeat=rows):
            if sum(parts) == total and list(parts) == sorted(parts, reverse=True):
                out.append(tuple(p for p in parts if p))
    return sorted(set(out))


def perms(n: int) -> list[Perm]:
    return list(itertools.permutations(range(1, n + 1)))


def swap_values(w: Perm, i: int) -> Perm:
    """s_i w: exchange the values i and i+1 in the one-line notation."""
    return tuple(i + 1 if x == i else i if x == i + 1 else x for x in w)


def left_descent(w: Perm) -> int:
    """The smallest i with i+1 left of i in w, so that l(s_i w) = l(w) - 1 (Bjorner-Brenti 1.5)."""
    return next(i for i in range(1, len(w)) if w.index(i + 1) < w.index(i))


def all_reduced_words(w: Perm) -> set[tuple[int, ...]]:
    """Every reduced word of w, by removing right descents (w(d) > w(d+1)) in every order."""
    if list(w) == sorted(w):
        return {()}
    out: set[tuple[int, ...]] = set()
    for d in range(1, len(w)):
        if w[d - 1] > w[d]:
            v = (*w[: d - 1], w[d], w[d - 1], *w[d + 1 :])
            out |= {(*word, d) for word in all_reduced_words(v)}
    return out


def inversions(w: Perm) -> int:
    return sum(1 for a, b in itertools.combinations(range(len(w)), 2) if w[a] > w[b])


def pi(f: sympy.Poly, i: int, xs: list[Any]) -> sympy.Poly:
    """Isobaric divided difference pi_i by sympy's exact polynomial division."""
    swapped = {(*e[: i - 1], e[i], e[i - 1], *e[i + 1 :]): c for e, c in f.as_dict().items()}
    sf = sympy.Poly.from_dict(swapped, *xs)
    quotient, remainder = sympy.div(xs[i - 1] * f - xs[i] * sf, sympy.Poly(xs[i - 1] - xs[i], *xs))
    assert remainder.is_zero
    return quotient


@cache
def key_of(shape: tuple[int, ...], w: Perm) -> dict[tuple[int, ...], int]:
    """key(w.lambda) = pi_{i1} ... pi_{ik} x^lambda for w = s_{i1} ... s_{ik} reduced, built
    as pi_i applied to the key of s_i w for a left descent i (Demazure 1974)."""
    n = len(w)
    xs = list(sympy.symbols(f"x1:{n + 1}"))
    lam = (*shape, *([0] * (n - len(shape))))
    if list(w) == sorted(w):
        return {lam: 1}
    i = left_descent(w)
    below = sympy.Poly.from_dict(key_of(shape, swap_values(w, i)), *xs)
    return {tuple(e): int(c) for e, c in pi(below, i, xs).as_dict().items()}


@cache
def atom_of(shape: tuple[int, ...], w: Perm) -> dict[tuple[int, ...], int]:
    """The atom of w.lambda for a minimal coset representative w: x^lambda at the identity, and
    (pi_i - 1) applied to the atom of s_i w for a left descent i (Lascoux-Schutzenberger 1990;
    Mason 2009); s_i w is again a minimal representative (Bjorner-Brenti 2005, Prop. 2.4.4)."""
    n = len(w)
    xs = list(sympy.symbols(f"x1:{n + 1}"))
    lam = (*shape, *([0] * (n - len(shape))))
    if list(w) == sorted(w):
        return {lam: 1}
    below = sympy.Poly.from_dict(atom_of(shape, swap_values(w, left_descent(w))), *xs)
    got = pi(below, left_descent(w), xs) - below
    return {tuple(e): int(c) for e, c in got.as_dict().items() if c}


def character(C: druse.Crystal, mask: np.ndarray[Any, Any]) -> dict[tuple[int, ...], int]:
    return {e: c for e, c in C.character(mask).to_dict().items() if c}


CASES = [(s, n) for n in range(1, 5) for s in shapes_up_to(6, 3) if len(s) <= n]


@pytest.mark.parametrize(("shape", "n"), CASES)
def test_demazure_character_formula(shape: tuple[int, ...], n: int) -> None:
    # character of B_w(lambda) = key(w.lambda) for every w in S_n (Kashiwara 1993; Littelmann
    # 1995), against sympy's pi_i (Demazure 1974)
    C = druse.crystal(shape, n)
    table = dm.all_demazure_masks(C)
    assert table.shape == (len(perms(n)), len(C))
    for row, w in zip(table, perms(n), strict=True):  # rows in lexicographic order, as documented
        assert character(C, row) == key_of(shape, w), (shape, w)
        assert np.array_equal(dm.demazure_mask_of(C, w), row)


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 4), ((3, 1, 1), 4), ((2, 2), 3)])
def test_every_reduced_word_gives_the_same_mask(shape: tuple[int, ...], n: int) -> None:
    # reduced words of w are connected by braid moves (Matsumoto 1964; Tits 1969), and the
    # Demazure crystal depends on w only (Kashiwara 1993)
    C = druse.crystal(shape, n)
    for w in perms(n):
        words = all_reduced_words(w)
        assert dm.reduced_word(w) in words
        masks = {dm.demazure_mask(C, word).tobytes() for word in words}
        assert masks == {dm.demazure_mask_of(C, w).tobytes()}


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 3), ((3, 2), 4), ((1, 1), 4), ((4,), 2)])
def test_extremes(shape: tuple[int, ...], n: int) -> None:
    # B_{w0}(lambda) = B(lambda) and B_id(lambda) = {u_lambda} (Kashiwara 1993)
    C = druse.crystal(shape, n)
    w0 = tuple(range(n, 0, -1))
    assert dm.demazure_mask_of(C, w0).all()
    identity = dm.demazure_mask(C, ())
    assert np.flatnonzero(identity).tolist() == [C.highest_weight()]


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 3), ((2, 1, 1), 4)])
def test_non_reduced_words_give_the_demazure_product(shape: tuple[int, ...], n: int) -> None:
    # D_i D_i = D_i (definition), so a word gives the crystal of its 0-Hecke product (Norton 1979)
    C = druse.crystal(shape, n)
    for k in range(5):
        for word in itertools.product(range(1, n), repeat=k):
            w = dm.demazure_product(word, n)
            assert np.array_equal(dm.demazure_mask(C, word), dm.demazure_mask_of(C, w))


def test_demazure_product_by_its_definition() -> None:
    # 0-Hecke monoid: w * s_i = w s_i if l(w s_i) > l(w), else w (Norton 1979)
    for word in itertools.product(range(1, 4), repeat=5):
        w: Perm = (1, 2, 3, 4)
        for i in word:
            v = (*w[: i - 1], w[i], w[i - 1], *w[i + 1 :])
            w = v if inversions(v) > inversions(w) else w
        assert dm.demazure_product(word, 4) == w
    assert dm.demazure_product((1, 2, 1), 3) == dm.word_permutation((1, 2, 1), 3) == (3, 2, 1)
    assert dm.word_permutation((1, 1), 3) == (1, 2, 3)


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 3), ((2, 2, 1), 4)])
def test_closed_under_f_i_for_left_descents(shape: tuple[int, ...], n: int) -> None:
    # if l(s_i w) < l(w), B_w = D_i(B_{s_i w}) is a union of whole f_i-strings tops down, so
    # f_i maps it into itself (D_i D_i = D_i)
    C = druse.crystal(shape, n)
    for w in perms(n):
        mask = dm.demazure_mask_of(C, w)
        for i in range(1, n):
            if w.index(i + 1) < w.index(i):
                fi = C.f(i)[mask]
                assert mask[fi[fi >= 0]].all()


@pytest.mark.parametrize(
    ("shape", "n"), [((2, 1), 3), ((3, 1), 4), ((2, 2), 4), ((2, 1, 1), 4), ((1,), 4), ((), 3)]
)
def test_atoms_partition_the_crystal(shape: tuple[int, ...], n: int) -> None:
    # B(lambda) is the disjoint union of the atoms of the distinct w.lambda, i.e. of the minimal
    # coset representatives w (Lascoux-Schutzenberger 1990; Mason 2009); other atoms are empty
    C = druse.crystal(shape, n)
    lam = (*shape, *([0] * (n - len(shape))))
    cover = np.zeros(len(C), dtype=np.int64)
    for w in perms(n):
        atom = dm.atom_mask(C, w)
        minimal = all(w[j] < w[j + 1] for j in range(n - 1) if lam[j] == lam[j + 1])
        assert atom.any() == minimal, w
        cover += atom
    assert (cover == 1).all()


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 3), ((3, 1), 4), ((2, 2, 1), 4), ((2,), 4)])
def test_atom_characters(shape: tuple[int, ...], n: int) -> None:
    # character of the atom of w = the atom polynomial of w.lambda, by sympy (sources at atom_of)
    C = druse.crystal(shape, n)
    lam = (*shape, *([0] * (n - len(shape))))
    for w in perms(n):
        if all(w[j] < w[j + 1] for j in range(n - 1) if lam[j] == lam[j + 1]):
            assert character(C, dm.atom_mask(C, w)) == atom_of(shape, w), w


def test_atom_of_the_standard_crystal() -> None:
    # atoms of B(1) for GL_3 are single monomials x_k, the atom of e_k (Mason 2009, from memory)
    C = druse.crystal((1,), 3)
    assert character(C, dm.atom_mask(C, (3, 1, 2))) == {(0, 0, 1): 1}
    assert character(C, dm.atom_mask(C, (2, 1, 3))) == {(0, 1, 0): 1}


def test_lengths_and_reduced_words_of_s4() -> None:
    lengths = [dm.length(w) for w in perms(4)]
    assert [lengths.count(k) for k in range(7)] == [1, 3, 5, 6, 5, 3, 1]  # Mahonian, OEIS A008302
    assert lengths == [inversions(w) for w in perms(4)]
    assert len(all_reduced_words((4, 3, 2, 1))) == 16  # Stanley 1984; OEIS A005118
    for w in perms(4):
        word = dm.reduced_word(w)
        assert len(word) == inversions(w)
        assert dm.word_permutation(word, 4) == w
    assert dm.all_permutations(3) == perms(3)


def lower_interval(v: Perm) -> set[Perm]:
    """Products of the reduced subwords of a reduced word of v (subword property,
    Bjorner-Brenti, "Combinatorics of Coxeter Groups", 2005, Thm. 2.2.2)."""
    word = dm.reduced_word(v)
    out = set()
    for keep in itertools.product((False, True), repeat=len(word)):
        sub = [i for i, k in zip(word, keep, strict=True) if k]
        u = dm.word_permutation(sub, len(v))
        if inversions(u) == len(sub):
            out.add(u)
    return out


def test_bruhat_order_of_s4() -> None:
    pairs = 0
    for v in perms(4):
        below = {u for u in perms(4) if dm.bruhat_le(u, v)}
        assert below == lower_interval(v)
        pairs += len(below)
    assert pairs == 213  # comparable pairs in Bruhat order of S_4, OEIS A007767 (from memory)
    assert len(lower_interval((4, 3, 2, 1))) == 24  # w0 is the top element
    assert not dm.bruhat_le((2, 1, 3), (1, 3, 2))  # incomparable elements of length 1


@pytest.mark.parametrize(
    ("word", "error", "text"),
    [
        ((0,), ValueError, "1..2"),
        ((3,), ValueError, "1..2"),
        ((1, 1.5), TypeError, "integer"),
        ((True,), TypeError, "integer"),
        ("12", TypeError, "sequence"),
    ],
)
def test_bad_words(word: Any, error: type[Exception], text: str) -> None:
    C = druse.crystal((2, 1), 3)
    with pytest.raises(error, match=text):
        dm.demazure_mask(C, word)
    with pytest.raises(error, match=text):
        dm.demazure_product(word, 3)


@pytest.mark.parametrize(
    ("perm", "text"),
    [((0, 1, 2), "0-based"), ((1, 1, 3), "permutation of 1..3"), ((1, 2), "n = 3 entries")],
)
def test_bad_permutations(perm: Any, text: str) -> None:
    C = druse.crystal((2, 1), 3)
    with pytest.raises(ValueError, match=text):
        dm.demazure_mask_of(C, perm)
    with pytest.raises(ValueError, match=text):
        dm.atom_mask(C, perm)


def test_bad_arguments_elsewhere() -> None:
    with pytest.raises(ValueError, match="0-based"):
        dm.reduced_word((1, 0))
    with pytest.raises(ValueError, match="same S_n"):
        dm.bruhat_le((1, 2), (1, 2, 3))
    with pytest.raises(TypeError, match="Crystal"):
        dm.demazure_mask("B(2,1)", (1,))  # type: ignore[arg-type]
    with pytest.raises(TypeError, match="integer"):
        dm.length((1, 2.0))  # type: ignore[arg-type]


def closure_by_definition(C: druse.Crystal, word: tuple[int, ...]) -> list[bool]:
    """D_{i1}(... D_{ik}({u_lambda})) straight from D_i(X) = {f_i^k x : x in X, k >= 0}."""
    x = {C.highest_weight()}
    for i in reversed(word):
        fi = C.f(i).tolist()
        grown = set(x)
        for v in x:
            while fi[v] >= 0:
                v = fi[v]
                grown.add(v)
        x = grown
    return [v in x for v in range(len(C))]


@given(st.lists(st.integers(1, 4), max_size=9).map(tuple))
def test_closure_against_the_definition(word: tuple[int, ...]) -> None:
    C = druse.crystal((3, 1, 1), 5)
    assert dm.demazure_mask(C, word).tolist() == closure_by_definition(C, word)


@pytest.mark.slow
def test_parallel_closure_against_the_definition() -> None:
    # 177408 vertices (hook-content, Stanley EC2 7.21.4): above the threads' threshold
    C = druse.crystal((4, 3, 2, 1), 8)
    for word in [(1, 2, 3, 4, 5, 6, 7), (7, 5, 3, 1, 2, 4, 6, 7, 5), (4, 3, 5, 4, 2, 6)]:
        assert dm.demazure_mask(C, word).tolist() == closure_by_definition(C, word)


def test_any_crystal_table() -> None:
    # a crystal given by its table: two copies of B(1) for GL_2 (0 -> 1 and 2 -> 3)
    C = druse.Crystal(2, 4, lowering=[[1, -1, 3, -1]])
    assert dm.demazure_mask(C, ()).tolist() == [True, False, True, False]
    assert dm.demazure_mask(C, (1,)).all()
