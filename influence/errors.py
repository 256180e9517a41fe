"""Errors raised by the influence package.

Each error carries the file, the item at fault and the fix, and renders as one line; the CLI
prints it and exits with status 1.
"""

from __future__ import annotations

from vehicles.errors import ToolError


class InfluenceError(ToolError):
    """Base of every error this package raises on purpose (see :class:`vehicles.errors.ToolError`
    for its fields: problem, source, item, fix)."""


class ModelError(InfluenceError, ValueError):
    """The model file or model description is invalid."""


class MechanismError(InfluenceError, ValueError):
    """The structure can move without straining: a missing support or too many releases."""


class ConditioningError(InfluenceError, ValueError):
    """The stiffness contrast of a structure is too large to solve to the accuracy the tool
    guarantees (a very short, very stiff piece beside a very soft one)."""


class LocationError(InfluenceError, ValueError):
    """A requested section, node or chainage is not on the structure."""


class BatchError(InfluenceError, ValueError):
    """An inventory, route or job file is invalid, or a batch run cannot start."""
