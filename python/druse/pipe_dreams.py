"""Reduced pipe dreams (RC-graphs) of a permutation: count, enumeration, weights, reduced words,
compatible sequences, and a text drawing.

Conventions (the contract): a pipe dream of w in S_n has crosses at (row, col), 1-based,
row + col <= n; a cross at (r, c) stands for s_{r+c-1}; reading rows top to bottom, each right to
left, gives a reduced word of w; x_r's exponent is the number of crosses in row r. Summing
x^weight over the pipe dreams of w gives the Schubert polynomial S_w (Bergeron-Billey, "RC-graphs
and Schubert polynomials", 1993; Fomin-Kirillov, "The Yang-Baxter equation, symmetric functions,
and Schubert polynomials", 1996).

Masks: the L = n(n-1)/2 cells, numbered j = 0..L-1 in reading order, give the integer
sum of 2^(L-1-j) over the crosses; it is stored as W = ceil(L/64) uint64 words, most significant
first. The pipe dreams of w come in ascending mask order.

The enumeration expands Fomin-Stanley's product A_1(x_1) ... A_{n-1}(x_{n-1}) in the
nilCoxeter algebra ("Schubert polynomials and the nilCoxeter algebra", 1994) row by row, over the
graph of partial products, in which every state finishes (see rust/schubert/pipes.rs).
"""

from __future__ import annotations

from collections.abc import Iterator, Sequence
from typing import Any

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import check_budget, check_nonnegative_int, check_positive_int
from druse._pipe_cells import (
    Crosses,
    compatible_sequence,
    draw_pipe_dream,
    pipe_dream_from_compatible,
)
from druse.demazure import check_perm

__all__ = [
    "PipeDreams",
    "compatible_sequence",
    "count_pipe_dreams",
    "draw_pipe_dream",
    "iter_pipe_dreams",
    "pipe_dream_from_compatible",
    "pipe_dream_of_mask",
    "pipe_dreams",
]

Perm = tuple[int, ...]
Masks = npt.NDArray[np.uint64]
Bytes = npt.NDArray[np.uint8]
Readings = tuple[npt.NDArray[np.int32], Bytes, Bytes]

#: The Rust kernel keeps one row of the staircase in a 64-bit field.
MAX_N = 64


def _perm(perm: Any) -> Perm:
    """check_perm, with repeated and missing letters named."""
    w = check_perm(perm) if _is_perm_like(perm) else None
    if w is None:
        values = [int(v) for v in perm]
        n = len(values)
        repeated = sorted({v for v in values if values.count(v) > 1})
        missing = [v for v in range(1, n + 1) if v not in values]
        if sorted(values) == list(range(n)):
            check_perm(values)  # raises the 0-based message
        problems = [f"{v} repeated" for v in repeated] + [f"{v} missing" for v in missing]
        raise ValueError(
            f"perm must be a permutation of 1..{n} in one-line notation; got {tuple(values)} "
            f"({', '.join(problems)})"
        )
    if len(w) > MAX_N:
        raise ValueError(f"perm must have at most {MAX_N} entries for pipe dreams; got {len(w)}")
    return w


def _is_perm_like(perm: Any) -> bool:
    """True unless perm is a sequence of integers that is not a permutation (checked later)."""
    try:
        check_perm(perm)
    except TypeError:
        return True  # let check_perm raise the TypeError
    except ValueError:
        return False
    return True


def _length(w: Perm) -> int:
    return sum(1 for a in range(len(w)) for b in range(a + 1, len(w)) if w[a] > w[b])


def count_pipe_dreams(perm: Sequence[int]) -> int:
    """The number of reduced pipe dreams of w, S_w(1, ..., 1), exactly, without listing them.

    Examples
    --------
    >>> count_pipe_dreams((1, 4, 3, 2))  # Catalan number C_3 (Woo 2004; OEIS A000108)
    5
    """
    return int(_core.pipe_dream_count(list(_perm(perm))))


def _crosses_of(words: list[int], cells: list[tuple[int, int]]) -> Crosses:
    value = 0
    for word in words:
        value = (value << 64) | int(word)
    size = len(cells)
    return tuple(sorted(cells[j] for j in range(size) if value >> (size - 1 - j) & 1))


