"""Running the ``druse`` command in-process through click's CliRunner, for the CLI tests."""

from __future__ import annotations

from click.testing import CliRunner, Result

from druse.cli import main


def run(*args: str, stdin: str | None = None) -> Result:
    return CliRunner().invoke(main, list(args), input=stdin)


def ok(*args: str, stdin: str | None = None) -> str:
    """Run a command that must succeed; return its standard output."""
    result = run(*args, stdin=stdin)
    assert result.exit_code == 0, result.output
    return result.stdout


def refused(*args: str, code: int = 1, stdin: str | None = None) -> str:
    """Run a command that must fail with a one-line ``Error:`` and no traceback."""
    result = run(*args, stdin=stdin)
    assert result.exit_code == code, result.output
    assert isinstance(result.exception, SystemExit), result.exception
    assert "Traceback" not in result.output
    errors = [line for line in result.output.splitlines() if line.startswith("Error:")]
    assert len(errors) == 1, result.output
    return errors[0]
