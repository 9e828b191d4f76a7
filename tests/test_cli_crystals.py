"""The command line for Littlewood-Richardson multiplicities and tensor products."""

from __future__ import annotations

import json
from pathlib import Path
from typing import Any

import druse
from clirun import ok, refused, run


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


def _saved(tmp_path: Path, name: str, doc: dict[str, Any]) -> str:
    path = tmp_path / name
    path.write_text(json.dumps(doc), encoding="utf-8")
    return str(path)


def test_check_and_decompose_a_saved_tableau_crystal(tmp_path: Path) -> None:
    # B(2,1) of GL_3 has 8 vertices (hook-content) and satisfies every axiom (Stembridge 2003)
    path = str(tmp_path / "b21.json")
    ok("crystal", "2,1", "3", "--output", path)
    assert "every axiom holds" in ok("check", path)
    out = ok("decompose", path)
    assert "isomorphic to B(2,1)" in out
    graphml = str(tmp_path / "b21.graphml")
    ok("convert", path, graphml)
    assert json.loads(ok("check", graphml, "--json"))["ok"] is True


def test_check_reports_a_wrong_weight_with_exit_status_1(tmp_path: Path) -> None:
    path = str(tmp_path / "b21.json")
    ok("crystal", "2,1", "3", "--output", path)
    doc = json.loads(Path(path).read_text(encoding="utf-8"))
    doc["vertices"][3]["weight"][0] += 1  # one weight wrong: wt(f_i x) = wt(x) - alpha_i breaks
    broken = _saved(tmp_path, "broken.json", doc)
    result = run("check", broken, "--json")
    assert result.exit_code == 1
    report = json.loads(result.stdout)
    assert report["ok"] is False
    assert report["counts"]["weight"] > 0
    assert any(3 in v["vertices"] for v in report["violations"] if v["axiom"] == "weight")


def test_malformed_file_names_the_line(tmp_path: Path) -> None:
    bad = tmp_path / "bad.json"
    bad.write_text('{"format": "druse.crystal",\n', encoding="utf-8")
    assert "line 2" in refused("check", str(bad))


def test_recognise_a_demazure_mask_and_a_broken_one(tmp_path: Path) -> None:
    path = str(tmp_path / "b21.json")
    ok("crystal", "2,1", "3", "--output", path)
    # B_{s_1}(2,1) = {u, f_1 u}: its character is key(1,2,0) (Demazure character formula,
    # Kashiwara 1993); the file keeps druse's vertex order, where f_1 of vertex 0 is vertex 1
    doc = json.loads(ok("recognise", path, "--vertices", "0,1", "--json"))
    assert doc["pieces"][0]["key"] == [1, 2, 0]
    assert doc["key_expansion"] == [[[1, 2, 0], 1]]
    subset = tmp_path / "subset.json"
    subset.write_text("[0, 1, 2, 5]", encoding="utf-8")
    out = ok("recognise", path, "--vertices", f"@{subset}")
    assert "not Demazure" in out
    assert "Error" in refused("recognise", path, "--vertices", "0,99")


def test_crystal_output_graphml_by_suffix(tmp_path: Path) -> None:
    path = str(tmp_path / "b31.graphml")
    ok("crystal", "3,1", "3", "--output", path)
    # B(3,1) of GL_3 has 15 vertices (hook-content formula)
    assert json.loads(ok("check", path, "--json"))["vertices"] == 15


def test_recognise_a_truncated_crystal_file(tmp_path: Path) -> None:
    # the pipe-dream crystal is a union of Demazure crystals whose keys sum to S_w
    # (Assaf-Schilling, "A Demazure crystal construction for Schubert polynomials", 2018)
    path = str(tmp_path / "pipes.json")
    druse.save_crystal(druse.pipe_dream_crystal((2, 5, 1, 4, 3)), path)
    doc = json.loads(ok("recognise", path, "--json"))
    assert all(p["demazure"] for p in doc["pieces"])
    expected = druse.schubert_key_expansion((2, 5, 1, 4, 3), method="polynomial")
    assert {tuple(a): c for a, c in doc["key_expansion"]} == expected
