"""Embedding one component of a truncated crystal into the tableau crystal B(lambda).

A truncated crystal is a graph claimed to be a vertex subset I of a crystal B(lambda) with the
arrows of B(lambda) between vertices of I, and nothing else (the pipe-dream crystal is one:
Assaf-Schilling, "A Demazure crystal construction for Schubert polynomials", 2018). Given its
highest weight vertex u, the map to B(lambda) is forced: u goes to the highest weight tableau
and f_i x to f_i of the image of x. So a walk along the component's f arrows finds the only
candidate; it is an embedding exactly when every arrow of the component goes to the arrow of the
same colour in B(lambda), weights agree and no two vertices share an image, and the truncation
is honest when every arrow of B(lambda) between two images is an arrow of the component.

B(lambda) itself is never enumerated: it can be far larger than the component (the one pipe
dream of the longest element of S_7 has lambda = (6, 5, 4, 3, 2, 1), and B(lambda) 2^21
tableaux). The walk holds the image tableaux and asks the tableau model for f_i and e_i on them
only, the targets coming back as vertex numbers of ``druse.crystal(lambda, n)``. The Demazure
test then runs on a local table of the image plus one *exit* per arrow leaving it.
"""

from __future__ import annotations

import itertools
from dataclasses import dataclass, replace

import numpy as np
import numpy.typing as npt

from druse.crystal import Crystal
from druse.recognition import (
    DemazurePiece,
    DemazureRecognition,
    DemazureWitness,
    _Component,
    _Local,
    _piece,
)
from druse.tableaux import tableau_model

IntArray = npt.NDArray[np.int64]
BoolArray = npt.NDArray[np.bool_]
Cells = npt.NDArray[np.uint8]


@dataclass(frozen=True)
class Mismatch:
    """Why a component is not an honest truncation of B(lambda); vertices are local (positions
    in the component's ascending vertex list) and ``model`` a vertex of B(lambda)."""

    kind: str
    vertex: int
    other: int | None = None
    i: int | None = None
    model: int | None = None
    detail: str = ""


@dataclass(frozen=True)
class Embedded:
    """A component embedded in B(lambda) as a local table for Demazure closures.

    Local vertices 0..k-1 are the component's (ascending), k.. are *exits*: one per arrow f_i of
    B(lambda) from an image to a vertex outside the image, so that a closure reaching an exit
    has left the image. ``images[v]`` is the vertex of B(lambda) of local vertex v.
    """

    images: IntArray
    lowering: list[IntArray]
    cut: Mismatch | None


class _Model:
    """The tableau model of B(lambda) with the operators evaluated on some tableaux."""

    def __init__(self, lam: tuple[int, ...], n: int) -> None:
        self.n = n
        self.core = tableau_model(tuple(x for x in lam if x), n)
        top = [r + 1 for r, part in enumerate(lam) for _ in range(part)]
        self.top_cells = np.array([top], dtype=np.uint8).reshape(1, len(top))
        self.top = int(self.core.rank(top))

    def arrows(self, cells: Cells, ranks: IntArray, i: int) -> tuple[IntArray, IntArray]:
        """f_i and e_i (vertex numbers of B(lambda), or -1) of the tableaux ``cells`` of
        vertices ``ranks``. The kernel gives each target as the row's position plus the rank
        difference, so the rank of the source is put back, and phi_i, epsilon_i say which
        targets exist. (One call per i: the all-i kernel builds tables for every level and
        costs more on the small batches met here.)"""
        f, e, phi, eps = self.core.operator(np.ascontiguousarray(cells), i)
        shift = ranks - np.arange(ranks.size)
        return np.where(phi > 0, f + shift, -1), np.where(eps > 0, e + shift, -1)

    def cells_of(self, ranks: IntArray) -> Cells:
        width = self.top_cells.shape[1]
        raw = b"".join(bytes(self.core.unrank(int(r))) for r in ranks)
        return np.frombuffer(raw, dtype=np.uint8).reshape(ranks.size, width).copy()


