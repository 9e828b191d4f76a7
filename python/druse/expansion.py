"""Expansions of polynomials in the key, atom and Schur bases, and a positivity report.

Key polynomials kappa_alpha (and Demazure atoms A_alpha), alpha running over the weak
compositions of length n, are each a basis of Z[x1..xn]; each has x^alpha as its leading term in
the reverse lexicographic order (compare exponents from the last variable backwards; larger
wins), with coefficient 1 (Lascoux-Schutzenberger, "Keys and standard bases", 1990; Reiner-
Shimozono, "Key polynomials and a flagged Littlewood-Richardson rule", 1995). So any polynomial is
peeled exactly: take its leading term c x^beta, subtract c kappa_beta, repeat. Every step checks
that the leading term really vanished, so a broken assumption raises instead of looping.

The key and atom peelings run in Rust (rust/poly/expand.rs), with the basis elements cached
across a batch (`key_expansions`); the Schur peeling runs here, on dicts.
"""

from __future__ import annotations

from collections.abc import Callable, Iterable, Iterator
from dataclasses import dataclass

import numpy as np
import numpy.typing as npt

from druse import _core
from druse.errors import InternalError
from druse.poly import Poly
from druse.schur import schur

Exponent = tuple[int, ...]


@dataclass(frozen=True)
class Positivity:
    """Whether an expansion has only non-negative coefficients, with a witness if not.

    Attributes
    ----------
    positive : bool
        True when every coefficient is >= 0.
    witness : tuple of int or None
        The index (composition or partition) of a negative coefficient, the first in the
        expansion's order; None when positive.
    coefficient : int or None
        That negative coefficient.
    """

    positive: bool
    witness: Exponent | None = None
    coefficient: int | None = None


def _peel(
    p: Poly, basis: Callable[[Exponent], Poly], order: Callable[[Exponent], Exponent]
) -> dict[Exponent, int]:
    """Triangular peeling of p by basis(beta), whose leading term in `order` is x^beta."""
    if not isinstance(p, Poly):
        raise TypeError(f"p must be a druse.Poly; got {type(p).__name__}")
    if any(min(e) < 0 for e, _ in p if e):
        raise ValueError("p must be a polynomial: negative exponents are not allowed")
    rest = p.to_dict()
    out: dict[Exponent, int] = {}
    while rest:
        lead = max(rest, key=order)
        c = rest[lead]
        out[lead] = c
        for e, b in basis(lead).to_dict().items():
            v = rest.get(e, 0) - c * b
            if v:
                rest[e] = v
            else:
                rest.pop(e, None)
        if lead in rest:  # the basis element did not lead with x^lead: a bug, not bad input
            raise InternalError(
                f"peeling did not remove the leading exponent {lead}; please report"
            )
    return out


def _check_poly(p: object, name: str) -> Poly:
    if not isinstance(p, Poly):
        raise TypeError(f"{name} must be a druse.Poly; got {type(p).__name__}")
    if len(p) and p.nvars and int(p.exponents.min()) < 0:
        raise ValueError(f"{name} must be a polynomial: negative exponents are not allowed")
    return p


def _as_dict(exps: npt.NDArray[np.int64], coeffs: list[int]) -> dict[Exponent, int]:
    return dict(zip(map(tuple, exps.tolist()), coeffs, strict=True))


def _expand(p: Poly, kind: str) -> dict[Exponent, int]:
    p = _check_poly(p, "p")
    exps, coeffs = _core.key_expansion_terms(p.exponents, p.coefficients, p.nvars, kind)
    return _as_dict(exps, coeffs)


def key_expansion(p: Poly) -> dict[Exponent, int]:
    """Coefficients c_alpha with p = sum c_alpha key(alpha), alpha of length p.nvars.

    Exact, by triangular peeling in reverse lexicographic order (see the module docstring), in
    Rust. The compositions come in decreasing reverse lexicographic order.

    Parameters
    ----------
    p : Poly
        A polynomial (non-negative exponents) with integer coefficients of any size.

    Returns
    -------
    dict
        ``{alpha: c_alpha}`` over the nonzero coefficients.

    Raises
    ------
    TypeError
        If ``p`` is not a Poly.
    ValueError
        If ``p`` has a negative exponent.

    Examples
    --------
    >>> import druse
    >>> druse.key_expansion(druse.key((0, 2, 1)) + 3 * druse.key((1, 0, 1)))
    {(0, 2, 1): 1, (1, 0, 1): 3}
    >>> druse.key_expansion(druse.schur((2, 1), 3))  # a Schur polynomial is one key
    {(0, 1, 2): 1}
    """
    return _expand(p, "key")


def atom_expansion(p: Poly) -> dict[Exponent, int]:
    """Coefficients c_alpha with p = sum c_alpha atom(alpha), by the same peeling, in Rust.

    Parameters and errors as for `key_expansion`.

    Examples
    --------
    >>> import druse
    >>> druse.atom_expansion(druse.key((0, 1)))
    {(0, 1): 1, (1, 0): 1}
    """
    return _expand(p, "atom")


