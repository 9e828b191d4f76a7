"""Tests of druse.key: key polynomials, Demazure atoms and the divided-difference operators.

The operators are checked against sympy as an independent arithmetic engine (their defining
quotients, simplified with ``sympy.cancel``), keys and atoms against the recursions that define
them run in sympy, against Schur polynomials and monomials, and against the atom decomposition
of a key over the Bruhat order.
"""

from __future__ import annotations

import doctest
import importlib
import itertools
import re
from collections.abc import Callable
from typing import Any

import pytest
import sympy  # type: ignore[import-untyped]
from hypothesis import given
from hypothesis import strategies as st

from druse import (
    Poly,
    TooLargeError,
    atom,
    demazure_atom_operator,
    divided_difference,
    isobaric_divided_difference,
    key,
    schur,
)

# `druse.key` is the function (re-exported by the package); the module is this one.
key_module = importlib.import_module("druse.key")

Composition = tuple[int, ...]
Operator = Callable[[Poly, int], Poly]


# -- the sympy reference: the defining quotients, simplified by sympy.cancel -------------------


def symbols(n: int) -> list[Any]:
    return list(sympy.symbols(f"x1:{n + 1}"))


def swap(expr: Any, xs: list[Any], i: int) -> Any:
    """s_i expr: x_i and x_(i+1) exchanged."""
    a, b = xs[i - 1], xs[i]
    return expr.subs({a: b, b: a}, simultaneous=True)


def sympy_pi(expr: Any, xs: list[Any], i: int) -> Any:
    """pi_i f = (x_i f - x_(i+1) s_i f) / (x_i - x_(i+1)) (Lascoux-Schutzenberger 1990)."""
    a, b = xs[i - 1], xs[i]
    return sympy.expand(sympy.cancel((a * expr - b * swap(expr, xs, i)) / (a - b)))


def sympy_pibar(expr: Any, xs: list[Any], i: int) -> Any:
    """pi_i - 1 (Lascoux-Schutzenberger 1990; Mason 2009)."""
    return sympy.expand(sympy_pi(expr, xs, i) - expr)


def sympy_d(expr: Any, xs: list[Any], i: int) -> Any:
    """d_i f = (f - s_i f) / (x_i - x_(i+1)) (Macdonald, Notes on Schubert Polynomials, 1991)."""
    a, b = xs[i - 1], xs[i]
    return sympy.expand(sympy.cancel((expr - swap(expr, xs, i)) / (a - b)))


def sympy_by_recursion(alpha: Composition, step: Callable[[Any, list[Any], int], Any]) -> Any:
    """x^alpha for weakly decreasing alpha, else step_i applied to the value at s_i alpha."""
    xs = symbols(len(alpha))
    for i in range(len(alpha) - 1):
        if alpha[i] < alpha[i + 1]:
            swapped = (*alpha[:i], alpha[i + 1], alpha[i], *alpha[i + 2 :])
            return step(sympy_by_recursion(swapped, step), xs, i + 1)
    return sympy.Mul(*(x**e for x, e in zip(xs, alpha, strict=True)))


def to_poly(expr: Any, n: int) -> Poly:
    return Poly.from_sympy(expr, symbols(n))


# -- strategies ----------------------------------------------------------------------------


@st.composite
def compositions(draw: st.DrawFn, max_size: int = 7, max_n: int = 5) -> Composition:
    """A weak composition with 2 <= n <= max_n parts and |alpha| <= max_size."""
    n = draw(st.integers(2, max_n))
    parts: list[int] = []
    for _ in range(n):
        parts.append(draw(st.integers(0, max_size - sum(parts))))
    return tuple(draw(st.permutations(parts)))


