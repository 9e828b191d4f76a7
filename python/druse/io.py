"""Saving and loading crystals: JSON in a schema of druse's own, and GraphML (an open standard).

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

Labels (a compatible extension of version 1): each vertex of a :class:`druse.LabelledCrystal`
also carries ``"label"``, its label as a JSON value: strings, integers, finite floats, true,
false and null as themselves, tuples as arrays (read back as tuples, so labels stay hashable).
Readers of the first form of version 1 ignore the extra key.

Reading (:func:`load_crystal`) accepts edges in any order, and a file where no vertex has
``"weight"`` (the weights are then derived as in :mod:`druse.user_crystal`). A vertex's label is
its ``"label"``, else its ``"tableau"`` (as a tuple of row tuples); a file with neither gives a
plain :class:`druse.Crystal`. Malformed files raise ValueError naming the file and the JSON path
(``$.vertices[3].weight``) or the line and column of a syntax error.

GraphML (http://graphml.graphdrawing.org/): one directed ``<graph>``; graph data ``n``,
``format``, ``version`` (and ``shape`` as JSON text for tableau crystals); each ``<node>`` in
vertex order with data ``weight`` (the entries separated by spaces) and ``label`` or ``tableau``
(JSON text, as above); each ``<edge source= target=>`` with data ``i`` (an int). The reader
matches keys by their ``attr.name``, so files from other programs with their own key ids work;
node ids may be any strings (document order is vertex order), edges may come anywhere in the
graph, and without data ``n`` or weights, n is the largest i plus 1 (weights then derived).
See :mod:`druse._graphml`.
"""

from __future__ import annotations

import contextlib
import io
import json
import os
import tempfile
from typing import IO, Any

import numpy as np

from druse import _graphml
from druse._check import check_positive_int
from druse._crystal_json import crystal_from_json, json_label
from druse._crystal_json import tableau_rows as _tableau_rows
from druse.crystal import Crystal, TableauCrystal
from druse.errors import TooLargeError
from druse.user_crystal import LabelledCrystal

