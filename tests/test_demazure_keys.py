"""Demazure crystals and right keys, two independent computations, agree: T lies in B_w(lambda)
exactly when its right key is <= the key tableau of w.lambda, entrywise, and the Demazure atom
of w is where the right key equals it (Lascoux-Schutzenberger, "Keys and standard bases", 1990;
Reiner-Shimozono 1995; Mason 2009)."""

from __future__ import annotations

import itertools

import numpy as np
import pytest

import druse
from druse.key import shortest_permutation
from reference.tableaux import partitions_up_to


def key_tableau(alpha: tuple[int, ...], shape: tuple[int, ...]) -> np.ndarray:
    """The key of content alpha, row-major: column c holds the j with alpha_j >= c, increasing."""
    rows = [[0] * length for length in shape]
    for c in range(shape[0] if shape else 0):
        column = [j + 1 for j, a in enumerate(alpha) if a > c]
        for r, x in enumerate(column):
            rows[r][c] = x
    return np.array([x for row in rows for x in row], dtype=np.uint8)


def act(w: tuple[int, ...], lam: tuple[int, ...]) -> tuple[int, ...]:
    out = [0] * len(w)
    for j, wj in enumerate(w):
        out[wj - 1] = lam[j] if j < len(lam) else 0
    return tuple(out)


CASES = [(s, n) for n in range(2, 5) for s in partitions_up_to(5) if 0 < len(s) <= n]


@pytest.mark.parametrize(("shape", "n"), CASES)
def test_masks_are_right_key_bounds_and_atoms_are_right_key_levels(
    shape: tuple[int, ...], n: int
) -> None:
    C = druse.crystal(shape, n)
    keys = druse.right_keys(C)
    contents = druse.right_key_weights(C)
    for w in itertools.permutations(range(1, n + 1)):
        alpha = act(w, shape)
        bound = (keys <= key_tableau(alpha, shape)).all(axis=1)
        assert np.array_equal(druse.demazure_mask_of(C, w), bound)
        if w == shortest_permutation(alpha):
            level = (contents == alpha).all(axis=1)
            assert np.array_equal(druse.atom_mask(C, w), level)
