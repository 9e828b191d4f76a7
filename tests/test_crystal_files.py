"""Saving and loading crystals as JSON and GraphML: exact round trips, malformed files, no
half-written files."""

from __future__ import annotations

import io
import json
import os
import xml.dom.minidom
from pathlib import Path
from typing import Any

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import druse
from druse import Crystal
from druse.io import crystal_to_json, load_crystal, save_crystal
from druse.user_crystal import LabelledCrystal, crystal_from_edges

FORMATS = ["json", "graphml"]
GRAPHML_NS = "http://graphml.graphdrawing.org/xmlns"  # the GraphML standard's namespace


def same(a: Crystal, b: Crystal) -> None:
    """Same vertices in the same order, edges, weights and labels."""
    assert (a.n, len(a)) == (b.n, len(b))
    assert np.array_equal(a.edges(), b.edges())
    assert np.array_equal(a.weights(), b.weights())
    labels = a.labels() if isinstance(a, LabelledCrystal) else None
    assert labels == (b.labels() if isinstance(b, LabelledCrystal) else None)
    if labels is not None:
        assert isinstance(b, LabelledCrystal)
        assert [type(x) for x in labels] == [type(x) for x in b.labels()]


def round_trip(c: Crystal, fmt: str) -> Crystal:
    buffer = io.StringIO()
    save_crystal(c, buffer, format=fmt)
    buffer.seek(0)
    return load_crystal(buffer, format=fmt)


def crystals() -> list[Crystal]:
    b = druse.crystal((2, 1), 3)
    mixed = [7, "1", 2.5, True, None, ("t", (1, 2)), -3, 'é<&>"']
    edges = [[0, 1, 1], [1, 2, 2], [3, 1, 4], [4, 2, 5]]
    return [
        crystal_from_edges(3, b.edges(), size=len(b) + 2),  # plain, with isolated vertices
        crystal_from_edges(3, {1: {"a": "b"}, 2: {"b": "c"}}),
        crystal_from_edges(3, edges, labels=mixed[:6]),
        crystal_from_edges(3, [[2, 1, 3], [3, 2, 4]], labels=mixed[3:]),
        crystal_from_edges(2, [], size=0),
        druse.crystal((3, 1), 4),
    ]


@pytest.mark.parametrize("fmt", FORMATS)
@pytest.mark.parametrize("index", range(6))
def test_round_trip_is_exact(fmt: str, index: int) -> None:
    c = crystals()[index]
    back = round_trip(c, fmt)
    if isinstance(c, druse.TableauCrystal):  # comes back labelled by its tableaux
        assert isinstance(back, LabelledCrystal)
        assert back.labels() == tuple(c.tableau(v) for v in range(len(c)))
        assert np.array_equal(back.edges(), c.edges())
        assert np.array_equal(back.weights(), c.weights())
        c = back
    same(back, c)
    same(round_trip(back, fmt), back)


@pytest.mark.parametrize("fmt", FORMATS)
def test_paths_choose_the_format_by_suffix(tmp_path: Path, fmt: str) -> None:
    c = crystals()[1]
    path = tmp_path / f"abc.{fmt.upper()}"
    save_crystal(c, path)
    same(load_crystal(path), c)
    same(load_crystal(str(path)), c)
    with open(path, "rb") as handle:  # a binary file works for reading, format from its name
        same(load_crystal(handle), c)
    assert os.listdir(tmp_path) == [path.name]  # no temporary file left behind


def test_numpy_labels_are_saved_as_numbers() -> None:
    c = crystal_from_edges(2, [[0, 1, 1]], labels=list(np.arange(2)))
    back = round_trip(c, "json")
    assert isinstance(back, LabelledCrystal)
    assert back.labels() == (0, 1)
    assert [type(x) for x in back.labels()] == [int, int]


def test_the_existing_export_loads() -> None:
    b = druse.crystal((2, 2), 3)
    doc = crystal_to_json(b)
    assert "label" not in doc["vertices"][0]
    back = load_crystal(io.StringIO(json.dumps(doc)), format="json")
    assert isinstance(back, LabelledCrystal)
    assert back.label(0) == ((1, 1), (2, 2))
    labelled = crystal_to_json(crystals()[1])
    assert labelled["version"] == 1
    assert labelled["vertices"][2] == {"index": 2, "label": "c", "weight": [0, 0, 1]}


