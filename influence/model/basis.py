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

from dataclasses import dataclass, field
from typing import Any

from influence.errors import ModelError
from influence.model.fields import check_keys, read_number
from influence.model.structure import Model

LIVE_LOAD = "LL"
"""The name combinations use for the live load."""

LOAD_KEYS = {"name", "load", "uniform", "members", "from", "to", "point", "at"}
COMBINATION_KEYS = {"name", "factors"}
LIVE_KEYS = {"distribution", "multiple_presence", "vehicles", "deflection_limit", "adjust",
             "deflection_vehicles"}
SECTION_KEYS = {"per_span", "step", "extra"}


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
    loads = tuple(_dead_load(entry, number, model, source)
                  for number, entry in enumerate(_entries(document, "loads", source), start=1))
    combinations = tuple(_combination(entry, number, source) for number, entry in
                         enumerate(_entries(document, "combinations", source), start=1))
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
    live_table = _table(document.get("live_load", {}), "live_load", LIVE_KEYS, source)
    limit = live_table.get("deflection_limit")
    live = LiveLoadSettings(
        distribution=_positive(live_table.get("distribution", 1.0), "live_load.distribution",
                               source),
        multiple_presence=_positive(live_table.get("multiple_presence", 1.0),
                                    "live_load.multiple_presence", source),
        vehicles=tuple(str(v) for v in live_table.get("vehicles", [])),
        deflection_vehicles=tuple(str(v) for v in live_table.get("deflection_vehicles", [])),
        deflection_limit=None if limit is None else _positive(
            limit, "live_load.deflection_limit", source),
        adjust={str(k): read_number(v, f"live_load.adjust.{k}", source) for k, v in
                _table(live_table.get("adjust", {}), "live_load.adjust",
                       set(live_table.get("adjust", {})), source).items()},
    )
    section_table = _table(document.get("sections", {}), "sections", SECTION_KEYS, source)
    per_span = section_table.get("per_span", 10)
    if not isinstance(per_span, int) or isinstance(per_span, bool) or per_span < 1:
        raise ModelError(f"per_span = {per_span!r}", source=source, item="sections.per_span",
                         fix="give a whole number of divisions, 1 or more (10: tenth points)")
    step = section_table.get("step")
    sections = SectionSettings(
        per_span=per_span,
        step=None if step is None else _positive(step, "sections.step", source),
        extra=tuple(str(e) for e in section_table.get("extra", [])),
    )
    return DesignBasis(loads, combinations, live, sections)


def _entries(document: dict[str, Any], key: str, source: str) -> list[dict[str, Any]]:
    value = document.get(key, [])
    if not isinstance(value, list) or not all(isinstance(v, dict) for v in value):
        raise ModelError(f"{key} must be a list of tables", source=source, item=key,
                         fix=f"write each entry as [[{key}]]")
    return value


def _table(value: Any, item: str, allowed: set[str], source: str) -> dict[str, Any]:
    if not isinstance(value, dict):
        raise ModelError(f"{item} must be a table", source=source, item=item,
                         fix=f"write it as [{item}]")
    check_keys(value, allowed, item, source)
    return value


def _positive(value: Any, item: str, source: str) -> float:
    number = read_number(value, item, source)
    if number <= 0:
        raise ModelError(f"{number:g} is not positive", source=source, item=item,
                         fix="give a positive number")
    return number


def _dead_load(entry: dict[str, Any], number: int, model: Model, source: str) -> DeadLoad:
    item = f"loads[{number}]"
    _table(entry, item, LOAD_KEYS, source)
    name = str(entry.get("name", f"load {number}"))
    item = f"load {name!r}"
    if "load" not in entry:
        raise ModelError("no load name", source=source, item=item,
                         fix='add load = "DC" (or DW, ...): the name combinations factor')
    load = str(entry["load"])
    if load == LIVE_LOAD:
        raise ModelError(f"{LIVE_LOAD} is the live load's name", source=source, item=item,
                         fix="give permanent loads another name, such as DC or DW")
    if ("uniform" in entry) == ("point" in entry):
        raise ModelError("give either uniform or point", source=source, item=item,
                         fix="uniform = intensity along the path, or point = force with at")
    path_members = {leg.member for leg in model.path}
    if "point" in entry:
        if "at" not in entry:
            raise ModelError("a point load needs its chainage", source=source, item=item,
                             fix="add at = chainage")
        for key in ("members", "from", "to"):
            if key in entry:
                raise ModelError(f"{key!r} does not apply to a point load", source=source,
                                 item=item, fix="use at = chainage")
        return DeadLoad(name, load, point=_positive(entry["point"], item, source),
                        at=read_number(entry["at"], item, source))
    members = tuple(str(m) for m in entry.get("members", []))
    for member in members:
        if member not in path_members:
            raise ModelError(f"member {member!r} is not on the path", source=source, item=item,
                             fix="dead loads act on path members: " + ", ".join(
                                 leg.member for leg in model.path))
    start = read_number(entry["from"], item, source) if "from" in entry else None
    end = read_number(entry["to"], item, source) if "to" in entry else None
    if start is not None and end is not None and end <= start:
        raise ModelError(f"from {start:g} to {end:g} is empty", source=source, item=item,
                         fix="give from < to")
    return DeadLoad(name, load, uniform=_positive(entry["uniform"], item, source),
                    members=members, start=start, end=end)


def _combination(entry: dict[str, Any], number: int, source: str) -> Combination:
    item = f"combinations[{number}]"
    _table(entry, item, COMBINATION_KEYS, source)
    name = str(entry.get("name", f"combination {number}"))
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
