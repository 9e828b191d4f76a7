"""Schur polynomials: druse against a pure-Python branching recursion on dicts, per group.

Targets from the issue (release build): s_(5,4,3,2,1)(x1..x9) in <= 50 ms and
s_(6,5,4,3,2,1)(x1..x10) in <= 1 s, through the public API (the Poly included). The kernel call
alone (``_core.schur_terms``) is timed beside it to show what the Poly wrapping costs.

The reference runs the small case in full. On the big one it would take about three minutes
and 12 GB (its memo keeps every level), so there it runs the same shape with n = 8 and both
record a per-term rate (``terms_per_s``); the reference's cost per term grows with n, so the
ratio it gives is, if anything, in the reference's favour.
"""

from __future__ import annotations

from collections import defaultdict
from collections.abc import Iterator
from functools import cache
from typing import Any

import pytest

import druse
from druse import _core

Shape = tuple[int, ...]
Terms = dict[tuple[int, ...], int]

SMALL = ((5, 4, 3, 2, 1), 9)  # 253692 terms (the project's issue)
BIG = ((6, 5, 4, 3, 2, 1), 10)  # 5900290 terms
BIG_REFERENCE = ((6, 5, 4, 3, 2, 1), 8)  # 262144 terms: same shape, fewer variables


def strips_below(mu: Shape) -> Iterator[Shape]:
    """The partitions nu with mu/nu a horizontal strip: mu_{j+1} <= nu_j <= mu_j."""

    def rows(j: int) -> Iterator[tuple[int, ...]]:
        if j == len(mu):
            yield ()
            return
        below = mu[j + 1] if j + 1 < len(mu) else 0
        for part in range(below, mu[j] + 1):
            for rest in rows(j + 1):
                yield (part, *rest)

    for nu in rows(0):
        yield tuple(p for p in nu if p > 0)


def schur_reference(shape: Shape, n: int) -> Terms:
    """s_shape(x1..xn) by the branching rule s_mu(x1..xk) = sum of xk^|mu/nu| s_nu(x1..x(k-1))
    over mu/nu a horizontal strip (Macdonald, Symmetric Functions and Hall Polynomials, 2nd ed.,
    1995, Ch. I (5.11)), memoised on (nu, k), exponents as tuples."""

    @cache
    def s(mu: Shape, k: int) -> Terms:
        if len(mu) > k:
            return {}
        if k == 0:
            return {(): 1}
        out: defaultdict[tuple[int, ...], int] = defaultdict(int)
        for nu in strips_below(mu):
            e = sum(mu) - sum(nu)
            for exps, c in s(nu, k - 1).items():
                out[(*exps, e)] += c
        return dict(out)

    return s(tuple(shape), n)


# Each case: (shape, n), the reference's (shape, n), rounds, and the number of terms of each.
CASES = {
    "schur (5,4,3,2,1) n=9": (SMALL, SMALL, 20, 253692, 253692),
    "schur (6,5,4,3,2,1) n=10": (BIG, BIG_REFERENCE, 5, 5900290, 262144),
}


@pytest.mark.parametrize("group", CASES)
def test_druse(benchmark: Any, record_rate: Any, group: str) -> None:
    case, _, rounds, terms, _ = CASES[group]
    benchmark.group = group
    p = benchmark.pedantic(druse.schur, args=case, rounds=rounds, warmup_rounds=1)
    assert len(p) == terms
    record_rate(benchmark, len(p), "terms", "druse")


@pytest.mark.parametrize("group", CASES)
def test_kernel(benchmark: Any, record_rate: Any, group: str) -> None:
    (shape, n), _, rounds, terms, _ = CASES[group]
    benchmark.group = group
    args = (list(shape), n)
    _, coeffs = benchmark.pedantic(_core.schur_terms, args=args, rounds=rounds, warmup_rounds=1)
    assert len(coeffs) == terms
    record_rate(benchmark, len(coeffs), "terms", "druse-kernel")


@pytest.mark.parametrize("group", CASES)
def test_reference(benchmark: Any, record_rate: Any, group: str) -> None:
    _, case, _, _, terms = CASES[group]
    benchmark.group = group
    result = benchmark.pedantic(schur_reference, args=case, rounds=1)
    assert len(result) == terms
    record_rate(benchmark, len(result), "terms", "reference")
