"""Helpers shared by the command line's modules: argument parsing, error reporting, formats."""

from __future__ import annotations

import json
import re
import sys
from collections.abc import Callable, Iterator, Sequence
from contextlib import contextmanager

import click

import druse

#: The summary builds the crystal in full (every f_i, e_i, phi_i, epsilon_i: 24 bytes per vertex
#: and i) up to this many (vertex, i) pairs, about 500 MB; beyond it, it reports what the count
#: and the first streamed tableau give.
SUMMARY_PAIRS = 20_000_000

#: Tableaux printed by ``druse tableaux`` unless --limit says otherwise.
DEFAULT_LIMIT = 20


#: N for the commands that build or stream a crystal: GL_N needs N >= 1.
LETTERS = click.IntRange(min=1)
_INTEGER = re.compile(r"-?[0-9]+")


def _parts(ctx: click.Context, param: click.Parameter, value: str) -> tuple[int, ...]:
    """Parse ``4,2,1`` into (4, 2, 1); ``()``, ``""`` and ``0`` are the empty tuple.

    Surrounding parentheses or brackets and spaces are allowed. Whether the tuple is a
    partition is left to the library, whose message names the rule.
    """
    text = value.strip().strip("()[]").strip()
    if text in ("", "0"):
        return ()
    parts = []
    for piece in text.split(","):
        piece = piece.strip()
        if not _INTEGER.fullmatch(piece):
            raise click.BadParameter(
                f"{value!r} is not a list of integers like 4,2,1 (bad part {piece!r})"
            )
        parts.append(int(piece))
    return tuple(parts)


@contextmanager
def _library_errors() -> Iterator[None]:
    """Turn the library's refusals into one-line ``Error:`` messages instead of tracebacks."""
    try:
        yield
    except (ValueError, TypeError) as err:  # TooLargeError is a ValueError
        raise click.ClickException(str(err)) from err
    except druse.InternalError as err:
        raise click.ClickException(f"{err} (please report the command that caused it)") from err


def _format_parts(parts: Sequence[int]) -> str:
    return "(" + ",".join(map(str, parts)) + ")"


def _format_tableau(rows: Sequence[Sequence[int]]) -> str:
    """One tableau on one line, rows top to bottom separated by ``/``; the empty one is ``()``."""
    if not rows:
        return "()"
    return " / ".join(" ".join(map(str, row)) for row in rows)


def _rows_of(cells: Sequence[int], shape: Sequence[int]) -> list[list[int]]:
    rows, start = [], 0
    for length in shape:
        rows.append(list(cells[start : start + length]))
        start += length
    return rows


def _echo_json(doc: object) -> None:
    """One compact JSON document on standard output."""
    click.echo(json.dumps(doc, separators=(",", ":")))


def _echo_poly(poly: druse.Poly, as_json: bool) -> None:
    """A polynomial as contract JSON, or readably."""
    if as_json:
        _echo_json(poly.to_json())
    else:
        click.echo(str(poly))


def _echo_terms(
    terms: dict[tuple[int, ...], int], name: str, empty: str | None = "0 (no terms)"
) -> None:
    """One line ``c * name(index)`` per term, coefficients right-aligned; `empty` if none."""
    width = max((len(str(c)) for c in terms.values()), default=1)
    for index, c in terms.items():
        click.echo(f"{c:>{width}} * {name}{_format_parts(index)}")
    if not terms and empty is not None:
        click.echo(empty)


@contextmanager
def _progress_bar(label: str, quiet: bool = False) -> Iterator[Callable[[int, int], None] | None]:
    """A click progress bar on stderr, driven by the library's progress(done, total) calls;
    None (no progress reports) when `quiet`."""
    if quiet:
        yield None
        return
    with click.progressbar(length=1, label=label, file=sys.stderr) as bar:
        seen = [0]

        def update(done: int, total: int) -> None:
            bar.length = max(total, 1)  # the total is first known from the library's own call
            bar.update(done - seen[0])
            seen[0] = done

        yield update
