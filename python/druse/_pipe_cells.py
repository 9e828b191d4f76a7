"""Single pipe dreams as cross sets: validation, compatible sequences, and the text drawing.

Cells of the staircase of S_n are (row, col), 1-based, row + col <= n; the cross at (r, c)
stands for s_{r+c-1}, and the reading order is rows top to bottom, each right to left.
"""

from __future__ import annotations

from typing import Any

from druse._check import check_int, check_positive_int

Cross = tuple[int, int]
Crosses = tuple[Cross, ...]

#: Two characters per cell, so that the pipes of neighbouring cells join: (cross, elbow, outside).
#: An elbow holds two bent pipes, one joining the left and top edges, one the bottom and right.
GLYPHS = {
    "ascii": ("-+", "Jr", ". "),
    "unicode": ("─┼", "╯╭", "· "),
}


def check_n(n: Any) -> int:
    return check_positive_int(n, "n")


def check_crosses(crosses: Any, n: int, name: str = "crosses") -> Crosses:
    """Distinct (row, col) cells of the staircase row + col <= n, returned sorted."""
    if isinstance(crosses, (str, bytes)):
        raise TypeError(f"{name} must be a collection of (row, col) pairs; got {crosses!r}")
    try:
        items = list(crosses)
    except TypeError:
        raise TypeError(
            f"{name} must be a collection of (row, col) pairs; got {type(crosses).__name__}"
        ) from None
    cells: list[Cross] = []
    for k, item in enumerate(items):
        if isinstance(item, (str, bytes)) or not hasattr(item, "__len__") or len(item) != 2:
            raise TypeError(f"{name}[{k}] must be a (row, col) pair; got {item!r}")
        r, c = check_int(item[0], f"{name}[{k}] row"), check_int(item[1], f"{name}[{k}] col")
        if r < 1 or c < 1 or r + c > n:
            raise ValueError(
                f"{name}[{k}] = {(r, c)} must be a cell of the staircase of S_{n}: "
                f"row >= 1, col >= 1, row + col <= {n}"
            )
        cells.append((r, c))
    if len(set(cells)) != len(cells):
        repeated = sorted({x for x in cells if cells.count(x) > 1})
        raise ValueError(f"{name} must not repeat a cell; {repeated} appear more than once")
    return tuple(sorted(cells))


def reading_order(crosses: Crosses) -> list[Cross]:
    """Rows top to bottom, each right to left."""
    return sorted(crosses, key=lambda rc: (rc[0], -rc[1]))


def _product_is_reduced(word: tuple[int, ...], n: int) -> tuple[bool, tuple[int, ...]]:
    """Whether s_{a1} ... s_{ak} is reduced, and the product (right action swaps positions)."""
    w = list(range(1, n + 1))
    for a in word:
        if w[a - 1] > w[a]:
            return False, ()
        w[a - 1], w[a] = w[a], w[a - 1]
    return True, tuple(w)


def compatible_sequence(crosses: Any, n: int) -> tuple[tuple[int, ...], tuple[int, ...]]:
    """The compatible sequence (a, i) of a reduced pipe dream of S_n.

    Billey-Jockusch-Stanley, "Some combinatorial properties of Schubert polynomials", 1993:
    S_w is the sum of x_{i_1} ... x_{i_l} over the compatible sequences of w. Reading the
    crosses in the contract's order, a_j = r + c - 1 is the j-th letter (a reduced word of w)
    and i_j = r its row.

    Parameters
    ----------
    crosses : collection of (row, col)
        The crosses of a reduced pipe dream of some w in S_n.
    n : int

    Returns
    -------
    (word, rows) : tuple of two int tuples

    Raises
    ------
    ValueError
        If a cross lies outside the staircase, repeats, or the word read is not reduced.

    Examples
    --------
    >>> compatible_sequence([(1, 2), (2, 1), (2, 2)], 4)  # a pipe dream of 1432
    ((2, 3, 2), (1, 2, 2))
    """
    n = check_n(n)
    order = reading_order(check_crosses(crosses, n))
    word = tuple(r + c - 1 for r, c in order)
    if not _product_is_reduced(word, n)[0]:
        raise ValueError(
            f"crosses must form a reduced pipe dream; their word {word} is not reduced"
        )
    return word, tuple(r for r, _ in order)


