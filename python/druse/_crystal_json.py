"""Reading the "druse.crystal" JSON schema (see :mod:`druse.io`), with JSON paths in every error.

Also the conversions of labels to JSON values and back, shared with the GraphML reader/writer.
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Hashable
from typing import Any

import numpy as np
import numpy.typing as npt

from druse.crystal import Crystal, TableauCrystal
from druse.user_crystal import build

#: The ``"format"`` tag of a crystal file, and the newest schema version this module reads.
FORMAT = "druse.crystal"
VERSION = 1


class FileError(ValueError):
    """A malformed crystal file; the message starts with the file and the place in it."""


def json_label(x: Any, what: str) -> Any:
    """A label as a JSON value: tuples become lists, numpy scalars Python ones; TypeError for
    what JSON cannot hold."""
    if isinstance(x, np.generic) and isinstance(x, (np.integer, np.floating, np.bool_)):
        x = x.item()
    if x is None or isinstance(x, (str, bool, int)):
        return x
    if isinstance(x, float):
        if not math.isfinite(x):
            raise TypeError(f"{what} is {x!r}, which JSON cannot hold")
        return x
    if isinstance(x, tuple):
        return [json_label(y, what) for y in x]
    raise TypeError(
        f"{what} is a {type(x).__name__} {x!r}; labels saved to a file must be str, int, float, "
        "bool, None or tuples of these"
    )


def label_from_json(x: Any, path: str) -> Hashable:
    """A JSON value as a label: arrays become tuples; ValueError for objects."""
    if isinstance(x, list):
        return tuple(label_from_json(y, f"{path}[{k}]") for k, y in enumerate(x))
    if isinstance(x, dict):
        raise ValueError(f"{path}: a label must not be a JSON object (it would not be hashable)")
    return x  # type: ignore[no-any-return]


def crystal_from_json(doc: Any, source: str = "<document>", check_weights: bool = True) -> Crystal:
    """The crystal a parsed "druse.crystal" document describes (schema in :mod:`druse.io`).

    Parameters
    ----------
    doc : any
        The result of ``json.load``.
    source : str
        Named at the start of every error message (the file's path).
    check_weights : bool
        Check wt(f_i x) = wt(x) - alpha_i on every edge (default True).

    Raises
    ------
    ValueError
        Anything malformed, with ``source`` and the JSON path (``$.edges[4]``).
    """
    try:
        return _read(doc, check_weights)
    except FileError as exc:
        raise FileError(f"{source}: {exc}") from None
    except (ValueError, TypeError) as exc:
        raise FileError(f"{source}: {exc}") from exc


def _field(obj: dict[str, Any], key: str, path: str) -> Any:
    if key not in obj:
        raise FileError(f"{path}: the key {key!r} is missing")
    return obj[key]


def _int(x: Any, path: str, low: int = 0) -> int:
    if isinstance(x, bool) or not isinstance(x, int):
        raise FileError(f"{path}: must be an integer; got {x!r}")
    if x < low:
        raise FileError(f"{path}: must be at least {low}; got {x}")
    return x


def check_header(fmt: Any, version: Any, where: str, vwhere: str) -> None:
    """The format tag and a version this reader knows."""
    if fmt != FORMAT:
        raise FileError(f"{where}: must be {FORMAT!r}; got {fmt!r}")
    version = _int(version, vwhere, 1)
    if version > VERSION:
        raise FileError(
            f"{vwhere}: the file has schema version {version}, newer than the {VERSION} this "
            "druse reads; upgrade druse"
        )


def _read(doc: Any, check_weights: bool) -> Crystal:
    if not isinstance(doc, dict):
        raise FileError(f"$: must be a JSON object; got {type(doc).__name__}")
    check_header(_field(doc, "format", "$"), _field(doc, "version", "$"), "$.format", "$.version")
    n = _int(_field(doc, "n", "$"), "$.n", 1)
    size = _int(_field(doc, "size", "$"), "$.size")
    vertices = _field(doc, "vertices", "$")
    if not isinstance(vertices, list) or len(vertices) != size:
        got = len(vertices) if isinstance(vertices, list) else type(vertices).__name__
        raise FileError(f"$.vertices: must be a list of size = {size} objects; got {got}")
    weights, labels = _vertices(vertices, n)
    edges = _edges(_field(doc, "edges", "$"))
    return build(
        n, size, edges, weights, labels, None, check_weights, where=lambda k: f"$.edges[{k}]"
    )


def _vertices(
    vertices: list[Any], n: int
) -> tuple[list[list[int]] | None, tuple[Hashable, ...] | None]:
    """Weights (None if no vertex has one) and labels (None if no vertex has one)."""
    weights: list[list[int]] = []
    labels: list[Hashable] = []
    for k, v in enumerate(vertices):
        path = f"$.vertices[{k}]"
        if not isinstance(v, dict):
            raise FileError(f"{path}: must be a JSON object; got {type(v).__name__}")
        if _int(_field(v, "index", path), f"{path}.index") != k:
            raise FileError(
                f"{path}.index: must be {k} (vertices in index order); got {v['index']}"
            )
        if "weight" in v:
            weights.append(_weight(v["weight"], n, f"{path}.weight"))
        key = "label" if "label" in v else "tableau" if "tableau" in v else None
        if key is not None:
            labels.append(label_from_json(v[key], f"{path}.{key}"))
        for have, what in ((weights, "weight"), (labels, "label or tableau")):
            if len(have) not in (0, k + 1):
                raise FileError(f"{path}: has no {what}, unlike the vertices before it")
    if vertices and 0 < len(labels) < len(vertices):
        raise FileError(f"$.vertices[{len(labels)}]: has no label or tableau, unlike vertex 0")
    if vertices and 0 < len(weights) < len(vertices):
        raise FileError(f"$.vertices[{len(weights)}]: has no weight, unlike vertex 0")
    return (weights or None), (tuple(labels) if labels else None)


def _weight(w: Any, n: int, path: str) -> list[int]:
    if not isinstance(w, list) or len(w) != n:
        raise FileError(f"{path}: must be a list of n = {n} integers; got {w!r}")
    for j, a in enumerate(w):
        if isinstance(a, bool) or not isinstance(a, int):
            raise FileError(f"{path}[{j}]: must be an integer; got {a!r}")
    return w


def _edges(edges: Any) -> npt.NDArray[np.int64]:
    if not isinstance(edges, list):
        raise FileError(
            f"$.edges: must be a list of [source, i, target]; got {type(edges).__name__}"
        )
    try:
        arr = np.array(edges, dtype=np.int64) if edges else np.zeros((0, 3), dtype=np.int64)
        exact = arr.shape == (len(edges), 3)
    except (ValueError, TypeError, OverflowError):
        exact = False
    if exact:
        # np.array also takes floats and bools; the file must hold plain integers
        exact = all(type(a) is int for row in edges for a in row)
    if not exact:
        for k, row in enumerate(edges):
            if not isinstance(row, list) or len(row) != 3:
                raise FileError(f"$.edges[{k}]: must be [source, i, target]; got {row!r}")
            for j, a in enumerate(row):
                _int(a, f"$.edges[{k}][{j}]", -(2**62))
                if abs(a) > 2**62:
                    raise FileError(f"$.edges[{k}][{j}]: {a} is too large")
        raise FileError("$.edges: malformed")  # pragma: no cover - the scan above finds it
    return arr


def tableau_rows(crystal: TableauCrystal, start: int, stop: int) -> list[list[list[int]]]:
    cells = crystal.tableaux()[start:stop]
    bounds = np.cumsum((0, *crystal.shape)).tolist()
    by_row = [cells[:, a:b].tolist() for a, b in itertools.pairwise(bounds)]
    if not by_row:
        return [[] for _ in range(len(cells))]
    return [list(rows) for rows in zip(*by_row, strict=True)]
