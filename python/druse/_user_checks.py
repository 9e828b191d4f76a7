"""Checks and weight derivation for crystals built from the user's edges (all vectorised).

Every check names the offending edge or vertex (its witness). ``where(k)`` says where edge row k
came from (``edges[5]``, ``$.edges[5]``, ``lowering[2]['a']``) and ``show(v)`` how to print
vertex v (its index, or its label), so the same checks serve arrays, dicts, callables and files.
"""

from __future__ import annotations

from collections.abc import Callable, Hashable, Mapping, Sequence
from typing import Any

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import check_int

IntArray = npt.NDArray[np.int64]
Where = Callable[[int], str]
Show = Callable[[int], str]

_INT32 = np.iinfo(np.int32)


def edge_array(edges: Any, name: str) -> IntArray:
    """``edges`` as an (E, 3) int64 array; TypeError for a non-integer dtype, ValueError for a
    wrong shape."""
    arr = np.asarray(edges)
    if arr.size == 0:
        return np.zeros((0, 3), dtype=np.int64)
    if arr.dtype == np.bool_ or arr.dtype.kind not in "iu":
        raise TypeError(
            f"{name} must be an integer array of rows (source, i, target); got dtype {arr.dtype}"
        )
    if arr.ndim != 2 or arr.shape[1] != 3:
        raise ValueError(
            f"{name} must have shape (E, 3), rows (source, i, target); got shape {arr.shape}"
        )
    if arr.dtype.kind == "u" and int(arr.max()) > 2**62:
        raise ValueError(f"{name} holds {int(arr.max())}, too large for a vertex or an index")
    return np.ascontiguousarray(arr, dtype=np.int64)


def vertex_count(edges: IntArray, size: Any, where: Where) -> int:
    """The number of vertices: ``size`` if given (checked to cover the edges), else max + 1."""
    ends = edges[:, [0, 2]]
    if ends.size and int(ends.min()) < 0:
        k = int(np.flatnonzero((ends < 0).any(axis=1))[0])
        raise ValueError(f"{where(k)} = {tuple(edges[k].tolist())} names a negative vertex")
    top = int(ends.max()) + 1 if ends.size else 0
    if size is None:
        return top
    count = check_int(size, "size")
    if count < top:
        k = int(np.flatnonzero((ends >= count).any(axis=1))[0])
        raise ValueError(
            f"{where(k)} = {tuple(edges[k].tolist())} names a vertex outside 0..{count - 1} "
            f"(size = {count})"
        )
    return count


def lowering_arrays(edges: IntArray, n: int, size: int, where: Where, show: Show) -> list[IntArray]:
    """f_1..f_{n-1} as int64 arrays, after checking that i is in range and each f_i is a partial
    bijection (one target per source, one source per target)."""
    colour = edges[:, 1]
    bad = np.flatnonzero((colour < 1) | (colour > n - 1))
    if bad.size:
        k = int(bad[0])
        span = f"1..{n - 1}" if n > 1 else "1..0, which is empty for n = 1"
        raise ValueError(f"{where(k)} has i = {int(colour[k])}; i must be in {span}")
    _no_repeats(edges, 0, size, where, show)
    _no_repeats(edges, 2, size, where, show)
    table = np.full((max(n - 1, 0), size), -1, dtype=np.int64)
    table.ravel()[(colour - 1) * size + edges[:, 0]] = edges[:, 2]  # one scatter for every i
    return list(table)


def raising_arrays(f: list[IntArray], size: int) -> list[IntArray]:
    """e_i as the inverse of each (checked) partial bijection f_i."""
    arrays = []
    for fi in f:
        src = np.flatnonzero(fi >= 0)
        e = np.full(size, -1, dtype=np.int64)
        e[fi[src]] = src
        arrays.append(e)
    return arrays


def _no_repeats(edges: IntArray, end: int, size: int, where: Where, show: Show) -> None:
    """No two rows share (i, source) (end = 0) or (i, target) (end = 2)."""
    if edges.shape[0] < 2:
        return
    # fast test on one int64 key (i < n and vertex < size, both bounded by the memory budget)
    key = np.sort(edges[:, 1] * max(size, 1) + edges[:, end])
    if not (key[1:] == key[:-1]).any():
        return
    order = np.lexsort((np.arange(edges.shape[0]), edges[:, end], edges[:, 1]))
    keyed = edges[order]
    clash = np.flatnonzero((keyed[1:, 1] == keyed[:-1, 1]) & (keyed[1:, end] == keyed[:-1, end]))
    if not clash.size:
        return
    a, b = int(order[clash[0]]), int(order[clash[0] + 1])
    (s1, i, t1), (s2, _, t2) = edges[a].tolist(), edges[b].tolist()
    if s1 == s2 and t1 == t2:
        raise ValueError(
            f"the edge {show(s1)} -{i}-> {show(t1)} is given twice: {where(a)}, {where(b)}"
        )
    if end == 0:
        what = f"f_{i} sends {show(s1)} to both {show(t1)} and {show(t2)}"
    else:
        what = f"f_{i} sends both {show(s1)} and {show(s2)} to {show(t1)}"
    raise ValueError(
        f"edges must form partial bijections for each i: {what} ({where(a)}, {where(b)})"
    )


