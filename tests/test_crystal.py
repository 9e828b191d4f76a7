"""The crystal B(lambda): axioms on every vertex; every vertex and arrow against the reference."""

from __future__ import annotations

from collections import Counter

import numpy as np
import numpy.typing as npt
import pytest
from hypothesis import given
from hypothesis import strategies as st

import druse
from reference import tableaux as ref
from strategies import shapes_and_n

Shape = tuple[int, ...]


def fitting(max_size: int, ns: range) -> list[tuple[Shape, int]]:
    """Every (shape, n) with |shape| <= max_size, n in ns and at most n rows."""
    return [(s, n) for n in ns for s in ref.partitions_up_to(max_size) if len(s) <= n]


SMALL = fitting(6, range(1, 5))
LARGER = fitting(6, range(5, 7))
LARGEST = [(s, n) for s, n in fitting(8, range(5, 7)) if sum(s) > 6]


def padded(shape: Shape, n: int) -> list[int]:
    return list(shape) + [0] * (n - len(shape))


def string_lengths(op: npt.NDArray[np.int64]) -> npt.NDArray[np.int64]:
    """How many times op applies from each vertex, by iterating the array itself."""
    steps = np.zeros(op.size, dtype=np.int64)
    current = np.arange(op.size)
    alive = op[current] >= 0
    while alive.any():
        steps += alive
        current = np.where(alive, op[current], current)
        alive = alive & (op[current] >= 0)
    return steps


def check_axioms(shape: Shape, n: int) -> None:
    C = druse.crystal(shape, n)
    w = C.weights().astype(np.int64)
    assert w.shape == (len(C), n)
    for i in range(1, n):
        f, e = C.f(i), C.e(i)
        down, up = np.flatnonzero(f >= 0), np.flatnonzero(e >= 0)
        assert np.array_equal(e[f[down]], down)  # e_i f_i b = b (crystal axiom)
        assert np.array_equal(f[e[up]], up)  # f_i e_i b = b
        alpha = np.zeros(n, dtype=np.int64)
        alpha[[i - 1, i]] = [1, -1]
        assert np.array_equal(w[f[down]], w[down] - alpha)  # wt(f_i b) = wt(b) - alpha_i
        phi, eps = C.phi(i).astype(np.int64), C.epsilon(i).astype(np.int64)
        assert np.array_equal(phi - eps, w[:, i - 1] - w[:, i])  # <h_i, wt b> = phi - epsilon
        assert np.array_equal(phi, string_lengths(f))  # phi_i = length of the f_i string
        assert np.array_equal(eps, string_lengths(e))
    top = ref.highest_weight_tableau(shape)
    assert C.highest_weights().tolist() == [0]  # one highest weight: B(lambda) is connected
    assert C.highest_weight() == 0 == C.index(top)  # vertex 0 by the documented order
    assert C.tableau(0) == top
    assert w[0].tolist() == padded(shape, n)  # its weight is lambda
    assert C.lowest_weights().tolist() == [len(C) - 1] == [C.lowest_weight()]
    assert C.tableau(len(C) - 1) == ref.lowest_weight_tableau(shape, n)
    assert not C.components().any()  # one component, labelled by its smallest vertex 0


@pytest.mark.parametrize(("shape", "n"), SMALL, ids=str)
def test_axioms_on_every_vertex(shape: Shape, n: int) -> None:
    check_axioms(shape, n)


@pytest.mark.parametrize(("shape", "n"), LARGER, ids=str)
def test_axioms_on_every_vertex_more_letters(shape: Shape, n: int) -> None:
    check_axioms(shape, n)


@pytest.mark.slow
@pytest.mark.parametrize(("shape", "n"), LARGEST, ids=str)
def test_axioms_on_every_vertex_larger(shape: Shape, n: int) -> None:
    check_axioms(shape, n)


def check_against_reference(shape: Shape, n: int, all_at_once: bool) -> None:
    C = druse.crystal(shape, n)
    if all_at_once:
        C.operator_tables()
    tabs = ref.ssyt(shape, n)
    order = sorted(tabs, key=lambda t: ref.level_chain(t, n), reverse=True)  # rust/tableau/mod.rs
    assert [C.tableau(v) for v in range(len(C))] == order
    where = {t: C.index(t) for t in tabs}
    assert sorted(where.values()) == list(range(len(C)))
    w = C.weights()
    for t, v in where.items():
        assert w[v].tolist() == list(ref.weight(t, n))
        for i in range(1, n):
            down, up = ref.f(t, i), ref.e(t, i)
            assert C.f(i)[v] == (-1 if down is None else where[down]), (t, i)
            assert C.e(i)[v] == (-1 if up is None else where[up]), (t, i)
            assert C.phi(i)[v] == ref.phi(t, i), (t, i)
            assert C.epsilon(i)[v] == ref.epsilon(t, i), (t, i)


@given(shapes_and_n(max_size=7, max_n=5), st.booleans())
def test_every_vertex_and_arrow_matches_reference(
    case: tuple[Shape, int], all_at_once: bool
) -> None:
    check_against_reference(*case, all_at_once)


