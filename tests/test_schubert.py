"""Schubert polynomials against the outside: sympy divided differences, OEIS, Macdonald's notes.

Each check names its source beside it; the slow pure-Python reference is
tests/reference/schubert.py.
"""

from __future__ import annotations

import doctest
import importlib
import itertools
import math

import numpy as np
import pytest
import sympy  # type: ignore[import-untyped]

from druse import (
    Poly,
    TooLargeError,
    all_schuberts,
    schubert,
    schubert_by_divided_differences,
    schur,
)
from reference import schubert as ref
from strategies import random_perms

Perm = tuple[int, ...]


def terms(p: Poly) -> dict[tuple[int, ...], int]:
    return p.to_dict()


def value_at_ones(p: Poly) -> int:
    return sum(terms(p).values())


S5 = list(itertools.permutations(range(1, 6)))


# -- sympy as the independent arithmetic engine ------------------------------------------------


def test_every_w_in_s5_against_sympy() -> None:
    expected = ref.sympy_all_schuberts(5)  # sympy divided differences, the definition
    for w in S5:
        assert terms(schubert(w)) == expected[w], w


@pytest.mark.parametrize("w", random_perms(6, 6, seed=6) + random_perms(7, 3, seed=7))
def test_random_w_in_s6_s7_against_sympy(w: Perm) -> None:
    assert terms(schubert(w)) == ref.sympy_schubert(w)  # sympy divided differences


def test_divided_difference_route_against_dict_reference() -> None:
    for w in S5 + random_perms(6, 10, seed=60):
        assert terms(schubert_by_divided_differences(w)) == ref.schubert_dict(w), w


def test_batch_agrees_with_transition_on_all_of_s6() -> None:
    # two routes of druse: divided differences top down vs the transition recursion
    batch = all_schuberts(6)
    assert list(batch) == list(itertools.permutations(range(1, 7)))
    for w, p in batch.items():
        assert p == schubert(w), w


def test_batch_progress_and_small_n() -> None:
    seen: list[tuple[int, int]] = []
    result = all_schuberts(4, progress=lambda done, total: seen.append((done, total)))
    assert seen[-1] == (24, 24)
    assert all(t == 24 for _, t in seen)
    assert result[(1, 2, 3, 4)] == Poly.from_dict({(0, 0, 0, 0): 1}, 4)
    assert all_schuberts(1) == {(1,): Poly.from_dict({(0,): 1}, 1)}
    assert list(all_schuberts(0)) == [()]


def test_examples_run() -> None:
    # the docstring examples (Macdonald 1991's S_132, S_321, S_2143, S_231; from memory)
    module = importlib.import_module("druse.schubert")
    failed, attempted = doctest.testmod(module, optionflags=doctest.ELLIPSIS)
    assert failed == 0
    assert attempted > 0


# -- published values and theorems ---------------------------------------------------------------


def test_textbook_examples() -> None:
    # Macdonald, Notes on Schubert Polynomials, 1991, tables of S_3 and S_4 (from memory;
    # each also checked here against the sympy definition)
    examples = {
        (1, 3, 2): "x1 + x2",
        (2, 1, 4, 3): "x1^2 + x1*x2 + x1*x3",
        (1, 4, 3, 2): "x1^2*x2 + x1^2*x3 + x1*x2^2 + x1*x2*x3 + x2^2*x3",
        (3, 2, 1): "x1^2*x2",
        (1, 3, 2, 4): "x1 + x2",
    }
    for w, text in examples.items():
        want = Poly(text, nvars=len(w))
        assert schubert(w) == want, w
        assert terms(want) == ref.sympy_schubert(w), w


@pytest.mark.parametrize("n", range(2, 11))
def test_catalan(n: int) -> None:
    # S_w(1,...,1) for w = 1 n n-1 ... 2 is the Catalan number C_(n-1) (Woo 2004; OEIS A000108)
    a000108 = [1, 1, 2, 5, 14, 42, 132, 429, 1430, 4862]  # OEIS A000108
    w = (1, *range(n, 1, -1))
    assert value_at_ones(schubert(w)) == a000108[n - 1]


def test_dominant_permutations_give_a_monomial() -> None:
    # w 132-avoiding (dominant) => S_w = x^code(w) (Macdonald 1991, (4.7))
    for n in (5, 6):
        for w in itertools.permutations(range(1, n + 1)):
            avoids = not any(w[a] < w[c] < w[b] for a, b, c in itertools.combinations(range(n), 3))
            if avoids:
                assert terms(schubert(w)) == {ref.code(w): 1}, w


def grassmannian_shape(w: Perm, k: int) -> tuple[int, ...]:
    """lambda_i = w(k+1-i) - (k+1-i) for w with its only descent at k (Macdonald 1991, (4.8))."""
    return tuple(w[k - i] - (k + 1 - i) for i in range(1, k + 1))


def sympy_schur(shape: tuple[int, ...], k: int) -> dict[tuple[int, ...], int]:
    """Jacobi's bialternant det(x_i^(lambda_j + k - j)) / det(x_i^(k - j)), in sympy."""
    xs = sympy.symbols(f"x1:{k + 1}")
    lam = list(shape) + [0] * (k - len(shape))
    num = sympy.Matrix(k, k, lambda i, j: xs[i] ** (lam[j] + k - 1 - j)).det()
    den = sympy.Matrix(k, k, lambda i, j: xs[i] ** (k - 1 - j)).det()
    quotient = sympy.Poly(sympy.cancel(num / den), *xs)
    return {tuple(e): int(c) for e, c in quotient.terms()}


