"""The design basis in a model file: dead loads, combinations, live-load settings, sections.

These tables sit beside the structure in the same TOML file::

    [[loads]]
    name = "deck slab"          # what it is
    load = "DC"                 # the load name that combinations factor
    uniform = 24.0              # [force/length], downward; on the whole path unless limited:
    members = ["span2"]         #   to named path members, and/or
    from = 10.0                 #   to a chainage range [length]
    to = 30.0
    [[loads]]
    name = "diaphragm"
    load = "DC"
    point = 35.0                # [force], downward
    at = 24.0                   # chainage [length]

    [[combinations]]
    name = "Strength I"
    factors = { DC = [1.25, 0.90], DW = [1.50, 0.65], LL = 1.75 }   # [max, min] or one value

    [live_load]
    distribution = 0.6          # lanes (or fraction of a lane) carried by this girder line
    multiple_presence = 1.2
    vehicles = ["HL-93"]        # default load models for envelopes and reports
    adjust = { alpha = 1.21 }   # inputs of those load models (see `influence vehicles NAME`)
    deflection_limit = 800      # live-load deflection limit: span / 800
    deflection_vehicles = ["HL-93 deflection"]   # load models of that check, if not vehicles

    [sections]
    per_span = 10               # tenth points (common practice for girders)
    step = 0.5                  # or a finer regular spacing [length]
    extra = ["C1@2.0", "37.5"]  # more sections, on or off the path

The live load's name in combinations is "LL" (it stands for the vehicles with their dynamic load
allowance, times the distribution and multiple presence factors).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import Any

from influence.errors import ModelError
from influence.model.fields import (
    check_keys,
    read_integer,
    read_number,
    read_quantity,
    read_text,
    read_texts,
    table,
    tables,
)
from influence.model.keys import COMBINATION_KEYS, LIVE_KEYS, LOAD_KEYS, SECTION_KEYS
from influence.model.limits import MAX_PER_SPAN, MAX_SECTIONS, check_size, estimated_sections
from influence.model.locations import check_chainage, check_location
from influence.model.path import CHAINAGE_TOLERANCE, PathGeometry, trace
from influence.model.structure import Model

LIVE_LOAD = "LL"
"""The name combinations use for the live load."""

@dataclass(frozen=True)
class DeadLoad:
    """A permanent load on the path, downward.

    Attributes:
        name: description.
        load: load name used by combinations (DC, DW, ...).
        uniform: intensity [force/length] (0 for a point load).
        point: force [force] (0 for a uniform load).
        members: path members the uniform load covers (empty: all).
        start, end: chainage range [length] of a uniform load (None: unlimited that side).
        at: chainage of a point load [length].
    """

    name: str
    load: str
    uniform: float = 0.0
    point: float = 0.0
    members: tuple[str, ...] = ()
    start: float | None = None
    end: float | None = None
    at: float | None = None


@dataclass(frozen=True)
class Combination:
    """Named load factors: (max, min) per load name; the live load is "LL"."""

    name: str
    factors: tuple[tuple[str, float, float], ...]

    def factor(self, load: str) -> tuple[float, float]:
        for name, high, low in self.factors:
            if name == load:
                return high, low
        return 0.0, 0.0


@dataclass(frozen=True)
class LiveLoadSettings:
    distribution: float = 1.0
    multiple_presence: float = 1.0
    vehicles: tuple[str, ...] = ()
    deflection_limit: float | None = None  # N in span / N
    deflection_vehicles: tuple[str, ...] = ()  # load models of the deflection check, if others
    adjust: dict[str, float] = field(default_factory=dict)  # load-model adjustments by name

    @property
    def scale(self) -> float:
        """What one lane's effect is multiplied by for this girder line [-]."""
        return self.distribution * self.multiple_presence


@dataclass(frozen=True)
class SectionSettings:
    per_span: int = 10
    step: float | None = None
    extra: tuple[str, ...] = ()


@dataclass(frozen=True)
class DesignBasis:
    """Everything in a model file beyond the structure."""

    loads: tuple[DeadLoad, ...] = ()
    combinations: tuple[Combination, ...] = ()
    live: LiveLoadSettings = LiveLoadSettings()
    sections: SectionSettings = SectionSettings()

    @property
    def load_names(self) -> tuple[str, ...]:
        return tuple(dict.fromkeys(load.load for load in self.loads))


