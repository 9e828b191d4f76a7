"""Reduced pipe dreams: enumeration, count, weights, words, compatible sequences, drawing.

Outside checks: the subset-filter oracle in tests/reference/pipe_dreams.py (from the
definition), Schubert polynomials by sympy divided differences (an independent arithmetic
engine), Catalan numbers (OEIS A000108), staircase SYT counts (OEIS A005118), Macdonald's
identity, and Billey-Jockusch-Stanley's compatible sequences.
"""

from __future__ import annotations

import itertools
import math
import random

import numpy as np
import pytest
import sympy  # type: ignore[import-untyped]
from hypothesis import given
from hypothesis import strategies as st

import druse
from druse import _check
from reference import pipe_dreams as ref

Perm = tuple[int, ...]


def perms(n: int) -> list[Perm]:
    return list(itertools.permutations(range(1, n + 1)))


def sample(n: int, k: int, seed: int) -> list[Perm]:
    rng = random.Random(seed)
    return [tuple(rng.sample(range(1, n + 1), n)) for _ in range(k)]


def at_ones(expr: sympy.Expr, n: int) -> int:
    return int(expr.subs({x: 1 for x in ref.symbols(n)}))


def generating_sum(P: druse.PipeDreams, n: int) -> sympy.Expr:
    """sum over the pipe dreams of x^weight."""
    x = ref.symbols(n)
    return sympy.Add(
        *[sympy.Mul(*[x[r] ** int(e) for r, e in enumerate(row)]) for row in P.weights()]
    )


@pytest.mark.parametrize("n", [1, 2, 3, 4, 5])
def test_matches_the_subset_filter(n: int) -> None:
    for w in perms(n):
        assert list(druse.pipe_dreams(w)) == ref.pipe_dreams(w)  # definition, ascending mask order


@given(st.permutations(range(1, 7)))
def test_matches_the_subset_filter_in_s6(w: list[int]) -> None:
    assert list(druse.pipe_dreams(w)) == ref.pipe_dreams(tuple(w))  # definition, random w in S_6


@given(st.permutations(range(1, 8)), st.integers(1, 50))
def test_chunks_in_s7(w: list[int], chunk: int) -> None:
    whole = druse.pipe_dreams(w).masks
    assert np.array_equal(np.concatenate(list(druse.iter_pipe_dreams(w, chunk=chunk))), whole)


def test_masks_are_the_shared_encoding() -> None:
    for w in perms(5):
        P = druse.pipe_dreams(w)
        assert P.masks.dtype == np.uint64
        assert P.masks.shape == (len(P), 1)
        assert [int(m) for m in P.masks[:, 0]] == [ref.mask(x, 5) for x in P]  # bit L-1-j


@pytest.mark.parametrize("n", [4, 5])
def test_weights_sum_to_the_schubert_polynomial(n: int) -> None:
    for w in perms(n):
        P = druse.pipe_dreams(w)
        # Bergeron-Billey 1993: S_w = sum of x^weight; S_w by sympy divided differences
        assert sympy.expand(generating_sum(P, n) - ref.schubert(w)) == 0


def test_count_is_schubert_at_ones() -> None:
    for w in perms(5) + sample(6, 12, 1) + sample(7, 4, 2):
        n = len(w)
        expected = at_ones(ref.schubert(w), n)  # sympy divided differences
        assert druse.count_pipe_dreams(w) == expected
        assert len(druse.pipe_dreams(w)) == expected


@pytest.mark.parametrize("n", range(2, 11))
def test_catalan(n: int) -> None:
    w = (1, *range(n, 1, -1))
    catalan = math.comb(2 * (n - 1), n - 1) // n  # Woo 2004; OEIS A000108
    assert druse.count_pipe_dreams(w) == catalan
    if n <= 8:
        assert len(druse.pipe_dreams(w)) == catalan


@pytest.mark.parametrize("n", range(1, 12))
def test_longest_element_has_only_the_staircase(n: int) -> None:
    P = druse.pipe_dreams(tuple(range(n, 0, -1)))
    assert len(P) == 1  # S_{w0} is one monomial (Lascoux-Schutzenberger 1982)
    assert P[0] == tuple(sorted(ref.staircase(n)))


