"""Reading and writing the terms of a `Poly`: checked exponent rows and coefficients, dict and
JSON input, polynomial text, sympy expressions, and plain or LaTeX output.

Readers return exponent rows (validated, int64-sized) and Python-int coefficients, not yet
summed or sorted; `Poly` puts them in canonical form.
"""

from __future__ import annotations

import re
from collections.abc import Callable, Mapping, Sequence
from typing import Any

import numpy as np
import numpy.typing as npt

from druse._check import check_int, check_nonnegative_int
from druse._poly_mul import INT64_MAX, INT64_MIN, IntArray

_FACTOR = re.compile(r"(\d+)|x(\d+)(?:(?:\^|\*\*)(\(-?\d+\)|-?\d+))?")


def _sympy() -> Any:
    """Import sympy on first use: it is slow to import and only conversions need it."""
    import sympy  # type: ignore[import-untyped]

    return sympy


def coefficient(value: object, name: str) -> int:
    """`value` as an int; TypeError unless it is an integer (bool refused)."""
    return value if type(value) is int else check_int(value, name)


def exponent_row(x: object, n: int | None, name: str) -> tuple[int, ...]:
    """A sequence of int64-sized integers (of length n unless n is None), as a tuple."""
    if isinstance(x, np.ndarray) and x.ndim == 1:
        x = x.tolist()
    if isinstance(x, (str, bytes)) or not isinstance(x, Sequence):
        raise TypeError(f"{name} must be a tuple of integers; got {type(x).__name__} {x!r}")
    if n is not None and len(x) != n:
        raise ValueError(f"{name} must have length nvars={n}; got {x!r} of length {len(x)}")
    row = tuple(e if type(e) is int else check_int(e, f"{name}[{k}]") for k, e in enumerate(x))
    if any(not INT64_MIN <= e <= INT64_MAX for e in row):
        raise ValueError(f"{name} must hold exponents in the int64 range; got {x!r}")
    return row


def exponent_array(exps: npt.ArrayLike, rows: int, n: int) -> IntArray:
    """`exps` as a fresh int64 array of shape (rows, n), every entry checked to fit."""
    arr = np.asarray(exps)
    if arr.ndim == 1 and arr.size == 0:
        arr = arr.reshape(0, n)
    if arr.shape != (rows, n):
        raise ValueError(
            f"exps must have shape (len(coeffs), nvars) = {(rows, n)}; got {arr.shape}"
        )
    if arr.size == 0:
        return np.zeros((rows, n), dtype=np.int64)
    if arr.dtype.kind == "O":
        flat = [exponent_row(r, n, "exps row") for r in arr.tolist()]
        return np.array(flat, dtype=np.int64).reshape(rows, n)
    if arr.dtype.kind not in "iu":
        raise TypeError(f"exps must hold integers; got dtype {arr.dtype}")
    if arr.dtype.kind == "u" and int(arr.max()) > INT64_MAX:
        raise ValueError(f"exps must hold exponents in the int64 range; got {int(arr.max())}")
    return np.array(arr, dtype=np.int64)


def _row_array(rows: Sequence[Sequence[int]], n: int) -> IntArray:
    return np.array(rows, dtype=np.int64).reshape(len(rows), n)


def dict_terms(d: Mapping[Any, Any], n: int) -> tuple[IntArray, list[int]]:
    """Exponent rows and coefficients of ``{exponent tuple: coefficient}``."""
    if not isinstance(d, Mapping):
        raise TypeError(f"d must be a mapping from exponent tuples to ints; got {type(d).__name__}")
    rows, coeffs = [], []
    for key, value in d.items():
        if not isinstance(key, tuple):
            raise TypeError(f"keys of d must be tuples of {n} integers; got {key!r}")
        rows.append(exponent_row(key, n, "key of d"))
        coeffs.append(coefficient(value, f"d[{key!r}]"))
    return _row_array(rows, n), coeffs


