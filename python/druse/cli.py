"""The ``druse`` command line: counts, Kostka numbers, Schur and key polynomials, crystals,
tableaux, Demazure crystals and expansions in the key, atom and Schur bases.

Every command calls the public API only. Shapes and weights are written ``4,2,1``; the empty
partition is ``()``, ``""`` or ``0``. Bad input ends with a one-line ``Error: ...`` and a non-zero
exit status (2 for malformed arguments, 1 for values the library refuses).
"""

from __future__ import annotations

import sys

import click
import numpy as np

import druse
from druse._cli_common import (
    DEFAULT_LIMIT,
    LETTERS,
    SUMMARY_PAIRS,
    _echo_poly,
    _format_parts,
    _format_tableau,
    _library_errors,
    _parts,
    _rows_of,
)
from druse._cli_crystals import check, convert, decompose, lr, lr_table, recognise, tensor
from druse._cli_keys import atom, demazure, expand, key
from druse._cli_schubert import pipe_dreams, schubert, schubert_all, schubert_keys, stanley
from druse.io import check_export_size, write_crystal_json


@click.group(context_settings={"help_option_names": ["-h", "--help"]})
@click.version_option(druse.__version__, "-V", "--version", prog_name="druse")
def main() -> None:
    """Crystals of type A on semistandard Young tableaux, Schur polynomials and Kostka numbers.

    SHAPE and WEIGHT are written 4,2,1; the empty partition is () or 0. N is the number of
    letters 1..N (the crystal of GL_N). All numbers are exact.
    """


@main.command()
@click.argument("shape", callback=_parts)
@click.argument("n", type=int)
def count(shape: tuple[int, ...], n: int) -> None:
    """Print the number of semistandard tableaux of SHAPE with entries 1..N."""
    with _library_errors():
        click.echo(druse.count_tableaux(shape, n))


@main.command()
@click.argument("shape", callback=_parts)
@click.argument("weight", callback=_parts)
def kostka(shape: tuple[int, ...], weight: tuple[int, ...]) -> None:
    """Print the Kostka number K(SHAPE, WEIGHT): tableaux of SHAPE whose content is WEIGHT."""
    with _library_errors():
        click.echo(druse.kostka(shape, weight))


@main.command()
@click.argument("shape", callback=_parts)
@click.argument("n", type=int)
@click.option(
    "--json", "as_json", is_flag=True, help='Print {"nvars": N, "terms": [[exps, c], ...]}.'
)
def schur(shape: tuple[int, ...], n: int, as_json: bool) -> None:
    """Print the Schur polynomial s_SHAPE(x1, ..., xN)."""
    with _library_errors():
        poly = druse.schur(shape, n)
    _echo_poly(poly, as_json)


@main.command()
@click.argument("shape", callback=_parts)
@click.argument("n", type=LETTERS)
@click.option("--json", "as_json", is_flag=True, help="Print vertices and edges as JSON.")
@click.option(
    "--output",
    "-o",
    type=click.Path(dir_okay=False, writable=True, allow_dash=True),
    help="Write the export to this file: GraphML if it ends in .graphml, else JSON ('-': stdout).",
)
def crystal(shape: tuple[int, ...], n: int, as_json: bool, output: str | None) -> None:
    """Summarise the crystal B(SHAPE) of GL_N, or export it as JSON (--json, --output).

    The export (format "druse.crystal", version 1) lists each vertex with its index, tableau
    rows and weight, and each edge as [source, i, target] meaning f_i(source) = target.
    """
    if as_json or output is not None:
        _export_crystal(shape, n, output)
    else:
        _summarise_crystal(shape, n)


def _export_crystal(shape: tuple[int, ...], n: int, output: str | None) -> None:
    with _library_errors():
        check_export_size(druse.count_tableaux(shape, n))  # refuse before building anything
        c = druse.crystal(shape, n)
        if output is None or output == "-":
            write_crystal_json(c, sys.stdout)
            return
        try:
            if output.lower().endswith(".graphml"):
                druse.save_crystal(c, output)  # GraphML, the open standard
            else:
                write_crystal_json(c, output)
        except OSError as err:
            raise click.ClickException(f"cannot write {output}: {err.strerror or err}") from err
        edges = sum(int(np.count_nonzero(c.f(i) >= 0)) for i in range(1, n))
    click.echo(f"wrote {len(c)} vertices and {edges} edges to {output}")


