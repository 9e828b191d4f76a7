"""The ``druse`` command line and the JSON export, through click's CliRunner."""

from __future__ import annotations

import io
import json
import math
from pathlib import Path
from typing import Any

import numpy as np
import pytest

import druse
from clirun import ok, refused
from druse.io import (
    CRYSTAL_FORMAT,
    EXPORT_LIMIT,
    check_export_size,
    crystal_to_json,
    write_crystal_json,
    write_json,
)

# --- top level ---------------------------------------------------------------------------------


def test_help_lists_every_command() -> None:
    out = ok("--help")
    for command in ("count", "kostka", "schur", "crystal", "tableaux"):
        assert command in out


def test_version() -> None:
    assert druse.__version__ in ok("--version")


@pytest.mark.parametrize("command", ["count", "kostka", "schur", "crystal", "tableaux"])
def test_each_command_has_help(command: str) -> None:
    assert "Usage:" in ok(command, "--help")


# --- count and kostka --------------------------------------------------------------------------


def test_count_against_hook_content() -> None:
    assert ok("count", "2,1", "3").strip() == "8"  # hook-content formula, Stanley EC2 Cor. 7.21.4
    assert (
        ok("count", "3,1", "3").strip() == "15"
    )  # Weyl dimension of GL_3 irrep (3,1), from memory
    assert ok("count", "1,1,1", "7").strip() == str(math.comb(7, 3))  # columns: subsets of 1..7
    assert ok("count", "5", "3").strip() == str(math.comb(7, 5))  # one row: multisets, C(n+k-1, k)


def test_count_is_exact_beyond_64_bits() -> None:
    out = ok("count", "8,8,8", "40").strip()
    assert int(out) == druse.count_tableaux((8, 8, 8), 40)
    assert int(out) > 2**64


@pytest.mark.parametrize("empty", ["()", "", "0", "[]", " ( ) "])
def test_empty_partition_spellings(empty: str) -> None:
    assert ok("count", empty, "4").strip() == "1"  # the empty tableau


def test_more_rows_than_letters_is_empty_not_an_error() -> None:
    assert ok("count", "1,1,1,1", "3").strip() == "0"
    assert "empty" in ok("crystal", "1,1,1,1", "3")
    assert "no tableaux" in ok("tableaux", "1,1,1,1", "3")


def test_kostka() -> None:
    assert ok("kostka", "3,1,1", "1,1,1,1,1").strip() == "6"  # SYT: hook length formula, FRT 1954
    assert ok("kostka", "2,2", "1,1,1,1").strip() == "2"  # SYT: hook length formula, FRT 1954
    assert (
        ok("kostka", "3,2", "2,2,1").strip() == "2"
    )  # Macdonald, SFHP Ch. I sec. 6 table, from memory
    assert ok("kostka", "4,2,2,1", "2,2,2,2,1").strip() == str(
        druse.kostka((4, 2, 2, 1), (2, 2, 2, 2, 1))
    )


# --- schur -------------------------------------------------------------------------------------


def test_schur_readable_is_str_of_the_poly() -> None:
    assert ok("schur", "3,1", "3").strip() == str(druse.schur((3, 1), 3))


def test_schur_json_is_the_contract_form() -> None:
    doc = json.loads(ok("schur", "4,2,1", "4", "--json"))
    assert doc == druse.schur((4, 2, 1), 4).to_json()
    assert druse.Poly.from_json(doc) == druse.schur((4, 2, 1), 4)
    assert set(doc) == {"nvars", "terms"}


def test_schur_of_a_column_is_elementary_symmetric() -> None:
    # s_(1,1) = e_2 = x1 x2 + x1 x3 + x2 x3 (Macdonald, SFHP Ch. I (3.9), from memory)
    doc = json.loads(ok("schur", "1,1", "3", "--json"))
    assert doc["nvars"] == 3
    assert sorted((tuple(e), c) for e, c in doc["terms"]) == [
        ((0, 1, 1), 1),
        ((1, 0, 1), 1),
        ((1, 1, 0), 1),
    ]


# --- crystal -----------------------------------------------------------------------------------


