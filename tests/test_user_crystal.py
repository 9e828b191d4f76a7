"""Crystals from the user's data: edge arrays, dicts on labels, callables; and every bad input."""

from __future__ import annotations

from collections.abc import Callable
from fractions import Fraction
from typing import Any

import numpy as np
import pytest

import druse
from druse.user_crystal import LabelledCrystal, crystal_from_edges, crystal_from_operators

Tableau = tuple[tuple[int, ...], ...]

SHAPES = [((1,), 4), ((2,), 3), ((2, 1), 3), ((3, 1), 3), ((2, 2), 3), ((2, 1, 1), 4), ((3, 2), 4)]


# --- an independent tableau crystal: the contract's signature rule, written directly ----------


def _cells(t: Tableau) -> list[tuple[int, int]]:
    """Cells in row reading order: rows bottom to top, each left to right."""
    return [(r, c) for r in reversed(range(len(t))) for c in range(len(t[r]))]


def _unpaired(t: Tableau, i: int) -> tuple[list[int], list[int]]:
    """Positions of the unpaired i and unpaired i+1 in the reading word (an i+1 pairs with the
    nearest unpaired i to its right)."""
    word = [t[r][c] for r, c in _cells(t)]
    free_i: list[int] = []  # unpaired i to the right of the scan, nearest last
    free_next: list[int] = []
    for k in reversed(range(len(word))):
        if word[k] == i:
            free_i.append(k)
        elif word[k] == i + 1:
            if free_i:
                free_i.pop()
            else:
                free_next.append(k)
    return free_i, free_next


def _change(t: Tableau, k: int, value: int) -> Tableau:
    r, c = _cells(t)[k]
    rows = [list(row) for row in t]
    rows[r][c] = value
    return tuple(tuple(row) for row in rows)


def f_tableau(i: int, t: Tableau) -> Tableau | None:
    """f_i turns the rightmost unpaired i into i+1."""
    free_i, _ = _unpaired(t, i)
    return _change(t, max(free_i), i + 1) if free_i else None


def e_tableau(i: int, t: Tableau) -> Tableau | None:
    """e_i turns the leftmost unpaired i+1 into i."""
    _, free_next = _unpaired(t, i)
    return _change(t, min(free_next), i) if free_next else None


def tableau_weight(n: int) -> Callable[[Tableau], tuple[int, ...]]:
    return lambda t: tuple(sum(row.count(a) for row in t) for a in range(1, n + 1))


def hook_content(shape: tuple[int, ...], n: int) -> int:
    """Number of SSYT: prod (n + c(u)) / h(u) (Stanley, Enumerative Combinatorics 2, 7.21.2)."""
    conj = [sum(1 for p in shape if p > c) for c in range(shape[0])] if shape else []
    value = Fraction(1)
    for r, length in enumerate(shape):
        for c in range(length):
            value *= Fraction(n + c - r, length - c - 1 + conj[c] - r - 1 + 1)
    assert value.denominator == 1
    return int(value)


def string_label(t: Tableau) -> str:
    return "|".join("".join(map(str, row)) for row in t)


# --- building from edges ---------------------------------------------------------------------


def test_standard_crystal_from_an_edge_array() -> None:
    n = 4
    edges = np.array([(k - 1, k, k) for k in range(1, n)])
    c = crystal_from_edges(n, edges)
    assert type(c) is druse.Crystal
    assert c.weights().tolist() == np.eye(n, dtype=int).tolist()  # wt(k) = e_k
    assert c.character() == druse.schur((1,), n)  # B(1) has character x1 + ... + xn


@pytest.mark.parametrize(("shape", "n"), SHAPES)
def test_tableau_crystal_rebuilt_from_its_edge_array(shape: tuple[int, ...], n: int) -> None:
    b = druse.crystal(shape, n)
    given = crystal_from_edges(n, b.edges(), b.weights())
    derived = crystal_from_edges(n, b.edges())
    # Schur = character of B(lambda) (Kashiwara-Nakashima 1994)
    assert given.character() == derived.character() == druse.schur(shape, n)
    assert len(derived) == hook_content(shape, n)  # Stanley EC2 7.21.2
    assert np.array_equal(derived.f(1), b.f(1))
    # derived weights: smallest entry 0, which is the tableau weight minus lambda_n (1, ..., 1)
    last = shape[n - 1] if len(shape) >= n else 0
    assert np.array_equal(derived.weights(), b.weights() - last)
    assert np.array_equal(
        crystal_from_edges(n, b.edges(), degree=sum(shape)).weights(), b.weights()
    )


