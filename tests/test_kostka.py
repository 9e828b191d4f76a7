"""Tests of druse.kostka: Macdonald's tables, a brute-force count, the hook length formula."""

from __future__ import annotations

import itertools
from collections import Counter
from functools import cache
from math import factorial, prod

import pytest
from hypothesis import given
from hypothesis import strategies as st

from druse import kostka
from reference.tableaux import partitions
from strategies import partitions as partition_strategy

Shape = tuple[int, ...]


@cache
def contents(shape: Shape, n: int) -> Counter[tuple[int, ...]]:
    """Brute force: every SSYT of shape with entries <= n, filled cell by cell (rows weakly
    increase, columns strictly increase), tallied by content."""
    cells = [(r, c) for r, length in enumerate(shape) for c in range(length)]
    filling: dict[tuple[int, int], int] = {}
    tally: Counter[tuple[int, ...]] = Counter()

    def place(i: int) -> None:
        if i == len(cells):
            values = list(filling.values())
            tally[tuple(values.count(v) for v in range(1, n + 1))] += 1
            return
        r, c = cells[i]
        low = max(filling.get((r, c - 1), 1), filling.get((r - 1, c), 0) + 1)
        for v in range(low, n + 1):
            filling[(r, c)] = v
            place(i + 1)
        filling.pop((r, c), None)

    place(0)
    return tally


def brute_kostka(shape: Shape, weight: tuple[int, ...]) -> int:
    return contents(shape, len(weight))[weight]


def dominates(lam: Shape, mu: Shape) -> bool:
    return all(sum(lam[: i + 1]) >= sum(mu[: i + 1]) for i in range(len(mu)))


def standard_count(shape: Shape) -> int:
    """Number of SYT by the hook length formula (Frame, Robinson and Thrall, 1954)."""
    conj = [sum(1 for p in shape if p > c) for c in range(shape[0])] if shape else []
    hooks = prod(
        (length - c) + (conj[c] - r) - 1 for r, length in enumerate(shape) for c in range(length)
    )
    return factorial(sum(shape)) // hooks


# Kostka matrices K[lambda][mu], lambda and mu both in decreasing lexicographic order, from
# Macdonald, Symmetric Functions and Hall Polynomials, 2nd ed., 1995, Ch. I sec. 6 (from memory;
# each entry is re-checked by the brute-force count below).
TABLES: dict[int, list[list[int]]] = {
    2: [
        [1, 1],
        [0, 1],
    ],
    3: [
        [1, 1, 1],
        [0, 1, 2],
        [0, 0, 1],
    ],
    4: [
        [1, 1, 1, 1, 1],
        [0, 1, 1, 2, 3],
        [0, 0, 1, 1, 2],
        [0, 0, 0, 1, 3],
        [0, 0, 0, 0, 1],
    ],
    5: [
        [1, 1, 1, 1, 1, 1, 1],
        [0, 1, 1, 2, 2, 3, 4],
        [0, 0, 1, 1, 2, 3, 5],
        [0, 0, 0, 1, 1, 3, 6],
        [0, 0, 0, 0, 1, 2, 5],
        [0, 0, 0, 0, 0, 1, 4],
        [0, 0, 0, 0, 0, 0, 1],
    ],
    6: [
        [1, 1, 1, 1, 1, 1, 1, 1, 1, 1, 1],
        [0, 1, 1, 2, 1, 2, 3, 2, 3, 4, 5],
        [0, 0, 1, 1, 1, 2, 3, 3, 4, 6, 9],
        [0, 0, 0, 1, 0, 1, 3, 1, 3, 6, 10],
        [0, 0, 0, 0, 1, 1, 1, 1, 2, 3, 5],
        [0, 0, 0, 0, 0, 1, 2, 2, 4, 8, 16],
        [0, 0, 0, 0, 0, 0, 1, 0, 1, 4, 10],
        [0, 0, 0, 0, 0, 0, 0, 1, 1, 2, 5],
        [0, 0, 0, 0, 0, 0, 0, 0, 1, 3, 9],
        [0, 0, 0, 0, 0, 0, 0, 0, 0, 1, 5],
        [0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1],
    ],
}

TABLE_ENTRIES = [
    (lam, mu, TABLES[n][i][j])
    for n in TABLES
    for i, lam in enumerate(partitions(n))
    for j, mu in enumerate(partitions(n))
]


