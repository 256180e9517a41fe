"""Errors raised by the vehicles package.

Every error says what was wrong, the offending value and the fix, in one line; the CLI prints the
message and exits with status 1.
"""

from __future__ import annotations


class VehicleError(ValueError):
    """Base of every error about a load train, a vehicle file or a load model.

    Attributes:
        source: file or library name the problem was found in ("" when built in Python).
        item: the key, axle or case at fault ("" when it is the whole thing).
        fix: what the user should change.
    """

    def __init__(self, problem: str, *, source: str = "", item: str = "", fix: str = "") -> None:
        self.problem = problem
        self.source = source
        self.item = item
        self.fix = fix
        super().__init__(self.one_line())

    def one_line(self) -> str:
        """The message as one line: source, item, problem and fix."""
        where = ": ".join(part for part in (self.source, self.item) if part)
        text = f"{where}: {self.problem}" if where else self.problem
        return f"{text} ({self.fix})" if self.fix else text


class OutputError(VehicleError):
    """A file or folder cannot be written where the user asked: a missing folder, a file in the
    way, a folder that is not ours to replace, or a place the system will not let us write."""
