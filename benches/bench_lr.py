"""Littlewood-Richardson multiplicities.

Targets from the issue: lr for every pair mu, nu of partitions of 8 in <= 5 s; a single
lr((6,4,2,1), (5,3,2)) in <= 50 ms. The group "lr vs crystal" sets the Rust count against the
crystal route (building B(mu) (x) B(nu) and reading off its highest weights) on one pair.
"""

from __future__ import annotations

from typing import Any

import pytest

import druse

SINGLE = ((6, 4, 2, 1), (5, 3, 2))
VERSUS = ((3, 2, 1), (2, 1))  # B(3,2,1) (x) B(2,1) for GL_5: 280 * 40 vertices


@pytest.mark.benchmark(group="lr table size 8")
def test_lr_table_8(benchmark: Any, record_rate: Any) -> None:
    t = benchmark(druse.lr_table, 8)
    assert t.coefficients.shape == (22, 22, 231)  # p(8) = 22, p(16) = 231 (OEIS A000041)
    record_rate(benchmark, 22 * 22, "pairs", "druse")


@pytest.mark.benchmark(group="lr (6,4,2,1) (5,3,2)")
def test_lr_single(benchmark: Any, record_rate: Any) -> None:
    c = benchmark(druse.lr, *SINGLE)
    assert c == druse.lr(SINGLE[1], SINGLE[0])
    record_rate(benchmark, 1, "calls", "druse")


@pytest.mark.benchmark(group="lr vs crystal (3,2,1) (2,1)")
def test_lr_versus(benchmark: Any, record_rate: Any) -> None:
    benchmark(druse.lr, *VERSUS)
    record_rate(benchmark, 1, "calls", "druse")


@pytest.mark.benchmark(group="lr vs crystal (3,2,1) (2,1)")
def test_lr_by_crystal_versus(benchmark: Any, record_rate: Any) -> None:
    c = benchmark(druse.lr_by_crystal, *VERSUS)
    assert c == druse.lr(*VERSUS)
    record_rate(benchmark, 1, "calls", "reference")
