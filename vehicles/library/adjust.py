"""Changing a load model's named inputs (EN 1991-2's alpha factors, a span-dependent impact).

A model stores its loads as they are at each adjustment's current value. A scaling adjustment
multiplies its quantities by new/old; a setting adjustment replaces the allowances it names. The
result is a new model whose adjustments carry the new values, so it can be adjusted again.

Example:
    >>> from vehicles.loadmodel import Adjustment, LoadCase, LoadModel
    >>> from vehicles.train import Axle, Train
    >>> lm71 = LoadModel("LM71", "rail", "kN-m",
    ...     (LoadCase("LM71", Train("axles", (Axle(250.0), Axle(250.0, 1.6))), lane=80.0),),
    ...     adjustments=(Adjustment("alpha", 1.0, scales=("axles", "lane")),))
    >>> heavier = adjusted(lm71, {"alpha": 1.21})
    >>> heavier.cases[0].lane, heavier.cases[0].train.items[1].load
    (96.8, 302.5)
    >>> adjusted(heavier, {"alpha": 1.0}).cases[0].lane
    80.0
"""

from __future__ import annotations

import dataclasses
from collections.abc import Mapping

from vehicles.errors import VehicleError
from vehicles.loadmodel import Adjustment, LoadCase, LoadModel
from vehicles.train import Axle, Patch, Train

_ALLOWANCE_FIELDS = {
    "dynamic_allowance": "axle_allowance",
    "uniform_dynamic_allowance": "patch_allowance",
    "lane_dynamic_allowance": "lane_allowance",
}


def _scaled_train(train: Train, axle_ratio: float, patch_ratio: float) -> Train:
    items: list[Axle | Patch] = [
        Axle(item.load * axle_ratio, item.gap)
        if isinstance(item, Axle)
        else Patch(item.intensity * patch_ratio, item.length, item.gap)
        for item in train.items
    ]
    return Train(train.name, tuple(items))


def _case_adjusted(case: LoadCase, adjustment: Adjustment, value: float) -> LoadCase:
    changes: dict[str, object] = {_ALLOWANCE_FIELDS[token]: value for token in adjustment.sets}
    if adjustment.scales:
        ratio = value / adjustment.value

        def ratio_for(token: str) -> float:
            return ratio if token in adjustment.scales else 1.0

        if case.train is not None:
            changes["train"] = _scaled_train(case.train, ratio_for("axles"), ratio_for("uniform"))
        changes["lane"] = case.lane * ratio_for("lane")
        changes["knife_edge_moment"] = case.knife_edge_moment * ratio_for("knife_edges")
        changes["knife_edge_shear"] = case.knife_edge_shear * ratio_for("knife_edges")
    return dataclasses.replace(case, **changes)  # type: ignore[arg-type]


def adjusted(model: LoadModel, values: Mapping[str, float]) -> LoadModel:
    """The model with some of its adjustments given new values.

    Args:
        model: the load model.
        values: new value by adjustment name (names as in ``model.adjustments``) [-].

    Raises:
        VehicleError: for a name the model does not have or a value it does not allow.
    """
    known = {a.name: a for a in model.adjustments}
    cases = model.cases
    renewed = list(model.adjustments)
    for name, value in values.items():
        if name not in known:
            offer = ", ".join(known) if known else "none"
            raise VehicleError(f"no adjustment named '{name}'", source=model.name,
                               item="adjustment", fix=f"this model has: {offer}")
        old = known[name]
        new = dataclasses.replace(old, value=float(value))  # validates the new value
        cases = tuple(_case_adjusted(case, old, new.value) for case in cases)
        renewed[renewed.index(old)] = new
    return dataclasses.replace(model, cases=cases, adjustments=tuple(renewed))
