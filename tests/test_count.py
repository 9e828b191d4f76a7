"""Numbers of tableaux: druse against product formulas, OEIS, and the reference enumerator."""

from __future__ import annotations

from math import comb, factorial

import numpy as np
import pytest
from hypothesis import given

import druse
from reference.tableaux import (
    hook_content_count,
    partitions,
    partitions_up_to,
    ssyt,
    standard_count,
    weyl_dimension,
)
from strategies import partitions as partition_st

SMALL_SHAPES = list(partitions_up_to(8))


@pytest.mark.parametrize("shape", SMALL_SHAPES, ids=str)
def test_every_small_shape_matches_hook_content(shape: tuple[int, ...]) -> None:
    for n in range(1, 7):
        want = hook_content_count(shape, n)  # Stanley, EC2, Cor. 7.21.4
        assert druse.count_tableaux(shape, n) == want, n
        assert len(druse.crystal(shape, n)) == want, n


def test_count_is_zero_without_letters() -> None:
    assert druse.count_tableaux((), 0) == 1  # the empty tableau; hook-content, empty product
    assert druse.count_tableaux((1,), 0) == 0  # no letter to place
    assert druse.count_tableaux((2, 2, 2), 2) == 0  # more rows than letters (strict columns)
    assert len(druse.crystal((1, 1, 1), 2)) == 0


@pytest.mark.parametrize("shape", list(partitions_up_to(6)), ids=str)
def test_reference_enumerator_agrees(shape: tuple[int, ...]) -> None:
    for n in range(1, 5):
        assert len(ssyt(shape, n)) == hook_content_count(shape, n)  # Stanley, EC2, Cor. 7.21.4
        assert druse.count_tableaux(shape, n) == len(ssyt(shape, n))


@given(partition_st(max_size=30, max_rows=9))
def test_weyl_dimension_formula(shape: tuple[int, ...]) -> None:
    for n in range(1, 11):
        # Weyl dimension formula, Fulton-Harris, Representation Theory, 1991, (15.17)
        assert druse.count_tableaux(shape, n) == weyl_dimension(shape, n), n


@pytest.mark.parametrize(
    ("shape", "n", "want"),
    [
        ((2, 1), 3, 8),  # adjoint representation of SL_3, dimension 3^2 - 1 (from memory)
        ((1, 1), 4, 6),  # exterior square of C^4 (from memory)
        ((2, 2), 3, 6),  # from memory: dimension of the GL_3 module (2,2)
        ((3, 1), 3, 15),  # from memory
        # staircase (n-1, ..., 1) with n letters: 2^(n choose 2) tableaux (from memory)
        ((4, 3, 2, 1), 5, 2**10),
        ((5, 4, 3, 2, 1), 6, 2**15),  # same fact
        ((6, 5, 4, 3, 2, 1), 7, 2**21),  # same fact
        ((6, 4, 2), 10, 17200755),  # the figure; hook-content (EC2 7.21.4) agrees below
        ((5, 4, 3, 2, 1), 7, 473088),  # the figure
        ((4, 3, 2, 1), 8, 177408),  # the figure
        ((6, 5, 4, 3, 2, 1), 8, 56229888),  # the figure
    ],
)
def test_known_counts(shape: tuple[int, ...], n: int, want: int) -> None:
    assert hook_content_count(shape, n) == want  # Stanley, EC2, Cor. 7.21.4
    assert weyl_dimension(shape, n) == want  # Fulton-Harris (15.17)
    assert druse.count_tableaux(shape, n) == want


@pytest.mark.parametrize(("shape", "n"), [((4, 2, 1), 6), ((3, 3), 5), ((6, 4, 2), 6), ((1,), 1)])
@pytest.mark.parametrize("threads", [1, 2])
def test_walking_every_tableau_counts_them(shape: tuple[int, ...], n: int, threads: int) -> None:
    want = hook_content_count(shape, n)  # Stanley, EC2, Cor. 7.21.4
    assert druse.count_by_enumeration(shape, n, threads=threads) == want


def test_counts_past_two_to_the_32() -> None:
    want = hook_content_count((8, 8), 15)  # Stanley, EC2, Cor. 7.21.4
    assert want > 2**32
    assert druse.count_tableaux((8, 8), 15) == want
    assert druse.count_tableaux((8, 8), 15) == weyl_dimension((8, 8), 15)  # Fulton-Harris (15.17)


def test_counts_past_two_to_the_64_stay_exact() -> None:
    shape, n = (30, 20, 10, 5), 60
    want = hook_content_count(shape, n)  # Stanley, EC2, Cor. 7.21.4
    assert want > 2**64
    assert druse.count_tableaux(shape, n) == want
    assert druse.count_tableaux((4,) * 40, 200) == weyl_dimension((4,) * 40, 200)  # F-H (15.17)


@pytest.mark.parametrize("k", range(9))
@pytest.mark.parametrize("n", range(1, 8))
def test_one_row_and_one_column(k: int, n: int) -> None:
    row, column = (k,), (1,) * k
    assert druse.count_tableaux(row, n) == comb(n + k - 1, k)  # multisets of size k: Sym^k C^n
    assert druse.count_tableaux(column, n) == comb(n, k)  # k-subsets: exterior power Lambda^k C^n


def test_hook_length_formula_on_staircases() -> None:
    # OEIS A005118 (SYT of staircase shape (k-1, ..., 1)): 1, 1, 2, 16, 768, 292864 (from memory)
    a005118 = [1, 1, 2, 16, 768, 292864]
    staircases = [tuple(range(k - 1, 0, -1)) for k in range(1, 7)]
    assert [standard_count(s) for s in staircases] == a005118


@pytest.mark.parametrize("k", range(11))
def test_sum_of_squares_of_standard_counts(k: int) -> None:
    # sum over lambda |- k of (f^lambda)^2 = k!: Robinson-Schensted correspondence (from memory)
    assert sum(standard_count(s) ** 2 for s in partitions(k)) == factorial(k)


def test_number_of_standard_tableaux_of_size_k() -> None:
    # OEIS A000085 (involutions = SYT with k cells): 1, 1, 2, 4, 10, 26, 76, 232, 764 (from memory)
    a000085 = [1, 1, 2, 4, 10, 26, 76, 232, 764]
    assert [sum(standard_count(s) for s in partitions(k)) for k in range(9)] == a000085


@pytest.mark.parametrize("shape", [s for s in partitions_up_to(6) if s], ids=str)
def test_crystal_counts_standard_tableaux(shape: tuple[int, ...]) -> None:
    # vertices of weight (1^k) in B(lambda), k = |lambda| letters, are the standard tableaux:
    # hook length formula (Frame-Robinson-Thrall, 1954)
    k = sum(shape)
    weights = druse.crystal(shape, k).weights()
    standard = int(np.all(weights == 1, axis=1).sum())
    assert standard == standard_count(shape)


def test_crystal_counts_standard_staircase_tableaux() -> None:
    weights = druse.crystal((3, 2, 1), 6).weights()
    assert int(np.all(weights == 1, axis=1).sum()) == 16  # OEIS A005118, (from memory)
