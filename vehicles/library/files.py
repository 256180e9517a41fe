"""Reading vehicle files and load-model files (TOML) into :class:`LoadModel` values.

Two forms share one vocabulary. A vehicle file holds one ``[vehicle]`` table: a train, its
factors and lane load, read as a model with a single case. A model file holds ``[model]``
(name, title, units, standard, clause, notes, category), optional ``[[train]]`` tables that cases
refer to by name, ``[[case]]`` tables, optional ``[[adjustment]]`` tables and, for a set of
fatigue lorries, optional ``[[traffic_type]]`` tables (``name``, ``shares`` = a table of case
name = fraction of the heavy vehicles, ``note``) and ``[[traffic_category]]`` tables (``name``,
``heavy_vehicles_per_year`` on one slow lane, ``note``). ``category`` says what the model is for:
one of :data:`vehicles.loadmodel.CATEGORIES`. Every value is in the units
the file names (``units = "kN-m"`` or ``"kip-ft"``): loads [force], gaps and lengths [length],
uniform and lane loads [force/length].

A train is given by one of:

- ``loads`` (front to rear) and ``spacings`` (gap to the previous axle, one fewer than loads; a
  pair ``[min, max]`` is a range), with optional ``leading_uniform`` / ``trailing_uniform``
  tables (``intensity``, ``length`` = a number, a range or ``"unlimited"`` (the default), and
  ``gap`` to the nearest axle);
- ``items``, a list of ``{ axle = load, gap = ... }`` and
  ``{ uniform = intensity, length = ..., gap = ... }`` tables, front to rear;
- ``vehicles`` (names of ``[[train]]`` tables) joined by ``headways`` (clear gap from the rear of
  one to the front of the next; fixed or a range), one fewer than vehicles.

Case keys: ``name``, ``train`` (a ``[[train]]`` name, or a ``[case.train]`` table), the train
keys above inline, ``factor``, ``dynamic_allowance`` (on axles), ``uniform_dynamic_allowance``
(on the train's uniform loads), ``lane``, ``lane_dynamic_allowance`` (on lane and knife-edge
loads), ``lane_clear_of_axles``, ``knife_edge_for_moment``, ``knife_edge_for_shear``,
``neglect_relieving_axles`` (true: each axle acts only where the influence line is adverse, as
AASHTO LRFD 3.6.1.3.1 neglects axles that do not contribute), ``scope`` (list, such as
``["negative moment", "interior reaction"]``) and ``note``.

Example:
    >>> model = parse_load_model('''
    ... [vehicle]
    ... name = "hauler"
    ... units = "kN-m"
    ... loads = [60, 110, 110]
    ... spacings = [3.4, [1.3, 4.0]]
    ... dynamic_allowance = 0.25
    ... ''', "hauler.toml")
    >>> case = model.cases[0]
    >>> case.train.total_load(), case.axle_allowance, case.train.ranged_values[0].high
    (280.0, 0.25, 4.0)
"""

from __future__ import annotations

import difflib
import math
from collections.abc import Callable, Mapping
from functools import partial
from pathlib import Path
from typing import Any, TypeVar

from vehicles.errors import VehicleError
from vehicles.limits import MAX_RANGED
from vehicles.loadmodel import Adjustment, LoadCase, LoadModel, Scope
from vehicles.quantities import KEY_DIMENSIONS, quantity
from vehicles.tomlfile import parse_toml_text, read_toml_file
from vehicles.traffic import TrafficCategory, TrafficType
from vehicles.train import Axle, Item, Patch, Span, Train
from vehicles.units import SYSTEMS

MODEL_KEYS = ("name", "title", "units", "standard", "clause", "notes", "category")
TRAIN_KEYS = ("loads", "spacings", "leading_uniform", "trailing_uniform", "items", "vehicles",
              "headways")
CASE_KEYS = ("name", "train", "factor", "dynamic_allowance", "uniform_dynamic_allowance", "lane",
             "lane_dynamic_allowance", "lane_clear_of_axles", "knife_edge_for_moment",
             "knife_edge_for_shear", "neglect_relieving_axles", "scope", "note", *TRAIN_KEYS)
VEHICLE_KEYS = tuple(dict.fromkeys((*MODEL_KEYS, *CASE_KEYS)))
UNIFORM_KEYS = ("intensity", "length", "gap")
ADJUSTMENT_KEYS = ("name", "value", "scales", "sets", "note")
TRAFFIC_TYPE_KEYS = ("name", "shares", "note")
TRAFFIC_CATEGORY_KEYS = ("name", "heavy_vehicles_per_year", "note")
UNLIMITED = "unlimited"
STRUCTURE_KEYS = frozenset({"title", "units", "beam", "truss", "nodes", "members", "path",
                            "loads", "combinations", "live_load", "sections", "capacity",
                            "fatigue"})
