"""Command-line commands for Littlewood-Richardson multiplicities, tensor products and crystals
given as files (JSON or GraphML)."""

from __future__ import annotations

import json

import click
import numpy as np

import druse
from druse._cli_common import (
    LETTERS,
    _echo_json,
    _echo_terms,
    _format_parts,
    _library_errors,
    _parts,
    _progress_bar,
)


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
    _echo_terms(terms, "s")


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
    with _library_errors(), _progress_bar(f"pairs of partitions of {size}", quiet) as update:
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
        parts = product.decomposition()  # highest weights, trailing zeros dropped
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
    _echo_terms(parts, "B")


_FORMATS = click.Choice(("json", "graphml"))


def _load(path: str, fmt: str | None) -> druse.Crystal:
    """A crystal file, weights left unchecked so that the axiom check can judge them."""
    with _library_errors():
        try:
            return druse.load_crystal(path, fmt, check_weights=False)
        except OSError as err:
            raise click.ClickException(f"cannot read {path}: {err.strerror or err}") from err


@click.command()
@click.argument("path", type=click.Path(dir_okay=False))
@click.option("--format", "fmt", type=_FORMATS, help="File format (default: from the suffix).")
@click.option("--no-stembridge", is_flag=True, help="Check the basic axioms only.")
@click.option(
    "--max-witnesses",
    type=click.IntRange(min=0),
    default=20,
    show_default=True,
    help="Report at most this many violations (the counts are always complete).",
)
@click.option("--json", "as_json", is_flag=True, help="Print the report as JSON.")
def check(
    path: str, fmt: str | None, no_stembridge: bool, max_witnesses: int, as_json: bool
) -> None:
    """Check that the crystal in PATH (JSON or GraphML) satisfies the crystal axioms of type A.

    The basic axioms (partial inverses, weights, string lengths) and Stembridge's local axioms
    (Stembridge, "A local characterization of simply-laced crystals", 2003); each violation is
    reported with its vertices. The exit status is 1 when an axiom fails.
    """
    c = _load(path, fmt)
    with _library_errors():
        report = druse.check_crystal(c, stembridge=not no_stembridge, max_witnesses=max_witnesses)
    if as_json:
        _echo_json({"path": path, "n": c.n, "vertices": len(c), **report.to_dict()})
    else:
        click.echo(f"{path}: crystal of GL_{c.n} with {len(c)} vertices")
        click.echo(str(report))
    if not report.ok:
        raise SystemExit(1)


@click.command()
@click.argument("path", type=click.Path(dir_okay=False))
@click.option("--format", "fmt", type=_FORMATS, help="File format (default: from the suffix).")
@click.option("--json", "as_json", is_flag=True, help="Print the components as JSON.")
def decompose(path: str, fmt: str | None, as_json: bool) -> None:
    """Split the crystal in PATH into components, each matched with B(lambda) on tableaux.

    For each component: its highest weight vertex and weight, and whether an explicit
    isomorphism to the tableau crystal B(lambda) exists (a witness says why not).
    """
    c = _load(path, fmt)
    rows = []
    with _library_errors():
        for k, part in enumerate(druse.decompose(c)):
            try:
                shape, _ = druse.tableau_isomorphism(c, k)
                match, why = shape, None
            except ValueError as err:
                match, why = None, str(err)
            rows.append((part, match, why))
    if as_json:
        _echo_json(
            {
                "path": path,
                "n": c.n,
                "vertices": len(c),
                "components": [
                    {
                        "highest_weight": p.highest_weight,
                        "weight": list(p.weight),
                        "size": p.size,
                        "shape": None if m is None else list(m),
                        "witness": why,
                    }
                    for p, m, why in rows
                ],
            }
        )
        return
    click.echo(f"{path}: crystal of GL_{c.n} with {len(c)} vertices, {len(rows)} components")
    for p, m, why in rows:
        head = f"  vertex {p.highest_weight}: weight {_format_parts(p.weight)}, {p.size} vertices"
        click.echo(f"{head}, isomorphic to B{_format_parts(m)}" if m is not None else head)
        if why is not None:
            click.echo(f"    not a B(lambda): {why}")


