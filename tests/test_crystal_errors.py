"""Bad input: a ValueError or TypeError naming the argument, never a crash, a panic or a hang."""

from __future__ import annotations

import contextlib
import subprocess
import sys
from typing import Any

import numpy as np
import pytest
from hypothesis import given
from hypothesis import strategies as st

import druse
from strategies import junk

NOT_PARTITIONS: list[tuple[Any, type[Exception], str]] = [
    ((2, 3), ValueError, "shape must be weakly decreasing"),
    ((1, 0, 1), ValueError, "shape must be weakly decreasing"),
    ((2, -1), ValueError, "shape must have non-negative parts"),
    ((-1,), ValueError, "shape must have non-negative parts"),
    ((2.0, 1), TypeError, r"shape\[0\] must be an integer"),
    ((2, 1.5), TypeError, r"shape\[1\] must be an integer"),
    ((True, 1), TypeError, r"shape\[0\] must be an integer"),
    ("21", TypeError, "shape must be a sequence of integers"),
    (b"\x02\x01", TypeError, "shape must be a sequence of integers"),
    (21, TypeError, "shape must be a sequence of integers"),
    (None, TypeError, "shape must be a sequence of integers"),
    ({2: 1}, TypeError, "shape must be a sequence of integers"),
    ((("2",),), TypeError, r"shape\[0\] must be an integer"),
]


@pytest.mark.parametrize(("shape", "error", "message"), NOT_PARTITIONS, ids=repr)
def test_shape_must_be_a_partition(shape: Any, error: type[Exception], message: str) -> None:
    with pytest.raises(error, match=message):
        druse.crystal(shape, 3)
    with pytest.raises(error, match=message):
        druse.count_tableaux(shape, 3)
    with pytest.raises(error, match=message):
        next(druse.iter_tableaux(shape, 3))


@pytest.mark.parametrize(
    ("n", "error", "message"),
    [
        (0, ValueError, "n must be a positive integer"),
        (-2, ValueError, "n must be a positive integer"),
        (3.0, TypeError, "n must be an integer"),
        ("3", TypeError, "n must be an integer"),
        (True, TypeError, "n must be an integer"),
        (None, TypeError, "n must be an integer"),
        (300, ValueError, r"n \b.*\b255\b"),  # one byte per entry
    ],
)
def test_n_must_be_a_positive_integer(n: Any, error: type[Exception], message: str) -> None:
    with pytest.raises(error, match=message):
        druse.crystal((2, 1), n)


def test_count_allows_no_letters_but_not_fewer() -> None:
    assert druse.count_tableaux((2, 1), 0) == 0
    with pytest.raises(ValueError, match="n must be non-negative"):
        druse.count_tableaux((2, 1), -1)
    half: Any = 2.5
    with pytest.raises(TypeError, match="n must be an integer"):
        druse.count_tableaux((2, 1), half)


@pytest.mark.parametrize("name", ["f", "e", "phi", "epsilon"])
def test_operator_index_in_range(name: str) -> None:
    C = druse.crystal((2, 1), 3)
    op = getattr(C, name)
    for i in (0, 3, -1, 2**70):
        with pytest.raises(ValueError, match=r"i must be in 1\.\.2"):
            op(i)
    not_ints: tuple[Any, ...] = (1.0, "1", True, None)
    for bad in not_ints:
        with pytest.raises(TypeError, match="i must be an integer"):
            op(bad)
    with pytest.raises(ValueError, match="i must be in"):
        getattr(druse.crystal((2,), 1), name)(1)  # GL_1 has no operators


@pytest.mark.parametrize(
    ("rows", "error", "message"),
    [
        ([[2, 1], [3]], ValueError, "rows must weakly increase"),
        ([[1, 2], [1]], ValueError, "columns must strictly increase"),
        ([[1, 1], [1]], ValueError, "columns must strictly increase"),
        ([[1, 4], [2]], ValueError, r"entries must be in 1\.\.3"),
        ([[0, 1], [2]], ValueError, r"entries must be in 1\.\.3"),
        ([[1, 1, 2]], ValueError, r"rows must have lengths \(2, 1\)"),
        ([[1, 1], [2, 3]], ValueError, r"rows must have lengths \(2, 1\)"),
        ([[1], [2], [3]], ValueError, r"rows must have lengths \(2, 1\)"),
        ([[1, 1.0], [2]], TypeError, r"rows\[0\]\[1\] must be an integer"),
        ([[1, True], [2]], TypeError, r"rows\[0\]\[1\] must be an integer"),
        ([[1, 1], "2"], TypeError, r"rows\[1\] must be a sequence"),
        ("112", TypeError, "rows must be a sequence of rows"),
        (None, TypeError, "rows must be a sequence of rows"),
    ],
)
def test_index_refuses_non_tableaux(rows: Any, error: type[Exception], message: str) -> None:
    with pytest.raises(error, match=message):
        druse.crystal((2, 1), 3).index(rows)


