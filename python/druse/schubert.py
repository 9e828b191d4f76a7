"""Schubert polynomials S_w, computed in Rust.

Definition (Lascoux and Schutzenberger, "Polynomes de Schubert", 1982; Macdonald, Notes on
Schubert Polynomials, 1991, (4.1)): for the longest permutation w0 of S_n,
S_(w0) = x1^(n-1) x2^(n-2) ... x_(n-1), and S_(w s_i) = d_i S_w whenever l(w s_i) < l(w), where
d_i f = (f - s_i f) / (x_i - x_(i+1)) and w s_i swaps the entries in positions i, i+1 of w.

A permutation is its one-line notation, a tuple holding 1..n once each (the contract).
"""

from __future__ import annotations

import bisect
import itertools
from collections import Counter
from collections.abc import Callable, Sequence
from typing import Any

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import MEMORY_BUDGET, check_budget, check_int, check_nonnegative_int
from druse.poly import Poly

__all__ = ["all_schuberts", "schubert", "schubert_by_divided_differences"]

Perm = tuple[int, ...]
PermLike = Sequence[int] | npt.NDArray[np.integer[Any]]
Progress = Callable[[int, int], object]

#: Polynomials computed per kernel call of `all_schuberts` (one progress report each).
_CHUNK = 1024


def _check_perm(perm: Any, name: str = "perm") -> Perm:
    """A 1-based permutation in one-line notation; the message names what is wrong."""
    if isinstance(perm, (str, bytes)) or not isinstance(perm, (Sequence, np.ndarray)):
        raise TypeError(
            f"{name} must be a tuple of integers (one-line notation); got {type(perm).__name__}"
            f" {perm!r}"
        )
    w = tuple(check_int(v, f"{name}[{k}]") for k, v in enumerate(list(perm)))
    n = len(w)
    if sorted(w) == list(range(1, n + 1)):
        return w
    rule = f"{name} must be a permutation of 1..{n} in one-line notation"
    if n > 0 and 0 in w and n not in w:
        raise ValueError(
            f"{rule}; got {w}: permutations are 1-based one-line notation; got 0-based? "
            "(then add 1 to each entry)"
        )
    repeated = sorted(x for x, times in Counter(w).items() if times > 1)
    outside = sorted({x for x in w if not 1 <= x <= n})
    missing = sorted(set(range(1, n + 1)) - set(w))
    parts = [
        f"repeated {repeated}" if repeated else "",
        f"out of range 1..{n}: {outside}" if outside else "",
        f"missing {missing}" if missing else "",
    ]
    raise ValueError(f"{rule}; got {w} ({', '.join(p for p in parts if p)})")


def _code(w: Perm) -> list[int]:
    """The Lehmer code, c_a = #{b > a : w(b) < w(a)}, in O(n log n) comparisons."""
    later: list[int] = []
    code = [0] * len(w)
    for a in range(len(w) - 1, -1, -1):
        code[a] = bisect.bisect_left(later, w[a])
        bisect.insort(later, w[a])
    return code


def _term_bound(w: Perm) -> int | None:
    """An upper bound on the number of terms of S_w: the x^a of degree l(w) in x_1..x_d (d the
    last descent of w) with a_i <= n - i and a_1 + ... + a_k >= c_1 + ... + c_k for every k,
    c = code(w). S_w is the sum of x^(crosses per row) over the reduced pipe dreams of w, all
    reached from the one with rows code(w) by ladder moves, which move a cross up (Bergeron and
    Billey, "RC-graphs and Schubert polynomials", 1993; Billey, Jockusch and Stanley 1993).
    None when even the bound would take long to count (such requests are far too large)."""
    n, code = len(w), _code(w)
    degree = sum(code)  # l(w)
    if all(code[k] >= code[k + 1] for k in range(n - 1)):
        return 1  # dominant: a single monomial (Macdonald 1991, (4.7))
    d = max((k + 1 for k in range(n - 1) if w[k] > w[k + 1]), default=0)
    if d * degree > 1_000_000:
        return None
    counts = [1] + [0] * degree  # counts[s]: choices of a_1..a_i with sum s; exact ints
    floor = 0
    for i in range(1, d + 1):
        window = n - i  # a_i in 0..n-i
        sums = list(itertools.accumulate(counts, initial=0))
        counts = [sums[s + 1] - sums[max(s - window, 0)] for s in range(degree + 1)]
        floor += code[i - 1]
        counts[:floor] = [0] * floor
    return counts[degree]


def _check_single_size(w: Perm) -> None:
    terms = _term_bound(w)
    # the memo table of the recursion holds several times the result; 16 B a term, plus a row
    nbytes = MEMORY_BUDGET + 1 if terms is None else terms * 4 * (16 + 8 * len(w))
    check_budget(
        nbytes, f"S_w for w = {w}", "take a permutation with fewer letters or a shorter one"
    )


