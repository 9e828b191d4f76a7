"""Export of crystals to JSON, in a schema of druse's own.

The crystal schema, version 1 (one JSON object)::

    {
      "format": "druse.crystal",       # always this string
      "version": 1,                    # bumped on any incompatible change
      "n": 6,                          # type A_{n-1}: weights have n entries, i runs over 1..n-1
      "shape": [4, 2, 2, 1],           # the partition lambda (tableau crystals only, else null)
      "size": 3240,                    # number of vertices N
      "vertices": [                    # N objects, by index 0..N-1
        {"index": 0, "tableau": [[1, 1, 1, 1], [2, 2], [3, 3], [4]], "weight": [4, 2, 2, 1, 0, 0]},
        ...
      ],
      "edges": [[0, 1, 1], ...]        # arrows source --i--> target, i.e. f_i(source) = target
    }

Vertices appear in index order, and ``vertices[k]["index"] == k``. ``"tableau"`` (the rows,
top row first, each left to right) is present only for crystals on tableaux. Edges are sorted by
i, then by source, exactly as :meth:`druse.Crystal.edges` returns them.
"""

from __future__ import annotations

import itertools
import json
import os
from typing import IO, Any

import numpy as np

from druse._check import check_positive_int
from druse.crystal import Crystal, TableauCrystal
from druse.errors import TooLargeError

__all__ = [
    "CRYSTAL_FORMAT",
    "CRYSTAL_FORMAT_VERSION",
    "EXPORT_LIMIT",
    "check_export_size",
    "crystal_to_json",
    "write_crystal_json",
    "write_json",
]

#: The ``"format"`` tag of a crystal export.
CRYSTAL_FORMAT = "druse.crystal"

#: The schema version written by :func:`crystal_to_json`.
CRYSTAL_FORMAT_VERSION = 1

#: Largest crystal exported: about 150 bytes of JSON per vertex and edge, so beyond this the file
#: runs to gigabytes and takes minutes to write or read back.
EXPORT_LIMIT = 2_000_000


def crystal_to_json(crystal: Crystal) -> dict[str, Any]:
    """The vertices and edges of a crystal as a JSON-ready dict (schema in the module docstring).

    The dict holds several Python objects per vertex (about 2 kB each); to write a large crystal
    to a file, :func:`write_crystal_json` produces the same text in bounded memory.

    Parameters
    ----------
    crystal : druse.Crystal
        Any crystal; for a :class:`druse.TableauCrystal` each vertex also carries its tableau.

    Returns
    -------
    dict
        Plain Python ints, lists and strings only, ready for :func:`json.dumps`.

    Raises
    ------
    TypeError
        If ``crystal`` is not a druse crystal.
    druse.TooLargeError
        If the crystal has more than ``EXPORT_LIMIT`` vertices; the message gives the size.

    Examples
    --------
    >>> import druse
    >>> from druse.io import crystal_to_json
    >>> doc = crystal_to_json(druse.crystal((2, 2), 3))
    >>> doc["size"], doc["vertices"][0]
    (6, {'index': 0, 'tableau': [[1, 1], [2, 2]], 'weight': [2, 2, 0]})
    """
    doc = _header(crystal)
    doc["vertices"] = _vertices(crystal, 0, len(crystal))
    doc["edges"] = crystal.edges().tolist()
    return doc


def write_crystal_json(
    crystal: Crystal, path_or_file: str | os.PathLike[str] | IO[str], chunk_size: int = 1 << 15
) -> None:
    """Write ``crystal_to_json(crystal)`` as compact JSON, chunk by chunk, in bounded memory.

    The text is the same, byte for byte, as ``write_json(crystal_to_json(crystal), ...)``.

    Parameters
    ----------
    crystal : druse.Crystal
        The crystal to export.
    path_or_file : str, os.PathLike or text file
        A path is created or overwritten; an open file is written to and left open.
    chunk_size : int
        Vertices (and edges) turned into Python objects at a time.

    Raises
    ------
    TypeError, druse.TooLargeError
        As :func:`crystal_to_json`.
    OSError
        If the path cannot be written.
    """
    header = _header(crystal)  # checks the crystal and its size before any file is created
    step = check_positive_int(chunk_size, "chunk_size")
    if isinstance(path_or_file, (str, os.PathLike)):
        with open(path_or_file, "w", encoding="utf-8") as handle:
            _stream_crystal(crystal, header, handle, step)
    else:
        _stream_crystal(crystal, header, path_or_file, step)


