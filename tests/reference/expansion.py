"""Key and atom expansions by triangular peeling on dicts, with key polynomials and atoms from
pi_i and pi_i - 1 on dicts: the slow, obvious oracle for rust/poly/expand.rs.

Key polynomials kappa_alpha and Demazure atoms A_alpha each have x^alpha as their leading term in
the reverse lexicographic order, with coefficient 1 (Lascoux and Schutzenberger, "Keys and
standard bases", 1990; Reiner and Shimozono, "Key polynomials and a flagged Littlewood-Richardson
rule", 1995): peel the leading term c x^beta, subtract c kappa_beta, repeat.
"""

from __future__ import annotations

from collections import defaultdict
from collections.abc import Callable
from functools import cache

Exponent = tuple[int, ...]
Terms = dict[Exponent, int]


def _operator(f: Terms, j: int, atom: bool) -> Terms:
    """pi_(j+1) (or pi_(j+1) - 1 when `atom`) on a dict, monomial by monomial.

    pi_i x^a y^b = (x^(a+1) y^b - y^(a+1) x^b) / (x - y) on the pair (x, y) = (x_i, x_(i+1)):
    x^a y^b + x^(a-1) y^(b+1) + ... + x^b y^a for a >= b, minus the terms strictly between for
    a < b (the geometric sum).
    """
    out: defaultdict[Exponent, int] = defaultdict(int)
    for e, c in f.items():
        a, b = e[j], e[j + 1]
        inside = range(b, a + 1) if a >= b else range(a + 1, b)
        image = [(p, 1 if a >= b else -1) for p in inside]
        if atom:
            image.append((a, -1))  # minus the identity
        for p, sign in image:
            out[(*e[:j], p, a + b - p, *e[j + 2 :])] += sign * c
    return {e: c for e, c in out.items() if c}


@cache
def basis_element(alpha: Exponent, atom: bool = False) -> tuple[tuple[Exponent, int], ...]:
    """kappa_alpha (or A_alpha): x^alpha for weakly decreasing alpha, else pi_j of the element
    of alpha with parts j, j+1 swapped, for any ascent alpha_j < alpha_(j+1)."""
    for j in range(len(alpha) - 1):
        if alpha[j] < alpha[j + 1]:
            swapped = (*alpha[:j], alpha[j + 1], alpha[j], *alpha[j + 2 :])
            return tuple(_operator(dict(basis_element(swapped, atom)), j, atom).items())
    return ((alpha, 1),)


def _revlex(e: Exponent) -> Exponent:
    return tuple(reversed(e))


def peel(f: Terms, basis: Callable[[Exponent], Terms]) -> Terms:
    """The coefficients c_beta with f = sum c_beta basis(beta), leading terms first."""
    rest = {e: c for e, c in f.items() if c}
    out: Terms = {}
    while rest:
        lead = max(rest, key=_revlex)
        c = rest[lead]
        out[lead] = c
        for e, b in basis(lead).items():
            v = rest.get(e, 0) - c * b
            if v:
                rest[e] = v
            else:
                rest.pop(e, None)
        if lead in rest:
            raise AssertionError(f"peeling did not remove {lead}")
    return out


def key_expansion(f: Terms) -> Terms:
    return peel(f, lambda alpha: dict(basis_element(alpha)))


def atom_expansion(f: Terms) -> Terms:
    return peel(f, lambda alpha: dict(basis_element(alpha, atom=True)))
