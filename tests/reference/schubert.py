"""Schubert polynomials from their definition, slowly and obviously, plus the combinatorics the
tests need (lengths, codes, reduced words).

Definition (Lascoux and Schutzenberger, "Polynomes de Schubert", 1982; Macdonald, Notes on
Schubert Polynomials, 1991, (4.1)): S_(w0) = x1^(n-1) ... x_(n-1) and S_(w s_i) = d_i S_w
whenever l(w s_i) < l(w), d_i f = (f - s_i f) / (x_i - x_(i+1)).

Two engines: plain dicts {exponents: coefficient} with d_i from the geometric sum, and sympy
(exact polynomial division by x_i - x_(i+1), remainder checked zero) as an independent one.
"""

from __future__ import annotations

import itertools
from collections import defaultdict
from typing import Any

import sympy  # type: ignore[import-untyped]

Perm = tuple[int, ...]
Terms = dict[tuple[int, ...], int]


def length(w: Perm) -> int:
    """Number of inversions."""
    return sum(1 for a, b in itertools.combinations(range(len(w)), 2) if w[a] > w[b])


def code(w: Perm) -> tuple[int, ...]:
    """The Lehmer code: c_a = #{b > a : w(b) < w(a)}."""
    return tuple(sum(1 for b in range(a + 1, len(w)) if w[b] < w[a]) for a in range(len(w)))


def times_s(w: Perm, i: int) -> Perm:
    """w s_i (i 1-based): swap the entries in positions i, i+1."""
    v = list(w)
    v[i - 1], v[i] = v[i], v[i - 1]
    return tuple(v)


def path_from_longest(w: Perm) -> list[int]:
    """Letters i_1, i_2, ... with w = w0 s_(i_1) s_(i_2) ..., each step one shorter."""
    up: list[int] = []
    v = w
    while True:
        ascents = [i for i in range(1, len(v)) if v[i - 1] < v[i]]
        if not ascents:
            return up[::-1]
        up.append(ascents[0])
        v = times_s(v, ascents[0])


def reduced_words(w: Perm) -> list[tuple[int, ...]]:
    """All reduced words (a_1, ..., a_l) of w = s_(a_1) ... s_(a_l): peel right descents."""
    if length(w) == 0:
        return [()]
    out: list[tuple[int, ...]] = []
    for i in range(1, len(w)):
        if w[i - 1] > w[i]:
            out.extend((*a, i) for a in reduced_words(times_s(w, i)))
    return out


def divided_difference(f: Terms, i: int) -> Terms:
    """d_i on a dict, monomial by monomial: for a > b, d_i x_i^a x_(i+1)^b is the sum of
    x_i^p x_(i+1)^(a+b-1-p) over b <= p < a; for a < b it is minus the sum over a <= p < b;
    zero for a = b (the geometric sum (x^m - y^m) / (x - y))."""
    out: defaultdict[tuple[int, ...], int] = defaultdict(int)
    j = i - 1
    for e, c in f.items():
        a, b = e[j], e[j + 1]
        lo, hi, sign = (b, a, 1) if a > b else (a, b, -1)
        for p in range(lo, hi):
            out[(*e[:j], p, a + b - 1 - p, *e[j + 2 :])] += sign * c
    return {e: c for e, c in out.items() if c}


def schubert_dict(w: Perm) -> Terms:
    """S_w by the definition on dicts."""
    n = len(w)
    f: Terms = {tuple(range(n - 1, -1, -1)): 1}
    for i in path_from_longest(w):
        f = divided_difference(f, i)
    return f


def sympy_divided_difference(f: Any, xs: list[Any], i: int) -> Any:
    """d_i f for a sympy Poly f: the exact quotient of f - s_i f by x_i - x_(i+1)."""
    a, b = xs[i - 1], xs[i]
    swapped = sympy.Poly(f.as_expr().subs({a: b, b: a}, simultaneous=True), *xs)
    quotient, remainder = sympy.div(f - swapped, sympy.Poly(a - b, *xs))
    assert remainder.is_zero
    return quotient


def sympy_schubert(w: Perm) -> Terms:
    """S_w by the definition in sympy, as {exponents: coefficient}."""
    n = len(w)
    xs = list(sympy.symbols(f"x1:{n + 1}"))
    f = sympy.Poly(sympy.prod(x ** (n - 1 - k) for k, x in enumerate(xs)), *xs)
    for i in path_from_longest(w):
        f = sympy_divided_difference(f, xs, i)
    return {tuple(e): int(c) for e, c in f.terms()}


def sympy_all_schuberts(n: int) -> dict[Perm, Terms]:
    """Every S_w of S_n in sympy, top down, one division per permutation."""
    xs = list(sympy.symbols(f"x1:{n + 1}"))
    top = tuple(range(n, 0, -1))
    polys = {top: sympy.Poly(sympy.prod(x ** (n - 1 - k) for k, x in enumerate(xs)), *xs)}
    for level in range(length(top) - 1, -1, -1):
        for w in itertools.permutations(range(1, n + 1)):
            if length(w) == level:
                i = next(i for i in range(1, n) if w[i - 1] < w[i])
                polys[w] = sympy_divided_difference(polys[times_s(w, i)], xs, i)
    return {w: {tuple(e): int(c) for e, c in f.terms()} for w, f in polys.items()}
