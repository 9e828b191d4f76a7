"""Axiom checks: crystals of representations pass, deliberately broken crystals are caught."""

from __future__ import annotations

import doctest
import importlib
import json

import numpy as np
import numpy.typing as npt
import pytest

import druse
from reference import tableaux as ref

Shape = tuple[int, ...]
IntArray = npt.NDArray[np.int64]
STEMBRIDGE = ("P3", "P4", "P5", "P6", "P5'", "P6'")
BASIC = ("inverse", "injective", "cycle", "weight", "string_length", "seminormal")

#: Every (shape, n) with |shape| <= 5, 2 <= n <= 5 and at most n rows.
CASES = [(s, n) for n in range(2, 6) for s in ref.partitions_up_to(5) if len(s) <= n]


def tables(shape: Shape, n: int) -> tuple[list[IntArray], npt.NDArray[np.int32]]:
    """The f_i arrays (writable copies) and weights of B(shape)."""
    C = druse.crystal(shape, n)
    return [C.f(i).copy() for i in range(1, n)], C.weights().copy()


def from_arrays(
    n: int, f: list[IntArray], w: npt.NDArray[np.int32], e: list[IntArray] | None = None
) -> druse.Crystal:
    return druse.Crystal(n, w.shape[0], lowering=f, raising=e, weights=w)


@pytest.mark.parametrize(("shape", "n"), CASES)
def test_tableau_crystals_satisfy_every_axiom(shape: Shape, n: int) -> None:
    # Kashiwara-Nakashima 1994: B(lambda) on tableaux is the crystal of V(lambda); Stembridge 2003
    # (main theorem, from memory): crystals of representations satisfy P1-P6, P5', P6'
    report = druse.check_crystal(druse.crystal(shape, n))
    assert report, str(report)
    assert report.checked == BASIC + STEMBRIDGE
    assert sum(report.counts.values()) == 0


@pytest.mark.slow
@pytest.mark.parametrize(("shape", "n"), [((3, 2, 1), 5), ((4, 2), 6), ((2, 2, 1, 1), 7)])
def test_larger_tableau_crystals_from_arrays(shape: Shape, n: int) -> None:
    # the same crystals as plain arrays (no model phi, e_i derived): Kashiwara-Nakashima 1994
    f, w = tables(shape, n)
    assert druse.check_crystal(from_arrays(n, f, w))


@pytest.mark.skipif(not hasattr(druse, "tensor_product"), reason="needs druse.tensor_product")
def test_tensor_cube_satisfies_every_axiom() -> None:
    # Kashiwara 1991: a tensor product of crystals of representations is one; its phi, epsilon
    # come from the signature rule and are compared with its strings (seminormal)
    B = druse.crystal((1,), 3)
    C = druse.tensor_product(B, B, B)  # type: ignore[attr-defined, unused-ignore]
    report = druse.check_crystal(C)
    assert report, str(report)
    assert "seminormal" in report.checked


def test_moved_edge_is_a_weight_witness() -> None:
    # move the f_1 arrow out of x onto z, the top of another 1-string of another weight
    n = 3
    f, w = tables((2, 1), n)
    x = int(np.flatnonzero(f[0] >= 0)[0])
    y = int(f[0][x])
    tops = [v for v in range(len(w)) if v not in f[0] and v not in (x, y)]
    z = next(v for v in tops if not np.array_equal(w[v], w[y]) and f[0][v] != x)
    f[0][x] = z
    report = druse.check_crystal(from_arrays(n, f, w))
    first = next(v for v in report.violations if v.axiom == "weight")
    assert (first.i, first.j, first.vertices) == (1, None, (x, z))  # wt(f_1 x) != wt(x) - alpha_1
    assert not report
    assert report.counts["weight"] >= 1


def test_wrong_weight_is_caught_at_its_vertex() -> None:
    n = 4
    f, w = tables((2, 1), n)
    v = 5
    w[v, 0] += 1
    report = druse.check_crystal(from_arrays(n, f, w))
    at_v = [x for x in report.violations if x.axiom == "string_length"]
    assert [x.vertices for x in at_v] == [(v,)]  # phi_1 - eps_1 no longer wt_1 - wt_2, at v only
    assert all(v in x.vertices for x in report.violations if x.axiom == "weight")
    assert report.counts["weight"] >= 1


