"""Tensor products of crystals: the signature rule on words, the reading-word embedding,
decompositions from the textbooks, multiplicative characters, and bad input."""

from __future__ import annotations

from itertools import product

import numpy as np
import pytest
import sympy  # type: ignore[import-untyped]

import druse
import druse._check
from reference import tableaux as ref

Word = tuple[int, ...]


def word_f(word: Word, i: int) -> Word | None:
    """f_i on a word by the signature rule (tests/reference): the rightmost unpaired i -> i+1."""
    lone_i, _ = ref.unpaired(word, i)
    if not lone_i:
        return None
    w = list(word)
    w[lone_i[-1]] = i + 1
    return tuple(w)


def word_e(word: Word, i: int) -> Word | None:
    """e_i on a word: the leftmost unpaired i+1 -> i."""
    _, lone_next = ref.unpaired(word, i)
    if not lone_next:
        return None
    w = list(word)
    w[lone_next[0]] = i
    return tuple(w)


def word_vertex(word: Word, n: int) -> int:
    """The vertex of b_{a_1} (x) ... (x) b_{a_k} in the tensor power of druse.crystal((1,), n):
    numbering is lexicographic in the factors, and B(1) numbers its letter a as a - 1."""
    v = 0
    for a in word:
        v = v * n + a - 1
    return v


@pytest.mark.parametrize(("n", "k"), [(2, 4), (3, 4), (4, 3)])
def test_tensor_power_of_the_standard_crystal_is_the_word_crystal(n: int, k: int) -> None:
    """Every word and every i: f_i, e_i, phi_i, epsilon_i of B(1)^(x)k agree with the signature
    rule on words (the pairing of the contract, oracle in tests/reference)."""
    b = druse.crystal((1,), n)
    assert [b.tableau(v) for v in range(n)] == [((a,),) for a in range(1, n + 1)]
    t = druse.tensor_product(*[b] * k)
    for word in product(range(1, n + 1), repeat=k):
        v = word_vertex(word, n)
        assert t.factors(v) == tuple(a - 1 for a in word)
        for i in range(1, n):
            fw, ew = word_f(word, i), word_e(word, i)
            assert t.f(i)[v] == (-1 if fw is None else word_vertex(fw, n))
            assert t.e(i)[v] == (-1 if ew is None else word_vertex(ew, n))
            lone_i, lone_next = ref.unpaired(word, i)
            assert (t.phi(i)[v], t.epsilon(i)[v]) == (len(lone_i), len(lone_next))
        assert tuple(t.weights()[v]) == tuple(word.count(a) for a in range(1, n + 1))


@pytest.mark.parametrize(("shape", "n"), [((2, 1), 3), ((2, 2), 3), ((3, 1), 4), ((2, 1, 1), 4)])
def test_reading_word_embedding_commutes_with_the_operators(shape: tuple[int, ...], n: int) -> None:
    """T -> its row reading word embeds B(lambda) into B(1)^(x)|lambda| as a crystal: it
    commutes with every f_i and e_i (Kashiwara-Nakashima 1994; Bump-Schilling 2017)."""
    c = druse.crystal(shape, n)
    t = druse.tensor_product(*[druse.crystal((1,), n)] * sum(shape))
    words = c.reading_words().astype(np.int64)
    embed = np.array([word_vertex(tuple(w), n) for w in words.tolist()], dtype=np.int64)
    assert np.unique(embed).size == len(c)
    for i in range(1, n):
        for op, top in ((c.f(i), t.f(i)), (c.e(i), t.e(i))):
            image = np.where(op >= 0, embed[np.maximum(op, 0)], -1)
            assert np.array_equal(top[embed], image)


@pytest.mark.parametrize("n", [2, 3, 4, 5])
def test_square_of_the_standard_crystal(n: int) -> None:
    # B(1) (x) B(1) = B(2) + B(1,1) (Bump-Schilling, Crystal Bases, 2017, from memory)
    b = druse.crystal((1,), n)
    assert druse.tensor_product(b, b).decomposition() == {(2,): 1, (1, 1): 1}


def test_square_of_b21_for_gl3() -> None:
    # B(2,1) (x) B(2,1) for GL_3: the LR rule by hand, s_21^2 = s_42 + s_411 + s_33 + 2 s_321
    # + s_3111 + s_222 + s_2211 (c^321 = 2: Fulton, Young Tableaux, 1997, ch. 5), and the
    # shapes with more than 3 rows vanish for GL_3
    b = druse.crystal((2, 1), 3)
    t = druse.tensor_product(b, b)
    expected = {(4, 2): 1, (4, 1, 1): 1, (3, 3): 1, (3, 2, 1): 2, (2, 2, 2): 1}
    assert t.decomposition() == expected
    # each component is B(lambda): its size is the Weyl dimension (hook-content formula)
    sizes = np.bincount(t.components())
    assert sorted(sizes.tolist()) == sorted(
        ref.hook_content_count(lam, 3) for lam, m in expected.items() for _ in range(m)
    )