def test_derived_weights_follow_the_documented_normalisation() -> None:
    b = druse.crystal((2, 2, 1), 3)  # lambda_3 = 1, so the default is the weight minus (1, 1, 1)
    c = crystal_from_edges(3, b.edges())
    assert c.weights()[0].tolist() == [1, 1, 0]
    assert crystal_from_edges(3, b.edges(), degree=5).weights()[0].tolist() == [2, 2, 1]
    assert crystal_from_edges(3, b.edges(), degree=2).weights()[0].tolist() == [1, 1, 0]
    isolated = crystal_from_edges(3, np.zeros((0, 3), dtype=np.int64), size=2)
    assert isolated.weights().tolist() == [[0, 0, 0], [0, 0, 0]]


def test_components_are_normalised_separately() -> None:
    b = druse.crystal((2, 1), 3)
    two = np.concatenate([b.edges(), b.edges() + np.array([len(b), 0, len(b)])])
    c = crystal_from_edges(3, two, degree=6)
    assert c.weights().sum(axis=1).tolist() == [6] * (2 * len(b))
    shifted = druse.schur((2, 1), 3) * druse.schur((1, 1, 1), 3)  # adding (1,1,1): times det
    assert c.character() == shifted + shifted


@pytest.mark.parametrize(("shape", "n"), SHAPES)
def test_tableau_crystal_from_dicts_on_string_labels(shape: tuple[int, ...], n: int) -> None:
    b = druse.crystal(shape, n)
    name = [string_label(b.tableau(v)) for v in range(len(b))]
    edges: dict[int, dict[str, str]] = {i: {} for i in range(1, n)}
    pairs: dict[int, list[tuple[str, str]]] = {i: [] for i in range(1, n)}
    for s, i, t in b.edges().tolist():
        edges[i][name[s]] = name[t]
        pairs[i].append((name[s], name[t]))
    weights = {name[v]: tuple(b.weights()[v].tolist()) for v in range(len(b))}
    for c in (crystal_from_edges(n, edges), crystal_from_edges(n, pairs, weights)):
        assert isinstance(c, LabelledCrystal)
        assert c.character() == druse.schur(shape, n)  # Kashiwara-Nakashima 1994
        assert sorted(map(str, c.labels())) == sorted(name)
        for v in range(len(c)):
            label = c.label(v)
            assert c.vertex(label) == v
            if len(shape) < n:  # derived weights equal the tableau weights when lambda_n = 0
                assert tuple(c.weights()[v].tolist()) == weights[str(label)]


def test_dict_vertex_order_is_first_appearance_then_given_labels() -> None:
    c = crystal_from_edges(3, {2: {"b": "c"}, 1: {"a": "b"}})
    assert c.labels() == ("a", "b", "c")  # i ascending, source before target
    d = crystal_from_edges(3, {1: {"a": "b"}, 2: {"b": "c"}}, labels=["c", "z", "b", "a"])
    assert d.labels() == ("c", "z", "b", "a")
    assert d.weights()[1].tolist() == [0, 0, 0]  # the isolated vertex
    e = crystal_from_edges(2, {}, {"x": (1, 1)})
    assert e.labels() == ("x",)


def test_array_with_labels_gives_a_labelled_crystal() -> None:
    c = crystal_from_edges(2, [[0, 1, 1]], labels=[("hi",), ("lo",)])
    assert isinstance(c, LabelledCrystal)
    assert c.vertex(("lo",)) == 1
    assert c.label(0) == ("hi",)


# --- building from callables -----------------------------------------------------------------


