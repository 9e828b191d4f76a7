"""The crystal on decreasing factorizations of a permutation, and its truncation to pipe dreams.

A decreasing factorization of w in S_n is a tuple (u^1, ..., u^n) of strictly decreasing words
whose concatenation u^1 u^2 ... u^n is a reduced word of w (n factors, counted from the left).
Its weight is (|u^1|, ..., |u^n|). It is *bounded* when every letter of u^r is at least r; the
bounded factorizations are the reduced pipe dreams of w, u^r being the crosses of row r read
right to left (a cross at (r, c) is the letter r + c - 1), and x_r = |u^r| crosses in row r, so
the character of the bounded set is the Schubert polynomial S_w (Billey-Jockusch-Stanley, "Some
combinatorial properties of Schubert polynomials", 1993; Assaf-Schilling, "A Demazure crystal
construction for Schubert polynomials", 2018).

The operators are those of Morse-Schilling, "Crystal approach to affine Schubert calculus",
2016, with the factors indexed from the left. On L = u^r, R = u^(r+1): the letters b of L, from
the largest down, are each paired with the smallest unpaired letter a > b of R. f_r takes the
smallest unpaired b of L out of L and puts b - t into R (t >= 0 least with b - t not in R);
e_r takes the largest unpaired a of R out of R and puts a + s into L (s >= 0 least with a + s
not in L). This orientation is forced: weights count factors from the left (row r of a pipe
dream is x_r), and f_r must lower the weight by alpha_r = e_r - e_(r+1). With it, each
component's highest weight is a partition and its bounded part is a Demazure crystal in druse's
convention (closure under f_i from u_lambda; checked in tests/test_pipe_crystal.py).

Vertex order: ascending lexicographic order of (u^1, ..., u^n), each factor read as the integer
sum of 2^(a-1) over its letters a. Restricted to the bounded vertices this is the ascending
order of the pipe-dream bit masks, the canonical order of pipe dreams.
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import MEMORY_BUDGET, check_index, check_int, check_positive_int
from druse.crystal import Crystal
from druse.demazure import check_perm

IntArray = npt.NDArray[np.int64]
BoolArray = npt.NDArray[np.bool_]
Factorization = tuple[tuple[int, ...], ...]
Crosses = tuple[tuple[int, int], ...]

#: Bytes kept per vertex and factor: bitsets, f and e (twice, Rust and numpy), weights, string
#: lengths; used to turn the memory budget into a vertex limit before enumerating.
_BYTES_PER_VERTEX_AND_FACTOR = 64
#: The Rust tables' mark for an operator defined on the whole crystal that leaves the bounded set.
_LEAVES = -2


def _frozen(a: npt.NDArray[Any]) -> npt.NDArray[Any]:
    a.flags.writeable = False
    return a


def _letters(bits: int) -> tuple[int, ...]:
    """The letters of a factor bitset, decreasing (bit a-1 is letter a)."""
    return tuple(a + 1 for a in reversed(range(bits.bit_length())) if bits >> a & 1)


class FactorizationCrystal(Crystal):
    """The crystal of GL_m on the decreasing factorizations of w in S_n into m factors (m = n
    unless asked otherwise).

    See the module docstring for the operators, the weight and the vertex order. Components are
    crystals B(lambda), one per Edelman-Greene tableau of w^-1 with at most m rows, so the
    character is the Stanley symmetric function F_w in x_1..x_m.
    """

    def __init__(self, perm: Sequence[int], factors: int | None = None) -> None:
        self._perm = check_perm(perm, "perm")
        if not self._perm:
            raise ValueError("perm must be a permutation of 1..n with n >= 1; got ()")
        m = len(self._perm) if factors is None else check_positive_int(factors, "factors")
        if m > 64:
            raise ValueError(f"factors must be at most 64; got {m}")
        limit = MEMORY_BUDGET // (_BYTES_PER_VERTEX_AND_FACTOR * m)
        table = _core.factorization_crystal(list(self._perm), m, False, limit)
        bits, f, e, weights, bounded = table
        super().__init__(m, bits.shape[0], lowering=f, raising=e, weights=weights)
        self._factors = _frozen(bits)
        self._bounded = _frozen(bounded)
        self._lookup: dict[bytes, int] | None = None

    @property
    def perm(self) -> tuple[int, ...]:
        """The permutation w, in one-line notation."""
        return self._perm

    def factor_bitsets(self) -> npt.NDArray[np.uint32]:
        """All factorizations as a read-only uint32 array (len(C), m): bit a-1 of entry
        [v, r-1] is set when the letter a lies in the factor u^r of vertex v."""
        return self._factors

    def factorization(self, v: int) -> Factorization:
        """The factorization at vertex v: m tuples, each a strictly decreasing word."""
        v = check_index(v, 0, self._size - 1, "v")
        return tuple(_letters(int(b)) for b in self._factors[v])

    def index(self, factorization: Sequence[Sequence[int]]) -> int:
        """The vertex of a factorization given as m words (ValueError if it is not one)."""
        if isinstance(factorization, (str, bytes)) or not isinstance(factorization, Sequence):
            raise TypeError("factorization must be a sequence of m words")
        if len(factorization) != self._n:
            raise ValueError(
                f"factorization must have m = {self._n} factors; got {len(factorization)}"
            )
        row = np.zeros(self._n, dtype=np.uint32)
        for r, factor in enumerate(factorization):
            for a in factor:
                a = check_index(check_int(a, "letter"), 1, len(self._perm) - 1, "letter")
                row[r] |= np.uint32(1 << (a - 1))
        return self._find(row.tobytes(), factorization)

    def _find(self, key: bytes, shown: object) -> int:
        if self._lookup is None:
            self._lookup = {r.tobytes(): k for k, r in enumerate(self._factors)}
        if key not in self._lookup:
            raise ValueError(f"{shown!r} is not a decreasing factorization of {self._perm}")
        return self._lookup[key]

    def bounded(self) -> BoolArray:
        """Read-only bool mask of the bounded vertices (letters of u^r all >= r): the pipe
        dreams. Its character is the Schubert polynomial S_w."""
        return self._bounded

    def is_bounded(self, v: int) -> bool:
        """Whether vertex v is bounded (a pipe dream)."""
        return bool(self._bounded[check_index(v, 0, self._size - 1, "v")])

    def __repr__(self) -> str:
        return f"<crystal of the {self._size} decreasing factorizations of {self._perm}>"


def factorization_crystal(perm: Sequence[int], factors: int | None = None) -> FactorizationCrystal:
    """The crystal on the decreasing factorizations of w into m factors (Morse-Schilling 2016).

    Parameters
    ----------
    perm : sequence of int
        w in one-line notation, a permutation of 1..n.
    factors : int, optional
        m, the number of factors (the crystal is one of GL_m); n by default, which has room
        for every pipe dream and every Schur function of F_w. m = n - 1 loses neither.

    Returns
    -------
    FactorizationCrystal

    Raises
    ------
    TypeError, ValueError
        If perm is not a permutation of 1..n (a 0-based one is named as such), or factors is
        not an integer in 1..64.
    druse.TooLargeError
        If the factorizations would not fit the memory budget.

    Examples
    --------
    >>> from druse.pipe_crystal import factorization_crystal
    >>> C = factorization_crystal((2, 1, 3))
    >>> [C.factorization(v) for v in range(len(C))]
    [((), (), (1,)), ((), (1,), ()), ((1,), (), ())]
    >>> C.bounded().tolist()
    [False, False, True]
    """
    return FactorizationCrystal(perm, factors)


class PipeDreamCrystal(Crystal):
    """The crystal on the reduced pipe dreams of w: the factorization crystal's operators kept
    where they stay among bounded factorizations, -1 where they leave (Assaf-Schilling 2018).

    Vertices are the pipe dreams in ascending order of their bit masks (cells (r, c) with
    r + c <= n numbered in reading order, rows top to bottom, each right to left; the first cell
    is the most significant bit). Each component is a Demazure crystal, so the character is S_w.
    Only the pipe dreams are enumerated (not the whole factorization crystal); where an operator
    leaves them is kept, see :meth:`leaves`.
    """

    def __init__(self, perm: Sequence[int]) -> None:
        self._perm = check_perm(perm, "perm")
        n = len(self._perm)
        if n == 0:
            raise ValueError("perm must be a permutation of 1..n with n >= 1; got ()")
        limit = MEMORY_BUDGET // (_BYTES_PER_VERTEX_AND_FACTOR * n)
        bits, f, e, weights, _ = _core.factorization_crystal(list(self._perm), n, True, limit)
        self._leaves = {
            "f": [_frozen(a == _LEAVES) for a in f],
            "e": [_frozen(a == _LEAVES) for a in e],
        }
        lowering = [np.where(a >= 0, a, -1) for a in f]
        raising = [np.where(a >= 0, a, -1) for a in e]
        super().__init__(n, bits.shape[0], lowering, raising, weights)
        self._bits = _frozen(bits)
        self._lookup: dict[bytes, int] | None = None
        self._whole: FactorizationCrystal | None = None

    @property
    def perm(self) -> tuple[int, ...]:
        """The permutation w, in one-line notation."""
        return self._perm

    @property
    def factorization_crystal(self) -> FactorizationCrystal:
        """The whole crystal of decreasing factorizations this one is cut from (built on first
        use: it can be much larger)."""
        if self._whole is None:
            self._whole = FactorizationCrystal(self._perm)
        return self._whole

    def vertices_in_factorization_crystal(self) -> IntArray:
        """For each pipe dream, its vertex in :attr:`factorization_crystal` (ascending)."""
        whole = self.factorization_crystal
        return _frozen(np.array([whole._find(r.tobytes(), r) for r in self._bits], dtype=np.int64))

    def leaves(self, i: int, which: str = "f") -> BoolArray:
        """Read-only mask of the pipe dreams where f_i (``which="f"``) or e_i (``"e"``) is defined
        on the whole factorization crystal but leads to a factorization that is not bounded."""
        if which not in ("f", "e"):
            raise ValueError(f"which must be 'f' or 'e'; got {which!r}")
        return self._leaves[which][self._check_i(i) - 1]

    def factorization(self, v: int) -> Factorization:
        """The pipe dream at vertex v as a bounded decreasing factorization (n words)."""
        v = check_index(v, 0, self._size - 1, "v")
        return tuple(_letters(int(b)) for b in self._bits[v])

    def pipe_dream(self, v: int) -> Crosses:
        """The crosses (row, col) of the pipe dream at vertex v, sorted."""
        factors = self.factorization(v)
        return tuple(sorted((r, a - r + 1) for r, u in enumerate(factors, start=1) for a in u))

    def index(self, crosses: Sequence[Sequence[int]]) -> int:
        """The vertex of a pipe dream given by its crosses (ValueError if it is not one of w)."""
        if isinstance(crosses, (str, bytes)) or not isinstance(crosses, Sequence):
            raise TypeError("crosses must be a sequence of (row, col) pairs")
        row = np.zeros(self._n, dtype=np.uint32)
        for k, cell in enumerate(crosses):
            if isinstance(cell, (str, bytes)) or not isinstance(cell, Sequence) or len(cell) != 2:
                raise TypeError(f"crosses[{k}] must be a (row, col) pair; got {cell!r}")
            r, c = (check_int(x, f"crosses[{k}]") for x in cell)
            if r < 1 or c < 1 or r + c > self._n:
                raise ValueError(
                    f"crosses[{k}] must satisfy row, col >= 1 and row + col <= {self._n}; "
                    f"got {(r, c)}"
                )
            row[r - 1] |= np.uint32(1 << (r + c - 2))
        bad = ValueError(f"{tuple(crosses)!r} is not a reduced pipe dream of {self.perm}")
        if sum(bin(int(b)).count("1") for b in row) != len(crosses):
            raise bad  # a repeated cell
        if self._lookup is None:
            self._lookup = {r.tobytes(): k for k, r in enumerate(self._bits)}
        if row.tobytes() not in self._lookup:
            raise bad
        return self._lookup[row.tobytes()]

    def masks(self) -> npt.NDArray[np.uint64]:
        """The pipe dreams' bit masks as a (len(C), W) uint64 array, W = ceil(L / 64),
        L = n(n-1)/2, most significant word first; ascending (the vertex order)."""
        n = self._n
        cells = n * (n - 1) // 2
        words = max(1, -(-cells // 64))
        factors = self._bits.astype(np.uint64)
        out = np.zeros((self._size, words), dtype=np.uint64)
        offset = 0  # cells in the rows above row r
        for r in range(1, n):
            for a in range(r, n):
                # the letter a of u^r is the cross (r, a - r + 1), number offset + n - 1 - a
                bit = cells - 1 - (offset + n - 1 - a)
                has = (factors[:, r - 1] >> np.uint64(a - 1)) & np.uint64(1)
                out[:, words - 1 - bit // 64] |= has << np.uint64(bit % 64)
            offset += n - r
        return _frozen(out)

    def __repr__(self) -> str:
        return f"<crystal on the {self._size} reduced pipe dreams of {self.perm}>"


def pipe_dream_crystal(perm: Sequence[int]) -> PipeDreamCrystal:
    """The crystal on the reduced pipe dreams of w (Assaf-Schilling 2018; Morse-Schilling 2016).

    Parameters
    ----------
    perm : sequence of int
        w in one-line notation, a permutation of 1..n.

    Returns
    -------
    PipeDreamCrystal
        Vertices are the pipe dreams in ascending mask order; ``C.pipe_dream(v)`` gives the
        crosses, ``C.index(crosses)`` the vertex, ``C.character()`` the Schubert polynomial.

    Raises
    ------
    TypeError, ValueError
        If perm is not a permutation of 1..n.
    druse.TooLargeError
        If the decreasing factorizations would not fit the memory budget.

    Examples
    --------
    >>> from druse.pipe_crystal import pipe_dream_crystal
    >>> C = pipe_dream_crystal((1, 3, 2))
    >>> [C.pipe_dream(v) for v in range(len(C))]
    [((2, 1),), ((1, 2),)]
    >>> C.f(1).tolist()
    [-1, 0]
    """
    return PipeDreamCrystal(perm)