def pipe_dream_of_mask(mask: Any, n: int) -> Crosses:
    """The crosses of one mask row (W uint64 words, most significant first), as from
    `iter_pipe_dreams` or `PipeDreams.masks`, for a permutation of S_n.

    Examples
    --------
    >>> pipe_dream_of_mask([0b010], 3)  # cells in reading order: (1, 2), (1, 1), (2, 1)
    ((1, 1),)
    """
    n = check_positive_int(n, "n")
    words = [int(x) for x in mask]
    cells = [(r, c) for r in range(1, n) for c in range(n - r, 0, -1)]
    expected = -(-len(cells) // 64)
    if len(words) != expected or any(not 0 <= x < 2**64 for x in words):
        raise ValueError(f"mask must be {expected} words in 0..2^64-1 for n = {n}; got {words}")
    if words and words[0] >> (len(cells) - 64 * (expected - 1)):
        raise ValueError(f"mask has bits past the {len(cells)} cells of n = {n}")
    return _crosses_of(words, cells)


def _readonly(a: npt.NDArray[Any]) -> npt.NDArray[Any]:
    a.flags.writeable = False
    return a


class PipeDreams:
    """The reduced pipe dreams of a permutation, in ascending mask order.

    A sized iterable of sorted tuples of (row, col) crosses (the contract); `masks` holds them
    as an (N, W) uint64 array. Build with `pipe_dreams`.
    """

    def __init__(self, perm: Perm, masks: Masks) -> None:
        self._perm = perm
        self._masks = _readonly(masks)
        self._n = len(perm)
        self._length = _length(perm)
        self._cells = [(r, c) for r in range(1, self._n) for c in range(self._n - r, 0, -1)]
        self._read: Readings | None = None

    @property
    def perm(self) -> Perm:
        return self._perm

    @property
    def masks(self) -> Masks:
        """(N, W) uint64, W = ceil(n(n-1)/2 / 64), most significant word first, ascending."""
        return self._masks

    def __len__(self) -> int:
        return int(self._masks.shape[0])

    def __iter__(self) -> Iterator[Crosses]:
        return (self[k] for k in range(len(self)))

    def __getitem__(self, k: int) -> Crosses:
        """The crosses of the k-th pipe dream, sorted by (row, col)."""
        size = len(self)
        k = int(k)
        if not -size <= k < size:
            raise IndexError(f"pipe dream index must be in {-size}..{size - 1}; got {k}")
        return _crosses_of(self._masks[k].tolist(), self._cells)

    def __repr__(self) -> str:
        return f"<PipeDreams of {self._perm}: {len(self)} pipe dreams>"

    def _readings(self) -> Readings:
        if self._read is None:
            size, n, length = len(self), self._n, self._length
            check_budget(size * (4 * n + 2 * length), "the weights and words", "use masks")
            weights, words, rows = _core.pipe_dream_read(self._masks, n, length)
            self._read = (_readonly(weights), _readonly(words), _readonly(rows))
        return self._read

    def weights(self) -> npt.NDArray[np.int32]:
        """(N, n) int32: the number of crosses in each row; x^weight summed is S_w."""
        return self._readings()[0]

    def reduced_words(self) -> npt.NDArray[np.uint8]:
        """(N, l(w)) uint8: the reduced word of each, rows top to bottom, each right to left."""
        return self._readings()[1]

    def compatible_sequences(self) -> tuple[Bytes, Bytes]:
        """(words, rows), each (N, l(w)) uint8: the compatible sequence (a, i) of each pipe dream
        (Billey-Jockusch-Stanley 1993); see `compatible_sequence`."""
        _, words, rows = self._readings()
        return words, rows

    def draw(self, k: int, style: str = "ascii") -> str:
        """A text drawing of the k-th pipe dream; see `draw_pipe_dream`."""
        return draw_pipe_dream(self[k], max(self._n, 1), style)


def pipe_dreams(perm: Sequence[int]) -> PipeDreams:
    """All reduced pipe dreams of w, in ascending mask order.

    Parameters
    ----------
    perm : sequence of int
        w in one-line notation, a permutation of 1..n (n <= 64).

    Returns
    -------
    PipeDreams
        A sized iterable of sorted tuples of (row, col) crosses, with `masks`, `weights()`,
        `reduced_words()`, `compatible_sequences()` and `draw(k)`.

    Raises
    ------
    ValueError
        If perm is not a permutation of 1..n (repeated or missing entries, or 0-based).
    TooLargeError
        If the masks would exceed the memory budget; the count is estimated first.

    Examples
    --------
    >>> list(pipe_dreams((1, 3, 2)))
    [((2, 1),), ((1, 2),)]
    """
    w = _perm(perm)
    model = _core.PipeDreamModel(list(w))
    total = int(model.count())
    check_budget(
        total * max(model.words(), 1) * 8,
        f"the {total} pipe dreams of {w}",
        "count them with count_pipe_dreams(perm), or stream them with iter_pipe_dreams(perm)",
    )
    return PipeDreams(w, model.enumerate())


def iter_pipe_dreams(perm: Sequence[int], chunk: int = 1 << 20, start: int = 0) -> Iterator[Masks]:
    """The masks of the pipe dreams of w in ascending order, as (at most chunk, W) uint64 arrays,
    beginning with the pipe dream of index ``start``.

    Streams in constant memory: each chunk is found by counting, not by listing what precedes it,
    so a late ``start`` costs no more than an early one.
    """
    w = _perm(perm)
    chunk = check_positive_int(chunk, "chunk")
    first = check_nonnegative_int(start, "start")
    check_budget(chunk * 8 * max(1, -(-len(w) * (len(w) - 1) // 128)), "a chunk", "lower chunk")
    model = _core.PipeDreamModel(list(w))
    total = int(model.count())
    for position in range(first, total, chunk):
        yield model.range(position, min(chunk, total - position))
