"""Reduced pipe dreams, reduced words, compatible sequences and Schubert polynomials, from the
definitions, slowly: nothing here imports druse.

- Pipe dreams: every set of l(w) cells of the staircase whose reading word (rows top to bottom,
  each right to left; the cell (r, c) reads r + c - 1) multiplies to w. A word of length l(w)
  that multiplies to w is reduced.
- Reduced words: a reduced word of w ends in a right descent d (w(d) > w(d+1)), and the rest is a
  reduced word of w s_d.
- Schubert polynomials by divided differences with sympy (Lascoux-Schutzenberger, "Polynomes de
  Schubert", 1982): S_{w0} = x1^{n-1} x2^{n-2} ... x_{n-1}, and S_w = d_i S_{w s_i} when
  w(i) < w(i+1), d_i f = (f - s_i f) / (x_i - x_{i+1}).
"""

from __future__ import annotations

import itertools
from functools import cache

import sympy  # type: ignore[import-untyped]

Perm = tuple[int, ...]
Cross = tuple[int, int]


def staircase(n: int) -> list[Cross]:
    """The cells (r, c), r + c <= n, in reading order: rows top to bottom, each right to left."""
    return [(r, c) for r in range(1, n) for c in range(n - r, 0, -1)]


def multiply(word: tuple[int, ...], n: int) -> Perm:
    """s_{a1} ... s_{ak} in one-line notation: each s_a on the right swaps positions a, a+1."""
    w = list(range(1, n + 1))
    for a in word:
        w[a - 1], w[a] = w[a], w[a - 1]
    return tuple(w)


def length(w: Perm) -> int:
    return sum(1 for a, b in itertools.combinations(range(len(w)), 2) if w[a] > w[b])


def mask(crosses: tuple[Cross, ...], n: int) -> int:
    """The shared encoding: the j-th cell in reading order is bit L-1-j."""
    cells = staircase(n)
    return sum(1 << (len(cells) - 1 - cells.index(x)) for x in crosses)


def pipe_dreams(w: Perm) -> list[tuple[Cross, ...]]:
    """All reduced pipe dreams of w, as sorted cross tuples, in ascending mask order."""
    n, size = len(w), length(w)
    found = []
    for subset in itertools.combinations(staircase(n), size):
        if multiply(tuple(r + c - 1 for r, c in subset), n) == w:
            found.append(tuple(sorted(subset)))
    return sorted(found, key=lambda x: mask(x, n))


@cache
def reduced_words(w: Perm) -> tuple[tuple[int, ...], ...]:
    if length(w) == 0:
        return ((),)
    out: list[tuple[int, ...]] = []
    for d in range(1, len(w)):
        if w[d - 1] > w[d]:
            v = list(w)
            v[d - 1], v[d] = v[d], v[d - 1]
            out.extend((*word, d) for word in reduced_words(tuple(v)))
    return tuple(out)


def compatible_sequences(w: Perm) -> list[tuple[tuple[int, ...], tuple[int, ...]]]:
    """Every (a, i): a a reduced word of w, i weakly increasing, 1 <= i_j <= a_j, and
    i_j < i_{j+1} when a_j < a_{j+1} (Billey-Jockusch-Stanley 1993), by trying every i."""
    out = []
    for a in reduced_words(w):
        for i in itertools.product(range(1, len(w)), repeat=len(a)):
            ok = all(i[j] <= a[j] for j in range(len(a))) and all(
                i[j] <= i[j + 1] and (a[j] > a[j + 1] or i[j] < i[j + 1]) for j in range(len(a) - 1)
            )
            if ok:
                out.append((a, i))
    return out


def symbols(n: int) -> tuple[sympy.Symbol, ...]:
    return tuple(sympy.symbols(f"x1:{n + 1}"))


@cache
def schubert(w: Perm) -> sympy.Expr:
    """S_w by divided differences downward from w0, with sympy."""
    n = len(w)
    x = symbols(n)
    ascent = next((i for i in range(1, n) if w[i - 1] < w[i]), None)
    if ascent is None:
        return sympy.Mul(*[x[k] ** (n - 1 - k) for k in range(n)])
    v = list(w)
    v[ascent - 1], v[ascent] = v[ascent], v[ascent - 1]
    f = sympy.expand(schubert(tuple(v)))
    xi, xj = x[ascent - 1], x[ascent]
    swapped = f.subs({xi: xj, xj: xi}, simultaneous=True)
    return sympy.expand(sympy.cancel((f - swapped) / (xi - xj)))
