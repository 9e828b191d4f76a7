"""Poly: exact arithmetic (against sympy and the multinomial theorem), evaluation, ring laws."""

from __future__ import annotations

import doctest
import json
import math
import operator
from collections.abc import Callable
from fractions import Fraction
from typing import Any

import numpy as np
import pytest
import sympy  # type: ignore[import-untyped]
from hypothesis import given
from hypothesis import strategies as st

import druse._poly_mul
import druse.poly
from druse.poly import Poly
from strategies import polys

X = sympy.symbols("x1:4")


def sympy_product(p: Poly, q: Poly) -> Any:
    return sympy.expand(p.to_sympy() * q.to_sympy())  # sympy as an independent engine


# -- canonical form ------------------------------------------------------------------------------


def test_arithmetic_against_sympy() -> None:
    p = Poly("x1^2*x3 - 3*x2 + x1^-1 + 4", 3)
    q = Poly("x1 - x2*x3^2 + 2", 3)
    ps, qs = p.to_sympy(), q.to_sympy()
    # sympy as an independent engine
    assert (p + q).to_sympy() == sympy.expand(ps + qs)
    assert (p - q).to_sympy() == sympy.expand(ps - qs)
    assert (p * q).to_sympy() == sympy.expand(ps * qs)
    assert (p**3).to_sympy() == sympy.expand(ps**3)
    assert (-p).to_sympy() == -ps
    assert (3 - p * 2 + 5 * q - 1).to_sympy() == sympy.expand(3 - 2 * ps + 5 * qs - 1)


def test_ints_and_numpy_ints_mix_on_either_side() -> None:
    p = Poly("x1 + 1", 1)
    assert 2 + p == p + 2 == Poly("x1 + 3", 1)
    assert 2 - p == Poly("1 - x1", 1)
    assert p - 2 == Poly("x1 - 1", 1)
    assert 3 * p == p * 3 == Poly("3*x1 + 3", 1)
    assert np.int64(3) * p == p * np.int64(3) == 3 * p
    assert np.int64(2) + p == p + 2
    assert p * 0 == 0
    assert +p is p


@pytest.mark.parametrize("fn", [operator.add, operator.sub, operator.mul])
def test_binary_ops_refuse_other_types_and_mixed_nvars(fn: Callable[[Any, Any], Any]) -> None:
    p, q = Poly("x1", 2), Poly("x1", 3)
    with pytest.raises(ValueError, match="nvars=2 and nvars=3"):
        fn(p, q)
    for other in [1.5, Fraction(1, 2), "x", True, [1]]:
        with pytest.raises(TypeError):
            fn(p, other)
        with pytest.raises(TypeError):
            fn(other, p)


def test_power_edge_cases_and_errors() -> None:
    p = Poly("x1 - x2", 2)
    assert p**0 == 1
    assert Poly.zero(2) ** 0 == 1  # the empty product
    assert Poly.zero(2) ** 3 == 0
    assert p**1 == p
    assert Poly.monomial((2, -1), -3) ** 5 == Poly.monomial((10, -5), -243)
    assert (p**7).coefficient((3, 4)) == math.comb(7, 3)  # binomial theorem: (-1)**4 * C(7, 3)
    assert (p**7).coefficient((4, 3)) == -math.comb(7, 4)  # binomial theorem
    with pytest.raises(ValueError, match="non-negative"):
        p**-1
    with pytest.raises(TypeError, match="integer"):
        p**1.5
    with pytest.raises(TypeError, match="integer"):
        p**True
    with pytest.raises(ValueError, match="int64"):
        Poly.monomial((2**62,)) ** 2


def test_product_exponents_past_int64_are_refused() -> None:
    p = Poly.monomial((2**62, 0)) + Poly.monomial((0, 1))
    with pytest.raises(ValueError, match="int64"):
        p * p


def test_big_coefficients_stay_exact() -> None:
    big = 2**64 + 1
    p = Poly.from_dict({(1, 0): big, (0, 1): -(2**100), (0, 0): 3}, 2)
    q = Poly.from_dict({(1, 1): 2**70 - 1, (0, 0): -big}, 2)
    assert (p * q).to_sympy() == sympy_product(p, q)
    assert (p * q).coefficient((2, 1)) == big * (2**70 - 1)
    assert (p + p).coefficient((0, 1)) == -(2**101)
    assert (p**4).to_sympy() == sympy.expand(p.to_sympy() ** 4)  # sympy as an independent engine


def test_multinomial_coefficients_of_a_large_power() -> None:
    p = Poly("1 + x1 + x2 + x3", 3) ** 24  # nine squarings and products with 455-term factors
    for a in [(0, 0, 0), (6, 6, 6), (24, 0, 0), (1, 2, 3), (10, 7, 0)]:
        rest = 24 - sum(a)
        want = math.factorial(24) // math.prod(math.factorial(k) for k in (*a, rest))
        assert p.coefficient(a) == want  # multinomial theorem
    assert len(p) == math.comb(27, 3)  # monomials of degree <= 24 in 3 variables
    assert sum(p.coefficients) == 4**24


