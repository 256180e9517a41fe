"""Which load models a rating runs at which level, and each model made ready for one section.

- Levels: the rating asks for levels by the method's names ("design inventory", "legal", ...
  for LRFR; "inventory", "operating" for LFR and ASR); the short names "inventory" and
  "operating" also name the LRFR design levels.
- Vehicles: with none named, the defaults of ``data/vehicles.toml`` by method and level (HL-93
  for the LRFR design levels; the legal loads, NRL, SU4-SU7, EV2, EV3 at the legal level; HS20
  for LFR and ASR). A named model is rated at the levels its category belongs to.
- Dynamic allowance, once: the library vehicles carry IM on their axles already. Every case of
  a model is given the rating's allowance instead of its own (axles and the train's patches
  take IM; the lane load none in LRFR, I in LFR and ASR, AASHTO Standard Specifications
  3.8.2, from memory, unconfirmed), so the exact search finds the governing position of the
  load with the allowance the rating uses, and the allowance is never applied twice.
- The lane-type legal load: its single-truck case only on spans over 200 ft; its two-truck case
  keeps its own scope (negative moment, interior reactions) (MBE 6A.4.4.2.1, from memory,
  unconfirmed).

Example:
    >>> rating_levels(("inventory", "legal"), "LRFR")
    ('design inventory', 'legal')
    >>> default_vehicles("LRFR", "design operating")
    ('HL-93',)
    >>> from vehicles.library.catalog import get_model
    >>> type3 = with_allowance(get_model("Type 3"), 0.2, 0.0)
    >>> type3.cases[0].axle_allowance, type3.cases[0].lane_allowance
    (0.2, 0.0)
    >>> lane_type = get_model("Type 3-3 lane-type")
    >>> [c.name for c in for_span(lane_type, 120.0).cases]     # 120 ft: two trucks only
    ['two Type 3-3 x 0.75 + lane']
    >>> len(for_span(lane_type, 201.0).cases)
    2
"""

from __future__ import annotations

import dataclasses
from dataclasses import dataclass

from influence.errors import ModelError
from influence.rating.load_factors import ALLOWABLE_LEVELS, LRFR_LEVELS, METHODS
from influence.rating.tables import data_file
from vehicles.loadmodel import LoadModel

VEHICLES_FILE = "vehicles.toml"
SHORT_LEVELS = {"inventory": "design inventory", "operating": "design operating"}
"""Short level names that name the LRFR design levels."""


def rating_levels(levels: tuple[str, ...], method: str, source: str = "") -> tuple[str, ...]:
    """The levels asked for, in the method's own names, each once.

    Raises:
        ModelError: for a level the method does not rate at.
    """
    allowed = LRFR_LEVELS if method == "LRFR" else ALLOWABLE_LEVELS
    found = []
    for level in levels:
        name = SHORT_LEVELS.get(level, level) if method == "LRFR" else level
        if name not in allowed:
            raise ModelError(f"level {level!r} is not a {method} rating level", source=source,
                             item="level",
                             fix="use one of: " + ", ".join(f'"{a}"' for a in allowed) + (
                                 " (LFR and ASR rate legal vehicles and permits at "
                                 "inventory and operating)" if method != "LRFR" else ""))
        found.append(name)
    return tuple(dict.fromkeys(found))


def default_vehicles(method: str, level: str) -> tuple[str, ...]:
    """The library names rated at a level when no vehicle is named."""
    return tuple(data_file(VEHICLES_FILE)["defaults"][method].get(level, ()))


def levels_of(model: LoadModel, method: str) -> tuple[str, ...]:
    """The levels a named load model is rated at, by its category.

    Raises:
        ModelError: for a category that is not rated (fatigue, deflection).
    """
    if method not in METHODS:
        raise ModelError(f"unknown method {method!r}", item="rating.method",
                         fix="use one of: " + ", ".join(METHODS))
    table = data_file(VEHICLES_FILE)["levels"][method]
    if model.category not in table:
        raise ModelError(f"{model.name} is a {model.category} load model", item="vehicle",
                         fix="rate design, legal, specialized hauling, notional, emergency or "
                             "permit load models, or a vehicle file of your own")
    return tuple(table[model.category])


def with_allowance(model: LoadModel, vehicle: float, lane: float) -> LoadModel:
    """The model with every case's dynamic allowances set: ``vehicle`` on the axles and the
    train's own patches, ``lane`` on lane and knife-edge loads [-]."""
    cases = tuple(dataclasses.replace(case, axle_allowance=vehicle, patch_allowance=vehicle,
                                      lane_allowance=lane) for case in model.cases)
    return dataclasses.replace(model, cases=cases)


@dataclass(frozen=True)
class LaneTypeRule:
    """Where the lane-type legal load applies, and the weight its posting takes.

    Attributes:
        model: library name of the lane-type legal load.
        long_span_case: its case for spans over ``minimum_span_ft``.
        minimum_span_ft: span beyond which that case applies [ft].
        posting_weight_of: the vehicle whose weight its posting takes.
        marks: source and confidence of the span rule and of the posting weight.
    """

    model: str
    long_span_case: str
    minimum_span_ft: float
    posting_weight_of: str
    marks: tuple[str, str]


def lane_type_rule() -> LaneTypeRule:
    """The lane-type legal load's rule (``data/vehicles.toml``)."""
    row = data_file(VEHICLES_FILE)["lane_type"]
    return LaneTypeRule(row["model"], row["long_span_case"], float(row["minimum_span_ft"]),
                        row["posting_weight_of"], (row["mark"], row["posting_weight_mark"]))


def for_span(model: LoadModel, span_feet: float) -> LoadModel:
    """The model as it applies on a span [ft]: the lane-type load's single-truck case is kept
    on spans over 200 ft only; every other model is returned as it is."""
    rule = lane_type_rule()
    if model.name != rule.model or span_feet > rule.minimum_span_ft:
        return model
    kept = tuple(case for case in model.cases if case.name != rule.long_span_case)
    return dataclasses.replace(model, cases=kept)