def test_crystal_summary() -> None:
    out = ok("crystal", "4,2,2,1", "6")
    c = druse.crystal((4, 2, 2, 1), 6)
    assert f"vertices            {len(c)}" in out
    assert "1 1 1 1 / 2 2 / 3 3 / 4" in out
    assert "(4,2,2,1,0,0)" in out
    assert f"edges               {len(c.edges())}" in out
    assert "components          1" in out  # B(lambda) is connected (Kashiwara 1991)


def test_crystal_summary_of_a_huge_crystal_streams() -> None:
    out = ok("crystal", "8,8", "15")
    assert str(druse.count_tableaux((8, 8), 15)) in out
    assert "1 1 1 1 1 1 1 1 / 2 2 2 2 2 2 2 2" in out


def check_export(doc: dict[str, Any], shape: tuple[int, ...], n: int) -> None:
    c = druse.crystal(shape, n)
    assert doc["format"] == CRYSTAL_FORMAT
    assert doc["version"] == 1
    assert (doc["n"], doc["shape"], doc["size"]) == (n, list(c.shape), len(c))
    assert [v["index"] for v in doc["vertices"]] == list(range(len(c)))
    assert [tuple(map(tuple, v["tableau"])) for v in doc["vertices"]] == [
        c.tableau(v) for v in range(len(c))
    ]
    assert np.array_equal(np.array([v["weight"] for v in doc["vertices"]]), c.weights())
    assert doc["edges"] == c.edges().tolist()


def test_crystal_json_matches_the_api() -> None:
    check_export(json.loads(ok("crystal", "3,2,2", "5", "--json")), (3, 2, 2), 5)


def test_crystal_output_file(tmp_path: Path) -> None:
    target = tmp_path / "b53.json"
    out = ok("crystal", "5,3", "4", "--output", str(target))
    doc = json.loads(target.read_text(encoding="utf-8"))
    check_export(doc, (5, 3), 4)
    assert f"wrote {doc['size']} vertices and {len(doc['edges'])} edges" in out
    assert json.loads(ok("crystal", "5,3", "4", "-o", "-")) == doc


def test_crystal_edges_count_by_the_signature_rule() -> None:
    # B(1) of GL_4 is the path 1 -> 2 -> 3 -> 4 (Kashiwara-Nakashima 1994): three arrows
    doc = json.loads(ok("crystal", "1", "4", "--json"))
    assert doc["edges"] == [[0, 1, 1], [1, 2, 2], [2, 3, 3]]
    assert [v["tableau"] for v in doc["vertices"]] == [[[1]], [[2]], [[3]], [[4]]]


def test_crystal_export_of_the_empty_shape() -> None:
    doc = json.loads(ok("crystal", "()", "3", "--json"))
    assert doc["vertices"] == [{"index": 0, "tableau": [], "weight": [0, 0, 0]}]
    assert doc["edges"] == []


def test_crystal_export_refuses_huge_crystals() -> None:
    line = refused("crystal", "6,4,2", "10", "--json")
    assert "17,200,755 vertices" in line  # hook-content count, Stanley EC2 Cor. 7.21.4
    assert f"{EXPORT_LIMIT:,}" in line


def test_crystal_output_to_a_missing_directory(tmp_path: Path) -> None:
    line = refused("crystal", "2,1", "3", "-o", str(tmp_path / "no" / "such" / "file.json"))
    assert "cannot write" in line


# --- tableaux ----------------------------------------------------------------------------------


def test_tableaux_limit_and_rest() -> None:
    out = ok("tableaux", "5,3", "3", "--limit", "4").splitlines()
    assert out[:2] == ["0: 1 1 1 1 1 / 2 2 2", "1: 1 1 1 1 2 / 2 2 2"]
    assert len(out) == 5
    total = druse.count_tableaux((5, 3), 3)
    assert out[-1].startswith(f"... {total - 4} more (of {total})")


def test_tableaux_all_and_start_follow_the_vertex_order() -> None:
    c = druse.crystal((2, 2, 1), 4)
    lines = ok("tableaux", "2,2,1", "4", "--limit", "0").splitlines()
    assert len(lines) == len(c)
    for v in (0, 7, len(c) - 1):
        rows = " / ".join(" ".join(map(str, row)) for row in c.tableau(v))
        assert lines[v] == f"{v}: {rows}"
    tail = ok("tableaux", "2,2,1", "4", "--start", "7", "--limit", "2").splitlines()
    assert tail[:2] == lines[7:9]


