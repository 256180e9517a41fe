"""Load models for a structure (named library models or vehicle files, in the model's units),
and the live-load scale of a girder line that every result built from a model file applies.

Example:
    >>> models, notes = vehicles_for(("HL-93",), "kN-m")
    >>> models[0].units, notes[0]
    ('kN-m', 'HL-93 converted from kip-ft to kN-m (exact factors)')
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence

from influence.errors import ModelError
from influence.model.basis import DesignBasis, LiveLoadSettings
from influence.model.structure import Model
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


def model_vehicles(names: Sequence[str], model: Model, basis: DesignBasis,
                   adjust: Mapping[str, float] | None = None) -> tuple[list[LoadModel], list[str]]:
    """The load models of a run on a model file: those named, else the file's
    ``live_load.vehicles``; the file's ``live_load.adjust`` applies, overridden by ``adjust``.

    Raises:
        ModelError: no vehicle named and none in the file.
    """
    chosen = tuple(names) or basis.live.vehicles
    if not chosen:
        raise ModelError("no vehicles given", source=model.source, item="live load",
                         fix="give --vehicle NAME or FILE, or live_load.vehicles in the file")
    return vehicles_for(chosen, model.units, {**basis.live.adjust, **dict(adjust or {})})


def live_load_scale(live: LiveLoadSettings, per_lane: bool = False) -> tuple[float, str]:
    """What one lane's effect is multiplied by for a girder line [-], and the sentence that
    says so, the same in every output (envelope, governing positions, sweeps).

    Args:
        live: the model file's live-load settings.
        per_lane: give one lane's values, leaving out the distribution and multiple presence.

    Example:
        >>> live = LiveLoadSettings(distribution=0.62)
        >>> live_load_scale(live)[0], live_load_scale(live, per_lane=True)[0]
        (0.62, 1.0)
        >>> live_load_scale(LiveLoadSettings())[1].startswith("Live load of one lane")
        True
    """
    allowance = "dynamic load allowance as each load model's cases give it."
    factors = (f"distribution {live.distribution:g} x multiple presence "
               f"{live.multiple_presence:g}")
    if live.scale == 1.0:
        return 1.0, ("Live load of one lane: the model file gives no distribution or multiple "
                     f"presence factor other than 1; {allowance}")
    if per_lane:
        return 1.0, (f"Live load of ONE LANE: left out are the {factors} of the model file's "
                     f"[live_load] (the envelope applies them); {allowance}")
    return live.scale, (f"Live load per girder line = one lane's effect x {factors} "
                        f"= {live.scale:g} x one lane ([live_load] of the model file); "
                        f"{allowance}")
