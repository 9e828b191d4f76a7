"""Littlewood-Richardson multiplicities c^lambda_{mu nu}: s_mu s_nu = sum c^lambda_{mu nu} s_lambda.

:func:`lr` counts in Rust: the tableaux T of shape nu (the partition with fewer cells; the
coefficients are symmetric) whose reversed row reading word keeps mu + (letters read so far) a
partition, i.e. T (x) u_mu is a highest weight vertex of B(nu) (x) B(mu), lambda = mu + wt(T)
(the Littlewood-Richardson rule through crystals: Bump-Schilling, "Crystal Bases:
Representations and Combinatorics", 2017; equivalently the Yamanouchi-word form of Fulton,
"Young Tableaux", 1997, ch. 5). :func:`lr_by_crystal` builds B(mu) (x) B(nu) and reads off its
highest weights, an independent route used to test the first.
"""

from __future__ import annotations

from collections.abc import Callable, Iterator, Sequence
from dataclasses import dataclass

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import check_budget, check_nonnegative_int, check_partition
from druse.crystal import crystal
from druse.tensor import tensor_product

Partition = tuple[int, ...]

#: Pairs (mu, nu) per kernel call in :func:`lr_table`: one progress report per chunk.
_CHUNK = 64


def lr(mu: Sequence[int], nu: Sequence[int]) -> dict[Partition, int]:
    """Littlewood-Richardson multiplicities: s_mu s_nu = sum_lambda c^lambda_{mu nu} s_lambda.

    Parameters
    ----------
    mu, nu : sequence of int
        Partitions (weakly decreasing, non-negative; trailing zeros ignored).

    Returns
    -------
    dict
        lambda (without trailing zeros) -> c^lambda_{mu nu} > 0, in decreasing lexicographic
        order of lambda; exact Python ints.

    Raises
    ------
    TypeError, ValueError
        If mu or nu is not a partition (or together they have more than 254 rows).

    Examples
    --------
    >>> import druse
    >>> druse.lr((2, 1), (2, 1))[(3, 2, 1)]
    2
    >>> druse.lr((1,), (1,))
    {(2,): 1, (1, 1): 1}
    """
    mu = check_partition(mu, "mu")
    nu = check_partition(nu, "nu")
    return _as_dict(_core.lr_terms(list(mu), list(nu)))


def lr_by_crystal(mu: Sequence[int], nu: Sequence[int]) -> dict[Partition, int]:
    """The same multiplicities as :func:`lr`, from the highest weight vertices of
    B(mu) (x) B(nu) for GL_n, n = l(mu) + l(nu) (enough rows for every lambda).

    Builds the whole tensor product, so it is meant for checks on small cases.

    Examples
    --------
    >>> import druse
    >>> druse.lr_by_crystal((2, 1), (1,)) == druse.lr((2, 1), (1,))
    True
    """
    mu = check_partition(mu, "mu")
    nu = check_partition(nu, "nu")
    n = max(len(mu) + len(nu), 1)
    return tensor_product(crystal(mu, n), crystal(nu, n)).decomposition()


@dataclass(frozen=True)
class LRTable:
    """Every c^lambda_{mu nu} for mu, nu partitions of one size.

    Attributes
    ----------
    partitions : tuple of partitions
        The partitions of ``size`` in decreasing lexicographic order; ``mu = partitions[a]``.
    products : tuple of partitions
        The partitions of ``2 * size`` in decreasing lexicographic order; ``lambda = products[c]``.
    coefficients : numpy array of shape (P, P, Q)
        ``coefficients[a, b, c] = c^{products[c]}_{partitions[a], partitions[b]}``; int64, or
        object (Python ints) if a value would not fit.
    """

    size: int
    partitions: tuple[Partition, ...]
    products: tuple[Partition, ...]
    coefficients: npt.NDArray[np.generic]

    def get(self, mu: Sequence[int], nu: Sequence[int]) -> dict[Partition, int]:
        """The nonzero c^lambda_{mu nu} of one pair, as :func:`lr` gives them."""
        a = self._position(mu, "mu")
        b = self._position(nu, "nu")
        row = self.coefficients[a, b]
        return {self.products[c]: int(row[c]) for c in np.flatnonzero(row)}

    def _position(self, shape: Sequence[int], name: str) -> int:
        p = check_partition(shape, name)
        try:
            return self.partitions.index(p)
        except ValueError:
            raise ValueError(f"{name} must be a partition of {self.size}; got {p}") from None


def lr_table(size: int, progress: Callable[[int, int], object] | None = None) -> LRTable:
    """c^lambda_{mu nu} for every pair mu, nu of partitions of ``size``, as an :class:`LRTable`.

    Parameters
    ----------
    size : int
        Non-negative.
    progress : callable, optional
        Called as ``progress(done, total)`` (pairs) after each chunk of pairs.

    Examples
    --------
    >>> import druse
    >>> t = druse.lr_table(2)
    >>> t.partitions, t.coefficients.shape
    (((2,), (1, 1)), (2, 2, 5))
    >>> t.get((1, 1), (2,))
    {(3, 1): 1, (2, 1, 1): 1}
    """
    size = check_nonnegative_int(size, "size")
    parts = tuple(partitions(size))
    products = tuple(partitions(2 * size))
    p, q = len(parts), len(products)
    check_budget(p * p * q * 8, f"the table of {p * p} products", "call druse.lr pair by pair")
    pairs = [(list(a), list(b)) for a in parts for b in parts]
    column = {lam: c for c, lam in enumerate(products)}
    values: list[list[int]] = []
    for start in range(0, len(pairs), _CHUNK):
        for terms in _core.lr_batch(pairs[start : start + _CHUNK]):
            row = [0] * q
            for lam, count in terms:
                row[column[tuple(lam)]] = count
            values.append(row)
        if progress is not None:
            progress(min(start + _CHUNK, len(pairs)), len(pairs))
    fits = all(v < 2**63 for row in values for v in row)
    table = np.array(values, dtype=np.int64 if fits else object).reshape(p, p, q)
    table.flags.writeable = False
    return LRTable(size, parts, products, table)


def partitions(size: int, largest: int | None = None) -> Iterator[Partition]:
    """The partitions of ``size`` with parts at most ``largest``, decreasing lexicographically."""
    if size == 0:
        yield ()
        return
    top = size if largest is None else min(size, largest)
    for first in range(top, 0, -1):
        for rest in partitions(size - first, first):
            yield (first, *rest)


def _as_dict(terms: list[tuple[list[int], int]]) -> dict[Partition, int]:
    return {tuple(lam): int(count) for lam, count in terms}
