"""Schubert-to-key expansions of every w in S_n, by both routes, in one group per n.

Target from the issue (release build): schubert(w) with its key expansion for every w in S_8
(40,320 permutations) in at most 60 s. The "polynomial" route (key_expansion(schubert(w))) is
the one held to it; the "crystal" route (the Demazure pieces of the pipe-dream crystal,
Assaf-Schilling 2018, recognised in Rust on the pipe dreams alone) is timed beside it on S_7
and S_8 in the same run. Each runs one round: a whole symmetric group is already many
thousands of calls. In the CI smoke run (benchmarks disabled) S_5 stands in, so that it stays
quick. extra_info holds perms_per_s for each route.
"""

from __future__ import annotations

import itertools
import math
from typing import Any

import pytest

from druse.schubert_keys import all_schubert_key_expansions, schubert_key_expansion

Perm = tuple[int, ...]


def expand_all(n: int, method: str) -> int:
    """Expand S_w for every w in S_n; return the number of keys, summed (a cheap checksum)."""
    total = 0
    for w in itertools.permutations(range(1, n + 1)):
        total += sum(schubert_key_expansion(w, method=method).values())
    return total


def run(benchmark: Any, record_rate: Any, n: int, method: str) -> None:
    size = 5 if benchmark.disabled else n
    keys = benchmark.pedantic(expand_all, args=(size, method), rounds=1, iterations=1)
    benchmark.extra_info["keys"] = keys
    count = 1
    for k in range(2, size + 1):
        count *= k
    record_rate(benchmark, count, "perms", method)
    assert keys >= count  # at least one key per w (Lascoux-Schutzenberger 1990)


@pytest.mark.benchmark(group="key expansions of all of S_7")
def test_s7_polynomial(benchmark: Any, record_rate: Any) -> None:
    run(benchmark, record_rate, 7, "polynomial")


@pytest.mark.benchmark(group="key expansions of all of S_7")
def test_s7_crystal(benchmark: Any, record_rate: Any) -> None:
    run(benchmark, record_rate, 7, "crystal")


@pytest.mark.benchmark(group="key expansions of all of S_8")
def test_s8_polynomial(benchmark: Any, record_rate: Any) -> None:
    run(benchmark, record_rate, 8, "polynomial")


@pytest.mark.benchmark(group="key expansions of all of S_8")
def test_s8_crystal(benchmark: Any, record_rate: Any) -> None:
    run(benchmark, record_rate, 8, "crystal")


@pytest.mark.benchmark(group="key expansions of all of S_8")
def test_s8_crystal_batch(benchmark: Any, record_rate: Any) -> None:
    size = 5 if benchmark.disabled else 8
    out = benchmark.pedantic(all_schubert_key_expansions, args=(size,), rounds=1, iterations=1)
    record_rate(benchmark, len(out), "perms", "batch")
    assert len(out) == math.factorial(size)