@pytest.mark.parametrize(("shape", "n"), SHAPES)
def test_tableau_crystal_from_callables(shape: tuple[int, ...], n: int) -> None:
    top = tuple(tuple([r + 1] * length) for r, length in enumerate(shape))
    c = crystal_from_operators(n, f_tableau, [top], raising=e_tableau, weight=tableau_weight(n))
    assert len(c) == hook_content(shape, n)  # Stanley EC2 7.21.2
    assert c.character() == druse.schur(shape, n)  # Kashiwara-Nakashima 1994
    assert c.label(0) == top
    # the same arrows as druse's tableau crystal, vertex by vertex
    b = druse.crystal(shape, n)
    to_b = np.array([b.index(t) for t in c.labels()])  # type: ignore[arg-type]
    for i in range(1, n):
        fi = c.f(i)
        assert np.array_equal(np.where(fi >= 0, to_b[fi], -1), b.f(i)[to_b])
    derived = crystal_from_operators(n, f_tableau, [top])
    assert len(derived) == len(c)
    if len(shape) < n:
        assert np.array_equal(derived.weights(), c.weights())


def test_exploration_order_is_seeds_then_breadth_first() -> None:
    up = crystal_from_operators(3, f_tableau, [((3,),)], raising=e_tableau)
    assert up.labels() == (((3,),), ((2,),), ((1,),))  # e_2 first, then e_1
    per_i = [lambda t, i=i: f_tableau(i, t) for i in (1, 2)]
    down = crystal_from_operators(3, per_i, [((1,),), ((1,),)])
    assert down.labels() == (((1,),), ((2,),), ((3,),))


def test_bounded_exploration_of_an_infinite_set() -> None:
    with pytest.raises(ValueError, match=r"more than limit = 1,000 vertices.*larger limit="):
        crystal_from_operators(2, lambda i, x: x + 1, [0], limit=1000)


# --- bad input -------------------------------------------------------------------------------

B21 = druse.crystal((2, 1), 3)

BAD_EDGES: list[tuple[Any, dict[str, Any], type[Exception], str]] = [
    (
        [[0, 1, 1], [2, 1, 1]],
        {},
        ValueError,
        r"f_1 sends both 0 and 2 to 1 \(edges\[0\], edges\[1\]\)",
    ),
    (
        [[0, 1, 1], [0, 1, 2]],
        {},
        ValueError,
        r"f_1 sends 0 to both 1 and 2 \(edges\[0\], edges\[1\]\)",
    ),
    ([[0, 1, 1], [0, 1, 1]], {}, ValueError, r"edge 0 -1-> 1 is given twice"),
    ([[0, 3, 1]], {}, ValueError, r"edges\[0\] has i = 3; i must be in 1..2"),
    ([[0, 0, 1]], {}, ValueError, r"i = 0; i must be in 1..2"),
    ([[0, 1, -1]], {}, ValueError, r"edges\[0\] = \(0, 1, -1\) names a negative vertex"),
    ([[0, 1, 5]], {"size": 3}, ValueError, r"names a vertex outside 0..2"),
    ([[0, 1]], {}, ValueError, r"edges must have shape \(E, 3\)"),
    ([0, 1, 1], {}, ValueError, r"edges must have shape \(E, 3\)"),
    ([[0.0, 1, 1]], {}, TypeError, "edges must be an integer array.*float64"),
    ([[True, True, False]], {}, TypeError, "edges must be an integer array.*bool"),
    ([["a", 1, 1]], {}, TypeError, "edges must be an integer array"),
    (
        [[0, 1, 1]],
        {"weights": [[1, 0, 0], [1, 0, 0]]},
        ValueError,
        r"inconsistent with the edge 0 -1-> 1 \(edges\[0\]\): wt\(1\) = \(1, 0, 0\) but "
        r"wt\(0\) - alpha_1 = \(0, 1, 0\)",
    ),
    (
        [[0, 1, 1]],
        {"weights": [[1, 0, 0]]},
        ValueError,
        r"weights must have shape \(N, n\) = \(2, 3\)",
    ),
    ([[0, 1, 1]], {"weights": [[1.0, 0, 0], [0, 1, 0]]}, TypeError, "weights must hold integers"),
    ([[0, 1, 1]], {"weights": {0: (1, 0, 0)}}, ValueError, "weights has no entry for vertex 1"),
    ([[0, 1, 1]], {"weights": [[2**40, 0, 0], [0, 1, 0]]}, ValueError, "32-bit"),
    ([[0, 1, 1], [1, 1, 0]], {}, ValueError, "f_1 runs in a cycle through vertex 0"),
    ([[0, 1, 1], [1, 2, 2]], {"degree": 2}, ValueError, r"degree = 2 is impossible"),
    ([[0, 1, 1]], {"degree": 1.5}, TypeError, "degree must be an integer"),
    ([[0, 1, 1]], {"labels": ["a", "b"], "size": 3}, ValueError, "size = 3 disagrees with the 2"),
    ([[0, 1, 1]], {"weights": [[1, 0, 0], [0, 1, 0]], "degree": 1}, ValueError, "not both"),
    ([[0, 1, 1]], {"labels": ["a", "a"]}, ValueError, r"labels must be distinct: labels\[0\]"),
    ([[0, 1, 1]], {"labels": [["a"], "b"]}, TypeError, r"labels\[0\] must be hashable"),
]


