"""Crystals of type A_{n-1}: one table type for every model, and the crystal B(lambda) on tableaux.

A crystal here is vertices ``0..N-1`` with a weight in Z^n each and, for each i in 1..n-1, the
lowering operator f_i and raising operator e_i as int64 arrays (target index, or -1 where the
operator is undefined). Everything general (string lengths, highest weights, components,
characters) is written once against that table; a model such as tableaux only fills it in.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import (
    check_budget,
    check_index,
    check_int,
    check_nonnegative_int,
    check_partition,
    check_positive_int,
)
from druse.poly import Poly
from druse.tableaux import count_tableaux, tableau_model

IntArray = npt.NDArray[np.int64]
SmallIntArray = npt.NDArray[np.int32]
BoolArray = npt.NDArray[np.bool_]

#: Bytes per vertex and operator index for f_i and e_i (two int64 arrays).
_OPERATOR_BYTES = 16


def _frozen(a: npt.NDArray[Any]) -> npt.NDArray[Any]:
    a.flags.writeable = False
    return a


class Crystal:
    """A finite crystal of type A_{n-1} given by its table.

    Subclasses fill the table lazily by overriding ``_compute_operators`` and ``_compute_weights``;
    everything else is shared.
    """

    def __init__(
        self,
        n: int,
        size: int,
        lowering: Sequence[npt.ArrayLike] | None = None,
        raising: Sequence[npt.ArrayLike] | None = None,
        weights: npt.ArrayLike | None = None,
    ) -> None:
        self._n = check_positive_int(n, "n")
        self._size = check_nonnegative_int(size, "size")
        self._f: dict[int, IntArray] = {}
        self._e: dict[int, IntArray] = {}
        self._phi: dict[int, SmallIntArray] = {}
        self._eps: dict[int, SmallIntArray] = {}
        self._weights: SmallIntArray | None = None
        if lowering is not None:
            self._set_arrays(lowering, raising, weights)

    def _set_arrays(
        self,
        lowering: Sequence[npt.ArrayLike],
        raising: Sequence[npt.ArrayLike] | None,
        weights: npt.ArrayLike | None,
    ) -> None:
        if len(lowering) != self._n - 1:
            raise ValueError(
                f"lowering must hold n - 1 = {self._n - 1} arrays; got {len(lowering)}"
            )
        for i, fi in enumerate(lowering, start=1):
            # a copy: freezing must not touch the caller's own array
            self._f[i] = _frozen(np.array(fi, dtype=np.int64))
        _core.sources(list(self._f.values()), self._size)  # validates shapes and ranges
        for i in range(1, self._n):
            if raising is None:
                self._e[i] = _frozen(_inverse(self._f[i]))
            else:
                self._e[i] = _frozen(np.array(raising[i - 1], dtype=np.int64))
        if weights is not None:
            w = np.array(weights, dtype=np.int32)
            if w.shape != (self._size, self._n):
                raise ValueError(
                    f"weights must have shape ({self._size}, {self._n}); got {w.shape}"
                )
            self._weights = _frozen(w)

    # --- the table -------------------------------------------------------------------------

    @property
    def n(self) -> int:
        """Number of variables: the crystal is of type A_{n-1} (GL_n)."""
        return self._n

    def __len__(self) -> int:
        return self._size

    def _check_i(self, i: Any) -> int:
        return check_index(i, 1, self._n - 1, "i")

    def f(self, i: int) -> IntArray:
        """Lowering operator f_i as an int64 array: ``f(i)[v]`` is the target of v, or -1."""
        i = self._check_i(i)
        if i not in self._f:
            self._load_operators(i)
        return self._f[i]

    def e(self, i: int) -> IntArray:
        """Raising operator e_i as an int64 array: ``e(i)[v]`` is the target of v, or -1."""
        i = self._check_i(i)
        if i not in self._e:
            self._load_operators(i)
        return self._e[i]

    def _load_operators(self, i: int) -> None:
        self._f[i], self._e[i] = (_frozen(a) for a in self._compute_operators(i))

    def phi(self, i: int) -> SmallIntArray:
        """phi_i: how many times f_i applies to each vertex (int32 array)."""
        i = self._check_i(i)
        if i not in self._phi:
            self._phi[i], self._eps[i] = (_frozen(a) for a in self._compute_string_lengths(i))
        return self._phi[i]

    def epsilon(self, i: int) -> SmallIntArray:
        """epsilon_i: how many times e_i applies to each vertex (int32 array)."""
        i = self._check_i(i)
        if i not in self._eps:
            self.phi(i)
        return self._eps[i]

    def weights(self) -> SmallIntArray:
        """Weights as an int32 array of shape (len(C), n)."""
        if self._weights is None:
            self._weights = _frozen(self._compute_weights())
        return self._weights

    def _compute_operators(self, i: int) -> tuple[IntArray, IntArray]:
        raise NotImplementedError(f"{type(self).__name__} has no operator f_{i}")

    def _compute_weights(self) -> SmallIntArray:
        raise NotImplementedError(f"{type(self).__name__} has no weights")

    def _compute_string_lengths(self, i: int) -> tuple[SmallIntArray, SmallIntArray]:
        return _core.string_steps(self.f(i)), _core.string_steps(self.e(i))

    # --- structure, written once for every crystal ------------------------------------------

    def _all(self, which: str) -> list[IntArray]:
        op = self.e if which == "e" else self.f
        return [op(i) for i in range(1, self._n)]

    def highest_weights(self) -> IntArray:
        """Vertices killed by every e_i, ascending."""
        return _frozen(_core.sources(self._all("e"), self._size))

    def lowest_weights(self) -> IntArray:
        """Vertices killed by every f_i, ascending."""
        return _frozen(_core.sources(self._all("f"), self._size))

    def highest_weight(self) -> int:
        """The highest weight vertex of a connected crystal (ValueError unless exactly one)."""
        return _only(self.highest_weights(), "highest weight")

    def lowest_weight(self) -> int:
        """The lowest weight vertex of a connected crystal (ValueError unless exactly one)."""
        return _only(self.lowest_weights(), "lowest weight")

    def components(self) -> IntArray:
        """Component label of every vertex; components are numbered by their smallest vertex."""
        return _frozen(_core.components(self._all("f"), self._size))

    def character(self, mask: npt.ArrayLike | None = None) -> Poly:
        """Sum of x^wt(v) over all vertices, or over those where ``mask`` is True.

        Examples
        --------
        >>> import druse
        >>> druse.crystal((2,), 2).character() == druse.schur((2,), 2)
        True
        """
        m = None
        if mask is not None:
            m = np.ascontiguousarray(mask)
            if m.dtype != np.bool_:
                raise TypeError(f"mask must be a boolean array; got dtype {m.dtype}")
            if m.shape != (self._size,):
                raise ValueError(f"mask must have shape ({self._size},); got {m.shape}")
        exps, coeffs = _core.character(self.weights(), m)
        return Poly._from_arrays(exps, coeffs, self._n)

    def demazure(self, word: Sequence[int]) -> BoolArray:
        """The Demazure crystal of w = s_{i1}...s_{ik} for ``word`` = (i1, ..., ik), as a read-only
        bool mask of length len(C): D_{i1}(...D_{ik}(highest weights)), D_{ik} applied first,
        D_i(X) = {f_i^k x : x in X, k >= 0}. A word that is not reduced gives the Demazure crystal
        of its Demazure product. See :func:`druse.demazure_mask`.

        Examples
        --------
        >>> import druse
        >>> C = druse.crystal((2, 1), 3)
        >>> int(C.demazure(()).sum()), int(C.demazure((1, 2, 1)).sum())
        (1, 8)
        """
        from druse.demazure import demazure_mask  # druse.demazure imports this module

        return demazure_mask(self, word)

    def edges(self) -> IntArray:
        """All arrows as an (E, 3) int64 array of rows (source, i, target), by i then source."""
        parts = []
        for i in range(1, self._n):
            fi = self.f(i)
            src = np.flatnonzero(fi >= 0)
            parts.append(np.column_stack([src, np.full(src.size, i), fi[src]]))
        if not parts:
            return _frozen(np.zeros((0, 3), dtype=np.int64))
        return _frozen(np.concatenate(parts).astype(np.int64))

    def __repr__(self) -> str:
        return f"<crystal of GL_{self._n} with {self._size} vertices>"


class TableauCrystal(Crystal):
    """The crystal B(lambda) of GL_n on semistandard Young tableaux of shape lambda, entries 1..n.

    Vertices are numbered in the order of the Rust enumerator: decreasing lexicographic in the
    chain of shapes (lambda^(n-1), ..., lambda^(1)), lambda^(k) being the cells with entries
    <= k, so vertex 0 is the highest weight tableau and the last vertex the lowest. The
    operators follow the signature rule on the row reading word (rows bottom to top, each left
    to right; Kashiwara-Nakashima, "Crystal graphs for representations of the q-analogue of
    classical Lie algebras", 1994).
    """

    def __init__(self, shape: Sequence[int], n: int) -> None:
        self._shape = check_partition(shape, "shape")
        n = check_positive_int(n, "n")
        cells = sum(self._shape)
        count = count_tableaux(self._shape, n)
        check_budget(
            count * max(cells, 1),
            f"the {count} tableaux of B{self._shape} for GL_{n}",
            "use druse.iter_tableaux to stream them in chunks, or druse.count_tableaux to count",
        )
        self._model = tableau_model(self._shape, n)
        self._cells = _frozen(self._model.enumerate())
        super().__init__(n, count)

    @property
    def shape(self) -> tuple[int, ...]:
        """The partition lambda."""
        return self._shape

    def tableaux(self) -> npt.NDArray[np.uint8]:
        """All tableaux as a read-only uint8 array (len(C), |lambda|): cells row by row."""
        return self._cells

    def reading_words(self) -> npt.NDArray[np.uint8]:
        """Row reading words of all tableaux (rows bottom to top, each left to right), as uint8
        (len(C), |lambda|): the words whose signature rule defines the operators."""
        starts = np.cumsum((0, *self._shape))
        order = [
            k for r in reversed(range(len(self._shape))) for k in range(starts[r], starts[r + 1])
        ]
        return _frozen(np.ascontiguousarray(self._cells[:, order]))

    def tableau(self, v: int) -> tuple[tuple[int, ...], ...]:
        """The tableau at vertex v, as a tuple of rows."""
        v = check_index(v, 0, self._size - 1, "v")
        flat = self._cells[v].tolist()
        rows, start = [], 0
        for length in self._shape:
            rows.append(tuple(flat[start : start + length]))
            start += length
        return tuple(rows)

    def index(self, rows: Sequence[Sequence[int]]) -> int:
        """The vertex of a tableau given as a sequence of rows (ValueError if it is not one)."""
        flat = _flatten_rows(rows, self._shape, self._n)
        return int(self._model.rank(flat))

    def operator_tables(self) -> None:
        """Compute f_i, e_i, phi_i, epsilon_i for every i at once (faster than one i at a time)."""
        check_budget(self._size * (self._n - 1) * 24, "operator tables", "ask for single f(i)")
        for i, arrays in enumerate(self._model.operator_tables(self._cells), start=1):
            self._store(i, *arrays)

    def lowering_tables(self) -> None:
        """Compute every f_i in one pass, without e_i, phi_i, epsilon_i: about half the cost of
        :meth:`operator_tables`, and all that a Demazure closure needs."""
        check_budget(self._size * (self._n - 1) * 8, "lowering tables", "ask for single f(i)")
        for i, (f, *_) in enumerate(self._model.operator_tables(self._cells, True), start=1):
            self._f[i] = _frozen(f)

    def _store(
        self, i: int, f: IntArray, e: IntArray, phi: SmallIntArray, eps: SmallIntArray
    ) -> None:
        self._f[i], self._e[i] = _frozen(f), _frozen(e)
        self._phi[i], self._eps[i] = _frozen(phi), _frozen(eps)

    def highest_weight(self) -> int:
        """The vertex of the tableau whose row r is filled with r (the highest weight vertex)."""
        if self._size == 0:
            raise ValueError("the crystal is empty: the shape has more rows than n")
        return self.index([[r + 1] * length for r, length in enumerate(self._shape)])

    def _compute_operators(self, i: int) -> tuple[IntArray, IntArray]:
        check_budget(self._size * _OPERATOR_BYTES, f"f_{i} and e_{i}", "stream with iter_tableaux")
        f, e, phi, eps = self._model.operator(self._cells, i)
        self._phi[i], self._eps[i] = _frozen(phi), _frozen(eps)  # free with the targets
        return f, e

    def _compute_string_lengths(self, i: int) -> tuple[SmallIntArray, SmallIntArray]:
        phi, eps = self._model.string_lengths(self._cells, i)
        return phi, eps

    def _compute_weights(self) -> SmallIntArray:
        w: SmallIntArray = self._model.weights(self._cells)
        return w

    def __repr__(self) -> str:
        shape = ",".join(map(str, self._shape))
        return f"<B({shape}) of GL_{self._n}: {self._size} tableaux>"


def crystal(shape: Sequence[int], n: int) -> TableauCrystal:
    """The crystal B(shape) of GL_n on semistandard tableaux with entries 1..n.

    Parameters
    ----------
    shape : sequence of int
        A partition (weakly decreasing, non-negative; trailing zeros ignored).
    n : int
        Number of letters, n >= 1. More rows than n gives the empty crystal.

    Returns
    -------
    TableauCrystal

    Raises
    ------
    TypeError, ValueError
        If shape is not a partition or n is not a positive integer.
    druse.TooLargeError
        If the tableaux would not fit the memory budget; the message names the size.

    Examples
    --------
    >>> import druse
    >>> C = druse.crystal((3, 1), 3)
    >>> len(C)
    15
    >>> C.tableau(C.highest_weight())
    ((1, 1, 1), (2,))
    >>> int(C.f(1)[C.highest_weight()]) == C.index([[1, 1, 2], [2]])
    True
    """
    return TableauCrystal(shape, n)


def _only(vertices: IntArray, what: str) -> int:
    if vertices.size != 1:
        raise ValueError(f"the crystal has {vertices.size} {what} vertices, not exactly one")
    return int(vertices[0])


def _inverse(f: IntArray) -> IntArray:
    e = np.full(f.size, -1, dtype=np.int64)
    src = np.flatnonzero(f >= 0)
    if np.unique(f[src]).size != src.size:
        raise ValueError("lowering arrays must be injective where defined (partial bijections)")
    e[f[src]] = src
    return e


def _flatten_rows(rows: Any, shape: tuple[int, ...], n: int) -> list[int]:
    if isinstance(rows, (str, bytes)) or not isinstance(rows, Sequence):
        raise TypeError(f"rows must be a sequence of rows; got {type(rows).__name__}")
    got = []
    for r, row in enumerate(rows):
        if isinstance(row, (str, bytes)) or not isinstance(row, Sequence):
            raise TypeError(f"rows[{r}] must be a sequence of integers; got {type(row).__name__}")
        got.append(row)
    while got and len(got[-1]) == 0:
        got.pop()
    lengths = tuple(len(row) for row in got)
    if lengths != shape:
        raise ValueError(f"rows must have lengths {shape} for this crystal; got {lengths}")
    flat = [check_int(x, f"rows[{r}][{c}]") for r, row in enumerate(got) for c, x in enumerate(row)]
    for x in flat:
        if not 1 <= x <= n:
            raise ValueError(f"tableau entries must be in 1..{n}; got {x}")
    return flat
