"""Key polynomials, Demazure atoms and the divided-difference operators, computed in Rust.

The operators act on x_i and x_(i+1) of a `Poly`; s_i swaps those two variables:

- the isobaric divided difference pi_i f = (x_i f - x_(i+1) s_i f) / (x_i - x_(i+1)),
- the atom operator pi_i - 1 (often written with a bar over pi_i),
- the ordinary divided difference d_i f = (f - s_i f) / (x_i - x_(i+1)).

Each is computed monomial by monomial from its closed form (a geometric sum), never by
dividing polynomials, with exact integer coefficients of any size.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

import numpy as np

from druse import _core
from druse._check import check_composition, check_index
from druse.poly import Poly

__all__ = [
    "atom",
    "demazure_atom_operator",
    "divided_difference",
    "isobaric_divided_difference",
    "key",
]

#: Largest part accepted: exponents cross to the kernels as int64.
_MAX_PART = 2**62


def _composition(alpha: Any) -> tuple[int, ...]:
    parts = check_composition(alpha, "alpha")
    for k, p in enumerate(parts):
        if p > _MAX_PART:
            raise ValueError(f"alpha parts must be at most 2**62; got {p} at position {k + 1}")
    return parts


def key(alpha: Sequence[int], method: str = "operators") -> Poly:
    """The key polynomial (Demazure character) kappa_alpha in x1..xn, n = len(alpha).

    kappa_alpha = x^alpha if alpha is weakly decreasing; otherwise kappa_alpha = pi_i
    kappa_(s_i alpha) for any i with alpha_i < alpha_(i+1), where s_i alpha swaps parts i and
    i+1 (Lascoux and Schutzenberger, "Keys and standard bases", 1990). The kernel applies one
    isobaric divided difference per inversion of alpha, in Rust.

    Parameters
    ----------
    alpha : sequence of int
        A weak composition: non-negative parts; its length is the number of variables.
    method : {"operators", "crystal"}
        ``"operators"`` (the default, fastest) applies the pi_i in Rust. ``"crystal"`` takes the
        character of the Demazure crystal B_w(lambda) inside B(lambda), lambda = alpha sorted
        and w the shortest permutation with w.lambda = alpha (the Demazure character formula:
        Demazure 1974; Kashiwara 1993; Littelmann 1995): an independent route, for checking.

    Returns
    -------
    Poly
        kappa_alpha, in ``len(alpha)`` variables, with non-negative coefficients.

    Raises
    ------
    TypeError
        If ``alpha`` is not a sequence of integers.
    ValueError
        If a part is negative or exceeds 2**62.

    Examples
    --------
    >>> key((0, 1))
    Poly('x1 + x2', nvars=2)
    >>> key((2, 0, 1))
    Poly('x1^2*x2 + x1^2*x3', nvars=3)
    >>> key((0, 1, 1)) == Poly("x1*x2 + x1*x3 + x2*x3", nvars=3)
    True
    """
    parts = _composition(alpha)
    if _route(method) == "crystal":
        return _by_crystal(parts, atom=False)
    exps, coeffs = _core.key_terms(list(parts))
    # The kernel returns Poly's canonical form (distinct rows, decreasing, nonzero coefficients).
    return Poly._canonical(exps, coeffs, len(parts))


def atom(alpha: Sequence[int], method: str = "operators") -> Poly:
    """The Demazure atom A_alpha in x1..xn, n = len(alpha).

    A_alpha = x^alpha if alpha is weakly decreasing; otherwise A_alpha = (pi_i - 1)
    A_(s_i alpha) for any i with alpha_i < alpha_(i+1) (Lascoux and Schutzenberger, "Keys and
    standard bases", 1990; Mason, "An explicit construction of type A Demazure atoms", 2009).
    kappa_alpha is the sum of the atoms A_beta over the beta below alpha in the Bruhat order of
    the rearrangements of alpha.

    Parameters
    ----------
    alpha : sequence of int
        A weak composition: non-negative parts; its length is the number of variables.

    Returns
    -------
    Poly
        A_alpha, in ``len(alpha)`` variables, with non-negative coefficients.

    Raises
    ------
    TypeError
        If ``alpha`` is not a sequence of integers.
    ValueError
        If a part is negative or exceeds 2**62.

    Examples
    --------
    >>> atom((0, 1))
    Poly('x2', nvars=2)
    >>> atom((0, 2, 1))
    Poly('x1*x2*x3 + x2^2*x3', nvars=3)
    """
    parts = _composition(alpha)
    if _route(method) == "crystal":
        return _by_crystal(parts, atom=True)
    exps, coeffs = _core.atom_terms(list(parts))
    return Poly._canonical(exps, coeffs, len(parts))


def _route(method: Any) -> str:
    if method not in ("operators", "crystal"):
        raise ValueError(f"method must be 'operators' or 'crystal'; got {method!r}")
    return str(method)


def shortest_permutation(alpha: Sequence[int]) -> tuple[int, ...]:
    """The shortest permutation w with w.lambda = alpha, lambda = alpha sorted decreasingly, in
    the convention (w.lambda)_{w(j)} = lambda_j: equal parts keep their relative order.

    Examples
    --------
    >>> shortest_permutation((1, 0, 3, 2, 0))
    (3, 4, 1, 2, 5)
    """
    parts = _composition(alpha)
    order = sorted(range(len(parts)), key=lambda p: (-parts[p], p))  # positions of lambda_1, ...
    return tuple(p + 1 for p in order)


def _by_crystal(parts: tuple[int, ...], atom: bool) -> Poly:
    # imported here: druse.crystal and druse.demazure sit above this module
    from druse.crystal import crystal
    from druse.demazure import atom_mask, demazure_mask_of

    n = len(parts)
    if n == 0:
        return Poly.one(0)
    C = crystal(sorted(parts, reverse=True), n)
    w = shortest_permutation(parts)
    return C.character(atom_mask(C, w) if atom else demazure_mask_of(C, w))


def _operator(p: Any, i: Any, kind: str, name: str) -> Poly:
    if not isinstance(p, Poly):
        raise TypeError(f"p must be a Poly; got {type(p).__name__}")
    if p.nvars < 2:
        raise ValueError(f"{name} needs at least 2 variables; p has nvars={p.nvars}")
    index = check_index(i, 1, p.nvars - 1, "i")
    if len(p) and int(p.exponents.min()) < 0:
        raise ValueError(
            f"{name} is defined here on polynomials; p has a negative (Laurent) exponent"
        )
    exps, coeffs = _core.poly_operator(
        np.ascontiguousarray(p.exponents), list(p.coefficients), p.nvars, kind, index
    )
    return Poly._canonical(exps, coeffs, p.nvars)


def isobaric_divided_difference(p: Poly, i: int) -> Poly:
    """pi_i p = (x_i p - x_(i+1) s_i p) / (x_i - x_(i+1)), exactly.

    On a monomial with x_i^a x_(i+1)^b, pi_i gives x_i^a x_(i+1)^b + ... + x_i^b x_(i+1)^a
    when a >= b, and minus the terms strictly between x_i^a x_(i+1)^b and x_i^b x_(i+1)^a when
    a < b (Lascoux and Schutzenberger, "Keys and standard bases", 1990). pi_i is linear,
    pi_i^2 = pi_i, and the pi_i satisfy the braid relations.

    Parameters
    ----------
    p : Poly
        A polynomial (no negative exponents) in at least 2 variables.
    i : int
        The operator acts on x_i and x_(i+1): 1 <= i <= p.nvars - 1.

    Returns
    -------
    Poly
        pi_i p, in the same variables.

    Raises
    ------
    TypeError
        If ``p`` is not a Poly or ``i`` is not an integer.
    ValueError
        If ``i`` is out of range or ``p`` has a negative exponent.

    Examples
    --------
    >>> isobaric_divided_difference(Poly("x1^2", nvars=2), 1)
    Poly('x1^2 + x1*x2 + x2^2', nvars=2)
    >>> isobaric_divided_difference(Poly("x2", nvars=2), 1)
    Poly('0', nvars=2)
    """
    return _operator(p, i, "pi", "the isobaric divided difference")


def demazure_atom_operator(p: Poly, i: int) -> Poly:
    """(pi_i - 1) p, the operator that builds Demazure atoms, exactly.

    On a monomial with x_i^a x_(i+1)^b it gives the terms x_i^c x_(i+1)^(a+b-c) for c = b..a-1
    when a >= b, and minus those for c = a..b-1 when a < b (Lascoux and Schutzenberger, "Keys
    and standard bases", 1990; Mason, "An explicit construction of type A Demazure atoms",
    2009). It satisfies (pi_i - 1)^2 = -(pi_i - 1) and the braid relations.

    Parameters
    ----------
    p : Poly
        A polynomial (no negative exponents) in at least 2 variables.
    i : int
        The operator acts on x_i and x_(i+1): 1 <= i <= p.nvars - 1.

    Returns
    -------
    Poly
        (pi_i - 1) p, in the same variables.

    Raises
    ------
    TypeError
        If ``p`` is not a Poly or ``i`` is not an integer.
    ValueError
        If ``i`` is out of range or ``p`` has a negative exponent.

    Examples
    --------
    >>> demazure_atom_operator(Poly("x1", nvars=2), 1)
    Poly('x2', nvars=2)
    >>> demazure_atom_operator(Poly("x2", nvars=2), 1)
    Poly('-x2', nvars=2)
    """
    return _operator(p, i, "pibar", "the Demazure atom operator")


def divided_difference(p: Poly, i: int) -> Poly:
    """d_i p = (p - s_i p) / (x_i - x_(i+1)), exactly; the degree drops by one.

    On a monomial with x_i^a x_(i+1)^b it gives the terms x_i^c x_(i+1)^(a+b-1-c) for
    c = b..a-1 when a > b, zero when a = b, and minus those for c = a..b-1 when a < b
    (Macdonald, Notes on Schubert Polynomials, 1991, Ch. II). d_i^2 = 0, and the d_i satisfy
    the braid relations.

    Parameters
    ----------
    p : Poly
        A polynomial (no negative exponents) in at least 2 variables.
    i : int
        The operator acts on x_i and x_(i+1): 1 <= i <= p.nvars - 1.

    Returns
    -------
    Poly
        d_i p, in the same variables.

    Raises
    ------
    TypeError
        If ``p`` is not a Poly or ``i`` is not an integer.
    ValueError
        If ``i`` is out of range or ``p`` has a negative exponent.

    Examples
    --------
    >>> divided_difference(Poly("x1^2", nvars=2), 1)
    Poly('x1 + x2', nvars=2)
    >>> divided_difference(Poly("x1*x2", nvars=2), 1)
    Poly('0', nvars=2)
    """
    return _operator(p, i, "d", "the divided difference")
