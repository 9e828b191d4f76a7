"""Command-line commands for Schubert polynomials, pipe dreams and Schubert-to-key expansions."""

from __future__ import annotations

import json
from typing import IO

import click

import druse
from druse._cli_common import (
    _echo_json,
    _echo_poly,
    _echo_terms,
    _format_parts,
    _library_errors,
    _parts,
    _progress_bar,
)

#: Pipe dreams drawn by ``druse pipes`` unless --limit says otherwise.
DEFAULT_DRAWINGS = 3


def _perm(ctx: click.Context, param: click.Parameter, value: str) -> tuple[int, ...]:
    """A permutation written 2,1,4,3 or, when every letter is one digit, 2143."""
    text = value.strip().strip("()[]").strip()
    if text.isdigit() and len(text) > 1 and "," not in text:
        return tuple(int(ch) for ch in text)
    return _parts(ctx, param, value)


@click.command()
@click.argument("perm", callback=_perm)
@click.option("--json", "as_json", is_flag=True, help="Print the polynomial as contract JSON.")
def schubert(perm: tuple[int, ...], as_json: bool) -> None:
    """Print the Schubert polynomial of PERM (one-line notation: 1,4,3,2 or 1432)."""
    with _library_errors():
        poly = druse.schubert(perm)
    _echo_poly(poly, as_json)


def _window(perm: tuple[int, ...], start: int, count: int) -> list[tuple[tuple[int, int], ...]]:
    """Pipe dreams start..start+count-1 of PERM, streamed from `start` on."""
    if count == 0:
        return []
    block = next(druse.iter_pipe_dreams(perm, chunk=count, start=start), None)
    return [] if block is None else [druse.pipe_dream_of_mask(row, len(perm)) for row in block]


@click.command("pipe-dreams")
@click.argument("perm", callback=_perm)
@click.option("--count", "only_count", is_flag=True, help="Print only the number of pipe dreams.")
@click.option(
    "--limit",
    "-k",
    type=click.IntRange(min=0),
    default=DEFAULT_DRAWINGS,
    show_default=True,
    help="Show at most this many pipe dreams (0: all of them).",
)
@click.option("--start", type=click.IntRange(min=0), default=0, help="Index of the first shown.")
@click.option(
    "--style", type=click.Choice(("ascii", "unicode")), default="ascii", show_default=True
)
@click.option(
    "--json", "as_json", is_flag=True, help="Print crosses, weight, word and rows as JSON."
)
def pipe_dreams(
    perm: tuple[int, ...], only_count: bool, limit: int, start: int, style: str, as_json: bool
) -> None:
    """Draw the reduced pipe dreams of PERM (1,4,3,2 or 1432), in ascending order of their masks.

    A cross at (row, col) stands for s_(row+col-1); reading the rows top to bottom, each right
    to left, gives a reduced word of PERM; row r holds the exponent of x_r.
    """
    with _library_errors():
        total = druse.count_pipe_dreams(perm)
        if only_count:
            click.echo(total)
            return
        wanted = max(0, total - start) if limit == 0 else max(0, min(limit, total - start))
        shown = _window(perm, start, wanted)
        seqs = [druse.compatible_sequence(crosses, len(perm)) for crosses in shown]
    if as_json:
        _echo_json(
            {
                "perm": list(perm),
                "count": total,
                "start": start,
                "pipe_dreams": [
                    {
                        "crosses": [list(c) for c in crosses],
                        "weight": _weight(crosses, len(perm)),
                        "word": list(word),
                        "rows": list(rows),
                    }
                    for crosses, (word, rows) in zip(shown, seqs, strict=True)
                ],
            }
        )
        return
    click.echo(f"w = {_format_parts(perm)}: {total} pipe dreams")
    for k, (crosses, (word, _rows)) in enumerate(zip(shown, seqs, strict=True), start=start):
        click.echo("")
        weight = _format_parts(_weight(crosses, len(perm)))
        click.echo(f"pipe dream {k}: weight {weight}, reduced word {_format_parts(word)}")
        click.echo(druse.draw_pipe_dream(crosses, len(perm), style))
    rest = total - start - len(shown)
    if rest > 0:
        click.echo(f"\n... {rest} more; --limit 0 shows all of them, --start skips ahead")


def _weight(crosses: tuple[tuple[int, int], ...], n: int) -> list[int]:
    out = [0] * n
    for row, _col in crosses:
        out[row - 1] += 1
    return out


_METHODS = ("crystal", "factorizations", "polynomial")


@click.command("schubert-keys")
@click.argument("perm", callback=_perm)
@click.option(
    "--method",
    type=click.Choice(_METHODS),
    default="crystal",
    show_default=True,
    help="Demazure pieces of the pipe-dream crystal (Rust), of the whole factorization crystal, "
    "or peeling the Schubert polynomial.",
)
@click.option("--json", "as_json", is_flag=True, help='Print {"nvars", "terms"} as JSON.')
def schubert_keys(perm: tuple[int, ...], method: str, as_json: bool) -> None:
    """Print the expansion of the Schubert polynomial of PERM into key polynomials."""
    with _library_errors():
        terms = druse.schubert_key_expansion(perm, method=method)
    if as_json:
        _echo_json({"nvars": len(perm), "terms": [[list(a), c] for a, c in terms.items()]})
        return
    _echo_terms(terms, "key")


@click.command()
@click.argument("perm", callback=_perm)
@click.option("--json", "as_json", is_flag=True, help='Print {"perm", "terms"} as JSON.')
def stanley(perm: tuple[int, ...], as_json: bool) -> None:
    """Print the Schur expansion of the Stanley symmetric function F_PERM (Edelman-Greene)."""
    with _library_errors():
        terms = druse.stanley_schur_expansion(perm)
    if as_json:
        _echo_json({"perm": list(perm), "terms": [[list(s), c] for s, c in terms.items()]})
        return
    _echo_terms(terms, "s")


@click.command("schubert-all")
@click.argument("n", type=click.IntRange(min=1))
@click.option("--keys", is_flag=True, help="Also expand each polynomial into key polynomials.")
@click.option(
    "--output",
    "-o",
    type=click.File("w", encoding="utf-8"),
    default="-",
    help="Write one JSON object per permutation (JSON lines) to this file ('-': stdout).",
)
@click.option("--quiet", "-q", is_flag=True, help="No progress bar.")
def schubert_all(n: int, keys: bool, output: IO[str], quiet: bool) -> None:
    """Compute the Schubert polynomial of every permutation of 1..N, sharing the work.

    Writes JSON lines {"permutation": [...], "schubert": {"nvars", "terms"}} (and "keys" with
    --keys), permutations in lexicographic order; the progress bar goes to stderr.
    """
    with _library_errors():
        with _progress_bar(f"S_{n}: Schubert polynomials", quiet) as update:
            polys = druse.all_schuberts(n, progress=update)
        expansions = None
        if keys:
            with _progress_bar(f"S_{n}: key expansions", quiet) as update:
                expansions = druse.key_expansions(list(polys.values()), progress=update)
    for k, (perm, poly) in enumerate(polys.items()):
        doc: dict[str, object] = {"permutation": list(perm), "schubert": poly.to_json()}
        if expansions is not None:
            doc["keys"] = [[list(a), c] for a, c in expansions[k].items()]
        output.write(json.dumps(doc, separators=(",", ":")) + "\n")
