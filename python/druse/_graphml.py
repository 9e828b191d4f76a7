"""GraphML (http://graphml.graphdrawing.org/) for crystals: written and read with xml.etree.

The layout is described in :mod:`druse.io`. Writing builds the elements with xml.etree in chunks
of vertices (so escaping is the library's, and memory stays bounded); reading feeds the file line
by line to xml.etree's pull parser, so every error can name the element and its line.
"""

from __future__ import annotations

import json
import xml.etree.ElementTree as ET
from collections.abc import Hashable
from dataclasses import dataclass, field
from typing import IO, Any

import numpy as np
import numpy.typing as npt

from druse._crystal_json import (
    FORMAT,
    VERSION,
    FileError,
    check_header,
    json_label,
    label_from_json,
    tableau_rows,
)
from druse.crystal import Crystal, TableauCrystal
from druse.user_crystal import LabelledCrystal, build

NAMESPACE = "http://graphml.graphdrawing.org/xmlns"
_SCHEMA = "http://graphml.graphdrawing.org/xmlns/1.0/graphml.xsd"
_CHUNK = 1 << 14

# (id, domain, attr.name, attr.type) of the keys written; readers match by attr.name
_KEYS = [
    ("n", "graph", "n", "int"),
    ("format", "graph", "format", "string"),
    ("version", "graph", "version", "int"),
    ("shape", "graph", "shape", "string"),
    ("weight", "node", "weight", "string"),
    ("label", "node", "label", "string"),
    ("tableau", "node", "tableau", "string"),
    ("i", "edge", "i", "int"),
]


def _text(elem: ET.Element) -> str:
    body = ET.tostring(elem, encoding="unicode")
    return body[len("<c>") : -len("</c>")] if elem.tag == "c" else body


def write_graphml(crystal: Crystal, out: IO[str]) -> None:
    """Write ``crystal`` as a GraphML document to a text stream."""
    labelled = isinstance(crystal, LabelledCrystal)
    tableaux = isinstance(crystal, TableauCrystal)
    out.write('<?xml version="1.0" encoding="UTF-8"?>\n')
    out.write(
        f'<graphml xmlns="{NAMESPACE}" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance" '
        f'xsi:schemaLocation="{NAMESPACE} {_SCHEMA}">\n'
    )
    head = ET.Element("c")
    for key_id, domain, name, kind in _KEYS:
        if (key_id == "label" and not labelled) or (
            key_id in ("tableau", "shape") and not tableaux
        ):
            continue
        attrs = {"id": key_id, "for": domain, "attr.name": name, "attr.type": kind}
        ET.SubElement(head, "key", attrs).tail = "\n"
    graph = ET.SubElement(head, "graph", {"id": "crystal", "edgedefault": "directed"})
    graph.text = "\n"
    values = {"n": str(crystal.n), "format": FORMAT, "version": str(VERSION)}
    if isinstance(crystal, TableauCrystal):
        values["shape"] = json.dumps(list(crystal.shape))
    for key_id, value in values.items():
        ET.SubElement(graph, "data", {"key": key_id}).text = value
        graph[-1].tail = "\n"
    out.write(_text(head).removesuffix("</graph>"))
    for start in range(0, len(crystal), _CHUNK):
        out.write(_text(_nodes(crystal, start, min(start + _CHUNK, len(crystal)))))
    for i in range(1, crystal.n):
        fi = crystal.f(i)
        for start in range(0, len(crystal), _CHUNK):
            chunk = ET.Element("c")
            sources = start + np.flatnonzero(fi[start : start + _CHUNK] >= 0)
            for s, t in zip(sources.tolist(), fi[sources].tolist(), strict=True):
                edge = ET.SubElement(chunk, "edge", {"source": f"v{s}", "target": f"v{t}"})
                ET.SubElement(edge, "data", {"key": "i"}).text = str(i)
                edge.tail = "\n"
            if len(chunk):
                out.write(_text(chunk))
    out.write("</graph>\n</graphml>\n")


def _nodes(crystal: Crystal, start: int, stop: int) -> ET.Element:
    chunk = ET.Element("c")
    weights = crystal.weights()[start:stop].tolist()
    extra: list[tuple[str, Any]] = []
    if isinstance(crystal, LabelledCrystal):
        labels = crystal.labels()[start:stop]
        extra = [
            ("label", json_label(x, f"the label of vertex {start + k}"))
            for k, x in enumerate(labels)
        ]
    elif isinstance(crystal, TableauCrystal):
        extra = [("tableau", rows) for rows in tableau_rows(crystal, start, stop)]
    for k, weight in enumerate(weights):
        node = ET.SubElement(chunk, "node", {"id": f"v{start + k}"})
        ET.SubElement(node, "data", {"key": "weight"}).text = " ".join(map(str, weight))
        if extra:
            key, value = extra[k]
            ET.SubElement(node, "data", {"key": key}).text = json.dumps(
                value, separators=(",", ":")
            )
        node.tail = "\n"
    return chunk


