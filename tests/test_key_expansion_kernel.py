"""The Rust key and atom peeling (rust/poly/expand.rs) against the pure-Python peeling in
tests/reference/expansion.py, sympy and published identities; the batch form and its cache."""

from __future__ import annotations

import itertools
import math
from typing import Any

import pytest
import sympy  # type: ignore[import-untyped]
from hypothesis import given
from hypothesis import strategies as st

import druse
from druse.poly import Poly
from reference import expansion as ref

Exponent = tuple[int, ...]


def nonnegative_polys(nvars: int, top: int = 3, max_terms: int = 6) -> st.SearchStrategy[Poly]:
    exps = st.tuples(*[st.integers(0, top)] * nvars)
    coeffs = st.one_of(st.integers(-9, 9), st.integers(-(2**80), 2**80))
    terms = st.dictionaries(exps, coeffs, max_size=max_terms)
    return terms.map(lambda d: Poly.from_dict(d, nvars))


any_polys = st.integers(0, 4).flatmap(nonnegative_polys)


def key_sum(terms: dict[Exponent, int], n: int) -> Poly:
    total = Poly.zero(n)
    for alpha, c in terms.items():
        total = total + c * druse.key(alpha)
    return total


@given(any_polys)
def test_kernel_equals_the_reference_on_random_polynomials(p: Poly) -> None:
    assert druse.key_expansion(p) == ref.key_expansion(p.to_dict())  # tests/reference
    assert druse.atom_expansion(p) == ref.atom_expansion(p.to_dict())  # tests/reference


@given(
    st.integers(1, 4).flatmap(
        lambda n: st.dictionaries(
            st.tuples(*[st.integers(0, 3)] * n), st.integers(-(2**70), 2**70), max_size=5
        )
    )
)
def test_a_sum_of_keys_comes_back(combination: dict[Exponent, int]) -> None:
    # keys are a basis (Lascoux-Schutzenberger 1990); the sum is built with the reference's keys
    n = len(next(iter(combination), ()))
    p = Poly.zero(n)
    for alpha, c in combination.items():
        p = p + c * Poly.from_dict(dict(ref.basis_element(alpha)), n)
    expected = {alpha: c for alpha, c in combination.items() if c}
    assert druse.key_expansion(p) == expected
    assert list(druse.key_expansion(p)) == sorted(expected, key=lambda a: a[::-1], reverse=True)


def partitions_up_to(size: int, rows: int) -> list[Exponent]:
    out = []
    for parts in itertools.product(range(size + 1), repeat=rows):
        if sum(parts) <= size and list(parts) == sorted(parts, reverse=True):
            out.append(parts)
    return out


def hook_content(shape: Exponent, n: int) -> int:
    # number of SSYT of the shape with entries <= n (Stanley, EC2, Cor. 7.21.4)
    cells = [(i, j) for i, row in enumerate(shape) for j in range(row)]
    conj = [sum(1 for row in shape if row > j) for j in range(shape[0] if shape else 0)]
    num = math.prod(n + j - i for i, j in cells)
    den = math.prod((shape[i] - j) + (conj[j] - i) - 1 for i, j in cells)
    return num // den


@pytest.mark.parametrize("n", [1, 2, 3, 4])
def test_a_schur_polynomial_is_the_key_of_its_antidominant_rearrangement(n: int) -> None:
    for lam in partitions_up_to(5, n):
        s = druse.schur(lam, n)
        # s(1,...,1) by hook-content, so the polynomial is the right one (Stanley EC2 7.21.4)
        assert sum(s.coefficients) == hook_content(lam, n)
        # s_lambda(x1..xn) = key(lambda reversed) (Lascoux-Schutzenberger 1990; Reiner-Shimozono
        # 1995): the expansion is one term
        assert druse.key_expansion(s) == {lam[::-1]: 1}


@pytest.mark.parametrize(
    ("a", "b"),
    [
        ((0, 1, 2), (1, 0, 1)),
        ((2, 0, 1), (0, 2, 1)),
        ((0, 1, 0, 2), (1, 0, 1, 0)),
        ((3, 0, 2), (0, 0, 2)),
    ],
)
def test_a_product_of_keys_resums_to_the_sympy_product(a: Exponent, b: Exponent) -> None:
    xs = sympy.symbols(f"x1:{len(a) + 1}")
    product = sympy.expand(druse.key(a).to_sympy(xs) * druse.key(b).to_sympy(xs))  # sympy
    expansion = druse.key_expansion(druse.key(a) * druse.key(b))
    resummed = sum((c * druse.key(alpha).to_sympy(xs) for alpha, c in expansion.items()), 0)
    assert sympy.expand(resummed - product) == 0


