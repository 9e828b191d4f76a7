"""Reduced pipe dreams: enumeration rate, and druse against the subset-filter oracle.

Target from the issue: >= 1e7 pipe dreams/s on the w in S_10 with the most pipe dreams found in a
minute's search. A 60 s hill-climbing search over S_10 (random transpositions, accepting ties,
with restarts; about 67,000 exact counts by count_pipe_dreams) found the layered permutation
1 4 3 2 10 9 8 7 6 5 with S_w(1, ..., 1) = 4,424,420 pipe dreams. The timed call is the public
`pipe_dreams(w)`: state graph, count, parallel enumeration of the masks, and the wrapper.
The second group sets druse against tests/reference on a case the oracle finishes quickly.
"""

from __future__ import annotations

from typing import Any

import pytest

import druse
from reference import pipe_dreams as ref

LARGEST_S10 = (1, 4, 3, 2, 10, 9, 8, 7, 6, 5)
LARGEST_S10_COUNT = 4424420  # found by the search above; checked against count_pipe_dreams
SMALL = (1, 6, 5, 4, 3, 2)  # 42 pipe dreams, Catalan C_5 (OEIS A000108)


@pytest.mark.benchmark(group="pipe dreams, largest found in S_10")
def test_enumeration_rate(benchmark: Any, record_rate: Any) -> None:
    assert druse.count_pipe_dreams(LARGEST_S10) == LARGEST_S10_COUNT
    P = benchmark.pedantic(druse.pipe_dreams, args=(LARGEST_S10,), rounds=5, warmup_rounds=1)
    assert len(P) == LARGEST_S10_COUNT
    record_rate(benchmark, LARGEST_S10_COUNT, "pipe_dreams", "druse")


@pytest.mark.benchmark(group="pipe dreams, largest found in S_10")
def test_count_rate(benchmark: Any) -> None:
    assert benchmark(druse.count_pipe_dreams, LARGEST_S10) == LARGEST_S10_COUNT


@pytest.mark.benchmark(group="pipe dreams of 1 6 5 4 3 2 vs reference")
def test_small_druse(benchmark: Any, record_rate: Any) -> None:
    P = benchmark(lambda: list(druse.pipe_dreams(SMALL)))
    assert len(P) == 42
    record_rate(benchmark, 42, "pipe_dreams", "druse")


@pytest.mark.benchmark(group="pipe dreams of 1 6 5 4 3 2 vs reference")
def test_small_reference(benchmark: Any, record_rate: Any) -> None:
    P = benchmark.pedantic(ref.pipe_dreams, args=(SMALL,), rounds=5)
    assert len(P) == 42
    record_rate(benchmark, 42, "pipe_dreams", "reference")


@pytest.mark.benchmark(group="pipe dreams, largest found in S_10")
def test_streaming_rate(benchmark: Any, record_rate: Any) -> None:
    def stream() -> int:
        return sum(len(chunk) for chunk in druse.iter_pipe_dreams(LARGEST_S10, chunk=1 << 20))

    assert benchmark.pedantic(stream, rounds=5, warmup_rounds=1) == LARGEST_S10_COUNT
    record_rate(benchmark, LARGEST_S10_COUNT, "pipe_dreams", "druse")
