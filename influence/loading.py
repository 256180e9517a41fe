"""Load models for a structure: named library models or vehicle files, in the model's units.

Example:
    >>> models, notes = vehicles_for(("HL-93",), "kN-m")
    >>> models[0].units, notes[0]
    ('kN-m', 'HL-93 converted from kip-ft to kN-m (exact factors)')
"""

from __future__ import annotations

from collections.abc import Sequence

from vehicles.catalog import load_model
from vehicles.loadmodel import LoadModel
from vehicles.units import model_in


def vehicles_for(names: Sequence[str], units: str) -> tuple[list[LoadModel], list[str]]:
    """Load each model by library name or file path, converted to ``units``; the notes say
    which were converted."""
    models, notes = [], []
    for name in names:
        original = load_model(name)
        if original.units != units:
            notes.append(f"{original.name} converted from {original.units} to {units} "
                         "(exact factors)")
            original = model_in(original, units)
        models.append(original)
    return models, notes
