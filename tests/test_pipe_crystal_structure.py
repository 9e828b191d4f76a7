"""The crystal on decreasing factorizations, and on pipe dreams inside it, through the general
crystal machinery: Stembridge's axioms, isomorphism of every component to a tableau crystal, and
Demazure recognition of the pipe dreams in every component."""

from __future__ import annotations

import itertools
import random

import pytest

import druse

S4 = list(itertools.permutations(range(1, 5)))
S5_SAMPLE = random.Random(20261202).sample(list(itertools.permutations(range(1, 6))), 12)


@pytest.mark.parametrize("w", S4 + S5_SAMPLE)
def test_factorization_crystal_is_a_union_of_tableau_crystals(w: tuple[int, ...]) -> None:
    c = druse.factorization_crystal(w)
    # Morse-Schilling 2016: a crystal of a GL_n representation, so Stembridge's local axioms hold
    # (Stembridge, "A local characterization of simply-laced crystals", 2003)
    report = druse.check_crystal(c)
    assert report.ok, str(report)
    for k, part in enumerate(druse.decompose(c)):
        shape, mapping = druse.tableau_isomorphism(c, k)
        assert mapping.size == part.size
        # the component's character is the Schur polynomial (Kashiwara-Nakashima 1994)
        assert c.character(part.mask(len(c))) == druse.schur(shape, c.n)


@pytest.mark.parametrize("w", S4 + S5_SAMPLE)
def test_pipe_dreams_are_demazure_in_each_component(w: tuple[int, ...]) -> None:
    c = druse.factorization_crystal(w)
    found = druse.demazure_recognition(c, c.bounded())
    # Assaf-Schilling, "A Demazure crystal construction for Schubert polynomials", 2018
    assert found.is_demazure
    expansion = found.key_expansion()
    assert expansion is not None
    # the keys sum to the Schubert polynomial, computed by the transition recursion
    total = druse.Poly.from_dict({}, len(w))
    for alpha, coefficient in expansion.items():
        total = total + druse.key(alpha) * druse.Poly.from_dict(
            {(0,) * len(w): coefficient}, len(w)
        )
    assert total == druse.schubert(w)


def test_all_of_s7_two_routes_agree() -> None:
    # the Demazure pieces of the pipe-dream crystal (Assaf-Schilling 2018) against peeling the
    # Schubert polynomials computed by divided differences from S_w0 (Macdonald 1991, (4.1))
    polys = druse.all_schuberts(7)
    by_peeling = druse.key_expansions(list(polys.values()))
    assert druse.all_schubert_key_expansions(7) == by_peeling
    # every coefficient is positive (Lascoux-Schutzenberger; Reiner-Shimozono 1995)
    assert all(c > 0 for e in by_peeling for c in e.values())
