"""Crystals from the user's data: edge arrays, dicts on any hashable labels, or Python callables.

Every constructor returns the foundation's :class:`druse.Crystal` (vertices 0..N-1, f_i as int64
arrays, weights (N, n) int32), or its subclass :class:`LabelledCrystal`, which also keeps the
user's label of each vertex. Bad input is refused with the witness: the edge that breaks a
partial bijection, the colour i out of range, the edge whose weights do not change by alpha_i.

Derived weights
---------------
When no weights are given they are derived from the string lengths: wt_i - wt_{i+1} = phi_i -
epsilon_i at every vertex (an axiom of the crystals of representations; Bump and Schilling,
"Crystal Bases: Representations and Combinatorics", 2017, ch. 2), which fixes the weights of
each connected component up to adding c(1, ..., 1). c is chosen so that the entries sum to
``degree`` when it is given, and otherwise so that the smallest entry in the component is 0.
For B(lambda) with fewer than n rows this gives the tableau weights exactly; in general it gives
them minus lambda_n (1, ..., 1).
"""

from __future__ import annotations

from collections.abc import Callable, Hashable, Iterable, Mapping, Sequence
from typing import Any, overload

import numpy as np
import numpy.typing as npt

from druse import _user_checks as checks
from druse._check import check_budget, check_int, check_positive_int
from druse._explore import explore
from druse._explore import show as short_repr
from druse.crystal import Crystal

__all__ = ["LabelledCrystal", "crystal_from_edges", "crystal_from_operators"]

Operator = Callable[[int, Any], Any] | Sequence[Callable[[Any], Any]]


class LabelledCrystal(Crystal):
    """A :class:`druse.Crystal` whose vertices carry the user's labels (distinct hashables).

    Vertex v (0..N-1) is labelled ``labels[v]``; everything of the table (f, e, weights,
    components, character...) is indexed by v, and :meth:`label` / :meth:`vertex` translate.
    """

    def __init__(
        self,
        n: int,
        labels: Sequence[Hashable],
        lowering: Sequence[npt.ArrayLike],
        weights: npt.ArrayLike,
        raising: Sequence[npt.ArrayLike] | None = None,
    ) -> None:
        self._labels = tuple(labels)
        self._index = _label_index(self._labels)
        super().__init__(n, len(self._labels), lowering=lowering, raising=raising, weights=weights)

    def label(self, v: int) -> Hashable:
        """The label of vertex v."""
        v = check_int(v, "v")
        if not 0 <= v < len(self._labels):
            raise ValueError(f"v must be in 0..{len(self._labels) - 1}; got {v}")
        return self._labels[v]

    def vertex(self, label: Hashable) -> int:
        """The vertex (index) that carries ``label``; ValueError if none does."""
        try:
            return self._index[label]
        except TypeError:
            raise TypeError(f"label must be hashable; got {type(label).__name__}") from None
        except KeyError:
            raise ValueError(f"no vertex is labelled {label!r}") from None

    def labels(self) -> tuple[Hashable, ...]:
        """All labels, in vertex order."""
        return self._labels

    def __repr__(self) -> str:
        return f"<labelled crystal of GL_{self._n} with {self._size} vertices>"


def _label_index(labels: tuple[Hashable, ...]) -> dict[Hashable, int]:
    index: dict[Hashable, int] = {}
    for v, x in enumerate(labels):
        try:
            first = index.setdefault(x, v)
        except TypeError:
            raise TypeError(f"labels[{v}] must be hashable; got {type(x).__name__} {x!r}") from None
        if first != v:
            raise ValueError(f"labels must be distinct: labels[{first}] == labels[{v}] == {x!r}")
    return index


@overload
def crystal_from_edges(
    n: int,
    edges: Mapping[Any, Any],
    weights: Any = None,
    *,
    size: int | None = None,
    labels: Sequence[Hashable] | None = None,
    degree: int | None = None,
    check_weights: bool = True,
) -> LabelledCrystal: ...


@overload
def crystal_from_edges(
    n: int,
    edges: Any,
    weights: Any = None,
    *,
    size: int | None = None,
    labels: Sequence[Hashable] | None = None,
    degree: int | None = None,
    check_weights: bool = True,
) -> Crystal: ...


