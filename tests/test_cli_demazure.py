"""The ``druse`` commands key, atom, expand and demazure, through click's CliRunner."""

from __future__ import annotations

import json
from pathlib import Path
from typing import Any

import numpy as np
import pytest
import sympy  # type: ignore[import-untyped]

import druse
from clirun import ok, refused
from druse.io import EXPORT_LIMIT


def ok_json(*args: str, stdin: str | None = None) -> Any:
    return json.loads(ok(*args, "--json", stdin=stdin))


def pi(f: Any, i: int, xs: tuple[Any, ...]) -> Any:
    """sympy's isobaric divided difference (x_i f - x_{i+1} s_i f) / (x_i - x_{i+1}), an
    independent arithmetic engine (Demazure, "Desingularisation des varietes de Schubert
    generalisees", 1974)."""
    a, b = xs[i - 1], xs[i]
    swapped = f.subs({a: b, b: a}, simultaneous=True)
    return sympy.expand(sympy.cancel((a * f - b * swapped) / (a - b)))


# --- top level ---------------------------------------------------------------------------------

COMMANDS = ["key", "atom", "expand", "demazure"]


def test_help_lists_the_new_commands() -> None:
    out = ok("--help")
    for command in COMMANDS:
        assert command in out


@pytest.mark.parametrize("command", COMMANDS)
def test_each_new_command_has_help(command: str) -> None:
    assert "Usage:" in ok(command, "--help")


# --- key and atom ------------------------------------------------------------------------------


@pytest.mark.parametrize("alpha", [(0, 2, 1), (2, 0, 1), (1, 0, 3, 2), (0,), ()])
def test_key_and_atom_json_are_the_api_values(alpha: tuple[int, ...]) -> None:
    text = ",".join(map(str, alpha)) or "()"
    assert ok_json("key", text) == druse.key(alpha).to_json()
    assert ok_json("atom", text) == druse.atom(alpha).to_json()
    assert druse.Poly.from_json(ok_json("key", text)) == druse.key(alpha)


def test_key_readable_is_str_of_the_poly() -> None:
    assert ok("key", "0,2,1").strip() == str(druse.key((0, 2, 1)))
    assert ok("atom", "(0, 2, 1)").strip() == str(druse.atom((0, 2, 1)))


def test_key_against_textbook_values() -> None:
    # kappa_alpha = x^alpha for weakly decreasing alpha (Lascoux-Schutzenberger 1990)
    assert ok("key", "3,1,1,0").strip() == "x1^3*x2*x3"
    # kappa of a weakly increasing alpha is the Schur polynomial of its sorting (same source)
    assert druse.Poly(ok("key", "0,1,2").strip(), nvars=3) == druse.schur((2, 1), 3)
    # kappa_(0,1) = pi_1 x1 = x1 + x2 (Demazure 1974; from memory)
    assert ok("key", "0,1").strip() == "x1 + x2"
    # A_(0,1) = (pi_1 - 1) x1 = x2 (Lascoux-Schutzenberger 1990; from memory)
    assert ok("atom", "0,1").strip() == "x2"


# --- expand ------------------------------------------------------------------------------------

BASIS_OF: dict[str, Any] = {"key": druse.key, "atom": druse.atom, "schur": None}


def resum(doc: dict[str, Any]) -> druse.Poly:
    n = doc["nvars"]
    total = druse.Poly.zero(n)
    for index, c in doc["terms"]:
        element = (
            druse.schur(index, n) if doc["basis"] == "schur" else BASIS_OF[doc["basis"]](index)
        )
        total = total + c * element
    return total


@pytest.mark.parametrize("basis", ["key", "atom"])
def test_expand_resums_to_the_input(basis: str) -> None:
    p = druse.key((0, 2, 1)) * druse.key((1, 0, 1)) + 5 * druse.Poly("x2^3*x3", nvars=3)
    doc = ok_json("expand", str(p), "--nvars", "3", "--basis", basis)
    assert doc["basis"] == basis
    assert doc["nvars"] == 3
    assert resum(doc) == p  # sympy-free identity: the expansion sums back to p
    expected = druse.key_expansion(p) if basis == "key" else druse.atom_expansion(p)
    assert {tuple(a): c for a, c in doc["terms"]} == expected


def test_expand_key_times_schur_is_positive() -> None:
    # key(alpha) * s_mu has a key-positive expansion (Polo 1989; Mathieu 1989)
    p = druse.key((0, 2, 1)) * druse.schur((1, 1), 3)
    doc = ok_json("expand", str(p), "--nvars", "3")
    assert doc["positive"] is True
    assert doc["witness"] is None
    assert resum(doc) == p


