"""Schubert polynomials in the key basis, and Stanley symmetric functions in the Schur basis.

Every Schubert polynomial is a sum of key polynomials with non-negative coefficients
(Lascoux-Schutzenberger, "Keys and standard bases", 1990; Reiner-Shimozono, "Key polynomials and
a flagged Littlewood-Richardson rule", 1995). Two independent routes compute the expansion:

- ``"crystal"``: the reduced pipe dreams of w are the bounded decreasing factorizations; inside
  each component B(lambda) of the crystal on all decreasing factorizations (Morse-Schilling,
  "Crystal approach to affine Schubert calculus", 2016) they form a Demazure crystal
  B_v(lambda) (Assaf-Schilling, "A Demazure crystal construction for Schubert polynomials",
  2018), which :func:`druse.recognition.demazure_recognition` identifies; each contributes
  key(v.lambda).
- ``"polynomial"``: ``druse.key_expansion(druse.schubert(w))``, triangular peeling of S_w.

The Stanley symmetric function F_w, the character of the whole factorization crystal, is
sum_lambda c_lambda s_lambda with c_lambda the number of Edelman-Greene tableaux of shape lambda
(Edelman-Greene, "Balanced tableaux", 1987): increasing tableaux whose row reading word is a
reduced word of w^-1 (with F_w summed over decreasing factorizations of w, as here; for the
reduced words of w itself, the shapes come transposed). They match the highest weight vertices
of the factorization crystal: each component B(lambda) has one. Keys stabilise to Schur
functions, so grouping the key expansion of S_w by sorted(alpha) gives the same numbers.
"""

from __future__ import annotations

import math
from collections.abc import Callable, Sequence

from druse import _core
from druse._check import MEMORY_BUDGET, check_budget, check_index
from druse.demazure import check_perm
from druse.errors import InternalError
from druse.expansion import key_expansion
from druse.pipe_crystal import factorization_crystal
from druse.recognition import demazure_recognition

Composition = tuple[int, ...]


def schubert_key_expansion(perm: Sequence[int], method: str = "crystal") -> dict[Composition, int]:
    """The key expansion S_w = sum c_alpha key(alpha), alpha of length n.

    Parameters
    ----------
    perm : sequence of int
        w in one-line notation, a permutation of 1..n.
    method : {"crystal", "factorizations", "polynomial"}
        ``"crystal"`` reads the Demazure pieces of the pipe-dream crystal, with the operators
        computed on the pipe dreams only; ``"factorizations"`` does the same through
        :func:`druse.recognition.demazure_recognition` on the whole factorization crystal
        (slower: that crystal is much larger); ``"polynomial"`` peels druse.schubert(perm).

    Returns
    -------
    dict
        composition alpha -> c_alpha > 0, in decreasing reverse lexicographic order of alpha.

    Raises
    ------
    TypeError, ValueError
        If perm is not a permutation of 1..n, or method is not one of the three names.
    druse.InternalError
        If the pipe dreams were not a union of Demazure crystals (Assaf-Schilling 2018 says they
        are; the check is made, not assumed).
    druse.TooLargeError
        If the crystal route's factorizations would not fit the memory budget.

    Examples
    --------
    >>> from druse.schubert_keys import schubert_key_expansion
    >>> schubert_key_expansion((1, 4, 3, 2))
    {(0, 2, 1, 0): 1}
    >>> schubert_key_expansion((1, 4, 3, 2), method="polynomial")
    {(0, 2, 1, 0): 1}
    """
    w = check_perm(perm, "perm")
    if method == "polynomial":
        from druse.schubert import schubert

        return key_expansion(schubert(w))
    if method == "factorizations":
        return _by_whole_crystal(w)
    if method != "crystal":
        raise ValueError(
            f"method must be 'crystal', 'factorizations' or 'polynomial'; got {method!r}"
        )
    return _by_pipe_dreams(w)


def _by_whole_crystal(w: Composition) -> dict[Composition, int]:
    """demazure_recognition of the bounded set in the whole factorization crystal."""
    # n - 1 factors suffice: no pipe dream has a cross in row n, the n-th factor of a bounded
    # factorization is empty, and each GL_(n-1) component is the part of a GL_n one with an
    # empty n-th factor, which holds the whole Demazure piece (its keys end in 0)
    C = factorization_crystal(w, max(len(w) - 1, 1))
    report = demazure_recognition(C, C.bounded())
    expansion = report.key_expansion()
    if expansion is None:
        bad = next(p for p in report if not p.is_demazure)
        raise InternalError(
            f"the pipe dreams of {w} are not a Demazure crystal in the component of vertex "
            f"{bad.highest_weight} (witness {bad.witness}); please report it"
        )
    pad = (0,) * (len(w) - C.n)
    return {alpha + pad: c for alpha, c in expansion.items()}


