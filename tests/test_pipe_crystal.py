"""The crystal on decreasing factorizations and its truncation to reduced pipe dreams."""

from __future__ import annotations

import math
from collections import Counter

import numpy as np
import pytest

import druse
from druse.pipe_crystal import factorization_crystal, pipe_dream_crystal
from reference.reduced_words import (
    all_perms,
    edelman_greene_shapes,
    inverse,
    schuberts_by_sympy,
    schur_by_sympy,
    symbols,
)

Perm = tuple[int, ...]
SCHUBERT_4 = schuberts_by_sympy(4)
SCHUBERT_5 = schuberts_by_sympy(5)


def hook_content(shape: tuple[int, ...], n: int) -> int:
    """s_lambda(1^n) = prod (n + c(u)) / h(u) (Stanley, EC2, Cor. 7.21.4)."""
    conj = [sum(1 for p in shape if p > j) for j in range(shape[0])] if shape else []
    top, bottom = 1, 1
    for r, length in enumerate(shape):
        for c in range(length):
            top *= n + c - r
            bottom *= length - c + conj[c] - r - 1
    return top // bottom


@pytest.mark.parametrize("w", all_perms(4) + all_perms(5))
def test_bounded_character_is_the_schubert_polynomial(w: Perm) -> None:
    expected = (SCHUBERT_4 if len(w) == 4 else SCHUBERT_5)[w]  # sympy divided differences
    C = factorization_crystal(w)
    xs = symbols(len(w))
    assert C.character(C.bounded()).to_sympy(xs) == expected
    assert pipe_dream_crystal(w).character().to_sympy(xs) == expected


@pytest.mark.parametrize("w", all_perms(4) + all_perms(5)[::7])
def test_components_are_schur_characters_with_edelman_greene_shapes(w: Perm) -> None:
    C = factorization_crystal(w)
    n, labels, wt = len(w), C.components(), C.weights()
    shapes: Counter[tuple[int, ...]] = Counter()
    for top in C.highest_weights():
        lam = tuple(int(x) for x in wt[top] if x > 0)
        shapes[lam] += 1
        char = C.character(labels == labels[top])
        assert char == druse.schur(lam, n)
        if n == 4:
            assert char.to_sympy(symbols(n)) == schur_by_sympy(lam, n)  # Jacobi bialternant
    # Edelman-Greene 1987: with F_w summed over decreasing factorizations, the shapes are those
    # of the insertion tableaux of the reduced words of w^-1 (the reversed words of w)
    assert shapes == edelman_greene_shapes(inverse(w))


@pytest.mark.parametrize("w", all_perms(4) + all_perms(5))
def test_crystal_axioms(w: Perm) -> None:
    C = factorization_crystal(w)
    wt = C.weights().astype(np.int64)
    everyone = np.arange(len(C))
    for i in range(1, C.n):
        f, e = C.f(i), C.e(i)
        down, up = np.flatnonzero(f >= 0), np.flatnonzero(e >= 0)
        assert (e[f[down]] == down).all()
        assert (f[e[up]] == up).all()
        alpha = np.zeros(C.n, dtype=np.int64)
        alpha[i - 1], alpha[i] = 1, -1
        assert (wt[f[down]] == wt[down] - alpha).all()  # f_i lowers by alpha_i
        assert (C.phi(i) - C.epsilon(i) == wt[everyone, i - 1] - wt[everyone, i]).all()


def test_counts_against_published_values() -> None:
    for n in range(2, 7):
        w0 = tuple(range(n, 0, -1))
        staircase = tuple(range(n - 1, 0, -1))
        # F_w0 = s_staircase (Stanley 1984; Edelman-Greene 1987), counted by hook-content
        assert len(factorization_crystal(w0)) == hook_content(staircase, n)
        assert len(pipe_dream_crystal(w0)) == 1  # S_w0 is one monomial
        catalan = math.comb(2 * (n - 1), n - 1) // n  # C_(n-1), OEIS A000108 (Woo 2004)
        assert len(pipe_dream_crystal((1, *range(n, 1, -1)))) == catalan


@pytest.mark.parametrize("w", [(1, 4, 3, 2), (2, 1, 5, 4, 3), (3, 1, 5, 2, 4), (1, 5, 3, 4, 2)])
def test_pipe_dreams_read_reduced_words_in_ascending_mask_order(w: Perm) -> None:
    C = pipe_dream_crystal(w)
    n = len(w)
    masks = [int(m[0]) for m in C.masks()]
    assert masks == sorted(masks)
    assert len(set(masks)) == len(masks)
    for v in range(len(C)):
        crosses = C.pipe_dream(v)
        assert C.index(crosses) == v
        word = [r + c - 1 for r, c in sorted(crosses, key=lambda rc: (rc[0], -rc[1]))]
        assert len(word) == druse.demazure.length(w)  # reduced ...
        assert druse.word_permutation(word, n) == w  # ... word of w (the contract's reading)
        cells = [(r, c) for r in range(1, n) for c in range(n - r, 0, -1)]  # reading order
        assert masks[v] == sum(1 << (len(cells) - 1 - cells.index(x)) for x in crosses)
        assert tuple(C.weights()[v]) == tuple(
            sum(1 for r, _ in crosses if r == q) for q in range(1, n + 1)
        )