def test_tableau_vertex_in_range() -> None:
    C = druse.crystal((2, 1), 3)
    for v in (-1, 8, 2**70):
        with pytest.raises(ValueError, match=r"v must be in 0\.\.7"):
            C.tableau(v)
    not_ints: tuple[Any, ...] = (0.0, "0", False)
    for bad in not_ints:
        with pytest.raises(TypeError, match="v must be an integer"):
            C.tableau(bad)
    with pytest.raises(ValueError, match="v must be in"):
        druse.crystal((1, 1, 1), 2).tableau(0)  # the empty crystal has no vertex


@pytest.mark.parametrize(
    ("mask", "error", "message"),
    [
        (np.ones(7, dtype=bool), ValueError, r"mask must have shape \(8,\)"),
        (np.ones((8, 1), dtype=bool), ValueError, r"mask must have shape \(8,\)"),
        (np.ones(8, dtype=np.uint8), TypeError, "mask must be a boolean array"),
        (np.ones(8, dtype=np.int64), TypeError, "mask must be a boolean array"),
        ([1.0] * 8, TypeError, "mask must be a boolean array"),
    ],
    ids=["short", "2d", "uint8", "int64", "floats"],
)
def test_mask_must_be_boolean_per_vertex(mask: Any, error: type[Exception], message: str) -> None:
    with pytest.raises(error, match=message):
        druse.crystal((2, 1), 3).character(mask)


def test_too_large_names_the_size_and_the_stream() -> None:
    with pytest.raises(druse.TooLargeError, match="iter_tableaux") as caught:
        druse.crystal((6, 5, 4, 3, 2, 1), 12)  # 592344383488 tableaux (hook-content, EC2 7.21.4)
    assert isinstance(caught.value, ValueError)
    assert "592344383488" in str(caught.value)
    assert "TB" in str(caught.value)  # about 12.4 TB of cells


def test_too_large_beyond_float_range() -> None:
    # binom(1021, 511) * 511 cells is about 1e309 bytes, past the largest float
    with pytest.raises(druse.TooLargeError, match="iter_tableaux"):
        druse.crystal((511,), 511)


def test_streaming_arguments() -> None:
    two: Any = 2.0
    zero: Any = "0"
    with pytest.raises(ValueError, match="chunk_size must be a positive integer"):
        next(druse.iter_tableaux((2, 1), 3, chunk_size=0))
    with pytest.raises(TypeError, match="chunk_size must be an integer"):
        next(druse.iter_tableaux((2, 1), 3, chunk_size=two))
    with pytest.raises(ValueError, match="start must be non-negative"):
        next(druse.iter_tableaux((2, 1), 3, start=-1))
    with pytest.raises(TypeError, match="start must be an integer"):
        next(druse.iter_tableaux((2, 1), 3, start=zero))
    with pytest.raises(ValueError, match="n must be a positive integer"):
        next(druse.iter_tableaux((2, 1), 0))


def outcome_in_fresh_interpreter(call: str) -> str:
    """Run `call` in a new interpreter (so an abort cannot take the test run down with it)."""
    code = (
        "import druse\n"
        "try:\n"
        f"    {call}\n"
        "    print('returned')\n"
        "except (TypeError, ValueError) as error:\n"
        "    print('raised', type(error).__name__)\n"
    )
    done = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, timeout=120, check=False
    )
    assert done.returncode == 0, f"{call}: exit code {done.returncode}; {done.stderr[-400:]}"
    return done.stdout.strip()


@pytest.mark.parametrize(
    "call",
    [
        "druse.crystal((2**40, 2**40), 1)",  # more rows than n, so no count stops it first
        "next(druse.iter_tableaux((2**40,), 3))",
        "druse.crystal((2**66, 2**66), 1)",  # parts beyond 64 bits
        "next(druse.iter_tableaux((2**66,), 3))",
        "next(druse.iter_tableaux((2, 1), 3, chunk_size=2**70))",
        "druse.crystal((70000,), 2)",
    ],
)
def test_huge_parts_are_refused_cleanly(call: str) -> None:
    assert outcome_in_fresh_interpreter(call).startswith(("raised", "returned"))


small_or_junk = st.one_of(st.integers(-2, 10), junk())
shape_or_junk = st.one_of(st.lists(st.integers(-2, 1000), max_size=6), junk())


@given(shape_or_junk, small_or_junk)
def test_no_panic_on_junk(shape: Any, n: Any) -> None:
    # parts stay below 2**10 here: huge parts are tried one by one, in a fresh interpreter, above
    if _has_huge_part(shape):
        return
    # druse.InternalError (a RuntimeError) or any other exception fails the test
    count = None
    with contextlib.suppress(TypeError, ValueError):
        count = druse.count_tableaux(shape, n)
    if count is not None and 10**5 < count * max(sum(shape), 1) < 2**34:
        return  # a valid request that fits: materialising it tests nothing about junk
    with contextlib.suppress(TypeError, ValueError):
        druse.crystal(shape, n)


def _has_huge_part(x: Any) -> bool:
    if isinstance(x, (list, tuple)):
        return any(_has_huge_part(p) for p in x)
    return isinstance(x, int) and abs(x) > 2**10
