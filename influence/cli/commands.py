"""Registers every command module with the ``influence`` group."""
from influence.cli import (
    lines,  # noqa: F401
    vehicles,  # noqa: F401
)
