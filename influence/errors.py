"""Errors raised by the influence package.

Each error carries the file, the item at fault and the fix, and renders as one line; the CLI
prints it and exits with status 1.
"""

from __future__ import annotations


class InfluenceError(Exception):
    """Base of every error this package raises on purpose.

    Attributes:
        problem: what was wrong, with the offending value.
        source: the file (or "" when built in Python).
        item: the key, member, node or location at fault.
        fix: what the user should do.
    """

    def __init__(self, problem: str, *, source: str = "", item: str = "", fix: str = "") -> None:
        self.problem = problem
        self.source = source
        self.item = item
        self.fix = fix
        super().__init__(self.one_line())

    def one_line(self) -> str:
        where = ": ".join(part for part in (self.source, self.item) if part)
        text = f"{where}: {self.problem}" if where else self.problem
        return f"{text} ({self.fix})" if self.fix else text


class ModelError(InfluenceError, ValueError):
    """The model file or model description is invalid."""


class MechanismError(InfluenceError, ValueError):
    """The structure can move without straining: a missing support or too many releases."""


class ConditioningError(InfluenceError, ValueError):
    """The stiffness contrast of a structure is too large to solve to the accuracy the tool
    guarantees (a very short, very stiff piece beside a very soft one)."""


class LocationError(InfluenceError, ValueError):
    """A requested section, node or chainage is not on the structure."""
