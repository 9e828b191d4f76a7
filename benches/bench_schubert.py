"""Schubert polynomials: the whole-S_n batch, the hardest single S_w of S_10 found, and druse
against sympy divided differences on all of S_6, in one group.

Targets from the issue (release build, this 2-core machine): all_schuberts(8) (40320
polynomials) in at most 10 s; schubert(w) for any single w in S_10 in at most 1 s; all of S_6
at least 1000 times faster than sympy divided differences, in one run. The sympy route is the
definition (Macdonald, Notes on Schubert Polynomials, 1991, (4.1)): S_(w0) = x1^5 x2^4 ... x5,
then one exact division d_i f = (f - s_i f) / (x_i - x_(i+1)) per permutation, top down.

Hardest single w in S_10 found (a minute of random search over S_10, then two minutes of hill
climbing by transpositions from several starts): (1, 4, 3, 2, 10, 9, 8, 7, 6, 5), 124134 terms,
the slowest for the transition recursion; (1, 3, 2, 10, 9, 8, 7, 6, 5, 4) has the most terms
met, 143100, and is timed too.
"""

from __future__ import annotations

from typing import Any

import pytest

import druse
from reference.schubert import sympy_all_schuberts

# (w, number of terms): druse's counts; the test suite checks druse against sympy up to S_7
HARDEST = [((1, 4, 3, 2, 10, 9, 8, 7, 6, 5), 124134), ((1, 3, 2, 10, 9, 8, 7, 6, 5, 4), 143100)]
S8_TERMS = 3755349  # terms of all S_w, w in S_8 (summed; the table in rust/schubert/batch.rs)
GROUP_S6 = "all Schubert polynomials of S_6"


@pytest.mark.benchmark(group="all_schuberts(8)")
def test_all_schuberts_8(benchmark: Any, record_rate: Any) -> None:
    result = benchmark.pedantic(druse.all_schuberts, args=(8,), rounds=3, iterations=1)
    record_rate(benchmark, 40320, "polynomials", "druse")
    assert len(result) == 40320
    assert sum(len(p) for p in result.values()) == S8_TERMS


@pytest.mark.benchmark(group="schubert(hardest w in S_10)")
@pytest.mark.parametrize(("w", "terms"), HARDEST)
def test_schubert_hardest_s10(
    benchmark: Any, record_rate: Any, w: tuple[int, ...], terms: int
) -> None:
    p = benchmark.pedantic(druse.schubert, args=(w,), rounds=5, iterations=1)
    record_rate(benchmark, terms, "terms", "druse")
    assert len(p) == terms


@pytest.mark.benchmark(group=GROUP_S6)
def test_all_s6_druse(benchmark: Any, record_rate: Any) -> None:
    result = benchmark(druse.all_schuberts, 6)
    record_rate(benchmark, 720, "polynomials", "druse")
    assert len(result) == 720


@pytest.mark.benchmark(group=GROUP_S6)
def test_all_s6_sympy(benchmark: Any, record_rate: Any) -> None:
    n = 4 if benchmark.disabled else 6  # the CI smoke run: a smaller case, so it stays quick
    result = benchmark.pedantic(sympy_all_schuberts, args=(n,), rounds=1, iterations=1)
    record_rate(benchmark, 720, "polynomials", "reference")
    assert {w: p.to_dict() for w, p in druse.all_schuberts(n).items()} == result
