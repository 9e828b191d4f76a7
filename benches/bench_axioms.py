"""Axiom checks and tableau isomorphisms on large crystals given as plain arrays.

Targets from the issue: the axiom check, Stembridge's axioms included, on a crystal of about
1e6 vertices given as edge arrays in <= 2 s; the isomorphism of a randomly relabelled B(lambda)
of about 1e5 vertices to the tableau crystal in <= 1 s, building the tableau crystal included.
There is no pure-Python reference here: one that walked 1e6 vertices would take minutes.
"""

from __future__ import annotations

from typing import Any

import numpy as np
import pytest

import druse

CHECKED = ((5, 4, 2, 1), 8)  # 1212750 vertices, 7 operators (hook-content, Stanley EC2 7.21.4)
MAPPED = ((5, 3, 2, 1), 7)  # 129360 vertices


def as_arrays(shape: tuple[int, ...], n: int, seed: int | None = None) -> druse.Crystal:
    """B(shape) as a plain Crystal built from its f_i arrays and weights, its vertices randomly
    renamed when a seed is given; e_i derived up front, so that only the check is timed."""
    B = druse.crystal(shape, n)
    B.lowering_tables()
    size = len(B)
    perm = np.arange(size) if seed is None else np.random.default_rng(seed).permutation(size)
    lowering = []
    for i in range(1, n):
        new = np.full(size, -1, dtype=np.int64)
        old = B.f(i)
        new[perm] = np.where(old >= 0, perm[np.maximum(old, 0)], -1)
        lowering.append(new)
    weights = np.zeros_like(B.weights())
    weights[perm] = B.weights()
    C = druse.Crystal(n, size, lowering=lowering, weights=weights)
    for i in range(1, n):
        C.e(i)
    return C


@pytest.fixture(scope="module")
def checked() -> druse.Crystal:
    return as_arrays(*CHECKED)


@pytest.mark.benchmark(group="axioms of B(5,4,2,1) n=8")
def test_check_with_stembridge(benchmark: Any, record_rate: Any, checked: druse.Crystal) -> None:
    report = benchmark.pedantic(druse.check_crystal, args=(checked,), rounds=5)
    assert report
    record_rate(benchmark, len(checked), "vertices", "druse")


@pytest.mark.benchmark(group="axioms of B(5,4,2,1) n=8")
def test_check_basic_only(benchmark: Any, record_rate: Any, checked: druse.Crystal) -> None:
    report = benchmark.pedantic(
        druse.check_crystal, args=(checked,), kwargs={"stembridge": False}, rounds=5
    )
    assert report
    record_rate(benchmark, len(checked), "vertices", "basic")


@pytest.mark.benchmark(group="isomorphism of B(5,3,2,1) n=7")
def test_isomorphism_of_relabelled(benchmark: Any, record_rate: Any) -> None:
    C = as_arrays(*MAPPED, seed=1)
    shape, mapping = benchmark.pedantic(druse.tableau_isomorphism, args=(C,), rounds=5)
    assert shape == MAPPED[0]
    assert mapping.size == len(C)
    record_rate(benchmark, len(C), "vertices", "druse")
