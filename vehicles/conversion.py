"""Trains, load cases and load models converted exactly from one unit system to another.

Axle loads [force], gaps and lengths [length], patch, lane and knife-edge loads are converted
with the exact factors of :mod:`vehicles.units`; dimensionless quantities (factors, dynamic
load allowances, adjustment values) are not touched. Conversions return new values.

Example:
    >>> from vehicles.train import Axle, Train
    >>> truck = Train("truck", (Axle(8.0), Axle(32.0, 14.0)))
    >>> converted = train_in(truck, "kip-ft", "kN-m")
    >>> [round(axle.load, 4) for axle in converted.items]
    [35.5858, 142.3431]
    >>> round(converted.items[1].gap, 4)
    4.2672
"""

from __future__ import annotations

import dataclasses

from vehicles.loadmodel import LoadCase, LoadModel
from vehicles.train import Axle, Patch, Span, Train
from vehicles.units import Factors, factors, system


def _scaled_span(value: Span, factor: float) -> Span:
    if isinstance(value, tuple):
        return (value[0] * factor, value[1] * factor)
    return value * factor


def _train_scaled(train: Train, f: Factors) -> Train:
    items: list[Axle | Patch] = []
    for item in train.items:
        gap = _scaled_span(item.gap, f.length)
        if isinstance(item, Axle):
            items.append(Axle(item.load * f.force, gap))
        else:
            length = None if item.length is None else _scaled_span(item.length, f.length)
            items.append(Patch(item.intensity * f.force_per_length, length, gap))
    return Train(train.name, tuple(items))


def train_in(train: Train, source: str, target: str) -> Train:
    """The train converted from ``source`` units to ``target`` units.

    Axle loads [force], gaps and lengths [length] and patch intensities [force/length] are
    converted; the name and order stay.
    """
    f = factors(source, target)
    return train if f == Factors(1.0, 1.0) else _train_scaled(train, f)


def case_in(case: LoadCase, source: str, target: str) -> LoadCase:
    """The load case converted from ``source`` to ``target`` units (factors unchanged)."""
    f = factors(source, target)
    if f == Factors(1.0, 1.0):
        return case
    clear = case.lane_clear_of_train
    return dataclasses.replace(
        case,
        train=None if case.train is None else _train_scaled(case.train, f),
        lane=case.lane * f.force_per_length,
        lane_clear_of_train=None if clear is None else clear * f.length,
        knife_edge_moment=case.knife_edge_moment * f.force,
        knife_edge_shear=case.knife_edge_shear * f.force,
    )


def model_in(model: LoadModel, target: str) -> LoadModel:
    """The load model converted to ``target`` units ("kN-m" or "kip-ft").

    Example:
        >>> from vehicles.loadmodel import LoadCase, LoadModel
        >>> lane = LoadModel("lane", "lane only", "kip-ft", (LoadCase("lane", lane=0.64),))
        >>> round(model_in(lane, "kN-m").cases[0].lane, 3)
        9.34
    """
    system(target)
    if model.units == target:
        return model
    cases = tuple(case_in(case, model.units, target) for case in model.cases)
    return dataclasses.replace(model, units=target, cases=cases)
