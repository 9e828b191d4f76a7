"""Tensor products of crystals by the tensor-product signature rule.

Convention (Bump-Schilling, "Crystal Bases: Representations and Combinatorics", 2017), the one
that agrees with druse's signature rule on reading words: the word a_1...a_k is the vertex
b_{a_1} (x) ... (x) b_{a_k} of the tensor power of the standard crystal B(1), and

- f_i(x (x) y) = f_i(x) (x) y if phi_i(y) <= epsilon_i(x), else x (x) f_i(y);
- e_i(x (x) y) = e_i(x) (x) y if phi_i(y) < epsilon_i(x), else x (x) e_i(y);
- phi_i(x (x) y) = phi_i(x) + max(0, phi_i(y) - epsilon_i(x)),
  epsilon_i(x (x) y) = epsilon_i(y) + max(0, epsilon_i(x) - phi_i(y)), wt = wt(x) + wt(y).

Why: after cancelling pairs (an i+1 with the nearest unpaired i to its right) x reads
i^phi(x) (i+1)^epsilon(x); in x (x) y the middle block (i+1)^epsilon(x) i^phi(y) cancels
min(epsilon(x), phi(y)) pairs, so the rightmost unpaired i (which f_i changes) lies in y exactly
when phi(y) > epsilon(x), and the leftmost unpaired i+1 (which e_i changes) lies in x exactly
when epsilon(x) > phi(y). In this convention x (x) y is highest weight iff y is and
epsilon_i(x) <= phi_i(y) for every i.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import check_budget, check_index
from druse.crystal import Crystal, TableauCrystal

IntArray = npt.NDArray[np.int64]
SmallIntArray = npt.NDArray[np.int32]

#: Bytes per vertex of a product table for each i (f_i, e_i as int64; phi_i, epsilon_i as int32).
_BYTES_PER_OPERATOR = 24


class TensorCrystal(Crystal):
    """The tensor product B_1 (x) ... (x) B_k of crystals of one GL_n, folded left to right.

    The vertex (v_1, ..., v_k) is numbered lexicographically in the factors (v_1 most
    significant): for two factors, (x, y) is x * len(B_2) + y. The operators follow the
    tensor-product signature rule stated in :mod:`druse.tensor`.
    """

    def __init__(self, factors: Sequence[Crystal]) -> None:
        self._factor_crystals = tuple(factors)
        self._sizes = tuple(len(c) for c in self._factor_crystals)
        n = self._factor_crystals[0].n
        ops, weights = _tables(self._factor_crystals[0])
        for right in self._factor_crystals[1:]:
            ops, weights = _pair(ops, weights, right, n)
        super().__init__(n, int(weights.shape[0]))
        for i, (f, e, phi, eps) in enumerate(ops, start=1):
            self._f[i], self._e[i] = _frozen(f), _frozen(e)
            self._phi[i], self._eps[i] = _frozen(phi), _frozen(eps)
        self._weights = _frozen(weights)

    @property
    def factor_crystals(self) -> tuple[Crystal, ...]:
        """The factors B_1, ..., B_k."""
        return self._factor_crystals

    def factors(self, v: int) -> tuple[int, ...]:
        """The factor vertices (v_1, ..., v_k) of the vertex v."""
        v = check_index(v, 0, self._size - 1, "v")
        parts = []
        for size in reversed(self._sizes):
            v, r = divmod(v, size)
            parts.append(r)
        return tuple(reversed(parts))

    def vertex(self, factors: Sequence[int]) -> int:
        """The vertex of the factor vertices (v_1, ..., v_k): the inverse of :meth:`factors`."""
        if isinstance(factors, (str, bytes)) or not isinstance(factors, Sequence):
            raise TypeError(f"factors must be a sequence of vertices; got {type(factors).__name__}")
        if len(factors) != len(self._sizes):
            raise ValueError(f"factors must hold {len(self._sizes)} vertices; got {len(factors)}")
        v = 0
        for k, (x, size) in enumerate(zip(factors, self._sizes, strict=True)):
            v = v * size + check_index(x, 0, size - 1, f"factors[{k}]")
        return v

    def decomposition(self) -> dict[tuple[int, ...], int]:
        """The highest weights of the components, with multiplicities.

        Keys are the weights of the highest weight vertices without trailing zeros (partitions
        for crystals of polynomial representations, such as products of tableau crystals),
        in decreasing lexicographic order.

        Examples
        --------
        >>> import druse
        >>> B = druse.crystal((1,), 3)
        >>> druse.tensor_product(B, B).decomposition()
        {(2,): 1, (1, 1): 1}
        """
        return highest_weight_multiset(self)

    def __repr__(self) -> str:
        sizes = " (x) ".join(str(s) for s in self._sizes)
        return f"<tensor product of GL_{self._n} crystals ({sizes}): {self._size} vertices>"


def tensor_product(*crystals: Crystal) -> TensorCrystal:
    """The tensor product B_1 (x) ... (x) B_k, folded left to right: ((B_1 (x) B_2) (x) B_3)...

    Parameters
    ----------
    *crystals : Crystal
        One or more crystals of the same GL_n (any :class:`druse.Crystal` with operators and
        weights).

    Returns
    -------
    TensorCrystal
        Vertices numbered lexicographically in the factors; ``.factors(v)``, ``.vertex(...)``,
        ``.decomposition()``.

    Raises
    ------
    TypeError
        If an argument is not a Crystal.
    ValueError
        If no crystal is given or the crystals are of different GL_n.
    druse.TooLargeError
        If the table would not fit the memory budget (estimated before anything is built).

    Examples
    --------
    >>> import druse
    >>> T = druse.tensor_product(druse.crystal((2, 1), 3), druse.crystal((1,), 3))
    >>> len(T), T.decomposition()
    (24, {(3, 1): 1, (2, 2): 1, (2, 1, 1): 1})
    >>> T.factors(T.vertex((4, 2)))
    (4, 2)
    """
    if not crystals:
        raise ValueError("tensor_product needs at least one crystal")
    for k, c in enumerate(crystals):
        if not isinstance(c, Crystal):
            raise TypeError(f"crystals[{k}] must be a druse.Crystal; got {type(c).__name__}")
        if c.n != crystals[0].n:
            raise ValueError(
                f"all crystals must be of the same GL_n; crystals[0] has n = {crystals[0].n}, "
                f"crystals[{k}] has n = {c.n}"
            )
    total = 1
    for c in crystals:
        total *= len(c)
    n = crystals[0].n
    check_budget(
        total * (_BYTES_PER_OPERATOR * (n - 1) + 4 * n),
        f"the tensor product table of {total} vertices",
        "use druse.lr for Littlewood-Richardson multiplicities without building the product",
    )
    return TensorCrystal(crystals)


def highest_weight_multiset(c: Crystal) -> dict[tuple[int, ...], int]:
    """Weights of the highest weight vertices of ``c`` (trailing zeros dropped), counted."""
    hw = c.highest_weights()
    tally: dict[tuple[int, ...], int] = {}
    for row in c.weights()[hw].tolist():
        while row and row[-1] == 0:
            row.pop()
        key = tuple(int(x) for x in row)
        tally[key] = tally.get(key, 0) + 1
    return dict(sorted(tally.items(), reverse=True))


_Ops = list[tuple[IntArray, IntArray, SmallIntArray, SmallIntArray]]


def _tables(c: Crystal) -> tuple[_Ops, SmallIntArray]:
    """The arrays of one factor in the layout the kernel takes (contiguous, right dtypes)."""
    cached = all(i in c._f and i in c._e and i in c._phi for i in range(1, c.n))
    if isinstance(c, TableauCrystal) and not cached:
        c.operator_tables()  # one pass for every i, faster than f(i) one at a time
    ops = [
        (
            np.ascontiguousarray(c.f(i), dtype=np.int64),
            np.ascontiguousarray(c.e(i), dtype=np.int64),
            np.ascontiguousarray(c.phi(i), dtype=np.int32),
            np.ascontiguousarray(c.epsilon(i), dtype=np.int32),
        )
        for i in range(1, c.n)
    ]
    weights = np.ascontiguousarray(c.weights(), dtype=np.int32).reshape(len(c), c.n)
    return ops, weights


def _pair(ops: _Ops, weights: SmallIntArray, right: Crystal, n: int) -> tuple[_Ops, SmallIntArray]:
    """The table of (the product so far) (x) right."""
    right_ops, right_weights = _tables(right)
    left_args = _kernel_args(ops, weights)
    right_args = _kernel_args(right_ops, right_weights)
    new_ops, new_weights = _core.tensor_tables(n, left_args, right_args)
    return list(new_ops), new_weights


def _kernel_args(ops: _Ops, weights: SmallIntArray) -> Any:
    return (
        [t[0] for t in ops],
        [t[1] for t in ops],
        [t[2] for t in ops],
        [t[3] for t in ops],
        weights,
    )


def _frozen(a: npt.NDArray[Any]) -> npt.NDArray[Any]:
    a.flags.writeable = False
    return a