def test_graphml_parsed_independently() -> None:
    b = druse.crystal((2, 1), 3)
    buffer = io.StringIO()
    save_crystal(b, buffer, format="graphml")
    dom = xml.dom.minidom.parseString(buffer.getvalue())
    root = dom.documentElement
    assert root is not None
    assert root.tagName == "graphml"
    assert root.namespaceURI == GRAPHML_NS
    keys = {k.getAttribute("attr.name"): k for k in dom.getElementsByTagName("key")}
    assert keys["i"].getAttribute("for") == "edge"
    assert keys["weight"].getAttribute("for") == "node"
    assert keys["tableau"].getAttribute("for") == "node"
    (graph,) = dom.getElementsByTagName("graph")
    assert graph.getAttribute("edgedefault") == "directed"
    nodes, edges = dom.getElementsByTagName("node"), dom.getElementsByTagName("edge")
    assert len(nodes) == len(b) == 8  # dim of the adjoint of GL_3, from memory
    assert len(edges) == len(b.edges())
    colours = sorted(
        int(d.firstChild.data)  # type: ignore[union-attr]
        for e in edges
        for d in e.getElementsByTagName("data")
    )
    assert colours == sorted(b.edges()[:, 1].tolist())


def test_graphml_from_another_program() -> None:
    text = f"""<?xml version="1.0"?>
<graphml xmlns="{GRAPHML_NS}">
  <key id="d0" for="edge" attr.name="i" attr.type="int"/>
  <key id="d1" for="node" attr.name="colour" attr.type="string"/>
  <key id="d2" for="edge" attr.name="i" attr.type="int"><default>1</default></key>
  <graph edgedefault="directed">
    <edge source="top" target="mid"/>
    <node id="top"><data key="d1">red</data></node>
    <node id="mid"/>
    <node id="low"/>
    <edge source="mid" target="low"><data key="d0">2</data></edge>
  </graph>
</graphml>
"""
    c = load_crystal(io.BytesIO(text.encode()), format="graphml")
    assert type(c) is Crystal
    assert c.character() == druse.schur((1,), 3)  # weights derived: B(1) of GL_3


MALFORMED_JSON: list[tuple[str, str]] = [
    (
        '{"format": "druse.crystal",\n "version": 1,\n "n": }',
        r"x.json: line 3, column 7: not valid JSON",
    ),
    ("[]", r"\$: must be a JSON object"),
    ('{"format": "other"}', r"\$: the key 'version' is missing"),
    ('{"format": "other", "version": 1}', r"\$.format: must be 'druse.crystal'; got 'other'"),
    ('{"format": "druse.crystal", "version": 9}', r"\$.version: the file has schema version 9"),
    ('{"format": "druse.crystal", "version": 1, "n": 0}', r"\$.n: must be at least 1"),
    (
        '{"format": "druse.crystal", "version": 1, "n": 2, "size": 1, "vertices": []}',
        r"\$.vertices: must be a list of size = 1 objects",
    ),
]


def header(**extra: Any) -> dict[str, Any]:
    return {"format": "druse.crystal", "version": 1, "n": 2, "size": 2, **extra}


def two(**vertex: Any) -> list[dict[str, Any]]:
    return [{"index": 0, "weight": [1, 0], **vertex}, {"index": 1, "weight": [0, 1]}]


