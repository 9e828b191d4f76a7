"""Axiom checks on any crystal of type A_{n-1}, every violation reported with a witness.

The basic crystal axioms (Kashiwara, "On crystal bases of the q-analogue of universal
enveloping algebras", 1991) and Stembridge's local axioms for simply-laced crystals (J. R.
Stembridge, "A local characterization of simply-laced crystals", Trans. AMS 355, 2003), which a
connected crystal satisfies exactly when it is the crystal of an irreducible representation.
With phi_i(x), epsilon_i(x) the lengths of the i-string below and above x, delta(x, j) =
-epsilon_j(x), ``Delta_i g(x) = g(e_i x) - g(x)`` and ``Nabla_i g(x) = g(x) - g(f_i x)``, and
a_ij the Cartan matrix of A_{n-1} (2 on the diagonal, -1 for |i - j| = 1, else 0), the axioms
checked are, for i, j in 1..n-1 with i != j:

``inverse``
    f_i x = y exactly when e_i y = x.
``injective``
    no two vertices have the same f_i target.
``cycle``
    no f_i-string closes up (Stembridge's P1; with ``inverse`` and ``injective``, his P2).
    A directed cycle through several colours always breaks ``weight``; in a crystal given
    without weights it is reported as ``cycle`` too (one witness per back edge of a search).
``weight``
    wt(f_i x) = wt(x) - alpha_i, alpha_i = e_i - e_{i+1}.
``string_length``
    phi_i(x) - epsilon_i(x) = wt(x)_i - wt(x)_{i+1}.
``seminormal``
    a model that states its own phi_i, epsilon_i (the tableau model does, by the signature rule)
    agrees with the string lengths.
``P3``
    if e_i x is defined: Delta_i delta(x, j) + Delta_i phi(x, j) = a_ij.
``P4``
    if e_i x is defined: Delta_i delta(x, j) <= 0 and Delta_i phi(x, j) <= 0.
``P5``
    if e_i x, e_j x are defined and Delta_i delta(x, j) = 0: y = e_i e_j x = e_j e_i x is
    defined and Nabla_j phi(y, i) = 0.
``P6``
    if e_i x, e_j x are defined and Delta_i delta(x, j) = Delta_j delta(x, i) = -1:
    y = e_i e_j e_j e_i x = e_j e_i e_i e_j x is defined and Nabla_i phi(y, j) = Nabla_j phi(y, i)
    = -1.
``P5'``, ``P6'``
    the duals: f for e, Nabla phi for Delta delta and back. If f_i x, f_j x are defined and
    Nabla_i phi(x, j) = 0: y = f_i f_j x = f_j f_i x and Delta_j delta(y, i) = 0; if
    Nabla_i phi(x, j) = Nabla_j phi(x, i) = -1: y = f_i f_j f_j f_i x = f_j f_i f_i f_j x and
    Delta_i delta(y, j) = Delta_j delta(y, i) = -1.
"""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from types import MappingProxyType
from typing import Any

import numpy as np
import numpy.typing as npt

from druse import _core
from druse._check import check_nonnegative_int
from druse.crystal import Crystal, TableauCrystal

__all__ = ["AxiomReport", "Violation", "check_crystal"]

#: More witnesses than this are never kept (a cap above it means "all"; the counts stay exact).
_MOST_WITNESSES = 2**40

#: Axioms that need weights; skipped (and not listed as checked) for a crystal without them.
_WEIGHTED = ("weight", "string_length")


@dataclass(frozen=True)
class Violation:
    """One violated axiom: its name, i and j (None when one index is involved), the vertices
    involved (-1 where an operator was undefined) and a short description."""

    axiom: str
    i: int
    j: int | None
    vertices: tuple[int, ...]
    detail: str

    def __str__(self) -> str:
        pair = f"i={self.i}" if self.j is None else f"i={self.i}, j={self.j}"
        return f"{self.axiom} ({pair}) at {self.vertices}: {self.detail}"


