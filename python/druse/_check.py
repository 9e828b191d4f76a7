"""Argument validation with messages that name the argument, the rule, and the value given."""

from __future__ import annotations

import numbers
from collections.abc import Sequence
from typing import Any

#: Materialising more than this many bytes is refused (with the streaming alternative named).
MEMORY_BUDGET = 8 * 2**30


def check_int(x: Any, name: str) -> int:
    """Return ``x`` as an int; TypeError unless it is an integer (bool is refused)."""
    if isinstance(x, bool) or not isinstance(x, numbers.Integral):
        raise TypeError(f"{name} must be an integer; got {type(x).__name__} {x!r}")
    return int(x)


def check_nonnegative_int(x: Any, name: str) -> int:
    value = check_int(x, name)
    if value < 0:
        raise ValueError(f"{name} must be non-negative; got {value}")
    return value


def check_positive_int(x: Any, name: str) -> int:
    value = check_int(x, name)
    if value < 1:
        raise ValueError(f"{name} must be a positive integer; got {value}")
    return value


def check_index(x: Any, lo: int, hi: int, name: str) -> int:
    """An integer in lo..hi inclusive."""
    value = check_int(x, name)
    if not lo <= value <= hi:
        if hi < lo:
            raise ValueError(f"{name} must be in {lo}..{hi}, which is empty; got {value}")
        raise ValueError(f"{name} must be in {lo}..{hi}; got {value}")
    return value


def _int_sequence(x: Any, name: str) -> tuple[int, ...]:
    if isinstance(x, (str, bytes)) or not isinstance(x, (Sequence, range)):
        try:
            import numpy as np

            if isinstance(x, np.ndarray) and x.ndim == 1:
                return tuple(check_int(v, f"{name}[{k}]") for k, v in enumerate(x.tolist()))
        except ImportError:  # pragma: no cover - numpy is a dependency
            pass
        raise TypeError(f"{name} must be a sequence of integers; got {type(x).__name__} {x!r}")
    return tuple(check_int(v, f"{name}[{k}]") for k, v in enumerate(x))


def check_composition(x: Any, name: str) -> tuple[int, ...]:
    """A weak composition: a sequence of non-negative integers (its length is kept)."""
    parts = _int_sequence(x, name)
    for k, p in enumerate(parts):
        if p < 0:
            raise ValueError(f"{name} must have non-negative parts; got {p} at position {k + 1}")
    return parts


def check_partition(x: Any, name: str) -> tuple[int, ...]:
    """A partition: non-negative, weakly decreasing; trailing zeros are dropped."""
    parts = check_composition(x, name)
    for k in range(len(parts) - 1):
        if parts[k] < parts[k + 1]:
            raise ValueError(
                f"{name} must be weakly decreasing; got {parts} ({parts[k]} before {parts[k + 1]})"
            )
    while parts and parts[-1] == 0:
        parts = parts[:-1]
    return parts


def check_budget(nbytes: int, what: str, instead: str) -> None:
    """Refuse to materialise more than MEMORY_BUDGET bytes, naming the size and the alternative."""
    from druse.errors import TooLargeError

    if nbytes > MEMORY_BUDGET:
        raise TooLargeError(
            f"{what} would need about {_human(nbytes)} of memory, more than the "
            f"{_human(MEMORY_BUDGET)} allowed; {instead}"
        )


def _human(nbytes: int) -> str:
    """``1.5 GB``-style size; exact integer arithmetic, so sizes past the float range work too."""
    if nbytes < 1000:
        return f"{nbytes} B"
    digits = len(str(nbytes))
    units = ("kB", "MB", "GB", "TB", "PB", "EB")
    step = min((digits - 1) // 3, len(units))
    scaled = nbytes // 10 ** (3 * step - 1)  # ten times the size in the chosen unit
    if step == len(units) and scaled >= 10_000:
        return f"about 10^{digits - 1} B"
    return f"{scaled // 10}.{scaled % 10} {units[step - 1]}"