def embed(
    crystal: Crystal, vertices: IntArray, position: IntArray, top: int, model: _Model
) -> Embedded | Mismatch:
    """Embed the component ``vertices`` (ascending; ``position[v]`` is the place of v in its
    component, -1 at slot -1; ``top`` its highest weight vertex, local) into B(lambda) of
    ``model``, or say where it fails (checks in the module docstring)."""
    ops = range(1, crystal.n)
    f_here = [position[crystal.f(i)[vertices]] for i in ops]
    e_here = [position[crystal.e(i)[vertices]] for i in ops]
    ranks, cells = _walk(model, f_here, top, vertices.size)
    reached = np.flatnonzero(ranks >= 0)
    f_model, e_model = _model_arrows(model, cells, ranks, reached)
    bad = _arrow_mismatch(f_here, f_model, ranks, "f", reached)
    if bad is None and reached.size < vertices.size:
        bad = Mismatch(
            "not_reached",
            int(np.flatnonzero(ranks < 0)[0]),
            detail="no path of f arrows leads to it from the highest weight vertex",
        )
    bad = bad or _arrow_mismatch(e_here, e_model, ranks, "e", reached)
    bad = bad or _weight_mismatch(model, crystal, vertices, ranks, cells)
    bad = bad or _shared_image(ranks)
    order = np.argsort(ranks, kind="stable")
    f_local = [_local(ranks, order, fm) for fm in f_model]
    e_local = [_local(ranks, order, em) for em in e_model]
    bad = (
        bad
        or _dishonest(f_here, f_local, f_model, "f")
        or _dishonest(e_here, e_local, e_model, "e")
    )
    if bad is not None:
        return bad
    return _table(ranks, f_local, f_model, e_local, e_model)


def _walk(model: _Model, f_here: list[IntArray], top: int, size: int) -> tuple[IntArray, Cells]:
    """Images of the vertices reached from ``top`` along f arrows (-1 elsewhere), level by
    level: a vertex first reached as f_i x gets f_i of the image of x (smallest i, then x)."""
    ranks = np.full(size, -1, dtype=np.int64)
    cells = np.zeros((size, model.top_cells.shape[1]), dtype=np.uint8)
    ranks[top], cells[top] = model.top, model.top_cells[0]
    frontier = np.array([top], dtype=np.int64)
    while frontier.size:
        found = []
        for i, f in enumerate(f_here, start=1):
            targets = f[frontier]
            fresh = targets >= 0
            fresh[fresh] = ranks[targets[fresh]] < 0
            if not fresh.any():
                continue
            sources = frontier[fresh]
            images = model.arrows(cells[sources], ranks[sources], i)[0]
            keep = images >= 0  # an arrow B(lambda) lacks: reported by _arrow_mismatch
            new, first = np.unique(targets[fresh][keep], return_index=True)
            ranks[new] = images[keep][first]
            cells[new] = model.cells_of(ranks[new])
            found.append(new)
        frontier = np.unique(np.concatenate(found)) if found else np.zeros(0, dtype=np.int64)
    return ranks, cells


def _model_arrows(
    model: _Model, cells: Cells, ranks: IntArray, reached: IntArray
) -> tuple[list[IntArray], list[IntArray]]:
    """f_i and e_i of B(lambda) at the image of every reached vertex (-1 at the others)."""
    lowering: list[IntArray] = []
    raising: list[IntArray] = []
    for i in range(1, model.n):
        f, e = model.arrows(cells[reached], ranks[reached], i)
        for out, got in ((lowering, f), (raising, e)):
            full = np.full(ranks.size, -1, dtype=np.int64)
            full[reached] = got
            out.append(full)
    return lowering, raising


