"""Numpy kernels behind `Poly`: grouping equal exponent rows, and exact products of polynomials.

A product packs exponent rows into int64 keys, forms all pairwise key sums block by block, and
adds the coefficient products of equal keys, either in a dense accumulator or by sorting. Big
coefficients are split into int64 limbs so that no sum can overflow.
"""

from __future__ import annotations

import math
from collections.abc import Iterable, Iterator
from typing import TYPE_CHECKING, Any

import numpy as np
import numpy.typing as npt

if TYPE_CHECKING:
    from druse.poly import Poly

IntArray = npt.NDArray[np.int64]
INT64_MIN, INT64_MAX = -(2**63), 2**63 - 1
#: Pairs of terms handled per block of a product: bounds a multiplication's working memory.
_BLOCK = 1 << 22
#: Products whose packed exponent keys lie below this use a dense accumulator (8 bytes a slot).
_DENSE_SLOTS = 1 << 24
#: Largest mixed-radix word: sums of two packed keys stay below 2**63.
_WORD = 1 << 62


def group_sum(keys: IntArray, coeffs: npt.NDArray[Any]) -> tuple[IntArray, npt.NDArray[Any]]:
    """Sort keys ascending (ints, or rows lexicographically); add coefficient columns of equal keys.

    `coeffs` has shape (P, len(keys)): P coefficient arrays summed alike.
    """
    if len(keys) == 0:
        return keys, coeffs
    if keys.ndim == 1 and coeffs.shape[0] == 1 and coeffs.dtype == np.int64:
        fused = _fused_sort(keys, coeffs[0])
        if fused is not None:
            return fused
    if keys.ndim == 1:
        order = np.argsort(keys)
        ordered = keys[order]
        new = ordered[1:] != ordered[:-1]
    else:
        order = np.lexsort(keys.T[::-1]) if keys.shape[1] else np.arange(len(keys))
        ordered = keys[order]
        new = np.any(ordered[1:] != ordered[:-1], axis=1)
    starts = np.flatnonzero(np.concatenate(([True], new)))
    return ordered[starts], np.add.reduceat(coeffs[:, order], starts, axis=1)


def _fused_sort(keys: IntArray, coeffs: IntArray) -> tuple[IntArray, IntArray] | None:
    """`group_sum` for non-negative keys and one coefficient array that fit together in 62 bits.

    Sorting key * 2**bits + (coeff + offset) by value is about thrice as fast as an argsort.
    """
    low, high = int(keys.min()), int(keys.max())
    bits = (2 * int(np.abs(coeffs).max()) + 1).bit_length()
    if low < 0 or high.bit_length() + bits > 62:
        return None
    offset = np.int64(1 << (bits - 1))
    ordered = np.sort((keys << bits) + (coeffs + offset))
    keys, coeffs = ordered >> bits, (ordered & ((1 << bits) - 1)) - offset
    starts = np.flatnonzero(np.concatenate(([True], keys[1:] != keys[:-1])))
    return keys[starts], np.add.reduceat(coeffs, starts).reshape(1, -1)


def _accumulate(
    pieces: Iterable[tuple[IntArray, npt.NDArray[Any]]],
) -> tuple[IntArray, npt.NDArray[Any]]:
    """Group-sum a stream of (keys, coeffs) blocks, merging partial sums whenever they pile up."""
    pending: list[tuple[IntArray, npt.NDArray[Any]]] = []
    size, limit = 0, 2 * _BLOCK
    for keys, coeffs in pieces:
        pending.append(group_sum(keys, coeffs))
        size += len(pending[-1][0])
        if size > limit and len(pending) > 1:
            pending = [_merge(pending)]
            size = len(pending[0][0])
            limit = max(limit, 2 * size)  # doubling keeps the merges linear overall
    return _merge(pending)


def _merge(parts: list[tuple[IntArray, npt.NDArray[Any]]]) -> tuple[IntArray, npt.NDArray[Any]]:
    if len(parts) == 1:
        return parts[0]
    keys = np.concatenate([k for k, _ in parts])
    return group_sum(keys, np.concatenate([c for _, c in parts], axis=1))