@pytest.mark.parametrize("w", [(2, 1, 5, 4, 3), (1, 4, 3, 2), (3, 1, 5, 2, 4), (5, 4, 3, 2, 1)])
def test_truncation_keeps_exactly_the_arrows_inside(w: Perm) -> None:
    P, F = pipe_dream_crystal(w), factorization_crystal(w)
    inside = P.vertices_in_factorization_crystal()
    assert (F.bounded()[inside]).all()
    assert inside.size == F.bounded().sum()
    for i in range(1, F.n):
        whole = F.f(i)[inside]
        kept = P.f(i)
        stays = (whole >= 0) & F.bounded()[whole]
        assert (kept[stays] >= 0).all()
        assert (inside[kept[stays]] == whole[stays]).all()
        assert (kept[~stays] == -1).all()
        leaves = (whole >= 0) & ~F.bounded()[whole]  # defined, but out of the pipe dreams
        assert (P.leaves(i) == leaves).all()
        up = F.e(i)[inside]
        assert (P.leaves(i, "e") == ((up >= 0) & ~F.bounded()[up])).all()
        assert not P.leaves(i, "e").any()  # pipe dreams are closed under e_i (Demazure)


def test_fewer_factors_keep_the_pipe_dreams() -> None:
    for w in all_perms(4):
        whole, fewer = factorization_crystal(w), factorization_crystal(w, factors=3)
        assert fewer.n == 3
        kept = [whole.factorization(v)[:3] for v in range(len(whole)) if whole.is_bounded(v)]
        assert kept == [fewer.factorization(v) for v in range(len(fewer)) if fewer.is_bounded(v)]
        assert fewer.character() == druse.Poly.from_dict(
            {e[:3]: c for e, c in whole.character().to_dict().items() if e[3] == 0}, 3
        )  # F_w in x1..x3 is F_w in x1..x4 at x4 = 0


def test_factorizations_read_back() -> None:
    C = factorization_crystal((3, 2, 1))
    rows = [C.factorization(v) for v in range(len(C))]
    assert len(set(rows)) == 8  # s_(2,1)(1,1,1) = 8, hook-content
    for v, row in enumerate(rows):
        assert C.index(row) == v
        assert all(list(u) == sorted(u, reverse=True) for u in row)
        assert C.is_bounded(v) == all(min(u, default=r) >= r for r, u in enumerate(row, 1))


def test_too_many_factorizations_are_refused(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr("druse.pipe_crystal.MEMORY_BUDGET", 64 * 4 * 10)  # room for 10
    with pytest.raises(druse.TooLargeError, match="decreasing factorizations"):
        factorization_crystal((4, 3, 2, 1))  # 64 of them
    assert len(pipe_dream_crystal((4, 3, 2, 1))) == 1  # the pipe dreams alone still fit


def test_one_letter() -> None:
    C = factorization_crystal((1,))
    assert len(C) == 1
    assert C.factorization(0) == ((),)
    assert pipe_dream_crystal((1,)).character() == druse.Poly.one(1)


def test_bad_input() -> None:
    with pytest.raises(ValueError, match="0-based"):
        factorization_crystal((0, 1, 2))
    with pytest.raises(ValueError, match="permutation"):
        pipe_dream_crystal((1, 1, 2))
    with pytest.raises(TypeError):
        pipe_dream_crystal("123")  # type: ignore[arg-type]
    C = pipe_dream_crystal((1, 3, 2))
    with pytest.raises(ValueError, match="not a reduced pipe dream"):
        C.index([(1, 1)])
    with pytest.raises(ValueError, match="row \\+ col"):
        C.index([(3, 1)])
    with pytest.raises(ValueError, match="not a reduced pipe dream"):
        C.index([(2, 1), (2, 1)])
    with pytest.raises(ValueError, match="which"):
        C.leaves(1, "g")
    with pytest.raises(ValueError, match="factors"):
        factorization_crystal((1, 2), factors=0)
    with pytest.raises(ValueError, match="n >= 1"):
        pipe_dream_crystal(())
    with pytest.raises(ValueError, match="not a decreasing factorization"):
        factorization_crystal((1, 3, 2)).index([(1,), (), ()])
