"""Demazure recognition: Demazure masks are recognised with their keys; broken ones get witnesses,
and every witness is checked here against its definition."""

from __future__ import annotations

import itertools
from collections import Counter

import numpy as np
import numpy.typing as npt
import pytest

import druse
from druse.key import shortest_permutation
from druse.pipe_crystal import factorization_crystal
from druse.recognition import DemazurePiece, DemazureWitness, demazure_recognition

Perm = tuple[int, ...]
Mask = npt.NDArray[np.bool_]
CASES = [((1,), 3), ((2, 1), 3), ((2,), 3), ((1, 1), 3), ((2, 1), 4), ((2, 2, 1), 4), ((3, 1), 4)]


def acted(w: Perm, lam: tuple[int, ...]) -> tuple[int, ...]:
    """w.lambda with (w.lambda)_{w(j)} = lambda_j (the contract's convention)."""
    out = [0] * len(w)
    for j, x in enumerate(lam):
        out[w[j] - 1] = x
    return tuple(out)


def padded(lam: tuple[int, ...], n: int) -> tuple[int, ...]:
    return lam + (0,) * (n - len(lam))


def demazure_masks(C: druse.Crystal) -> dict[Perm, Mask]:
    n = C.n
    return {w: druse.demazure_mask_of(C, w) for w in itertools.permutations(range(1, n + 1))}


@pytest.mark.parametrize(("shape", "n"), CASES)
def test_every_demazure_mask_is_recognised_with_its_key(shape: tuple[int, ...], n: int) -> None:
    C = druse.crystal(shape, n)
    lam = padded(shape, n)
    for w, mask in demazure_masks(C).items():
        (piece,) = demazure_recognition(C, mask).pieces
        assert piece.is_demazure
        assert piece.witness is None
        assert piece.key == acted(w, lam)  # same Demazure crystal, same extremal weight
        assert piece.perm is not None
        assert acted(piece.perm, lam) == piece.key
        assert druse.demazure.length(piece.perm) <= druse.demazure.length(w)  # shortest
        assert druse.word_permutation(piece.word or (), n) == piece.perm
        assert C.character(mask) == druse.key(piece.key)  # Kashiwara 1993 / Littelmann 1995


def string_of(C: druse.Crystal, v: int, i: int) -> list[int]:
    top = v
    while C.e(i)[top] >= 0:
        top = int(C.e(i)[top])
    out = [top]
    while C.f(i)[out[-1]] >= 0:
        out.append(int(C.f(i)[out[-1]]))
    return out


def check_witness(C: druse.Crystal, mask: Mask, piece: DemazurePiece) -> str:
    """Verify a witness from its definition (module docstring of druse.recognition)."""
    masks = demazure_masks(C)
    if piece.is_demazure:
        assert piece.perm is not None
        assert (masks[piece.perm] == mask).all()
        return "demazure"
    w = piece.witness
    assert isinstance(w, DemazureWitness)
    if w.kind == "cut_string":
        assert w.i is not None
        assert w.other is not None
        string = string_of(C, w.vertex, w.i)
        assert mask[w.vertex]
        assert not mask[w.other]
        assert w.other in string
        met = [x for x in string if mask[x]]
        assert met not in ([], string, [string[0]])  # Kashiwara 1993, Prop. 3.3.5
    elif w.kind == "closure_leaves":
        assert w.key is not None
        assert w.other is not None
        assert mask[w.vertex]
        assert tuple(C.weights()[w.vertex]) == w.key
        assert masks[shortest_permutation(w.key)][w.other]
        assert not mask[w.other]
    elif w.kind in ("unreached", "union"):
        inside = [m for m in masks.values() if not (m & ~mask).any()]
        union = np.logical_or.reduce(inside)
        assert not any((m == mask).all() for m in inside)
        if w.kind == "unreached":
            assert mask[w.vertex]
            assert not union[w.vertex]
        else:
            assert (union == mask).all()
    else:
        raise AssertionError(f"unknown witness kind {w.kind}")
    return w.kind


def broken_mask_kinds(shape: tuple[int, ...], n: int) -> Counter[str]:
    """Flip one vertex of every Demazure mask of B(shape); check each answer; count the kinds."""
    C = druse.crystal(shape, n)
    kinds: Counter[str] = Counter()
    for base in {m.tobytes(): m for m in demazure_masks(C).values()}.values():
        for v in range(len(C)):
            broken = base.copy()
            broken[v] = not broken[v]  # drop a vertex, or add one
            if not broken.any():
                continue
            (piece,) = demazure_recognition(C, broken).pieces
            kinds[check_witness(C, broken, piece)] += 1
            string = string_of(C, v, 1)
            if not broken[v] and string[0] != v and string[-1] != v:
                # dropped from the middle of a 1-string: the cut is seen on that string
                assert piece.witness is not None
                assert piece.witness.kind == "cut_string"
    return kinds


@pytest.mark.parametrize(("shape", "n"), CASES)
def test_broken_masks_get_valid_witnesses(shape: tuple[int, ...], n: int) -> None:
    assert broken_mask_kinds(shape, n)["cut_string"] > 0


def test_every_kind_of_witness_occurs() -> None:
    kinds = broken_mask_kinds((2, 1), 4)
    assert set(kinds) == {"demazure", "cut_string", "closure_leaves", "unreached", "union"}


def test_a_union_of_two_demazure_crystals_is_named_as_such() -> None:
    C = druse.crystal((2, 1), 3)
    mask = druse.demazure_mask(C, (1,)) | druse.demazure_mask(C, (2,))
    (piece,) = demazure_recognition(C, mask).pieces
    assert not piece.is_demazure
    assert piece.witness is not None
    assert check_witness(C, mask, piece) == "union"


PERMS_4 = list(itertools.permutations(range(1, 5)))
PERMS_5 = list(itertools.permutations(range(1, 6)))


@pytest.mark.parametrize("w", PERMS_4 + PERMS_5[::4])
def test_pipe_dreams_in_each_component_are_demazure(w: Perm) -> None:
    C = factorization_crystal(w)
    report = demazure_recognition(C, C.bounded())
    assert report.is_demazure  # Assaf-Schilling 2018
    expansion = report.key_expansion()
    assert expansion is not None
    total = sum((c * druse.key(a) for a, c in expansion.items()), druse.Poly.from_dict({}, len(w)))
    assert total == C.character(C.bounded())
    assert len(report) == len(set(C.components()[C.bounded()].tolist()))


def test_bad_input() -> None:
    C = druse.crystal((1,), 2)
    with pytest.raises(TypeError, match="boolean"):
        demazure_recognition(C, np.ones(2, dtype=np.int64))
    with pytest.raises(ValueError, match="shape"):
        demazure_recognition(C, np.ones(3, dtype=bool))
    with pytest.raises(TypeError, match="Crystal"):
        demazure_recognition("crystal", np.ones(2, dtype=bool))  # type: ignore[arg-type]
    two_tops = druse.Crystal(2, 2, lowering=[np.array([-1, -1])], weights=[[1, 0], [0, 1]])
    with pytest.raises(ValueError, match="not dominant"):
        demazure_recognition(two_tops, np.array([False, True]))
