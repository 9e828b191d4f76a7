"""Slow, obvious oracles for permutations: reduced words, Edelman-Greene insertion, Schubert
polynomials by sympy divided differences, Schur polynomials by the bialternant formula."""

from __future__ import annotations

import itertools
from collections import Counter
from functools import cache

import sympy  # type: ignore[import-untyped]

Perm = tuple[int, ...]


@cache
def reduced_words(w: Perm) -> tuple[tuple[int, ...], ...]:
    """Every reduced word (i1, ..., il) of w = s_i1 ... s_il: the last letter is a right
    descent i (w(i) > w(i+1)), and the rest is a reduced word of w s_i."""
    if all(w[k] < w[k + 1] for k in range(len(w) - 1)):
        return ((),)
    out = []
    for i in range(1, len(w)):
        if w[i - 1] > w[i]:
            v = list(w)
            v[i - 1], v[i] = v[i], v[i - 1]
            out += [(*word, i) for word in reduced_words(tuple(v))]
    return tuple(out)


def edelman_greene_insert(word: tuple[int, ...]) -> tuple[tuple[int, ...], ...]:
    """The insertion tableau P of a reduced word (Edelman-Greene, "Balanced tableaux", 1987):
    x enters a row; if it is larger than every entry it is appended; else, y being the smallest
    entry > x, if y = x + 1 and x is in the row the row stays and x + 1 moves on, otherwise y
    is replaced by x and moves on to the next row."""
    rows: list[list[int]] = []
    for letter in word:
        x = letter
        for row in rows:
            bigger = [y for y in row if y > x]
            if not bigger:
                row.append(x)
                break
            y = min(bigger)
            if not (y == x + 1 and x in row):
                row[row.index(y)] = x
            x = y
        else:
            rows.append([x])
    return tuple(tuple(r) for r in rows)


def inverse(w: Perm) -> Perm:
    out = [0] * len(w)
    for position, value in enumerate(w, start=1):
        out[value - 1] = position
    return tuple(out)


def edelman_greene_shapes(w: Perm) -> Counter[tuple[int, ...]]:
    """Shape -> number of Edelman-Greene tableaux (distinct insertion tableaux) of w."""
    tableaux = {edelman_greene_insert(a) for a in reduced_words(w)}
    return Counter(tuple(len(r) for r in t) for t in tableaux)


def symbols(n: int) -> list[sympy.Symbol]:
    return list(sympy.symbols(f"x1:{n + 1}"))


def schuberts_by_sympy(n: int) -> dict[Perm, sympy.Expr]:
    """S_w for every w in S_n: S_w0 = x1^(n-1) ... x_(n-1), S_(w s_i) = d_i S_w when
    w(i) > w(i+1), d_i f = (f - s_i f) / (x_i - x_(i+1)) (Lascoux-Schutzenberger 1982;
    Macdonald, Notes on Schubert Polynomials, 1991, (4.1)), computed with sympy."""
    xs = symbols(n)
    w0 = tuple(range(n, 0, -1))
    out = {w0: sympy.Mul(*[xs[j] ** (n - 1 - j) for j in range(n)])}
    todo = [w0]
    while todo:
        w = todo.pop()
        for i in range(1, n):
            if w[i - 1] > w[i]:
                v = list(w)
                v[i - 1], v[i] = v[i], v[i - 1]
                if tuple(v) not in out:
                    f = out[w]
                    swapped = f.subs({xs[i - 1]: xs[i], xs[i]: xs[i - 1]}, simultaneous=True)
                    out[tuple(v)] = sympy.expand(sympy.cancel((f - swapped) / (xs[i - 1] - xs[i])))
                    todo.append(tuple(v))
    return out


def schur_by_sympy(shape: tuple[int, ...], n: int) -> sympy.Expr:
    """s_lambda(x1..xn) = det(x_i^(lambda_j + n - j)) / det(x_i^(n - j)) (Jacobi's bialternant
    formula; Macdonald, Symmetric Functions and Hall Polynomials, 1995, I (3.1))."""
    xs = symbols(n)
    lam = list(shape) + [0] * (n - len(shape))
    top = sympy.Matrix(n, n, lambda i, j: xs[i] ** (lam[j] + n - 1 - j)).det()
    bottom = sympy.Matrix(n, n, lambda i, j: xs[i] ** (n - 1 - j)).det()
    return sympy.expand(sympy.cancel(top / bottom))


def all_perms(n: int) -> list[Perm]:
    return list(itertools.permutations(range(1, n + 1)))