def _arrow_mismatch(
    here: list[IntArray], there: list[IntArray], ranks: IntArray, op: str, reached: IntArray
) -> Mismatch | None:
    """The first arrow x -> y of the component (smallest i, then x) whose image is not the arrow
    of the same colour in B(lambda)."""
    on = np.zeros(ranks.size, dtype=np.bool_)
    on[reached] = True
    for i, (h, t) in enumerate(zip(here, there, strict=True), start=1):
        safe = np.where(h >= 0, h, 0)
        bad = np.flatnonzero(on & (h >= 0) & ((t < 0) | (t != ranks[safe])))
        if bad.size:
            x = int(bad[0])
            y, image = int(h[x]), int(t[x])
            where = "undefined" if image < 0 else f"vertex {image}"
            target = "no image" if ranks[y] < 0 else f"image {int(ranks[y])}"
            return Mismatch(
                "arrow_not_in_model",
                x,
                y,
                i,
                None if image < 0 else image,
                f"{op}_{i} of its image {int(ranks[x])} in B(lambda) is {where}, but the crystal "
                f"has the arrow {op}_{i} to a vertex with {target}",
            )
    return None


def _weight_mismatch(
    model: _Model, crystal: Crystal, vertices: IntArray, ranks: IntArray, cells: Cells
) -> Mismatch | None:
    given = np.asarray(crystal.weights()[vertices], dtype=np.int64)
    image = np.asarray(model.core.weights(cells), dtype=np.int64)
    bad = np.flatnonzero((given != image).any(axis=1))
    if not bad.size:
        return None
    x = int(bad[0])
    return Mismatch(
        "weight_differs",
        x,
        model=int(ranks[x]),
        detail=f"its weight is {tuple(given[x].tolist())}, its image's {tuple(image[x].tolist())}",
    )


def _shared_image(ranks: IntArray) -> Mismatch | None:
    order = np.argsort(ranks, kind="stable")
    same = np.flatnonzero(ranks[order][1:] == ranks[order][:-1])
    if not same.size:
        return None
    x, y = int(order[same[0]]), int(order[same[0] + 1])
    return Mismatch("not_injective", x, y, model=int(ranks[x]), detail="both map to one vertex")


def _local(ranks: IntArray, order: IntArray, targets: IntArray) -> IntArray:
    """Local vertex whose image is each target; -1 for no target, -2 for one outside the image."""
    sorted_ranks = ranks[order]
    at = np.minimum(np.searchsorted(sorted_ranks, targets), max(ranks.size - 1, 0))
    hit = (targets >= 0) & (sorted_ranks[at] == targets)
    return np.where(hit, order[at], np.where(targets >= 0, -2, -1))


def _dishonest(
    here: list[IntArray], local: list[IntArray], there: list[IntArray], op: str
) -> Mismatch | None:
    """The first arrow of B(lambda) between two images that the component lacks."""
    for i, (h, loc, t) in enumerate(zip(here, local, there, strict=True), start=1):
        bad = np.flatnonzero((loc >= 0) & (h != loc))
        if bad.size:
            x = int(bad[0])
            return Mismatch(
                "missing_arrow",
                x,
                int(loc[x]),
                i,
                int(t[x]),
                f"B(lambda) has {op}_{i} from its image to the image of the other vertex; "
                f"the crystal has no such {op}_{i} arrow",
            )
    return None


def _table(
    ranks: IntArray,
    f_local: list[IntArray],
    f_model: list[IntArray],
    e_local: list[IntArray],
    e_model: list[IntArray],
) -> Embedded:
    """The local lowering table with exits, and the first cut string (smallest i, then x)."""
    size = ranks.size
    exits = [np.flatnonzero(loc == -2) for loc in f_local]
    images = np.concatenate([ranks, *(fm[out] for fm, out in zip(f_model, exits, strict=True))])
    lowering, start = [], size
    for loc, out in zip(f_local, exits, strict=True):
        table = np.full(images.size, -1, dtype=np.int64)
        table[:size] = loc
        table[out] = np.arange(start, start + out.size)
        start += out.size
        lowering.append(table)
    cut = None
    for i, (fl, el, em, fm) in enumerate(
        zip(f_local, e_local, e_model, f_model, strict=True), start=1
    ):
        above_out, below_out = el == -2, (el != -1) & (fl == -2)
        bad = np.flatnonzero(above_out | below_out)
        if bad.size:
            x = int(bad[0])
            other = int(em[x]) if above_out[x] else int(fm[x])
            cut = Mismatch("cut_string", x, None, i, other)
            break
    return Embedded(images, lowering, cut)


