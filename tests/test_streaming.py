"""Streaming tableaux in chunks: the same rows, in the same order, as the materialised crystal."""

from __future__ import annotations

from itertools import islice, pairwise

import numpy as np
import numpy.typing as npt
import pytest

import druse
from reference import tableaux as ref

Shape = tuple[int, ...]
CASES = [((3, 1), 3), ((4, 2, 1), 5), ((3, 3, 2), 4), ((2,), 1), ((), 3), ((1, 1, 1), 2)]


def streamed(shape: Shape, n: int, chunk_size: int, start: int = 0) -> npt.NDArray[np.uint8]:
    chunks = list(druse.iter_tableaux(shape, n, chunk_size=chunk_size, start=start))
    for k, block in enumerate(chunks):
        assert block.dtype == np.uint8
        assert not block.flags.writeable
        assert block.shape[1] == sum(shape)
        assert len(block) == chunk_size or k == len(chunks) - 1  # only the last one is short
    if not chunks:
        return np.zeros((0, sum(shape)), dtype=np.uint8)
    return np.concatenate(chunks)


def as_rows(flat: list[int], shape: Shape) -> ref.Tableau:
    rows, at = [], 0
    for length in shape:
        rows.append(tuple(flat[at : at + length]))
        at += length
    return tuple(rows)


@pytest.mark.parametrize(("shape", "n"), CASES, ids=str)
@pytest.mark.parametrize("chunk_size", [1, 7, 1 << 16])
def test_chunks_concatenate_to_the_crystal(shape: Shape, n: int, chunk_size: int) -> None:
    assert np.array_equal(streamed(shape, n, chunk_size), druse.crystal(shape, n).tableaux())


@pytest.mark.parametrize(("shape", "n"), [((3, 1), 3), ((4, 2, 1), 5)], ids=str)
def test_start_offsets(shape: Shape, n: int) -> None:
    every = druse.crystal(shape, n).tableaux()
    size = len(every)
    for start in (0, 1, 5, size // 2, size - 1, size, size + 10):
        for chunk_size in (1, 7, 1 << 16):
            assert np.array_equal(streamed(shape, n, chunk_size, start), every[start:]), start


def test_stream_is_in_the_documented_order() -> None:
    shape, n = (3, 2, 1), 4
    got = [as_rows(row, shape) for row in streamed(shape, n, 10).tolist()]
    # rust/tableau/mod.rs: decreasing lexicographic order of (lambda^(n-1), ..., lambda^(1))
    assert got == sorted(ref.ssyt(shape, n), key=lambda t: ref.level_chain(t, n), reverse=True)


def check_prefix_of_a_big_stream(shape: Shape, n: int, rows: list[list[int]]) -> None:
    tabs = [as_rows(row, shape) for row in rows]
    assert tabs[0] == ref.highest_weight_tableau(shape)  # vertex 0 (rust/tableau/mod.rs)
    assert all(ref.is_semistandard(t, n) for t in tabs)
    chains = [ref.level_chain(t, n) for t in tabs]
    assert all(a > b for a, b in pairwise(chains))  # strictly decreasing: no repeats


def test_stream_of_a_crystal_too_big_to_materialise() -> None:
    shape, n = (6, 5, 4, 3, 2, 1), 12
    with pytest.raises(druse.TooLargeError):
        druse.crystal(shape, n)
    first = next(druse.iter_tableaux(shape, n, chunk_size=500))
    assert first.shape == (500, 21)
    check_prefix_of_a_big_stream(shape, n, first.tolist())


def test_far_indices_past_two_to_the_32() -> None:
    shape, n = (8, 8), 15
    count = druse.count_tableaux(shape, n)  # 7229999700 by hook-content (Stanley, EC2, 7.21.4)
    assert count == ref.hook_content_count(shape, n)
    (last,) = druse.iter_tableaux(shape, n, chunk_size=4, start=count - 1)
    assert as_rows(last[0].tolist(), shape) == ref.lowest_weight_tableau(shape, n)
    far = 2**32 + 3
    wide = next(druse.iter_tableaux(shape, n, chunk_size=8, start=far))
    halves = list(islice(druse.iter_tableaux(shape, n, chunk_size=4, start=far), 2))
    assert np.array_equal(wide, np.concatenate(halves))  # chunks at far offsets are consecutive
    tabs = [as_rows(row, shape) for row in wide.tolist()]
    assert all(ref.is_semistandard(t, n) for t in tabs)
    chains = [ref.level_chain(t, n) for t in tabs]
    assert all(a > b for a, b in pairwise(chains))


def test_stream_is_lazy_and_restartable() -> None:
    stream = druse.iter_tableaux((4, 4, 4), 9, chunk_size=3)  # 457380 tableaux, none made yet
    a = next(stream)
    b = next(druse.iter_tableaux((4, 4, 4), 9, chunk_size=3))
    assert np.array_equal(a, b)
    assert np.array_equal(next(stream), next(druse.iter_tableaux((4, 4, 4), 9, 3, start=3)))
