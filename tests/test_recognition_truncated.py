"""Demazure recognition of truncated crystals (no mask, no ambient crystal): pipe-dream crystals
and Demazure subcrystals rebuilt on their own are unions of Demazure crystals with the right
keys; graphs that are not honest truncations of B(lambda) get witnesses naming what differs."""

from __future__ import annotations

import itertools
import random

import numpy as np
import numpy.typing as npt
import pytest

import druse
from druse.recognition import DemazurePiece, demazure_recognition

Perm = tuple[int, ...]
Mask = npt.NDArray[np.bool_]
S4 = list(itertools.permutations(range(1, 5)))
S5_SAMPLE = random.Random(5).sample(list(itertools.permutations(range(1, 6))), 20)
S6_SAMPLE = random.Random(6).sample(list(itertools.permutations(range(1, 7))), 10)
SHAPES = [((1,), 3), ((2, 1), 3), ((2,), 3), ((2, 1), 4), ((2, 2, 1), 4), ((3, 1), 4)]


def acted(w: Perm, lam: tuple[int, ...]) -> tuple[int, ...]:
    """w.lambda with (w.lambda)_{w(j)} = lambda_j (the convention of druse.recognition)."""
    out = [0] * len(w)
    for j, x in enumerate(lam):
        out[w[j] - 1] = x
    return tuple(out)


def rebuilt(C: druse.Crystal, mask: Mask) -> tuple[druse.Crystal, npt.NDArray[np.int64]]:
    """The vertices of ``mask`` as a crystal of their own: the arrows of C between them, their
    weights; vertex k is the k-th vertex of the mask (ascending), which is also returned."""
    kept = np.flatnonzero(mask).astype(np.int64)
    new = np.full(len(C), -1, dtype=np.int64)
    new[kept] = np.arange(kept.size)
    edges = C.edges()
    inside = mask[edges[:, 0]] & mask[edges[:, 2]]
    rows = np.column_stack([new[edges[inside, 0]], edges[inside, 1], new[edges[inside, 2]]])
    weights = C.weights()[kept]
    return druse.crystal_from_edges(C.n, rows, weights, size=int(kept.size)), kept


def only_piece(C: druse.Crystal) -> DemazurePiece:
    (piece,) = demazure_recognition(C).pieces
    return piece


@pytest.mark.parametrize("w", S4 + S5_SAMPLE + S6_SAMPLE)
def test_pipe_dream_crystal_is_a_union_of_demazure_crystals(w: Perm) -> None:
    C = druse.pipe_dream_crystal(w)
    found = demazure_recognition(C)
    # Assaf-Schilling, "A Demazure crystal construction for Schubert polynomials", 2018
    assert found.is_demazure
    assert len(found) == len(set(C.components().tolist()))
    expansion = found.key_expansion()
    # the Schubert polynomial by divided differences from S_w0 (Macdonald, "Notes on Schubert
    # polynomials", 1991, (4.1)), peeled into keys
    assert expansion == druse.schubert_key_expansion(w, method="polynomial")
    assert expansion is not None
    total = sum((c * druse.key(a) for a, c in expansion.items()), druse.Poly.from_dict({}, len(w)))
    # Billey-Jockusch-Stanley 1993: pipe dreams of w have character S_w
    assert total == druse.schubert(w) == C.character()
    for piece in found:
        assert piece.embedding is not None
        assert piece.embedding.size == piece.size
        assert druse.crystal(piece.weight, C.n).weights()[piece.embedding].tolist() == (
            C.weights()[C.components() == C.components()[piece.highest_weight]].tolist()
        )


