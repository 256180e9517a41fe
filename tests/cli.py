"""Shared test helper: run the influence command in-process."""

from __future__ import annotations

from click.testing import CliRunner

from influence.cli import main


def invoke(*args: str) -> tuple[int, str]:
    """Exit status and combined output of ``influence ARGS``."""
    result = CliRunner().invoke(main, list(args))
    return result.exit_code, result.output