@pytest.mark.parametrize(("edges", "kwargs", "error", "message"), BAD_EDGES, ids=repr)
def test_bad_edges_are_refused_with_the_witness(
    edges: Any, kwargs: dict[str, Any], error: type[Exception], message: str
) -> None:
    with pytest.raises(error, match=message):
        crystal_from_edges(3, edges, **kwargs)


def test_a_moved_edge_is_caught_with_its_witness() -> None:
    edges = B21.edges().copy()
    edges[0, 2] = edges[1, 2]  # f_1 of vertex edges[0, 0] now lands on another's target
    with pytest.raises(ValueError, match=r"f_1 sends both \d+ and \d+ to \d+"):
        crystal_from_edges(3, edges)
    weights = B21.weights().copy()
    weights[3] += [1, -1, 0]  # one weight wrong
    with pytest.raises(ValueError, match=r"inconsistent with the edge .*3"):
        crystal_from_edges(3, B21.edges(), weights)


def test_string_lengths_no_weight_fits() -> None:
    with pytest.raises(
        ValueError, match=r"no weights fit the string lengths .* at the edge 'a' -1-> 'b'"
    ):
        crystal_from_edges(3, {1: {"a": "b"}, 2: {"a": "c"}})


BAD_DICTS: list[tuple[Any, type[Exception], str]] = [
    (
        {1: [("a", "b"), ("a", "c")]},
        ValueError,
        r"f_1 sends 'a' to both 'b' and 'c' \(edges\[1\]\[0\]",
    ),
    ({1: {"a": "c", "b": "c"}}, ValueError, r"f_1 sends both 'a' and 'b' to 'c'"),
    ({1: {"a": ["b"]}}, TypeError, r"edges\[1\] holds an unhashable list"),
    ({1: "ab"}, TypeError, r"edges\[1\] must be a dict"),
    ({1: [("a", "b", "c")]}, ValueError, r"edges\[1\]\[0\] must be a pair"),
    ({"1": {"a": "b"}}, TypeError, "edges key i must be an integer"),
    ({5: {"a": "b"}}, ValueError, r"has i = 5; i must be in 1..2"),
]


@pytest.mark.parametrize(("edges", "error", "message"), BAD_DICTS, ids=repr)
def test_bad_dicts_are_refused(edges: Any, error: type[Exception], message: str) -> None:
    with pytest.raises(error, match=message):
        crystal_from_edges(3, edges)


def test_unknown_label_and_lookup_errors() -> None:
    with pytest.raises(ValueError, match="'q', which is not among the labels"):
        crystal_from_edges(3, {1: {"a": "q"}}, labels=["a", "b"])
    c = crystal_from_edges(2, {1: {"a": "b"}})
    with pytest.raises(ValueError, match="no vertex is labelled 'z'"):
        c.vertex("z")
    with pytest.raises(TypeError, match="label must be hashable"):
        c.vertex(["a"])  # type: ignore[arg-type]
    with pytest.raises(ValueError, match=r"v must be in 0..1"):
        c.label(2)


