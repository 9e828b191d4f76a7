"""Poly: construction, conversions (dict, JSON, sympy, text), inspection, hashing."""

from __future__ import annotations

import copy
import json
import pickle
from fractions import Fraction
from typing import Any

import numpy as np
import pytest
import sympy  # type: ignore[import-untyped]

from druse.poly import Poly

X = sympy.symbols("x1:4")


def sympy_product(p: Poly, q: Poly) -> Any:
    return sympy.expand(p.to_sympy() * q.to_sympy())  # sympy as an independent engine


# -- canonical form ------------------------------------------------------------------------------


def test_from_arrays_sums_duplicates_drops_zeros_and_sorts_decreasing() -> None:
    exps = np.array([[0, 1], [2, 0], [0, 1], [1, 1], [3, 3]])
    p = Poly._from_arrays(exps, [np.int64(2), 5, 3, 7, -0], 2)
    assert p.exponents.tolist() == [[2, 0], [1, 1], [0, 1]]
    assert p.coefficients == (5, 7, 5)
    assert all(type(c) is int for c in p.coefficients)
    assert p.exponents.dtype == np.int64
    assert not p.exponents.flags.writeable
    with pytest.raises(ValueError, match="read-only"):
        p.exponents[0, 0] = 9


def test_from_arrays_accepts_empty_and_numpy_coefficients() -> None:
    assert Poly._from_arrays(np.zeros((0, 3), dtype=np.int64), [], 3) == Poly.zero(3)
    assert Poly._from_arrays([], [], 2) == 0
    p = Poly._from_arrays(np.array([[1], [1]], dtype=np.uint8), np.array([2, -2]), 1)
    assert not p
    q = Poly._from_arrays(np.array([[2**62]], dtype=object), np.array([7], dtype=np.uint64), 1)
    assert q.to_dict() == {(2**62,): 7}


def test_from_arrays_does_not_alias_the_callers_array() -> None:
    exps = np.array([[1, 0]], dtype=np.int64)
    p = Poly._from_arrays(exps, [1], 2)
    exps[0, 0] = 5
    assert exps.flags.writeable
    assert p.to_dict() == {(1, 0): 1}


@pytest.mark.parametrize(
    ("exps", "coeffs", "nvars", "error", "message"),
    [
        (np.zeros((2, 2)), [1], 2, ValueError, "shape"),
        (np.zeros((1, 3), dtype=np.int64), [1], 2, ValueError, "shape"),
        (np.zeros((1, 2)), [1], 2, TypeError, "integers"),
        (np.zeros((1, 2), dtype=bool), [1], 2, TypeError, "integers"),
        (np.array([[2**63]], dtype=np.uint64), [1], 1, ValueError, "int64"),
        (np.array([[2**70]], dtype=object), [1], 1, ValueError, "int64"),
        (np.zeros((1, 2), dtype=np.int64), [1.5], 2, TypeError, r"coeffs\[0\]"),
        (np.zeros((1, 2), dtype=np.int64), [True], 2, TypeError, r"coeffs\[0\]"),
        (np.zeros((1, 2), dtype=np.int64), [1], -1, ValueError, "nvars"),
    ],
)
def test_from_arrays_refuses_bad_input(
    exps: Any, coeffs: Any, nvars: int, error: type[Exception], message: str
) -> None:
    with pytest.raises(error, match=message):
        Poly._from_arrays(exps, coeffs, nvars)


# -- dict, json, sympy, text round trips -----------------------------------------------------


def test_dict_round_trip_and_zero_values_dropped() -> None:
    d = {(2, 0, 1): 1, (0, 1, 0): 3, (0, 0, -1): -1, (1, 1, 1): 0}
    p = Poly.from_dict(d, 3)
    assert p.to_dict() == {k: v for k, v in d.items() if v}
    assert len(p) == 3
    assert Poly.from_dict({(np.int64(1),): np.int32(4)}, 1).to_dict() == {(1,): 4}