@st.composite
def polys_and_index(draw: st.DrawFn, max_n: int = 5) -> tuple[Poly, int]:
    """A polynomial with a few terms of small degree and integer coefficients, and 1 <= i < n."""
    n = draw(st.integers(2, max_n))
    rows = st.tuples(*[st.integers(0, 4)] * n)
    terms = draw(st.dictionaries(rows, st.integers(-9, 9).filter(bool), max_size=5))
    return Poly.from_dict(terms, n), draw(st.integers(1, n - 1))


# -- operators against sympy ---------------------------------------------------------------

OPERATORS: list[tuple[Operator, Callable[[Any, list[Any], int], Any]]] = [
    (isobaric_divided_difference, sympy_pi),
    (demazure_atom_operator, sympy_pibar),
    (divided_difference, sympy_d),
]


@pytest.mark.parametrize(("ours", "reference"), OPERATORS)
@given(case=polys_and_index())
def test_operators_match_sympy(
    ours: Operator, reference: Callable[[Any, list[Any], int], Any], case: tuple[Poly, int]
) -> None:
    p, i = case
    xs = symbols(p.nvars)
    assert ours(p, i) == to_poly(reference(p.to_sympy(xs), xs, i), p.nvars)  # sympy.cancel


@given(alpha=compositions())
def test_key_and_atom_match_sympy_recursions(alpha: Composition) -> None:
    n = len(alpha)
    assert key(alpha) == to_poly(sympy_by_recursion(alpha, sympy_pi), n)  # sympy, L-S 1990
    assert atom(alpha) == to_poly(sympy_by_recursion(alpha, sympy_pibar), n)  # sympy, Mason 2009


# -- keys: monomials, Schur polynomials, atoms ----------------------------------------------


@given(alpha=compositions())
def test_key_of_a_partition_is_its_monomial(alpha: Composition) -> None:
    lam = tuple(sorted(alpha, reverse=True))
    assert key(lam) == Poly.monomial(lam)  # kappa_lambda = x^lambda (Lascoux-Schutzenberger 1990)
    assert atom(lam) == Poly.monomial(lam)  # A_lambda = x^lambda (Mason 2009)


@given(alpha=compositions(max_size=8, max_n=5))
def test_key_of_an_increasing_composition_is_schur(alpha: Composition) -> None:
    increasing = tuple(sorted(alpha))
    lam = tuple(sorted(alpha, reverse=True))
    # kappa of the increasing rearrangement is s_lambda (Lascoux-Schutzenberger 1990)
    assert key(increasing) == schur(lam, len(alpha))


def minimal_permutation(alpha: Composition) -> tuple[int, ...]:
    """The shortest w in S_n (one-line) with (w.lambda)_(w(j)) = lambda_j, lambda = sort(alpha).

    w(j) is the position of the j-th largest part of alpha, ties taken left to right.
    """
    order = sorted(range(len(alpha)), key=lambda p: (-alpha[p], p))
    return tuple(p + 1 for p in order)


def bruhat_leq(u: tuple[int, ...], w: tuple[int, ...]) -> bool:
    """u <= w in Bruhat order: #{a <= i : u(a) >= k} <= #{a <= i : w(a) >= k} for all i, k
    (the tableau criterion; Bjorner and Brenti, Combinatorics of Coxeter Groups, 2005, 2.1.5)."""
    n = len(u)
    return all(
        sum(1 for a in range(i) if u[a] >= k) <= sum(1 for a in range(i) if w[a] >= k)
        for i in range(1, n + 1)
        for k in range(1, n + 1)
    )


def below_in_orbit(alpha: Composition) -> list[Composition]:
    """The rearrangements of alpha whose minimal permutation is below alpha's in Bruhat order."""
    top = minimal_permutation(alpha)
    orbit = set(itertools.permutations(alpha))
    return [b for b in sorted(orbit) if bruhat_leq(minimal_permutation(b), top)]


def small_compositions() -> list[Composition]:
    return [
        alpha
        for n in range(1, 5)
        for alpha in itertools.product(range(4), repeat=n)
        if sum(alpha) <= 5
    ]


