"""Registers every command module with the ``influence`` group."""
from influence.cli import (
    batch,  # noqa: F401
    envelopes,  # noqa: F401
    fatigue,  # noqa: F401
    lines,  # noqa: F401
    placement,  # noqa: F401
    rating,  # noqa: F401
    vehicles,  # noqa: F401
)