MALFORMED_DOCS: list[tuple[dict[str, Any], str]] = [
    (
        header(vertices=two(), edges=[[0, 1, 1], [0, 1, 1]]),
        r"given twice: \$.edges\[0\], \$.edges\[1\]",
    ),
    (header(vertices=two(), edges=[[0, 2, 1]]), r"\$.edges\[0\] has i = 2; i must be in 1..1"),
    (
        header(vertices=two(), edges=[[0, 1, 7]]),
        r"\$.edges\[0\] = \(0, 1, 7\) names a vertex outside",
    ),
    (
        header(vertices=two(), edges=[[0, 1, 1.5]]),
        r"\$.edges\[0\]\[2\]: must be an integer; got 1.5",
    ),
    (header(vertices=two(), edges=[[0, 1]]), r"\$.edges\[0\]: must be \[source, i, target\]"),
    (header(vertices=two(), edges={}), r"\$.edges: must be a list"),
    (
        header(vertices=two(weight=[1]), edges=[]),
        r"\$.vertices\[0\].weight: must be a list of n = 2",
    ),
    (
        header(vertices=two(weight=[1, True]), edges=[]),
        r"\$.vertices\[0\].weight\[1\]: must be an integer",
    ),
    (header(vertices=two(index=1), edges=[]), r"\$.vertices\[0\].index: must be 0"),
    (
        header(vertices=two(label={"a": 1}), edges=[]),
        r"\$.vertices\[0\].label: a label must not be",
    ),
    (header(vertices=two(label="a"), edges=[]), r"\$.vertices\[1\]: has no label"),
    (
        header(
            vertices=[{"index": 0, "weight": [0, 1]}, {"index": 1, "weight": [0, 1]}],
            edges=[[0, 1, 1]],
        ),
        r"inconsistent with the edge 0 -1-> 1 \(\$.edges\[0\]\)",
    ),
]


@pytest.mark.parametrize(("text", "message"), MALFORMED_JSON)
def test_malformed_json_text(tmp_path: Path, text: str, message: str) -> None:
    path = tmp_path / "x.json"
    path.write_text(text, encoding="utf-8")
    with pytest.raises(ValueError, match=message):
        load_crystal(path)


@pytest.mark.parametrize(("doc", "message"), MALFORMED_DOCS)
def test_malformed_json_documents(tmp_path: Path, doc: dict[str, Any], message: str) -> None:
    path = tmp_path / "bad.json"
    path.write_text(json.dumps(doc), encoding="utf-8")
    with pytest.raises(ValueError, match=f"bad.json: .*{message}"):
        load_crystal(path)


def test_unchecked_weights_load_for_an_axiom_check() -> None:
    doc = header(
        vertices=[{"index": 0, "weight": [0, 1]}, {"index": 1, "weight": [0, 1]}], edges=[[0, 1, 1]]
    )
    c = load_crystal(io.StringIO(json.dumps(doc)), format="json", check_weights=False)
    assert c.weights().tolist() == [[0, 1], [0, 1]]


def graphml(body: str, keys: str = '<key id="i" for="edge" attr.name="i" attr.type="int"/>') -> str:
    return f'<?xml version="1.0"?>\n<graphml xmlns="{GRAPHML_NS}">\n{keys}\n{body}\n</graphml>\n'


NODES = '<node id="a"/>\n<node id="b"/>\n'
MALFORMED_GRAPHML: list[tuple[str, str]] = [
    (
        graphml('<graph edgedefault="directed">\n<node id="a">\n</graph>'),
        r"line 6, column 2: not well-formed XML \(mismatched tag\)",
    ),
    (
        graphml('<graph edgedefault="undirected"/>'),
        r'line 4: <graph>: must have edgedefault="directed"',
    ),
    (graphml(""), "no <graph> element"),
    (
        graphml('<graph edgedefault="directed"/>\n<graph edgedefault="directed"/>'),
        r"line 5: <graph>: a crystal file holds exactly one graph",
    ),
    (
        graphml(
            f'<graph edgedefault="directed">\n{NODES}<edge source="a" target="c">'
            '<data key="i">1</data></edge></graph>'
        ),
        r"line 7: <edge>: no node has the id 'c'",
    ),
    (
        graphml(f'<graph edgedefault="directed">\n{NODES}<edge source="a" target="b"/></graph>'),
        r"line 7: <edge>: has no data i",
    ),
    (
        graphml(
            f'<graph edgedefault="directed">\n{NODES}<edge source="a" target="b">'
            '<data key="i">one</data></edge></graph>'
        ),
        r"line 7: <data>: must be an integer",
    ),
    (
        graphml(
            f'<graph edgedefault="directed">\n{NODES}<edge source="a" target="b">'
            '<data key="q">1</data></edge></graph>'
        ),
        r"line 7: <data>: key 'q' is not declared",
    ),
    (
        graphml(f'<graph edgedefault="directed">\n{NODES}<hyperedge/></graph>'),
        r"line 7: <hyperedge>: hyperedges are not crystal arrows",
    ),
    (
        graphml('<graph edgedefault="directed">\n<node id="a"/>\n<node id="a"/></graph>'),
        r"line 6: <node>: the id 'a' is used twice",
    ),
    (
        graphml(
            f'<graph edgedefault="directed">\n{NODES}<edge source="a" target="b">'
            '<data key="i">1</data></edge>\n<edge source="a" target="a"><data key="i">1</data>'
            "</edge></graph>"
        ),
        r"f_1 sends a to both b and a|f_1 sends 0 to both 1 and 0",
    ),
    (
        graphml(
            '<graph edgedefault="directed">\n<node id="a"><data key="w">1 x</data></node></graph>',
            '<key id="w" for="node" attr.name="weight" attr.type="string"/>',
        ),
        r"line 5: <data> weight: must be integers separated by spaces",
    ),
    (
        graphml(
            '<graph edgedefault="directed">\n<node id="a"><data key="l">[1,</data></node></graph>',
            '<key id="l" for="node" attr.name="label" attr.type="string"/>',
        ),
        r"line 5: <data> label: not JSON text",
    ),
    (
        graphml('<graph edgedefault="directed">\n<node id="a"/></graph>'),
        "neither data n nor node weights nor edges",
    ),
]