@pytest.mark.parametrize("alpha", small_compositions())
def test_key_is_the_sum_of_atoms_below_it(alpha: Composition) -> None:
    total = sum((atom(beta) for beta in below_in_orbit(alpha)), Poly.zero(len(alpha)))
    assert key(alpha) == total  # kappa_alpha = sum of A_beta, beta <= alpha (L-S 1990; Mason 2009)


@given(alpha=compositions(max_size=9, max_n=5))
def test_keys_and_atoms_have_non_negative_coefficients(alpha: Composition) -> None:
    # both are sums of monomials over tableaux (Lascoux-Schutzenberger 1990; Mason 2009)
    assert all(c > 0 for c in key(alpha).coefficients)
    assert all(c > 0 for c in atom(alpha).coefficients)


@pytest.mark.parametrize(
    ("alpha", "value"),
    [
        ((0, 1), 2),  # x1 + x2, from memory (Lascoux-Schutzenberger 1990)
        # Demazure characters of shape (2,1) in S_3 at ones: 1, 2, 2, 5, 5, 8 (from memory)
        ((2, 1, 0), 1),  # x^(2,1,0) itself
        ((1, 2, 0), 2),  # x1^2x2 + x1x2^2
        ((2, 0, 1), 2),  # x1^2x2 + x1^2x3
        ((1, 0, 2), 5),  # x1^2x2 + x1^2x3 + x1x2^2 + x1x2x3 + x1x3^2 (by hand, from memory)
        ((0, 2, 1), 5),  # x1^2x2 + x1x2^2 + x1^2x3 + x1x2x3 + x2^2x3 (by hand, from memory)
        ((0, 1, 2), 8),  # s_21(1,1,1) = 8 (hook-content, Stanley EC2 Cor. 7.21.4)
    ],
)
def test_key_values_at_ones(alpha: Composition, value: int) -> None:
    assert key(alpha)(*([1] * len(alpha))) == value


# -- operator identities --------------------------------------------------------------------


@given(case=polys_and_index())
def test_pi_is_idempotent_and_d_squares_to_zero(case: tuple[Poly, int]) -> None:
    p, i = case
    once = isobaric_divided_difference(p, i)
    assert isobaric_divided_difference(once, i) == once  # pi_i^2 = pi_i (Macdonald 1991, (2.10))
    assert divided_difference(divided_difference(p, i), i) == 0  # d_i^2 = 0 (Macdonald 1991, (2.3))
    bar = demazure_atom_operator(p, i)
    assert demazure_atom_operator(bar, i) == -bar  # (pi_i - 1)^2 = -(pi_i - 1), from pi_i^2 = pi_i
    assert bar == once - p  # the definition of pi_i - 1


@pytest.mark.parametrize(
    "op", [isobaric_divided_difference, demazure_atom_operator, divided_difference]
)
@given(case=polys_and_index(max_n=5))
def test_braid_relations(op: Operator, case: tuple[Poly, int]) -> None:
    p, i = case
    if i + 1 >= p.nvars:
        i -= 1
    if i < 1:
        return
    # op_i op_(i+1) op_i = op_(i+1) op_i op_(i+1) (Macdonald, Notes on Schubert Polynomials, 1991)
    assert op(op(op(p, i), i + 1), i) == op(op(op(p, i + 1), i), i + 1)
    if i + 2 < p.nvars:
        # far-apart operators commute: op_i op_(i+2) = op_(i+2) op_i (Macdonald 1991)
        assert op(op(p, i), i + 2) == op(op(p, i + 2), i)


def test_big_coefficients_stay_exact() -> None:
    n, xs = 3, symbols(3)
    p = Poly.from_dict({(5, 0, 2): 3**90, (1, 4, 0): -(2**130), (0, 0, 0): 7}, n)
    for ours, reference in OPERATORS:
        for i in (1, 2):
            expected = to_poly(reference(p.to_sympy(xs), xs, i), n)  # sympy.cancel
            assert ours(p, i) == expected
    # pi_1 (c x1) = c (x1 + x2) for c past 2**127: the kernel widens to big integers
    c = 2**127 + 1
    assert isobaric_divided_difference(Poly.from_dict({(1, 0): c}, 2), 1).coefficients == (c, c)