@click.command()
@click.argument("source", type=click.Path(dir_okay=False))
@click.argument("target", type=click.Path(dir_okay=False))
def convert(source: str, target: str) -> None:
    """Read a crystal file and write it in the format of TARGET's suffix (.json or .graphml)."""
    c = _load(source, None)
    with _library_errors():
        try:
            druse.save_crystal(c, target)
        except OSError as err:
            raise click.ClickException(f"cannot write {target}: {err.strerror or err}") from err
    click.echo(f"wrote {len(c)} vertices to {target}")


def _subset(text: str, size: int) -> list[int]:
    """Vertex indices from '0,3,5' or from a file holding a JSON array of them ('@path')."""
    if text.startswith("@"):
        path = text[1:]
        try:
            with open(path, encoding="utf-8") as handle:
                doc = json.load(handle)
        except OSError as err:
            raise click.ClickException(f"cannot read {path}: {err.strerror or err}") from err
        except json.JSONDecodeError as err:
            raise click.ClickException(f"{path}: line {err.lineno}: not valid JSON") from err
        if not isinstance(doc, list) or not all(type(v) is int for v in doc):
            raise click.ClickException(f"{path} must hold a JSON array of vertex indices")
        vertices = list(doc)
    else:
        pieces = [x.strip() for x in text.strip().strip("()[]").split(",") if x.strip()]
        if not all(x.isdigit() for x in pieces):
            raise click.BadParameter(f"{text!r} is not a list of vertex indices like 0,3,5")
        vertices = [int(x) for x in pieces]
    bad = [v for v in vertices if not 0 <= v < size]
    if bad:
        raise click.ClickException(f"--vertices must be in 0..{size - 1}; got {bad[0]}")
    return vertices


@click.command()
@click.argument("path", type=click.Path(dir_okay=False))
@click.option(
    "--vertices",
    "-v",
    "subset",
    help="The subset: vertex indices 0,3,5 or @FILE with a JSON array of them. Without it, the "
    "crystal itself is taken as truncated (arrows cut where they leave it, like a pipe-dream "
    "crystal) and each component is matched into B(lambda).",
)
@click.option("--format", "fmt", type=_FORMATS, help="File format (default: from the suffix).")
@click.option("--json", "as_json", is_flag=True, help="Print the pieces as JSON.")
def recognise(path: str, subset: str | None, fmt: str | None, as_json: bool) -> None:
    """Decide, component by component, whether a vertex subset of the crystal in PATH (or the
    whole crystal, read as truncated) is a Demazure crystal B_w(lambda); print w and its key
    w.lambda, or a witness why not."""
    c = _load(path, fmt)
    mask = np.ones(len(c), dtype=np.bool_)
    if subset is not None:
        mask[:] = False
        mask[_subset(subset, len(c))] = True
    with _library_errors():
        found = druse.demazure_recognition(c, None if subset is None else mask)
        expansion = found.key_expansion()
    if as_json:
        terms = None if expansion is None else [[list(a), k] for a, k in expansion.items()]
        _echo_json({"path": path, "pieces": [_piece_doc(p) for p in found], "key_expansion": terms})
        return
    click.echo(f"{path}: {int(mask.sum())} of {len(c)} vertices, {len(found)} components met")
    for p in found:
        click.echo(f"  component of vertex {p.highest_weight} (weight {_format_parts(p.weight)}):")
        if p.perm is not None and p.key is not None:
            click.echo(f"    B_w with w = {_format_parts(p.perm)}, key{_format_parts(p.key)}")
        elif p.witness is not None:
            w = p.witness
            click.echo(
                f"    not Demazure: {w.kind} at vertex {w.vertex} (other {w.other}, i {w.i})"
            )
            if w.detail:
                click.echo(f"    {w.detail}")
    if expansion is not None:
        terms_text = " + ".join(f"{k}*key{_format_parts(a)}" for a, k in expansion.items())
        click.echo(f"character: {terms_text}")


def _piece_doc(p: druse.DemazurePiece) -> dict[str, object]:
    w = p.witness
    return {
        "highest_weight": p.highest_weight,
        "weight": list(p.weight),
        "size": p.size,
        "demazure": p.is_demazure,
        "perm": None if p.perm is None else list(p.perm),
        "word": None if p.word is None else list(p.word),
        "key": None if p.key is None else list(p.key),
        "witness": None
        if w is None
        else {
            "kind": w.kind,
            "vertex": w.vertex,
            "other": w.other,
            "i": w.i,
            "model_vertex": w.model_vertex,
            "detail": w.detail,
        },
    }