@pytest.mark.parametrize(
    ("d", "nvars", "error", "message"),
    [
        ({(1, 2): 1}, 3, ValueError, "length nvars=3"),
        ({1: 1}, 1, TypeError, "tuples"),
        ({"x1": 1}, 1, TypeError, "tuples"),
        ({(1.0,): 1}, 1, TypeError, "integer"),
        ({(True,): 1}, 1, TypeError, "integer"),
        ({(1,): True}, 1, TypeError, "integer"),
        ({(1,): 1.5}, 1, TypeError, "integer"),
        ({(1,): 2.0}, 1, TypeError, "integer"),
        ({(1,): Fraction(2, 1)}, 1, TypeError, "integer"),
        ({(2**63,): 1}, 1, ValueError, "int64"),
        ({(1,): 1}, -1, ValueError, "nvars"),
        ({(1,): 1}, 1.0, TypeError, "nvars"),
        ([((1,), 1)], 1, TypeError, "mapping"),
    ],
)
def test_from_dict_refuses_bad_input(
    d: Any, nvars: Any, error: type[Exception], message: str
) -> None:
    with pytest.raises(error, match=message):
        Poly.from_dict(d, nvars)


def test_json_has_exactly_the_documented_shape_and_survives_json_text() -> None:
    p = Poly("x1^2*x3 + 3*x2*x4 - x5", nvars=5)
    assert p.to_json() == {
        "nvars": 5,
        "terms": [[[2, 0, 1, 0, 0], 1], [[0, 1, 0, 1, 0], 3], [[0, 0, 0, 0, 1], -1]],
    }
    big = Poly.monomial((1, -1), 2**100 + 1)
    assert Poly.from_json(json.loads(json.dumps(big.to_json()))) == big
    shuffled = {"nvars": 2, "terms": [[[0, 1], 4], [[1, 0], 0], [[3, 0], 1]]}
    assert Poly.from_json(shuffled) == Poly("x1^3 + 4*x2", 2)


@pytest.mark.parametrize(
    ("obj", "error", "message"),
    [
        ([2, []], TypeError, "dict"),
        ({"nvars": 1}, ValueError, "exactly the keys"),
        ({"nvars": 1, "terms": [], "x": 0}, ValueError, "exactly the keys"),
        ({"nvars": -1, "terms": []}, ValueError, r"obj\['nvars'\]"),
        ({"nvars": "2", "terms": []}, TypeError, r"obj\['nvars'\]"),
        ({"nvars": 1, "terms": {}}, TypeError, r"obj\['terms'\]"),
        ({"nvars": 1, "terms": [5]}, TypeError, r"obj\['terms'\]\[0\]"),
        ({"nvars": 1, "terms": [[[1], 1, 2]]}, ValueError, "pair"),
        ({"nvars": 1, "terms": [[[1, 2], 1]]}, ValueError, "length nvars=1"),
        ({"nvars": 1, "terms": [["1", 1]]}, TypeError, "tuple of integers"),
        ({"nvars": 1, "terms": [[[1], 1.0]]}, TypeError, r"\[0\]\[1\]"),
        ({"nvars": 1, "terms": [[[1], True]]}, TypeError, r"\[0\]\[1\]"),
        ({"nvars": 1, "terms": [[[1], 1], [[1], 2]]}, ValueError, "twice"),
    ],
)
def test_from_json_refuses_bad_structure(obj: Any, error: type[Exception], message: str) -> None:
    with pytest.raises(error, match=message):
        Poly.from_json(obj)


def test_sympy_round_trip_with_default_and_given_symbols() -> None:
    p = Poly("x1^2*x3 - 2*x2 + 7 + x1^-1", nvars=3)
    x1, x2, x3 = X
    assert p.to_sympy() == x1**2 * x3 - 2 * x2 + 7 + 1 / x1
    a, b, c = sympy.symbols("a b c")
    assert p.to_sympy([a, b, c]) == a**2 * c - 2 * b + 7 + 1 / a
    assert p.to_sympy("a b c") == p.to_sympy(["a", "b", "c"])
    assert Poly.from_sympy(p.to_sympy(), X) == p
    assert Poly.from_sympy(p.to_sympy([a, b, c]), "a b c") == p
    assert Poly.zero(2).to_sympy() == 0
    assert Poly.one(0).to_sympy() == 1


