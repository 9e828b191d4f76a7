"""Command-line commands for Demazure crystals, key polynomials and expansions."""

from __future__ import annotations

import json
from collections.abc import Sequence
from typing import IO

import click
import numpy as np
import numpy.typing as npt

import druse
from druse._cli_common import (
    LETTERS,
    SUMMARY_PAIRS,
    _echo_json,
    _echo_poly,
    _echo_terms,
    _format_parts,
    _library_errors,
    _parts,
)
from druse.io import check_export_size

#: Readable name of each expansion basis, and the function that computes the expansion.
_BASES = {
    "key": druse.key_expansion,
    "atom": druse.atom_expansion,
    "schur": druse.schur_expansion,
}


def _sequence(ctx: click.Context, param: click.Parameter, value: str) -> tuple[int, ...]:
    """Like `_parts`, except that ``0`` is the one-part tuple (0,): a composition or a word."""
    return (0,) if value.strip() == "0" else _parts(ctx, param, value)


@click.command()
@click.argument("alpha", callback=_sequence)
@click.option("--json", "as_json", is_flag=True, help="Print the polynomial as contract JSON.")
def key(alpha: tuple[int, ...], as_json: bool) -> None:
    """Print the key polynomial (Demazure character) of the composition ALPHA, written 0,2,1."""
    with _library_errors():
        _echo_poly(druse.key(alpha), as_json)


@click.command()
@click.argument("alpha", callback=_sequence)
@click.option("--json", "as_json", is_flag=True, help="Print the polynomial as contract JSON.")
def atom(alpha: tuple[int, ...], as_json: bool) -> None:
    """Print the Demazure atom of the composition ALPHA, written 0,2,1."""
    with _library_errors():
        _echo_poly(druse.atom(alpha), as_json)


def _read_poly(text: str, nvars: int | None, source: str) -> druse.Poly:
    """The polynomial in `text`: contract JSON if it starts with '{', else polynomial text."""
    if not text.lstrip().startswith("{"):
        if nvars is None:
            raise click.UsageError("--nvars is required for polynomial text")
        with _library_errors():
            return druse.Poly(text, nvars=nvars)
    try:
        doc = json.loads(text)
    except json.JSONDecodeError as err:
        raise click.ClickException(f"{source} is not valid JSON: {err}") from err
    with _library_errors():
        poly = druse.Poly.from_json(doc)
    if nvars is not None and poly.nvars != nvars:
        raise click.ClickException(f"{source} has nvars={poly.nvars} but --nvars {nvars} was given")
    return poly


@click.command()
@click.argument("poly", required=False)
@click.option(
    "--file",
    "-f",
    "source",
    type=click.File("r", encoding="utf-8"),
    help="Read the polynomial (text or contract JSON) from this file ('-': stdin).",
)
@click.option(
    "--nvars",
    "-n",
    type=click.IntRange(min=0),
    help="Number of variables x1..xN (required for text; checked against JSON).",
)
@click.option(
    "--basis",
    type=click.Choice(sorted(_BASES)),
    default="key",
    show_default=True,
    help="Expand in key polynomials, Demazure atoms or Schur polynomials.",
)
@click.option(
    "--json",
    "as_json",
    is_flag=True,
    help='Print {"basis", "nvars", "terms", "positive", "witness"} as JSON.',
)
def expand(
    poly: str | None, source: IO[str] | None, nvars: int | None, basis: str, as_json: bool
) -> None:
    """Expand a polynomial in a basis exactly and say whether every coefficient is >= 0.

    POLY is written like 'x1^2*x3 + 3*x2*x4' (integer coefficients; '^' or '**' for powers);
    --file reads it, or the JSON {"nvars": N, "terms": [[exps, c], ...]}, from a file instead.
    The Schur basis needs a symmetric polynomial.
    """
    if (poly is None) == (source is None):
        raise click.UsageError("give the polynomial either as POLY or with --file, not both")
    if source is not None:
        p = _read_poly(source.read(), nvars, f"--file {source.name}")
    else:
        p = _read_poly(str(poly), nvars, "POLY")
    with _library_errors():
        terms = _BASES[basis](p)
    report = druse.positivity(terms)
    if as_json:
        doc = {
            "basis": basis,
            "nvars": p.nvars,
            "terms": [[list(index), c] for index, c in terms.items()],
            "positive": report.positive,
            "witness": None if report.witness is None else list(report.witness),
        }
        _echo_json(doc)
        return
    _echo_terms(terms, basis, empty="0 (the zero polynomial)")
    if report.witness is None:
        click.echo(f"positive: every {basis} coefficient is >= 0")
    else:
        where = f"{basis}{_format_parts(report.witness)}"
        click.echo(f"not positive: the coefficient of {where} is {report.coefficient}")


