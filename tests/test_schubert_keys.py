"""Schubert-to-key expansions by two routes, and Stanley symmetric functions in the Schur basis."""

from __future__ import annotations

import math
from collections import Counter

import pytest

import druse
from druse.schubert_keys import (
    all_schubert_key_expansions,
    schubert_key_expansion,
    stanley_schur_expansion,
)
from reference.reduced_words import all_perms, edelman_greene_shapes, inverse, reduced_words
from strategies import random_perms

Perm = tuple[int, ...]


def code(w: Perm) -> tuple[int, ...]:
    """The Lehmer code: c_j = #{k > j : w(k) < w(j)}."""
    return tuple(sum(1 for b in w[j + 1 :] if b < a) for j, a in enumerate(w))


def vexillary(w: Perm) -> bool:
    """No pattern 2143: no a < b < c < d with w(b) < w(a) < w(d) < w(c)."""
    n = len(w)
    return not any(
        w[b] < w[a] < w[d] < w[c]
        for a in range(n)
        for b in range(a + 1, n)
        for c in range(b + 1, n)
        for d in range(c + 1, n)
    )


def syt_count(shape: tuple[int, ...]) -> int:
    """f^lambda by the hook length formula (Frame-Robinson-Thrall 1954)."""
    conj = [sum(1 for p in shape if p > j) for j in range(shape[0])] if shape else []
    hooks = math.prod(
        length - c + conj[c] - r - 1 for r, length in enumerate(shape) for c in range(length)
    )
    return math.factorial(sum(shape)) // hooks


def grouped(expansion: dict[tuple[int, ...], int]) -> Counter[tuple[int, ...]]:
    out: Counter[tuple[int, ...]] = Counter()
    for alpha, c in expansion.items():
        out[tuple(sorted((a for a in alpha if a), reverse=True))] += c
    return out


@pytest.mark.parametrize("w", all_perms(5))
def test_routes_agree_on_s5(w: Perm) -> None:
    by_crystal = schubert_key_expansion(w)
    assert by_crystal == schubert_key_expansion(w, method="polynomial")
    assert by_crystal == schubert_key_expansion(w, method="factorizations")
    assert all(c > 0 for c in by_crystal.values())  # Lascoux-Schutzenberger 1990: positive
    # keys stabilise to Schur functions (Lascoux-Schutzenberger 1990; Reiner-Shimozono 1995)
    assert grouped(by_crystal) == Counter(stanley_schur_expansion(w))


@pytest.mark.parametrize("w", random_perms(6, 12, 6))
def test_routes_agree_on_random_s6(w: Perm) -> None:
    by_crystal = schubert_key_expansion(w)
    assert by_crystal == schubert_key_expansion(w, method="polynomial")
    assert by_crystal == schubert_key_expansion(w, method="factorizations")
    assert grouped(by_crystal) == Counter(stanley_schur_expansion(w))


@pytest.mark.slow
@pytest.mark.parametrize("w", random_perms(7, 6, 7))
def test_routes_agree_on_random_s7(w: Perm) -> None:
    by_crystal = schubert_key_expansion(w)
    assert by_crystal == schubert_key_expansion(w, method="polynomial")
    assert grouped(by_crystal) == Counter(stanley_schur_expansion(w))


@pytest.mark.parametrize("w", all_perms(4) + all_perms(5) + random_perms(6, 5, 60))
def test_stanley_expansion_against_edelman_greene(w: Perm) -> None:
    expansion = stanley_schur_expansion(w)
    # Edelman-Greene 1987, insertion tableaux of the reduced words of w^-1 (see the module doc)
    assert Counter(expansion) == edelman_greene_shapes(inverse(w))
    # Stanley 1984: the number of reduced words is sum c_lambda f^lambda
    assert sum(c * syt_count(lam) for lam, c in expansion.items()) == len(reduced_words(w))


@pytest.mark.parametrize("n", [2, 3, 4, 5, 6])
def test_longest_element(n: int) -> None:
    w0 = tuple(range(n, 0, -1))
    staircase = tuple(range(n - 1, 0, -1))
    assert stanley_schur_expansion(w0) == {staircase: 1}  # F_w0 = s_staircase (Stanley 1984)
    assert schubert_key_expansion(w0) == {(*staircase, 0): 1}  # S_w0 = x^staircase, one key


@pytest.mark.parametrize("w", all_perms(5))
def test_vexillary_schuberts_are_single_keys(w: Perm) -> None:
    # S_w = key(code(w)) exactly when w avoids 2143 (Lascoux-Schutzenberger 1990; from memory)
    expansion = schubert_key_expansion(w)
    assert (expansion == {code(w): 1}) == vexillary(w)
    assert code(w) in expansion  # the leading key is that of the code (from memory)


def test_published_example() -> None:
    # S_1432 = x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3 (Macdonald, Notes on Schubert
    # Polynomials, 1991, table of S_4; from memory), which is key(0, 2, 1)
    assert schubert_key_expansion((1, 4, 3, 2)) == {(0, 2, 1, 0): 1}
    assert druse.key((0, 2, 1, 0)) == druse.Poly.from_dict(
        {(2, 1, 0, 0): 1, (2, 0, 1, 0): 1, (1, 2, 0, 0): 1, (1, 1, 1, 0): 1, (0, 2, 1, 0): 1}, 4
    )
    # 2143 is not vexillary: S_2143 = x1^2 + x1 x2 + x1 x3 = key(2,0,0,0) + key(1,0,1,0)
    assert schubert_key_expansion((2, 1, 4, 3)) == {(1, 0, 1, 0): 1, (2, 0, 0, 0): 1}


def test_the_batch_matches_one_at_a_time() -> None:
    seen: list[tuple[int, int]] = []
    batch = all_schubert_key_expansions(5, progress=lambda done, total: seen.append((done, total)))
    assert batch == [schubert_key_expansion(w) for w in druse.all_permutations(5)]
    assert seen[-1] == (120, 120)
    # sum over S_n of the number of keys, all coefficients counted (from this route and the
    # polynomial one, which agree on S_5 above)
    assert sum(sum(e.values()) for e in batch) == sum(
        sum(schubert_key_expansion(w, method="polynomial").values()) for w in all_perms(5)
    )
    with pytest.raises(ValueError, match=r"n must be in 1\.\.12"):
        all_schubert_key_expansions(13)


def test_bad_input() -> None:
    with pytest.raises(ValueError, match="method"):
        schubert_key_expansion((1, 2), method="tableaux")
    with pytest.raises(ValueError, match="0-based"):
        schubert_key_expansion((1, 0))
    with pytest.raises(TypeError):
        stanley_schur_expansion(None)  # type: ignore[arg-type]


@pytest.mark.slow
def test_huge_stanley_search_is_refused_not_exhausting_memory() -> None:
    # w0 of S_12 has 2^66 decreasing factorizations into 11 factors (hook-content count of
    # staircase shape, Stanley 1984): the search stops at its memo cap with TooLargeError
    with pytest.raises(druse.TooLargeError, match="decreasing factorizations"):
        druse.stanley_schur_expansion(tuple(range(12, 0, -1)))