# --- reading ---------------------------------------------------------------------------------


@dataclass
class _Reader:
    """What the pull parser has delivered so far."""

    keys: dict[str, tuple[str, str]] = field(default_factory=dict)  # id -> (domain, attr.name)
    defaults: dict[str, str] = field(default_factory=dict)  # attr.name -> <default> value
    graph_data: dict[str, str] = field(default_factory=dict)
    node_ids: dict[str, int] = field(default_factory=dict)
    node_data: list[dict[str, str]] = field(default_factory=list)
    node_lines: list[int] = field(default_factory=list)
    edges: list[tuple[str, str, str | None, int]] = field(default_factory=list)
    stack: list[str] = field(default_factory=list)
    graphs: int = 0
    holder: dict[str, str] = field(default_factory=dict)
    graph: ET.Element | None = None


def _local(tag: str) -> str | None:
    """The GraphML tag without its namespace; None for elements of another namespace."""
    if tag.startswith("{"):
        ns, _, name = tag[1:].partition("}")
        return name if ns == NAMESPACE else None
    return tag


def _start(r: _Reader, tag: str, elem: ET.Element, line: int) -> None:
    where = f"line {line}: <{tag}>"
    if tag == "graph":
        r.graphs += 1
        if r.graphs > 1 or "graph" in r.stack:
            raise FileError(f"{where}: a crystal file holds exactly one graph")
        r.graph = elem
        if elem.get("edgedefault") != "directed":
            raise FileError(
                f'{where}: must have edgedefault="directed" (crystal arrows are directed)'
            )
    elif tag in ("node", "edge", "hyperedge") and r.stack[-1:] != ["graph"]:
        raise FileError(f"{where}: must be a child of <graph>")
    if tag == "hyperedge":
        raise FileError(f"{where}: hyperedges are not crystal arrows")
    if tag in ("node", "edge"):
        r.holder = {
            name: r.defaults[name]
            for domain, name in r.keys.values()
            if domain in (tag, "all") and name in r.defaults
        }
    r.stack.append(tag)


def _end(r: _Reader, tag: str, elem: ET.Element, line: int) -> None:
    r.stack.pop()
    where = f"line {line}: <{tag}>"
    if tag == "key":
        key_id, name = elem.get("id"), elem.get("attr.name")
        if key_id is None or name is None:
            raise FileError(f"{where}: needs the attributes id and attr.name")
        r.keys[key_id] = (elem.get("for", "all"), name)
        default = elem.find(f"{{{NAMESPACE}}}default")
        default = elem.find("default") if default is None else default
        if default is not None:
            r.defaults[name] = f"{default.text or ''}\0{line}"
    elif tag == "data":
        key_id = elem.get("key")
        if key_id not in r.keys:
            raise FileError(f"{where}: key {key_id!r} is not declared by a <key> before it")
        domain, name = r.keys[key_id]
        parent = r.stack[-1] if r.stack else ""
        if domain not in ("all", parent):
            return  # a key of another domain: GraphML says to ignore it here
        store = r.graph_data if parent == "graph" else r.holder
        store[name] = f"{elem.text or ''}\0{line}"  # the line rides along for error messages
    elif tag == "node":
        node_id = elem.get("id")
        if node_id is None:
            raise FileError(f"{where}: needs an id")
        if node_id in r.node_ids:
            raise FileError(f"{where}: the id {node_id!r} is used twice")
        r.node_ids[node_id] = len(r.node_data)
        r.node_data.append(r.holder)
        r.node_lines.append(line)
    elif tag == "edge":
        source, target = elem.get("source"), elem.get("target")
        if source is None or target is None:
            raise FileError(f"{where}: needs source and target")
        if elem.get("directed", "true") != "true":
            raise FileError(f"{where}: must be directed")
        r.edges.append((source, target, r.holder.get("i"), line))
    if tag in ("node", "edge") and r.graph is not None:
        del r.graph[:]  # read: drop it, so memory stays bounded on large files


def read_graphml(handle: IO[Any], source: str, check_weights: bool = True) -> Crystal:
    """The crystal in a GraphML stream (text or binary); errors start with ``source``."""
    parser: ET.XMLPullParser[ET.Element] = ET.XMLPullParser(events=("start", "end"))
    r = _Reader()
    line = 0
    try:
        for line, chunk in enumerate(handle, start=1):
            parser.feed(chunk)
            _events(r, parser, line)
        parser.close()
        _events(r, parser, line)
        return _crystal(r, check_weights)
    except ET.ParseError as exc:
        row, col = exc.position
        what = str(exc).split(":")[0]
        raise FileError(
            f"{source}: line {row}, column {col}: not well-formed XML ({what})"
        ) from None
    except FileError as exc:
        raise FileError(f"{source}: {exc}") from None
    except (ValueError, TypeError) as exc:
        raise FileError(f"{source}: {exc}") from exc