def test_raising_that_is_not_the_inverse() -> None:
    n = 3
    f, w = tables((2,), n)
    e = [druse.crystal((2,), n).e(i).copy() for i in range(1, n)]
    x = int(np.flatnonzero(f[1] >= 0)[0])
    y = int(f[1][x])
    e[1][y] = -1  # f_2 x = y, but e_2 y undefined
    report = druse.check_crystal(from_arrays(n, f, w, e))
    assert report.counts["inverse"] == 1
    (v,) = [v for v in report.violations if v.axiom == "inverse"]
    assert (v.axiom, v.i, v.vertices) == ("inverse", 2, (x, y, -1))


def test_closed_string_is_a_cycle() -> None:
    # the 1-string [1,1] -> [1,2] -> [2,2] of B(2), GL_2, closed up: f_1([2,2]) = [1,1]
    n = 2
    f, w = tables((2,), n)
    f[0][2] = 0
    report = druse.check_crystal(from_arrays(n, f, w))
    cycles = [v for v in report.violations if v.axiom == "cycle"]
    assert [(v.i, v.vertices) for v in cycles] == [(1, (0, 1, 2))]
    assert report.counts["cycle"] == 1


def test_cycle_through_two_colours() -> None:
    # f_1(0) = 1 and f_2(1) = 0: with weights it breaks `weight`; without, it is a `cycle`
    lowering = [np.array([1, -1]), np.array([-1, 0])]
    report = druse.check_crystal(druse.Crystal(3, 2, lowering=lowering))
    assert report.counts["cycle"] == 1
    (v,) = [v for v in report.violations if v.axiom == "cycle"]
    assert (v.i, v.vertices) == (2, (0, 1))
    weighted = druse.Crystal(3, 2, lowering=lowering, weights=[[1, 0, 0], [0, 1, 0]])
    assert druse.check_crystal(weighted).counts["weight"] >= 1


def glued(shape: Shape, n: int, i: int, u: int) -> druse.Crystal:
    """Two copies of B(shape), the second shifted by N, with the f_i arrows out of u and its
    copy u + N swapped. Every i-string keeps its length and every arrow its weight change, so
    the basic axioms still hold; but unless the swap merely renames two vertices, the result is
    connected with two highest weight vertices, so by Stembridge's theorem (2003, from memory)
    some local axiom fails."""
    C = druse.crystal(shape, n)
    size = len(C)
    f = [np.concatenate([C.f(k), np.where(C.f(k) >= 0, C.f(k) + size, -1)]) for k in range(1, n)]
    f[i - 1][u], f[i - 1][u + size] = f[i - 1][u + size], f[i - 1][u]
    return from_arrays(n, f, np.concatenate([C.weights(), C.weights()]))


def test_glued_square_breaks_only_stembridge() -> None:
    # u is chosen where f_1 u and f_2 u exist with Nabla_1 phi(u, 2) = 0, so P5' asks
    # f_2 f_1 u = f_1 f_2 u: after the swap, f_2 f_1 u lies in the second copy and
    # f_1 f_2 u in the first
    B = druse.crystal((2, 2), 3)
    f1, f2, phi2 = B.f(1), B.f(2), B.phi(2)
    u = next(v for v in range(len(B)) if f1[v] >= 0 and f2[v] >= 0 and phi2[v] == phi2[f1[v]])
    C = glued((2, 2), 3, 1, u)
    report = druse.check_crystal(C)
    assert not report
    assert all(report.counts[a] == 0 for a in BASIC)  # the basic axioms cannot see it
    square = [v for v in report.violations if v.axiom == "P5'" and v.vertices[0] == u]
    assert square, str(report)
    assert {v.i for v in square} <= {1, 2}
    assert {v.j for v in square} <= {1, 2}
    assert druse.check_crystal(C, stembridge=False)  # without the local axioms it passes


def test_glued_octagon_breaks_p6() -> None:
    # B(2,1) of GL_3 has no commuting 1,2-squares: every swap breaks an octagon (P6 and P6')
    report = druse.check_crystal(glued((2, 1), 3, 1, 0))
    assert {a for a, c in report.counts.items() if c} == {"P6", "P6'"}
    assert all(v.axiom in ("P6", "P6'") and v.i == 1 and v.j == 2 for v in report.violations)


