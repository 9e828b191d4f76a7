"""Hypothesis strategies for the objects druse works with."""

from __future__ import annotations

import random
from typing import Any

from hypothesis import strategies as st

from druse.poly import Poly

Shape = tuple[int, ...]


@st.composite
def partitions(
    draw: st.DrawFn, max_size: int, max_rows: int | None = None, min_size: int = 0
) -> Shape:
    """A partition with min_size <= |lambda| <= max_size and at most max_rows rows.

    Parts are drawn largest first, each bounded by the previous part and the cells left, so
    every draw is a partition and shrinking goes towards small, short shapes.
    """
    rows_left = max_size if max_rows is None else max_rows
    size = draw(st.integers(min_size, max_size))
    parts: list[int] = []
    left = size
    while left > 0 and rows_left > 0:
        bound = min(left, parts[-1] if parts else left)
        low = -(-left // rows_left)  # the remaining rows must hold what is left
        if low > bound:
            break
        part = draw(st.integers(low, bound))
        parts.append(part)
        left -= part
        rows_left -= 1
    return tuple(parts)


@st.composite
def shapes_and_n(
    draw: st.DrawFn, max_size: int, max_n: int, min_n: int = 1, fits: bool = True
) -> tuple[Shape, int]:
    """(shape, n) with 1 <= min_n <= n <= max_n; if fits, the shape has at most n rows."""
    n = draw(st.integers(min_n, max_n))
    shape = draw(partitions(max_size, n if fits else None))
    return shape, n


def junk() -> st.SearchStrategy[Any]:
    """Arbitrary values that an argument checker must refuse or accept, never crash on."""
    scalars = st.one_of(
        st.none(),
        st.booleans(),
        st.integers(-(2**70), 2**70),
        st.floats(allow_nan=True, allow_infinity=True),
        st.text(max_size=4),
        st.binary(max_size=4),
        st.complex_numbers(allow_nan=False, allow_infinity=False),
    )
    return st.recursive(
        scalars,
        lambda inner: st.one_of(
            st.lists(inner, max_size=5),
            st.tuples(inner, inner),
            st.dictionaries(st.integers(0, 3), inner, max_size=2),
        ),
        max_leaves=8,
    )


def shape_like() -> st.SearchStrategy[Any]:
    """Sequences of integers, mostly small, sometimes huge or negative: near-miss partitions."""
    part = st.one_of(st.integers(-3, 12), st.integers(-(2**66), 2**66))
    return st.one_of(st.lists(part, max_size=6), st.tuples(part, part), junk())


@st.composite
def polys(draw: st.DrawFn, nvars: int, max_terms: int = 5) -> Poly:
    """Small Laurent polynomials whose coefficients reach past 2**64."""
    exps = st.tuples(*[st.integers(-2, 3)] * nvars)
    coeffs = st.one_of(st.integers(-3, 3), st.integers(-(2**80), 2**80))
    return Poly.from_dict(draw(st.dictionaries(exps, coeffs, max_size=max_terms)), nvars)


Perm = tuple[int, ...]


def random_perms(n: int, count: int, seed: int) -> list[Perm]:
    """`count` permutations of 1..n, drawn reproducibly from `seed`."""
    rng = random.Random(seed)
    out = []
    for _ in range(count):
        w = list(range(1, n + 1))
        rng.shuffle(w)
        out.append(tuple(w))
    return out
