"""Key, atom and Schur expansions: exact (checked by re-summing), and their positivity."""

from __future__ import annotations

import itertools

import pytest
from hypothesis import given
from hypothesis import strategies as st

import druse
from druse.expansion import positivity
from druse.poly import Poly


def compositions(n: int, top: int) -> list[tuple[int, ...]]:
    return list(itertools.product(range(top + 1), repeat=n))


def resum(expansion: dict[tuple[int, ...], int], basis: object, n: int) -> Poly:
    total = Poly.zero(n)
    for alpha, c in expansion.items():
        total = total + c * basis(alpha)  # type: ignore[operator]
    return total


small_polys = st.integers(1, 3).flatmap(
    lambda n: st.dictionaries(
        st.tuples(*[st.integers(0, 2)] * n), st.integers(-5, 5), max_size=5
    ).map(lambda d: Poly.from_dict(d, n))
)


@given(small_polys)
def test_key_and_atom_expansions_resum_to_the_polynomial(p: Poly) -> None:
    assert resum(druse.key_expansion(p), druse.key, p.nvars) == p
    assert resum(druse.atom_expansion(p), druse.atom, p.nvars) == p


@pytest.mark.parametrize("alpha", compositions(3, 2))
def test_a_key_expands_to_itself(alpha: tuple[int, ...]) -> None:
    assert druse.key_expansion(druse.key(alpha)) == {alpha: 1}
    assert druse.atom_expansion(druse.atom(alpha)) == {alpha: 1}


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 3), ((3, 1), 3), ((2, 2, 1), 4), ((1,), 4)])
def test_a_schur_polynomial_is_the_key_of_the_increasing_rearrangement(
    shape: tuple[int, ...], n: int
) -> None:
    # s_lambda(x1..xn) = key(lambda reversed, padded to n) (Lascoux-Schutzenberger 1990)
    increasing = tuple(sorted(shape + (0,) * (n - len(shape))))
    assert druse.key_expansion(druse.schur(shape, n)) == {increasing: 1}


@pytest.mark.parametrize("alpha", [(0, 2, 1), (1, 0, 2), (0, 1, 2), (2, 0, 1)])
def test_a_key_is_a_sum_of_distinct_atoms_including_its_own(alpha: tuple[int, ...]) -> None:
    # key(alpha) = sum of atom(beta) over beta <= alpha in the orbit of alpha, each once
    # (Lascoux-Schutzenberger 1990; Mason 2009)
    atoms = druse.atom_expansion(druse.key(alpha))
    assert atoms[alpha] == 1
    assert set(atoms.values()) == {1}
    assert all(sorted(beta) == sorted(alpha) for beta in atoms)


def test_pieri_rule_through_the_schur_expansion() -> None:
    # s_(2,1) s_(1) = s_(3,1) + s_(2,2) + s_(2,1,1) (Pieri rule; Macdonald, I (5.16))
    p = druse.schur((2, 1), 4) * druse.schur((1,), 4)
    assert druse.schur_expansion(p) == {(3, 1): 1, (2, 2): 1, (2, 1, 1): 1}


@given(
    st.tuples(*[st.integers(0, 2)] * 3),
    st.sampled_from([(1,), (2,), (1, 1), (2, 1)]),
)
def test_key_times_schur_is_key_positive(alpha: tuple[int, ...], mu: tuple[int, ...]) -> None:
    # A Demazure character times a dominant character has a filtration by Demazure modules
    # (Polo 1989; Mathieu 1989): the key expansion has non-negative coefficients.
    expansion = druse.key_expansion(druse.key(alpha) * druse.schur(mu, 3))
    assert positivity(expansion).positive, expansion


def test_a_product_of_two_keys_that_is_not_key_positive() -> None:
    # Found by searching with druse itself over compositions of length 3 with parts <= 2, in
    # order: key(0,1,0) key(1,0,1) = (x1 + x2)(x1 x2 + x1 x3) is the first product with a
    # negative key coefficient. Checked by hand: key(1,1,1) + key(2,0,1) + key(1,2,0)
    # - key(2,1,0) = x1 x2 x3 + x1^2 x3 + x1 x2^2 + x1^2 x2, and keys are a basis.
    first = None
    for a, b in itertools.combinations_with_replacement(compositions(3, 2), 2):
        report = positivity(druse.key_expansion(druse.key(a) * druse.key(b)))
        if not report.positive:
            first = (a, b, report)
            break
    assert first == ((0, 1, 0), (1, 0, 1), druse.Positivity(False, (2, 1, 0), -1))
    product = druse.key((0, 1, 0)) * druse.key((1, 0, 1))
    assert druse.key_expansion(product) == {(1, 1, 1): 1, (2, 0, 1): 1, (1, 2, 0): 1, (2, 1, 0): -1}


def test_bad_input() -> None:
    with pytest.raises(TypeError, match=r"druse\.Poly"):
        druse.key_expansion({(1, 0): 1})  # type: ignore[arg-type]
    with pytest.raises(ValueError, match="negative exponents"):
        druse.key_expansion(Poly.from_dict({(-1, 0): 1}, 2))
    with pytest.raises(ValueError, match="not symmetric"):
        druse.schur_expansion(Poly.from_dict({(0, 1): 1}, 2))


def test_positivity_report() -> None:
    assert positivity({(1, 0): 2}) == druse.Positivity(True)
    assert positivity({(1, 0): 2, (0, 1): -3}) == druse.Positivity(False, (0, 1), -3)