def pipe_dream_from_compatible(word: Any, rows: Any, n: int) -> Crosses:
    """The reduced pipe dream of a compatible sequence (a, i): crosses (i_j, a_j - i_j + 1).

    The inverse of `compatible_sequence`. Derived from the contract's reading order (rows top to
    bottom, each right to left): (a, i) comes from a pipe dream exactly when
    (1) a is a reduced word (of the w it multiplies to), (2) i is weakly increasing,
    (3) 1 <= i_j <= a_j (the cell's column a_j - i_j + 1 is at least 1), and
    (4) a_j < a_{j+1} implies i_j < i_{j+1} (within a row letters strictly decrease, read right to
    left; with (1), a_j = a_{j+1} cannot occur). These are the conditions of Billey-Jockusch-
    Stanley, "Some combinatorial properties of Schubert polynomials", 1993.

    Raises
    ------
    ValueError
        Naming the first condition that fails, and where.

    Examples
    --------
    >>> pipe_dream_from_compatible((2, 3, 2), (1, 2, 2), 4)
    ((1, 2), (2, 1), (2, 2))
    """
    n = check_n(n)
    a = _letters(word, "word", 1, n - 1)
    i = _letters(rows, "rows", 1, n - 1)
    if len(a) != len(i):
        raise ValueError(f"word and rows must have the same length; got {len(a)} and {len(i)}")
    if not _product_is_reduced(a, n)[0]:
        raise ValueError(f"word must be a reduced word; {a} is not reduced")
    for j in range(len(a)):
        if i[j] > a[j]:
            raise ValueError(f"rows[{j}] = {i[j]} must be at most word[{j}] = {a[j]}")
        if j + 1 < len(a) and i[j] > i[j + 1]:
            raise ValueError(f"rows must be weakly increasing; rows[{j}] > rows[{j + 1}]")
        if j + 1 < len(a) and a[j] < a[j + 1] and i[j] == i[j + 1]:
            raise ValueError(
                f"rows[{j}] < rows[{j + 1}] is needed, because word[{j}] < word[{j + 1}]"
            )
    return tuple(sorted((r, x - r + 1) for x, r in zip(a, i, strict=True)))


def _letters(x: Any, name: str, lo: int, hi: int) -> tuple[int, ...]:
    if isinstance(x, (str, bytes)) or not hasattr(x, "__iter__"):
        raise TypeError(f"{name} must be a sequence of integers; got {type(x).__name__} {x!r}")
    out = tuple(check_int(v, f"{name}[{k}]") for k, v in enumerate(x))
    for k, v in enumerate(out):
        if not lo <= v <= hi:
            raise ValueError(f"{name}[{k}] must be in {lo}..{hi}; got {v}")
    return out


def draw_pipe_dream(crosses: Any, n: int, style: str = "ascii") -> str:
    """A text drawing of a pipe dream on the n x n grid, with row and column labels.

    Each cell is two characters wide so that pipes of neighbouring cells join. ASCII style:
    ``-+`` a cross, ``Jr`` an elbow (two bent pipes: ``J`` joins the left and top edges, ``r``
    the bottom and right edges), ``.`` a cell outside the staircase (row + col > n). Unicode
    style: ``─┼``, ``╯╭`` and ``·``.

    Examples
    --------
    >>> print(draw_pipe_dream([(1, 2)], 3))
        1 2 3
     1  Jr-+.
     2  Jr. .
     3  . . .
    """
    n = check_n(n)
    if n > 99:
        raise ValueError(f"n must be at most 99 for a drawing; got {n}")
    if style not in GLYPHS:
        raise ValueError(f"style must be one of {sorted(GLYPHS)}; got {style!r}")
    cross, elbow, outside = GLYPHS[style]
    on = set(check_crosses(crosses, n))
    lines = ["    " + "".join(f"{c:<2d}" for c in range(1, n + 1)).rstrip()]
    for r in range(1, n + 1):
        cells = [
            outside if r + c > n else cross if (r, c) in on else elbow for c in range(1, n + 1)
        ]
        lines.append(f"{r:>2d}  " + "".join(cells).rstrip())
    return "\n".join(lines)
