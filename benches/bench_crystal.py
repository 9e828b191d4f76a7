"""Crystal operator tables: druse against the pure-Python reference, per group.

Rates are (vertex, i) pairs per second. Each druse round works on a fresh crystal (built in the
untimed setup), because the operator arrays are cached after the first call. Targets from the
issue: all f_i of B(4,3,2,1), n = 8 at >= 1e8 pairs/s, phi/epsilon alone at >= 3e8 pairs/s;
all f_i, e_i, phi_i of B(4,3,2,1), n = 7 at least 300 times faster than the reference.
"""

from __future__ import annotations

from typing import Any

import pytest

import druse
from reference import tableaux as ref

OPERATORS = ((4, 3, 2, 1), 8)  # 177408 vertices (hook-content, Stanley EC2 7.21.4)
OPERATORS_REFERENCE = ((4, 3, 2, 1), 6)  # 8064 vertices: the reference's rate barely depends on n
VERSUS = ((4, 3, 2, 1), 7)  # 43008 vertices


def fresh(shape: tuple[int, ...], n: int) -> Any:
    """A setup for benchmark.pedantic: a new crystal, so that no operator is cached yet."""
    return lambda: ((druse.crystal(shape, n),), {})


def pairs(shape: tuple[int, ...], n: int) -> int:
    return druse.count_tableaux(shape, n) * (n - 1)


@pytest.mark.benchmark(group="all f_i (4,3,2,1) n=8")
def test_operator_tables(benchmark: Any, record_rate: Any) -> None:
    benchmark.pedantic(lambda C: C.operator_tables(), setup=fresh(*OPERATORS), rounds=15)
    record_rate(benchmark, pairs(*OPERATORS), "pairs", "druse")


@pytest.mark.benchmark(group="all f_i (4,3,2,1) n=8")
def test_f_one_i_at_a_time(benchmark: Any, record_rate: Any) -> None:
    n = OPERATORS[1]
    benchmark.pedantic(lambda C: [C.f(i) for i in range(1, n)], setup=fresh(*OPERATORS), rounds=15)
    record_rate(benchmark, pairs(*OPERATORS), "pairs", "druse-f(i)")


@pytest.mark.benchmark(group="all f_i (4,3,2,1) n=8")
def test_f_reference(benchmark: Any, record_rate: Any) -> None:
    shape, n = OPERATORS_REFERENCE

    def all_f() -> int:
        tabs = ref.ssyt(shape, n)
        where = {t: k for k, t in enumerate(tabs)}
        targets = [
            [-1 if (u := ref.f(t, i)) is None else where[u] for t in tabs] for i in range(1, n)
        ]
        return sum(map(len, targets))

    assert benchmark.pedantic(all_f, rounds=3) == pairs(shape, n)
    record_rate(benchmark, pairs(shape, n), "pairs", "reference")


@pytest.mark.benchmark(group="phi, epsilon (4,3,2,1) n=8")
def test_string_lengths(benchmark: Any, record_rate: Any) -> None:
    n = OPERATORS[1]
    benchmark.pedantic(
        lambda C: [C.phi(i) for i in range(1, n)], setup=fresh(*OPERATORS), rounds=15
    )
    record_rate(benchmark, pairs(*OPERATORS), "pairs", "druse")


@pytest.mark.benchmark(group="phi, epsilon (4,3,2,1) n=8")
def test_string_lengths_reference(benchmark: Any, record_rate: Any) -> None:
    shape, n = OPERATORS_REFERENCE
    tabs = ref.ssyt(shape, n)

    def all_phi_eps() -> int:
        return sum(ref.phi(t, i) + ref.epsilon(t, i) for i in range(1, n) for t in tabs)

    benchmark.pedantic(all_phi_eps, rounds=3)
    record_rate(benchmark, pairs(shape, n), "pairs", "reference")


def druse_f_e_phi(shape: tuple[int, ...], n: int) -> int:
    C = druse.crystal(shape, n)
    C.operator_tables()
    return sum(C.f(i).size + C.e(i).size + C.phi(i).size for i in range(1, n)) // 3


@pytest.mark.benchmark(group="f, e, phi (4,3,2,1) n=7")
def test_versus_druse(benchmark: Any, record_rate: Any) -> None:
    got = benchmark.pedantic(druse_f_e_phi, args=VERSUS, rounds=20, warmup_rounds=2)
    assert got == pairs(*VERSUS)
    record_rate(benchmark, pairs(*VERSUS), "pairs", "druse")


@pytest.mark.benchmark(group="f, e, phi (4,3,2,1) n=7")
def test_versus_reference(benchmark: Any, record_rate: Any) -> None:
    tabs, *_tables = benchmark.pedantic(ref.crystal_table, args=VERSUS, rounds=2)
    C = druse.crystal(*VERSUS)
    assert [C.tableau(v) for v in range(len(C))] == sorted(
        tabs, key=lambda t: ref.level_chain(t, VERSUS[1]), reverse=True
    )
    record_rate(benchmark, pairs(*VERSUS), "pairs", "reference")
