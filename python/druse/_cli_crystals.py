"""Command-line commands for Littlewood-Richardson multiplicities, tensor products and crystals
given as files (JSON or GraphML)."""

from __future__ import annotations

import json
from collections.abc import Sequence

import click

import druse
from druse._cli_common import LETTERS, _format_parts, _library_errors, _parts, _progress_bar


def _echo_json(doc: object) -> None:
    click.echo(json.dumps(doc, separators=(",", ":")))


def _trimmed(weight: Sequence[int]) -> tuple[int, ...]:
    parts = list(weight)
    while parts and parts[-1] == 0:
        parts.pop()
    return tuple(parts)


def _echo_multiplicities(terms: dict[tuple[int, ...], int], name: str) -> None:
    width = max((len(str(c)) for c in terms.values()), default=1)
    for shape, c in terms.items():
        click.echo(f"{c:>{width}} * {name}{_format_parts(shape)}")
    if not terms:
        click.echo("0 (no terms)")


@click.command()
@click.argument("mu", callback=_parts)
@click.argument("nu", callback=_parts)
@click.option(
    "--method",
    type=click.Choice(("count", "crystal")),
    default="count",
    show_default=True,
    help="Count lattice tableaux in Rust, or read the highest weights of B(MU) x B(NU).",
)
@click.option("--json", "as_json", is_flag=True, help='Print {"mu", "nu", "terms"} as JSON.')
def lr(mu: tuple[int, ...], nu: tuple[int, ...], method: str, as_json: bool) -> None:
    """Print the Littlewood-Richardson multiplicities: s_MU s_NU = sum c^lambda_{MU,NU} s_lambda."""
    with _library_errors():
        terms = druse.lr(mu, nu) if method == "count" else druse.lr_by_crystal(mu, nu)
    if as_json:
        _echo_json(
            {"mu": list(mu), "nu": list(nu), "terms": [[list(s), c] for s, c in terms.items()]}
        )
        return
    _echo_multiplicities(terms, "s")


@click.command("lr-table")
@click.argument("size", type=click.IntRange(min=0))
@click.option("--json", "as_json", is_flag=True, help="Print the whole table as JSON.")
@click.option("--quiet", "-q", is_flag=True, help="No progress bar.")
def lr_table(size: int, as_json: bool, quiet: bool) -> None:
    """Compute c^lambda_{mu,nu} for every pair of partitions mu, nu of SIZE.

    Without --json, prints one line per pair: mu, nu and the number of lambda with c > 0 and
    the sum of the c. With --json: {"size", "partitions", "products", "coefficients"}, the
    coefficients nested as [mu][nu][lambda] in the order of the two partition lists.
    """
    with _library_errors():
        if quiet:
            table = druse.lr_table(size)
        else:
            with _progress_bar(f"pairs of partitions of {size}") as update:
                table = druse.lr_table(size, progress=update)
    if as_json:
        _echo_json(
            {
                "size": size,
                "partitions": [list(p) for p in table.partitions],
                "products": [list(p) for p in table.products],
                "coefficients": table.coefficients.tolist(),
            }
        )
        return
    for a, mu in enumerate(table.partitions):
        for b, nu in enumerate(table.partitions):
            row = table.coefficients[a, b]
            click.echo(
                f"{_format_parts(mu)} x {_format_parts(nu)}: "
                f"{int((row > 0).sum())} shapes, sum {int(row.sum())}"
            )


@click.command()
@click.argument(
    "shapes", nargs=-1, required=True, callback=lambda c, p, v: [_parts(c, p, s) for s in v]
)
@click.option("--n", "-n", "n", type=LETTERS, required=True, help="The crystals are of GL_N.")
@click.option(
    "--json", "as_json", is_flag=True, help='Print {"n", "factors", "vertices", "decomposition"}.'
)
def tensor(shapes: list[tuple[int, ...]], n: int, as_json: bool) -> None:
    """Decompose the tensor product B(SHAPE1) x B(SHAPE2) x ... of GL_N into irreducibles.

    Factors are folded left to right, with the signature rule f_i(x (x) y) = f_i(x) (x) y if
    phi_i(y) <= epsilon_i(x), else x (x) f_i(y) (the convention that matches reading words).
    """
    with _library_errors():
        product = druse.tensor_product(*(druse.crystal(s, n) for s in shapes))
        parts = {_trimmed(w): c for w, c in product.decomposition().items()}
    if as_json:
        _echo_json(
            {
                "n": n,
                "factors": [list(s) for s in shapes],
                "vertices": len(product),
                "decomposition": [[list(s), c] for s, c in parts.items()],
            }
        )
        return
    names = " x ".join(f"B{_format_parts(s)}" for s in shapes)
    click.echo(f"{names} of GL_{n}: {len(product)} vertices, {sum(parts.values())} components")
    _echo_multiplicities(parts, "B")