def _stream_crystal(crystal: Crystal, header: dict[str, Any], out: IO[str], step: int) -> None:
    out.write(_dumps(header)[:-1] + ',"vertices":[')
    size = len(crystal)
    for start in range(0, size, step):
        out.write(("," if start else "") + _dumps(_vertices(crystal, start, start + step))[1:-1])
    out.write('],"edges":[')
    first = True
    for i in range(1, crystal.n):
        fi = crystal.f(i)
        for start in range(0, size, step):
            sources = start + np.flatnonzero(fi[start : start + step] >= 0)
            if sources.size == 0:
                continue
            rows = np.column_stack([sources, np.full(sources.size, i), fi[sources]]).tolist()
            out.write(("" if first else ",") + _dumps(rows)[1:-1])
            first = False
    out.write("]}\n")


def check_export_size(size: int) -> None:
    """Raise TooLargeError if a crystal of ``size`` vertices is over ``EXPORT_LIMIT``.

    Call it with a count (such as ``druse.count_tableaux``) to refuse before building anything.
    """
    if size > EXPORT_LIMIT:
        raise TooLargeError(
            f"the crystal has {size:,} vertices, more than the {EXPORT_LIMIT:,} a JSON export "
            "allows; stream its tableaux with druse.iter_tableaux (or `druse tableaux`) instead"
        )


def _header(crystal: Crystal) -> dict[str, Any]:
    if not isinstance(crystal, Crystal):
        raise TypeError(f"crystal must be a druse.Crystal; got {type(crystal).__name__}")
    size = len(crystal)
    check_export_size(size)
    shape = list(crystal.shape) if isinstance(crystal, TableauCrystal) else None
    return {
        "format": CRYSTAL_FORMAT,
        "version": CRYSTAL_FORMAT_VERSION,
        "n": crystal.n,
        "shape": shape,
        "size": size,
    }


def _vertices(crystal: Crystal, start: int, stop: int) -> list[dict[str, Any]]:
    """The vertex objects of indices start..stop-1, built from whole columns of the arrays."""
    stop = min(stop, len(crystal))
    weights: list[list[int]] = crystal.weights()[start:stop].tolist()
    if isinstance(crystal, TableauCrystal):
        tableaux = _tableau_rows(crystal, start, stop)
        return [
            {"index": v, "tableau": rows, "weight": weight}
            for v, rows, weight in zip(range(start, stop), tableaux, weights, strict=True)
        ]
    return [{"index": v, "weight": w} for v, w in zip(range(start, stop), weights, strict=True)]


def _tableau_rows(crystal: TableauCrystal, start: int, stop: int) -> list[list[list[int]]]:
    cells = crystal.tableaux()[start:stop]
    bounds = np.cumsum((0, *crystal.shape)).tolist()
    by_row = [cells[:, a:b].tolist() for a, b in itertools.pairwise(bounds)]
    if not by_row:
        return [[] for _ in range(len(cells))]
    return [list(rows) for rows in zip(*by_row, strict=True)]


def write_json(obj: Any, path_or_file: str | os.PathLike[str] | IO[str]) -> None:
    """Write ``obj`` as compact JSON followed by a newline, to a path or an open text file.

    Parameters
    ----------
    obj : any JSON-serialisable object
        For instance the dict from :func:`crystal_to_json` or from ``Poly.to_json()``.
    path_or_file : str, os.PathLike or text file
        A path is created or overwritten; an open file is written to and left open.

    Raises
    ------
    TypeError
        If ``obj`` holds something JSON cannot represent (before any file is created).
    OSError
        If the path cannot be written.
    """
    text = _dumps(obj) + "\n"
    if isinstance(path_or_file, (str, os.PathLike)):
        with open(path_or_file, "w", encoding="utf-8") as handle:
            handle.write(text)
    else:
        path_or_file.write(text)


def _dumps(obj: Any) -> str:
    # json.dumps runs the C encoder in one shot; json.dump would use the slow pure-Python one.
    return json.dumps(obj, separators=(",", ":"))
