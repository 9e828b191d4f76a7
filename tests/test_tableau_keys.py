"""Right and left keys of tableaux against two pure-Python references built another way.

The kernel (rust/tableau/keys.rs) reads the keys off the Schutzenberger involution and Schensted
insertion. Here:

* ``slide_keys`` does the jeu de taquin of Lascoux and Schutzenberger ("Keys and standard bases",
  1990) literally: column j of K_+(T) is the last column of the anti-rectification of columns
  j..m of T, column j of K_-(T) the first column of the anti-rectification of columns 1..j, each
  anti-rectified by reverse slides, one cell at a time, in a box (no insertion, no involution);
* ``demazure_right_keys`` uses the theorem that T lies in B_w(lambda) exactly when
  K_+(T) <= key(w.lambda) (Lascoux-Schutzenberger 1990; Reiner-Shimozono, "Key polynomials and a
  flagged Littlewood-Richardson rule", 1995), with B_w closed up from the highest weight under
  f_i strings along a reduced word (Kashiwara 1993; Littelmann 1995): the right key weight of T
  is w.lambda for the smallest B_w holding T (they are nested along Bruhat order).
"""

from __future__ import annotations

import itertools
from collections.abc import Sequence

import numpy as np
import numpy.typing as npt
import pytest
from hypothesis import given, settings

import druse
from druse import _core
from druse.tableau_keys import (
    left_key,
    left_key_weights,
    left_keys,
    right_key,
    right_key_weights,
    right_keys,
)
from reference import tableaux as ref
from reference.keys import slide_keys
from strategies import shapes_and_n

Shape = tuple[int, ...]
Rows = list[list[int]]

SMALL = [(s, n) for n in range(1, 5) for s in ref.partitions_up_to(6) if len(s) <= n]


# --- reference 2: the Demazure crystal theorem --------------------------------------------------


def reduced_word(perm: Sequence[int]) -> tuple[int, ...]:
    """A reduced word (i1, ..., ik) with perm = s_{i1} ... s_{ik}, by bubble sort."""
    p, steps = list(perm), list[int]()
    while True:
        i = next((i for i in range(len(p) - 1) if p[i] > p[i + 1]), None)
        if i is None:
            return tuple(reversed(steps))
        p[i], p[i + 1] = p[i + 1], p[i]
        steps.append(i + 1)


def act(perm: Sequence[int], lam: Shape, n: int) -> tuple[int, ...]:
    """w.lambda, with (w.lambda)_{w(j)} = lambda_j (the contract's convention)."""
    parts = list(lam) + [0] * (n - len(lam))
    out = [0] * n
    for j in range(n):
        out[perm[j] - 1] = parts[j]
    return tuple(out)


def closure(crystal: druse.TableauCrystal, word: Sequence[int], start: int, up: bool) -> set[int]:
    """D_{i1}(...D_{ik}({start})): f_i strings (or e_i strings when up), D_{ik} applied first."""
    found = {start}
    for i in reversed(word):
        op = crystal.e(i) if up else crystal.f(i)
        grown = set(found)
        for v in found:
            target = int(op[v])
            while target >= 0:
                grown.add(target)
                target = int(op[target])
        found = grown
    return found


def demazure_right_keys(crystal: druse.TableauCrystal) -> list[tuple[int, ...]]:
    """Right key weight of every vertex: w.lambda for the smallest B_w(lambda) containing it."""
    n, lam = crystal.n, crystal.shape
    best: list[tuple[int, tuple[int, ...]]] = [(len(crystal) + 1, ())] * len(crystal)
    for perm in itertools.permutations(range(1, n + 1)):
        members = closure(crystal, reduced_word(perm), crystal.highest_weight(), up=False)
        for v in members:
            best[v] = min(best[v], (len(members), act(perm, lam, n)))
    return [alpha for _size, alpha in best]


def key_tableau(alpha: Sequence[int], shape: Shape) -> list[int]:
    """Cells (row-major) of the key of alpha: column c holds {j : alpha_j >= c}, increasing."""
    columns = [
        [j + 1 for j, a in enumerate(alpha) if a >= c]
        for c in range(1, (shape[0] if shape else 0) + 1)
    ]
    return [columns[c][r] for r, length in enumerate(shape) for c in range(length)]


def nested_columns(cells: npt.NDArray[np.uint8], shape: Shape) -> bool:
    starts = np.cumsum((0, *shape))
    width = shape[0] if shape else 0
    cols = [
        {int(cells[starts[r] + c]) for r in range(len(shape)) if shape[r] > c} for c in range(width)
    ]
    return all(cols[c + 1] <= cols[c] for c in range(width - 1))


def as_rows(crystal: druse.TableauCrystal, v: int) -> Rows:
    return [list(row) for row in crystal.tableau(v)]


def flat(rows: Rows) -> list[int]:
    return [x for row in rows for x in row]


# --- checks ------------------------------------------------------------------------------------


