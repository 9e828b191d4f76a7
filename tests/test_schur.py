"""Tests of druse.schur: Schur polynomials against the bialternant, hook-content and dominance."""

from __future__ import annotations

import doctest
import importlib
import itertools
from math import factorial, prod

import numpy as np
import pytest
import sympy  # type: ignore[import-untyped]
from hypothesis import given
from hypothesis import strategies as st

from druse import TooLargeError, kostka, schur
from reference.tableaux import partitions
from strategies import shapes_and_n

# `druse.schur` is the function (re-exported by the package); the module is this one.
schur_module = importlib.import_module("druse.schur")

Shape = tuple[int, ...]
Terms = dict[tuple[int, ...], int]


def hook_content(shape: Shape, n: int) -> int:
    """Number of SSYT of shape with entries <= n (Stanley, EC2, 1999, Cor. 7.21.4)."""
    conj = [sum(1 for p in shape if p > c) for c in range(shape[0])] if shape else []
    num = prod(n + c - r for r, length in enumerate(shape) for c in range(length))
    hooks = prod(
        (length - c) + (conj[c] - r) - 1 for r, length in enumerate(shape) for c in range(length)
    )
    return num // hooks


def standard_count(shape: Shape) -> int:
    """Number of SYT by the hook length formula (Frame, Robinson and Thrall, 1954)."""
    conj = [sum(1 for p in shape if p > c) for c in range(shape[0])] if shape else []
    hooks = prod(
        (length - c) + (conj[c] - r) - 1 for r, length in enumerate(shape) for c in range(length)
    )
    return factorial(sum(shape)) // hooks


def permutation_sign(perm: tuple[int, ...]) -> int:
    inversions = sum(1 for i, j in itertools.combinations(range(len(perm)), 2) if perm[i] > perm[j])
    return -1 if inversions % 2 else 1


def alternant(alpha: list[int], xs: tuple[sympy.Symbol, ...]) -> sympy.Poly:
    """a_alpha = det(x_i^alpha_j) = sum over permutations of sign * x^(permuted alpha)."""
    terms: dict[tuple[int, ...], int] = {}
    for perm in itertools.permutations(range(len(alpha))):
        terms[tuple(alpha[p] for p in perm)] = permutation_sign(perm)
    return sympy.Poly.from_dict(terms, *xs)


def bialternant(shape: Shape, n: int) -> Terms:
    """a_{lambda+delta} / a_delta, divided by sympy (Macdonald, Symmetric Functions and Hall
    Polynomials, 2nd ed., 1995, Ch. I (3.1)), as a dict of exponent tuples."""
    xs = sympy.symbols(f"x1:{n + 1}")
    lam = list(shape) + [0] * (n - len(shape))
    num = alternant([lam[j] + n - 1 - j for j in range(n)], xs)
    den = alternant([n - 1 - j for j in range(n)], xs)
    quotient, remainder = sympy.div(num, den)
    assert remainder.is_zero
    return {tuple(int(e) for e in k): int(v) for k, v in quotient.as_dict().items()}


def dominated(weight: tuple[int, ...], shape: Shape) -> bool:
    """The sorted weight is dominated by shape (same size assumed)."""
    mu = sorted(weight, reverse=True)
    return all(sum(mu[: i + 1]) <= sum(shape[: i + 1]) for i in range(len(mu)))


SMALL = [(lam, n) for size in range(7) for lam in partitions(size) for n in range(1, 5)]


@pytest.mark.parametrize(("shape", "n"), SMALL)
def test_matches_the_bialternant(shape: Shape, n: int) -> None:
    got = schur(shape, n).to_dict()
    if len(shape) > n:
        assert got == {}  # more rows than variables: no tableau at all
    else:
        assert got == bialternant(shape, n)  # Macdonald, Ch. I (3.1), divided by sympy


@pytest.mark.parametrize(
    "shape", [(2, 1), (3, 1, 1), (2, 2, 1), (4, 2), (1, 1, 1, 1), (3, 2, 1), (2, 2, 1, 1), (6,)]
)
def test_matches_the_bialternant_in_five_variables(shape: Shape) -> None:
    assert schur(shape, 5).to_dict() == bialternant(shape, 5)  # Macdonald, Ch. I (3.1)


def test_conventions() -> None:
    assert schur((), 0).to_dict() == {(): 1}  # the empty shape is the constant 1
    assert schur((0, 0), 3).to_dict() == {(0, 0, 0): 1}
    assert schur((3,), 1).to_dict() == {(3,): 1}
    assert schur((1,), 0).to_dict() == {}
    p = schur((2, 1), 3)
    assert p.nvars == 3


def test_terms_are_in_decreasing_lexicographic_order() -> None:
    exps = schur((3, 2, 1), 5).exponents
    rows = [tuple(r) for r in exps.tolist()]
    assert rows == sorted(rows, reverse=True)
    assert len(set(rows)) == len(rows)