def _optional_sequence(
    ctx: click.Context, param: click.Parameter, value: str | None
) -> tuple[int, ...] | None:
    return None if value is None else _sequence(ctx, param, value)


@click.command()
@click.argument("shape", callback=_parts)
@click.argument("n", type=LETTERS)
@click.argument("word", required=False, callback=_optional_sequence)
@click.option(
    "--perm",
    callback=_optional_sequence,
    help="A permutation in one-line notation, e.g. 3,4,1,2,5, instead of WORD.",
)
@click.option("--json", "as_json", is_flag=True, help="Print the vertices and character as JSON.")
def demazure(
    shape: tuple[int, ...],
    n: int,
    word: tuple[int, ...] | None,
    perm: tuple[int, ...] | None,
    as_json: bool,
) -> None:
    """Print the Demazure crystal of WORD (written 2,3,1,2; () is empty) inside B(SHAPE).

    WORD (i1, ..., ik) means w = s_i1 ... s_ik, D_ik applied first; a word that is not reduced
    gives the Demazure crystal of its Demazure product. The character is key(w.SHAPE)
    (Demazure 1974; Kashiwara 1993).
    """
    if (word is None) == (perm is None):
        raise click.UsageError(
            "give the Weyl group element either as WORD or with --perm"
            + ("" if word is None else ", not both")
        )
    with _library_errors():
        size = druse.count_tableaux(shape, n)
        if as_json:
            check_export_size(size)  # refuse before building anything, as `crystal --json` does
        elif size * max(n - 1, 1) > SUMMARY_PAIRS:
            raise druse.TooLargeError(
                f"the crystal has {size:,} vertices, more than the {SUMMARY_PAIRS:,} (vertex, i) "
                "pairs this command builds"
            )
        c = druse.crystal(shape, n)
        mask, word, perm = _demazure_of(c, word, perm)
        character = c.character(mask)
        alpha = _moved_shape(c.shape, perm)
        if alpha is not None and character != druse.key(alpha):
            raise druse.InternalError(f"the character of the Demazure crystal is not key{alpha}")
    vertices = np.flatnonzero(mask).tolist()
    if as_json:
        doc = {
            "shape": list(c.shape),
            "n": n,
            "word": list(word),
            "permutation": list(perm),
            "size": len(vertices),
            "vertices": vertices,
            "character": character.to_json(),
        }
        _echo_json(doc)
        return
    named = "0 (the crystal is empty)" if alpha is None else f"key{_format_parts(alpha)}"
    click.echo(f"Demazure crystal in B{_format_parts(c.shape)} of GL_{n}")
    for label, value in [
        ("word", _format_parts(word)),
        ("permutation", _format_parts(perm)),
        ("vertices", f"{len(vertices)} of {len(c)}"),
        ("character", named if alpha is None else f"{named} = {character}"),
    ]:
        click.echo(f"  {label:<19} {value}")


def _demazure_of(
    c: druse.TableauCrystal, word: tuple[int, ...] | None, perm: tuple[int, ...] | None
) -> tuple[npt.NDArray[np.bool_], tuple[int, ...], tuple[int, ...]]:
    """The mask of WORD or of --perm, with the word and the permutation it stands for."""
    if perm is not None:
        return druse.demazure_mask_of(c, perm), druse.reduced_word(perm), perm
    if word is not None:
        return c.demazure(word), word, druse.demazure_product(word, c.n)
    raise click.UsageError("give the Weyl group element either as WORD or with --perm")


def _moved_shape(shape: Sequence[int], perm: Sequence[int]) -> tuple[int, ...] | None:
    """w.lambda, with (w.lambda)_{w(j)} = lambda_j; None if lambda has more parts than w letters."""
    if len(shape) > len(perm):
        return None
    lam = [*shape, *[0] * (len(perm) - len(shape))]
    alpha = [0] * len(perm)
    for j, image in enumerate(perm):
        alpha[image - 1] = lam[j]
    return tuple(alpha)
