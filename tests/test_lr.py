"""Littlewood-Richardson multiplicities against published values, the Pieri rules, the hook
length formula, Schur products expanded in sympy, and the tensor-product crystal."""

from __future__ import annotations

from itertools import product
from math import comb
from typing import Any

import numpy as np
import pytest
import sympy  # type: ignore[import-untyped]
from hypothesis import given
from hypothesis import strategies as st

import druse
from reference import tableaux as ref

Shape = tuple[int, ...]

UP_TO_4 = list(ref.partitions_up_to(4))


def contains(lam: Shape, mu: Shape) -> bool:
    return len(mu) <= len(lam) and all(m <= lam[k] for k, m in enumerate(mu))


def padded(shape: Shape, length: int) -> list[int]:
    return list(shape) + [0] * (length - len(shape))


def strips(mu: Shape, k: int, vertical: bool) -> dict[Shape, int]:
    """lambda/mu a horizontal strip (no two cells in a column: lambda_{j+1} <= mu_j) or a
    vertical one (no two in a row: lambda_j - mu_j <= 1) of k cells, each with multiplicity 1."""
    out = {}
    for lam in ref.partitions(sum(mu) + k):
        if not contains(lam, mu):
            continue
        m, lm = padded(mu, len(lam) + 1), padded(lam, len(lam) + 1)
        if vertical:
            ok = all(lm[j] - m[j] <= 1 for j in range(len(lam)))
        else:
            ok = all(lm[j + 1] <= m[j] for j in range(len(lam)))
        if ok:
            out[lam] = 1
    return out


def lr_skew_count(lam: Shape, mu: Shape, nu: Shape) -> int:
    """The Littlewood-Richardson rule as Fulton states it (Young Tableaux, 1997, ch. 5): the
    number of SSYT of skew shape lam/mu and content nu whose word, read backwards (rows top to
    bottom, each right to left), is a lattice word. Plain backtracking, for small shapes."""
    m = padded(mu, len(lam))
    order = [(r, c) for r in range(len(lam)) for c in reversed(range(m[r], lam[r]))]
    filling: dict[tuple[int, int], int] = {}
    used = [0] * (len(nu) + 1)

    def extend(k: int) -> int:
        if k == len(order):
            return 1
        r, c = order[k]
        hi = filling.get((r, c + 1), len(nu))
        lo = filling.get((r - 1, c), 0) + 1
        total = 0
        for j in range(lo, hi + 1):
            if used[j - 1] < nu[j - 1] and (j == 1 or used[j - 2] > used[j - 1]):
                used[j - 1] += 1
                filling[(r, c)] = j
                total += extend(k + 1)
                used[j - 1] -= 1
                del filling[(r, c)]
        return total

    return extend(0)


def lr_by_skew_tableaux(mu: Shape, nu: Shape) -> dict[Shape, int]:
    out = {}
    for lam in ref.partitions(sum(mu) + sum(nu)):
        if contains(lam, mu) and contains(lam, nu):
            count = lr_skew_count(lam, mu, nu)
            if count:
                out[lam] = count
    return out


@given(
    st.sampled_from(list(ref.partitions_up_to(5))), st.sampled_from(list(ref.partitions_up_to(4)))
)
def test_against_lr_skew_tableaux(mu: Shape, nu: Shape) -> None:
    # Fulton, Young Tableaux, 1997, ch. 5: LR skew tableaux with a reverse lattice word
    assert druse.lr(mu, nu) == lr_by_skew_tableaux(mu, nu)


def test_fulton_example() -> None:
    assert druse.lr((2, 1), (2, 1))[(3, 2, 1)] == 2  # Fulton, Young Tableaux, 1997, ch. 5
    assert druse.lr_by_crystal((2, 1), (2, 1))[(3, 2, 1)] == 2  # same source
    assert lr_skew_count((3, 2, 1), (2, 1), (2, 1)) == 2  # same source, the oracle here


@pytest.mark.parametrize("mu", list(ref.partitions_up_to(5)))
def test_pieri_rules(mu: Shape) -> None:
    # Pieri: s_mu h_k = sum over horizontal k-strips, s_mu e_k over vertical ones (Fulton,
    # Young Tableaux, 1997, sec. 2.2; Macdonald, Symmetric Functions, ch. I (5.16), (5.17))
    for k in range(4):
        assert druse.lr(mu, (k,)) == strips(mu, k, vertical=False)
        assert druse.lr(mu, (1,) * k) == strips(mu, k, vertical=True)


def test_symmetry() -> None:
    # c^lambda_{mu nu} = c^lambda_{nu mu}: s_mu s_nu = s_nu s_mu
    for mu, nu in product(ref.partitions_up_to(5), repeat=2):
        assert druse.lr(mu, nu) == druse.lr(nu, mu)