def truncated_recognition(crystal: Crystal) -> DemazureRecognition:
    """:func:`druse.recognition.demazure_recognition` with no mask: one piece per component of
    ``crystal``, by ascending smallest vertex."""
    try:
        weights = crystal.weights()
    except NotImplementedError:
        raise ValueError("crystal has no weights: truncated recognition needs them") from None
    labels = crystal.components()
    order = np.argsort(labels, kind="stable")  # stable: ascending within each component
    starts = np.flatnonzero(np.r_[True, labels[order][1:] != labels[order][:-1]])[: order.size]
    bounds = np.r_[starts, order.size]
    position = np.full(len(crystal) + 1, -1, dtype=np.int64)  # slot -1 keeps -1 as -1
    position[order] = np.arange(order.size) - np.repeat(starts, np.diff(bounds))
    is_top = np.zeros(len(crystal), dtype=np.bool_)
    is_top[crystal.highest_weights()] = True
    found = _Found(crystal, weights, position, {})
    pieces = []
    for a, b in itertools.pairwise(bounds):
        vertices = order[a:b].astype(np.int64)
        pieces.append(_truncated_piece(found, vertices, is_top[vertices]))
    return DemazureRecognition(tuple(pieces))


@dataclass(frozen=True)
class _Found:
    """What every component's embedding shares: the crystal, its weights, each vertex's place
    in its component, and the tableau models met so far (by lambda)."""

    crystal: Crystal
    weights: npt.NDArray[np.int32]
    position: IntArray
    models: dict[tuple[int, ...], _Model]

    def model(self, lam: tuple[int, ...]) -> _Model:
        if lam not in self.models:
            self.models[lam] = _Model(lam, self.crystal.n)
        return self.models[lam]


def _truncated_piece(found: _Found, vertices: IntArray, is_top: BoolArray) -> DemazurePiece:
    crystal, weights = found.crystal, found.weights
    size = int(vertices.size)
    tops = np.flatnonzero(is_top)
    if tops.size == 0:
        why = "every vertex of the component has some e_i defined"
        return DemazurePiece(
            -1,
            (),
            size,
            False,
            witness=_named(vertices, Mismatch("no_highest_weight", 0, detail=why)),
        )
    top = int(tops[0])
    lam = tuple(int(x) for x in weights[vertices[top]])
    bad = None
    if tops.size > 1:
        bad = Mismatch(
            "two_highest_weights", top, int(tops[1]), detail="both are killed by every e_i"
        )
    elif min(lam, default=0) < 0 or any(x < y for x, y in itertools.pairwise(lam)):
        bad = Mismatch("not_partition", top, detail=f"its weight {lam} is not a partition")
    got = bad or embed(crystal, vertices, found.position, top, found.model(lam))
    if isinstance(got, Mismatch):
        return DemazurePiece(int(vertices[top]), lam, size, False, witness=_named(vertices, got))
    exits = got.images.size - size
    local_vertices = np.concatenate([vertices, np.full(exits, -1, dtype=np.int64)])
    comp = _Component(got.lowering, local_vertices, got.images)
    inside = np.arange(got.images.size) < size
    wt = np.concatenate([weights[vertices], np.zeros((exits, crystal.n), dtype=np.int32)])
    cut = None if got.cut is None else _named(vertices, got.cut)
    piece = _piece(_Local(comp, top, inside, wt), int(vertices[top]), lam, cut)
    return replace(piece, embedding=_frozen(got.images[:size].copy()))


def _named(vertices: IntArray, bad: Mismatch) -> DemazureWitness:
    """The witness for a mismatch on local vertices, in the crystal's vertex numbers."""
    other = None if bad.other is None else int(vertices[bad.other])
    return DemazureWitness(
        bad.kind, int(vertices[bad.vertex]), other, bad.i, model_vertex=bad.model, detail=bad.detail
    )


def _frozen(a: IntArray) -> IntArray:
    a.flags.writeable = False
    return a
