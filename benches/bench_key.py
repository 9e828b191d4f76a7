"""Key polynomials: druse against a pure-Python pi_i on dicts and against sympy, in one group.

Target from the issue (release build): key((0,3,5,1,6,4,0,3)) (32976 terms) at least 100 times
faster than the pure-Python pi_i reference and at least 1000 times faster than sympy's, in one
run. All three apply the same operators in the same order: kappa_alpha = pi_(j_1) ... pi_(j_k)
x^lambda (Lascoux and Schutzenberger, "Keys and standard bases", 1990). The sympy route applies
each pi_i as the exact quotient (x_i f - x_(i+1) s_i f) / (x_i - x_(i+1)) of sympy Polys; it
takes about two minutes, so it runs one round.
"""

from __future__ import annotations

from collections import defaultdict
from typing import Any

import pytest
import sympy  # type: ignore[import-untyped]

import druse

Composition = tuple[int, ...]
Terms = dict[tuple[int, ...], int]

ALPHA = (0, 3, 5, 1, 6, 4, 0, 3)  # the project's issue
TERMS = 32976  # the number of terms of kappa_ALPHA (all three routes agree)
GROUP = "key((0,3,5,1,6,4,0,3))"


def operator_steps(alpha: Composition) -> tuple[Composition, list[int]]:
    """lambda = sort(alpha) and the 0-based j of each pi to apply to x^lambda, first one first."""
    parts = list(alpha)
    swaps: list[int] = []
    while True:
        ascents = [j for j in range(len(parts) - 1) if parts[j] < parts[j + 1]]
        if not ascents:
            return tuple(parts), swaps[::-1]
        j = ascents[-1]  # the rightmost, as druse does: smaller intermediate keys
        parts[j], parts[j + 1] = parts[j + 1], parts[j]
        swaps.append(j)


def pi_on_dict(f: Terms, j: int) -> Terms:
    """pi_(j+1) on {exponents: coefficient} by the closed form of each monomial's image."""
    out: defaultdict[tuple[int, ...], int] = defaultdict(int)
    for e, c in f.items():
        a, b = e[j], e[j + 1]
        if a >= b:  # x^a y^b + ... + x^b y^a
            for p in range(b, a + 1):
                out[(*e[:j], p, a + b - p, *e[j + 2 :])] += c
        else:  # minus the terms strictly between
            for p in range(a + 1, b):
                out[(*e[:j], p, a + b - p, *e[j + 2 :])] -= c
    return {e: c for e, c in out.items() if c}


def key_by_dicts(alpha: Composition) -> Terms:
    lam, steps = operator_steps(alpha)
    f: Terms = {lam: 1}
    for j in steps:
        f = pi_on_dict(f, j)
    return f


def key_by_sympy(alpha: Composition) -> Any:
    xs = sympy.symbols(f"x1:{len(alpha) + 1}")
    lam, steps = operator_steps(alpha)
    f = sympy.Poly(sympy.Mul(*(x**e for x, e in zip(xs, lam, strict=True))), *xs)
    for j in steps:
        a, b = xs[j], xs[j + 1]
        swapped = sympy.Poly(f.as_expr().subs({a: b, b: a}, simultaneous=True), *xs)
        numerator = sympy.Poly(a, *xs) * f - sympy.Poly(b, *xs) * swapped
        f = numerator.exquo(sympy.Poly(a - b, *xs))
    return f


@pytest.mark.benchmark(group=GROUP)
def test_key_druse(benchmark: Any, record_rate: Any) -> None:
    k = benchmark(druse.key, ALPHA)
    record_rate(benchmark, TERMS, "terms", "druse")
    assert len(k) == TERMS


@pytest.mark.benchmark(group=GROUP)
def test_key_reference(benchmark: Any, record_rate: Any) -> None:
    k = benchmark.pedantic(key_by_dicts, args=(ALPHA,), rounds=5, iterations=1)
    record_rate(benchmark, TERMS, "terms", "reference")
    assert k == druse.key(ALPHA).to_dict()


@pytest.mark.benchmark(group=GROUP)
def test_key_sympy(benchmark: Any) -> None:
    if benchmark.disabled:  # the CI smoke run: a smaller case, so that it stays quick
        small = (0, 2, 1, 3)
        k = benchmark.pedantic(key_by_sympy, args=(small,), rounds=1, iterations=1)
        assert druse.Poly.from_sympy(k, "x1:5") == druse.key(small)
        return
    k = benchmark.pedantic(key_by_sympy, args=(ALPHA,), rounds=1, iterations=1)
    # not record_rate: its speedup is druse over the dict reference, which would be misread here
    benchmark.extra_info["terms_per_s"] = f"{TERMS / benchmark.stats.stats.median:.4g}"
    assert len(k.terms()) == TERMS
