"""The two unit systems of load trains and load models, and exact conversion between them.

A system fixes the force and length units; force/length and moment follow. The factors are exact
by definition: 1 ft = 0.3048 m (international foot, 1959) and 1 lbf = 4.4482216152605 N
(0.45359237 kg x 9.80665 m/s^2), so 1 kip = 4.4482216152605 kN.

Conversions return new values; nothing is changed in place. Dimensionless quantities (factors,
dynamic load allowances, adjustment values) are not touched.

Example:
    >>> truck = Train("truck", (Axle(8.0), Axle(32.0, 14.0)))
    >>> converted = train_in(truck, "kip-ft", "kN-m")
    >>> [round(axle.load, 4) for axle in converted.items]
    [35.5858, 142.3431]
    >>> round(converted.items[1].gap, 4)
    4.2672
    >>> labels("kip-ft").force_per_length
    'kip/ft'
"""

from __future__ import annotations

import dataclasses
from dataclasses import dataclass
from typing import TYPE_CHECKING

from vehicles.errors import VehicleError
from vehicles.train import Axle, Patch, Span, Train

if TYPE_CHECKING:
    from vehicles.loadmodel import LoadCase, LoadModel

KN_PER_KIP = 4.4482216152605
"""Exact: 1 lbf = 4.4482216152605 N."""

M_PER_FT = 0.3048
"""Exact: the international foot."""


@dataclass(frozen=True)
class UnitLabels:
    """The printed unit of each quantity in a system."""

    force: str
    length: str
    force_per_length: str
    moment: str


@dataclass(frozen=True)
class UnitSystem:
    """A unit system: its labels and its size in SI (kN and m)."""

    name: str
    labels: UnitLabels
    kn_per_force: float
    m_per_length: float


SYSTEMS = {
    "kN-m": UnitSystem("kN-m", UnitLabels("kN", "m", "kN/m", "kN-m"), 1.0, 1.0),
    "kip-ft": UnitSystem(
        "kip-ft", UnitLabels("kip", "ft", "kip/ft", "kip-ft"), KN_PER_KIP, M_PER_FT
    ),
}
"""Every unit system a file or a library model may use, by name."""


def system(name: str) -> UnitSystem:
    """The unit system called ``name`` ("kN-m" or "kip-ft").

    Raises:
        VehicleError: for any other name.

    Example:
        >>> system("kN-m").labels.moment
        'kN-m'
    """
    try:
        return SYSTEMS[name]
    except (KeyError, TypeError):
        raise VehicleError(
            f"unknown units '{name}'", item="units", fix="give units = " + " or ".join(
                f'"{known}"' for known in SYSTEMS)
        ) from None


def labels(name: str) -> UnitLabels:
    """The printed labels of the unit system ``name``."""
    return system(name).labels


@dataclass(frozen=True)
class Factors:
    """Multipliers that take values from one system to another."""

    force: float
    length: float

    @property
    def force_per_length(self) -> float:
        return self.force / self.length


def factors(source: str, target: str) -> Factors:
    """Multipliers from ``source`` units to ``target`` units.

    Example:
        >>> round(factors("kip-ft", "kN-m").force_per_length, 6)
        14.593903
        >>> factors("kN-m", "kN-m")
        Factors(force=1.0, length=1.0)
    """
    a, b = system(source), system(target)
    if a is b:
        return Factors(1.0, 1.0)
    return Factors(a.kn_per_force / b.kn_per_force, a.m_per_length / b.m_per_length)


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