@pytest.mark.parametrize(("shape", "n"), SMALL)
def test_keys_match_both_references(shape: Shape, n: int) -> None:
    crystal = druse.crystal(shape, n)
    right, left = right_keys(crystal), left_keys(crystal)
    by_demazure = demazure_right_keys(crystal)  # Lascoux-Schutzenberger 1990 theorem
    for v in range(len(crystal)):
        want_right, want_left = slide_keys(as_rows(crystal, v))  # LS 1990 definition
        assert right[v].tolist() == flat(want_right)
        assert left[v].tolist() == flat(want_left)
        assert right[v].tolist() == key_tableau(by_demazure[v], shape)
    assert right_key_weights(crystal).tolist() == [list(a) for a in by_demazure]


@pytest.mark.parametrize(("shape", "n"), SMALL)
def test_left_keys_by_opposite_demazure_crystals(shape: Shape, n: int) -> None:
    # from memory: the Schutzenberger involution swaps right and left keys and sends B_w(lambda)
    # to the opposite Demazure crystal closed down from the lowest weight under e_i strings; so
    # K_-(T) has content u.(w0.lambda) for the smallest such crystal of u that holds T.
    crystal = druse.crystal(shape, n)
    w0_lam = tuple(reversed(act(range(1, n + 1), shape, n)))
    best: list[tuple[int, tuple[int, ...]]] = [(len(crystal) + 1, ())] * len(crystal)
    for perm in itertools.permutations(range(1, n + 1)):
        members = closure(crystal, reduced_word(perm), crystal.lowest_weight(), up=True)
        alpha = tuple(w0_lam[perm.index(k + 1)] for k in range(n))  # (u.beta)_{u(j)} = beta_j
        for v in members:
            best[v] = min(best[v], (len(members), alpha))
    assert left_key_weights(crystal).tolist() == [list(a) for _size, a in best]


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 3), ((3, 1), 3), ((2, 2, 1), 4), ((3, 2), 4)])
def test_demazure_masks_both_ways(shape: Shape, n: int) -> None:
    # T in B_w(lambda) iff K_+(T) <= key(w.lambda) entrywise (Lascoux-Schutzenberger 1990;
    # Reiner-Shimozono 1995), for every w in S_n, by two different reduced words where w has two.
    crystal = druse.crystal(shape, n)
    right = right_keys(crystal).astype(np.int64)
    for perm in itertools.permutations(range(1, n + 1)):
        bound = np.array(key_tableau(act(perm, shape, n), shape), dtype=np.int64)
        by_keys = set(np.flatnonzero((right <= bound).all(axis=1)).tolist())
        word = reduced_word(perm)
        assert closure(crystal, word, crystal.highest_weight(), up=False) == by_keys
        other = reduced_word_from_the_right(perm)
        assert closure(crystal, other, crystal.highest_weight(), up=False) == by_keys


def reduced_word_from_the_right(perm: Sequence[int]) -> tuple[int, ...]:
    """Another reduced word of perm: sort the inverse (perm^-1 = s_{ik} ... s_{i1})."""
    inverse = [perm.index(k) + 1 for k in range(1, len(perm) + 1)]
    return tuple(reversed(reduced_word(inverse)))


def bruhat_leq(u: Sequence[int], w: Sequence[int]) -> bool:
    """u <= w in Bruhat order: every sorted prefix of u is entrywise <= that of w (the tableau
    criterion; Bjorner-Brenti, "Combinatorics of Coxeter Groups", 2005, Thm. 2.6.3)."""
    return all(
        all(a <= b for a, b in zip(sorted(u[:i]), sorted(w[:i]), strict=True))
        for i in range(1, len(u))
    )


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 3), ((2, 1, 1), 4), ((3, 1), 4), ((2, 2), 4)])
def test_atoms_are_the_tableaux_of_one_right_key(shape: Shape, n: int) -> None:
    # The Demazure atom of alpha = w.lambda (w shortest with it) is B_w minus the B_v, v < w, and
    # is the set of T with K_+(T) = key(alpha) (Lascoux-Schutzenberger 1990; Mason, "An explicit
    # construction of type A Demazure atoms", 2009).
    crystal = druse.crystal(shape, n)
    perms = sorted(itertools.permutations(range(1, n + 1)), key=lambda p: len(reduced_word(p)))
    masks = {
        p: closure(crystal, reduced_word(p), crystal.highest_weight(), up=False) for p in perms
    }
    weights = [tuple(a) for a in right_key_weights(crystal).tolist()]
    seen: set[tuple[int, ...]] = set()
    for w in perms:
        alpha = act(w, shape, n)
        if alpha in seen:
            continue  # a longer w with the same w.lambda
        seen.add(alpha)
        below = set().union(*(masks[v] for v in perms if v != w and bruhat_leq(v, w)))
        atom = masks[w] - below
        assert atom == {v for v in range(len(crystal)) if weights[v] == alpha}


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 3), ((3, 2, 1), 4), ((2, 2), 4), ((4, 1), 3)])
def test_key_properties(shape: Shape, n: int) -> None:
    crystal = druse.crystal(shape, n)
    cells = crystal.tableaux()
    right, left = right_keys(crystal), left_keys(crystal)
    # keys are key tableaux bounding T: K_-(T) <= T <= K_+(T) (Lascoux-Schutzenberger 1990)
    assert (left <= cells).all()
    assert (cells <= right).all()
    for key in (right, left):
        assert all(nested_columns(row, shape) for row in key)
        assert all(ref.is_semistandard(rows_of(row, shape), n) for row in key)
    # the content of a key tableau is its weight
    assert (right_key_weights(crystal) == _core.TableauModel(list(shape), n).weights(right)).all()
    # a key tableau is its own right and left key (LS 1990); all n!/stab keys occur
    keyed = [v for v in range(len(crystal)) if nested_columns(cells[v], shape)]
    assert all((right[v] == cells[v]).all() and (left[v] == cells[v]).all() for v in keyed)
    orbit = {act(p, shape, n) for p in itertools.permutations(range(1, n + 1))}
    assert len(keyed) == len(orbit)
    assert {tuple(a) for a in right_key_weights(crystal).tolist()} == orbit
    # highest weight: its own right key, and the only tableau with right key content lambda
    hw = crystal.highest_weight()
    assert (right[hw] == cells[hw]).all()
    dominant = act(range(1, n + 1), shape, n)
    assert sum(tuple(a) == dominant for a in right_key_weights(crystal).tolist()) == 1
    assert (left[crystal.lowest_weight()] == cells[crystal.lowest_weight()]).all()