def test_swap_that_only_renames_two_vertices_passes() -> None:
    # in B(2,2) of GL_3, f_1 of vertex 4 ends at a vertex with no other arrow: swapping it with
    # its copy just exchanges two names, so the result is still two copies of B(2,2)
    C = glued((2, 2), 3, 1, 4)
    assert druse.check_crystal(C)
    assert [p.weight for p in druse.decompose(C)] == [(2, 2, 0), (2, 2, 0)]


def test_witness_cap_and_order() -> None:
    # every weight shifted in its first part: string_length fails at most vertices
    n = 4
    f, w = tables((3, 1), n)
    w[:, 0] += np.arange(len(w)) % 3
    report = druse.check_crystal(from_arrays(n, f, w), max_witnesses=7)
    assert len(report.violations) == 7
    assert sum(report.counts.values()) > 7
    firsts = [v.vertices[0] for v in report.violations]
    assert firsts == sorted(firsts)  # vertex order
    as_json = json.loads(json.dumps(report.to_dict()))
    assert as_json["counts"] == dict(report.counts)
    assert as_json["violations"][0]["vertices"] == list(report.violations[0].vertices)
    assert "violations" in str(report)
    assert str(report.violations[0]) in str(report)


def test_without_weights_and_without_stembridge() -> None:
    f, _ = tables((2, 1), 3)
    report = druse.check_crystal(druse.Crystal(3, len(f[0]), lowering=f), stembridge=False)
    assert report.checked == ("inverse", "injective", "cycle", "seminormal")
    assert report
    assert "every axiom holds" in str(report)


class _StatedStrings(druse.Crystal):
    """A crystal that states its own phi_i (one too many at vertex 0) instead of walking."""

    def __init__(self) -> None:
        f, w = tables((1,), 2)
        super().__init__(2, 2, lowering=f, weights=w)

    def _compute_string_lengths(
        self, i: int
    ) -> tuple[npt.NDArray[np.int32], npt.NDArray[np.int32]]:
        return np.array([2, 0], dtype=np.int32), np.array([0, 1], dtype=np.int32)


def test_stated_string_lengths_must_match() -> None:
    # B(1) of GL_2 is 0 -> 1 with phi_1 = (1, 0); the model claims phi_1(0) = 2
    report = druse.check_crystal(_StatedStrings())
    (v,) = report.violations
    assert (v.axiom, v.i, v.vertices) == ("seminormal", 1, (0,))


def test_bad_arguments() -> None:
    with pytest.raises(TypeError, match=r"druse\.Crystal"):
        druse.check_crystal("B(2)")  # type: ignore[arg-type]
    with pytest.raises(ValueError, match="max_witnesses"):
        druse.check_crystal(druse.crystal((1,), 2), max_witnesses=-1)
    with pytest.raises(TypeError, match="stembridge"):
        druse.check_crystal(druse.crystal((1,), 2), stembridge=1)  # type: ignore[arg-type]
    assert druse.check_crystal(druse.crystal((1, 1, 1), 2))  # the empty crystal: nothing fails


@pytest.mark.parametrize("name", ["druse.axioms", "druse.structure"])
def test_examples_run(name: str) -> None:
    module = importlib.import_module(name)
    failed, attempted = doctest.testmod(module, optionflags=doctest.ELLIPSIS)
    assert failed == 0
    assert attempted > 0


def test_kernel_refuses_malformed_tables() -> None:
    # the Rust side checks again what memory safety rests on: a ValueError, never a crash
    from druse import _core

    f = [np.array([1, -1], dtype=np.int64)]
    w = np.zeros((2, 2), dtype=np.int32)
    with pytest.raises(ValueError, match="one entry per vertex"):
        _core.check_axioms(2, 3, f, f, None, None, True, 10)
    with pytest.raises(ValueError, match=r"vertex in 0\.\.2"):
        _core.check_axioms(2, 2, [np.array([5, -1])], f, w, None, True, 10)
    with pytest.raises(ValueError, match="weights must have"):
        _core.check_axioms(2, 2, f, f, np.zeros((2, 3), dtype=np.int32), None, True, 10)
    with pytest.raises(ValueError, match="declared"):
        _core.check_axioms(2, 2, f, f, w, ([], []), True, 10)
    with pytest.raises(ValueError, match="highest weight vertices must be vertices"):
        _core.model_map(2, (f, f, w), 7, (f, f, w), 0, 0)
