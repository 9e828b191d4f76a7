"""Semistandard Young tableaux and their crystal, straight from the definitions.

A tableau is a tuple of rows, each a tuple of entries in 1..n; rows weakly increase left to
right and columns strictly increase top to bottom (English notation).

The crystal operators use the signature rule on the row reading word (rows read bottom to top,
each left to right): every letter i+1 is paired with the nearest unpaired letter i to its right;
f_i changes the rightmost unpaired i into i+1, e_i the leftmost unpaired i+1 into i
(Kashiwara and Nakashima, "Crystal graphs for representations of the q-analogue of classical
Lie algebras", 1994; the pairing goes back to Lascoux and Schutzenberger, "Le monoide plaxique",
1981).
"""

from __future__ import annotations

from collections.abc import Iterator, Sequence
from fractions import Fraction
from itertools import pairwise
from math import factorial, prod

Tableau = tuple[tuple[int, ...], ...]
Shape = tuple[int, ...]


# --- partitions ---------------------------------------------------------------------------------


def partitions(k: int, largest: int | None = None) -> Iterator[Shape]:
    """All partitions of k with parts <= largest, in decreasing lexicographic order."""
    if largest is None:
        largest = k
    if k == 0:
        yield ()
        return
    for first in range(min(k, largest), 0, -1):
        for rest in partitions(k - first, first):
            yield (first, *rest)


def partitions_up_to(max_size: int) -> Iterator[Shape]:
    """All partitions of 0, 1, ..., max_size."""
    for k in range(max_size + 1):
        yield from partitions(k)


def conjugate(shape: Sequence[int]) -> Shape:
    """Column lengths of the diagram."""
    return tuple(sum(1 for p in shape if p > c) for c in range(shape[0] if shape else 0))


def cells(shape: Sequence[int]) -> list[tuple[int, int]]:
    """Cells (row, column), 0-based, row by row."""
    return [(r, c) for r, length in enumerate(shape) for c in range(length)]


def hook_length(shape: Sequence[int], r: int, c: int) -> int:
    """Cells to the right of (r, c), below it, and the cell itself."""
    return (shape[r] - c - 1) + (conjugate(shape)[c] - r - 1) + 1


# --- counting formulas --------------------------------------------------------------------------


def hook_content_count(shape: Sequence[int], n: int) -> int:
    """Number of SSYT of shape with entries <= n: prod over cells (n + c - r) / hook.

    Hook-content formula, Stanley, Enumerative Combinatorics vol. 2, 1999, Cor. 7.21.4.
    """
    value = Fraction(1)
    for r, c in cells(shape):
        value *= Fraction(n + c - r, hook_length(shape, r, c))
    assert value.denominator == 1
    return max(int(value), 0)


def weyl_dimension(shape: Sequence[int], n: int) -> int:
    """Dimension of the irreducible GL_n-module of highest weight shape.

    prod_{i<j} (l_i - l_j + j - i) / (j - i), over 1 <= i < j <= n.

    Weyl dimension formula (Fulton and Harris, Representation Theory, 1991, (15.17)).
    Returns 0 when the shape has more than n rows (no such representation).
    """
    if len(shape) > n:
        return 0
    lam = list(shape) + [0] * (n - len(shape))
    value = Fraction(1)
    for i in range(n):
        for j in range(i + 1, n):
            value *= Fraction(lam[i] - lam[j] + j - i, j - i)
    assert value.denominator == 1
    return int(value)


def standard_count(shape: Sequence[int]) -> int:
    """Number of standard Young tableaux: |shape|! / prod of hook lengths.

    Hook length formula (Frame, Robinson and Thrall, "The hook graphs of the symmetric group",
    1954).
    """
    hooks = prod(hook_length(shape, r, c) for r, c in cells(shape))
    return factorial(sum(shape)) // hooks


# --- tableaux -----------------------------------------------------------------------------------


def is_semistandard(rows: Sequence[Sequence[int]], n: int) -> bool:
    """Rows weakly increase, columns strictly increase, entries in 1..n, row lengths a partition."""
    lengths = [len(row) for row in rows]
    if any(a < b for a, b in pairwise(lengths)):
        return False
    for r, row in enumerate(rows):
        for c, x in enumerate(row):
            if not 1 <= x <= n:
                return False
            if c > 0 and row[c - 1] > x:
                return False
            if r > 0 and rows[r - 1][c] >= x:
                return False
    return True


