"""Demazure recognition: is a vertex subset of a crystal a Demazure crystal in each component?

For a component B(lambda) (highest weight vertex u, weight lambda dominant) and a subset M of it,
M is the Demazure crystal B_w(lambda) = D_{i1}(... D_{ik}({u})) of some w exactly when it is
found by this test:

1. *Strings.* A Demazure crystal meets every i-string in the empty set, the whole string, or its
   top element only (Kashiwara, "The crystal base and Littelmann's refined Demazure character
   formula", 1993, Prop. 3.3.5; Littelmann, "Crystal graphs and Young tableaux", 1995). So a
   vertex x of M with e_i x defined but outside M, or with e_i x defined and f_i x defined but
   outside M, is a witness against M ("cut_string").
2. *The candidate.* Extremal vertices of B(lambda) are the vertices of weight v.lambda, one for
   each composition alpha = v.lambda (weight multiplicity one). B_w(lambda) contains the one of
   weight v.lambda exactly when v <= w in Bruhat order (modulo the stabiliser of lambda), so if
   M = B_w(lambda), the extremal weight in M with the most inversions (pairs j < k with
   alpha_j < alpha_k, the length of the shortest v with v.lambda = alpha) is unique and equals
   w.lambda. Its Demazure crystal is computed with the closure kernel and compared with M.
3. *Witnesses otherwise.* For each extremal vertex x of M (weight alpha), any Demazure crystal
   containing x contains B_v(lambda) for the shortest v with v.lambda = alpha; a vertex of that
   crystal outside M is a witness ("closure_leaves"). If all of them lie inside M, their union
   is the union of all Demazure crystals inside M: a vertex of M outside it is reached by no
   Demazure closure inside the mask ("unreached"); if there is none, M is a union of several
   Demazure crystals but not one ("union", with two incomparable extremal vertices).

The components are assumed to be highest weight crystals B(lambda) (each has exactly one
highest weight vertex, of dominant weight; that much is checked here). The key expansion of the
mask's character, when every piece is Demazure, is the sum of key(w.lambda) over the pieces.

*Truncated crystals.* With no mask, the crystal itself is taken to be a union of vertex subsets
of crystals B(lambda), each with the arrows of B(lambda) inside it (f_i = -1 where the full
operator would leave): the crystal on pipe dreams of Assaf-Schilling, "A Demazure crystal
construction for Schubert polynomials", 2018, is one. Each component is embedded into
B(lambda) by the forced map (highest weight vertex to highest weight tableau, f_i to f_i;
:mod:`druse._embedding`), the embedding and the honesty of the truncation are checked, and the
image is put through the test above, with B(lambda) evaluated only at the image and its
neighbours.
"""

from __future__ import annotations

import itertools
from collections.abc import Iterator
from dataclasses import dataclass, field

import numpy as np
import numpy.typing as npt

from druse import _core
from druse.crystal import Crystal
from druse.demazure import reduced_word
from druse.errors import InternalError
from druse.key import shortest_permutation

IntArray = npt.NDArray[np.int64]
BoolArray = npt.NDArray[np.bool_]
Composition = tuple[int, ...]


@dataclass(frozen=True)
class DemazureWitness:
    """Why a mask restricted to one component is not a Demazure crystal.

    Attributes
    ----------
    kind : str
        ``"cut_string"``: ``vertex`` is in the mask, ``other`` is on its ``i``-string outside the
        mask, and the mask meets that string in a set that is not empty, whole or its top.
        ``"closure_leaves"``: ``vertex`` is an extremal vertex in the mask, of weight ``key``;
        every Demazure crystal containing it contains ``other``, which is outside the mask.
        ``"unreached"``: ``vertex`` is in the mask and in no Demazure crystal inside the mask.
        ``"union"``: the mask is the union of the Demazure crystals of several incomparable
        extremal vertices, among them ``vertex`` and ``other``; no single one contains it.
    vertex, other : int or None
        Vertices of the crystal (not of the component).
    i : int or None
        The operator index for ``"cut_string"``.
    key : tuple of int or None
        The weight of ``vertex`` when it is extremal.
    model_vertex : int or None
        Truncated crystals only (``mask=None``): a vertex of B(lambda), numbered as in
        ``druse.crystal(lambda, n)``: the one ``other`` would be when it lies outside the given
        crystal (``other`` is then None), or the image of ``vertex`` for the embedding kinds.
    detail : str
        What differs, for the embedding kinds (empty otherwise).

    The truncated route adds kinds for a component that is not a truncation of B(lambda):
    ``"no_highest_weight"`` (every vertex has some e_i), ``"two_highest_weights"`` (``vertex``
    and ``other`` are both killed by every e_i), ``"not_partition"`` (the weight of the highest
    weight vertex is not a partition), ``"arrow_not_in_model"`` (the arrow ``vertex`` --i-->
    ``other``, by f_i or e_i as ``detail`` says, does not map to the arrow of B(lambda)),
    ``"not_reached"`` (no f path from the highest weight vertex), ``"weight_differs"`` (weight
    of ``vertex`` and of its image), ``"not_injective"`` (``vertex`` and ``other`` have one
    image) and ``"missing_arrow"`` (B(lambda) has the arrow from the image of ``vertex`` to that
    of ``other``; the crystal has not: a dishonest truncation).
    """

    kind: str
    vertex: int
    other: int | None = None
    i: int | None = None
    key: Composition | None = None
    model_vertex: int | None = None
    detail: str = ""