def json_terms(obj: Mapping[str, Any]) -> tuple[IntArray, list[int], int]:
    """Exponent rows, coefficients and nvars of ``{"nvars": n, "terms": [[exps, c], ...]}``."""
    if not isinstance(obj, Mapping):
        raise TypeError(
            f"obj must be a dict with keys 'nvars' and 'terms'; got {type(obj).__name__}"
        )
    if set(obj) != {"nvars", "terms"}:
        raise ValueError(f"obj must have exactly the keys 'nvars' and 'terms'; got {list(obj)}")
    n = check_nonnegative_int(obj["nvars"], "obj['nvars']")
    terms = obj["terms"]
    if not isinstance(terms, (list, tuple)):
        raise TypeError(
            f"obj['terms'] must be a list of [exponents, coefficient] pairs; got {terms!r}"
        )
    seen: dict[tuple[int, ...], int] = {}
    coeffs = []
    for k, term in enumerate(terms):
        if not isinstance(term, (list, tuple)):
            raise TypeError(
                f"obj['terms'][{k}] must be a list [exponents, coefficient]; got {term!r}"
            )
        if len(term) != 2:
            raise ValueError(
                f"obj['terms'][{k}] must be a pair [exponents, coefficient]; got {term!r}"
            )
        row = exponent_row(term[0], n, f"obj['terms'][{k}][0]")
        if row in seen:
            raise ValueError(f"obj['terms'] lists exponents {list(row)} twice ({seen[row]}, {k})")
        seen[row] = k
        coeffs.append(coefficient(term[1], f"obj['terms'][{k}][1]"))
    return _row_array(list(seen), n), coeffs, n


def text_terms(text: str, n: int) -> tuple[IntArray, list[int]]:
    """Read 'x1^2*x3 - 3*x2 + 5' (also '**', 'x1^-1', 'x1^(-1)') into exponent rows, coeffs."""
    s = "".join(text.split())
    if not s:
        raise ValueError("polynomial text is empty; write '0' for the zero polynomial")
    rows: list[list[int]] = []
    coeffs: list[int] = []
    pos = 0
    while pos < len(s):
        coeff, row = 1, [0] * n
        if s[pos] in "+-":
            coeff, pos = (-1 if s[pos] == "-" else 1), pos + 1
        while True:
            m = _FACTOR.match(s, pos)
            if m is None:
                raise ValueError(
                    f"cannot read {text!r}: expected an integer or x<i>[^e] at {s[pos:]!r}"
                )
            if m.group(1):
                coeff *= int(m.group(1))
            else:
                i = int(m.group(2))
                if not 1 <= i <= n:
                    raise ValueError(f"variable x{i} in {text!r} is not among x1..x{n} (nvars={n})")
                row[i - 1] += int(m.group(3).strip("()")) if m.group(3) else 1
            pos = m.end()
            if not s.startswith("*", pos):
                break
            pos += 1
        if pos < len(s) and s[pos] not in "+-":
            rule = " (coefficients and exponents must be integers)" if s[pos] in "./" else ""
            raise ValueError(f"cannot read {text!r}: expected '+', '-' or '*' at {s[pos:]!r}{rule}")
        rows.append(list(exponent_row(row, None, f"exponents in {text!r}")))
        coeffs.append(coeff)
    return _row_array(rows, n), coeffs


def _symbols(symbols: Sequence[Any] | str | None, n: int | None) -> tuple[Any, ...]:
    """Distinct sympy Symbols (strings become Symbols); None means x1..xn."""
    sympy = _sympy()
    if symbols is None:
        return tuple(sympy.symbols(f"x1:{n + 1}")) if n else ()
    if isinstance(symbols, str):
        symbols = sympy.symbols(symbols, seq=True)
    if not isinstance(symbols, Sequence):
        raise TypeError(
            f"symbols must be a sequence of sympy Symbols; got {type(symbols).__name__}"
        )
    gens = tuple(sympy.Symbol(g) if isinstance(g, str) else g for g in symbols)
    for g in gens:
        if not isinstance(g, sympy.Symbol):
            raise TypeError(f"symbols must hold sympy Symbols; got {type(g).__name__} {g!r}")
    if len(set(gens)) != len(gens):
        raise ValueError(f"symbols must be distinct; got {gens}")
    if n is not None and len(gens) != n:
        raise ValueError(f"symbols must have length nvars={n}; got {len(gens)} symbols {gens}")
    return gens


def sympy_terms(expr: Any, symbols: Sequence[Any] | str) -> tuple[IntArray, list[int], int]:
    """Exponent rows, coefficients and nvars of a Laurent polynomial in `symbols`."""
    sympy = _sympy()
    gens = _symbols(symbols, None)
    if isinstance(expr, sympy.Poly):
        expr = expr.as_expr()
    try:
        expr = sympy.sympify(expr, strict=True)
    except sympy.SympifyError:
        raise TypeError(f"expr must be a sympy expression; got {type(expr).__name__}") from None
    if not isinstance(expr, sympy.Expr):
        raise TypeError(f"expr must be a sympy expression; got {type(expr).__name__} {expr}")
    try:  # reading an expanded expression directly is much faster than sympy.expand
        rows, coeffs = _expanded_terms(expr, gens)
    except ValueError:
        rows, coeffs = _expanded_terms(sympy.expand(expr), gens)
    return _row_array(rows, len(gens)), coeffs, len(gens)


