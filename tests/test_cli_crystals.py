"""The command line for Littlewood-Richardson multiplicities and tensor products."""

from __future__ import annotations

import json

from clirun import ok, refused


def test_lr_prints_the_published_example() -> None:
    # c^{(3,2,1)}_{(2,1),(2,1)} = 2 (Fulton, Young Tableaux, 1997, ch. 5)
    out = ok("lr", "2,1", "2,1")
    assert "2 * s(3,2,1)" in out.splitlines()


def test_lr_json_agrees_between_methods() -> None:
    # the two routes are independent: a lattice count and the tensor product's highest weights
    a = json.loads(ok("lr", "3,1", "2,2", "--json"))
    b = json.loads(ok("lr", "3,1", "2,2", "--json", "--method", "crystal"))
    assert a == b
    assert a["mu"] == [3, 1]
    assert a["nu"] == [2, 2]


def test_lr_pieri_row() -> None:
    # Pieri: s_(2,1) s_(1) = s_(3,1) + s_(2,2) + s_(2,1,1), each once (Macdonald, SFHP, I.5.16)
    doc = json.loads(ok("lr", "2,1", "1", "--json"))
    assert doc["terms"] == [[[3, 1], 1], [[2, 2], 1], [[2, 1, 1], 1]]


def test_lr_table_json_shape() -> None:
    # partitions of 3: 3 of them (OEIS A000041); products of size 6: 11 (OEIS A000041)
    doc = json.loads(ok("lr-table", "3", "--json", "--quiet"))
    assert len(doc["partitions"]) == 3
    assert len(doc["products"]) == 11
    assert len(doc["coefficients"]) == 3
    assert len(doc["coefficients"][0][0]) == 11


def test_lr_table_text_lines() -> None:
    out = ok("lr-table", "2", "--quiet")
    # s_2 s_2 = s_4 + s_31 + s_22 (Pieri): 3 shapes, sum 3
    assert "(2) x (2): 3 shapes, sum 3" in out


def test_tensor_square_of_standard_crystal() -> None:
    # B(1) x B(1) = B(2) + B(1,1) for GL_3 (Bump-Schilling, Crystal Bases, 2017, from memory)
    doc = json.loads(ok("tensor", "1", "1", "-n", "3", "--json"))
    assert doc["vertices"] == 9
    assert doc["decomposition"] == [[[2], 1], [[1, 1], 1]]


def test_tensor_text() -> None:
    # B(2,1) x B(2,1) for GL_3: 64 = 8 * 8 vertices; six components by the LR rule
    out = ok("tensor", "2,1", "2,1", "-n", "3")
    assert out.splitlines()[0] == "B(2,1) x B(2,1) of GL_3: 64 vertices, 6 components"
    assert "2 * B(3,2,1)" in out


def test_bad_input_is_refused() -> None:
    assert "mu" in refused("lr", "1,2", "1")
    assert "Error" in refused("tensor", "1", "-n", "0", code=2)
