"""Demazure closures: druse against a pure-Python closure on the same cases, per group.

Targets from the issue: the Demazure crystal of a reduced word of w0 on B(4,3,2,1), n = 8,
operator tables included, in <= 25 ms; the masks of every w in S_6 on B(3,2,1), n = 6, in <= 1 s.
Each druse round works on a fresh crystal (enumerated in the untimed setup), so the operator
tables are part of the timing. The reference walks the same f_i arrays as Python lists (given
to it untimed), with sets, from the definition D_i(X) = {f_i^k x : x in X, k >= 0}.
"""

from __future__ import annotations

import itertools
from typing import Any

import pytest

import druse
from druse import demazure as dm

W0_CASE = ((4, 3, 2, 1), 8)  # 177408 vertices (hook-content, Stanley EC2 7.21.4)
GROUP_CASE = ((3, 2, 1), 6)  # 896 vertices, 720 permutations


def fresh(shape: tuple[int, ...], n: int) -> Any:
    """A setup for benchmark.pedantic: a new crystal, so that no operator is cached yet."""
    return lambda: ((druse.crystal(shape, n),), {})


def close(f: list[list[int]], start: set[int], word: tuple[int, ...]) -> set[int]:
    """D_{i1}(... D_{ik}(start)) by the definition, D_{ik} first."""
    x = set(start)
    for i in reversed(word):
        fi = f[i - 1]
        grown = set(x)
        for v in x:
            t = fi[v]
            while t >= 0 and t not in grown:
                grown.add(t)
                t = fi[t]
        x = grown
    return x


def reference_tables(shape: tuple[int, ...], n: int) -> tuple[list[list[int]], int]:
    C = druse.crystal(shape, n)
    return [C.f(i).tolist() for i in range(1, n)], C.highest_weight()


def w0_word(n: int) -> tuple[int, ...]:
    return dm.reduced_word(tuple(range(n, 0, -1)))


@pytest.mark.benchmark(group="demazure w0 (4,3,2,1) n=8")
def test_w0_mask(benchmark: Any, record_rate: Any) -> None:
    shape, n = W0_CASE
    word = w0_word(n)
    mask = benchmark.pedantic(lambda C: dm.demazure_mask(C, word), setup=fresh(shape, n), rounds=15)
    assert mask.all()
    record_rate(benchmark, mask.size * len(word), "vertex_letters", "druse")


@pytest.mark.benchmark(group="demazure w0 (4,3,2,1) n=8")
def test_w0_mask_tables_ready(benchmark: Any) -> None:
    """The closure alone: the operator tables are built in the untimed setup, as for the
    reference, so this pair gives the ratio of the closures themselves."""
    shape, n = W0_CASE
    word = w0_word(n)

    def ready() -> tuple[tuple[Any], dict[str, Any]]:
        C = druse.crystal(shape, n)
        C.operator_tables()
        return (C,), {}

    mask = benchmark.pedantic(lambda C: dm.demazure_mask(C, word), setup=ready, rounds=15)
    assert mask.all()


@pytest.mark.benchmark(group="demazure w0 (4,3,2,1) n=8")
def test_w0_reference(benchmark: Any, record_rate: Any) -> None:
    shape, n = W0_CASE
    f, top = reference_tables(shape, n)
    word = w0_word(n)
    got = benchmark.pedantic(lambda: close(f, {top}, word), rounds=2)
    assert len(got) == len(f[0])
    record_rate(benchmark, len(got) * len(word), "vertex_letters", "reference")


@pytest.mark.benchmark(group="demazure all of S_6 (3,2,1) n=6")
def test_all_masks(benchmark: Any, record_rate: Any) -> None:
    shape, n = GROUP_CASE
    table = benchmark.pedantic(dm.all_demazure_masks, setup=fresh(shape, n), rounds=15)
    assert table.shape[0] == 720
    record_rate(benchmark, table.shape[0], "masks", "druse")


@pytest.mark.benchmark(group="demazure all of S_6 (3,2,1) n=6")
def test_all_masks_reference(benchmark: Any, record_rate: Any) -> None:
    shape, n = GROUP_CASE
    f, top = reference_tables(shape, n)
    perms = list(itertools.permutations(range(1, n + 1)))
    words = [dm.reduced_word(w) for w in perms]  # untimed, like the tables

    def every_mask() -> int:
        return sum(len(close(f, {top}, word)) for word in words)

    assert benchmark.pedantic(every_mask, rounds=3) > 0
    record_rate(benchmark, len(perms), "masks", "reference")