def _by_pipe_dreams(w: Composition) -> dict[Composition, int]:
    """The Demazure pieces of the pipe-dream crystal, recognised in Rust on the pipe dreams alone.

    The same test as :func:`druse.recognition.demazure_recognition`, run on the operators
    truncated to the pipe dreams with a mark where one leads out of them: the strings through a
    pipe dream are checked through those marks, and a Demazure closure D_i(X) stays inside
    exactly when no f_i it follows leads out. So the whole factorization crystal, far larger,
    is never built (rust/schubert/factorization_keys.rs).
    """
    limit = MEMORY_BUDGET // (64 * max(len(w), 1))
    try:
        pairs = _core.pipe_dream_keys(list(w), limit)
    except ValueError as err:
        if "not a union of Demazure crystals" in str(err):
            raise InternalError(f"{w}: {err}") from None
        raise
    out = {tuple(alpha): c for alpha, c in pairs}
    return dict(sorted(out.items(), key=_revlex, reverse=True))


def all_schubert_key_expansions(
    n: int, progress: Callable[[int, int], object] | None = None
) -> list[dict[Composition, int]]:
    """The key expansion of S_w for every w in S_n, by the crystal route, in parallel.

    Parameters
    ----------
    n : int
        1 <= n <= 12.
    progress : callable, optional
        Called as ``progress(done, total)`` after each chunk of permutations.

    Returns
    -------
    list of dict
        Entry k is ``schubert_key_expansion(w)`` for the k-th permutation w of S_n in
        lexicographic order of its one-line notation (the order of druse.all_permutations).

    Raises
    ------
    TypeError, ValueError
        If n is not an integer in 1..12.
    druse.TooLargeError
        If the results would not fit the memory budget.

    Examples
    --------
    >>> from druse.schubert_keys import all_schubert_key_expansions
    >>> all_schubert_key_expansions(3)
    [{(0, 0, 0): 1}, {(0, 1, 0): 1}, {(1, 0, 0): 1}, {(1, 1, 0): 1}, {(2, 0, 0): 1}, {(2, 1, 0): 1}]
    """
    n = check_index(n, 1, 12, "n")
    total = math.factorial(n)
    check_budget(total * 200, f"the key expansions of all {total} permutations of S_{n}", "loop")
    limit = MEMORY_BUDGET // (64 * n)
    chunk = max(256, total // 100)
    out: list[dict[Composition, int]] = []
    for start in range(0, total, chunk):
        for pairs in _core.pipe_dream_keys_batch(n, start, min(chunk, total - start), limit):
            terms = {tuple(alpha): c for alpha, c in pairs}
            out.append(dict(sorted(terms.items(), key=_revlex, reverse=True)))
        if progress is not None:
            progress(len(out), total)
    return out


def _revlex(term: tuple[Composition, int]) -> Composition:
    return tuple(reversed(term[0]))


def stanley_schur_expansion(perm: Sequence[int]) -> dict[Composition, int]:
    """The Schur expansion F_w = sum c_lambda s_lambda of the Stanley symmetric function.

    c_lambda counts the Edelman-Greene tableaux of shape lambda (increasing tableaux whose row
    reading word is a reduced word of w^-1; Edelman-Greene, "Balanced tableaux", 1987), read here
    as the highest weight vertices of weight lambda of the crystal on decreasing factorizations
    into n - 1 factors (Morse-Schilling 2016), which has room for every shape: the columns of an
    increasing tableau with entries in 1..n-1 have at most n - 1 cells.

    Parameters
    ----------
    perm : sequence of int
        w in one-line notation, a permutation of 1..n.

    Returns
    -------
    dict
        partition lambda (no trailing zeros) -> c_lambda > 0, in decreasing lexicographic order.

    Examples
    --------
    >>> from druse.schubert_keys import stanley_schur_expansion
    >>> stanley_schur_expansion((3, 2, 1))
    {(2, 1): 1}
    >>> stanley_schur_expansion((2, 1, 4, 3))
    {(2,): 1, (1, 1): 1}
    """
    w = check_perm(perm, "perm")
    C = factorization_crystal(w, max(len(w) - 1, 1))
    weights = C.weights()
    out: dict[Composition, int] = {}
    for v in C.highest_weights():
        lam = tuple(int(x) for x in weights[v] if x > 0)
        out[lam] = out.get(lam, 0) + 1
    return dict(sorted(out.items(), reverse=True))