def _boom(i: int, x: int) -> int:
    raise KeyError(x)


def test_operators_that_raise_are_reported_and_chained() -> None:
    with pytest.raises(ValueError, match=r"f_1 raised KeyError at vertex 7") as info:
        crystal_from_operators(3, _boom, [7])
    assert isinstance(info.value.__cause__, KeyError)
    with pytest.raises(ValueError, match=r"e_2 raised ZeroDivisionError at vertex 'x'") as info:
        crystal_from_operators(3, lambda i, x: None, ["x"], raising=lambda i, x: i / (i - 2))
    assert isinstance(info.value.__cause__, ZeroDivisionError)
    with pytest.raises(ValueError, match=r"weight raised ValueError at vertex 0") as info:
        crystal_from_operators(2, lambda i, x: None, [0], weight=lambda x: [int("no")])
    assert isinstance(info.value.__cause__, ValueError)


BAD_OPERATORS: list[tuple[dict[str, Any], type[Exception], str]] = [
    ({"lowering": lambda i, x: [x]}, TypeError, r"f_1\(0\) is an unhashable list"),
    ({"seeds": [[0]]}, TypeError, r"seeds\[0\] is an unhashable list"),
    ({"seeds": [None]}, ValueError, r"seeds\[0\] is None"),
    ({"seeds": 5}, TypeError, "seeds must be an iterable"),
    ({"lowering": [lambda x: None]}, ValueError, "lowering must hold n - 1 = 2 callables"),
    ({"lowering": [None, None]}, TypeError, r"lowering\[0\] must be callable"),
    ({"lowering": 3}, TypeError, "lowering must be a callable"),
    ({"weight": lambda x: (0, 0)}, ValueError, r"weight\(0\) must have n = 3 entries"),
    ({"weight": lambda x: (0, 0, 0.5)}, TypeError, r"weight\(0\)\[2\] must be an integer"),
    ({"weight": lambda x: 3}, TypeError, r"weight\(0\) must be 3 integers"),
    ({"limit": 0}, ValueError, "limit must be a positive integer"),
    (
        {"lowering": lambda i, x: x + 1 if x < 2 else None, "weight": lambda x: (0, 0, 0)},
        ValueError,
        "weights are inconsistent with the edge 0 -1-> 1",
    ),
    (
        {
            "lowering": lambda i, x: 1 if x == 0 else None,
            "raising": lambda i, x: 5 if x == 1 else None,
        },
        ValueError,
        r"not partial bijections: f_1\(0\) = 1 and e_1\(1\) = 5",
    ),
    (
        {"lowering": lambda i, x: 9 if x < 2 else None, "seeds": [0, 1]},
        ValueError,
        r"not partial bijections: f_1\(0\) = 9 and f_1\(1\) = 9",
    ),
]


@pytest.mark.parametrize(("kwargs", "error", "message"), BAD_OPERATORS, ids=repr)
def test_bad_operators_are_refused(
    kwargs: dict[str, Any], error: type[Exception], message: str
) -> None:
    args: dict[str, Any] = {"lowering": lambda i, x: None, "seeds": [0], **kwargs}
    with pytest.raises(error, match=message):
        crystal_from_operators(3, **args)


def test_huge_n_is_refused_not_looped_over() -> None:
    with pytest.raises(druse.TooLargeError, match="operator arrays of 999999999999 colours"):
        crystal_from_edges(10**12, [])
    with pytest.raises(druse.TooLargeError, match="use a smaller n"):
        crystal_from_operators(10**12, lambda i, x: None, [0])


def test_bad_n() -> None:
    with pytest.raises(ValueError, match="n must be a positive integer"):
        crystal_from_edges(0, [])
    with pytest.raises(TypeError, match="n must be an integer"):
        crystal_from_operators(2.0, lambda i, x: None, [0])  # type: ignore[arg-type]
    c = crystal_from_edges(1, [], size=2)  # GL_1: no operators, weights derived as (0,)
    assert c.weights().tolist() == [[0], [0]]
    with pytest.raises(ValueError, match=r"i must be in 1\.\.0, which is empty"):
        crystal_from_edges(1, [[0, 1, 1]])
