"""Shared helpers for the benchmarks: the reference oracle on the path, and throughput records."""

from __future__ import annotations

import sys
from collections.abc import Callable
from pathlib import Path
from typing import Any

import pytest

# tests/reference is the pure-Python oracle each druse timing is set against.
sys.path.insert(0, str(Path(__file__).resolve().parents[1] / "tests"))

#: Medians per (group, label) seen so far in this run, to state ratios in extra_info.
_RATES: dict[tuple[str, str], float] = {}


def _record_rate(benchmark: Any, items: int, unit: str, label: str) -> None:
    """Store items per second of the median round in extra_info, and the druse/reference ratio.

    ``label`` is "druse" or "reference"; whichever of a group's two runs comes second also
    records ``speedup`` (druse rate over reference rate), so the ratio comes from one run.
    Nothing is recorded when benchmarks are disabled (the CI smoke run).
    """
    if benchmark.stats is None:
        return
    median = benchmark.stats.stats.median
    rate = items / median
    benchmark.extra_info[f"{unit}_per_s"] = f"{rate:.4g}"
    benchmark.extra_info["items"] = items
    group = benchmark.group or ""
    _RATES[(group, label)] = rate
    druse, reference = _RATES.get((group, "druse")), _RATES.get((group, "reference"))
    if druse is not None and reference is not None:
        benchmark.extra_info["speedup"] = f"{druse / reference:.4g}"


@pytest.fixture
def record_rate() -> Callable[[Any, int, str, str], None]:
    """``record_rate(benchmark, items, unit, label)``, called after the timed run."""
    return _record_rate
