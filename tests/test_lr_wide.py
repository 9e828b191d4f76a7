"""Littlewood-Richardson counts past the small fixed-width integers the count starts in: exact
Python ints, checked against the hook length and hook-content formulas."""

from __future__ import annotations

from math import comb

import pytest

import druse
from reference import tableaux as ref

Shape = tuple[int, ...]

# largest counts 640 and 840 (past a u8), computed here and checked below by the hook formulas
STAIRCASES = [((6, 5, 4, 3, 2, 1), (5, 4, 3, 2, 1)), ((6, 5, 4, 3, 2, 1), (6, 4, 3, 2, 1))]


def check_dimensions(mu: Shape, nu: Shape, c: dict[Shape, int]) -> None:
    """sum_lambda c^lambda f^lambda = binom(|mu|+|nu|, |mu|) f^mu f^nu, f by the hook length
    formula (Frame-Robinson-Thrall 1954): dimensions of Ind_{S_a x S_b}^{S_{a+b}}."""
    a, b = sum(mu), sum(nu)
    got = sum(k * ref.standard_count(lam) for lam, k in c.items())
    assert got == comb(a + b, a) * ref.standard_count(mu) * ref.standard_count(nu)


@pytest.mark.parametrize(("mu", "nu"), STAIRCASES)
def test_counts_are_exact_ints(mu: Shape, nu: Shape) -> None:
    c = druse.lr(mu, nu)
    assert all(type(k) is int and k > 0 for k in c.values())
    assert max(c.values()) > 2**8  # the case has counts past a u8
    check_dimensions(mu, nu, c)
    assert c == druse.lr(nu, mu)  # s_mu s_nu = s_nu s_mu


@pytest.mark.parametrize("n", [2, 5, 11])
def test_principal_specialisation(n: int) -> None:
    # s_lambda(1^n) by the hook-content formula (Stanley, Enumerative Combinatorics vol. 2,
    # 1999, Cor. 7.21.4), at every n: s_mu(1^n) s_nu(1^n) = sum c^lambda s_lambda(1^n)
    mu, nu = (5, 4, 3, 2, 1), (5, 4, 3, 2, 1)  # counts up to 176, 1433 lambdas
    c = druse.lr(mu, nu)
    rhs = sum(k * ref.hook_content_count(lam, n) for lam, k in c.items())
    assert ref.hook_content_count(mu, n) * ref.hook_content_count(nu, n) == rhs


@pytest.mark.slow
def test_larger_staircases() -> None:
    mu, nu = (7, 6, 5, 4, 3, 2, 1), (6, 5, 4, 3, 2, 1)
    c = druse.lr(mu, nu)
    assert max(c.values()) > 2**13
    check_dimensions(mu, nu, c)
