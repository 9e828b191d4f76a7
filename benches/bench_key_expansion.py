"""Key expansions: the Rust peeling (rust/poly/expand.rs) against the pure-Python peeling of
tests/reference/expansion.py, on the same polynomials, in one group each.

Both peel the revlex-leading term and subtract a key polynomial (Lascoux and Schutzenberger,
"Keys and standard bases", 1990), each caching the key polynomials it computes; every timed
round starts from empty caches, so the key polynomials are computed inside the timing too.

Target from issue 4 (release build): the Schubert polynomials of all of S_8 with their key
expansions in at most 60 s. The polynomials come from druse.all_schuberts (timed in
bench_schubert.py); only their expansion is timed here.
A second batch holds products of two key polynomials in 7 variables (demo data, seeded), whose
expansions have negative coefficients too.
"""

from __future__ import annotations

import random
from typing import Any

import pytest

import druse
from reference import expansion as ref

SINGLE = druse.schur((3, 2, 1), 6) * druse.key((0, 1, 2, 0, 1, 0))
GROUP_SINGLE = "key_expansion(schur((3,2,1),6) * key((0,1,2,0,1,0)))"


@pytest.fixture(scope="module")
def schubert_stand_ins() -> dict[int, list[druse.Poly]]:
    return {n: list(druse.all_schuberts(n).values()) for n in (7, 8)}


@pytest.fixture(scope="module")
def key_products() -> list[druse.Poly]:
    rng = random.Random(2026)

    def composition() -> tuple[int, ...]:
        return tuple(rng.randrange(3) for _ in range(7))

    return [druse.key(composition()) * druse.key(composition()) for _ in range(200)]


def clear_reference_cache() -> None:
    ref.basis_element.cache_clear()


@pytest.mark.benchmark(group=GROUP_SINGLE)
def test_single_druse(benchmark: Any, record_rate: Any) -> None:
    out = benchmark.pedantic(druse.key_expansion, args=(SINGLE,), rounds=20, warmup_rounds=2)
    record_rate(benchmark, len(SINGLE), "terms", "druse")
    assert len(out) == 23  # every route agrees (tests/test_key_expansion_kernel.py)


@pytest.mark.benchmark(group=GROUP_SINGLE)
def test_single_reference(benchmark: Any, record_rate: Any) -> None:
    terms = SINGLE.to_dict()
    out = benchmark.pedantic(
        ref.key_expansion, args=(terms,), setup=clear_reference_cache, rounds=5
    )
    record_rate(benchmark, len(SINGLE), "terms", "reference")
    assert out == druse.key_expansion(SINGLE)


@pytest.mark.parametrize("n", [7, 8])
def test_batch_druse(
    benchmark: Any, record_rate: Any, schubert_stand_ins: dict[int, list[druse.Poly]], n: int
) -> None:
    benchmark.group = f"key_expansions(all S_{n} stand-ins)"
    polys = schubert_stand_ins[n]
    out = benchmark.pedantic(druse.key_expansions, args=(polys,), rounds=3)
    record_rate(benchmark, len(polys), "polys", "druse")
    assert all(c > 0 for expansion in out for c in expansion.values())  # Schubert: key-positive


@pytest.mark.parametrize("n", [7, 8])
def test_batch_reference(
    benchmark: Any, record_rate: Any, schubert_stand_ins: dict[int, list[druse.Poly]], n: int
) -> None:
    benchmark.group = f"key_expansions(all S_{n} stand-ins)"
    polys = schubert_stand_ins[n]

    def expand_all() -> list[dict[tuple[int, ...], int]]:
        return [ref.key_expansion(p.to_dict()) for p in polys]

    out = benchmark.pedantic(expand_all, setup=clear_reference_cache, rounds=3 if n < 8 else 1)
    record_rate(benchmark, len(polys), "polys", "reference")
    assert out[::97] == druse.key_expansions(polys[::97])


GROUP_PRODUCTS = "key_expansions(200 products key(a) key(b), 7 variables)"


@pytest.mark.benchmark(group=GROUP_PRODUCTS)
def test_products_druse(benchmark: Any, record_rate: Any, key_products: list[druse.Poly]) -> None:
    benchmark.pedantic(druse.key_expansions, args=(key_products,), rounds=5)
    record_rate(benchmark, len(key_products), "polys", "druse")


@pytest.mark.benchmark(group=GROUP_PRODUCTS)
def test_products_reference(
    benchmark: Any, record_rate: Any, key_products: list[druse.Poly]
) -> None:
    def expand_all() -> list[dict[tuple[int, ...], int]]:
        return [ref.key_expansion(p.to_dict()) for p in key_products]

    out = benchmark.pedantic(expand_all, setup=clear_reference_cache, rounds=2)
    record_rate(benchmark, len(key_products), "polys", "reference")
    assert out == druse.key_expansions(key_products)