@dataclass(frozen=True)
class DemazurePiece:
    """The mask inside one connected component of the crystal.

    Attributes
    ----------
    highest_weight : int
        The component's highest weight vertex u_lambda.
    weight : tuple of int
        lambda, its weight (length n).
    size : int
        Number of mask vertices in the component.
    is_demazure : bool
        Whether the mask restricted to the component is a Demazure crystal B_w(lambda).
    perm : tuple of int or None
        The shortest such w, in one-line notation.
    word : tuple of int or None
        A reduced word of ``perm`` (druse's canonical one).
    key : tuple of int or None
        The composition w.lambda, (w.lambda)_{w(j)} = lambda_j: the character is key(w.lambda).
    witness : DemazureWitness or None
        Why not, when ``is_demazure`` is False.
    embedding : numpy int64 array or None
        Truncated crystals only: the vertex of ``druse.crystal(weight, n)`` of each vertex of
        the component (ascending), when the component embeds.

    A component of a truncated crystal with no highest weight vertex has ``highest_weight``
    -1 and ``weight`` ().
    """

    highest_weight: int
    weight: Composition
    size: int
    is_demazure: bool
    perm: tuple[int, ...] | None = None
    word: tuple[int, ...] | None = None
    key: Composition | None = None
    witness: DemazureWitness | None = None
    embedding: IntArray | None = field(default=None, compare=False, repr=False)


@dataclass(frozen=True)
class DemazureRecognition:
    """One :class:`DemazurePiece` per component meeting the mask, by ascending smallest vertex.

    Iterating, ``len`` and indexing go through ``pieces``.
    """

    pieces: tuple[DemazurePiece, ...]

    @property
    def is_demazure(self) -> bool:
        """Whether the mask is a Demazure crystal in every component it meets."""
        return all(p.is_demazure for p in self.pieces)

    def key_expansion(self) -> dict[Composition, int] | None:
        """The character of the mask as sum of key(w.lambda) over the pieces, as a dict
        composition -> multiplicity (None unless every piece is Demazure)."""
        if not self.is_demazure:
            return None
        out: dict[Composition, int] = {}
        for p in self.pieces:
            assert p.key is not None  # set on every Demazure piece
            out[p.key] = out.get(p.key, 0) + 1
        return dict(sorted(out.items(), key=lambda t: tuple(reversed(t[0])), reverse=True))

    def __iter__(self) -> Iterator[DemazurePiece]:
        return iter(self.pieces)

    def __len__(self) -> int:
        return len(self.pieces)

    def __getitem__(self, k: int) -> DemazurePiece:
        return self.pieces[k]


def _mask(crystal: Crystal, mask: npt.ArrayLike) -> BoolArray:
    m = np.asarray(mask)
    if m.dtype != np.bool_:
        raise TypeError(f"mask must be a boolean array; got dtype {m.dtype}")
    if m.shape != (len(crystal),):
        raise ValueError(f"mask must have shape ({len(crystal)},); got {m.shape}")
    return np.ascontiguousarray(m)


def _cut_strings(crystal: Crystal, m: BoolArray, labels: IntArray) -> dict[int, DemazureWitness]:
    """The first cut string witness (smallest i, then smallest vertex) in each component."""
    found: dict[int, DemazureWitness] = {}
    for i in range(1, crystal.n):
        e, f = crystal.e(i), crystal.f(i)
        above_out = (e >= 0) & ~m[e]  # m[-1] is read where e = -1, but masked by e >= 0
        below_out = (e >= 0) & (f >= 0) & ~m[f]
        for bad, other in ((above_out, e), (below_out, f)):
            xs = np.flatnonzero(m & bad)
            firsts = np.unique(labels[xs], return_index=True)[1]
            for x in xs[firsts]:
                label = int(labels[x])
                old = found.get(label)
                if old is None or (old.i == i and int(x) < old.vertex):
                    found[label] = DemazureWitness("cut_string", int(x), int(other[x]), i)
    return found