def test_from_sympy_expands_and_accepts_laurent_and_sympy_poly() -> None:
    x, y = sympy.symbols("x y")
    assert Poly.from_sympy((x + 1 / x) ** 2, [x]).to_dict() == {(2,): 1, (0,): 2, (-2,): 1}
    assert Poly.from_sympy((x + y) / 2 + (x - y) / 2, [x, y]).to_dict() == {(1, 0): 1}
    assert Poly.from_sympy(sympy.Poly(x**2 * y - 3, x, y), [x, y]) == Poly("x1^2*x2 - 3", 2)
    assert Poly.from_sympy(12, [x]) == 12
    assert Poly.from_sympy(sympy.Integer(2) ** 70 * y, [x, y]).coefficient((0, 1)) == 2**70


@pytest.mark.parametrize(
    ("expr", "message"),
    [
        ("x/2", "integer coefficients"),
        ("2.0*x", "integer coefficients"),
        ("sqrt(2)*x", "integer coefficients"),
        ("I*x", "integer coefficients"),
        ("x*z", "only the symbols.*contains z"),
        ("x**z", "only the symbols.*contains z"),
        ("sqrt(x)", "Laurent polynomial"),
        ("1/(x + 1)", "Laurent polynomial"),
        ("(x**2 - 1)/(x - 1)", "Laurent polynomial"),
        ("sin(x)", "Laurent polynomial"),
    ],
)
def test_from_sympy_names_the_broken_rule(expr: str, message: str) -> None:
    x, y = sympy.symbols("x y")
    with pytest.raises(ValueError, match=message):
        Poly.from_sympy(sympy.sympify(expr), [x, y])


def test_from_sympy_and_to_sympy_refuse_bad_arguments() -> None:
    x, y = sympy.symbols("x y")
    with pytest.raises(TypeError, match="expr"):
        Poly.from_sympy("x + y", [x, y])
    with pytest.raises(TypeError, match="expr"):
        Poly.from_sympy(sympy.Eq(x, y), [x, y])
    with pytest.raises(ValueError, match="distinct"):
        Poly.from_sympy(x, [x, x])
    with pytest.raises(TypeError, match="Symbols"):
        Poly.from_sympy(x, [x, 3])
    with pytest.raises(TypeError, match="sequence"):
        Poly.from_sympy(x, x)
    with pytest.raises(ValueError, match="length nvars=2"):
        Poly.one(2).to_sympy([x])


def test_text_format_matches_the_canonical_order() -> None:
    p = Poly.from_dict({(2, 0, 1, 0, 0): 1, (0, 1, 0, 1, 0): 3, (0, 0, 0, 0, 1): -1}, 5)
    assert str(p) == "x1^2*x3 + 3*x2*x4 - x5"
    assert repr(p) == "Poly('x1^2*x3 + 3*x2*x4 - x5', nvars=5)"
    assert eval(repr(p), {"Poly": Poly}) == p
    assert str(Poly.zero(2)) == "0"
    assert str(Poly("-x1 + 1 - 2*x2^-3", 2)) == "-x1 + 1 - 2*x2^-3"
    assert str(Poly(-7, 0)) == "-7"
    assert p.latex() == "x_{1}^{2} x_{3} + 3 x_{2} x_{4} - x_{5}"
    assert p._repr_latex_() == f"$\\displaystyle {p.latex()}$"
    long = Poly.from_dict({(k,): 1 for k in range(150)}, 1)
    assert long._repr_latex_().endswith(r"+ \cdots \quad (150\ \text{terms})$")
    assert long.latex().count("x_{1}") == 149


def test_text_parser_reads_the_usual_spellings() -> None:
    p = Poly.from_dict({(2, 0): 3, (-1, 1): -1, (0, 0): 5}, 2)
    for text in ["3*x1^2 - x1^-1*x2 + 5", "3 * x1**2 - x1^(-1) * x2 + 5", "5 - x2*x1^-1 + 3*x1*x1"]:
        assert Poly(text, nvars=2) == p
    assert Poly("2*3*x1 - 6*x1", 1) == 0