@pytest.mark.parametrize(
    ("shape", "n"), [((5, 4, 3, 2, 1), 9), ((4, 4, 2), 7), ((7,), 6), ((3, 3, 3, 3), 8)]
)
def test_values_at_one_are_hook_content(shape: Shape, n: int) -> None:
    # s_lambda(1, ..., 1) counts the SSYT: hook-content formula (Stanley, EC2, Cor. 7.21.4).
    assert sum(schur(shape, n).coefficients) == hook_content(shape, n)


def dominated_weights(shape: Shape, n: int) -> int:
    """Number of weak compositions of |shape| into n parts whose sorted version is dominated by
    shape: the monomials of s_shape (Macdonald, Ch. I (6.5)), counted by sorted partition."""

    def arrangements(mu: Shape) -> int:
        parts = list(mu) + [0] * (n - len(mu))
        return factorial(n) // prod(factorial(parts.count(v)) for v in set(parts))

    size = sum(shape)
    return sum(arrangements(mu) for mu in partitions(size) if len(mu) <= n and dominated(mu, shape))


def test_staircase_has_the_published_number_of_terms() -> None:
    shape, n = (5, 4, 3, 2, 1), 9
    p = schur(shape, n)
    assert len(p) == 253692  # the figure given in the project's issue
    assert len(p) == dominated_weights(shape, n)  # Macdonald, Ch. I (6.5)
    ordered = -np.sort(-p.exponents, axis=1)
    assert np.all(np.cumsum(ordered, axis=1) <= np.cumsum(list(shape) + [0] * 4))


@pytest.mark.slow
def test_big_staircase() -> None:
    shape, n = (6, 5, 4, 3, 2, 1), 10
    p = schur(shape, n)
    assert len(p) == dominated_weights(shape, n)  # Macdonald, Ch. I (6.5)
    total = sum(p.coefficients)
    assert total == hook_content(shape, n)  # Stanley, EC2, Cor. 7.21.4
    assert total > 2**33  # 10051092480: the sum would wrap in 32 bits


@pytest.mark.parametrize(("shape", "n"), [((3, 1), 4), ((2, 2, 1), 4), ((4, 2, 1), 5)])
def test_symmetric_in_the_variables(shape: Shape, n: int) -> None:
    # s_lambda is symmetric (Macdonald, Ch. I (3.1)): every permutation of x1..xn fixes it.
    d = schur(shape, n).to_dict()
    for perm in itertools.permutations(range(n)):
        assert {tuple(a[i] for i in perm): c for a, c in d.items()} == d


@given(shapes_and_n(max_size=8, max_n=6), st.data())
def test_symmetric_under_transpositions(case: tuple[Shape, int], data: st.DataObject) -> None:
    shape, n = case
    d = schur(shape, n).to_dict()
    i = data.draw(st.integers(0, n - 1), label="i")
    j = data.draw(st.integers(0, n - 1), label="j")

    def swap(a: tuple[int, ...]) -> tuple[int, ...]:
        b = list(a)
        b[i], b[j] = b[j], b[i]
        return tuple(b)

    assert {swap(a): c for a, c in d.items()} == d  # Macdonald, Ch. I (3.1): s_lambda symmetric


def test_coefficients_are_exact_python_ints() -> None:
    # Coefficients past 2**64 need so many variables that the polynomial would not fit in
    # memory; the wide and big-integer paths are checked in the kernel's own tests and, for the
    # same arithmetic, in test_kostka.py. Here: Python ints, exact, equal to outside counts.
    p = schur((4, 3, 2, 1), 10)
    assert all(type(c) is int for c in p.coefficients)
    # The coefficient of x1 ... x10 counts standard tableaux: 768 by the hook length formula
    # (Frame, Robinson and Thrall, 1954).
    assert p.coefficient((1,) * 10) == standard_count((4, 3, 2, 1)) == 768
    # Every coefficient is the Kostka number of its exponent (Macdonald, Ch. I (5.12)).
    for exps, c in list(p.to_dict().items())[::997]:
        assert c == kostka((4, 3, 2, 1), exps)


def test_refuses_what_would_not_fit() -> None:
    with pytest.raises(TooLargeError, match="kostka"):
        schur((10, 9, 8, 7, 6, 5, 4, 3, 2, 1), 40)


@pytest.mark.parametrize(
    ("shape", "n", "error", "match"),
    [
        ((1, 2), 3, ValueError, "shape must be weakly decreasing"),
        ((2, -1), 3, ValueError, "shape must have non-negative parts"),
        ((2, 1), -1, ValueError, "n must be non-negative"),
        ((2, 1), 2.0, TypeError, "n must be an integer"),
        ("21", 2, TypeError, "shape must be a sequence"),
        ((2, True), 2, TypeError, r"shape\[1\] must be an integer"),
        ((2**40,), 2, ValueError, "shape parts must be at most"),
    ],
)
def test_bad_input(shape: object, n: object, error: type[Exception], match: str) -> None:
    with pytest.raises(error, match=match):
        schur(shape, n)  # type: ignore[arg-type]


def test_docstring_examples() -> None:
    assert doctest.testmod(schur_module).failed == 0