def crystal_from_edges(
    n: int,
    edges: Any,
    weights: Any = None,
    *,
    size: int | None = None,
    labels: Sequence[Hashable] | None = None,
    degree: int | None = None,
    check_weights: bool = True,
) -> Crystal:
    """A crystal of type A_{n-1} from its arrows x --i--> f_i(x).

    Parameters
    ----------
    n : int
        Weights have n entries and i runs over 1..n-1.
    edges : array-like or dict
        Either an (E, 3) integer array of rows (source, i, target) on vertices 0..N-1 (the fast
        path), or a dict ``{i: {x: f_i(x)}}`` or ``{i: [(x, f_i(x)), ...]}`` on hashable labels.
    weights : array-like or dict, optional
        An (N, n) integer array in vertex order, or a dict vertex (or label) -> n integers. If
        omitted, weights are derived from the string lengths (module docstring).
    size : int, optional
        Number of vertices for an array (default: largest vertex + 1); larger for isolated ones.
    labels : sequence of hashables, optional
        The vertices in order. For a dict it fixes the order and may add isolated vertices (the
        default order is first appearance: i ascending, each in the given order, source before
        target, then the keys of a weights dict); for an array it labels vertex v as labels[v].
    degree : int, optional
        Sum of the entries of every derived weight (instead of smallest entry 0).
    check_weights : bool
        Check wt(f_i x) = wt(x) - alpha_i on every edge for given weights (default True).

    Returns
    -------
    Crystal or LabelledCrystal
        A :class:`LabelledCrystal` for dict edges or when ``labels`` is given.

    Raises
    ------
    TypeError
        For a non-integer dtype, unhashable labels, non-integer n or i.
    ValueError
        Wrong shapes, i out of 1..n-1, arrows that are not partial bijections, weights that do not
        change by alpha_i, or string lengths no weights fit; the message names the witness.

    Examples
    --------
    >>> import druse
    >>> from druse.user_crystal import crystal_from_edges
    >>> C = crystal_from_edges(3, {1: {"a": "b"}, 2: {"b": "c"}})
    >>> C.labels(), C.weights().tolist()
    (('a', 'b', 'c'), [[1, 0, 0], [0, 1, 0], [0, 0, 1]])
    >>> C.character() == druse.schur((1,), 3)
    True
    """
    n = check_positive_int(n, "n")
    if isinstance(edges, Mapping):
        return _from_dict(n, edges, weights, labels, degree, check_weights)
    arr = checks.edge_array(edges, "edges")
    label_tuple = None if labels is None else tuple(labels)
    if label_tuple is not None:
        if size is not None and size != len(label_tuple):
            raise ValueError(f"size = {size} disagrees with the {len(label_tuple)} labels")
        size = len(label_tuple)

    def where(k: int) -> str:
        return f"edges[{k}]"

    count = checks.vertex_count(arr, size, where)
    return build(n, count, arr, weights, label_tuple, degree, check_weights, where=where)


def _from_dict(
    n: int,
    edges: Mapping[Any, Any],
    weights: Any,
    labels: Sequence[Hashable] | None,
    degree: int | None,
    check_weights: bool,
) -> LabelledCrystal:
    index: dict[Hashable, int] = {}
    if labels is not None:
        index = _label_index(tuple(labels))
    fixed = labels is not None
    rows: list[tuple[int, int, int]] = []
    origins: list[str] = []
    for i in sorted(edges, key=lambda key: check_int(key, "edges key i")):
        for k, pair in enumerate(_pairs(edges[i], i)):
            ends = [_vertex_of(x, index, fixed, f"edges[{i}]") for x in pair]
            rows.append((ends[0], int(i), ends[1]))
            origins.append(
                f"edges[{i}][{pair[0]!r}]" if isinstance(edges[i], Mapping) else f"edges[{i}][{k}]"
            )
    if not fixed and isinstance(weights, Mapping):
        for x in weights:
            _vertex_of(x, index, False, "weights")
    arr = np.array(rows, dtype=np.int64).reshape(-1, 3)
    crystal = build(
        n, len(index), arr, weights, tuple(index), degree, check_weights, where=origins.__getitem__
    )
    assert isinstance(crystal, LabelledCrystal)
    return crystal


def _pairs(value: Any, i: Any) -> list[tuple[Any, Any]]:
    if isinstance(value, Mapping):
        return list(value.items())
    if isinstance(value, (str, bytes)) or not isinstance(value, Iterable):
        raise TypeError(
            f"edges[{i}] must be a dict {{x: f_i(x)}} or a list of pairs (x, f_i(x)); "
            f"got {type(value).__name__}"
        )
    pairs = []
    for k, pair in enumerate(value):
        if not isinstance(pair, (tuple, list)) or len(pair) != 2:
            raise ValueError(f"edges[{i}][{k}] must be a pair (x, f_i(x)); got {pair!r}")
        pairs.append((pair[0], pair[1]))
    return pairs


def _vertex_of(x: Any, index: dict[Hashable, int], fixed: bool, where: str) -> int:
    try:
        v = index.get(x)
    except TypeError:
        raise TypeError(f"{where} holds an unhashable {type(x).__name__} {x!r}") from None
    if v is None:
        if fixed:
            raise ValueError(f"{where} names {x!r}, which is not among the labels")
        v = index[x] = len(index)
    return v


