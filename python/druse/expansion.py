"""Expansions of polynomials in the key, atom and Schur bases, and a positivity report.

Key polynomials kappa_alpha (and Demazure atoms A_alpha), alpha running over the weak
compositions of length n, are each a basis of Z[x1..xn]; each has x^alpha as its leading term in
the reverse lexicographic order (compare exponents from the last variable backwards; larger
wins), with coefficient 1 (Lascoux-Schutzenberger, "Keys and standard bases", 1990; Reiner-
Shimozono, "Key polynomials and a flagged Littlewood-Richardson rule", 1995). So any polynomial is
peeled exactly: take its leading term c x^beta, subtract c kappa_beta, repeat. Every step checks
that the leading term really vanished, so a broken assumption raises instead of looping.
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass

from druse.errors import InternalError
from druse.key import atom, key
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


def _revlex_key(e: Exponent) -> Exponent:
    return tuple(reversed(e))


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


def key_expansion(p: Poly) -> dict[Exponent, int]:
    """Coefficients c_alpha with p = sum c_alpha key(alpha), alpha of length p.nvars.

    Exact, by triangular peeling in reverse lexicographic order (see the module docstring).

    Examples
    --------
    >>> import druse
    >>> druse.key_expansion(druse.key((0, 2, 1)) + 3 * druse.key((1, 0, 1)))
    {(0, 2, 1): 1, (1, 0, 1): 3}
    >>> druse.key_expansion(druse.schur((2, 1), 3))  # a Schur polynomial is one key
    {(0, 1, 2): 1}
    """
    return dict(
        sorted(_peel(p, key, _revlex_key).items(), key=lambda t: _revlex_key(t[0]), reverse=True)
    )


def atom_expansion(p: Poly) -> dict[Exponent, int]:
    """Coefficients c_alpha with p = sum c_alpha atom(alpha), by the same peeling.

    Examples
    --------
    >>> import druse
    >>> druse.atom_expansion(druse.key((0, 1)))
    {(0, 1): 1, (1, 0): 1}
    """
    return dict(
        sorted(_peel(p, atom, _revlex_key).items(), key=lambda t: _revlex_key(t[0]), reverse=True)
    )


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