def test_grassmannian_permutations_give_schur_polynomials() -> None:
    # S_w = s_lambda(x1..xk) for w Grassmannian with descent k (Macdonald 1991, (4.8))
    for n in (5, 6):
        for w in itertools.permutations(range(1, n + 1)):
            descents = [k for k in range(1, n) if w[k - 1] > w[k]]
            if len(descents) != 1:
                continue
            k = descents[0]
            shape = grassmannian_shape(w, k)
            pad = (0,) * (n - k)
            want = {e + pad: c for e, c in terms(schur(shape, k)).items()}
            assert terms(schubert(w)) == want, w
            if n == 5 and k <= 3:
                assert want == {e + pad: c for e, c in sympy_schur(shape, k).items()}  # sympy


def monk_terms(w: Perm, r: int) -> list[Perm]:
    """The w t_(ab), a <= r < b, with l(w t_(ab)) = l(w) + 1 (Macdonald 1991, (4.15))."""
    out = []
    for a in range(r):
        for b in range(r, len(w)):
            v = list(w)
            v[a], v[b] = v[b], v[a]
            if ref.length(tuple(v)) == ref.length(w) + 1:
                out.append(tuple(v))
    return out


@pytest.mark.parametrize("w", random_perms(5, 5, seed=15) + random_perms(6, 4, seed=16))
def test_monk_rule(w: Perm) -> None:
    # S_(s_r) S_w = sum over transpositions (Monk 1959; Macdonald 1991, (4.15)), in S_(n+1)
    # so that every b > r is available
    big = (*w, len(w) + 1)
    m = len(big)
    for r in range(1, m):
        s_r = (*range(1, r), r + 1, r, *range(r + 2, m + 1))
        total = Poly.from_dict({}, m)
        for v in monk_terms(big, r):
            total = total + schubert(v)
        assert schubert(s_r) * schubert(big) == total, (w, r)


@pytest.mark.parametrize("w", S5[::7] + random_perms(6, 3, seed=26))
def test_macdonald_reduced_word_identity(w: Perm) -> None:
    # sum over reduced words a of w of a_1 ... a_l = l! S_w(1,...,1) (Macdonald 1991, (6.11))
    total = sum(math.prod(a) for a in ref.reduced_words(w))
    assert total == math.factorial(ref.length(w)) * value_at_ones(schubert(w))


def test_longest_element_and_wide_permutations() -> None:
    # S_(w0) = x1^(n-1) ... x_(n-1) (the definition, Macdonald 1991, (4.1))
    assert terms(schubert(tuple(range(12, 0, -1)))) == {tuple(range(11, -1, -1)): 1}
    # S_(s_r) = x1 + ... + xr (Macdonald 1991, (4.14)); 40 letters, so no packed keys
    w = list(range(1, 41))
    w[29], w[30] = w[30], w[29]
    want = {tuple(int(j == i) for j in range(40)): 1 for i in range(30)}
    assert terms(schubert(w)) == want


def test_other_sequences_and_the_empty_permutation() -> None:
    # S_132 = x1 + x2 (Macdonald 1991, table of S_3; from memory); S of the empty perm is 1
    assert schubert([1, 3, 2]) == schubert(np.array([1, 3, 2])) == Poly("x1 + x2", nvars=3)
    assert schubert(()).to_dict() == {(): 1}


# -- bad input -------------------------------------------------------------------------------------


@pytest.mark.parametrize(
    ("perm", "error", "words"),
    [
        ("123", TypeError, "tuple of integers"),
        (3, TypeError, "tuple of integers"),
        ((1, 2.0, 3), TypeError, "perm[1] must be an integer"),
        ((True, 2), TypeError, "perm[0] must be an integer"),
        ((1, 1, 3), ValueError, "repeated [1]"),
        ((1, 1, 3), ValueError, "missing [2]"),
        ((1, 2, 5), ValueError, "out of range 1..3: [5]"),
        ((0, 2, 1), ValueError, "1-based one-line notation; got 0-based?"),
        ((-1, 1), ValueError, "permutation of 1..2"),
        ((0, 2, 2), ValueError, "got 0-based?"),
    ],
)
def test_bad_permutations(perm: object, error: type[Exception], words: str) -> None:
    for function in (schubert, schubert_by_divided_differences):
        with pytest.raises(error) as info:
            function(perm)  # type: ignore[arg-type]
        assert words in str(info.value)


def test_too_large_requests_are_refused_before_work() -> None:
    with pytest.raises(TooLargeError, match=r"every Schubert polynomial of S_9.*smaller n"):
        all_schuberts(9)
    with pytest.raises(TooLargeError, match="S_50"):
        all_schuberts(50)
    with pytest.raises(TooLargeError, match="fewer letters"):
        schubert((1, *range(40, 1, -1)))  # C_39 terms and more
    with pytest.raises(TypeError, match="n must be an integer"):
        all_schuberts(3.0)  # type: ignore[arg-type]
    with pytest.raises(ValueError, match="n must be non-negative"):
        all_schuberts(-1)