def test_tables_have_the_right_size() -> None:
    for n, table in TABLES.items():
        count = len(list(partitions(n)))
        assert len(table) == count
        assert all(len(row) == count for row in table)


@pytest.mark.parametrize(("shape", "weight", "value"), TABLE_ENTRIES)
def test_published_tables(shape: Shape, weight: Shape, value: int) -> None:
    assert kostka(shape, weight) == value  # Macdonald, Ch. I sec. 6 tables (from memory)
    padded = weight + (0,) * (len(shape) - len(weight))
    assert brute_kostka(shape, padded) == value  # brute-force SSYT count


@pytest.mark.parametrize("n", range(7))
def test_matches_brute_force_on_all_weights(n: int) -> None:
    # Every weak composition of n into up to 4 parts, every shape of n (brute-force count).
    for shape in partitions(n):
        for weight in itertools.product(range(n + 1), repeat=4):
            if sum(weight) == n:
                assert kostka(shape, weight) == brute_kostka(shape, weight)


@pytest.mark.parametrize("n", range(9))
def test_diagonal_is_one_and_zero_unless_dominated(n: int) -> None:
    for lam in partitions(n):
        assert kostka(lam, lam) == 1  # Macdonald, Ch. I (6.5): unitriangular
        for mu in partitions(n):
            value = kostka(lam, mu)
            assert (value > 0) == dominates(lam, mu)  # Macdonald, Ch. I (6.5)


@pytest.mark.parametrize("n", range(1, 11))
def test_standard_weight_counts_standard_tableaux(n: int) -> None:
    for lam in partitions(n):
        assert kostka(lam, (1,) * n) == standard_count(lam)  # Frame-Robinson-Thrall 1954


@pytest.mark.parametrize(
    ("shape", "bits"),
    [
        ((10, 10, 10, 10, 10), 64),
        ((8, 7, 6, 5, 4, 3, 2, 1), 64),
        ((13, 12, 11, 10, 9, 8, 7), 128),
        ((9,) * 9, 128),
    ],
)
def test_big_values_stay_exact(shape: Shape, bits: int) -> None:
    value = kostka(shape, (1,) * sum(shape))
    assert value == standard_count(shape)  # hook length formula (Frame-Robinson-Thrall 1954)
    assert value > 2**bits


def test_one_row_and_one_column() -> None:
    assert kostka((7,), (2, 0, 3, 2)) == 1  # a single row holds any content in one way
    assert kostka((1, 1, 1), (1, 1, 1)) == 1
    assert kostka((1, 1, 1), (2, 1)) == 0  # a column needs distinct entries


@given(partition_strategy(max_size=9), st.data())
def test_symmetric_in_the_weight(shape: Shape, data: st.DataObject) -> None:
    # K_{lambda,w} depends only on the multiset of w (Bender and Knuth, 1972).
    parts = data.draw(st.lists(st.integers(0, 4), min_size=1, max_size=6), label="weight")
    if sum(parts) < sum(shape):
        parts.append(sum(shape) - sum(parts))
    weight = tuple(parts)
    shuffled = tuple(data.draw(st.permutations(weight), label="permuted"))
    assert kostka(shape, weight) == kostka(shape, shuffled)


def test_size_mismatch_gives_zero() -> None:
    assert kostka((2, 1), (1, 1)) == 0
    assert kostka((2, 1), (2, 2)) == 0
    assert kostka((), ()) == 1
    assert kostka((), (0, 0)) == 1
    assert kostka((0, 0), ()) == 1


@pytest.mark.parametrize(
    ("shape", "weight", "error", "match"),
    [
        ((1, 2), (1, 2), ValueError, "shape must be weakly decreasing"),
        ((2, 1), (2, -1, 2), ValueError, "weight must have non-negative parts"),
        ((2, 1), 3, TypeError, "weight must be a sequence"),
        (None, (1,), TypeError, "shape must be a sequence"),
        ((2, 1), (1.5, 1.5), TypeError, r"weight\[0\] must be an integer"),
        ((2, 1), (True, 2), TypeError, r"weight\[0\] must be an integer"),
    ],
)
def test_bad_input(shape: object, weight: object, error: type[Exception], match: str) -> None:
    with pytest.raises(error, match=match):
        kostka(shape, weight)  # type: ignore[arg-type]
