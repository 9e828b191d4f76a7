"""Counting and streaming semistandard Young tableaux."""

from __future__ import annotations

from collections.abc import Iterator, Sequence

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import check_nonnegative_int, check_partition, check_positive_int


def count_tableaux(shape: Sequence[int], n: int) -> int:
    """Number of semistandard Young tableaux of ``shape`` with entries in 1..n, exactly.

    Uses the hook-content formula prod (n + c(u)) / h(u) over the cells u, c(u) = column - row
    the content and h(u) the hook length (Stanley, Enumerative Combinatorics vol. 2, 1999,
    Cor. 7.21.4). No tableau is enumerated, so any size is cheap.

    Parameters
    ----------
    shape : sequence of int
        A partition; trailing zeros are ignored.
    n : int
        Number of letters (n >= 0). More rows than n gives 0.

    Examples
    --------
    >>> count_tableaux((2, 1), 3)
    8
    >>> count_tableaux((3, 3, 3), 2)
    0
    """
    lam = check_partition(shape, "shape")
    n = check_nonnegative_int(n, "n")
    if len(lam) > n:
        return 0
    conj = [sum(1 for p in lam if p > c) for c in range(lam[0])] if lam else []
    num, den = 1, 1
    for r, length in enumerate(lam):
        for c in range(length):
            num *= n + c - r
            den *= (length - c - 1) + (conj[c] - r - 1) + 1
    return num // den


def iter_tableaux(
    shape: Sequence[int], n: int, chunk_size: int = 1 << 16, start: int = 0
) -> Iterator[npt.NDArray[np.uint8]]:
    """Stream the tableaux of B(shape) in vertex order, in chunks, in constant memory.

    Each chunk is a uint8 array (k, |shape|) of cells row by row; chunks are consecutive, so the
    first row of a chunk has index ``start`` plus the rows already yielded. Use this where
    ``druse.crystal`` would not fit in memory.

    Examples
    --------
    >>> sum(len(block) for block in iter_tableaux((2, 1), 3, chunk_size=3))
    8
    """
    lam = check_partition(shape, "shape")
    n = check_positive_int(n, "n")
    size = check_positive_int(chunk_size, "chunk_size")
    model = _core.TableauModel(list(lam), n)
    total = model.count()
    position = check_nonnegative_int(start, "start")
    while position < total:
        block = model.chunk(position, size)
        block.flags.writeable = False
        position += len(block)
        yield block


def count_by_enumeration(shape: Sequence[int], n: int, threads: int = 1) -> int:
    """Walk every tableau of B(shape) in vertex order without storing any, and return how many.

    A check on :func:`count_tableaux` by a route independent of the hook-content formula, and the
    raw speed of the enumerator (``threads`` > 1 splits the index range across cores). It takes
    time proportional to the count: prefer :func:`count_tableaux` to learn the number.

    Examples
    --------
    >>> count_by_enumeration((3, 2), 4) == count_tableaux((3, 2), 4)
    True
    """
    lam = check_partition(shape, "shape")
    n = check_positive_int(n, "n")
    workers = check_positive_int(threads, "threads")
    count, _checksum = _core.TableauModel(list(lam), n).scan(workers)
    return int(count)