@dataclass(frozen=True)
class AxiomReport:
    """The outcome of :func:`check_crystal`; ``bool(report)`` is ``report.ok``.

    Attributes
    ----------
    ok : bool
        True when no axiom is violated anywhere.
    violations : tuple of Violation
        The first ``max_witnesses`` violations, in vertex order (at one vertex, in check order).
    counts : mapping of str to int
        The total number of violations of each checked axiom (all of them, not only those kept).
    checked : tuple of str
        The axioms checked, in report order.
    """

    ok: bool
    violations: tuple[Violation, ...]
    counts: Mapping[str, int] = field(hash=False)
    checked: tuple[str, ...]

    def __bool__(self) -> bool:
        return self.ok

    def to_dict(self) -> dict[str, Any]:
        """A JSON-ready form: ok, checked, counts, and violations as dicts of plain values."""
        return {
            "ok": self.ok,
            "checked": list(self.checked),
            "counts": dict(self.counts),
            "violations": [
                {
                    "axiom": v.axiom,
                    "i": v.i,
                    "j": v.j,
                    "vertices": list(v.vertices),
                    "detail": v.detail,
                }
                for v in self.violations
            ],
        }

    def __str__(self) -> str:
        if self.ok:
            return f"every axiom holds ({', '.join(self.checked)})"
        broken = ", ".join(f"{a}: {c}" for a, c in self.counts.items() if c)
        total = sum(self.counts.values())
        lines = [f"{total} violations ({broken}); the first {len(self.violations)}:"]
        lines += [f"  {v}" for v in self.violations]
        return "\n".join(lines)


def check_crystal(C: Crystal, stembridge: bool = True, max_witnesses: int = 100) -> AxiomReport:
    """Check the crystal axioms of type A_{n-1} on ``C``, with a witness for each violation.

    Parameters
    ----------
    C : druse.Crystal
        Any crystal table (a tableau crystal, or one built from arrays). Without weights, the
        axioms ``weight`` and ``string_length`` are skipped.
    stembridge : bool
        Also check Stembridge's local axioms P3-P6, P5', P6' (see the module docs).
    max_witnesses : int
        How many violations to keep (the counts cover all of them).

    Returns
    -------
    AxiomReport

    Raises
    ------
    TypeError, ValueError
        If ``C`` is not a Crystal, or its arrays are malformed (wrong length, index out of range).

    Examples
    --------
    >>> import druse
    >>> report = druse.check_crystal(druse.crystal((2, 1), 3))
    >>> bool(report), report.counts["P6"]
    (True, 0)
    """
    if not isinstance(C, Crystal):
        raise TypeError(f"C must be a druse.Crystal; got {type(C).__name__}")
    if not isinstance(stembridge, bool):
        raise TypeError(f"stembridge must be a bool; got {type(stembridge).__name__}")
    cap = min(check_nonnegative_int(max_witnesses, "max_witnesses"), _MOST_WITNESSES)
    if isinstance(C, TableauCrystal) and len(C) > 0:
        C.operator_tables()  # one pass for every i, phi and epsilon included
    n, ops = C.n, range(1, C.n)
    lowering = [np.ascontiguousarray(C.f(i)) for i in ops]
    raising = [np.ascontiguousarray(C.e(i)) for i in ops]
    weights = _weights_of(C)
    declared = None
    if _states_strings(C):
        # the model states phi and epsilon itself: compare them with its strings
        declared = ([C.phi(i) for i in ops], [C.epsilon(i) for i in ops])
    counts, rows = _core.check_axioms(
        n, len(C), lowering, raising, weights, declared, stembridge, cap
    )
    checked = tuple(a for a, _ in counts if weights is not None or a not in _WEIGHTED)
    violations = tuple(
        Violation(axiom, i, j or None, tuple(vertices), detail)
        for axiom, i, j, vertices, detail in rows
    )
    kept = {a: c for a, c in counts if a in checked}
    return AxiomReport(
        ok=not any(kept.values()),
        violations=violations,
        counts=MappingProxyType(kept),
        checked=checked,
    )


def _states_strings(C: Crystal) -> bool:
    """True when phi_i and epsilon_i come from the model rather than from walking the arrays:
    its class computes them itself (tableaux), or they are already held for every i (a tensor
    product fills them in by the signature rule)."""
    overridden = type(C)._compute_string_lengths is not Crystal._compute_string_lengths
    held = all(i in C._phi and i in C._eps for i in range(1, C.n))
    return overridden or (held and C.n > 1)


def _weights_of(C: Crystal) -> npt.NDArray[np.int32] | None:
    try:
        w = C.weights()
    except NotImplementedError:
        return None
    return np.ascontiguousarray(w, dtype=np.int32)