def test_tableaux_start_past_the_end() -> None:
    assert "--start" in refused("tableaux", "2,1", "3", "--start", "8", code=2)


# --- bad input ---------------------------------------------------------------------------------


@pytest.mark.parametrize(
    ("args", "code", "words"),
    [
        (("count", "2,3", "3"), 1, "weakly decreasing"),
        (("count", "a,b", "3"), 2, "not a list of integers"),
        (("count", "2,1", "three"), 2, "Invalid value for 'N'"),
        (("count", "2.5", "3"), 2, "not a list of integers"),
        (("kostka", "2,1", "1,-1,3"), 1, "non-negative"),
        (("schur", "1,2", "3"), 1, "weakly decreasing"),
        (("crystal", "2,1", "0"), 2, "Invalid value for 'N'"),
        (("tableaux", "2,1", "0"), 2, "Invalid value for 'N'"),
        (("crystal", "3,4", "3", "--json"), 1, "weakly decreasing"),
        (("tableaux", "2,1", "3", "--limit", "-1"), 2, "--limit"),
        (("count", "2,1"), 2, "Missing argument 'N'"),
        (("frobnicate",), 2, "No such command"),
    ],
)
def test_bad_input_is_one_line(args: tuple[str, ...], code: int, words: str) -> None:
    assert words in refused(*args, code=code)


# --- io ----------------------------------------------------------------------------------------


def test_export_of_a_crystal_without_tableaux() -> None:
    # the two-vertex crystal B(1) of GL_2 given by hand: 0 --1--> 1
    c = druse.Crystal(2, 2, lowering=[[1, -1]], weights=[[1, 0], [0, 1]])
    doc = crystal_to_json(c)
    assert doc["shape"] is None
    assert doc["vertices"] == [{"index": 0, "weight": [1, 0]}, {"index": 1, "weight": [0, 1]}]
    assert doc["edges"] == [[0, 1, 1]]


def test_export_refuses_what_is_not_a_crystal() -> None:
    with pytest.raises(TypeError, match=r"druse\.Crystal"):
        crystal_to_json({"n": 3})  # type: ignore[arg-type]


def test_write_json_to_a_file_object_and_a_path(tmp_path: Path) -> None:
    doc = crystal_to_json(druse.crystal((2, 2), 3))
    buffer = io.StringIO()
    write_json(doc, buffer)
    assert json.loads(buffer.getvalue()) == doc
    write_json(doc, tmp_path / "b22.json")
    assert json.loads((tmp_path / "b22.json").read_text(encoding="utf-8")) == doc


def test_write_json_fails_before_creating_the_file(tmp_path: Path) -> None:
    target = tmp_path / "bad.json"
    with pytest.raises(TypeError):
        write_json({"x": object()}, target)
    assert not target.exists()


@pytest.mark.parametrize("chunk_size", [1, 7, 1 << 15])
def test_streamed_export_is_the_same_text(chunk_size: int) -> None:
    for c in (druse.crystal((3, 2, 2), 4), druse.crystal((), 2), druse.crystal((2,), 1)):
        whole, streamed = io.StringIO(), io.StringIO()
        write_json(crystal_to_json(c), whole)
        write_crystal_json(c, streamed, chunk_size=chunk_size)
        assert streamed.getvalue() == whole.getvalue()


def test_streamed_export_of_a_crystal_without_tableaux(tmp_path: Path) -> None:
    c = druse.Crystal(2, 2, lowering=[[1, -1]], weights=[[1, 0], [0, 1]])
    write_crystal_json(c, tmp_path / "pair.json", chunk_size=1)
    assert json.loads((tmp_path / "pair.json").read_text(encoding="utf-8")) == crystal_to_json(c)


def test_export_size_check_names_the_size() -> None:
    check_export_size(EXPORT_LIMIT)
    with pytest.raises(druse.TooLargeError, match=f"{EXPORT_LIMIT + 1:,} vertices"):
        check_export_size(EXPORT_LIMIT + 1)