@pytest.mark.parametrize(("text", "message"), MALFORMED_GRAPHML)
def test_malformed_graphml(tmp_path: Path, text: str, message: str) -> None:
    path = tmp_path / "bad.graphml"
    path.write_text(text, encoding="utf-8")
    with pytest.raises(ValueError, match=f"bad.graphml: (.*){message}"):
        load_crystal(path)


def test_a_failed_save_leaves_the_old_file_whole(tmp_path: Path) -> None:
    target = tmp_path / "c.json"
    save_crystal(crystals()[1], target)
    before = target.read_bytes()
    bad = crystal_from_edges(2, [[0, 1, 1]], labels=["fine", frozenset({1})])
    for path in (target, tmp_path / "c.graphml"):
        with pytest.raises(TypeError, match="the label of vertex 1 is a frozenset"):
            save_crystal(bad, path)
    assert target.read_bytes() == before
    assert sorted(os.listdir(tmp_path)) == ["c.json"]
    buffer = io.StringIO()
    with pytest.raises(TypeError, match="frozenset"):
        save_crystal(bad, buffer, format="json")
    assert buffer.getvalue() == ""


def test_format_errors(tmp_path: Path) -> None:
    c = crystals()[1]
    with pytest.raises(ValueError, match=r"suffix '.txt'.*format='json'"):
        save_crystal(c, tmp_path / "c.txt")
    with pytest.raises(ValueError, match="format must be given"):
        save_crystal(c, io.StringIO())
    with pytest.raises(ValueError, match="format must be 'json' or 'graphml'; got 'xml'"):
        load_crystal(io.StringIO(), format="xml")
    with pytest.raises(TypeError, match=r"crystal must be a druse\.Crystal"):
        save_crystal("no", tmp_path / "c.json")  # type: ignore[arg-type]
    with pytest.raises(TypeError, match=r"float\('nan'\)|nan, which JSON cannot hold"):
        save_crystal(crystal_from_edges(2, [], labels=[float("nan")]), io.StringIO(), "json")
    assert sorted(os.listdir(tmp_path)) == []


@settings(max_examples=25)
@given(st.randoms(use_true_random=False), st.sampled_from(FORMATS))
def test_relabelled_tableau_crystal_round_trips(rng: Any, fmt: str) -> None:
    b = druse.crystal((2, 1), 3)
    order = list(range(len(b)))
    rng.shuffle(order)  # new vertex k is old vertex order[k]
    new = np.argsort(order)
    edges = b.edges().copy()
    edges[:, 0], edges[:, 2] = new[edges[:, 0]], new[edges[:, 2]]
    names: list[Any] = [rng.choice([f"t{v}", v * 10, (v, str(v))]) for v in order]
    c = crystal_from_edges(3, edges, labels=names)
    assert c.character() == druse.schur((2, 1), 3)  # Kashiwara-Nakashima 1994
    assert np.array_equal(c.weights(), b.weights()[order])
    same(round_trip(c, fmt), c)
