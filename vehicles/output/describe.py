"""Plain descriptions of load models for display: library rows and one model in full.

The descriptions are dictionaries of text, numbers, lists and None only, ready for JSON and for
the table formatter in :mod:`vehicles.output.tables`. Every quantity sits beside its unit label.

Lengths and totals of a train count what is finite: an unlimited uniform load (the trailing load
of Cooper E80, say) is reported apart as ``unlimited_uniform`` [force/length], and ``length`` runs
from the front of the train to the start of that load. A ranged gap or patch length gives a
``[min, max]`` pair; fixed values give equal ends.

Example:
    >>> from vehicles.library.catalog import get_model
    >>> row = summary(get_model("HL-93"))
    >>> row["cases"], row["total_load"], row["length"]
    (3, [50.0, 144.0], [4.0, 1056.0])
"""

from __future__ import annotations

import math
from typing import Any

import numpy as np

from vehicles.loadmodel import LoadCase, LoadModel
from vehicles.train import Arrangement, Axle, Span, Train
from vehicles.units import labels


def _span(value: Span | None) -> float | list[float] | None:
    if value is None:
        return None
    return list(value) if isinstance(value, tuple) else value


def _finite_totals(arrangement: Arrangement) -> tuple[float, float, float]:
    """Finite load [force], finite length [length], unlimited intensity [force/length]."""
    extents = arrangement.patch_ends - arrangement.patch_starts
    finite = np.isfinite(extents)
    load = float(arrangement.axle_loads.sum() + (arrangement.patch_intensities * extents)[finite]
                 .sum())
    points = np.concatenate([arrangement.axle_offsets, arrangement.patch_starts,
                             arrangement.patch_ends])
    points = points[np.isfinite(points)]
    unlimited = float(arrangement.patch_intensities[~finite].sum())
    return load, float(points.max() - points.min()), unlimited


def train_totals(train: Train) -> dict[str, Any]:
    """Total finite load and length of a train over its ranges, as ``[min, max]`` pairs.

    Example:
        >>> truck = Train("t", (Axle(8.0), Axle(32.0, 14.0), Axle(32.0, (14.0, 30.0))))
        >>> train_totals(truck)
        {'total_load': [72.0, 72.0], 'length': [28.0, 44.0], 'unlimited_uniform': None}
    """
    low = _finite_totals(train.arranged([r.low for r in train.ranged_values]))
    high = _finite_totals(train.arranged([r.high for r in train.ranged_values]))
    return {
        "total_load": [low[0], high[0]],
        "length": [low[1], high[1]],
        "unlimited_uniform": low[2] or None,
    }


def _train_details(train: Train) -> dict[str, Any]:
    offsets = train.arranged()
    items: list[dict[str, Any]] = []
    axle, patch = 0, 0
    for index, item in enumerate(train.items):
        gap = None if index == 0 else _span(item.gap)
        if isinstance(item, Axle):
            items.append({"kind": "axle", "load": item.load, "gap": gap,
                          "offset": float(offsets.axle_offsets[axle])})
            axle += 1
            continue
        start, end = offsets.patch_starts[patch], offsets.patch_ends[patch]
        items.append({"kind": "uniform", "intensity": item.intensity,
                      "length": _span(item.length), "gap": gap,
                      "start": float(start) if math.isfinite(start) else None,
                      "end": float(end) if math.isfinite(end) else None})
        patch += 1
    return {"name": train.name, **train_totals(train), "items": items}


def _case_details(case: LoadCase) -> dict[str, Any]:
    return {
        "name": case.name,
        "factor": case.factor,
        "dynamic_allowance": case.axle_allowance,
        "uniform_dynamic_allowance": case.patch_allowance,
        "lane": case.lane,
        "lane_dynamic_allowance": case.lane_allowance,
        "lane_clear_of_axles": case.lane_clear_of_train,
        "knife_edge_for_moment": case.knife_edge_moment,
        "knife_edge_for_shear": case.knife_edge_shear,
        "scope": list(case.scope.effects) or ["all responses"],
        "note": case.note,
        "train": None if case.train is None else _train_details(case.train),
    }


def summary(model: LoadModel) -> dict[str, Any]:
    """One library row: name, category, standard, units, number of cases, and the range over the
    cases of the train's finite total load [force] and length [length] (None for lane-only
    models)."""
    trains = [train_totals(c.train) for c in model.cases if c.train is not None]
    loads = [value for t in trains for value in t["total_load"]]
    lengths = [value for t in trains for value in t["length"]]
    return {
        "name": model.name,
        "category": model.category,
        "title": model.title,
        "standard": model.standard,
        "units": model.units,
        "cases": len(model.cases),
        "total_load": [min(loads), max(loads)] if loads else None,
        "length": [min(lengths), max(lengths)] if lengths else None,
        "unlimited_uniform": any(t["unlimited_uniform"] for t in trains),
    }


def details(model: LoadModel) -> dict[str, Any]:
    """One model in full: source, unit labels, notes, adjustments, each case with its train and
    the traffic data of a set of fatigue lorries (shares [-], heavy vehicles [1/year])."""
    unit = labels(model.units)
    return {
        "name": model.name,
        "category": model.category,
        "title": model.title,
        "standard": model.standard,
        "clause": model.clause,
        "units": model.units,
        "unit_labels": {"force": unit.force, "length": unit.length,
                        "force_per_length": unit.force_per_length, "moment": unit.moment},
        "notes": list(model.notes),
        "adjustments": [{"name": a.name, "value": a.value, "scales": list(a.scales),
                         "sets": list(a.sets), "note": a.note} for a in model.adjustments],
        "cases": [_case_details(case) for case in model.cases],
        "traffic_types": [{"name": t.name, "shares": dict(t.shares), "note": t.note}
                          for t in model.traffic_types],
        "traffic_categories": [{"name": t.name,
                                "heavy_vehicles_per_year": t.heavy_vehicles_per_year,
                                "note": t.note} for t in model.traffic_categories],
    }