def weight_table(
    weights: Any, n: int, labels: Sequence[Hashable] | None, size: int
) -> npt.NDArray[np.int32]:
    """Given weights (an (N, n) integer array, or a mapping vertex or label -> n integers) as an
    int32 array, after checking dtype, shape and range."""
    if isinstance(weights, Mapping):
        keys = labels if labels is not None else range(size)
        missing = [k for k in keys if k not in weights]
        if missing:
            raise ValueError(f"weights has no entry for vertex {missing[0]!r}")
        rows = [weights[k] for k in keys]
        arr = np.asarray(rows) if rows else np.zeros((0, n), dtype=np.int64)
    else:
        arr = np.asarray(weights)
    if arr.size and (arr.dtype == np.bool_ or arr.dtype.kind not in "iu"):
        raise TypeError(f"weights must hold integers; got dtype {arr.dtype}")
    if arr.shape != (size, n):
        raise ValueError(f"weights must have shape (N, n) = ({size}, {n}); got {arr.shape}")
    if arr.size and (int(arr.max()) > _INT32.max or int(arr.min()) < _INT32.min):
        raise ValueError("weights must fit in 32-bit integers")
    return np.ascontiguousarray(arr, dtype=np.int32)


def check_weight_changes(
    weights: npt.NDArray[np.int32], edges: IntArray, where: Where, show: Show
) -> None:
    """wt(f_i x) = wt(x) - alpha_i on every edge (alpha_i = e_i - e_{i+1}), else the witness."""
    if not edges.shape[0]:
        return
    src, colour, tgt = edges[:, 0], edges[:, 1], edges[:, 2]
    n = weights.shape[1]
    change = weights[tgt].astype(np.int64) - weights[src]
    flat = change.ravel()
    at = np.arange(edges.shape[0]) * n + colour
    flat[at - 1] += 1  # wt(f_i x) - wt(x) + alpha_i must vanish
    flat[at] -= 1
    bad = np.flatnonzero(change.any(axis=1))
    if bad.size:
        k = int(bad[0])
        s, i, t = edges[k].tolist()
        expected = weights[s].astype(np.int64)
        expected[i - 1] -= 1
        expected[i] += 1
        raise ValueError(
            f"weights are inconsistent with the edge {show(s)} -{i}-> {show(t)} ({where(k)}): "
            f"wt({show(t)}) = {tuple(weights[t].tolist())} but wt({show(s)}) - alpha_{i} = "
            f"{tuple(expected.tolist())}"
        )


def derive_weights(
    f: list[IntArray],
    n: int,
    size: int,
    degree: int | None,
    edges: IntArray,
    where: Where,
    show: Show,
) -> npt.NDArray[np.int32]:
    """Weights from string lengths: wt_j - wt_{j+1} = phi_j - epsilon_j at every vertex, which
    fixes each component's weights up to adding c(1, ..., 1); c makes the entries sum to
    ``degree``, or (degree None) the smallest entry in the component 0."""
    diff = np.zeros((size, n - 1), dtype=np.int64)
    for i, (fi, ei) in enumerate(zip(f, raising_arrays(f, size), strict=True), start=1):
        diff[:, i - 1] = _string(fi, i, "f", show) - _string(ei, i, "e", show)
    _check_string_changes(diff, edges, where, show)
    base = np.zeros((size, n), dtype=np.int64)  # the weight with last entry 0
    base[:, : n - 1] = np.cumsum(diff[:, ::-1], axis=1)[:, ::-1]
    total = base.sum(axis=1)
    comp = _core.components(f, size)
    count = int(comp.max()) + 1 if size else 0
    if degree is None:
        # smallest entry 0: n * (shift) = max over the component of (total - n * smallest entry)
        shift_total = np.full(count, np.iinfo(np.int64).min, dtype=np.int64)
        np.maximum.at(shift_total, comp, total - n * base.min(axis=1, initial=0))
    else:
        shift_total = np.full(count, degree, dtype=np.int64)
        off = np.flatnonzero((shift_total[comp] - total) % n)
        if off.size:
            v = int(off[0])
            raise ValueError(
                f"degree = {degree} is impossible for the component of vertex {show(v)}: "
                f"its weights have entry sums congruent to {int(total[v]) % n} mod n = {n}"
            )
    weights = base + ((shift_total[comp] - total) // n)[:, None]
    if size and (int(weights.max()) > _INT32.max or int(weights.min()) < _INT32.min):
        raise ValueError("derived weights do not fit in 32-bit integers; choose another degree")
    return np.ascontiguousarray(weights, dtype=np.int32)


def _string(op: IntArray, i: int, letter: str, show: Show) -> npt.NDArray[np.int64]:
    try:
        return _core.string_steps(op).astype(np.int64)
    except ValueError as exc:
        v = int(str(exc).rsplit(" ", 1)[-1])
        raise ValueError(
            f"{letter}_{i} runs in a cycle through vertex {show(v)}, so its strings are "
            "infinite and no weights fit them"
        ) from exc


def _check_string_changes(
    diff: npt.NDArray[np.int64], edges: IntArray, where: Where, show: Show
) -> None:
    """Weights fit the string lengths only if phi - epsilon drops by column i of the Cartan
    matrix (2 at i, -1 at i +- 1) along each f_i."""
    if not edges.shape[0]:
        return
    src, colour, tgt = edges[:, 0], edges[:, 1], edges[:, 2]
    expected = diff[src].copy()
    rows = np.arange(edges.shape[0])
    expected[rows, colour - 1] -= 2
    n1 = diff.shape[1]
    for step in (-1, 1):
        j = colour - 1 + step
        ok = (j >= 0) & (j < n1)
        expected[rows[ok], j[ok]] += 1
    bad = np.flatnonzero((diff[tgt] != expected).any(axis=1))
    if bad.size:
        k = int(bad[0])
        s, i, t = edges[k].tolist()
        raise ValueError(
            f"no weights fit the string lengths (wt_j - wt_(j+1) = phi_j - epsilon_j) at the edge "
            f"{show(s)} -{i}-> {show(t)} ({where(k)}): phi - epsilon is "
            f"{tuple(diff[s].tolist())} at the source and {tuple(diff[t].tolist())} at the "
            f"target, where {tuple(expected[k].tolist())} is needed"
        )