def _events(r: _Reader, parser: ET.XMLPullParser[ET.Element], line: int) -> None:
    for item in parser.read_events():
        event, elem = item[0], item[-1]
        if not isinstance(elem, ET.Element):
            continue  # only start and end events are asked for; these carry elements
        tag = _local(elem.tag)
        if tag is None:
            continue
        if event == "start":
            _start(r, tag, elem, line)
        else:
            _end(r, tag, elem, line)


def _value(raw: str) -> tuple[str, int]:
    text, _, line = raw.rpartition("\0")
    return text, int(line)


def _crystal(r: _Reader, check_weights: bool) -> Crystal:
    if r.graphs == 0:
        raise FileError("no <graph> element")
    fmt = r.graph_data.get("format")
    if fmt is not None:
        text, line = _value(fmt)
        version = r.graph_data.get("version")
        check_header(
            text, _int(version) if version else 1, f"line {line}: <data> format", "<data> version"
        )
    size = len(r.node_data)
    rows, lines = [], []
    for s, t, colour, line in r.edges:
        ends = [r.node_ids.get(x) for x in (s, t)]
        if ends[0] is None or ends[1] is None:
            missing = s if ends[0] is None else t
            raise FileError(f"line {line}: <edge>: no node has the id {missing!r}")
        if colour is None:
            raise FileError(f"line {line}: <edge>: has no data i (the colour of the arrow)")
        rows.append((ends[0], _int(colour), ends[1]))
        lines.append(line)
    edges = np.array(rows, dtype=np.int64).reshape(-1, 3)
    weights = [_node_weight(d) for d in r.node_data]
    labels = _labels(r.node_data, r.node_lines)
    n = _graph_n(r, weights, edges)
    for k, w in enumerate(weights):
        if (w is None) != (weights[0] is None):
            have = "lacks a weight" if w is None else "has a weight"
            raise FileError(f"line {r.node_lines[k]}: <node>: {have}, unlike the first node")
        if w is not None and len(w) != n:
            raise FileError(
                f"line {r.node_lines[k]}: <node>: the weight must have n = {n} entries; "
                f"got {len(w)}"
            )
    table = None if not weights or weights[0] is None else weights
    return build(
        n,
        size,
        edges,
        table,
        labels,
        None,
        check_weights,
        where=lambda k: f"the <edge> on line {lines[k]}",
    )


def _int(raw: str) -> int:
    text, line = _value(raw)
    try:
        return int(text.strip())
    except ValueError:
        raise FileError(f"line {line}: <data>: must be an integer; got {text!r}") from None


def _node_weight(data: dict[str, str]) -> list[int] | None:
    raw = data.get("weight")
    if raw is None:
        return None
    text, line = _value(raw)
    try:
        return [int(a) for a in text.split()]
    except ValueError:
        raise FileError(
            f"line {line}: <data> weight: must be integers separated by spaces; got {text!r}"
        ) from None


def _graph_n(r: _Reader, weights: list[list[int] | None], edges: npt.NDArray[np.int64]) -> int:
    """n from the graph's data n, else the length of the weights, else the largest i plus 1."""
    if "n" in r.graph_data:
        n = _int(r.graph_data["n"])
        if n < 1:
            raise FileError(f"line {_value(r.graph_data['n'])[1]}: <data> n: must be at least 1")
        return n
    if weights and weights[0] is not None:
        return len(weights[0])
    if edges.size:
        return max(int(edges[:, 1].max()), 0) + 1
    raise FileError("the graph has neither data n nor node weights nor edges, so n is unknown")


def _labels(data: list[dict[str, str]], lines: list[int]) -> tuple[Hashable, ...] | None:
    found: list[Hashable] = []
    for k, d in enumerate(data):
        raw = d.get("label", d.get("tableau"))
        if raw is None:
            if found:
                raise FileError(f"line {lines[k]}: <node>: has no label, unlike the first node")
            continue
        if len(found) != k:
            raise FileError(f"line {lines[k]}: <node>: has a label, unlike the first node")
        text, line = _value(raw)
        try:
            value = json.loads(text)
        except json.JSONDecodeError as exc:
            raise FileError(f"line {line}: <data> label: not JSON text ({exc.msg})") from None
        found.append(label_from_json(value, f"line {line}: <data> label"))
    return tuple(found) if found else None
