"""Right keys of every tableau of a crystal: druse's kernel against the pure-Python reference.

The reference (reverse jeu de taquin slides, ``tests/test_tableau_keys.py``) runs a smaller
crystal of the same group; its cost per tableau grows with |lambda| and n, so the smaller case
flatters it and the per-tableau ratio is a lower bound on the speedup at the full case.
Target from the issue: right keys of every vertex of B((4,3,2,1)), n = 8, at >= 1e6 tableaux/s.
"""

from __future__ import annotations

from typing import Any

import pytest

import druse
from druse import _core
from reference.keys import slide_key

FULL = ((4, 3, 2, 1), 8)  # 177408 tableaux (hook-content, Stanley EC2 7.21.4)
REFERENCE = ((4, 3, 2, 1), 5)  # 1024 tableaux: same shape, fewer letters


@pytest.mark.benchmark(group="right keys (4,3,2,1) n=8")
def test_right_keys(benchmark: Any, record_rate: Any) -> None:
    shape, n = FULL
    crystal = druse.crystal(shape, n)
    cells = crystal.tableaux()
    assert len(crystal) == 177408 == druse.count_tableaux(shape, n)

    def run() -> int:
        keys, _weights = _core.tableau_keys(list(shape), n, cells, "right")
        return len(keys)

    count = benchmark.pedantic(run, rounds=10, warmup_rounds=1)
    record_rate(benchmark, count, "tableaux", "druse")


@pytest.mark.benchmark(group="right keys (4,3,2,1) n=8")
def test_right_keys_reference(benchmark: Any, record_rate: Any) -> None:
    shape, n = REFERENCE
    crystal = druse.crystal(shape, n)
    tableaux = [[list(row) for row in crystal.tableau(v)] for v in range(len(crystal))]

    def run() -> int:
        return sum(1 for t in tableaux if slide_key(t, "right"))

    count = benchmark.pedantic(run, rounds=3)
    record_rate(benchmark, count, "tableaux", "reference")
