"""Shared test helper: run the influence command in-process."""

from __future__ import annotations

from click.testing import CliRunner

from influence.cli import main


def invoke(*args: str) -> tuple[int, str]:
    """Exit status and combined output of ``influence ARGS``."""
    result = CliRunner().invoke(main, list(args))
    return result.exit_code, result.output


def refused(*args: str) -> str:
    """Run ``influence ARGS``, assert it was refused as a user error should be (exit status 1,
    exactly one line, ``error: ...``, no traceback) and return that line."""
    result = CliRunner().invoke(main, list(args))
    assert result.exception is None or isinstance(result.exception, SystemExit), (
        f"traceback: {result.exception!r}")
    assert result.exit_code == 1, result.output
    lines = [line for line in result.output.splitlines() if line.strip()]
    assert len(lines) == 1 and lines[0].startswith("error: "), result.output
    assert "Traceback" not in result.output
    return lines[0]