def schubert(perm: PermLike) -> Poly:
    """The Schubert polynomial S_w in x1..xn, n = len(perm).

    Computed in Rust by the transition recursion (Lascoux and Schutzenberger, "Schubert
    polynomials and the Littlewood-Richardson rule", 1985; Macdonald, Notes on Schubert
    Polynomials, 1991, (4.16)): with r the last descent of w, s > r the last position with
    w(s) < w(r) and v = w t_(rs), S_w = x_r S_v + sum of S_(v t_(qr)) over the q < r with
    l(v t_(qr)) = l(w); memoised, with dominant permutations giving x^code(w) at once.

    Parameters
    ----------
    perm : sequence of int or 1-d integer array
        A permutation of 1..n in one-line notation.

    Returns
    -------
    Poly
        S_w in ``len(perm)`` variables, with non-negative integer coefficients.

    Raises
    ------
    TypeError
        If ``perm`` is not a sequence of integers (bool entries are refused).
    ValueError
        If ``perm`` is not a permutation of 1..n (a 0-based one is named as such).
    TooLargeError
        If the estimated size of the computation exceeds the memory budget.

    Examples
    --------
    >>> schubert((1, 3, 2))
    Poly('x1 + x2', nvars=3)
    >>> schubert((3, 2, 1))
    Poly('x1^2*x2', nvars=3)
    """
    w = _check_perm(perm)
    _check_single_size(w)
    exps, coeffs = _core.schubert_terms(list(w))
    return Poly._canonical(exps, coeffs, len(w))


def schubert_by_divided_differences(perm: PermLike) -> Poly:
    """S_w straight from the definition: d_i applied to S_(w0) along a descending path to w.

    Slower than `schubert` (the intermediate polynomials near w0 are large); an independent
    route, for cross-checks. The d_i are the Rust kernels of `druse.divided_difference`.

    Parameters
    ----------
    perm : sequence of int or 1-d integer array
        A permutation of 1..n in one-line notation.

    Returns
    -------
    Poly
        S_w in ``len(perm)`` variables.

    Raises
    ------
    TypeError, ValueError, TooLargeError
        As for `schubert`.

    Examples
    --------
    >>> schubert_by_divided_differences((2, 1, 4, 3))
    Poly('x1^2 + x1*x2 + x1*x3', nvars=4)
    """
    w = _check_perm(perm)
    # the kernel bounds the size of each step before taking it (TooLargeError past 2 GB)
    exps, coeffs = _core.schubert_divided_terms(list(w))
    return Poly._canonical(exps, coeffs, len(w))


def all_schuberts(n: int, progress: Progress | None = None) -> dict[Perm, Poly]:
    """Every Schubert polynomial of S_n, keyed by permutation in lexicographic order.

    Computed top down from S_(w0) = x1^(n-1) ... x_(n-1), one divided difference per
    permutation (S_w = d_i S_(w s_i) for an ascent i of w), level by level in decreasing
    length, in parallel; the result does not depend on the schedule.

    Parameters
    ----------
    n : int
        The size of the symmetric group, n >= 0.
    progress : callable, optional
        ``progress(done, total)`` is called after each chunk of polynomials (and once at the
        end), with total = n!.

    Returns
    -------
    dict
        ``{perm: S_perm}`` for every permutation of 1..n, in lexicographic order of ``perm``.

    Raises
    ------
    TypeError
        If ``n`` is not an integer.
    ValueError
        If ``n`` is negative.
    TooLargeError
        If the estimated memory of the result exceeds the budget (n = 9 already does).

    Examples
    --------
    >>> all_schuberts(3)[(2, 3, 1)]
    Poly('x1*x2', nvars=3)
    """
    size = check_nonnegative_int(n, "n")
    estimate = _core.schubert_batch_bytes(size) if size < 64 else None
    alternative = "compute single ones with schubert(perm), or take a smaller n"
    if estimate is None:
        check_budget(MEMORY_BUDGET + 1, f"every Schubert polynomial of S_{size}", alternative)
    else:
        check_budget(estimate, f"every Schubert polynomial of S_{size}", alternative)
    batch = _core.SchubertBatch(size, MEMORY_BUDGET)
    total = batch.total()
    done = 0
    while done < total:
        done = batch.advance(_CHUNK)
        if progress is not None:
            progress(done, total)
    exps, coeffs, offsets = batch.collect()
    bounds = offsets.tolist()
    perms = itertools.permutations(range(1, size + 1))
    return {
        w: Poly._canonical(exps[bounds[k] : bounds[k + 1]], coeffs[bounds[k] : bounds[k + 1]], size)
        for k, w in enumerate(perms)
    }
