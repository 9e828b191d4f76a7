"""Exceptions raised by druse. Each subclasses a built-in, so ``except ValueError`` still works."""

from __future__ import annotations

__all__ = ["InternalError", "TooLargeError"]


class TooLargeError(ValueError):
    """A request needs more memory than allowed; the message gives the size and an alternative."""


class InternalError(RuntimeError):
    """A bug in druse (a Rust panic was caught); please report it with the call that caused it."""
