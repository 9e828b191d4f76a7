"""Structure of a crystal: its components with their highest weights, and the explicit
isomorphism of a connected crystal (or one component) to the tableau crystal B(lambda).

A connected crystal of a representation of GL_n has one highest weight vertex, whose weight
lambda is dominant, and is isomorphic to B(lambda) (Kashiwara, "On crystal bases of the
q-analogue of universal enveloping algebras", 1991; Kashiwara-Nakashima 1994 for the tableau
model). The isomorphism is found by walking from both highest weight vertices along the same
f_i arrows at once, then every arrow and weight is compared through the map.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass, field

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import check_int
from druse.crystal import Crystal, crystal

__all__ = ["Component", "decompose", "tableau_isomorphism"]

IntArray = npt.NDArray[np.int64]


@dataclass(frozen=True)
class Component:
    """One connected component of a crystal.

    Attributes
    ----------
    highest_weight : int
        Its highest weight vertex (the one vertex killed by every e_i).
    weight : tuple of int
        The weight of that vertex (lambda, up to a shift by (k, ..., k) if it has negative parts).
    vertices : numpy int64 array
        Its vertices, ascending (read-only).
    size : int
        The number of vertices.
    """

    highest_weight: int
    weight: tuple[int, ...]
    vertices: IntArray = field(compare=False, hash=False, repr=False)
    size: int

    @property
    def shift(self) -> int:
        """k >= 0, as small as possible, with weight + (k, ..., k) free of negative parts: the
        shift :func:`tableau_isomorphism` applies before comparing with B(lambda)."""
        return max(0, -min(self.weight, default=0))

    def mask(self, total: int) -> npt.NDArray[np.bool_]:
        """The component as a bool mask over the ``total`` vertices of its crystal."""
        m = np.zeros(total, dtype=np.bool_)
        m[self.vertices] = True
        return m


def decompose(C: Crystal) -> list[Component]:
    """The connected components of ``C``, ordered by their smallest vertex.

    Parameters
    ----------
    C : druse.Crystal
        A crystal with weights.

    Returns
    -------
    list of Component

    Raises
    ------
    ValueError
        If ``C`` has no weights, or a component does not have exactly one highest weight vertex
        (then it is not the crystal of a representation; the message names the vertices).

    Examples
    --------
    >>> import druse
    >>> [c.weight for c in druse.decompose(druse.crystal((2, 1), 3))]
    [(2, 1, 0)]
    """
    _check_crystal_arg(C)
    weights = _weights(C)
    labels = C.components()
    tops = C.highest_weights()
    sizes = np.bincount(labels, minlength=0) if labels.size else np.zeros(0, dtype=np.int64)
    top_of = np.full(sizes.size, -1, dtype=np.int64)
    for v in tops.tolist():
        if top_of[labels[v]] >= 0:
            raise ValueError(
                f"the component of vertex {v} has two highest weight vertices, "
                f"{int(top_of[labels[v]])} and {v}: it is not the crystal of a representation"
            )
        top_of[labels[v]] = v
    members = np.split(np.argsort(labels, kind="stable"), np.cumsum(sizes)[:-1])
    parts = []
    for k, vertices in enumerate(members):
        if top_of[k] < 0:
            raise ValueError(
                f"the component of vertex {int(vertices[0])} has no highest weight vertex "
                "(its e_i arrows go round in a cycle)"
            )
        vertices = vertices.astype(np.int64)
        vertices.flags.writeable = False
        top = int(top_of[k])
        weight = tuple(int(x) for x in weights[top])
        parts.append(Component(top, weight, vertices, int(vertices.size)))
    return parts


def tableau_isomorphism(
    C: Crystal, component: Component | int | None = None
) -> tuple[tuple[int, ...], IntArray]:
    """An explicit isomorphism from a connected crystal (or one component) to B(lambda).

    lambda is the weight of the highest weight vertex. If its last part is negative, every
    weight is first raised by k = -(last part), so that lambda = wt + (k, ..., k) is a
    partition; then a vertex of weight w maps to a tableau of weight w + (k, ..., k).

    Parameters
    ----------
    C : druse.Crystal
        A crystal with weights.
    component : Component, int or None
        The component to map (a :class:`Component` of ``decompose(C)``, or its position in that
        list); None maps all of ``C``, which must then be connected.

    Returns
    -------
    (lambda, mapping)
        lambda as a partition (without trailing zeros), and an int64 array: ``mapping[k]`` is
        the vertex of ``druse.crystal(lambda, C.n)`` that the k-th vertex of the component
        (ascending; all of ``C`` when ``component`` is None) maps to.

    Raises
    ------
    ValueError
        If there is no isomorphism: the highest weight is not dominant, or the walk finds a
        vertex whose arrows or weight differ from its image (the message names the vertex, i
        and what differs), or ``C`` is not connected when ``component`` is None.

    Examples
    --------
    >>> import druse
    >>> C = druse.crystal((2, 1), 3)
    >>> shape, mapping = druse.tableau_isomorphism(C)
    >>> shape, mapping.tolist() == list(range(len(C)))
    ((2, 1), True)
    """
    _check_crystal_arg(C)
    weights = _weights(C)
    part = _choose(C, component)
    top = part.highest_weight if part is not None else C.highest_weight()
    shape, shift = _dominant(top, tuple(int(x) for x in weights[top]))
    model = crystal(shape, C.n)
    model.operator_tables()
    ops = range(1, C.n)
    source = ([C.f(i) for i in ops], [C.e(i) for i in ops], weights)
    target = ([model.f(i) for i in ops], [model.e(i) for i in ops], model.weights())
    full, miss = _core.model_map(C.n, source, top, target, model.highest_weight(), -shift)
    if miss is not None or full is None:
        vertex, i, detail = miss if miss is not None else (top, 0, "no map")
        where = f"vertex {vertex}" + (f", i = {i}" if i else "")
        raise ValueError(f"no isomorphism to B{shape} of GL_{C.n}: at {where}: {detail}")
    if part is not None:
        return shape, full[part.vertices]
    outside = np.flatnonzero(full < 0)
    if outside.size:
        raise ValueError(
            f"C is not connected: vertex {int(outside[0])} is not in the component of the "
            f"highest weight vertex {top}; pass one of druse.decompose(C) as component"
        )
    return shape, full


def _check_crystal_arg(C: object) -> None:
    if not isinstance(C, Crystal):
        raise TypeError(f"C must be a druse.Crystal; got {type(C).__name__}")


def _weights(C: Crystal) -> npt.NDArray[np.int32]:
    try:
        return np.ascontiguousarray(C.weights(), dtype=np.int32)
    except NotImplementedError:
        raise ValueError("C has no weights: build it with weights=...") from None


def _choose(C: Crystal, component: Component | int | None) -> Component | None:
    if component is None or isinstance(component, Component):
        return component
    parts = decompose(C)
    k = check_int(component, "component")
    if not 0 <= k < len(parts):
        raise ValueError(f"component must be in 0..{len(parts) - 1}; got {k}")
    return parts[k]


def _dominant(top: int, weight: Sequence[int]) -> tuple[tuple[int, ...], int]:
    """(lambda, k): lambda = weight + (k, ..., k) a partition, k >= 0 as small as possible."""
    for r in range(len(weight) - 1):
        if weight[r] < weight[r + 1]:
            raise ValueError(
                f"the highest weight vertex {top} has weight {tuple(weight)}, which is not "
                f"dominant (part {r + 1} is smaller than part {r + 2}): no B(lambda) has it"
            )
    shift = max(0, -weight[-1]) if weight else 0
    shape = [w + shift for w in weight]
    while shape and shape[-1] == 0:
        shape.pop()
    return tuple(shape), shift