def test_expand_schur_littlewood_richardson() -> None:
    # s_(2,1) s_(1) = s_(3,1) + s_(2,2) + s_(2,1,1) (Pieri rule, Macdonald SFHP I (5.16))
    p = druse.schur((2, 1), 4) * druse.schur((1,), 4)
    doc = ok_json("expand", str(p), "--nvars", "4", "--basis", "schur")
    assert sorted((tuple(lam), c) for lam, c in doc["terms"]) == [
        ((2, 1, 1), 1),
        ((2, 2), 1),
        ((3, 1), 1),
    ]
    assert resum(doc) == p


def test_expand_a_product_of_keys_that_is_not_key_positive() -> None:
    # found by druse's own search (tests/test_expansion.py): coefficient -1 at key(2,1,0)
    p = druse.key((0, 1, 0)) * druse.key((1, 0, 1))
    doc = ok_json("expand", str(p), "--nvars", "3")
    assert doc["positive"] is False
    assert doc["witness"] == [2, 1, 0]
    assert {tuple(a): c for a, c in doc["terms"]} == {
        (1, 1, 1): 1,
        (2, 0, 1): 1,
        (1, 2, 0): 1,
        (2, 1, 0): -1,
    }
    lines = ok("expand", str(p), "--nvars", "3").splitlines()
    assert "-1 * key(2,1,0)" in [line.strip() for line in lines]
    assert lines[-1] == "not positive: the coefficient of key(2,1,0) is -1"


def test_expand_readable_format() -> None:
    lines = ok("expand", "x1^2*x2 + x1^2*x3 + 3*x1*x2*x3", "--nvars", "3").splitlines()
    assert lines == [
        "3 * key(1,1,1)",  # the API's order: reverse lexicographic, largest first
        "1 * key(2,0,1)",
        "positive: every key coefficient is >= 0",
    ]
    assert ok("expand", "0", "--nvars", "2").splitlines()[0] == "0 (the zero polynomial)"


def test_expand_reads_text_and_json_files(tmp_path: Path) -> None:
    p = druse.key((1, 0, 2)) - 2 * druse.key((0, 0, 3))
    text_file, json_file = tmp_path / "p.txt", tmp_path / "p.json"
    text_file.write_text(str(p) + "\n", encoding="utf-8")
    json_file.write_text(json.dumps(p.to_json()), encoding="utf-8")
    from_text = ok_json("expand", "--file", str(text_file), "--nvars", "3")
    from_json = ok_json("expand", "--file", str(json_file))
    from_stdin = ok_json("expand", "--file", "-", stdin=json.dumps(p.to_json()))
    assert from_text == from_json == from_stdin
    assert {tuple(a): c for a, c in from_json["terms"]} == {(1, 0, 2): 1, (0, 0, 3): -2}
    assert from_json["witness"] == [0, 0, 3]


def test_expand_is_exact_beyond_64_bits() -> None:
    big = 3**50
    doc = ok_json("expand", f"{big}*x1*x2", "--nvars", "2")
    assert doc["terms"] == [[[1, 1], big]]


# --- demazure ----------------------------------------------------------------------------------


def test_demazure_character_formula_through_the_cli() -> None:
    # Demazure character formula: the character of B_w(lambda) is pi_{i1} ... pi_{ik} x^lambda
    # (Demazure 1974; Lascoux-Schutzenberger, "Keys and standard bases", 1990); here
    # lambda = (2,1,0), word (2,1), computed by sympy's pi_i as the reference.
    xs = sympy.symbols("x1:4")
    expected = pi(pi(xs[0] ** 2 * xs[1], 1, xs), 2, xs)
    doc = ok_json("demazure", "2,1", "3", "2,1")
    character = druse.Poly.from_json(doc["character"])
    assert sympy.expand(character.to_sympy(xs) - expected) == 0
    assert character == druse.key((1, 0, 2))  # w.lambda for w = s2 s1 = (3,1,2)
    assert doc["permutation"] == [3, 1, 2]
    assert doc["size"] == len(doc["vertices"]) == int(expected.subs(dict.fromkeys(xs, 1)))


def test_demazure_json_is_the_api_values() -> None:
    c = druse.crystal((3, 1, 1), 4)
    doc = ok_json("demazure", "3,1,1", "4", "1,3,2")
    mask = c.demazure((1, 3, 2))
    assert doc["shape"] == [3, 1, 1]
    assert doc["n"] == 4
    assert doc["word"] == [1, 3, 2]
    assert doc["permutation"] == list(druse.demazure_product((1, 3, 2), 4))
    assert doc["vertices"] == np.flatnonzero(mask).tolist()
    assert doc["size"] == int(mask.sum())
    assert doc["character"] == c.character(mask).to_json()