def test_reduced_words_of_w0_count_staircase_tableaux() -> None:
    # number of reduced words of w0 = SYT of the staircase (Stanley 1984; OEIS A005118)
    counts = [len(ref.reduced_words(tuple(range(n, 0, -1)))) for n in range(1, 6)]
    assert counts == [1, 1, 2, 16, 768]  # OEIS A005118


@pytest.mark.parametrize("w", perms(4) + perms(5) + sample(6, 6, 3))
def test_macdonald_identity(w: Perm) -> None:
    # Macdonald, Notes on Schubert Polynomials, 1991, (6.11):
    # sum over reduced words a of a_1 ... a_l = l! S_w(1, ..., 1)
    words = ref.reduced_words(w)
    lhs = sum(math.prod(a) for a in words)
    assert lhs == math.factorial(ref.length(w)) * druse.count_pipe_dreams(w)


def test_words_are_reduced_words_of_w() -> None:
    for w in perms(5) + sample(7, 5, 4):
        P = druse.pipe_dreams(w)
        words = P.reduced_words()
        assert words.shape == (len(P), ref.length(w))
        assert words.dtype == np.uint8
        for crosses, word in zip(P, words.tolist(), strict=True):
            assert ref.multiply(tuple(word), len(w)) == w  # multiplies to w, length l(w)
            assert tuple(word) == tuple(
                r + c - 1 for r, c in sorted(crosses, key=lambda x: (x[0], -x[1]))
            )


def test_compatible_sequences_round_trip() -> None:
    for w in perms(5):
        P = druse.pipe_dreams(w)
        words, rows = P.compatible_sequences()
        for k, crosses in enumerate(P):
            a, i = druse.compatible_sequence(crosses, 5)
            assert (a, i) == (tuple(words[k].tolist()), tuple(rows[k].tolist()))
            assert druse.pipe_dream_from_compatible(a, i, 5) == crosses


@pytest.mark.parametrize("w", [w for w in perms(4) + perms(5) if ref.length(w) <= 5])
def test_compatible_sequences_count_and_sum(w: Perm) -> None:
    n = len(w)
    seqs = ref.compatible_sequences(w)
    assert len(seqs) == at_ones(ref.schubert(w), n)  # BJS 1993 Thm 1.1 at x = 1, with sympy
    x = ref.symbols(n)
    total = sympy.Add(*[sympy.Mul(*[x[r - 1] for r in i]) for _, i in seqs])
    assert sympy.expand(total - ref.schubert(w)) == 0  # BJS 1993 Thm 1.1
    got = {druse.compatible_sequence(c, n) for c in druse.pipe_dreams(w)}
    assert got == set(seqs)


def test_streaming_matches_the_whole() -> None:
    w = (1, 4, 3, 2, 7, 6, 5)
    whole = druse.pipe_dreams(w).masks
    chunks = list(druse.iter_pipe_dreams(w, chunk=37))
    P = druse.pipe_dreams(w)
    assert [druse.pipe_dream_of_mask(m, 7) for m in chunks[1]] == [P[k] for k in range(37, 74)]
    with pytest.raises(ValueError, match="past the"):
        druse.pipe_dream_of_mask([1 << 21], 7)  # L = 21 cells (the shared encoding)
    assert all(len(c) <= 37 for c in chunks)
    assert np.array_equal(np.concatenate(chunks), whole)


def test_wide_masks() -> None:
    w = (1, *range(12, 1, -1))  # L = 66 cells: two words per mask
    P = druse.pipe_dreams(w)
    assert P.masks.shape == (58786, 2)  # Catalan C_11 (OEIS A000108)
    values = [(int(a) << 64) | int(b) for a, b in P.masks.tolist()]
    assert values == sorted(set(values))
    assert ref.multiply(tuple(P.reduced_words()[-1].tolist()), 12) == w
    top = druse.pipe_dreams(tuple(range(64, 0, -1)))  # L = 2016 cells: 32 words
    assert top.masks.shape == (1, 32)
    assert top[0] == tuple(sorted(ref.staircase(64)))  # w0: the full staircase
    assert top.weights().tolist() == [list(range(63, -1, -1))]  # S_{w0} = x1^63 x2^62 ...