"""Top-level keys of a structure model file: a file holding one is not a vehicle file."""

_CASE_FIELDS = {
    # file key: LoadCase field
    "factor": "factor",
    "dynamic_allowance": "axle_allowance",
    "uniform_dynamic_allowance": "patch_allowance",
    "lane": "lane",
    "lane_dynamic_allowance": "lane_allowance",
    "lane_clear_of_axles": "lane_clear_of_train",
    "knife_edge_for_moment": "knife_edge_moment",
    "knife_edge_for_shear": "knife_edge_shear",
}

T = TypeVar("T")


class _Reader:
    """Checks and converts raw TOML values, naming the file and the item in every error."""

    def __init__(self, source: str) -> None:
        self.source = source
        self.units: str | None = None  # known before any quantity is read

    def fail(self, where: str, problem: str, fix: str) -> VehicleError:
        return VehicleError(problem, source=self.source, item=where, fix=fix)

    def built(self, where: str, make: Callable[[], T]) -> T:
        """Call a constructor, re-raising its error with the file and the item."""
        try:
            return make()
        except VehicleError as error:
            item = f"{where} {error.item}" if error.item else where
            raise self.fail(item, error.problem, error.fix) from None

    def require(self, raw: Mapping[str, Any], where: str, keys: tuple[str, ...]) -> None:
        for key in keys:
            if key not in raw:
                raise self.fail(where, f"no {key}", f"give {key} = ...")

    def table(self, value: object, where: str, allowed: tuple[str, ...]) -> dict[str, Any]:
        if not isinstance(value, dict):
            raise self.fail(where, f"expected a table, found {value!r}", "give a TOML table")
        for key in value:
            if key not in allowed:
                close = difflib.get_close_matches(key, allowed, n=1)
                hint = f"did you mean '{close[0]}'?" if close else "allowed: " + ", ".join(allowed)
                raise self.fail(where, f"unknown key '{key}'", hint)
        return value

    def text(self, value: object, where: str) -> str:
        if not isinstance(value, str):
            raise self.fail(where, f"expected text, found {value!r}", 'give a quoted "string"')
        return value

    def texts(self, value: object, where: str) -> tuple[str, ...]:
        if not isinstance(value, list):
            raise self.fail(where, f"expected a list of text, found {value!r}", 'give ["..."]')
        return tuple(self.text(v, f"{where}[{i + 1}]") for i, v in enumerate(value))

    def flag(self, value: object, where: str) -> bool:
        if not isinstance(value, bool):
            raise self.fail(where, f"expected true or false, found {value!r}",
                            "give true or false (no quotes)")
        return value

    def number(self, value: object, where: str, *, positive: bool = False,
               key: str | None = None) -> float:
        """A number; for a ``key`` with a dimension also a quantity such as "32 kip"."""
        if key is not None and isinstance(value, str):
            if self.units is None:
                raise self.fail(where, f"{value!r} needs the file's units",
                                'give units = "kN-m" or "kip-ft" in the same table')
            value = quantity(value, key, self.units, item=where, source=self.source)
        if isinstance(value, bool) or not isinstance(value, int | float):
            fix = "give a number" if key is None else (
                f"give a number in the file's units, or a quantity such as "
                f"{KEY_DIMENSIONS[key].example}")
            raise self.fail(where, f"expected a number, found {value!r}", fix)
        number = float(value)
        if not math.isfinite(number) or number < 0 or (positive and number == 0):
            need = "positive" if positive else "zero or positive"
            raise self.fail(where, f"{number:g} is not allowed", f"give a {need} number")
        return number

    def span(self, value: object, where: str, *, positive: bool = False,
             key: str = "length") -> Span:
        if isinstance(value, list):
            if len(value) != 2:
                raise self.fail(where, f"a range needs two numbers, found {value!r}",
                                "give [min, max]")
            low = self.number(value[0], where, positive=positive, key=key)
            high = self.number(value[1], where, positive=positive, key=key)
            if low > high:
                raise self.fail(where, f"range [{low:g}, {high:g}] has min above max",
                                f"give [{high:g}, {low:g}]")
            return (low, high)
        return self.number(value, where, positive=positive, key=key)

    def length(self, value: object, where: str) -> Span | None:
        if value == UNLIMITED:
            return None
        return self.span(value, where, positive=True)

    def numbers(self, value: object, where: str, *, allow_empty: bool = False) -> list[object]:
        if not isinstance(value, list) or not (value or allow_empty):
            raise self.fail(where, f"expected a list, found {value!r}", "give [a, b, ...]")
        return value

    # trains

    def uniform(self, value: object, where: str, gap_default: Span = 0.0) -> Patch:
        raw = self.table(value, where, UNIFORM_KEYS)
        if "intensity" not in raw:
            raise self.fail(where, "no intensity", "give intensity = load per unit length")
        intensity = self.number(raw["intensity"], f"{where} intensity", positive=True,
                                key="intensity")
        length = self.length(raw.get("length", UNLIMITED), f"{where} length")
        gap = self.span(raw.get("gap", gap_default), f"{where} gap", key="gap")
        return Patch(intensity, length, gap)

    def axles(self, raw: Mapping[str, Any], where: str) -> list[Item]:
        loads = self.numbers(raw["loads"], f"{where} loads")
        spacings = self.numbers(raw.get("spacings", []), f"{where} spacings", allow_empty=True)
        if len(spacings) != len(loads) - 1:
            raise self.fail(f"{where} spacings",
                            f"{len(spacings)} spacings for {len(loads)} loads",
                            "give one spacing fewer than loads: the gap to the previous axle")
        items: list[Item] = [Axle(self.number(loads[0], f"{where} loads[1]", positive=True,
                                               key="loads"))]
        for index, (load, gap) in enumerate(zip(loads[1:], spacings, strict=True), start=2):
            axle_load = self.number(load, f"{where} loads[{index}]", positive=True, key="loads")
            axle_gap = self.span(gap, f"{where} spacings[{index - 1}]", positive=True,
                                 key="spacings")
            items.append(Axle(axle_load, axle_gap))
        if "leading_uniform" in raw:
            lead = self.uniform(raw["leading_uniform"], f"{where} leading_uniform")
            items[0] = Axle(items[0].load, lead.gap)  # type: ignore[union-attr]
            items.insert(0, Patch(lead.intensity, lead.length))
        if "trailing_uniform" in raw:
            items.append(self.uniform(raw["trailing_uniform"], f"{where} trailing_uniform"))
        return items

    def item(self, value: object, where: str, first: bool) -> Item:
        keys = ("axle", "uniform", "length", "gap")
        raw = self.table(value, where, keys)
        gap = 0.0 if first else self.span(raw.get("gap", 0.0), f"{where} gap", key="gap")
        if ("axle" in raw) == ("uniform" in raw):
            raise self.fail(where, "an item needs one of axle or uniform",
                            "give { axle = load } or { uniform = intensity, length = ... }")
        if "axle" in raw:
            if "length" in raw:
                raise self.fail(where, "an axle has no length", "remove length")
            return Axle(self.number(raw["axle"], f"{where} axle", positive=True, key="axle"), gap)
        intensity = self.number(raw["uniform"], f"{where} uniform", positive=True, key="uniform")
        return Patch(intensity, self.length(raw.get("length", UNLIMITED), f"{where} length"), gap)

    def train(self, raw: Mapping[str, Any], name: str, where: str,
              named: Mapping[str, Train]) -> Train:
        forms = [key for key in ("loads", "items", "vehicles") if key in raw]
        if len(forms) != 1:
            found = " and ".join(forms) if forms else "none of them"
            raise self.fail(where, f"a train needs one of loads, items or vehicles; found {found}",
                            "describe the train one way")
        others = {"loads": ("items", "vehicles", "headways"),
                  "items": ("spacings", "leading_uniform", "trailing_uniform", "headways"),
                  "vehicles": ("spacings", "leading_uniform", "trailing_uniform", "items")}
        for key in others[forms[0]]:
            if key in raw:
                raise self.fail(f"{where} {key}", f"'{key}' does not go with '{forms[0]}'",
                                f"remove {key}")
        if forms[0] == "loads":
            items = self.axles(raw, where)
            return self.built(where, lambda: Train(name, tuple(items)))
        if forms[0] == "items":
            listed = self.numbers(raw["items"], f"{where} items")
            made = [self.item(v, f"{where} items[{i + 1}]", i == 0) for i, v in enumerate(listed)]
            return self.built(where, lambda: Train(name, tuple(made)))
        return self.joined(raw, name, where, named)

    def joined(self, raw: Mapping[str, Any], name: str, where: str,
               named: Mapping[str, Train]) -> Train:
        names = self.texts(raw["vehicles"], f"{where} vehicles")
        headways = self.numbers(raw.get("headways", []), f"{where} headways", allow_empty=True)
        if not names or len(headways) != len(names) - 1:
            raise self.fail(f"{where} headways", f"{len(headways)} headways for {len(names)} "
                            "vehicles", "give one headway fewer than vehicles")
        parts = []
        for index, part_name in enumerate(names):
            if part_name not in named:
                close = difflib.get_close_matches(part_name, list(named), n=1)
                hint = f"did you mean '{close[0]}'?" if close else "define it in a [[train]] table"
                raise self.fail(f"{where} vehicles[{index + 1}]",
                                f"no train named '{part_name}'", hint)
            parts.append(named[part_name])
        joined = parts[0]
        for index, (part, headway) in enumerate(zip(parts[1:], headways, strict=True)):
            gap = self.span(headway, f"{where} headways[{index + 1}]", key="headways")
            joined = self.built(where, partial(joined.followed_by, part, gap))
        return Train(name, joined.items)

    # cases and models

    def case(self, raw: Mapping[str, Any], where: str, named: Mapping[str, Train]) -> LoadCase:
        name = self.text(raw.get("name", ""), f"{where} name") or where
        where = f"case '{name}'" if "name" in raw and where.startswith("[[") else where
        train: Train | None = None
        reference = raw.get("train")
        has_inline = any(key in raw for key in TRAIN_KEYS)
        if reference is not None and has_inline:
            raise self.fail(f"{where} train", "a train is given twice",
                            "give train = \"name\" or the train keys, not both")
        if isinstance(reference, str):
            if reference not in named:
                close = difflib.get_close_matches(reference, list(named), n=1)
                hint = f"did you mean '{close[0]}'?" if close else "define it in a [[train]] table"
                raise self.fail(f"{where} train", f"no train named '{reference}'", hint)
            train = named[reference]
        elif reference is not None:
            sub = self.table(reference, f"{where} train", ("name", *TRAIN_KEYS))
            train_name = self.text(sub.get("name", name), f"{where} train name")
            train = self.train(sub, train_name, f"{where} train", named)
        elif has_inline:
            train = self.train(raw, name, where, named)
        if train is not None and len(train.ranged_values) > MAX_RANGED:
            raise self.fail(f"{where} train", f"{len(train.ranged_values)} ranged gaps and "
                            f"lengths are more than {MAX_RANGED}",
                            "fix some of them: the search for the governing values grows as 3 "
                            "to the power of their number")
        values = {field: self.number(raw[key], f"{where} {key}",
                                     key=key if key in KEY_DIMENSIONS else None)
                  for key, field in _CASE_FIELDS.items() if key in raw}
        scope = self.texts(raw.get("scope", []), f"{where} scope")
        note = self.text(raw.get("note", ""), f"{where} note")
        neglect = self.flag(raw.get("neglect_relieving_axles", False),
                            f"{where} neglect_relieving_axles")
        return self.built(where, lambda: LoadCase(
            name, train, scope=Scope(scope), note=note, neglect_relieving_axles=neglect,
            **values))  # type: ignore[arg-type]

    def adjustment(self, value: object, where: str) -> Adjustment:
        raw = self.table(value, where, ADJUSTMENT_KEYS)
        self.require(raw, where, ("name", "value"))
        name = self.text(raw["name"], f"{where} name")
        value = self.number(raw["value"], f"{where} value")
        scales = self.texts(raw.get("scales", []), f"{where} scales")
        sets = self.texts(raw.get("sets", []), f"{where} sets")
        note = self.text(raw.get("note", ""), f"{where} note")
        return self.built(where, partial(Adjustment, name, value, scales, sets, note))

    def traffic_type(self, value: object, where: str) -> TrafficType:
        raw = self.table(value, where, TRAFFIC_TYPE_KEYS)
        self.require(raw, where, ("name", "shares"))
        name = self.text(raw["name"], f"{where} name")
        if not isinstance(raw["shares"], dict) or not raw["shares"]:
            raise self.fail(f"{where} shares", f"expected a table, found {raw['shares']!r}",
                            'give shares = { "case name" = fraction, ... }')
        shares = tuple((case, self.number(share, f"{where} shares {case}"))
                       for case, share in raw["shares"].items())
        note = self.text(raw.get("note", ""), f"{where} note")
        return self.built(where, partial(TrafficType, name, shares, note))

    def traffic_category(self, value: object, where: str) -> TrafficCategory:
        raw = self.table(value, where, TRAFFIC_CATEGORY_KEYS)
        self.require(raw, where, ("name", "heavy_vehicles_per_year"))
        name = self.text(raw["name"], f"{where} name")
        count = self.number(raw["heavy_vehicles_per_year"], f"{where} heavy_vehicles_per_year",
                            positive=True)
        note = self.text(raw.get("note", ""), f"{where} note")
        return self.built(where, partial(TrafficCategory, name, count, note))

    def model(self, meta: Mapping[str, Any], where: str, cases: tuple[LoadCase, ...],
              **extras: tuple[Any, ...]) -> LoadModel:
        self.require(meta, where, ("name", "units"))
        name = self.text(meta["name"], f"{where} name")
        fields = {key: self.text(meta.get(key, ""), f"{where} {key}")
                  for key in ("title", "units", "standard", "clause", "category")}
        notes = self.texts(meta.get("notes", []), f"{where} notes")
        return self.built(where, lambda: LoadModel(
            name, fields["title"] or name, fields["units"], cases, fields["standard"],
            fields["clause"], notes, category=fields["category"], **extras))

    def document(self, data: Mapping[str, Any]) -> LoadModel:
        structure = sorted(set(data) & STRUCTURE_KEYS)
        if structure:
            raise self.fail("file", f"looks like a structure model file ({structure[0]} at "
                            "the top level), not a vehicle file",
                            "give it as MODEL_FILE; a vehicle file holds a [vehicle] table "
                            "(loads, spacings, units) or [model] with [[case]] tables")
        meta = data.get("vehicle", data.get("model"))
        if isinstance(meta, dict) and isinstance(meta.get("units"), str) \
                and meta["units"] in SYSTEMS:
            self.units = meta["units"]
        if "vehicle" in data:
            self.table(data, "file", ("vehicle",))
            raw = self.table(data["vehicle"], "[vehicle]", VEHICLE_KEYS)
            case_raw = {k: v for k, v in raw.items() if k in CASE_KEYS}
            case = self.case(case_raw, "[vehicle]", {})
            return self.model(raw, "[vehicle]", (case,))
        self.table(data, "file", ("model", "train", "case", "adjustment", "traffic_type",
                                  "traffic_category"))
        if "model" not in data:
            raise self.fail("file", "no [vehicle] or [model] table",
                            "start the file with [vehicle] (one vehicle) or [model] (cases)")
        named: dict[str, Train] = {}
        for index, value in enumerate(self.tables(data, "train")):
            where = f"[[train]] {index + 1}"
            raw = self.table(value, where, ("name", *TRAIN_KEYS))
            name = self.text(raw.get("name", ""), f"{where} name")
            if not name or name in named:
                raise self.fail(f"{where} name", f"train name '{name}' is missing or used twice",
                                "give each train its own name")
            named[name] = self.train(raw, name, f"train '{name}'", named)
        cases = tuple(self.case(self.table(value, f"[[case]] {i + 1}", CASE_KEYS),
                                f"[[case]] {i + 1}", named)
                      for i, value in enumerate(self.tables(data, "case")))
        readers: dict[str, tuple[str, Callable[[object, str], object]]] = {
            # model field: (file table, reader)
            "adjustments": ("adjustment", self.adjustment),
            "traffic_types": ("traffic_type", self.traffic_type),
            "traffic_categories": ("traffic_category", self.traffic_category),
        }
        extras = {field: tuple(read(value, f"[[{key}]] {i + 1}")
                               for i, value in enumerate(self.tables(data, key)))
                  for field, (key, read) in readers.items()}
        meta = self.table(data["model"], "[model]", MODEL_KEYS)
        return self.model(meta, "[model]", cases, **extras)

    def tables(self, data: Mapping[str, Any], key: str) -> list[object]:
        value = data.get(key, [])
        if not isinstance(value, list):
            raise self.fail(key, f"'{key}' must be an array of tables", f"write [[{key}]]")
        return value


def parse_load_model(text: str, source: str = "<text>") -> LoadModel:
    """Read a vehicle or load-model document from TOML text.

    Args:
        text: the TOML document.
        source: the file name used in error messages.

    Raises:
        VehicleError: for malformed TOML (with its line) or any bad value, in one line.
    """
    return _Reader(source).document(parse_toml_text(text, source, VehicleError))


def read_load_model(path: str | Path) -> LoadModel:
    """Read a vehicle file or a load-model file (UTF-8 TOML; a byte-order mark is allowed).

    Args:
        path: the TOML file.

    Raises:
        VehicleError: when the file cannot be read or holds a bad value.
    """
    return _Reader(str(path)).document(read_toml_file(path, VehicleError, "vehicle file"))
