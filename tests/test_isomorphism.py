"""Components, highest weights and explicit isomorphisms to B(lambda)."""

from __future__ import annotations

import numpy as np
import numpy.typing as npt
import pytest

import druse
from reference import tableaux as ref

Shape = tuple[int, ...]
IntArray = npt.NDArray[np.int64]
CASES = [(s, n) for n in range(1, 5) for s in ref.partitions_up_to(4) if len(s) <= n]


def relabelled(
    crystals: list[druse.Crystal], seed: int
) -> tuple[druse.Crystal, IntArray, list[int]]:
    """The disjoint union of ``crystals`` with its vertices randomly renamed: (union, new name of
    each old vertex in concatenation order, offsets of the parts)."""
    n = crystals[0].n
    offsets = list(np.cumsum([0] + [len(C) for C in crystals]))
    total = offsets[-1]
    perm = np.random.default_rng(seed).permutation(total).astype(np.int64)
    f = []
    for i in range(1, n):
        old = np.concatenate(
            [np.where(C.f(i) >= 0, C.f(i) + o, -1) for C, o in zip(crystals, offsets, strict=False)]
        )
        new = np.full(total, -1, dtype=np.int64)
        new[perm] = np.where(old >= 0, perm[np.maximum(old, 0)], -1)
        f.append(new)
    w = np.zeros((total, n), dtype=np.int32)
    w[perm] = np.concatenate([C.weights() for C in crystals])
    return druse.Crystal(n, total, lowering=f, weights=w), perm, offsets


@pytest.mark.parametrize(("shape", "n"), CASES)
def test_relabelled_crystal_maps_back(shape: Shape, n: int) -> None:
    B = druse.crystal(shape, n)
    C, perm, _ = relabelled([B], seed=len(B))
    lam, mapping = druse.tableau_isomorphism(C)
    assert lam == shape
    # the isomorphism of connected crystals is unique (it fixes the highest weight vertex and
    # commutes with every f_i), so it must undo the relabelling
    assert np.array_equal(mapping[perm], np.arange(len(B)))
    assert np.array_equal(B.weights()[mapping], C.weights())  # mapped tableau weights agree


def test_tableau_crystal_maps_to_itself() -> None:
    B = druse.crystal((3, 1), 4)
    lam, mapping = druse.tableau_isomorphism(B)
    assert lam == (3, 1)
    assert np.array_equal(mapping, np.arange(len(B)))


def test_disjoint_union_is_decomposed() -> None:
    n = 4
    shapes = [(2, 1), (3,), (2, 1), (1, 1, 1), ()]
    C, _, _ = relabelled([druse.crystal(s, n) for s in shapes], seed=7)
    parts = druse.decompose(C)
    assert sorted(p.weight for p in parts) == sorted(s + (0,) * (n - len(s)) for s in shapes)
    assert sum(p.size for p in parts) == len(C)
    for k, p in enumerate(parts):
        lam = tuple(x for x in p.weight if x)
        assert p.size == ref.hook_content_count(lam, n)  # hook-content, Stanley EC2 Cor. 7.21.4
        # Kashiwara-Nakashima 1994: the character of B(lambda) is the Schur polynomial s_lambda
        assert C.character(p.mask(len(C))) == druse.schur(lam, n)
        got, mapping = druse.tableau_isomorphism(C, k)
        assert got == lam
        assert np.array_equal(druse.crystal(lam, n).weights()[mapping], C.weights()[p.vertices])
        assert np.array_equal(druse.tableau_isomorphism(C, p)[1], mapping)


def test_negative_weights_are_shifted() -> None:
    # B(2,1) of GL_3 twisted by det^-3: weights lowered by (3, 3, 3); lambda = wt + (3, 3, 3)
    B = druse.crystal((2, 1), 3)
    f = [B.f(i) for i in (1, 2)]
    C = druse.Crystal(3, len(B), lowering=f, weights=B.weights() - 3)
    lam, mapping = druse.tableau_isomorphism(C)
    assert lam == (2, 1)
    assert np.array_equal(mapping, np.arange(len(B)))
    (part,) = druse.decompose(C)
    assert part.weight == (-1, -2, -3)
    assert part.shift == 3


def test_non_dominant_highest_weight_is_refused() -> None:
    # one vertex of weight (0, 1), no arrows: its highest weight is not a partition
    C = druse.Crystal(2, 1, lowering=[np.array([-1])], weights=[[0, 1]])
    with pytest.raises(ValueError, match=r"vertex 0 has weight \(0, 1\), which is not dominant"):
        druse.tableau_isomorphism(C)


def test_string_of_the_wrong_length_is_refused() -> None:
    # a 1-string of 4 vertices from weight (2, 0): B(2) of GL_2 has 3 (Kashiwara 1991: the
    # i-string through the highest weight vertex has length lambda_i - lambda_{i+1})
    f = [np.array([1, 2, 3, -1])]
    C = druse.Crystal(2, 4, lowering=f, weights=[[2, 0], [1, 1], [0, 2], [-1, 3]])
    with pytest.raises(ValueError, match=r"at vertex 2, i = 1: f_1\(2\) = 3, but f_1 is undefined"):
        druse.tableau_isomorphism(C)
    assert not druse.check_crystal(C)  # string_length fails too


def test_not_connected_or_not_a_representation() -> None:
    C, _, _ = relabelled([druse.crystal((1,), 2), druse.crystal((1,), 2)], seed=1)
    with pytest.raises(ValueError, match="2 highest weight vertices"):
        druse.tableau_isomorphism(C)
    with pytest.raises(ValueError, match=r"component must be in 0\.\.1"):
        druse.tableau_isomorphism(C, 2)
    # two highest weight vertices 0 and 1 above one vertex 2: f_1(0) = f_2(1) = 2
    lowering = [np.array([2, -1, -1]), np.array([-1, 2, -1])]
    glued = druse.Crystal(3, 3, lowering=lowering, weights=[[1, 0, 0], [0, 2, -1], [0, 1, 0]])
    with pytest.raises(ValueError, match="two highest weight vertices"):
        druse.decompose(glued)
    with pytest.raises(TypeError, match=r"druse\.Crystal"):
        druse.decompose([1, 2])  # type: ignore[arg-type]
    with pytest.raises(ValueError, match="no weights"):
        druse.decompose(druse.Crystal(2, 2, lowering=[np.array([1, -1])]))