@pytest.mark.parametrize(
    ("text", "message"),
    [
        ("", "empty"),
        ("x1 +", "expected an integer"),
        ("2x1", "expected '\\+', '-' or '\\*'"),
        ("x1 ^ y", "expected '\\+', '-' or '\\*'"),
        ("x3", "not among x1..x2"),
        ("x0", "not among x1..x2"),
        ("x1 + * x2", "expected an integer"),
        ("x1^99999999999999999999", "int64"),
    ],
)
def test_text_parser_refuses_bad_text(text: str, message: str) -> None:
    with pytest.raises(ValueError, match=message):
        Poly(text, nvars=2)


def test_constructor_accepts_its_documented_kinds_only() -> None:
    p = Poly("x1 + 2", 2)
    assert Poly({(1, 0): 1, (0, 0): 2}, 2) == p
    assert Poly(p, 2) == p
    assert Poly(np.int64(2), 2) == 2
    with pytest.raises(ValueError, match="nvars=2 but nvars=3"):
        Poly(p, 3)
    with pytest.raises(TypeError, match="data"):
        Poly(1.5, 2)  # type: ignore[arg-type]


# -- inspection --------------------------------------------------------------------------------


def test_constructors_inspection_and_iteration() -> None:
    assert Poly.variable(2, 3).to_dict() == {(0, 1, 0): 1}
    assert Poly.monomial([1, -2], -4).to_dict() == {(1, -2): -4}
    assert Poly.monomial((1, 1), 0) == Poly.zero(2)
    assert Poly.monomial((), 3) == Poly(3, 0)
    assert Poly.one(3).to_dict() == {(0, 0, 0): 1}
    p = Poly("x1^3*x2 + 2*x2^2 - x1^-1", 2)
    assert list(p) == [((3, 1), 1), ((0, 2), 2), ((-1, 0), -1)]
    assert p.coefficient((0, 2)) == 2
    assert p.coefficient(np.array([5, 5])) == 0
    assert p.degree() == 4
    assert (p.degree(1), p.degree(2)) == (3, 2)
    assert not p.is_homogeneous()
    assert Poly("x1^2 + x1*x2^-1*x3^2", 3).is_homogeneous()
    assert Poly.zero(2).is_homogeneous()
    assert bool(p)
    assert not Poly.zero(1)
    assert p.nvars == 2


def test_inspection_refuses_bad_arguments() -> None:
    p = Poly("x1 + x2", 2)
    with pytest.raises(ValueError, match="zero polynomial has no degree"):
        Poly.zero(2).degree()
    with pytest.raises(ValueError, match=r"i must be in 1\.\.2"):
        p.degree(3)
    with pytest.raises(ValueError, match="length nvars=2"):
        p.coefficient((1,))
    with pytest.raises(TypeError, match="tuple of integers"):
        p.coefficient("11")  # type: ignore[arg-type]
    with pytest.raises(ValueError, match=r"i must be in 1\.\.3"):
        Poly.variable(0, 3)
    with pytest.raises(TypeError, match="i must be an integer"):
        Poly.variable(1.0, 3)  # type: ignore[arg-type]
    with pytest.raises(TypeError, match="coeff"):
        Poly.monomial((1,), True)


def test_hash_equality_pickle_copy() -> None:
    p = Poly("x1*x2 - 4", 2)
    assert p == Poly.from_dict({(1, 1): 1, (0, 0): -4}, 2)
    assert hash(p) == hash(Poly("-4 + x2*x1", 2))
    assert Poly(5, 3) == 5
    assert hash(Poly(5, 3)) == hash(5)  # equal objects hash alike
    assert Poly.zero(2) == 0
    assert p != 0
    assert Poly.one(2) != Poly.one(3)
    assert p != "x1*x2 - 4"
    assert len({p, Poly("x1*x2 - 4", 2), Poly("x1*x2", 2)}) == 2
    assert pickle.loads(pickle.dumps(p)) == p
    assert copy.copy(p) is p
    assert copy.deepcopy(p) is p


# -- arithmetic ----------------------------------------------------------------------------------


@pytest.mark.parametrize("text", ["x1/2", "0.5*x1", "2*x1^1.5"])
def test_text_with_a_fraction_names_the_integer_rule(text: str) -> None:
    with pytest.raises(ValueError, match="must be integers"):
        Poly(text, nvars=2)