def test_drawing() -> None:
    text = druse.draw_pipe_dream([(1, 2), (2, 1)], 3)
    assert text.splitlines() == ["    1 2 3", " 1  Jr-+.", " 2  -+. .", " 3  . . ."]
    art = druse.pipe_dreams((2, 1)).draw(0, style="unicode")
    assert art.splitlines()[1] == " 1  ─┼·"
    assert len(druse.pipe_dreams((1, 3, 2)).draw(-1).splitlines()) == 4


def test_small_cases_and_repr() -> None:
    P = druse.pipe_dreams((1, 2))
    assert (P.perm, list(P), repr(P)) == ((1, 2), [()], "<PipeDreams of (1, 2): 1 pipe dreams>")
    assert druse.pipe_dreams(()).masks.shape == (1, 0)
    assert druse.pipe_dreams((1,)).weights().shape == (1, 1)
    with pytest.raises(IndexError, match="index"):
        P[1]


@pytest.mark.parametrize(
    ("perm", "error", "words"),
    [
        ((1, 1, 3), ValueError, "1 repeated"),
        ((1, 2, 4), ValueError, "3 missing"),
        ((0, 1, 2), ValueError, "0-based"),
        ((2, 1.5), TypeError, "integer"),
        ("213", TypeError, "sequence"),
        (tuple(range(65, 0, -1)), ValueError, "at most 64"),
    ],
)
def test_bad_perm(perm: object, error: type[Exception], words: str) -> None:
    with pytest.raises(error, match=words):
        druse.pipe_dreams(perm)  # type: ignore[arg-type]
    with pytest.raises(error, match=words):
        druse.count_pipe_dreams(perm)  # type: ignore[arg-type]


def test_too_many_refused_with_the_count(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr(_check, "MEMORY_BUDGET", 100)
    with pytest.raises(druse.TooLargeError, match=r"the 42 pipe dreams.*count_pipe_dreams"):
        druse.pipe_dreams((1, 6, 5, 4, 3, 2))


def test_bad_compatible_sequences() -> None:
    with pytest.raises(ValueError, match="weakly increasing"):
        druse.pipe_dream_from_compatible((2, 1), (2, 1), 4)
    with pytest.raises(ValueError, match="at most word"):
        druse.pipe_dream_from_compatible((1,), (2,), 3)
    with pytest.raises(ValueError, match="because word"):
        druse.pipe_dream_from_compatible((1, 2), (1, 1), 3)
    with pytest.raises(ValueError, match="reduced"):
        druse.pipe_dream_from_compatible((1, 1), (1, 1), 3)
    with pytest.raises(ValueError, match="same length"):
        druse.pipe_dream_from_compatible((1, 2), (1,), 3)
    with pytest.raises(ValueError, match="reduced"):
        druse.compatible_sequence([(1, 2), (2, 1)], 3)  # reads s2 s2


def test_bad_crosses() -> None:
    with pytest.raises(ValueError, match="staircase"):
        druse.draw_pipe_dream([(2, 2)], 3)
    with pytest.raises(ValueError, match="repeat"):
        druse.draw_pipe_dream([(1, 1), (1, 1)], 3)
    with pytest.raises(TypeError, match="pair"):
        druse.draw_pipe_dream([(1, 1, 1)], 3)
    with pytest.raises(ValueError, match="style"):
        druse.draw_pipe_dream([], 3, style="fancy")


def test_huge_state_graph_is_refused_quickly() -> None:
    # w = 1 30 29 ... 2 has C_29 (about 1.3e15) pipe dreams (Woo 2004; OEIS A000108): the state
    # graph outgrows its cap inside the first row, and the refusal comes before memory runs out
    w = (1, *range(30, 1, -1))
    with pytest.raises(druse.TooLargeError, match="state graph"):
        druse.count_pipe_dreams(w)


def test_streaming_from_a_start_index_is_the_tail() -> None:
    # the chunk at `start` is found by counting; it must equal the tail of the full listing
    # (Woo 2004: 1 6 5 4 3 2 has C_5 = 42 pipe dreams, OEIS A000108)
    w = (1, 6, 5, 4, 3, 2)
    full = druse.pipe_dreams(w).masks
    tail = np.concatenate(list(druse.iter_pipe_dreams(w, chunk=5, start=17)))
    assert len(full) == 42
    assert np.array_equal(tail, full[17:])
    assert list(druse.iter_pipe_dreams(w, start=42)) == []
