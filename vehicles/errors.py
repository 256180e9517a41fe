"""The tool's errors: one base that every error raised on purpose derives from, and the error of
the vehicles package.

Every error says what was wrong, the offending value and the fix, in one line; the CLI prints the
message and exits with status 1.
"""

from __future__ import annotations


class ToolError(ValueError):
    """Base of every error this tool raises on purpose (``influence`` derives its own from it).

    Attributes:
        problem: what was wrong, with the offending value.
        source: file or library name the problem was found in ("" when built in Python).
        item: the key, member, axle, case or location at fault ("" when it is the whole thing).
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


class VehicleError(ToolError):
    """Base of every error about a load train, a vehicle file or a load model."""


class OutputError(VehicleError):
    """A file or folder cannot be written where the user asked: a missing folder, a file in the
    way, a folder that is not ours to replace, or a place the system will not let us write."""