#: Input terms per kernel call of `key_expansions`: a progress report every few tens of ms.
_CHUNK_TERMS = 50_000


def _chunks(polys: list[Poly]) -> Iterator[list[int]]:
    """Consecutive index ranges of about _CHUNK_TERMS input terms (at least one polynomial)."""
    chunk: list[int] = []
    terms = 0
    for k, p in enumerate(polys):
        chunk.append(k)
        terms += len(p)
        if terms >= _CHUNK_TERMS:
            yield chunk
            chunk, terms = [], 0
    if chunk:
        yield chunk


def key_expansions(
    polys: Iterable[Poly], progress: Callable[[int, int], object] | None = None
) -> list[dict[Exponent, int]]:
    """The key expansion of each polynomial, with key polynomials shared across the batch.

    Equal to ``[key_expansion(p) for p in polys]``, but each key polynomial is computed once
    for the whole batch (one cache per number of variables), and the polynomials are expanded
    on all cores.

    Parameters
    ----------
    polys : iterable of Poly
        Polynomials (non-negative exponents); they may differ in nvars.
    progress : callable or None
        Called as ``progress(done, total)`` (polynomials) after each chunk of work.

    Returns
    -------
    list of dict
        One ``{alpha: c_alpha}`` per polynomial, in input order.

    Raises
    ------
    TypeError
        If an item is not a Poly, or ``progress`` is not callable.
    ValueError
        If a polynomial has a negative exponent.

    Examples
    --------
    >>> import druse
    >>> druse.key_expansions([druse.key((0, 1)), druse.schur((1,), 2) * 2])
    [{(0, 1): 1}, {(0, 1): 2}]
    """
    items = list(polys)
    for k, p in enumerate(items):
        if not isinstance(p, Poly):
            raise TypeError(f"polys[{k}] must be a druse.Poly; got {type(p).__name__}")
    if progress is not None and not callable(progress):
        raise TypeError(f"progress must be callable or None; got {type(progress).__name__}")
    caches = _caches(items)
    out: list[dict[Exponent, int]] = [{} for _ in items]
    done = 0
    for chunk in _chunks(items):
        by_nvars: dict[int, list[int]] = {}
        for k in chunk:
            by_nvars.setdefault(items[k].nvars, []).append(k)
        for n, ks in by_nvars.items():
            args = [(items[k].exponents, items[k].coefficients) for k in ks]
            exps, coeffs, offsets = _core.key_expansion_batch(caches[n], args)
            rows = list(map(tuple, exps.tolist()))
            starts = offsets.tolist()
            for j, k in enumerate(ks):
                lo, hi = starts[j], starts[j + 1]
                out[k] = dict(zip(rows[lo:hi], coeffs[lo:hi], strict=True))
        done += len(chunk)
        if progress is not None:
            progress(done, len(items))
    return out


def _caches(items: list[Poly]) -> dict[int, _core.ExpansionCache]:
    """One kernel cache per nvars, its packing chosen from the largest exponent there."""
    groups: dict[int, list[int]] = {}
    for k, p in enumerate(items):
        groups.setdefault(p.nvars, []).append(k)
    caches, bad = {}, []
    for n, ks in groups.items():
        first_negative, top = _core.exponent_bounds([items[k].exponents for k in ks])
        if first_negative >= 0:
            bad.append(ks[first_negative])
        caches[n] = _core.ExpansionCache("key", n, top)
    if bad:
        raise ValueError(
            f"polys[{min(bad)}] must be a polynomial: negative exponents are not allowed"
        )
    return caches


def schur_expansion(p: Poly) -> dict[Exponent, int]:
    """Coefficients c_lambda with p = sum c_lambda s_lambda(x1..xn) for a symmetric p.

    Peels the lexicographically largest monomial, whose exponent must be a partition when p is
    symmetric (Macdonald, Symmetric Functions and Hall Polynomials, 1995, I (6.5)); partitions
    come back without trailing zeros. A non-symmetric p raises ValueError.

    Examples
    --------
    >>> import druse
    >>> druse.schur_expansion(druse.schur((2, 1), 3) * druse.schur((1,), 3))
    {(3, 1): 1, (2, 2): 1, (2, 1, 1): 1}
    """
    n = p.nvars

    def basis(lam: Exponent) -> Poly:
        if any(lam[j] < lam[j + 1] for j in range(len(lam) - 1)):
            raise ValueError(f"p is not symmetric: its leading exponent {lam} is not a partition")
        return schur(lam, n)

    out = _peel(p, basis, lambda e: e)
    trimmed = {tuple(x for k, x in enumerate(lam) if any(lam[k:])): c for lam, c in out.items()}
    return dict(sorted(trimmed.items(), reverse=True))


def positivity(expansion: dict[Exponent, int]) -> Positivity:
    """Report on an expansion: positive, or the first negative coefficient as a witness.

    Examples
    --------
    >>> positivity({(1, 0): 2, (0, 1): -1})
    Positivity(positive=False, witness=(0, 1), coefficient=-1)
    """
    for index, c in expansion.items():
        if c < 0:
            return Positivity(False, index, c)
    return Positivity(True)