def _summarise_crystal(shape: tuple[int, ...], n: int) -> None:
    with _library_errors():  # everything is computed before anything is printed
        lines = _summary_lines(shape, n)
    click.echo(f"crystal B{_format_parts(shape)} of GL_{n}")
    for label, value in lines:
        click.echo(f"  {label:<19} {value}")


def _summary_lines(shape: tuple[int, ...], n: int) -> list[tuple[str, str]]:
    size = druse.count_tableaux(shape, n)
    lines = [("vertices", str(size))]
    if size == 0:
        return [*lines, ("", f"(empty: the shape has more than {n} rows)")]
    if size * max(n - 1, 1) > SUMMARY_PAIRS:
        first = next(druse.iter_tableaux(shape, n, chunk_size=1))[0].tolist()
        note = f"(more than {SUMMARY_PAIRS:,} (vertex, i) pairs: not built in full; "
        return [
            *lines,
            ("highest weight", f"vertex 0: {_format_tableau(_rows_of(first, shape))}"),
            ("", note + "`druse tableaux` streams the vertices)"),
        ]
    c = druse.crystal(shape, n)
    c.operator_tables()  # every f_i in one pass
    top = c.highest_weight()
    edges = sum(int(np.count_nonzero(c.f(i) >= 0)) for i in range(1, n))
    return [
        *lines,
        ("edges", str(edges)),
        ("highest weight", f"vertex {top}: {_format_tableau(c.tableau(top))}"),
        ("its weight", _format_parts(c.weights()[top].tolist())),
        ("lowest weight", f"vertex {c.lowest_weight()}"),
        ("character", f"{len(c.character())} distinct weights"),
        ("components", str(len(np.unique(c.components())))),
    ]


@main.command()
@click.argument("shape", callback=_parts)
@click.argument("n", type=LETTERS)
@click.option(
    "--limit",
    "-k",
    type=click.IntRange(min=0),
    default=DEFAULT_LIMIT,
    show_default=True,
    help="Print at most this many tableaux (0: all of them).",
)
@click.option(
    "--start", type=click.IntRange(min=0), default=0, help="Index of the first tableau printed."
)
def tableaux(shape: tuple[int, ...], n: int, limit: int, start: int) -> None:
    """Print the tableaux of SHAPE with entries 1..N in vertex order, one per line.

    Each line is the vertex index and the rows, top to bottom, separated by '/'. The
    tableaux are streamed, so any size can be listed with --limit 0.
    """
    with _library_errors():
        total = druse.count_tableaux(shape, n)
        if total == 0:
            click.echo(f"no tableaux: the shape has more than {n} rows")
            return
        if start >= total:
            raise click.BadParameter(
                f"must be below the number of tableaux, {total}; got {start}", param_hint="--start"
            )
        wanted = total - start if limit == 0 else min(limit, total - start)
        chunk = max(1, min(wanted, 1 << 14))
        printed = 0
        for block in druse.iter_tableaux(shape, n, chunk_size=chunk, start=start):
            for cells in block[: wanted - printed].tolist():
                click.echo(f"{start + printed}: {_format_tableau(_rows_of(cells, shape))}")
                printed += 1
            if printed >= wanted:
                break
    rest = total - start - printed
    if rest > 0:
        click.echo(f"... {rest} more (of {total}); --limit 0 prints all, --start skips ahead")


# Demazure crystals, key polynomials and expansions: commands of their own module.
for _command in (key, atom, expand, demazure):
    main.add_command(_command)

# Littlewood-Richardson multiplicities, tensor products, crystals from files.
for _command in (lr, lr_table, tensor, check, decompose, recognise, convert):
    main.add_command(_command)

# Schubert polynomials, pipe dreams and their key expansions.
for _command in (schubert, pipe_dreams, schubert_keys, stanley, schubert_all):
    main.add_command(_command)
