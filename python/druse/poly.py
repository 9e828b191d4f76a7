"""Exact sparse polynomials in x1..xn (Laurent allowed) with integer coefficients of any size.

The multiplication kernels live in `druse._poly_mul`; reading and writing terms (text, dict,
JSON, sympy, LaTeX) in `druse._poly_text`.
"""

from __future__ import annotations

import numbers
from collections.abc import Callable, Iterator, Mapping, Sequence
from fractions import Fraction
from typing import Any, ClassVar

import numpy as np
import numpy.typing as npt

from druse._check import check_index, check_int, check_nonnegative_int
from druse._poly_mul import INT64_MAX, IntArray, group_sum, product_terms
from druse._poly_text import (
    coefficient,
    dict_terms,
    exponent_array,
    exponent_row,
    json_terms,
    latex_text,
    plain_text,
    sympy_expr,
    sympy_terms,
    text_terms,
)

__all__ = ["Poly"]

#: Terms shown by `_repr_latex_`; a notebook cell should not render ten thousand terms.
_LATEX_TERMS = 100


def _is_int(x: object) -> bool:
    return isinstance(x, numbers.Integral) and not isinstance(x, bool)


class Poly:
    """Exact sparse polynomial (Laurent allowed: exponents may be negative) in x1..x_nvars.

    Terms are kept in decreasing lexicographic order of their exponent vectors; coefficients are
    Python ints of any size. Instances are immutable and hashable.

    Parameters
    ----------
    data : str, int, Mapping or Poly
        Text such as ``'x1^2*x3 - 3*x2 + 5'`` (``**`` and ``x1^-1`` also read), a constant, or a
        mapping from exponent tuples to coefficients (as in `from_dict`).
    nvars : int
        Number of variables.

    Examples
    --------
    >>> p = Poly("x1 + x2", nvars=2)
    >>> p**2
    Poly('x1^2 + 2*x1*x2 + x2^2', nvars=2)
    >>> (p**2).coefficient((1, 1)), p(2, 3)
    (2, 5)
    """

    __slots__ = ("_coeffs", "_exps", "_nvars")
    __array_ufunc__: ClassVar[None] = None  # numpy scalars defer to our reflected operators
    _nvars: int
    _exps: IntArray
    _coeffs: tuple[int, ...]

    def __init__(
        self, data: str | int | np.integer[Any] | Mapping[Any, Any] | Poly, nvars: int
    ) -> None:
        n = check_nonnegative_int(nvars, "nvars")
        if isinstance(data, str):
            src = Poly._combine(*text_terms(data, n), n)
        elif isinstance(data, Poly):
            if data.nvars != n:
                raise ValueError(f"data has nvars={data.nvars} but nvars={n} was asked for")
            src = data
        elif isinstance(data, Mapping):
            src = Poly.from_dict(data, n)
        elif _is_int(data):
            src = Poly._constant(int(data), n)
        else:
            raise TypeError(f"data must be a str, int, mapping or Poly; got {type(data).__name__}")
        self._nvars, self._exps, self._coeffs = src._nvars, src._exps, src._coeffs

    # -- construction ------------------------------------------------------------------------

    @classmethod
    def _canonical(cls, exps: IntArray, coeffs: Sequence[int], nvars: int) -> Poly:
        """Wrap terms already in canonical form (distinct rows, decreasing, nonzero coeffs)."""
        self = object.__new__(cls)
        self._exps = np.array(exps, dtype=np.int64, order="C")  # a copy we own
        self._exps.flags.writeable = False
        self._nvars, self._coeffs = nvars, tuple(coeffs)
        return self

    @classmethod
    def _combine(cls, exps: IntArray, coeffs: Sequence[int], nvars: int) -> Poly:
        """Sum duplicate rows, drop zero coefficients, sort: validated int64 rows, Python ints."""
        rows, sums = group_sum(exps, np.array(coeffs, dtype=object).reshape(1, len(coeffs)))
        keep = sums[0] != 0
        return cls._canonical(rows[keep][::-1], sums[0, keep][::-1].tolist(), nvars)

    @classmethod
    def _from_arrays(
        cls,
        exps: npt.ArrayLike,
        coeffs: Sequence[int | np.integer[Any]] | npt.NDArray[np.integer[Any]],
        nvars: int,
    ) -> Poly:
        """Build from an exponent array (T, nvars) and T integer coefficients: sums duplicate
        exponent rows, drops zero coefficients, sorts canonically. Coefficients become Python ints
        (numpy ints accepted). A (0, nvars) array gives the zero polynomial."""
        n = check_nonnegative_int(nvars, "nvars")
        if isinstance(coeffs, np.ndarray) and coeffs.dtype.kind in "iu":
            values = coeffs.tolist()
        else:
            values = [coefficient(c, f"coeffs[{k}]") for k, c in enumerate(coeffs)]
        return cls._combine(exponent_array(exps, len(values), n), values, n)

    @classmethod
    def from_dict(cls, d: Mapping[Any, Any], nvars: int) -> Poly:
        """Polynomial from ``{exponent tuple: coefficient}``; zero coefficients are dropped.

        Raises
        ------
        TypeError
            If a key is not a tuple of integers or a value is not an integer (bool refused).
        ValueError
            If a key's length is not `nvars` or an exponent does not fit in int64.
        """
        n = check_nonnegative_int(nvars, "nvars")
        return cls._combine(*dict_terms(d, n), n)

    @classmethod
    def from_json(cls, obj: Mapping[str, Any]) -> Poly:
        """Inverse of `to_json`: ``{"nvars": n, "terms": [[[e1, ..., en], c], ...]}``.

        Terms may come in any order; zero coefficients are dropped, repeated exponents refused.
        """
        return cls._combine(*json_terms(obj))

    @classmethod
    def from_sympy(cls, expr: Any, symbols: Sequence[Any] | str) -> Poly:
        """Polynomial from a sympy expression that is a Laurent polynomial in `symbols`.

        Raises
        ------
        ValueError
            If a coefficient is not an integer, another symbol appears, or a factor is not an
            integer power of one of the symbols.
        """
        return cls._combine(*sympy_terms(expr, symbols))

    @classmethod
    def zero(cls, nvars: int) -> Poly:
        """The zero polynomial in `nvars` variables."""
        return cls._constant(0, check_nonnegative_int(nvars, "nvars"))

    @classmethod
    def one(cls, nvars: int) -> Poly:
        """The constant 1 in `nvars` variables."""
        return cls._constant(1, check_nonnegative_int(nvars, "nvars"))

    @classmethod
    def _constant(cls, c: int, n: int) -> Poly:
        return cls._canonical(np.zeros((1 if c else 0, n), dtype=np.int64), [c] if c else [], n)

    @classmethod
    def monomial(cls, exps: Sequence[int] | npt.NDArray[np.integer[Any]], coeff: int = 1) -> Poly:
        """``coeff * x1^e1 * ... * xn^en`` with n = len(exps)."""
        row = exponent_row(exps, None, "exps")
        c = coefficient(coeff, "coeff")
        return cls._canonical(
            np.array([row] if c else [], dtype=np.int64).reshape(1 if c else 0, len(row)),
            [c] if c else [],
            len(row),
        )

    @classmethod
    def variable(cls, i: int, nvars: int) -> Poly:
        """The variable x_i (1-based) among x1..x_nvars."""
        n = check_nonnegative_int(nvars, "nvars")
        row = [0] * n
        row[check_index(i, 1, n, "i") - 1] = 1
        return cls._canonical(np.array([row], dtype=np.int64), [1], n)

    # -- inspection --------------------------------------------------------------------------

    @property
    def nvars(self) -> int:
        """Number of variables."""
        return self._nvars

    @property
    def exponents(self) -> IntArray:
        """Read-only int64 array (terms, nvars) of exponent rows, in canonical order."""
        return self._exps

    @property
    def coefficients(self) -> tuple[int, ...]:
        """Coefficients aligned with the rows of `exponents`."""
        return self._coeffs

    def __len__(self) -> int:
        return len(self._coeffs)

    def __bool__(self) -> bool:
        return bool(self._coeffs)

    def __iter__(self) -> Iterator[tuple[tuple[int, ...], int]]:
        """(exponent tuple, coefficient) pairs in canonical order."""
        return zip(map(tuple, self._exps.tolist()), self._coeffs, strict=True)

    def coefficient(self, exps: Sequence[int] | npt.NDArray[np.integer[Any]]) -> int:
        """The coefficient of ``x^exps`` (0 if that monomial does not occur)."""
        row = np.array(exponent_row(exps, self._nvars, "exps"), dtype=np.int64)
        hits = np.flatnonzero(np.all(self._exps == row, axis=1))
        return self._coeffs[hits[0]] if len(hits) else 0

    def degree(self, i: int | None = None) -> int:
        """Largest total degree of a term, or the largest exponent of x_i (1-based) if given.

        Raises
        ------
        ValueError
            For the zero polynomial, which has no degree.
        """
        if not self:
            raise ValueError("the zero polynomial has no degree")
        if i is None:
            return max(map(sum, self._exps.tolist()))
        return int(self._exps[:, check_index(i, 1, self._nvars, "i") - 1].max())

    def is_homogeneous(self) -> bool:
        """True if all terms have the same total degree (so is the zero polynomial)."""
        return len(set(map(sum, self._exps.tolist()))) <= 1

    def _constant_value(self) -> int | None:
        if not self._coeffs:
            return 0
        if len(self._coeffs) == 1 and not self._exps.any():
            return self._coeffs[0]
        return None

    # -- conversion --------------------------------------------------------------------------

    def to_dict(self) -> dict[tuple[int, ...], int]:
        """``{exponent tuple: coefficient}`` with nonzero Python-int coefficients."""
        return dict(self)

    def to_json(self) -> dict[str, Any]:
        """JSON-able ``{"nvars": n, "terms": [[[e1, ..., en], c], ...]}`` in canonical order."""
        return {
            "nvars": self._nvars,
            "terms": [[r, c] for r, c in zip(self._exps.tolist(), self._coeffs, strict=True)],
        }

    def to_sympy(self, symbols: Sequence[Any] | str | None = None) -> Any:
        """The polynomial as a sympy expression in `symbols` (default x1..xn)."""
        return sympy_expr(self._exps, self._coeffs, symbols, self._nvars)

    def __reduce__(self) -> tuple[Callable[[Mapping[str, Any]], Poly], tuple[dict[str, Any]]]:
        return (Poly.from_json, (self.to_json(),))

    # -- arithmetic --------------------------------------------------------------------------

    def __eq__(self, other: object) -> bool:
        if isinstance(other, Poly):
            return (
                self._nvars == other._nvars
                and self._coeffs == other._coeffs
                and np.array_equal(self._exps, other._exps)
            )
        if _is_int(other):
            return self._constant_value() == other
        return NotImplemented

    def __hash__(self) -> int:
        c = self._constant_value()  # equal to an int, so it must hash like that int
        return hash(c) if c is not None else hash((self._nvars, self._coeffs, self._exps.tobytes()))

    def _operand(self, other: object, op: str) -> Poly | None:
        if isinstance(other, Poly):
            if other._nvars != self._nvars:
                raise ValueError(
                    f"cannot {op} polynomials in different numbers of variables: "
                    f"nvars={self._nvars} and nvars={other._nvars}"
                )
            return other
        if _is_int(other):
            return Poly._constant(check_int(other, "other"), self._nvars)
        return None

    def __add__(self, other: object) -> Poly:
        q = self._operand(other, "add")
        if q is None:
            return NotImplemented
        exps = np.concatenate((self._exps, q._exps))
        return Poly._combine(exps, self._coeffs + q._coeffs, self._nvars)

    __radd__ = __add__

    def __neg__(self) -> Poly:
        return Poly._canonical(self._exps, [-c for c in self._coeffs], self._nvars)

    def __pos__(self) -> Poly:
        return self

    def __sub__(self, other: object) -> Poly:
        q = self._operand(other, "subtract")
        return NotImplemented if q is None else self + (-q)

    def __rsub__(self, other: object) -> Poly:
        q = self._operand(other, "subtract")
        return NotImplemented if q is None else q + (-self)

    def __mul__(self, other: object) -> Poly:
        q = self._operand(other, "multiply")
        if q is None:
            return NotImplemented
        if not self or not q:
            return Poly.zero(self._nvars)
        exps, coeffs = product_terms(self, q)
        return Poly._canonical(exps[::-1], coeffs[::-1].tolist(), self._nvars)

    __rmul__ = __mul__

    def __pow__(self, k: object) -> Poly:
        """``self**k`` for k >= 0 by repeated squaring (D. E. Knuth, TAOCP vol. 2, 4.6.3, 1969)."""
        k = check_nonnegative_int(k, "exponent k")
        if len(self) == 1:  # a monomial: no products to sort
            if max(-int(self._exps.min(initial=0)), int(self._exps.max(initial=0))) * k > INT64_MAX:
                raise ValueError(f"the exponents of this power (k={k}) would leave the int64 range")
            return Poly._canonical(self._exps * k, [self._coeffs[0] ** k], self._nvars)
        result, base = Poly.one(self._nvars), self
        while k:  # binary powering: O(log k) products
            if k & 1:
                result = result * base
            k >>= 1
            if k:
                base = base * base
        return result

    def __copy__(self) -> Poly:
        return self

    def __deepcopy__(self, memo: dict[int, Any]) -> Poly:
        return self

    def __call__(self, *values: Any) -> Any:
        """Evaluate at ``x_i = values[i-1]``; ints and Fractions give exact ints or Fractions.

        Values may be anything with + * ** (a sympy expression, another Poly). An int raised to a
        negative power becomes a Fraction, so that results stay exact.
        """
        if len(values) != self._nvars:
            raise ValueError(f"expected {self._nvars} values, one per variable; got {len(values)}")
        lowest = self._exps.min(axis=0).tolist() if self else [0] * self._nvars
        points = list(values)
        for j, v in enumerate(values):
            if isinstance(v, bool):
                raise TypeError(f"values[{j}] must be a number, not bool")
            if lowest[j] < 0 and (_is_int(v) or isinstance(v, Fraction)) and v == 0:
                raise ValueError(f"values[{j}] is 0 but x{j + 1} has negative exponent {lowest[j]}")
            if lowest[j] < 0 and _is_int(v):
                points[j] = Fraction(int(v))
        powers: dict[tuple[int, int], Any] = {}
        total: Any = 0
        for row, c in zip(self._exps.tolist(), self._coeffs, strict=True):
            term: Any = c
            for j, e in enumerate(row):
                if e:
                    if (j, e) not in powers:
                        powers[j, e] = points[j] ** e
                    term = term * powers[j, e]
            total = total + term
        if isinstance(total, Fraction) and total.denominator == 1 and all(map(_is_int, values)):
            return int(total)
        return total

    # -- display -----------------------------------------------------------------------------

    def __str__(self) -> str:
        return plain_text(self._exps, self._coeffs)

    def __repr__(self) -> str:
        return f"Poly({str(self)!r}, nvars={self._nvars})"

    def latex(self, max_terms: int | None = None) -> str:
        """LaTeX source without dollars, e.g. ``x_{1}^{2} x_{3} + 3 x_{2}``; may be truncated."""
        return latex_text(self._exps, self._coeffs, max_terms)

    def _repr_latex_(self) -> str:
        return f"$\\displaystyle {self.latex(_LATEX_TERMS)}$"