def _expanded_terms(expr: Any, gens: tuple[Any, ...]) -> tuple[list[tuple[int, ...]], list[int]]:
    """Exponent rows and coefficients of a sum of integer multiples of monomials in `gens`."""
    sympy = _sympy()
    index = {g: j for j, g in enumerate(gens)}
    rows, coeffs = [], []
    for term in sympy.Add.make_args(expr):
        coeff, rest = term.as_coeff_Mul()
        row = [0] * len(gens)
        for factor in sympy.Mul.make_args(rest):
            if factor == 1:
                continue
            base, power = factor.as_base_exp()
            if base not in index or not power.is_Integer:
                raise _sympy_factor_error(factor, term, gens)
            row[index[base]] += int(power)
        if not coeff.is_Integer:
            raise ValueError(f"expr must have integer coefficients; term {term} has {coeff}")
        rows.append(exponent_row(row, None, f"exponents of {term}"))
        coeffs.append(int(coeff))
    return rows, coeffs


def _sympy_factor_error(factor: Any, term: Any, gens: tuple[Any, ...]) -> ValueError:
    strangers = factor.free_symbols - set(gens)
    if strangers:
        names = ", ".join(sorted(map(str, strangers)))
        return ValueError(
            f"expr must involve only the symbols {gens}; term {term} contains {names}"
        )
    if not factor.free_symbols:
        return ValueError(
            f"expr must have integer coefficients; term {term} has the factor {factor}"
        )
    return ValueError(
        f"expr must be a Laurent polynomial in {gens} (integer powers of the symbols only); "
        f"term {term} has the factor {factor} (sympy.cancel may turn a quotient into one)"
    )


def sympy_expr(
    exps: IntArray, coeffs: Sequence[int], symbols: Sequence[Any] | str | None, n: int
) -> Any:
    """The sum of ``c * x^row`` over the terms, as a sympy expression in `symbols`."""
    sympy = _sympy()
    gens = _symbols(symbols, n)
    powers: dict[tuple[int, int], Any] = {}  # shared powers save most of sympy's work
    terms = []
    for row, c in zip(exps.tolist(), coeffs, strict=True):
        for j, e in enumerate(row):
            if e and (j, e) not in powers:
                powers[j, e] = gens[j] ** e
        terms.append(sympy.Mul(sympy.Integer(c), *[powers[j, e] for j, e in enumerate(row) if e]))
    return sympy.Add(*terms)


def _format_terms(
    exps: IntArray,
    coeffs: Sequence[int],
    power: Callable[[int, int], str],
    times: str,
    max_terms: int | None,
) -> str:
    """Signed terms joined by ' + ' / ' - '; `power(i, e)` writes x_i^e, `times` joins factors."""
    shown = zip(exps[:max_terms].tolist(), coeffs[:max_terms], strict=True)
    parts = []
    for k, (row, c) in enumerate(shown):
        factors = [power(j + 1, e) for j, e in enumerate(row) if e]
        body = times.join(([str(abs(c))] if abs(c) != 1 or not factors else []) + factors)
        parts.append(
            ("-" if c < 0 else "") + body if k == 0 else f" {'-' if c < 0 else '+'} {body}"
        )
    return "".join(parts) or "0"


def plain_text(exps: IntArray, coeffs: Sequence[int]) -> str:
    """Text that `text_terms` reads back, e.g. ``x1^2*x3 + 3*x2``."""
    return _format_terms(exps, coeffs, lambda i, e: f"x{i}" if e == 1 else f"x{i}^{e}", "*", None)


def latex_text(exps: IntArray, coeffs: Sequence[int], max_terms: int | None) -> str:
    """LaTeX source of the first `max_terms` terms (all if None), noting how many there are."""
    text = _format_terms(
        exps, coeffs, lambda i, e: f"x_{{{i}}}" if e == 1 else f"x_{{{i}}}^{{{e}}}", " ", max_terms
    )
    if max_terms is not None and len(coeffs) > max_terms:
        text += rf" + \cdots \quad ({len(coeffs)}\ \text{{terms}})"
    return text