__all__ = [
    "CRYSTAL_FORMAT",
    "CRYSTAL_FORMAT_VERSION",
    "EXPORT_LIMIT",
    "check_export_size",
    "crystal_from_json",
    "crystal_to_json",
    "load_crystal",
    "save_crystal",
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
    if isinstance(crystal, LabelledCrystal):
        labels = crystal.labels()[start:stop]
        return [
            {"index": v, "label": json_label(x, f"the label of vertex {v}"), "weight": weight}
            for v, x, weight in zip(range(start, stop), labels, weights, strict=True)
        ]
    return [{"index": v, "weight": w} for v, w in zip(range(start, stop), weights, strict=True)]


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


#: File formats :func:`save_crystal` and :func:`load_crystal` know, by suffix.
CRYSTAL_FILE_FORMATS = {".json": "json", ".graphml": "graphml"}

PathOrFile = str | os.PathLike[str] | IO[str]


def save_crystal(crystal: Crystal, path_or_file: PathOrFile, format: str | None = None) -> None:
    """Save a crystal as JSON or GraphML (schemas in the module docstring).

    A path is written through a temporary file in the same folder, renamed into place only when
    complete, so a failure never leaves a half-written file; an open file receives the whole
    text in one write, after it has been produced.

    Parameters
    ----------
    crystal : druse.Crystal
        Any crystal; a LabelledCrystal's labels must be str, int, float, bool, None or tuples.
    path_or_file : str, os.PathLike or text file
        Where to write.
    format : {"json", "graphml"}, optional
        Default: from the suffix (``.json`` or ``.graphml``).

    Raises
    ------
    TypeError
        If ``crystal`` is not a crystal or a label has no JSON form.
    ValueError
        For an unknown format; druse.TooLargeError past ``EXPORT_LIMIT`` vertices.
    OSError
        If the path cannot be written.

    Examples
    --------
    >>> import io, druse
    >>> from druse.io import load_crystal, save_crystal
    >>> buffer = io.StringIO()
    >>> save_crystal(druse.crystal((2, 1), 3), buffer, format="graphml")
    >>> _ = buffer.seek(0)
    >>> C = load_crystal(buffer, format="graphml")
    >>> len(C), C.label(0)
    (8, ((1, 1), (2,)))
    """
    fmt = _file_format(path_or_file, format)
    header = _header(crystal)  # refuses a non-crystal or one too large before any file is made

    def emit(out: IO[str]) -> None:
        if fmt == "json":
            _stream_crystal(crystal, header, out, 1 << 15)
        else:
            _graphml.write_graphml(crystal, out)

    if not isinstance(path_or_file, (str, os.PathLike)):
        buffer = io.StringIO()
        emit(buffer)
        path_or_file.write(buffer.getvalue())
        return
    folder = os.path.dirname(os.path.abspath(path_or_file))
    handle = tempfile.NamedTemporaryFile(  # noqa: SIM115 - closed below, then renamed
        "w", encoding="utf-8", dir=folder, prefix=".druse-", suffix=".part", delete=False
    )
    try:
        with handle:
            emit(handle)
        os.replace(handle.name, path_or_file)
    except BaseException:
        with contextlib.suppress(OSError):
            os.unlink(handle.name)
        raise


def load_crystal(
    path_or_file: PathOrFile | IO[bytes], format: str | None = None, *, check_weights: bool = True
) -> Crystal:
    """Load a crystal saved by :func:`save_crystal` (or written by hand to the same schema).

    Parameters
    ----------
    path_or_file : str, os.PathLike or file
        A path, or a file open for reading (text or binary).
    format : {"json", "graphml"}, optional
        Default: from the suffix (``.json`` or ``.graphml``).
    check_weights : bool
        Check wt(f_i x) = wt(x) - alpha_i on every edge (default True); pass False to load a
        crystal whose weights an axiom check is to judge.

    Returns
    -------
    Crystal or LabelledCrystal
        Same vertices in the same order, edges, weights and labels as the crystal saved; a
        tableau crystal comes back as a LabelledCrystal labelled by its tableaux.

    Raises
    ------
    ValueError
        For a malformed file: the message names the file and the line (or the JSON path, or the
        GraphML element and its line); for edges that are not partial bijections, colours out of
        range, inconsistent weights, with the witness.
    OSError
        If the path cannot be read.
    """
    fmt = _file_format(path_or_file, format)
    name = _source_name(path_or_file)
    if isinstance(path_or_file, (str, os.PathLike)):
        with open(path_or_file, "rb") as handle:
            return _load(handle, fmt, name, check_weights)
    return _load(path_or_file, fmt, name, check_weights)


def _load(handle: IO[Any], fmt: str, name: str, check_weights: bool) -> Crystal:
    if fmt == "graphml":
        return _graphml.read_graphml(handle, name, check_weights)
    text = handle.read()
    try:
        doc = json.loads(text)
    except json.JSONDecodeError as exc:
        raise ValueError(
            f"{name}: line {exc.lineno}, column {exc.colno}: not valid JSON ({exc.msg})"
        ) from None
    except UnicodeDecodeError as exc:
        raise ValueError(f"{name}: not UTF-8 text ({exc.reason} at byte {exc.start})") from None
    return crystal_from_json(doc, name, check_weights)


def _file_format(path_or_file: Any, format: str | None) -> str:
    if format is not None:
        if format not in CRYSTAL_FILE_FORMATS.values():
            raise ValueError(f"format must be 'json' or 'graphml'; got {format!r}")
        return format
    name = path_or_file if isinstance(path_or_file, (str, os.PathLike)) else None
    if name is None:
        name = getattr(path_or_file, "name", None)
        if not isinstance(name, str):
            raise ValueError("format must be given ('json' or 'graphml') for a file object")
    suffix = os.path.splitext(os.fspath(name))[1].lower()
    if suffix not in CRYSTAL_FILE_FORMATS:
        raise ValueError(
            f"cannot tell the format from the suffix {suffix!r} of {os.fspath(name)!r}: use "
            ".json or .graphml, or pass format='json' or format='graphml'"
        )
    return CRYSTAL_FILE_FORMATS[suffix]


def _source_name(path_or_file: Any) -> str:
    if isinstance(path_or_file, (str, os.PathLike)):
        return os.fspath(path_or_file)
    name = getattr(path_or_file, "name", None)
    return name if isinstance(name, str) else "<file>"