def build(
    n: int,
    size: int,
    edges: npt.NDArray[np.int64],
    weights: Any,
    labels: tuple[Hashable, ...] | None,
    degree: int | None,
    check_weights: bool,
    where: Callable[[int], str],
) -> Crystal:
    """The crystal of checked ``edges`` (E, 3) on ``size`` vertices; shared by every
    constructor and by the file readers (``where`` names the origin of an edge row)."""
    if labels is not None:
        if len(labels) != size:
            raise ValueError(f"labels must have one entry per vertex ({size}); got {len(labels)}")
        _label_index(labels)  # distinct and hashable, before any message shows them

    def show(v: int) -> str:
        return short_repr(labels[v]) if labels is not None else str(v)

    _check_table_size(n, size)
    checks.vertex_count(edges, size, where)
    f = checks.lowering_arrays(edges, n, size, where, show)
    if weights is not None and degree is not None:
        raise ValueError("degree normalises derived weights; give weights or degree, not both")
    if weights is None:
        if degree is not None:
            degree = check_int(degree, "degree")
        table = checks.derive_weights(f, n, size, degree, edges, where, show)
    else:
        table = checks.weight_table(weights, n, labels, size)
        if check_weights:
            checks.check_weight_changes(table, edges, where, show)
    e = checks.raising_arrays(f, size)  # f is checked: no need for Crystal to check it again
    if labels is None:
        return Crystal(n, size, lowering=f, raising=e, weights=table)
    return LabelledCrystal(n, labels, f, table, e)


def _check_table_size(n: int, size: int) -> None:
    # two int64 arrays per i, each with about 64 words of overhead, even for few vertices
    check_budget(
        (n - 1) * (size + 64) * 16, f"the operator arrays of {n - 1} colours i", "use a smaller n"
    )


def crystal_from_operators(
    n: int,
    lowering: Operator,
    seeds: Iterable[Hashable],
    raising: Operator | None = None,
    weight: Callable[[Any], Sequence[int]] | None = None,
    *,
    limit: int = 1_000_000,
    degree: int | None = None,
    check_weights: bool = True,
) -> LabelledCrystal:
    """The crystal generated from ``seeds`` by Python operators f_i (and e_i).

    Vertices are numbered in discovery order: the seeds in their order, then breadth first,
    applying to each vertex f_1, ..., f_{n-1} and then e_1, ..., e_{n-1}. The exploration stops
    with a ValueError after ``limit`` vertices, so it always ends (a single call that never
    returns cannot be interrupted from here; Ctrl-C still works).

    Parameters
    ----------
    n : int
        Weights have n entries and i runs over 1..n-1.
    lowering : callable or sequence of callables
        ``lowering(i, x)`` or ``lowering[i - 1](x)``: f_i(x), or None where f_i is undefined.
        Results must be hashable (tuples, not lists).
    seeds : iterable of hashables
        Where the exploration starts (for instance the highest weight vertices).
    raising : callable or sequence of callables, optional
        e_i in the same form; when given, the exploration also goes up, and e_i must be the
        partial inverse of f_i.
    weight : callable, optional
        ``weight(x)``: n integers. If omitted, weights are derived (module docstring).
    limit : int
        Most vertices explored (default 1,000,000).
    degree : int, optional
        Sum of the entries of every derived weight (instead of smallest entry 0).
    check_weights : bool
        Check wt(f_i x) = wt(x) - alpha_i on every edge for given weights (default True).

    Returns
    -------
    LabelledCrystal
        Labelled by the objects the operators act on.

    Raises
    ------
    TypeError
        For unhashable seeds or results, or operators that are not callables.
    ValueError
        An operator or ``weight`` that raises (chained, naming i and the vertex), more than
        ``limit`` vertices, f_i and e_i that disagree, or any check of :func:`crystal_from_edges`.

    Examples
    --------
    >>> import druse
    >>> from druse.user_crystal import crystal_from_operators
    >>> def f(i, word):  # the standard crystal on 1-letter words
    ...     return (word[0] + 1,) if word[0] == i else None
    >>> C = crystal_from_operators(3, f, [(1,)])
    >>> C.labels(), C.character() == druse.schur((1,), 3)
    (((1,), (2,), (3,)), True)
    """
    n = check_positive_int(n, "n")
    limit = check_positive_int(limit, "limit")
    _check_table_size(n, 0)
    found = explore(n, lowering, raising, seeds, limit)
    weights = None
    if weight is not None:
        weights = [found.call_weight(weight, x, n) for x in found.labels]
    crystal = build(
        n,
        len(found.labels),
        found.edge_array(),
        weights,
        tuple(found.labels),
        degree,
        check_weights,
        where=found.origin,
    )
    assert isinstance(crystal, LabelledCrystal)
    return crystal