def test_large_key_is_exact_and_symmetric_where_it_must_be() -> None:
    alpha = (0, 3, 5, 1, 6, 4, 0, 3)
    k = key(alpha)
    # kappa_alpha is symmetric in x_i, x_(i+1) when alpha_i < alpha_(i+1), since it is in the
    # image of pi_i (Lascoux-Schutzenberger 1990); here i = 1, 2, 4, 7
    for i in (1, 2, 4, 7):
        assert isobaric_divided_difference(k, i) == k
    assert k.coefficient(alpha) == 1  # the leading monomial x^alpha (Reiner-Shimozono 1995)


# -- bad input --------------------------------------------------------------------------------


@pytest.mark.parametrize(
    ("alpha", "error", "message"),
    [
        ((1, -1, 2), ValueError, "alpha must have non-negative parts; got -1 at position 2"),
        ((1, 2.5), TypeError, "alpha[1] must be an integer"),
        ("12", TypeError, "alpha must be a sequence of integers"),
        ((1, True), TypeError, "alpha[1] must be an integer"),
        ((2**63, 0), ValueError, "alpha parts must be at most 2**62"),
    ],
)
def test_bad_compositions(alpha: Any, error: type[Exception], message: str) -> None:
    for function in (key, atom):
        with pytest.raises(error, match=re.escape(message)):
            function(alpha)


@pytest.mark.parametrize(
    "op", [isobaric_divided_difference, demazure_atom_operator, divided_difference]
)
def test_bad_operator_arguments(op: Operator) -> None:
    p = Poly("x1^2 + x3", nvars=3)
    with pytest.raises(ValueError, match=re.escape("i must be in 1..2; got 3")):
        op(p, 3)
    with pytest.raises(ValueError, match=re.escape("i must be in 1..2; got 0")):
        op(p, 0)
    with pytest.raises(TypeError, match="i must be an integer"):
        op(p, 1.0)  # type: ignore[arg-type]
    with pytest.raises(TypeError, match="p must be a Poly; got str"):
        op("x1", 1)  # type: ignore[arg-type]
    with pytest.raises(ValueError, match=re.escape("negative (Laurent) exponent")):
        op(Poly("x1^-1*x2", nvars=2), 1)
    with pytest.raises(ValueError, match="at least 2 variables"):
        op(Poly("x1", nvars=1), 1)


def test_huge_images_are_refused_not_built() -> None:
    # pi_1 x2^(2**40) has 2**40 - 1 terms: refused with the size named, not attempted
    with pytest.raises(TooLargeError, match="would need about"):
        isobaric_divided_difference(Poly.monomial((0, 2**40)), 1)
    with pytest.raises(TooLargeError, match="would need about"):
        key((0, 2**40))
    # a huge exponent with a small image is fine: d_1 (x1^N x2^N) = 0, pi_1 fixes it
    p = Poly.monomial((2**40, 2**40))
    assert divided_difference(p, 1) == 0
    assert isobaric_divided_difference(p, 1) == p


def test_zero_and_constants() -> None:
    assert key(()) == 1
    assert atom(()) == 1
    assert key((3,)) == Poly("x1^3", nvars=1)
    zero = Poly.zero(3)
    assert isobaric_divided_difference(zero, 1) == 0
    assert divided_difference(zero, 2) == 0
    assert isobaric_divided_difference(Poly.one(2), 1) == 1  # pi_i fixes symmetric functions
    assert divided_difference(Poly.one(2), 1) == 0  # d_i kills symmetric functions


def test_docstring_examples() -> None:
    assert doctest.testmod(key_module).failed == 0
