"""Enumerating and materialising SSYT: druse against the pure-Python reference, per group.

Where the full case is too slow for pure Python, the reference runs a smaller case of the same
shape and both record a per-tableau rate (``tableaux_per_s``); the reference's cost is linear in
the number of tableaux (constant work per filled cell), so the rates compare directly.
Targets from the issue: walking (6,4,2), n = 10 at >= 2.5e8 tableaux/s on one thread and
>= 4e8 on two; materialising B(5,4,3,2,1), n = 7 in <= 5 ms and B(6,5,4,3,2,1), n = 8 in <= 2 s.
"""

from __future__ import annotations

from typing import Any

import pytest

import druse
from druse import _core
from reference import tableaux as ref

WALK = ((6, 4, 2), 10)  # 17200755 tableaux (hook-content, Stanley EC2 7.21.4)
WALK_REFERENCE = ((6, 4, 2), 6)  # 62370 tableaux
SMALL = ((5, 4, 3, 2, 1), 7)  # 473088 tableaux
BIG = ((6, 5, 4, 3, 2, 1), 8)  # 56229888 tableaux, 1.18 GB of cells
BIG_REFERENCE = ((6, 5, 4, 3, 2, 1), 6)  # 32768 tableaux: same shape, fewer letters


@pytest.mark.benchmark(group="walk (6,4,2) n=10")
@pytest.mark.parametrize("threads", [1, 2])
def test_walk_scan(benchmark: Any, record_rate: Any, threads: int) -> None:
    shape, n = WALK
    model = _core.TableauModel(list(shape), n)  # private until the public wrapper settles
    count, _checksum = benchmark.pedantic(model.scan, args=(threads,), rounds=5, warmup_rounds=1)
    assert count == druse.count_tableaux(shape, n)
    record_rate(benchmark, count, "tableaux", "druse" if threads == 1 else f"druse-{threads}")


@pytest.mark.benchmark(group="walk (6,4,2) n=10")
def test_walk_iter_tableaux(benchmark: Any, record_rate: Any) -> None:
    shape, n = WALK

    def consume() -> int:
        return sum(len(block) for block in druse.iter_tableaux(shape, n, chunk_size=1 << 16))

    count = benchmark.pedantic(consume, rounds=3, warmup_rounds=1)
    assert count == druse.count_tableaux(shape, n)
    record_rate(benchmark, count, "tableaux", "druse-iter")


@pytest.mark.benchmark(group="walk (6,4,2) n=10")
def test_walk_reference(benchmark: Any, record_rate: Any) -> None:
    shape, n = WALK_REFERENCE  # the full case would take about a minute in pure Python
    count = benchmark.pedantic(lambda: len(ref.ssyt(shape, n)), rounds=3)
    assert count == ref.hook_content_count(shape, n)
    record_rate(benchmark, count, "tableaux", "reference")


@pytest.mark.benchmark(group="materialise (5,4,3,2,1) n=7")
def test_materialise_small(benchmark: Any, record_rate: Any) -> None:
    shape, n = SMALL
    C = benchmark.pedantic(druse.crystal, args=(shape, n), rounds=20, warmup_rounds=2)
    assert len(C) == 473088  # the figure; hook-content (EC2 7.21.4) agrees
    record_rate(benchmark, len(C), "tableaux", "druse")


@pytest.mark.benchmark(group="materialise (5,4,3,2,1) n=7")
def test_materialise_small_reference(benchmark: Any, record_rate: Any) -> None:
    shape, n = SMALL
    count = benchmark.pedantic(lambda: len(ref.ssyt(shape, n)), rounds=3)
    assert count == 473088
    record_rate(benchmark, count, "tableaux", "reference")


@pytest.mark.benchmark(group="materialise (6,5,4,3,2,1) n=8")
def test_materialise_big(benchmark: Any, record_rate: Any) -> None:
    shape, n = BIG

    def build() -> int:
        return len(druse.crystal(shape, n))  # dropped at once: one 1.2 GB array alive at a time

    count = benchmark.pedantic(build, rounds=3)
    assert count == 56229888  # the figure; hook-content (EC2 7.21.4) agrees
    record_rate(benchmark, count, "tableaux", "druse")


@pytest.mark.benchmark(group="materialise (6,5,4,3,2,1) n=8")
def test_materialise_big_reference(benchmark: Any, record_rate: Any) -> None:
    shape, n = BIG_REFERENCE  # the full case would need about 30 GB and 4 minutes in Python
    count = benchmark.pedantic(lambda: len(ref.ssyt(shape, n)), rounds=3)
    assert count == ref.hook_content_count(shape, n)
    record_rate(benchmark, count, "tableaux", "reference")