def design_from_document(document: dict[str, Any], model: Model, source: str = "") -> DesignBasis:
    """The design basis of a parsed model file, every value typed and every place on the
    structure (loads, sections) checked against it."""
    path = trace(model)
    units = model.units
    loads = tuple(_dead_load(entry, number, model, path, source)
                  for number, entry in enumerate(tables(document, "loads", source), start=1))
    combinations = tuple(_combination(entry, number, source) for number, entry in
                         enumerate(tables(document, "combinations", source), start=1))
    names = [c.name for c in combinations]
    if len(set(names)) != len(names):
        raise ModelError("a combination name is used twice", source=source, item="combinations",
                         fix="give each combination its own name")
    known = {load.load for load in loads} | {LIVE_LOAD}
    for combination in combinations:
        for load, _, _ in combination.factors:
            if load not in known:
                raise ModelError(
                    f"factor on unknown load {load!r}", source=source,
                    item=f"combination {combination.name}",
                    fix="use the load names of [[loads]] (" + ", ".join(sorted(known)) + ")",
                )
    live = _live_load(table(document.get("live_load"), "live_load", source), source)
    sections = _sections(table(document.get("sections"), "sections", source), model, path,
                         units, source)
    return DesignBasis(loads, combinations, live, sections)


def _live_load(given: dict[str, Any], source: str) -> LiveLoadSettings:
    check_keys(given, LIVE_KEYS, "live_load", source)
    limit = given.get("deflection_limit")
    adjust = table(given.get("adjust"), "live_load.adjust", source)
    return LiveLoadSettings(
        distribution=_positive(given.get("distribution", 1.0), "live_load.distribution",
                               source),
        multiple_presence=_positive(given.get("multiple_presence", 1.0),
                                    "live_load.multiple_presence", source),
        vehicles=_model_names(given.get("vehicles", []), "live_load.vehicles", source),
        deflection_vehicles=_model_names(given.get("deflection_vehicles", []),
                                         "live_load.deflection_vehicles", source),
        deflection_limit=None if limit is None else _positive(
            limit, "live_load.deflection_limit", source),
        adjust={str(k): read_number(v, f"live_load.adjust.{k}", source)
                for k, v in adjust.items()},
    )


def _model_names(value: Any, item: str, source: str) -> tuple[str, ...]:
    if isinstance(value, str):
        raise ModelError(f"expected a list of load model names, got the text {value!r}",
                         source=source, item=item,
                         fix=f'write a list, even of one: ["{value}"]')
    names = read_texts(value, item, source)
    for number, name in enumerate(names, start=1):
        if not name.strip():
            raise ModelError("an empty load model name", source=source,
                             item=f"{item}[{number}]",
                             fix="give a library name such as \"HL-93\" or a vehicle file")
    return names


def _sections(given: dict[str, Any], model: Model, path: PathGeometry, units: str,
              source: str) -> SectionSettings:
    check_keys(given, SECTION_KEYS, "sections", source)
    per_span = read_integer(given.get("per_span", 10), "sections.per_span", source)
    check_size(per_span, MAX_PER_SPAN, "divisions of a span", "sections.per_span", source,
               fix=f"give at most {MAX_PER_SPAN} divisions")
    step = given.get("step")
    if step is not None:
        step = _positive(read_quantity(step, "step", "sections.step", source, units),
                         "sections.step", source)
    spans = 1 + sum(1 for leg in path.legs[:-1] if model.node(leg.exit_node).support.is_support)
    check_size(estimated_sections(path.total_length, spans, per_span, step), MAX_SECTIONS,
               "envelope sections", "sections.step" if step else "sections.per_span", source,
               fix="give a coarser step or fewer divisions")
    extra = _locations(given.get("extra", []), "sections.extra", source)
    for number, location in enumerate(extra, start=1):
        check_location(model, path, location, f"sections.extra[{number}]", source)
    return SectionSettings(per_span=per_span, step=step, extra=extra)


def _locations(value: Any, item: str, source: str) -> tuple[str, ...]:
    """A list of locations: text, or a number standing for a chainage."""
    if isinstance(value, list):
        value = [repr(float(entry)) if isinstance(entry, int | float) and not isinstance(
            entry, bool) else entry for entry in value]
    return read_texts(value, item, source)


def _positive(value: Any, item: str, source: str) -> float:
    number = read_number(value, item, source)
    if number <= 0:
        raise ModelError(f"{number:g} is not positive", source=source, item=item,
                         fix="give a positive number")
    return number


