"""Second tour: a crystal defined on our own objects, checked and decomposed; Littlewood-Richardson
multiplicities two ways; a Schubert polynomial, its pipe dreams and its key expansion.

    python examples/schubert_and_checks.py

As in scenario.py, every number printed is checked against an independent route to it.
"""

from __future__ import annotations

from collections.abc import Sequence

import druse

Word = tuple[int, ...]


def parts(p: Sequence[int]) -> str:
    return "(" + ",".join(map(str, p)) + ")"


def lower_word(i: int, word: Word) -> Word | None:
    """f_i on a word by the signature rule: an i+1 pairs with the nearest unpaired i to its
    right; f_i turns the rightmost unpaired i into i+1 (None if there is none)."""
    unpaired_i: list[int] = []
    open_plus = 0  # unpaired i+1 seen so far, waiting for an i to their right
    for k, letter in enumerate(word):
        if letter == i + 1:
            open_plus += 1
        elif letter == i:
            if open_plus:
                open_plus -= 1
            else:
                unpaired_i.append(k)
    if not unpaired_i:
        return None
    k = unpaired_i[-1]
    return (*word[:k], i + 1, *word[k + 1 :])


def word_weight(word: Word, n: int) -> tuple[int, ...]:
    return tuple(word.count(a) for a in range(1, n + 1))


def section_own_crystal() -> None:
    n = 4
    letters = range(1, n)  # every component has a vertex without the letter n
    seeds = [(a, b, c) for a in letters for b in letters for c in letters]
    c = druse.crystal_from_operators(
        n, lower_word, seeds, weight=lambda w: word_weight(w, n), limit=10_000
    )
    print(f"words of length 3 in 1..{n} under the signature rule: {len(c)} vertices")
    assert len(c) == n**3
    report = druse.check_crystal(c)
    print(f"  axiom check: {report}")
    assert report.ok
    shapes = []
    for k, part in enumerate(druse.decompose(c)):
        shape, _ = druse.tableau_isomorphism(c, k)
        shapes.append(tuple(x for x in shape if x))
        print(f"  component at {c.label(part.highest_weight)}: B{parts(shapes[-1])}")
    # B(1)^{x3} = B(3) + 2 B(2,1) + B(1,1,1) (Pieri's rule twice)
    assert sorted(shapes) == sorted([(3,), (2, 1), (2, 1), (1, 1, 1)])

    edges = c.edges().copy()
    edges[0, 2], edges[1, 2] = edges[1, 2], edges[0, 2]  # two arrows of f_1 swap their targets
    broken = druse.crystal_from_edges(n, edges, c.weights(), size=len(c), check_weights=False)
    bad = druse.check_crystal(broken, max_witnesses=2)
    print(f"  the same with two f_1 arrows swapped: {bad}")
    assert not bad.ok


def section_lr() -> None:
    mu, nu = (3, 2, 1), (2, 1)
    counted = druse.lr(mu, nu)
    by_crystal = druse.lr_by_crystal(mu, nu)
    print(f"s{parts(mu)} s{parts(nu)}: {len(counted)} shapes, {sum(counted.values())} in all")
    assert counted == by_crystal  # lattice count == highest weights of B(mu) x B(nu)
    top = max(counted.items(), key=lambda item: item[1])
    print(f"  the largest multiplicity: c^{parts(top[0])} = {top[1]}")
    b = druse.tensor_product(druse.crystal(nu, 4), druse.crystal(nu, 4))
    print(f"  B{parts(nu)} x B{parts(nu)} of GL_4: {len(b)} vertices -> {b.decomposition()}")
    assert len(b) == druse.count_tableaux(nu, 4) ** 2


def section_schubert() -> None:
    w = (2, 5, 1, 4, 3)
    s = druse.schubert(w)
    print(f"S_{parts(w)} has {len(s)} terms; S_w(1,...,1) = {sum(c for _, c in s)}")
    assert s == druse.schubert_by_divided_differences(w)
    dreams = druse.pipe_dreams(w)
    print(f"  {len(dreams)} reduced pipe dreams; the first, crosses {dreams[0]}:")
    print("\n".join("    " + line for line in dreams.draw(0).splitlines()))
    assert len(dreams) == sum(c for _, c in s)
    keys = druse.key_expansion(s)
    print("  key expansion: " + " + ".join(f"{c}*key{parts(a)}" for a, c in keys.items()))
    assert druse.positivity(keys).positive  # Schubert polynomials are key-positive


def main() -> None:
    section_own_crystal()
    print()
    section_lr()
    print()
    section_schubert()


if __name__ == "__main__":
    main()
