"""Bounded breadth-first exploration of a crystal given by Python callables.

Callables are the user's code: whatever they raise comes back as a ValueError naming the
operator and the vertex (chained), what they return must be hashable, and the number of vertices
is capped, so the exploration always ends.
"""

from __future__ import annotations

import reprlib
from collections.abc import Callable, Hashable, Iterable, Sequence
from typing import Any

import numpy as np
import numpy.typing as npt

from druse._check import check_int

_short = reprlib.Repr()
_short.maxstring = 60
_short.maxother = 60


def show(x: Any) -> str:
    """A repr short enough for an error message."""
    return _short.repr(x)


class Exploration:
    """Vertices found so far (in discovery order) and the arrows f_i between them."""

    def __init__(self, n: int, limit: int) -> None:
        self.n = n
        self.limit = limit
        self.labels: list[Hashable] = []
        self.index: dict[Hashable, int] = {}
        # per i: source -> (target, how it was found), and target -> source
        self.down: list[dict[int, tuple[int, str]]] = [{} for _ in range(n)]
        self.up: list[dict[int, int]] = [{} for _ in range(n)]
        self.rows: list[tuple[int, int, int]] = []
        self.origins: list[str] = []

    def add(self, x: Any, found_by: str) -> int:
        try:
            v = self.index.get(x)
        except TypeError:
            raise TypeError(
                f"{found_by} is an unhashable {type(x).__name__} {show(x)}; vertices must be "
                "hashable (use tuples, not lists)"
            ) from None
        if v is not None:
            return v
        if len(self.labels) >= self.limit:
            raise ValueError(
                f"the exploration found more than limit = {self.limit:,} vertices (the last one "
                f"from {found_by}); the operators may generate an infinite set. If the crystal "
                "is finite, pass a larger limit= to crystal_from_operators"
            )
        v = self.index[x] = len(self.labels)
        self.labels.append(x)
        return v

    def arrow(self, s: int, i: int, t: int, how: str) -> None:
        """Record s --i--> t (found as ``how``), refusing a second target or a second source."""
        known = self.down[i].get(s)
        if known is not None:
            if known[0] != t:
                raise ValueError(f"the operators are not partial bijections: {known[1]} but {how}")
            return
        other = self.up[i].get(t)
        if other is not None and other != s:
            raise ValueError(
                f"the operators are not partial bijections: {self.down[i][other][1]} and {how}"
            )
        self.down[i][s] = (t, how)
        self.up[i][t] = s
        self.rows.append((s, i, t))
        self.origins.append(how)

    def edge_array(self) -> npt.NDArray[np.int64]:
        return np.array(self.rows, dtype=np.int64).reshape(-1, 3)

    def origin(self, k: int) -> str:
        return self.origins[k]

    def call_weight(self, weight: Callable[[Any], Sequence[int]], x: Any, n: int) -> list[int]:
        try:
            wt = weight(x)
        except Exception as exc:
            raise ValueError(
                f"weight raised {type(exc).__name__} at vertex {show(x)}: {exc}"
            ) from exc
        if isinstance(wt, (str, bytes)) or not isinstance(wt, Iterable):
            raise TypeError(f"weight({show(x)}) must be {n} integers; got {show(wt)}")
        entries = list(wt)
        if len(entries) != n:
            raise ValueError(f"weight({show(x)}) must have n = {n} entries; got {show(wt)}")
        return [check_int(a, f"weight({show(x)})[{k}]") for k, a in enumerate(entries)]


def _per_i(op: Any, n: int, name: str) -> Callable[[int, Any], Any]:
    """``op(i, x)`` from either form: one callable of (i, x), or a sequence of callables of x."""
    if callable(op):
        return op  # type: ignore[no-any-return]
    if isinstance(op, (str, bytes)) or not isinstance(op, Sequence):
        raise TypeError(
            f"{name} must be a callable (i, x) -> y or a sequence of n - 1 callables; "
            f"got {type(op).__name__}"
        )
    if len(op) != n - 1:
        raise ValueError(f"{name} must hold n - 1 = {n - 1} callables; got {len(op)}")
    for k, g in enumerate(op):
        if not callable(g):
            raise TypeError(f"{name}[{k}] must be callable; got {type(g).__name__}")
    ops = list(op)
    return lambda i, x: ops[i - 1](x)


def _apply(op: Callable[[int, Any], Any], letter: str, i: int, x: Any) -> Any:
    try:
        return op(i, x)
    except Exception as exc:
        raise ValueError(
            f"the operator {letter}_{i} raised {type(exc).__name__} at vertex {show(x)}: {exc}"
        ) from exc


def explore(
    n: int, lowering: Any, raising: Any, seeds: Iterable[Hashable], limit: int
) -> Exploration:
    """Breadth-first from the seeds: each vertex gets f_1..f_{n-1}, then e_1..e_{n-1}."""
    f = _per_i(lowering, n, "lowering")
    e = None if raising is None else _per_i(raising, n, "raising")
    if isinstance(seeds, (str, bytes)) or not isinstance(seeds, Iterable):
        raise TypeError(f"seeds must be an iterable of vertices; got {type(seeds).__name__}")
    found = Exploration(n, limit)
    for k, seed in enumerate(seeds):
        if seed is None:
            raise ValueError(f"seeds[{k}] is None, which stands for 'undefined'")
        found.add(seed, f"seeds[{k}]")
    done = 0
    while done < len(found.labels):
        x = found.labels[done]
        for i in range(1, n):
            y = _apply(f, "f", i, x)
            if y is not None:
                t = found.add(y, f"f_{i}({show(x)})")
                found.arrow(done, i, t, f"f_{i}({show(x)}) = {show(y)}")
        if e is not None:
            for i in range(1, n):
                y = _apply(e, "e", i, x)
                if y is not None:
                    s = found.add(y, f"e_{i}({show(x)})")
                    found.arrow(s, i, done, f"e_{i}({show(x)}) = {show(y)}")
        done += 1
    return found
