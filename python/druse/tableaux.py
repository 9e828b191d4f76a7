"""Counting and streaming semistandard Young tableaux."""

from __future__ import annotations

from collections.abc import Iterator, Sequence

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import check_index, check_nonnegative_int, check_partition, check_positive_int

#: Entries are stored in one byte, so enumeration needs n <= 255 (counting does not).
MAX_LETTERS = 255
#: Row lengths of enumerated shapes are stored in 16 bits.
MAX_PART = 65534


def tableau_model(shape: tuple[int, ...], n: int) -> _core.TableauModel:
    """The Rust tables of SSYT(shape, n), for an already checked partition and n >= 1."""
    check_index(n, 1, MAX_LETTERS, "n (for enumeration; count_tableaux has no limit)")
    if shape and shape[0] > MAX_PART:
        raise ValueError(
            f"shape parts must be at most {MAX_PART} for enumeration; got {shape[0]} "
            "(count_tableaux has no limit)"
        )
    return _core.TableauModel(list(shape), n)


def count_tableaux(shape: Sequence[int], n: int) -> int:
    """Number of semistandard Young tableaux of ``shape`` with entries in 1..n, exactly.

    No tableau is enumerated. Of two exact product formulas, the one with fewer factors is used:
    the hook-content formula prod (n + c(u)) / h(u) over the |shape| cells u, c(u) the content and
    h(u) the hook length (Stanley, Enumerative Combinatorics vol. 2, 1999, Cor. 7.21.4), or Weyl's
    dimension formula prod_{i<j<=n} (l_i - l_j + j - i) / (j - i) (Weyl, 1926; Fulton-Harris,
    Representation Theory, 1991, Thm. 6.3), with n(n-1)/2 factors. Products are taken as balanced
    trees, so a shape of a million cells or n in the thousands stays fast.

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
    >>> count_tableaux((10**6,), 2)
    1000001
    """
    lam = check_partition(shape, "shape")
    n = check_nonnegative_int(n, "n")
    if len(lam) > n:
        return 0
    if n * (n - 1) // 2 < sum(lam):
        return _weyl_dimension(lam, n)
    return _hook_content(lam, n)


def _hook_content(lam: tuple[int, ...], n: int) -> int:
    conj = [sum(1 for p in lam if p > c) for c in range(lam[0])] if lam else []
    contents = (n + c - r for r, length in enumerate(lam) for c in range(length))
    hooks = (
        (length - c) + (conj[c] - r) - 1 for r, length in enumerate(lam) for c in range(length)
    )
    return _product(list(contents)) // _product(list(hooks))


def _weyl_dimension(lam: tuple[int, ...], n: int) -> int:
    parts = list(lam) + [0] * (n - len(lam))
    pairs = [(i, j) for i in range(n) for j in range(i + 1, n)]
    return _product([parts[i] - parts[j] + j - i for i, j in pairs]) // _product(
        [j - i for i, j in pairs]
    )


def _product(factors: list[int]) -> int:
    """Product as a balanced tree: big integers multiply fastest when sizes are even."""
    while len(factors) > 1:
        factors = [
            factors[k] * factors[k + 1] if k + 1 < len(factors) else factors[k]
            for k in range(0, len(factors), 2)
        ]
    return factors[0] if factors else 1


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
    model = tableau_model(lam, n)
    total = model.count()
    position = check_nonnegative_int(start, "start")
    while position < total:
        block = model.chunk(position, min(size, total - position))
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
    count, _checksum = tableau_model(lam, n).scan(workers)
    return int(count)
