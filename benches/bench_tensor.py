"""Tensor products of crystals.

Target from the issue: B(2,1) (x) B(2,1) (x) B(2,1) for GL_6 (70^3 = 343000 vertices) built and
decomposed in <= 1 s. The group "pair (3,2,1) n=5" sets druse against the tensor-product rule
written as plain Python loops over the factors' tables, both on factors whose tables are
already built ((vertex, i) pairs of the product per second).
"""

from __future__ import annotations

from typing import Any

import pytest

import druse

SHAPE, N = (2, 1), 6


def fresh_factors(k: int) -> Any:
    """A setup for benchmark.pedantic: new factor crystals, so no operator table is cached."""
    return lambda: (tuple(druse.crystal(SHAPE, N) for _ in range(k)), {})


@pytest.mark.benchmark(group="triple (2,1) n=6")
def test_triple_product_decomposed(benchmark: Any, record_rate: Any) -> None:
    def build(*factors: druse.Crystal) -> dict[tuple[int, ...], int]:
        return druse.tensor_product(*factors).decomposition()

    d = benchmark.pedantic(build, setup=fresh_factors(3), rounds=5)
    # the dimensions add up: 70^3 (Weyl dimension of B(2,1) for GL_6 is 70, hook-content)
    assert sum(m * druse.count_tableaux(lam, N) for lam, m in d.items()) == 70**3
    record_rate(benchmark, 70**3, "vertices", "druse")


PAIR = ((3, 2, 1), 5)  # 280 vertices (hook-content), 78400 in the product


def warm() -> druse.TableauCrystal:
    b = druse.crystal(*PAIR)
    b.operator_tables()
    return b


@pytest.mark.benchmark(group="pair (3,2,1) n=5")
def test_pair_druse(benchmark: Any, record_rate: Any) -> None:
    b = warm()
    benchmark.pedantic(druse.tensor_product, args=(b, b), rounds=10)
    record_rate(benchmark, 280**2 * (PAIR[1] - 1), "pairs", "druse")


def python_tensor(b: druse.Crystal) -> list[list[int]]:
    """f_i of b (x) b in plain Python: f(x) (x) y if phi(y) <= eps(x), else x (x) f(y)."""
    size = len(b)
    out = []
    for i in range(1, b.n):
        f, phi, eps = b.f(i).tolist(), b.phi(i).tolist(), b.epsilon(i).tolist()
        row = []
        for x in range(size):
            for y in range(size):
                if phi[y] <= eps[x]:
                    row.append(-1 if f[x] < 0 else f[x] * size + y)
                else:
                    row.append(-1 if f[y] < 0 else x * size + f[y])
        out.append(row)
    return out


@pytest.mark.benchmark(group="pair (3,2,1) n=5")
def test_pair_python(benchmark: Any, record_rate: Any) -> None:
    b = warm()
    rows = benchmark.pedantic(python_tensor, args=(b,), rounds=3)
    t = druse.tensor_product(b, b)
    assert all(rows[i - 1] == t.f(i).tolist() for i in range(1, b.n))
    record_rate(benchmark, 280**2 * (PAIR[1] - 1), "pairs", "reference")
