"""Right and left keys of the tableaux of a crystal B(lambda) (Lascoux-Schutzenberger).

A key tableau is a semistandard tableau whose columns are nested: each column's entries contain
those of the column to its right. The key tableau of a weak composition alpha has column c equal
to {j : alpha_j >= c}, so its content is alpha. Every tableau T has a right key K_+(T) >= T and a
left key K_-(T) <= T entrywise, both key tableaux of T's shape (Lascoux and Schutzenberger, "Keys
and standard bases", 1990). T lies in the Demazure crystal B_w(lambda) exactly when
K_+(T) <= key(w.lambda) entrywise (same source; Reiner and Shimozono, "Key polynomials and a
flagged Littlewood-Richardson rule", 1995).

The Rust kernel computes every key of the crystal at once, by jeu de taquin through the
Schutzenberger involution (see ``rust/tableau/keys.rs``); results are cached on the crystal.
"""

from __future__ import annotations

import weakref
from typing import Any

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import check_index
from druse.crystal import TableauCrystal

CellArray = npt.NDArray[np.uint8]
WeightArray = npt.NDArray[np.int32]

#: Keys already computed, per crystal and side; entries go when their crystal does.
_CACHE: weakref.WeakKeyDictionary[TableauCrystal, dict[str, tuple[CellArray, WeightArray]]] = (
    weakref.WeakKeyDictionary()
)

__all__ = [
    "left_key",
    "left_key_weights",
    "left_keys",
    "right_key",
    "right_key_weights",
    "right_keys",
]


def _keys(crystal: Any, which: str) -> tuple[CellArray, WeightArray]:
    """Keys and their contents, computed once per crystal and side, read-only."""
    if not isinstance(crystal, TableauCrystal):
        raise TypeError(
            f"keys are defined for tableau crystals (druse.crystal); got {type(crystal).__name__}"
        )
    cache = _CACHE.setdefault(crystal, {})
    if which not in cache:
        cells, weights = _core.tableau_keys(
            list(crystal.shape), crystal.n, crystal.tableaux(), which
        )
        cells.flags.writeable = False
        weights.flags.writeable = False
        cache[which] = (cells, weights)
    return cache[which]


def right_keys(crystal: TableauCrystal) -> CellArray:
    """Right keys K_+(T) of every tableau, as a read-only uint8 array (len(C), |lambda|).

    Cells are laid out as in :meth:`TableauCrystal.tableaux` (row by row). Row v is the right key
    of vertex v.

    Parameters
    ----------
    crystal : TableauCrystal
        A crystal from :func:`druse.crystal`.

    Raises
    ------
    TypeError
        If ``crystal`` is not a tableau crystal.

    Examples
    --------
    >>> import druse
    >>> from druse.tableau_keys import right_keys
    >>> C = druse.crystal((2, 1), 3)
    >>> v = C.index([[1, 2], [3]])
    >>> right_keys(C)[v].tolist()
    [2, 2, 3]
    """
    return _keys(crystal, "right")[0]


def left_keys(crystal: TableauCrystal) -> CellArray:
    """Left keys K_-(T) of every tableau, as a read-only uint8 array (len(C), |lambda|).

    Parameters
    ----------
    crystal : TableauCrystal
        A crystal from :func:`druse.crystal`.

    Raises
    ------
    TypeError
        If ``crystal`` is not a tableau crystal.

    Examples
    --------
    >>> import druse
    >>> from druse.tableau_keys import left_keys
    >>> C = druse.crystal((2, 1), 3)
    >>> left_keys(C)[C.index([[1, 2], [3]])].tolist()
    [1, 1, 3]
    """
    return _keys(crystal, "left")[0]


def right_key_weights(crystal: TableauCrystal) -> WeightArray:
    """Contents of the right keys: int32 (len(C), n), row v the weak composition alpha with
    K_+(T_v) = key(alpha).

    Parameters
    ----------
    crystal : TableauCrystal
        A crystal from :func:`druse.crystal`.

    Raises
    ------
    TypeError
        If ``crystal`` is not a tableau crystal.

    Examples
    --------
    >>> import druse
    >>> from druse.tableau_keys import right_key_weights
    >>> C = druse.crystal((2, 1), 3)
    >>> right_key_weights(C)[C.index([[1, 2], [3]])].tolist()
    [0, 2, 1]
    """
    return _keys(crystal, "right")[1]


def left_key_weights(crystal: TableauCrystal) -> WeightArray:
    """Contents of the left keys: int32 (len(C), n), row v the weak composition alpha with
    K_-(T_v) = key(alpha).

    Parameters
    ----------
    crystal : TableauCrystal
        A crystal from :func:`druse.crystal`.

    Raises
    ------
    TypeError
        If ``crystal`` is not a tableau crystal.

    Examples
    --------
    >>> import druse
    >>> from druse.tableau_keys import left_key_weights
    >>> C = druse.crystal((2, 1), 3)
    >>> left_key_weights(C)[C.index([[1, 2], [3]])].tolist()
    [2, 0, 1]
    """
    return _keys(crystal, "left")[1]


def right_key(crystal: TableauCrystal, v: int) -> tuple[tuple[int, ...], ...]:
    """The right key of the tableau at vertex v, as a tuple of rows (like ``C.tableau(v)``).

    Parameters
    ----------
    crystal : TableauCrystal
        A crystal from :func:`druse.crystal`.
    v : int
        A vertex, 0 <= v < len(crystal).

    Raises
    ------
    TypeError
        If ``crystal`` is not a tableau crystal or v is not an integer.
    ValueError
        If v is out of range.

    Examples
    --------
    >>> import druse
    >>> from druse.tableau_keys import right_key
    >>> C = druse.crystal((3, 1), 3)
    >>> right_key(C, C.index([[1, 2, 3], [2]]))
    ((1, 3, 3), (3,))
    """
    return _as_rows(crystal, right_keys(crystal), v)


def left_key(crystal: TableauCrystal, v: int) -> tuple[tuple[int, ...], ...]:
    """The left key of the tableau at vertex v, as a tuple of rows (like ``C.tableau(v)``).

    Parameters and errors as for :func:`right_key`.

    Examples
    --------
    >>> import druse
    >>> from druse.tableau_keys import left_key
    >>> C = druse.crystal((3, 1), 3)
    >>> left_key(C, C.index([[1, 2, 3], [2]]))
    ((1, 2, 2), (2,))
    """
    return _as_rows(crystal, left_keys(crystal), v)


def _as_rows(crystal: TableauCrystal, keys: CellArray, v: int) -> tuple[tuple[int, ...], ...]:
    v = check_index(v, 0, len(crystal) - 1, "v")
    flat = keys[v].tolist()
    rows, start = [], 0
    for length in crystal.shape:
        rows.append(tuple(flat[start : start + length]))
        start += length
    return tuple(rows)