def test_homogeneous_products_match_the_multinomial_theorem() -> None:
    e = Poly("x1 + x2 + x3 + x4", 4)
    p = (e**5) * (e**6)
    assert len(p) == math.comb(14, 3)  # monomials of degree 11 in 4 variables
    want = math.factorial(11) // math.prod(math.factorial(k) for k in (2, 3, 4, 2))
    assert p.coefficient((2, 3, 4, 2)) == want  # multinomial theorem


@pytest.mark.parametrize(
    ("dense_slots", "block"), [(1 << 24, 1 << 22), (0, 1 << 22), (0, 3), (1 << 24, 3)]
)
def test_every_product_route_agrees_with_sympy(
    monkeypatch: pytest.MonkeyPatch, dense_slots: int, block: int
) -> None:
    monkeypatch.setattr(druse._poly_mul, "_DENSE_SLOTS", dense_slots)
    monkeypatch.setattr(druse._poly_mul, "_BLOCK", block)
    cases = [
        ("x1^2 + 3*x1*x2 - x3 + 1", "x1 - x2^2*x3 + 5"),  # small coefficients, packed keys
        ("x1^2*x2 + 3*x1*x2^2 - 2*x3^3", "x1 - x2 + 7*x3"),  # homogeneous: last exponent implied
        ("x1^-3 + x2 - 2*x3^2", "x1^3*x2^-1 - x2 + 1"),  # Laurent
    ]
    for text_p, text_q in cases:
        p, q = Poly(text_p, 3), Poly(text_q, 3)
        for scale in [1, 2**40, 2**90 + 7]:
            ps, qs = p * scale, q * (scale - 3)
            assert (ps * qs).to_sympy() == sympy_product(ps, qs)  # sympy as an independent engine
    wide = Poly.monomial((2**61, 0, 0)) + Poly.monomial((-(2**61), 1, 1)) + 1
    assert (wide * wide).to_sympy() == sympy.expand(wide.to_sympy() ** 2)  # unpackable rows
    many = Poly.from_dict({tuple((k * j) % 23 for j in range(30)): k - 3 for k in range(8)}, 30)
    assert (many * many).to_sympy() == sympy.expand(many.to_sympy() ** 2)  # several key words


# -- evaluation ----------------------------------------------------------------------------------


def test_evaluation_is_exact() -> None:
    p = Poly("x1^2*x3 - 3*x2 + 4 + x1^-1", 3)
    point = (Fraction(2, 3), -5, 7)
    want = p.to_sympy().subs(dict(zip(X, point, strict=True)))  # sympy as an independent engine
    assert p(*point) == Fraction(int(want.p), int(want.q))
    assert p(2, 1, 1) == Fraction(11, 2)  # 4 - 3 + 4 + 1/2, by hand
    assert Poly("x1^2 - x2", 2)(2**40, 3) == 2**80 - 3
    assert type(Poly("x1^2 - x2", 2)(2, 3)) is int
    assert type(Poly("x1^-1 + x1", 1)(1)) is int
    assert Poly.zero(2)(1, 2) == 0
    assert Poly("x1 + x2", 2)(Poly("x1^2", 1), Poly("-1", 1)) == Poly("x1^2 - 1", 1)
    assert p(*X) == p.to_sympy()


def test_evaluation_refuses_bad_points() -> None:
    p = Poly("x1^-1 + x2", 2)
    with pytest.raises(ValueError, match="expected 2 values"):
        p(1)
    with pytest.raises(TypeError, match="bool"):
        p(True, 1)
    with pytest.raises(ValueError, match="values\\[0\\] is 0"):
        p(0, 1)
    assert p(1, 0) == 1


# -- properties ------------------------------------------------------------------------------


@given(polys(3), polys(3), polys(3))
def test_ring_axioms(p: Poly, q: Poly, r: Poly) -> None:
    assert p * (q + r) == p * q + p * r
    assert (p * q) * r == p * (q * r)
    assert p * q == q * p
    assert (p + q) + r == p + (q + r)
    assert p - p == 0
    assert p + Poly.zero(3) == p
    assert p * Poly.one(3) == p


@given(polys(3), polys(3))
def test_products_and_sums_agree_with_sympy(p: Poly, q: Poly) -> None:
    assert (p * q).to_sympy() == sympy_product(p, q)
    assert (p - q).to_sympy() == sympy.expand(p.to_sympy() - q.to_sympy())  # sympy, independent


@given(polys(2, max_terms=3), st.integers(0, 4))
def test_powers_agree_with_sympy(p: Poly, k: int) -> None:
    assert (p**k).to_sympy() == sympy.expand(p.to_sympy() ** k)  # sympy as an independent engine


@given(st.integers(0, 4).flatmap(lambda n: polys(n, max_terms=6)))
def test_round_trips(p: Poly) -> None:
    assert Poly.from_dict(p.to_dict(), p.nvars) == p
    assert Poly.from_json(json.loads(json.dumps(p.to_json()))) == p
    assert Poly(str(p), p.nvars) == p
    symbols = sympy.symbols(f"y1:{p.nvars + 1}")
    assert Poly.from_sympy(p.to_sympy(symbols), symbols) == p
    assert p.exponents.tolist() == sorted(p.exponents.tolist(), reverse=True)
    assert 0 not in p.coefficients


def test_docstring_examples_run() -> None:
    assert doctest.testmod(druse.poly).failed == 0