def test_dimensions_add_up() -> None:
    # sum_lambda c^lambda_{mu nu} f^lambda = binom(|mu|+|nu|, |mu|) f^mu f^nu, f by the hook
    # length formula (Frame-Robinson-Thrall 1954): dimensions of Ind_{S_a x S_b}^{S_{a+b}}
    for mu, nu in product(ref.partitions_up_to(6), repeat=2):
        a, b = sum(mu), sum(nu)
        got = sum(c * ref.standard_count(lam) for lam, c in druse.lr(mu, nu).items())
        assert got == comb(a + b, a) * ref.standard_count(mu) * ref.standard_count(nu)


@pytest.mark.slow
@pytest.mark.parametrize("mu", UP_TO_4)
def test_schur_products_in_sympy(mu: Shape) -> None:
    """s_mu s_nu = sum c^lambda s_lambda in l(mu) + l(nu) variables (enough for every lambda),
    Schur polynomials from druse.schur, multiplied and expanded in sympy."""
    for nu in UP_TO_4:
        if nu > mu:
            continue  # the other order is the symmetry test
        n = max(len(mu) + len(nu), 1)
        xs = sympy.symbols(f"x1:{n + 1}")

        def s(shape: Shape, xs: Any = xs, n: int = n) -> sympy.Poly:
            return sympy.Poly(druse.schur(shape, n).to_sympy(xs), *xs)

        rhs = sympy.Poly(0, *xs)
        for lam, c in druse.lr(mu, nu).items():
            rhs += c * s(lam)
        assert s(mu) * s(nu) == rhs  # sympy


def test_lr_equals_the_crystal_route() -> None:
    """Counting tableaux (Rust) against the highest weight vertices of B(mu) (x) B(nu)."""
    small = list(ref.partitions_up_to(3))
    pairs = [*product(small, repeat=2), ((2, 2), (2, 1)), ((3, 1), (2, 1, 1)), ((2, 1), (3, 2))]
    for mu, nu in pairs:
        assert druse.lr(mu, nu) == druse.lr_by_crystal(mu, nu), (mu, nu)


def test_larger_case_is_consistent() -> None:
    mu, nu = (6, 4, 2, 1), (5, 3, 2)
    c = druse.lr(mu, nu)
    assert c == druse.lr(nu, mu)
    a, b = sum(mu), sum(nu)
    got = sum(k * ref.standard_count(lam) for lam, k in c.items())
    assert got == comb(a + b, a) * ref.standard_count(mu) * ref.standard_count(nu)  # hook formula
    assert all(contains(lam, mu) and contains(lam, nu) for lam in c)
    assert list(c) == sorted(c, reverse=True)


def test_table_matches_single_calls() -> None:
    seen: list[tuple[int, int]] = []
    t = druse.lr_table(4, progress=lambda done, total: seen.append((done, total)))
    assert t.partitions == tuple(ref.partitions(4))
    assert t.products == tuple(ref.partitions(8))
    assert t.coefficients.shape == (5, 5, 22)
    assert t.coefficients.dtype == np.int64
    assert seen[-1] == (25, 25)
    for mu, nu in product(t.partitions, repeat=2):
        assert t.get(mu, nu) == druse.lr(mu, nu)
    assert druse.lr_table(0).get((), ()) == {(): 1}
    # p(8) * p(8) pairs, p(16) products (OEIS A000041: p(8) = 22, p(16) = 231)
    assert druse.lr_table(8).coefficients.shape == (22, 22, 231)


def test_empty_and_trailing_zeros() -> None:
    assert druse.lr((), ()) == {(): 1}
    assert druse.lr((2, 0), (0,)) == {(2,): 1}
    assert druse.lr_by_crystal((), (1,)) == {(1,): 1}


@pytest.mark.parametrize(
    ("mu", "nu", "error", "match"),
    [
        ((1, 2), (1,), ValueError, "mu must be weakly decreasing"),
        ((1,), (2, -1), ValueError, "nu must have non-negative parts"),
        ("21", (1,), TypeError, "mu must be a sequence"),
        ((1,), (1.5,), TypeError, "nu\\[0\\] must be an integer"),
        ((1,), 3, TypeError, "nu must be a sequence"),
        ((1,) * 200, (1,) * 60, ValueError, "at most 254 rows"),
    ],
)
def test_bad_input(mu: Any, nu: Any, error: type[Exception], match: str) -> None:
    with pytest.raises(error, match=match):
        druse.lr(mu, nu)


def test_bad_table_input() -> None:
    with pytest.raises(ValueError, match="size must be non-negative"):
        druse.lr_table(-1)
    with pytest.raises(TypeError, match="size must be an integer"):
        druse.lr_table("3")  # type: ignore[arg-type]
    with pytest.raises(ValueError, match="mu must be a partition of 2"):
        druse.lr_table(2).get((3,), (2,))
    with pytest.raises(ValueError, match="mu must be weakly decreasing"):
        druse.lr_by_crystal((1, 2), (1,))