@pytest.mark.parametrize("n", [5, 7, 8])
def test_longest_element_needs_no_enumeration_of_b_lambda(n: int) -> None:
    w0 = tuple(range(n, 0, -1))
    delta = tuple(range(n - 1, -1, -1))
    C = druse.pipe_dream_crystal(w0)
    piece = only_piece(C)
    # S_w0 = x^delta, delta = (n-1, ..., 1, 0) (Lascoux-Schutzenberger 1982; Macdonald 1991),
    # and key(alpha) = x^alpha for a partition alpha (from memory); B(delta) has 2^(n(n-1)/2)
    # tableaux (hook-content formula), never built here
    assert piece.is_demazure
    assert piece.weight == delta
    assert piece.key == delta
    assert piece.perm == tuple(range(1, n + 1))
    assert druse.count_tableaux(delta, n) == 2 ** (n * (n - 1) // 2)


@pytest.mark.parametrize(("shape", "n"), SHAPES)
def test_rebuilt_demazure_subcrystals_are_recognised(shape: tuple[int, ...], n: int) -> None:
    B = druse.crystal(shape, n)
    lam = tuple(shape) + (0,) * (n - len(shape))
    for w in itertools.permutations(range(1, n + 1)):
        mask = B.demazure(druse.reduced_word(w))
        D, kept = rebuilt(B, mask)
        piece = only_piece(D)
        assert piece.is_demazure, piece.witness
        assert piece.weight == lam
        # the Demazure character of B_w(lambda) is key(w.lambda) (Kashiwara 1993; Littelmann,
        # "Crystal graphs and Young tableaux", 1995); the shortest w' with w'.lambda = w.lambda
        # gives the same Demazure crystal
        assert piece.key == acted(w, lam)
        assert D.character() == druse.key(piece.key)
        assert piece.perm is not None
        assert acted(piece.perm, lam) == piece.key
        # the embedding is forced (u_lambda to u_lambda, f_i to f_i): it is the inclusion
        assert piece.embedding is not None
        assert piece.embedding.tolist() == kept.tolist()


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 3), ((2, 1), 4), ((3, 1), 4)])
def test_rebuilt_broken_masks_agree_with_the_mask_route(shape: tuple[int, ...], n: int) -> None:
    """Flip one vertex of each Demazure mask; when the rest is connected with one top, the
    rebuilt crystal is an honest truncation, and must be judged as the mask is in B(lambda)."""
    B = druse.crystal(shape, n)
    labels_checked = 0
    kinds = set()
    for w in itertools.permutations(range(1, n + 1)):
        base = B.demazure(druse.reduced_word(w))
        for v in range(1, len(B)):
            mask = base.copy()
            mask[v] = not mask[v]
            D, kept = rebuilt(B, mask)
            if len(set(D.components().tolist())) != 1 or len(D.highest_weights()) != 1:
                continue  # then two components or two tops: not one truncation of B(lambda)
            (expected,) = demazure_recognition(B, mask).pieces
            got = only_piece(D)
            assert got.is_demazure == expected.is_demazure
            assert got.key == expected.key
            if expected.witness is None:
                continue
            assert got.witness is not None
            assert got.witness.kind == expected.witness.kind
            assert int(kept[got.witness.vertex]) == expected.witness.vertex
            labels_checked += 1
            kinds.add(got.witness.kind)
            if got.witness.kind == "cut_string":
                # the other end of the cut is off the mask: a vertex of B only
                assert got.witness.other is None
                assert got.witness.model_vertex is not None
                assert not mask[got.witness.model_vertex]
                i = got.witness.i
                assert i is not None
                near = {
                    int(B.e(i)[kept[got.witness.vertex]]),
                    int(B.f(i)[kept[got.witness.vertex]]),
                }
                assert got.witness.model_vertex in near
            if got.witness.kind == "closure_leaves":
                assert got.witness.model_vertex is not None
                assert not mask[got.witness.model_vertex]
    assert labels_checked > 0
    if (shape, n) == ((2, 1), 4):  # every kind of the mask route's witnesses is met
        assert kinds == {"cut_string", "closure_leaves", "unreached", "union"}


def test_an_arrow_that_b_lambda_lacks() -> None:
    B = druse.crystal((2, 1), 3)
    D, kept = rebuilt(B, B.demazure((1,)))
    # B(2,1): f_2 of the highest weight tableau 11/2 is 11/3, and f_1 is not defined on 22/3
    lowest = next(k for k, v in enumerate(kept) if B.tableau(int(v)) == ((1, 2), (2,)))
    assert B.f(2)[kept[lowest]] >= 0  # so the arrow added below is one B lacks at f_1
    assert B.f(1)[kept[lowest]] < 0  # from memory: 12/2 has phi_1 = 0
    edges = np.vstack([D.edges(), [[lowest, 1, len(D)]]])
    weights = np.vstack([D.weights(), D.weights()[lowest] - np.array([1, -1, 0])])
    bad = druse.crystal_from_edges(3, edges, weights, size=len(D) + 1)
    piece = only_piece(bad)
    assert not piece.is_demazure
    assert piece.witness is not None
    assert piece.witness.kind == "arrow_not_in_model"
    assert (piece.witness.vertex, piece.witness.i, piece.witness.other) == (lowest, 1, len(D))
    assert piece.witness.model_vertex is None  # f_1 is undefined there in B(2,1)
    assert "undefined" in piece.witness.detail