def test_big_coefficients_are_exact() -> None:
    # coefficients past 2**64 and 2**128 (Python ints as the exact engine)
    big, huge = 2**70 + 1, -(3**90)
    p = big * druse.key((0, 2, 1)) + huge * druse.key((1, 1, 0)) + druse.key((0, 0, 3))
    assert druse.key_expansion(p) == {(0, 0, 3): 1, (0, 2, 1): big, (1, 1, 0): huge}
    assert druse.atom_expansion(p) == ref.atom_expansion(p.to_dict())  # tests/reference


def schubert_by_divided_differences(n: int) -> dict[tuple[int, ...], Poly]:
    # S_w0 = x1^(n-1) ... x_(n-1), S_(w s_i) = d_i S_w when l(w s_i) < l(w) (Macdonald, Notes on
    # Schubert Polynomials, 1991, (4.1))
    w0 = tuple(range(n, 0, -1))
    out = {w0: Poly.monomial(tuple(range(n - 1, -1, -1)))}
    frontier = [w0]
    while frontier:
        nxt = []
        for w in frontier:
            for i in range(n - 1):
                v = (*w[:i], w[i + 1], w[i], *w[i + 2 :])
                if w[i] > w[i + 1] and v not in out:
                    out[v] = druse.divided_difference(out[w], i + 1)
                    nxt.append(v)
        frontier = nxt
    return out


def test_schubert_polynomials_expand_positively_in_a_batch() -> None:
    # every Schubert polynomial is a non-negative sum of keys (Lascoux-Schutzenberger 1990;
    # Reiner-Shimozono 1995); and S_w for w = 1 n ... 2 in S_4 is the key of its code (0, 2, 1, 0)
    # (Lascoux-Schutzenberger: S_w = key(code w) for vexillary w; from memory)
    schuberts = schubert_by_divided_differences(5)
    polys = list(schuberts.values())
    batch = druse.key_expansions(polys)
    assert batch == [druse.key_expansion(p) for p in polys]
    assert all(c > 0 for expansion in batch for c in expansion.values())
    for p, expansion in zip(polys[:30], batch[:30], strict=True):
        assert expansion == ref.key_expansion(p.to_dict())  # tests/reference
    assert druse.key_expansion(schubert_by_divided_differences(4)[(1, 4, 3, 2)]) == {
        (0, 2, 1, 0): 1
    }


def test_a_batch_of_mixed_sizes_reports_progress() -> None:
    polys = [druse.key((k % 3, 1, 0)[: 1 + k % 3]) * (k - 3) for k in range(50)]
    polys.append(Poly.zero(2))
    calls: list[tuple[int, int]] = []
    out = druse.key_expansions(
        iter(polys), progress=lambda done, total: calls.append((done, total))
    )
    assert out == [druse.key_expansion(p) for p in polys]
    assert calls
    assert calls[-1] == (len(polys), len(polys))
    assert [d for d, _ in calls] == sorted(d for d, _ in calls)
    assert druse.key_expansions([]) == []


def test_many_chunks_share_one_cache(monkeypatch: Any) -> None:
    import druse.expansion as expansion

    monkeypatch.setattr(expansion, "_CHUNK_TERMS", 10)
    polys = list(schubert_by_divided_differences(4).values())
    calls: list[int] = []
    out = druse.key_expansions(polys, progress=lambda done, total: calls.append(done))
    assert len(calls) > 1
    assert out == [ref.key_expansion(p.to_dict()) for p in polys]  # tests/reference


def test_bad_input() -> None:
    with pytest.raises(TypeError, match=r"polys\[1\] must be a druse\.Poly"):
        druse.key_expansions([druse.key((0, 1)), {(1, 0): 1}])  # type: ignore[list-item]
    laurent = Poly.from_dict({(1, -1): 1}, 2)
    with pytest.raises(ValueError, match=r"polys\[2\] must be a polynomial: negative exponents"):
        druse.key_expansions([Poly.zero(3), druse.key((1, 0)), laurent, laurent])
    with pytest.raises(ValueError, match="negative exponents"):
        druse.atom_expansion(laurent)
    with pytest.raises(TypeError, match="progress must be callable"):
        druse.key_expansions([], progress=3)  # type: ignore[arg-type]
