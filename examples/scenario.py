"""A short tour of druse on crystals of our own choosing; runs in a couple of seconds.

    python examples/scenario.py

Every number printed is also checked here against an independent route to it (the hook-content
count, the Schur polynomial, a Kostka number), so the scenario fails loudly if anything is off.
"""

from __future__ import annotations

import time
from collections.abc import Sequence

import numpy as np

import druse
from druse.io import crystal_to_json


def parts(p: Sequence[int]) -> str:
    """A partition or weight as (4,2,1)."""
    return "(" + ",".join(map(str, p)) + ")"


def show(rows: Sequence[Sequence[int]]) -> str:
    """A tableau on one line, rows top to bottom separated by '/'."""
    return " / ".join(" ".join(map(str, row)) for row in rows) or "()"


def weight(c: druse.Crystal, v: int) -> tuple[int, ...]:
    """The weight of vertex v as a tuple of Python ints."""
    return tuple(c.weights()[v].tolist())


def lowering_chain(c: druse.TableauCrystal, start: int, word: Sequence[int]) -> int:
    """Apply f_i for each i of ``word`` in turn, printing every step; return the last vertex."""
    v = start
    print(f"  start    v={v:<5} {show(c.tableau(v))}")
    for i in word:
        target = int(c.f(i)[v])
        if target < 0:
            print(f"  f_{i} is undefined at v={v} (phi_{i} = 0); the chain stops")
            break
        v = target
        print(f"  f_{i} ->   v={v:<5} {show(c.tableau(v))}   weight {parts(weight(c, v))}")
    return v


def section_crystal() -> druse.TableauCrystal:
    shape, n = (4, 2, 2, 1), 6
    c = druse.crystal(shape, n)
    expected = druse.count_tableaux(shape, n)  # hook-content formula, no enumeration
    print(f"B{parts(shape)} of GL_{n}: {len(c)} vertices; hook-content count {expected}")
    assert len(c) == expected
    top = c.highest_weight()
    print(f"highest weight vertex {top}: {show(c.tableau(top))}, weight {parts(weight(c, top))}")
    print("a lowering chain f_4, f_5, f_3, f_4, f_1, f_2 from the top:")
    v = lowering_chain(c, top, (4, 5, 3, 4, 1, 2))
    assert c.index(c.tableau(v)) == v  # ranking inverts enumeration
    i = 3
    length = int(c.phi(i)[v])
    print(
        f"from there f_{i} applies phi_{i} = {length} more times (epsilon_{i} = {c.epsilon(i)[v]})"
    )
    return c


def section_character(c: druse.TableauCrystal) -> None:
    start = time.perf_counter()
    character = c.character()
    s = druse.schur(c.shape, c.n)
    print(
        f"character of the crystal == s_{parts(c.shape)}(x1..x{c.n}): {character == s} "
        f"({len(s)} monomials, {1000 * (time.perf_counter() - start):.1f} ms for both)"
    )
    assert character == s
    weight = (2, 2, 2, 1, 1, 1)
    k = druse.kostka(c.shape, weight)
    mask = np.all(c.weights() == np.array(weight), axis=1)
    print(
        f"Kostka number K_{parts(c.shape)},{parts(weight)} = {k}; "
        f"vertices of that weight in the crystal: {mask.sum()}"
    )
    assert k == int(mask.sum()) == s.to_dict()[weight]


def section_second_crystal() -> None:
    shape, n = (5, 3), 7
    c = druse.crystal(shape, n)
    edges = c.edges()
    labels = np.unique(c.components())
    low = c.lowest_weight()
    print(
        f"B{parts(shape)} of GL_{n}: {len(c)} vertices, {len(edges)} edges, "
        f"{labels.size} component; lowest weight {show(c.tableau(low))}"
    )
    per_i = np.bincount(edges[:, 1], minlength=n)[1:]
    print(f"  arrows per colour i = 1..{n - 1}: {per_i.tolist()}")
    doc = crystal_to_json(druse.crystal((3, 2, 2), 4))
    print(
        f"  JSON export of B(3,2,2) for GL_4: format {doc['format']!r} v{doc['version']}, "
        f"{doc['size']} vertices, {len(doc['edges'])} edges"
    )


def section_streaming() -> None:
    shape, n = (6, 4, 2), 9
    start = time.perf_counter()
    total = without_top_letter = chunks = 0
    for block in druse.iter_tableaux(shape, n, chunk_size=1 << 16):
        chunks += 1
        total += len(block)
        without_top_letter += int(np.count_nonzero(block.max(axis=1) < n))
    seconds = time.perf_counter() - start
    print(
        f"streamed B{parts(shape)} of GL_{n} in {chunks} chunks: {total} tableaux in "
        f"{seconds:.2f} s, {without_top_letter} of them without the letter {n}"
    )
    assert total == druse.count_tableaux(shape, n)
    assert without_top_letter == druse.count_tableaux(
        shape, n - 1
    )  # those are SSYT with letters < n
    huge = druse.count_tableaux((8, 8), 15)
    print(f"  both agree with count_tableaux, which also says B(8,8) of GL_15 has {huge:,}")


def main() -> None:
    c = section_crystal()
    print()
    section_character(c)
    print()
    section_second_crystal()
    print()
    section_streaming()


if __name__ == "__main__":
    main()
