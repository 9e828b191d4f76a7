"""key(alpha) and atom(alpha) by two independent routes: isobaric divided differences in Rust,
and the character of a Demazure crystal (or atom) inside the tableau crystal B(lambda)."""

from __future__ import annotations

import itertools

import pytest
from hypothesis import given
from hypothesis import strategies as st

import druse
from druse.key import shortest_permutation

SMALL = [a for n in range(1, 5) for a in itertools.product(range(3), repeat=n)]


@pytest.mark.parametrize("alpha", SMALL)
def test_operators_and_crystal_agree(alpha: tuple[int, ...]) -> None:
    # Demazure character formula (Demazure 1974; Kashiwara 1993; Littelmann 1995), and atoms as
    # the characters of Demazure atoms of crystals (Lascoux-Schutzenberger 1990; Mason 2009)
    assert druse.key(alpha) == druse.key(alpha, method="crystal")
    assert druse.atom(alpha) == druse.atom(alpha, method="crystal")


@given(st.lists(st.integers(0, 3), min_size=1, max_size=5).filter(lambda a: sum(a) <= 7))
def test_operators_and_crystal_agree_beyond(alpha: list[int]) -> None:
    assert druse.key(alpha) == druse.key(alpha, method="crystal")
    assert druse.atom(alpha) == druse.atom(alpha, method="crystal")


def test_shortest_permutation_sends_lambda_to_alpha() -> None:
    # (w.lambda)_{w(j)} = lambda_j, the contract's convention
    for alpha in SMALL:
        lam = sorted(alpha, reverse=True)
        w = shortest_permutation(alpha)
        moved = [0] * len(alpha)
        for j, wj in enumerate(w):
            moved[wj - 1] = lam[j]
        assert tuple(moved) == alpha
        assert druse.atom_mask(druse.crystal(lam, len(alpha)), w).any()  # shortest: atom not empty


def test_unknown_method_is_refused() -> None:
    with pytest.raises(ValueError, match="method must be"):
        druse.key((0, 1), method="guess")