def _dead_load(entry: dict[str, Any], number: int, model: Model, path: PathGeometry,
               source: str) -> DeadLoad:
    item = f"loads[{number}]"
    check_keys(entry, LOAD_KEYS, item, source)
    name = read_text(entry.get("name", f"load {number}"), f"{item}.name", source)
    item = f"load {name!r}"
    if "load" not in entry:
        raise ModelError("no load name", source=source, item=item,
                         fix='add load = "DC" (or DW, ...): the name combinations factor')
    load = read_text(entry["load"], f"{item}.load", source)
    if not load.strip():
        raise ModelError("an empty load name", source=source, item=item,
                         fix='give load = "DC" (or DW, ...)')
    if load == LIVE_LOAD:
        raise ModelError(f"{LIVE_LOAD} is the live load's name", source=source, item=item,
                         fix="give permanent loads another name, such as DC or DW")
    if ("uniform" in entry) == ("point" in entry):
        raise ModelError("give either uniform or point", source=source, item=item,
                         fix="uniform = intensity along the path, or point = force with at")
    units = model.units
    if "point" in entry:
        if "at" not in entry:
            raise ModelError("a point load needs its chainage", source=source, item=item,
                             fix="add at = chainage")
        for key in ("members", "from", "to"):
            if key in entry:
                raise ModelError(f"{key!r} does not apply to a point load", source=source,
                                 item=item, fix="use at = chainage")
        force = _positive(read_quantity(entry["point"], "point", f"{item}.point", source,
                                        units), f"{item}.point", source)
        at = read_quantity(entry["at"], "at", f"{item}.at", source, units)
        check_chainage(path, at, f"{item}.at", source, what="point load at")
        return DeadLoad(name, load, point=force, at=min(max(at, 0.0), path.total_length))
    path_members = [leg.member for leg in path.legs]
    members = read_texts(entry.get("members", []), f"{item}.members", source)
    for member in members:
        if member not in path_members:
            raise ModelError(f"member {member!r} is not on the path", source=source, item=item,
                             fix="dead loads act on path members: " + ", ".join(path_members))
    start = read_quantity(entry["from"], "from", f"{item}.from", source, units) \
        if "from" in entry else None
    end = read_quantity(entry["to"], "to", f"{item}.to", source, units) if "to" in entry else None
    for key, value in (("from", start), ("to", end)):
        if value is not None:
            check_chainage(path, value, f"{item}.{key}", source, what=key)
    if start is not None and end is not None and end <= start:
        raise ModelError(f"from {start:g} to {end:g} is empty", source=source, item=item,
                         fix="give from < to")
    intensity = _positive(read_quantity(entry["uniform"], "uniform", f"{item}.uniform", source,
                                        units), f"{item}.uniform", source)
    if members and (start is not None or end is not None):
        lo = -math.inf if start is None else start
        hi = math.inf if end is None else end
        slack = CHAINAGE_TOLERANCE * max(path.total_length, 1.0)
        if not any(min(leg.end_chainage, hi) - max(leg.start_chainage, lo) > slack
                   for leg in path.legs if leg.member in members):
            raise ModelError("from and to lie outside the members named", source=source,
                             item=item, fix="give a range that covers part of those members")
    return DeadLoad(name, load, uniform=intensity, members=members, start=start, end=end)


def _combination(entry: dict[str, Any], number: int, source: str) -> Combination:
    item = f"combinations[{number}]"
    check_keys(entry, COMBINATION_KEYS, item, source)
    name = read_text(entry.get("name", f"combination {number}"), f"{item}.name", source)
    item = f"combination {name!r}"
    factors = entry.get("factors")
    if not isinstance(factors, dict) or not factors:
        raise ModelError("no factors", source=source, item=item,
                         fix='give factors = { DC = [1.25, 0.90], LL = 1.75 }')
    parsed = []
    for load, value in factors.items():
        if isinstance(value, list):
            if len(value) != 2:
                raise ModelError(f"factor on {load} is {value!r}", source=source, item=item,
                                 fix="give one factor, or [max, min]")
            high, low = (read_number(v, f"{item}.{load}", source) for v in value)
        else:
            high = low = read_number(value, f"{item}.{load}", source)
        if high < 0 or low < 0:
            raise ModelError(f"negative factor on {load}", source=source, item=item,
                             fix="give factors of zero or more")
        if low > high:
            raise ModelError(f"factor range on {load} is [{high:g}, {low:g}]: min above max",
                             source=source, item=item, fix="write [max, min]")
        parsed.append((str(load), high, low))
    return Combination(name, tuple(parsed))