def test_demazure_by_permutation_matches_the_word() -> None:
    by_perm = ok_json("demazure", "2,2,1", "4", "--perm", "3,4,1,2")
    c = druse.crystal((2, 2, 1), 4)
    assert by_perm["vertices"] == np.flatnonzero(druse.demazure_mask_of(c, (3, 4, 1, 2))).tolist()
    assert by_perm["word"] == list(druse.reduced_word((3, 4, 1, 2)))
    assert by_perm["permutation"] == [3, 4, 1, 2]
    assert druse.word_permutation(by_perm["word"], 4) == (3, 4, 1, 2)
    # another reduced word of the same w gives the same crystal (Demazure 1974)
    other = [2, 1, 3, 2] if by_perm["word"] != [2, 1, 3, 2] else [2, 3, 1, 2]
    assert druse.word_permutation(other, 4) == (3, 4, 1, 2)
    by_word = ok_json("demazure", "2,2,1", "4", ",".join(map(str, other)))
    assert by_word["vertices"] == by_perm["vertices"]


@pytest.mark.parametrize("empty", ["()", ""])
def test_demazure_of_the_empty_word_is_the_highest_weight(empty: str) -> None:
    doc = ok_json("demazure", "2,1", "3", empty)
    assert (doc["word"], doc["permutation"], doc["vertices"]) == ([], [1, 2, 3], [0])
    assert druse.Poly.from_json(doc["character"]) == druse.Poly("x1^2*x2", nvars=3)


def test_demazure_of_a_non_reduced_word_is_its_demazure_product() -> None:
    # 0-Hecke monoid: s1 * s1 = s1, so (1,1,2,1) gives w0 = (3,2,1) (Norton 1979)
    doc = ok_json("demazure", "2,1", "3", "1,1,2,1")
    assert doc["permutation"] == [3, 2, 1]
    assert doc["size"] == 8  # all of B(2,1) of GL_3: hook-content formula, Stanley EC2 7.21.4


def test_demazure_readable() -> None:
    out = ok("demazure", "2,1", "3", "2,1")
    assert "permutation         (3,1,2)" in out
    assert "vertices            5 of 8" in out
    assert f"key(1,0,2) = {druse.key((1, 0, 2))}" in out
    assert "empty" in ok("demazure", "1,1,1,1", "3", "1")


# --- bad input ---------------------------------------------------------------------------------


@pytest.mark.parametrize(
    ("args", "code", "words"),
    [
        (("key", "1,-1"), 1, "non-negative"),
        (("atom", "a,b"), 2, "not a list of integers"),
        (("expand", "x1/2", "--nvars", "2"), 1, "cannot read"),  # a non-integer coefficient
        (("expand", "0.5*x1", "--nvars", "2"), 1, "cannot read"),
        (("expand", "x1 +", "--nvars", "2"), 1, "cannot read"),
        (("expand", "x1*__import__", "--nvars", "2"), 1, "cannot read"),  # never eval'd
        (("expand", "x3", "--nvars", "2"), 1, "not among x1..x2"),
        (("expand", "x1^-1", "--nvars", "1"), 1, "negative exponents"),
        (("expand", "x1", "--nvars", "2", "--basis", "schur"), 1, "not symmetric"),
        (("expand", "x1"), 2, "--nvars is required"),
        (("expand", "--nvars", "2"), 2, "either as POLY or with --file"),
        (("expand", "x1", "--nvars", "2", "--basis", "monomial"), 2, "--basis"),
        (("expand", "--file", "/no/such/file", "--nvars", "2"), 2, "--file"),
        (("demazure", "2,1", "3", "3"), 1, "letter in 1..2"),
        (("demazure", "2,1", "3", "0"), 1, "letter in 1..2"),
        (("demazure", "2,1", "3", "--perm", "1,1,2"), 1, "permutation"),
        (("demazure", "2,1", "3", "--perm", "2,1"), 1, "n = 3 entries"),
        (("demazure", "2,3", "3", "1"), 1, "weakly decreasing"),
        (("demazure", "2,1", "3"), 2, "either as WORD or with --perm"),
        (("demazure", "2,1", "3", "1", "--perm", "2,1,3"), 2, "not both"),
        (("demazure", "8,8", "15", "1"), 1, "(vertex, i) pairs"),
        (("demazure", "2,1", "0", "1"), 2, "Invalid value for 'N'"),
    ],
)
def test_bad_input_is_one_line(args: tuple[str, ...], code: int, words: str) -> None:
    assert words in refused(*args, code=code)


@pytest.mark.parametrize(
    ("doc", "words"),
    [
        ('{"nvars": 2, "terms": [[[1, 0], 1.5]]}', "must be an integer"),  # non-integer
        ('{"nvars": 2, "terms": [[[1, 0, 0], 1]]}', "length nvars=2"),
        ('{"nvars": 3, "terms": []}', "nvars=3 but --nvars 2"),
        ('{"nvars": 2, "terms": [', "not valid JSON"),
    ],
)
def test_bad_json_input_is_one_line(doc: str, words: str) -> None:
    assert words in refused("expand", "--file", "-", "--nvars", "2", stdin=doc)


def test_demazure_json_refuses_huge_crystals() -> None:
    line = refused("demazure", "6,4,2", "10", "1", "--json")
    assert "17,200,755 vertices" in line  # hook-content count, Stanley EC2 Cor. 7.21.4
    assert f"{EXPORT_LIMIT:,}" in line