@pytest.mark.parametrize(
    ("shape", "n"), [((3, 1), 3), ((2, 2, 1), 4), ((3, 2, 1), 4), ((4, 2), 5), ((2, 1, 1), 6)]
)
def test_fixed_cases_match_reference(shape: Shape, n: int) -> None:
    check_against_reference(shape, n, all_at_once=False)


@pytest.mark.parametrize(("shape", "n"), [((3, 1), 3), ((3, 3, 2), 4), ((4, 2, 1), 5), ((2,), 1)])
def test_tableaux_hold_each_ssyt_once(shape: Shape, n: int) -> None:
    C = druse.crystal(shape, n)
    cells = C.tableaux()
    assert cells.dtype == np.uint8
    assert cells.shape == (len(C), sum(shape))
    assert not cells.flags.writeable
    got = [tuple(row) for row in cells.tolist()]
    want = [tuple(x for row in t for x in row) for t in ref.ssyt(shape, n)]
    assert Counter(got) == Counter(want)
    for v in range(len(C)):
        assert C.index(C.tableau(v)) == v
        assert ref.is_semistandard(C.tableau(v), n)


def test_construction_is_deterministic() -> None:
    a, b = druse.crystal((4, 2, 1), 5), druse.crystal((4, 2, 1), 5)
    assert np.array_equal(a.tableaux(), b.tableaux())
    b.operator_tables()
    for i in range(1, 5):
        assert np.array_equal(a.f(i), b.f(i))
        assert np.array_equal(a.e(i), b.e(i))
        assert np.array_equal(a.phi(i), b.phi(i))
        assert np.array_equal(a.epsilon(i), b.epsilon(i))


def test_edges_list_every_arrow() -> None:
    C = druse.crystal((3, 2), 4)
    edges = C.edges()
    assert edges.dtype == np.int64
    want = [(v, i, int(C.f(i)[v])) for i in range(1, 4) for v in range(len(C)) if C.f(i)[v] >= 0]
    assert [tuple(row) for row in edges.tolist()] == want


def test_small_and_empty_crystals() -> None:
    empty = druse.crystal((1, 1, 1), 2)  # more rows than letters
    assert len(empty) == 0
    assert empty.tableaux().shape == (0, 3)
    assert empty.weights().shape == (0, 2)
    assert empty.highest_weights().size == 0
    assert empty.edges().shape == (0, 3)
    assert empty.character().to_dict() == {}
    with pytest.raises(ValueError, match="empty"):
        empty.highest_weight()
    point = druse.crystal((), 3)  # the empty tableau: the trivial representation
    assert len(point) == 1
    assert point.tableau(0) == ()
    assert point.index([]) == 0
    assert point.f(1).tolist() == [-1]
    assert point.character().to_dict() == {(0, 0, 0): 1}
    line = druse.crystal((3,), 1)  # GL_1: one vertex, no operators
    assert len(line) == 1
    assert line.edges().shape == (0, 3)
    assert line.character().to_dict() == {(3,): 1}


@pytest.mark.parametrize(("shape", "n"), SMALL, ids=str)
def test_character_is_the_schur_polynomial(shape: Shape, n: int) -> None:
    C = druse.crystal(shape, n)
    char = C.character()
    # brute force over the reference tableaux: the character is the sum of x^wt(T)
    assert char.to_dict() == dict(Counter(ref.weight(t, n) for t in ref.ssyt(shape, n)))
    # s_lambda = sum over SSYT of x^wt(T) (Stanley, EC2, Def. 7.10.1, from memory)
    assert char == druse.schur(shape, n)


@pytest.mark.parametrize(("shape", "n"), SMALL, ids=str)
def test_character_is_symmetric(shape: Shape, n: int) -> None:
    # the character of a crystal of a GL_n-module is symmetric: s_i acts on each i-string by
    # reversing it (Kashiwara 1994, from memory)
    terms = druse.crystal(shape, n).character().to_dict()
    for i in range(n - 1):
        for exps, c in terms.items():
            swapped = list(exps)
            swapped[i], swapped[i + 1] = swapped[i + 1], swapped[i]
            assert terms.get(tuple(swapped)) == c


@given(shapes_and_n(max_size=7, max_n=5), st.integers(0, 2**32 - 1))
def test_masked_character_counts_weights(case: tuple[Shape, int], seed: int) -> None:
    shape, n = case
    C = druse.crystal(shape, n)
    mask = np.random.default_rng(seed).random(len(C)) < 0.4
    brute = Counter(tuple(C.weights()[v].tolist()) for v in np.flatnonzero(mask))
    got = C.character(mask)
    assert got.to_dict() == dict(brute)
    assert got == druse.Poly.from_dict(dict(brute), n)
    assert C.character(np.zeros(len(C), dtype=bool)).to_dict() == {}
    assert C.character(np.ones(len(C), dtype=bool)) == C.character()