def rows_of(cells: npt.NDArray[np.uint8], shape: Shape) -> Rows:
    starts = np.cumsum((0, *shape))
    return [cells[starts[r] : starts[r + 1]].tolist() for r in range(len(shape))]


def test_worked_example() -> None:
    # T = 1 2 / 3 = f_1 f_2 (1 1 / 2) is in B_{s1 s2}(2,1) but not in B_{s1} or B_{s2} (signature
    # rule, by hand), so K_+(T) = key((0,2,1)) = 2 2 / 3 by the LS 1990 theorem above.
    crystal = druse.crystal((2, 1), 3)
    v = crystal.index([[1, 2], [3]])
    assert right_key(crystal, v) == ((2, 2), (3,))
    assert right_key_weights(crystal)[v].tolist() == [0, 2, 1]
    assert left_keys(crystal)[v].tolist() == [1, 1, 3]
    assert left_key(crystal, v) == ((1, 1), (3,))


@settings(max_examples=25)
@given(shapes_and_n(max_size=7, max_n=6))
def test_random_crystals_match_the_slides(case: tuple[Shape, int]) -> None:
    shape, n = case
    crystal = druse.crystal(shape, n)
    right, left = right_keys(crystal), left_keys(crystal)
    for v in range(0, len(crystal), max(1, len(crystal) // 60)):
        want_right, want_left = slide_keys(as_rows(crystal, v))
        assert right[v].tolist() == flat(want_right)
        assert left[v].tolist() == flat(want_left)


def test_results_are_read_only_cached_and_deterministic() -> None:
    crystal = druse.crystal((4, 2, 1), 6)
    right = right_keys(crystal)
    assert right is right_keys(crystal)
    assert not right.flags.writeable
    with pytest.raises(ValueError, match="read-only"):
        right[0, 0] = 1
    again, _weights = _core.tableau_keys([4, 2, 1], 6, crystal.tableaux(), "right")
    assert (again == right).all()


def test_bad_input() -> None:
    with pytest.raises(TypeError, match="tableau crystal"):
        right_keys(druse.Crystal(2, 1, [[-1]]))  # type: ignore[arg-type]
    crystal = druse.crystal((2, 1), 3)
    with pytest.raises(ValueError, match="v must"):
        right_key(crystal, len(crystal))
    cells = crystal.tableaux()
    with pytest.raises(ValueError, match="which must be 'right' or 'left'"):
        _core.tableau_keys([2, 1], 3, cells, "up")
    with pytest.raises(ValueError, match="of 4 cells each"):
        _core.tableau_keys([2, 2], 3, cells, "right")
    bad = np.array([[2, 1, 3]], dtype=np.uint8)
    with pytest.raises(ValueError, match=r"cells\[0\] is not a semistandard tableau"):
        _core.tableau_keys([2, 1], 3, bad, "left")
    with pytest.raises(ValueError, match=r"entries must be in 1\.\.3"):
        _core.tableau_keys([2, 1], 3, np.array([[1, 1, 4]], dtype=np.uint8), "right")
    with pytest.raises(ValueError, match="weakly decreasing"):
        _core.tableau_keys([1, 2], 3, cells, "right")


def test_empty_shape() -> None:
    crystal = druse.crystal((), 3)
    assert right_keys(crystal).shape == (1, 0)
    assert right_key_weights(crystal).tolist() == [[0, 0, 0]]
    assert right_key(crystal, 0) == ()
    assert left_key(crystal, 0) == ()
