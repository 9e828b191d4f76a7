"""Right and left keys of a tableau by jeu de taquin: reverse slides in a box, nothing clever.

Lascoux-Schutzenberger, "Keys and standard bases", 1990: column j of the right key is the last
column of the anti-rectification of columns j..m; column j of the left key is the first column
of the anti-rectification of columns 1..j.
"""

from __future__ import annotations

Rows = list[list[int]]


def _antirectify(rows: Rows) -> dict[tuple[int, int], int]:
    """Anti-rectification of a straight tableau by reverse slides inside its bounding box.

    A reverse slide into an outer co-corner moves the hole up or left: the larger of the entries
    above and to the left comes in, the one above on a tie (Fulton, "Young Tableaux", 1997, Ch. 1).
    """
    height, width = len(rows), len(rows[0])
    filled = {(r, c): x for r, row in enumerate(rows) for c, x in enumerate(row)}
    outer = [len(row) for row in rows]  # the outer shape nu, row by row
    while any(length < width for length in outer):
        r = next(
            r for r in range(height) if outer[r] < width and (r == 0 or outer[r - 1] > outer[r])
        )
        hole = (r, outer[r])
        outer[r] += 1
        while True:
            up, left = (hole[0] - 1, hole[1]), (hole[0], hole[1] - 1)
            a, b = filled.get(up), filled.get(left)
            if a is None and b is None:
                break
            source = up if b is None or (a is not None and a >= b) else left
            filled[hole] = filled.pop(source)
            hole = source
    return filled


def slide_key(rows: Rows, side: str) -> Rows:
    """K_+(T) (side "right") or K_-(T) (side "left") as rows, by anti-rectification."""
    width = len(rows[0]) if rows else 0
    key: Rows = [[0] * len(row) for row in rows]
    for j in range(width):
        height = sum(1 for row in rows if len(row) > j)
        if side == "right":  # the last column of antirect(columns j..m)
            box = _antirectify([row[j:] for row in rows if len(row) > j])
            column = sorted(x for (_r, c), x in box.items() if c == width - j - 1)
        else:  # the first column of antirect(columns 1..j)
            box = _antirectify([row[: j + 1] for row in rows])
            column = sorted(x for (_r, c), x in box.items() if c == 0)
        assert len(column) == height  # an anti-normal shape of the right size
        for r in range(height):
            key[r][j] = column[r]
    return key


def slide_keys(rows: Rows) -> tuple[Rows, Rows]:
    """(K_+(T), K_-(T))."""
    return slide_key(rows, "right"), slide_key(rows, "left")
