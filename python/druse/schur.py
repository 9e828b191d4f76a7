"""Schur polynomials and Kostka numbers, computed exactly in Rust without listing tableaux."""

from __future__ import annotations

from collections.abc import Sequence

from druse import _core
from druse._check import check_composition, check_nonnegative_int, check_partition
from druse.poly import Poly

__all__ = ["kostka", "schur"]

#: Largest part the kernels accept: exponents cross as 32-bit unsigned integers.
_MAX_PART = 2**32 - 1


def schur(shape: Sequence[int], n: int) -> Poly:
    """The Schur polynomial s_shape(x1, ..., xn), exactly.

    The coefficient of x1^a1 ... xn^an is the number of semistandard Young tableaux of shape
    ``shape`` with ``ak`` entries equal to k (the Kostka number). It is computed by the branching
    rule s_lambda(x1..xk) = sum of xk^|lambda/mu| s_mu(x1..x(k-1)) over the mu with lambda/mu a
    horizontal strip (Macdonald, Symmetric Functions and Hall Polynomials, 2nd ed., 1995,
    Ch. I (5.11)), on dense coefficient arrays, without listing tableaux.

    Parameters
    ----------
    shape : sequence of int
        A partition (weakly decreasing, non-negative); trailing zeros are ignored.
    n : int
        Number of variables (n >= 0).

    Returns
    -------
    Poly
        A polynomial in ``n`` variables. More rows than ``n`` gives the zero polynomial; the
        empty shape gives the constant 1.

    Raises
    ------
    TypeError
        If ``shape`` is not a sequence of integers or ``n`` is not an integer.
    ValueError
        If ``shape`` is not a partition, a part exceeds 2**32 - 1, or ``n`` is negative.
    druse.TooLargeError
        If the computation would need more than 4 GiB; `kostka` gives single coefficients.

    Examples
    --------
    >>> s = schur((2, 1), 3)
    >>> s.to_dict()[(1, 1, 1)], len(s)
    (2, 7)
    >>> schur((1,), 2).to_dict() == {(1, 0): 1, (0, 1): 1}
    True
    >>> schur((1, 1, 1), 2).to_dict()
    {}
    """
    lam = check_partition(shape, "shape")
    nvars = check_nonnegative_int(n, "n")
    if lam and lam[0] > _MAX_PART:
        raise ValueError(f"shape parts must be at most {_MAX_PART}; got {lam[0]}")
    exps, coeffs = _core.schur_terms(list(lam), nvars)
    # The kernel returns distinct rows in decreasing lexicographic order with nonzero
    # coefficients, which is Poly's canonical form: no need to sort and merge again.
    return Poly._canonical(exps, coeffs, nvars)


def kostka(shape: Sequence[int], weight: Sequence[int]) -> int:
    """The Kostka number K_{shape, weight}, exactly.

    It counts the semistandard Young tableaux of shape ``shape`` whose entries are
    ``weight[0]`` ones, ``weight[1]`` twos, and so on. The count runs over Gelfand-Tsetlin
    patterns: the cells holding entries <= k form a partition, and each step to the next one
    adds a horizontal strip of ``weight[k]`` cells (Macdonald, Symmetric Functions and Hall
    Polynomials, 2nd ed., 1995, Ch. I sec. 6).

    Parameters
    ----------
    shape : sequence of int
        A partition; trailing zeros are ignored.
    weight : sequence of int
        A weak composition (non-negative integers, any order, any length).

    Returns
    -------
    int
        The number of such tableaux; 0 when ``sum(weight) != sum(shape)``.

    Raises
    ------
    TypeError
        If ``shape`` or ``weight`` is not a sequence of integers.
    ValueError
        If ``shape`` is not a partition or ``weight`` has a negative entry.
    druse.TooLargeError
        If the partial counts would need more than 4 GiB.

    Examples
    --------
    >>> kostka((2, 1), (1, 1, 1))
    2
    >>> kostka((3, 2), (1, 2, 2)) == kostka((3, 2), (2, 2, 1))
    True
    >>> kostka((2, 2), (3, 1))
    0
    """
    lam = check_partition(shape, "shape")
    w = check_composition(weight, "weight")
    return int(_core.kostka_number(list(lam), list(w)))