def test_a_missing_arrow_inside_the_image() -> None:
    B = druse.crystal((2, 1), 3)
    whole, _ = rebuilt(B, np.ones(len(B), dtype=np.bool_))
    edges = whole.edges()
    # drop an arrow into a vertex that keeps another incoming arrow (no new top, connected)
    incoming = np.bincount(edges[:, 2], minlength=len(B))
    drop = int(np.flatnonzero(incoming[edges[:, 2]] >= 2)[0])
    x, i, y = (int(t) for t in edges[drop])
    cut = druse.crystal_from_edges(3, np.delete(edges, drop, axis=0), whole.weights(), size=8)
    piece = only_piece(cut)
    assert not piece.is_demazure
    assert piece.witness is not None
    assert piece.witness.kind == "missing_arrow"
    assert (piece.witness.vertex, piece.witness.i, piece.witness.other) == (x, i, y)
    assert piece.witness.model_vertex == int(B.f(i)[x])


def test_a_top_whose_weight_is_not_a_partition() -> None:
    # one vertex of weight (0, 1): killed by e_1 but not dominant, so in no B(lambda)
    # (the highest weight of a GL_n crystal is dominant: Kashiwara 1991)
    C = druse.crystal_from_edges(2, np.zeros((0, 3), dtype=np.int64), [[0, 1]], size=1)
    piece = only_piece(C)
    assert piece.witness is not None
    assert piece.witness.kind == "not_partition"
    assert piece.witness.vertex == 0
    assert piece.weight == (0, 1)
    negative = druse.crystal_from_edges(2, np.zeros((0, 3), dtype=np.int64), [[0, -1]], size=1)
    assert only_piece(negative).witness is not None


def test_two_tops_in_one_component() -> None:
    # 0 --1--> 2 <--2-- 1, weights consistent (wt f_i x = wt x - alpha_i): 0 and 1 both killed
    # by every e_i, while a component B(lambda) has one highest weight vertex (Kashiwara 1991)
    edges = np.array([[0, 1, 2], [1, 2, 2]])
    C = druse.crystal_from_edges(3, edges, [[1, 0, 1], [0, 2, 0], [0, 1, 1]], size=3)
    piece = only_piece(C)
    assert piece.witness is not None
    assert piece.witness.kind == "two_highest_weights"
    assert (piece.witness.vertex, piece.witness.other) == (0, 1)


def test_two_vertices_with_one_image() -> None:
    # in B(2) of GL_3, f_2 f_1 f_1 and f_1 f_2 f_1 of 11 are both 23 (from memory: 11 -> 12 ->
    # 22 -> 23 and 12 -> 13 -> 23); here the two paths end at different vertices 4 and 5
    edges = np.array([[0, 1, 1], [1, 1, 2], [1, 2, 3], [2, 2, 4], [3, 1, 5]])
    weights = [[2, 0, 0], [1, 1, 0], [0, 2, 0], [1, 0, 1], [0, 1, 1], [0, 1, 1]]
    C = druse.crystal_from_edges(3, edges, weights, size=6)
    piece = only_piece(C)
    assert piece.witness is not None
    assert piece.witness.kind == "not_injective"
    assert (piece.witness.vertex, piece.witness.other) == (4, 5)
    B = druse.crystal((2,), 3)
    assert piece.witness.model_vertex == B.index([[2, 3]])


def test_a_weight_that_differs_from_its_image() -> None:
    # B(1) of GL_2 is 1 --1--> 2; here the lower vertex carries the weight (1, 0) of the top
    edges = np.array([[0, 1, 1]])
    C = druse.crystal_from_edges(2, edges, [[1, 0], [1, 0]], size=2, check_weights=False)
    piece = only_piece(C)
    assert piece.witness is not None
    assert piece.witness.kind == "weight_differs"
    assert piece.witness.vertex == 1
    assert "(0, 1)" in piece.witness.detail  # the weight of the tableau 2


def test_masks_still_work_and_empty_crystals_have_no_pieces() -> None:
    B = druse.crystal((2, 1), 3)
    assert demazure_recognition(B, B.demazure((1, 2))).is_demazure
    empty = druse.crystal_from_edges(2, np.zeros((0, 3), dtype=np.int64), np.zeros((0, 2)), size=0)
    assert len(demazure_recognition(empty)) == 0
    # B(lambda) itself is the Demazure crystal of the longest element (Kashiwara 1993)
    assert only_piece(B).perm == (3, 2, 1)