@pytest.mark.parametrize(
    ("shapes", "n"), [(((2, 1), (1,)), 3), (((1, 1), (2,), (1,)), 3), (((2,), (2, 1)), 4)]
)
def test_characters_multiply(shapes: tuple[tuple[int, ...], ...], n: int) -> None:
    """character(B1 (x) B2) = character(B1) * character(B2), multiplied in sympy."""
    crystals = [druse.crystal(s, n) for s in shapes]
    t = druse.tensor_product(*crystals)
    xs = sympy.symbols(f"x1:{n + 1}")
    expected = sympy.Integer(1)
    for c in crystals:
        expected *= c.character().to_sympy(xs)
    assert sympy.expand(t.character().to_sympy(xs) - expected) == 0  # sympy


def test_string_lengths_and_weights_are_consistent() -> None:
    """Crystal axioms on a triple product: e_i inverts f_i, phi_i - eps_i = <wt, alpha_i>, and the
    stored phi_i, eps_i are the string lengths (Bump-Schilling 2017, the axioms of ch. 2)."""
    b = druse.crystal((2, 1), 3)
    t = druse.tensor_product(b, druse.crystal((1,), 3), b)
    w = t.weights().astype(np.int64)
    for i in range(1, 3):
        f, e = t.f(i), t.e(i)
        src = np.flatnonzero(f >= 0)
        assert np.array_equal(e[f[src]], src)
        assert np.count_nonzero(e >= 0) == src.size
        assert np.array_equal(t.phi(i) - t.epsilon(i), w[:, i - 1] - w[:, i])
        assert np.array_equal(t.phi(i), druse._core.string_steps(np.ascontiguousarray(f)))
        assert np.array_equal(t.epsilon(i), druse._core.string_steps(np.ascontiguousarray(e)))


def test_vertex_numbering_is_lexicographic_in_the_factors() -> None:
    a, b, c = druse.crystal((1,), 3), druse.crystal((2,), 3), druse.crystal((1, 1), 3)
    t = druse.tensor_product(a, b, c)
    assert len(t) == 3 * 6 * 3
    assert t.factors(0) == (0, 0, 0)
    assert t.factors(len(t) - 1) == (2, 5, 2)
    for v in range(len(t)):
        x, y, z = t.factors(v)
        assert v == (x * 6 + y) * 3 + z == t.vertex((x, y, z))
        assert np.array_equal(t.weights()[v], a.weights()[x] + b.weights()[y] + c.weights()[z])


def test_user_crystal_and_gl1() -> None:
    # a crystal given by its table (two copies of B(1) of GL_2) tensors like any other
    user = druse.Crystal(2, 4, lowering=[[1, -1, 3, -1]], weights=[[1, 0], [0, 1]] * 2)
    assert druse.tensor_product(user, druse.crystal((1,), 2)).decomposition() == {
        (2,): 2,
        (1, 1): 2,
    }
    one = druse.crystal((3,), 1)
    t = druse.tensor_product(one, one)
    assert len(t) == 1
    assert t.decomposition() == {(6,): 1}


def test_bad_input() -> None:
    b = druse.crystal((1,), 3)
    with pytest.raises(ValueError, match="at least one"):
        druse.tensor_product()
    with pytest.raises(TypeError, match="crystals\\[1\\]"):
        druse.tensor_product(b, (1,))  # type: ignore[arg-type]
    with pytest.raises(ValueError, match="same GL_n"):
        druse.tensor_product(b, druse.crystal((1,), 4))
    t = druse.tensor_product(b, b)
    with pytest.raises(ValueError, match="factors must hold 2"):
        t.vertex((1,))
    with pytest.raises(ValueError, match="factors\\[1\\]"):
        t.vertex((0, 3))
    with pytest.raises(TypeError, match="factors"):
        t.vertex(3)  # type: ignore[arg-type]
    with pytest.raises(ValueError, match="v must be"):
        t.factors(9)


def test_memory_is_estimated_first(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr(druse._check, "MEMORY_BUDGET", 1000)
    b = druse.crystal((2, 1), 3)
    with pytest.raises(druse.TooLargeError, match="tensor product"):
        druse.tensor_product(b, b)
