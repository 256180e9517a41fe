"""Load models for a structure: named library models or vehicle files, in the model's units.

Example:
    >>> models, notes = vehicles_for(("HL-93",), "kN-m")
    >>> models[0].units, notes[0]
    ('kN-m', 'HL-93 converted from kip-ft to kN-m (exact factors)')
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence

from vehicles.conversion import model_in
from vehicles.errors import VehicleError
from vehicles.library.adjust import adjusted
from vehicles.library.catalog import load_model
from vehicles.loadmodel import LoadModel


def vehicles_for(names: Sequence[str], units: str,
                 adjust: Mapping[str, float] | None = None) -> tuple[list[LoadModel], list[str]]:
    """Load each model by library name or file path, converted to ``units``; the notes say
    which were converted and adjusted.

    Args:
        names: library names or vehicle file paths.
        units: the structure's unit system.
        adjust: new values of named adjustments (such as {"alpha": 1.21} for Load Model 71),
            applied to every model that has them; each must belong to at least one model.
    """
    models, notes = [], []
    adjust = dict(adjust or {})
    used: set[str] = set()
    for name in names:
        original = load_model(name)
        own = {key: value for key, value in adjust.items()
               if key in {a.name for a in original.adjustments}}
        if own:
            original = adjusted(original, own)
            used.update(own)
            notes.append(f"{original.name} adjusted: " + ", ".join(
                f"{key} = {value:g}" for key, value in own.items()))
        if original.units != units:
            notes.append(f"{original.name} converted from {original.units} to {units} "
                         "(exact factors)")
            original = model_in(original, units)
        models.append(original)
    unused = sorted(set(adjust) - used)
    if unused:
        offered = sorted({a.name for m in models for a in m.adjustments})
        raise VehicleError(f"no load model given has an adjustment named '{unused[0]}'",
                           item="--adjust",
                           fix="adjustments of these models: " + (", ".join(offered) or "none"))
    return models, notes