def _inversions(weights: npt.NDArray[np.int32]) -> IntArray:
    """Per row alpha: pairs j < k with alpha_j < alpha_k (length of the shortest v, v.lambda)."""
    n = weights.shape[1]
    total = np.zeros(weights.shape[0], dtype=np.int64)
    for j in range(n):
        for k in range(j + 1, n):
            total += weights[:, j] < weights[:, k]
    return total


class _Component:
    """One component as its own small table (local vertex numbers), for closures.

    ``vertices[v]`` is the crystal's vertex at local v, or -1 for a vertex outside the crystal
    (an exit of a truncated crystal into B(lambda)); ``images[v]`` is then its vertex there.
    """

    def __init__(
        self, ops: list[IntArray], vertices: IntArray, images: IntArray | None = None
    ) -> None:
        self.ops = ops
        self.vertices = vertices
        self.images = images

    @classmethod
    def of_crystal(cls, crystal: Crystal, vertices: IntArray, position: IntArray) -> _Component:
        ops = [np.ascontiguousarray(position[crystal.f(i)[vertices]]) for i in range(1, crystal.n)]
        return cls(ops, vertices)

    def closure(self, top: int, alpha: Composition) -> tuple[BoolArray, tuple[int, ...]]:
        w = shortest_permutation(alpha)
        word = reduced_word(w)
        local = _core.demazure_closure(self.ops, self.vertices.size, [top], list(word))
        return local, w

    def witness(
        self, kind: str, x: int, other: int | None = None, key: Composition | None = None
    ) -> DemazureWitness:
        """A witness on local vertices, named by the crystal's (or B(lambda)'s) vertices."""
        if other is None or self.vertices[other] >= 0:
            named = None if other is None else int(self.vertices[other])
            return DemazureWitness(kind, int(self.vertices[x]), named, key=key)
        assert self.images is not None  # only truncated crystals have exits
        image = int(self.images[other])
        return DemazureWitness(kind, int(self.vertices[x]), key=key, model_vertex=image)


def demazure_recognition(
    crystal: Crystal, mask: npt.ArrayLike | None = None
) -> DemazureRecognition:
    """Decide, component by component, whether ``mask`` is a Demazure crystal B_w(lambda); or,
    with no mask, whether a truncated crystal is a union of Demazure crystals.

    Parameters
    ----------
    crystal : Crystal
        With a mask: any druse crystal whose components are highest weight crystals B(lambda).
        Without: a crystal-like graph whose arrows may stop short (f_i = -1 where the full
        operator would leave the set), such as :func:`druse.pipe_dream_crystal`.
    mask : array of bool, shape (len(crystal),), optional
        The vertex subset. None: each component of ``crystal`` is embedded into
        B(lambda) (lambda the weight of its vertex killed by every e_i), checked to be the
        subgraph of B(lambda) induced on its image (every arrow maps to the arrow of the same
        colour, weights agree, no two vertices share an image, and every arrow of B(lambda)
        between images is present), and its image is recognised in B(lambda) as with a mask.
        A component that fails gets a witness naming vertices, i and what differs; B(lambda)
        is never enumerated, only evaluated on the image (module ``druse._embedding``).

    Returns
    -------
    DemazureRecognition
        One piece per component meeting the mask, with w, a reduced word and the key w.lambda,
        or a witness; and the key expansion of the mask's character when all are Demazure.
        Pieces name vertices of ``crystal``; ``model_vertex`` of a witness names one of
        ``druse.crystal(lambda, n)`` that has no counterpart in a truncated crystal.

    Raises
    ------
    TypeError, ValueError
        If crystal is not a Crystal, mask is not a bool array of the right shape, or a component
        meeting the mask does not have exactly one highest weight vertex of dominant weight
        (with a mask; without one, that is a witness).

    Examples
    --------
    >>> import druse
    >>> from druse.recognition import demazure_recognition
    >>> C = druse.crystal((2, 1), 3)
    >>> piece = demazure_recognition(C, C.demazure((2, 1)))[0]
    >>> piece.is_demazure, piece.perm, piece.key
    (True, (3, 1, 2), (1, 0, 2))
    >>> P = druse.pipe_dream_crystal((2, 1, 4, 3))
    >>> [p.perm for p in demazure_recognition(P)]
    [(1, 3, 2, 4), (1, 2, 3, 4)]
    >>> demazure_recognition(P).key_expansion()
    {(1, 0, 1, 0): 1, (2, 0, 0, 0): 1}
    """
    if not isinstance(crystal, Crystal):
        raise TypeError(f"crystal must be a druse Crystal; got {type(crystal).__name__}")
    if mask is None:
        from druse._embedding import truncated_recognition  # it imports this module

        return truncated_recognition(crystal)
    m = _mask(crystal, mask)
    labels = crystal.components()
    cuts = _cut_strings(crystal, m, labels)
    tops: dict[int, list[int]] = {}
    for v in crystal.highest_weights():
        tops.setdefault(int(labels[v]), []).append(int(v))
    order = np.argsort(labels, kind="stable")
    starts = np.flatnonzero(np.r_[True, labels[order][1:] != labels[order][:-1]])
    bounds = np.r_[starts, order.size]
    position = np.full(len(crystal) + 1, -1, dtype=np.int64)  # slot -1 keeps -1 as -1
    weights = crystal.weights()
    pieces = []
    for a, b in itertools.pairwise(bounds):
        vertices = order[a:b]
        if not m[vertices].any():
            continue
        position[vertices] = np.arange(vertices.size)
        top = _top_of(int(vertices[0]), tops.get(int(labels[vertices[0]]), []), weights)
        cut = cuts.get(int(labels[vertices[0]]))
        comp = _Component.of_crystal(crystal, vertices, position)
        local = _Local(comp, int(position[top]), m[vertices], weights[vertices])
        pieces.append(_piece(local, top, tuple(int(x) for x in weights[top]), cut))
    return DemazureRecognition(tuple(pieces))