def _blocks(rows: int, width: int) -> Iterator[slice]:
    step = max(1, _BLOCK // max(1, width))
    return (slice(start, start + step) for start in range(0, rows, step))


def _word_groups(spans: list[int]) -> list[list[int]]:
    """Split the variables into runs whose exponent ranges multiply to at most _WORD."""
    groups: list[list[int]] = [[]]
    size = 1
    for j, span in enumerate(spans):
        if groups[-1] and size * span > _WORD:
            groups.append([])
            size = 1
        groups[-1].append(j)
        size *= span
    return groups


def _pack(exps: IntArray, low: list[int], spans: list[int], groups: list[list[int]]) -> IntArray:
    """One int64 word per group: a mixed-radix number of (exponent - low), first variable first."""
    words = np.empty((len(exps), len(groups)), dtype=np.int64)
    for w, group in enumerate(groups):
        weights = [math.prod(spans[j] for j in group[k + 1 :]) for k in range(len(group))]
        shifted = exps[:, group] - np.array([low[j] for j in group], dtype=np.int64)
        words[:, w] = shifted @ np.array(weights, dtype=np.int64)
    return words[:, 0] if len(groups) == 1 else words


def _unpack(keys: IntArray, lo: list[int], spans: list[int], groups: list[list[int]]) -> IntArray:
    words = keys.reshape(len(keys), -1)
    exps = np.empty((len(keys), len(spans)), dtype=np.int64)
    for w, group in enumerate(groups):
        rest = words[:, w]
        for j in reversed(group):
            rest, exps[:, j] = np.divmod(rest, spans[j])
    return exps + np.array(lo, dtype=np.int64)


def _common_degree(p: Poly) -> int | None:
    """The total degree shared by all terms, or None (also None if row sums could overflow)."""
    if max(-int(p._exps.min()), int(p._exps.max())) * p.nvars >= _WORD:
        return None
    degrees = p._exps.sum(axis=1)
    return int(degrees[0]) if bool(np.all(degrees == degrees[0])) else None


def _limbs(coeffs: tuple[int, ...], bits: int, count: int) -> IntArray:
    """(T, count) int64 signed base-2**bits digits of each coefficient, least significant first."""
    if count == 1:
        return np.array(coeffs, dtype=np.int64).reshape(-1, 1)
    mask = (1 << bits) - 1
    return np.array(
        [
            [(abs(c) >> (bits * k) & mask) * (1 if c > 0 else -1) for k in range(count)]
            for c in coeffs
        ],
        dtype=np.int64,
    )


def _split_coefficients(a: Poly, b: Poly) -> tuple[IntArray, IntArray, list[int]]:
    """Coefficients as int64 limbs, small enough that no sum of limb products can overflow.

    Each coefficient of a*b sums at most min(len(a), len(b)) products. Returns the limbs of a
    and b and, for each of the (limbs of a) * (limbs of b) columns of products, its bit shift.
    """
    ma, mb = max(map(abs, a._coeffs)), max(map(abs, b._coeffs))
    pairs = min(len(a), len(b))
    if min(sum(map(abs, a._coeffs)) * sum(map(abs, b._coeffs)), ma * mb * pairs) <= INT64_MAX:
        return _limbs(a._coeffs, 63, 1), _limbs(b._coeffs, 63, 1), [0]
    budget = 62 - pairs.bit_length()  # bits of one limb product
    ba, bb = ma.bit_length(), mb.bit_length()
    a_bits = min(range(1, budget), key=lambda x: -(-ba // x) * -(-bb // (budget - x)))
    b_bits = budget - a_bits
    na, nb = -(-ba // a_bits), -(-bb // b_bits)
    shifts = [i * a_bits + j * b_bits for i in range(na) for j in range(nb)]
    return _limbs(a._coeffs, a_bits, na), _limbs(b._coeffs, b_bits, nb), shifts


def _limb_products(ca: IntArray, cb: IntArray, s: slice) -> IntArray:
    """Products of limbs of the terms ca[s] with those of all of cb: one row per limb pair."""
    return (ca.T[:, None, s, None] * cb.T[None, :, None, :]).reshape(ca.shape[1] * cb.shape[1], -1)


def _limb_sums(
    ka: IntArray, kb: IntArray, ca: IntArray, cb: IntArray, slots: int
) -> tuple[IntArray, npt.NDArray[Any]]:
    """Distinct keys ka[i] + kb[j] (ascending) and, per limb pair, the sums of their products.

    Packed single-word keys below `slots` go to a dense accumulator when it is small and not
    much sparser than the products; other keys (several words, or exponent rows) are sorted.
    """
    width, nlimbs = ka.shape[1:], ca.shape[1] * cb.shape[1]
    if not width and slots * nlimbs <= _DENSE_SLOTS and slots <= 4 * len(ka) * len(kb):
        acc = np.zeros((nlimbs, slots), dtype=np.int64)
        for s in _blocks(len(ka), len(kb) * nlimbs):
            flat, prods = (ka[s, None] + kb).ravel(), _limb_products(ca, cb, s)
            for p in range(nlimbs):
                np.add.at(acc[p], flat, prods[p])
        keys = np.flatnonzero(np.any(acc, axis=0))
        return keys, acc[:, keys]
    return _accumulate(
        ((ka[s, None] + kb[None]).reshape(-1, *width), _limb_products(ca, cb, s))
        for s in _blocks(len(ka), len(kb) * math.prod(width) * nlimbs)
    )


def product_terms(a: Poly, b: Poly) -> tuple[IntArray, npt.NDArray[Any]]:
    """Exponents (ascending) and nonzero coefficients of a*b, computed block by block in numpy.

    Exponent rows are packed into int64 words by a mixed radix over the product's exponent
    ranges (the substitution of L. Kronecker, "Grundzuege einer arithmetischen Theorie der
    algebraischen Groessen", 1882), so that key(e + f) = key(e) + key(f) and keys sort like
    the rows; if both factors are homogeneous the last exponent is implied and left out. Big
    coefficients are split into int64 limbs (`_split_coefficients`) and reassembled at the end.
    """
    lo = (a._exps.min(axis=0) + b._exps.min(axis=0).astype(object)).tolist()
    hi = (a._exps.max(axis=0) + b._exps.max(axis=0).astype(object)).tolist()
    if min(lo, default=0) < INT64_MIN or max(hi, default=0) > INT64_MAX:
        raise ValueError("the product's exponents would leave the int64 range")
    da, db = (_common_degree(a), _common_degree(b)) if a.nvars > 1 else (None, None)
    cols = a.nvars - 1 if da is not None and db is not None else a.nvars
    spans = [h - low + 1 for h, low in zip(hi[:cols], lo[:cols], strict=True)]
    ea, eb = a._exps[:, :cols], b._exps[:, :cols]
    groups = _word_groups(spans) if max(spans, default=1) <= _WORD else []
    if groups:
        ka = _pack(ea, a._exps.min(axis=0).tolist(), spans, groups)
        kb = _pack(eb, b._exps.min(axis=0).tolist(), spans, groups)
    else:  # astronomically wide exponents: sort the rows themselves
        ka, kb = ea, eb
    ca, cb, shifts = _split_coefficients(a, b)
    keys, sums = _limb_sums(ka, kb, ca, cb, math.prod(spans))
    coeffs = sums[0] if shifts == [0] else np.zeros(len(keys), dtype=object)
    for p, shift in enumerate(shifts if shifts != [0] else []):
        coeffs += sums[p].astype(object) << shift
    exps = _unpack(keys, lo[:cols], spans, groups) if groups else keys
    if cols < a.nvars:  # the implied last exponent
        last = (da or 0) + (db or 0) - exps.sum(axis=1, keepdims=True)
        exps = np.concatenate((exps, last), axis=1)
    keep = coeffs != 0
    return exps[keep], coeffs[keep]
