"""Which vehicles cross, and how often: a spectrum file, or a fatigue load model with the trucks
a day or a traffic category.

- A spectrum (weigh-in-motion trucks, :mod:`influence.fatigue.spectrum`): each row passes its
  ``per_day`` times a day, or its share of the (ADTT)SL for ``count`` columns; 365 days a year.
- A load model with the single-lane average daily truck traffic: each passes 365 x (ADTT)SL
  times a year, (ADTT)SL = p x ADTT (AASHTO LRFD 3.6.1.4.2, Eq. 6.6.1.2.5-3 counts 365 days).
- A load model with traffic categories (EN 1991-2 4.6.1, Table 4.5): the category's heavy
  vehicles a year on the slow lane; a set of lorries (FLM4) shares them by the traffic type's
  shares (Table 4.7).

A case's factor multiplies its axle loads; its dynamic allowance does not (the [fatigue] table's
dynamic allowance acts on the stress ranges instead, see :mod:`influence.fatigue.settings`).

Example:
    >>> from vehicles.library.catalog import get_model
    >>> traffic = vehicle_traffic(get_model("FLM4"), traffic_category="category 2",
    ...                           traffic_type="local traffic")
    >>> traffic.fleet.labels[0], float(traffic.fleet.passages_per_year[0])  # 80 % of 0.5e6
    ('lorry 1', 400000.0)
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from influence.errors import ModelError
from influence.fatigue.fleet import Fleet
from influence.fatigue.settings import DAYS_PER_YEAR
from influence.fatigue.spectrum import TrafficSpectrum
from vehicles.loadmodel import LoadModel
from vehicles.train import Axle, Train


@dataclass(frozen=True)
class Traffic:
    """The vehicles of a run with their passages, and how they were found.

    Attributes:
        fleet: the vehicles and their passages a year.
        description: one line for headers ("HL-93 fatigue, (ADTT)SL 850 a day").
        notes: remarks for the output (allowances not applied, converted units).
    """

    fleet: Fleet
    description: str
    notes: tuple[str, ...] = ()


def spectrum_traffic(spectrum: TrafficSpectrum, adtt_sl: float | None) -> Traffic:
    """The trucks of a spectrum file, passing as its frequency column says.

    Args:
        spectrum: the trucks, in the model's units.
        adtt_sl: single-lane trucks a day, needed for ``count`` columns.

    Raises:
        ModelError: for counts without a positive ``adtt_sl``.
    """
    daily = spectrum.daily_passages(adtt_sl)
    fleet = Fleet.of_spectrum(spectrum, daily * DAYS_PER_YEAR)
    per_day = float(daily.sum())
    how = (f"counts shared out over (ADTT)SL {adtt_sl:g} a day" if spectrum.frequency == "count"
           else "per_day column")
    return Traffic(fleet, f"spectrum {spectrum.source}: {len(spectrum.trucks)} trucks, "
                          f"{per_day:g} a day in the lane ({how})")


def vehicle_traffic(model: LoadModel, *, adtt_sl: float | None = None,
                    traffic_category: str | None = None,
                    traffic_type: str | None = None) -> Traffic:
    """The cases of a fatigue load model, passing (ADTT)SL times a day or as a traffic category
    and type say.

    Args:
        model: the load model, in the structure's units.
        adtt_sl: single-lane trucks a day (used when no traffic category is given).
        traffic_category: a traffic category of the model (heavy vehicles a year).
        traffic_type: a traffic type of the model (each lorry's share); needed for a model with
            several cases.

    Raises:
        ModelError: naming the missing or unknown input and the choices.
    """
    item = f"vehicle {model.name}"
    trains = [_axle_train(model, index) for index in range(len(model.cases))]
    if traffic_category is not None:
        categories = {c.name: c for c in model.traffic_categories}
        if traffic_category not in categories:
            raise ModelError(f"unknown traffic category {traffic_category!r}", item=item,
                             fix="use one of " + (", ".join(categories) or
                                                  "none: give the trucks a day (adtt)"))
        yearly = categories[traffic_category].heavy_vehicles_per_year
        basis = f"{traffic_category}: {yearly:g} heavy vehicles a year on the slow lane"
    elif adtt_sl is not None:
        yearly = DAYS_PER_YEAR * adtt_sl
        basis = f"(ADTT)SL {adtt_sl:g} trucks a day in one lane"
    else:
        offered = ", ".join(c.name for c in model.traffic_categories)
        raise ModelError("no traffic given", item=item,
                         fix="give adtt (in [fatigue] or --adtt)" +
                             (f" or a traffic category: {offered}" if offered else ""))
    shares = _shares(model, traffic_type, item)
    if traffic_type is not None:
        basis += f", {traffic_type} traffic"
    notes = tuple(f"{case.name}: its dynamic allowance {case.axle_allowance:g} is left to the "
                  "[fatigue] table, which applies one to the stress ranges"
                  for case in model.cases if case.axle_allowance)
    fleet = Fleet.of_trains(trains, yearly * shares, model.units,
                            [case.name for case in model.cases])
    return Traffic(fleet, f"{model.name}, {basis}", notes)


def _axle_train(model: LoadModel, index: int) -> Train:
    """Case ``index``'s axles times its factor (no allowance), refused with a lane load."""
    case = model.cases[index]
    where = f"vehicle {model.name}, case {case.name}"
    if case.train is None or case.lane or case.knife_edge_moment or case.knife_edge_shear:
        raise ModelError("a case with lane or knife-edge loads", item=where,
                         fix="use a fatigue vehicle of axles only: HL-93 fatigue, FLM3, FLM4 "
                             "or a vehicle file")
    if case.factor == 1.0:
        return case.train
    return Train(case.train.name, tuple(
        Axle(item.load * case.factor, item.gap) if isinstance(item, Axle) else item
        for item in case.train.items))


def _shares(model: LoadModel, traffic_type: str | None, item: str) -> np.ndarray:
    """Each case's share of the traffic."""
    types = {t.name: t for t in model.traffic_types}
    if traffic_type is None:
        if len(model.cases) == 1:
            return np.ones(1)
        raise ModelError(f"{len(model.cases)} vehicles and no traffic type to share the "
                         "traffic", item=item,
                         fix="give a traffic type: " + (", ".join(types) or
                                                       "the model has none; use one vehicle"))
    if traffic_type not in types:
        raise ModelError(f"unknown traffic type {traffic_type!r}", item=item,
                         fix="use one of " + (", ".join(types) or "none"))
    return np.array([types[traffic_type].share(case.name) for case in model.cases])