def _top_of(label: int, tops: list[int], weights: npt.NDArray[np.int32]) -> int:
    if len(tops) != 1:
        raise ValueError(
            f"the component of vertex {label} has {len(tops)} highest weight vertices; "
            "Demazure recognition needs components B(lambda), with exactly one"
        )
    lam = weights[tops[0]].tolist()
    if any(x < y for x, y in itertools.pairwise(lam)):
        raise ValueError(f"the highest weight vertex {tops[0]} has weight {lam}, not dominant")
    return tops[0]


@dataclass(frozen=True)
class _Local:
    """A component's table with its highest weight vertex, mask and weights (local numbers)."""

    comp: _Component
    top: int
    inside: BoolArray
    wt: npt.NDArray[np.int32]


def _piece(local: _Local, top: int, lam: Composition, cut: DemazureWitness | None) -> DemazurePiece:
    comp, inside, wt = local.comp, local.inside, local.wt
    size = int(inside.sum())
    if cut is not None:
        return DemazurePiece(top, lam, size, False, witness=cut)
    extremal = np.flatnonzero(inside & (np.sort(wt, axis=1)[:, ::-1] == np.array(lam)).all(axis=1))
    lengths = _inversions(wt[extremal])
    best = extremal[lengths == lengths.max()]
    if best.size == 1:
        alpha = tuple(int(x) for x in wt[best[0]])
        closed, w = comp.closure(local.top, alpha)
        if np.array_equal(closed, inside):
            return DemazurePiece(top, lam, size, True, w, reduced_word(w), alpha)
    return DemazurePiece(top, lam, size, False, witness=_why_not(local, extremal))


def _why_not(local: _Local, extremal: IntArray) -> DemazureWitness:
    comp, inside, wt = local.comp, local.inside, local.wt
    union = np.zeros(inside.size, dtype=np.bool_)
    maximal: list[tuple[int, BoolArray]] = []
    for x in extremal[np.argsort(-_inversions(wt[extremal]), kind="stable")]:
        alpha = tuple(int(v) for v in wt[x])
        closed, _ = comp.closure(local.top, alpha)
        outside = np.flatnonzero(closed & ~inside)
        if outside.size:
            return comp.witness("closure_leaves", int(x), int(outside[0]), key=alpha)
        if not any(c[x] for _, c in maximal):
            maximal.append((int(x), closed))
        union |= closed
    missed = np.flatnonzero(inside & ~union)
    if missed.size:
        return comp.witness("unreached", int(missed[0]))
    if len(maximal) < 2:
        raise InternalError("Demazure recognition: a single maximal closure was missed")
    (x, _), (y, _) = maximal[0], maximal[1]
    return comp.witness("union", x, y, key=tuple(int(v) for v in wt[x]))