def ssyt(shape: Sequence[int], n: int) -> list[Tableau]:
    """All SSYT of shape with entries 1..n, by filling the cells one at a time, row by row.

    Each cell takes any value at least its left neighbour, above its upper neighbour, and at
    most n minus the number of cells below it in its column (so no partial filling dead-ends).
    """
    shape = tuple(p for p in shape if p > 0)
    if len(shape) > n:
        return []
    places = cells(shape)
    column = conjugate(shape)
    grid = [[0] * length for length in shape]
    found: list[Tableau] = []

    def fill(k: int) -> None:
        if k == len(places):
            found.append(tuple(tuple(row) for row in grid))
            return
        r, c = places[k]
        low = max(grid[r][c - 1] if c > 0 else 1, grid[r - 1][c] + 1 if r > 0 else 1)
        high = n - (column[c] - r - 1)
        for x in range(low, high + 1):
            grid[r][c] = x
            fill(k + 1)

    fill(0)
    return found


def weight(t: Tableau, n: int) -> tuple[int, ...]:
    """How many entries equal 1, 2, ..., n."""
    flat = [x for row in t for x in row]
    return tuple(flat.count(k) for k in range(1, n + 1))


def highest_weight_tableau(shape: Sequence[int]) -> Tableau:
    """Row r (1-based) filled with r."""
    return tuple((r + 1,) * length for r, length in enumerate(shape) if length > 0)


def lowest_weight_tableau(shape: Sequence[int], n: int) -> Tableau:
    """Each column of height h filled with n-h+1, ..., n from top to bottom."""
    column = conjugate(shape)
    return tuple(
        tuple(n - column[c] + r + 1 for c in range(length)) for r, length in enumerate(shape)
    )


def level_chain(t: Tableau, n: int) -> tuple[tuple[int, ...], ...]:
    """(lambda^(n-1), ..., lambda^(1)): lambda^(k)_r is the number of entries <= k in row r."""
    return tuple(tuple(sum(1 for x in row if x <= k) for row in t) for k in range(n - 1, 0, -1))


# --- the crystal --------------------------------------------------------------------------------


def reading_positions(t: Tableau) -> list[tuple[int, int]]:
    """Cells in reading order: rows bottom to top, each left to right."""
    return [(r, c) for r in range(len(t) - 1, -1, -1) for c in range(len(t[r]))]


def reading_word(t: Tableau) -> list[int]:
    return [t[r][c] for r, c in reading_positions(t)]


def unpaired(word: Sequence[int], i: int) -> tuple[list[int], list[int]]:
    """Positions of the unpaired i's and of the unpaired (i+1)'s in word, left to right.

    Scanning left to right, an i+1 waits for a partner; an i pairs with the latest waiting
    i+1, which is the same as pairing each i+1 with the nearest unpaired i to its right.
    """
    waiting: list[int] = []
    lone_i: list[int] = []
    for pos, x in enumerate(word):
        if x == i + 1:
            waiting.append(pos)
        elif x == i:
            if waiting:
                waiting.pop()
            else:
                lone_i.append(pos)
    return lone_i, waiting


def _replace(t: Tableau, cell: tuple[int, int], value: int) -> Tableau:
    rows = [list(row) for row in t]
    rows[cell[0]][cell[1]] = value
    return tuple(tuple(row) for row in rows)


def f(t: Tableau, i: int) -> Tableau | None:
    """Lowering operator f_i, or None if it does not apply."""
    lone_i, _ = unpaired(reading_word(t), i)
    if not lone_i:
        return None
    return _replace(t, reading_positions(t)[lone_i[-1]], i + 1)


def e(t: Tableau, i: int) -> Tableau | None:
    """Raising operator e_i, or None if it does not apply."""
    _, lone_next = unpaired(reading_word(t), i)
    if not lone_next:
        return None
    return _replace(t, reading_positions(t)[lone_next[0]], i)


def phi(t: Tableau, i: int) -> int:
    """Number of unpaired i's: how often f_i applies."""
    return len(unpaired(reading_word(t), i)[0])


def epsilon(t: Tableau, i: int) -> int:
    """Number of unpaired (i+1)'s: how often e_i applies."""
    return len(unpaired(reading_word(t), i)[1])


def crystal_table(
    shape: Sequence[int], n: int
) -> tuple[list[Tableau], dict[int, list[int]], dict[int, list[int]], dict[int, list[int]]]:
    """Tableaux (in enumeration order) and, for each i, f_i and e_i targets (-1: none) and phi_i.

    Targets are found through a dictionary from tableau to position; this is the plain way
    the benchmarks compare the Rust operator tables with.
    """
    tabs = ssyt(shape, n)
    where = {t: k for k, t in enumerate(tabs)}
    fs: dict[int, list[int]] = {}
    es: dict[int, list[int]] = {}
    phis: dict[int, list[int]] = {}
    for i in range(1, n):
        fs[i] = [-1 if (u := f(t, i)) is None else where[u] for t in tabs]
        es[i] = [-1 if (u := e(t, i)) is None else where[u] for t in tabs]
        phis[i] = [phi(t, i) for t in tabs]
    return tabs, fs, es, phis
