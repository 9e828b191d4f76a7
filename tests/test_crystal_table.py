"""The shared crystal table: a crystal given by arrays behaves like the model it was taken from."""

from __future__ import annotations

import numpy as np
import pytest

import druse


def relabelled(shape: tuple[int, ...], n: int, seed: int) -> tuple[druse.Crystal, np.ndarray]:
    """B(shape) rebuilt from its own arrays with the vertices renumbered by a random permutation."""
    C = druse.crystal(shape, n)
    perm = np.random.default_rng(seed).permutation(len(C))  # new label of old vertex v
    lowering = []
    for i in range(1, n):
        f = C.f(i)
        g = np.full(len(C), -1, dtype=np.int64)
        has = f >= 0
        g[perm[has]] = perm[f[has]]
        lowering.append(g)
    weights = np.empty_like(C.weights())
    weights[perm] = C.weights()
    return druse.Crystal(n, len(C), lowering=lowering, weights=weights), perm


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 3), ((3, 1, 1), 4), ((2, 2), 4), ((3,), 2)])
def test_generic_algorithms_agree_with_the_tableau_model(shape: tuple[int, ...], n: int) -> None:
    C = druse.crystal(shape, n)
    D, perm = relabelled(shape, n, seed=len(shape) + n)
    for i in range(1, n):
        # string lengths by walking the arrays equal those of the signature rule
        assert np.array_equal(D.phi(i)[perm], C.phi(i))
        assert np.array_equal(D.epsilon(i)[perm], C.epsilon(i))
        # e_i derived as the inverse of f_i equals the signature rule's e_i
        assert np.array_equal(D.e(i)[perm[C.e(i) >= 0]], perm[C.e(i)[C.e(i) >= 0]])
    assert D.highest_weight() == perm[C.highest_weight()]
    assert D.lowest_weight() == perm[C.lowest_weight()]
    assert np.unique(D.components()).size == 1  # B(lambda) is connected
    assert D.character() == C.character() == druse.schur(shape, n)


def test_arrays_given_are_copied_not_frozen() -> None:
    f = np.array([1, -1], dtype=np.int64)
    druse.Crystal(2, 2, lowering=[f], weights=[[1, 0], [0, 1]])
    f[0] = 1  # still writable: the crystal keeps its own copy
    assert f.flags.writeable


def test_disconnected_table() -> None:
    # two copies of the standard crystal of GL_2: 0 -> 1 and 2 -> 3
    D = druse.Crystal(2, 4, lowering=[[1, -1, 3, -1]], weights=[[1, 0], [0, 1], [1, 0], [0, 1]])
    assert D.highest_weights().tolist() == [0, 2]
    assert D.components().tolist() == [0, 0, 1, 1]
    with pytest.raises(ValueError, match="not exactly one"):
        D.highest_weight()
    assert D.character().to_dict() == {(1, 0): 2, (0, 1): 2}


@pytest.mark.parametrize(
    ("kwargs", "message"),
    [
        ({"lowering": [[1, 5]]}, "vertex in 0..2"),
        ({"lowering": [[1, -1, 0]]}, "one entry per vertex"),
        ({"lowering": [[1, 1]]}, "partial bijections"),
        ({"lowering": []}, "n - 1 = 1 arrays"),
        ({"lowering": [[1, -1]], "weights": [[1, 0]]}, "weights must have shape"),
    ],
)
def test_bad_tables_are_refused(kwargs: dict[str, object], message: str) -> None:
    with pytest.raises(ValueError, match=message):
        druse.Crystal(2, 2, **kwargs)  # type: ignore[arg-type]


def test_negative_size_is_refused() -> None:
    with pytest.raises(ValueError, match="size must be non-negative"):
        druse.Crystal(2, -1)


def test_lowering_tables_alone_then_everything_else_on_demand() -> None:
    C, D = druse.crystal((3, 2, 1), 4), druse.crystal((3, 2, 1), 4)
    C.lowering_tables()  # f_i only
    D.operator_tables()  # f_i, e_i, phi_i, epsilon_i
    for i in range(1, 4):
        assert np.array_equal(C.f(i), D.f(i))
        assert np.array_equal(C.e(i), D.e(i))  # computed when first asked for
        assert np.array_equal(C.phi(i), D.phi(i))
