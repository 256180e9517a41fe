"""Text and JSON renderings of the descriptions made by :mod:`vehicles.output.describe`.

Numbers are printed to six significant figures with their unit label; ranges as "14 to 30 ft".

Example:
    >>> from vehicles.library.catalog import get_model
    >>> from vehicles.output.describe import summary
    >>> print(library_table([summary(get_model("LM2"))]))  # doctest: +NORMALIZE_WHITESPACE
    name  category  units  cases  train load  train length  standard
    LM2   design    kN-m   1      400 kN      0 m           EN 1991-2:2003 Actions on ...
"""

from __future__ import annotations

import json
from collections.abc import Sequence
from typing import Any

from vehicles.output.tabular import render_columns
from vehicles.units import labels


def _num(value: float) -> str:
    return f"{value:.6g}"


def _quantity(value: float | Sequence[float] | None, unit: str) -> str:
    if value is None:
        return "-"
    if isinstance(value, int | float):
        return f"{_num(value)} {unit}"
    low, high = value
    if low == high:
        return f"{_num(low)} {unit}"
    return f"{_num(low)} to {_num(high)} {unit}"


def _short(text: str, width: int = 48) -> str:
    return text if len(text) <= width else text[: width - 4].rstrip() + " ..."


def library_table(rows: Sequence[dict[str, Any]]) -> str:
    """The library listing: one line a model (rows from
    :func:`vehicles.output.describe.summary`)."""
    table = [["name", "category", "units", "cases", "train load", "train length", "standard"]]
    for row in rows:
        unit = labels(row["units"])
        load = _quantity(row["total_load"], unit.force)
        if row["unlimited_uniform"]:
            load += " + unlimited uniform"
        table.append([row["name"], row["category"] or "-", row["units"], str(row["cases"]),
                      load, _quantity(row["length"], unit.length), _short(row["standard"])])
    return render_columns(table)


def _train_lines(train: dict[str, Any], unit: Any) -> list[str]:
    head = (f"  train '{train['name']}': load {_quantity(train['total_load'], unit.force)}, "
            f"length {_quantity(train['length'], unit.length)}")
    if train["unlimited_uniform"]:
        head += f", then {_num(train['unlimited_uniform'])} {unit.force_per_length} unlimited"
    rows = [["#", "kind", "load", "gap to previous", "from front", "length"]]
    for number, item in enumerate(train["items"], start=1):
        if item["kind"] == "axle":
            rows.append([str(number), "axle", _quantity(item["load"], unit.force),
                         _quantity(item["gap"], unit.length),
                         _quantity(item["offset"], unit.length), ""])
        else:
            start = "ahead" if item["start"] is None else _quantity(item["start"], unit.length)
            extent = ("unlimited" if item["length"] is None
                      else _quantity(item["length"], unit.length))
            rows.append([str(number), "uniform",
                         _quantity(item["intensity"], unit.force_per_length),
                         _quantity(item["gap"], unit.length), start, extent])
    table = render_columns(rows).splitlines()
    return [head, *("    " + line for line in table)]


def _case_lines(number: int, case: dict[str, Any], unit: Any) -> list[str]:
    lines = [f"case {number}: {case['name']}  (applies to: {', '.join(case['scope'])})"]
    parts = [f"factor {_num(case['factor'])}",
             f"dynamic allowance on axles {_num(case['dynamic_allowance'])}"]
    if case["uniform_dynamic_allowance"]:
        parts.append(f"on train uniform loads {_num(case['uniform_dynamic_allowance'])}")
    if case["lane"]:
        lane = f"lane {_quantity(case['lane'], unit.force_per_length)} on adverse parts"
        if case["lane_clear_of_axles"] is not None:
            lane += f", clear of the axles by {_quantity(case['lane_clear_of_axles'], unit.length)}"
        parts.append(lane)
    for key, what in (("knife_edge_for_moment", "moment"), ("knife_edge_for_shear", "shear")):
        if case[key]:
            parts.append(f"knife-edge for {what} {_quantity(case[key], unit.force)}")
    if case["lane"] or case["knife_edge_for_moment"] or case["knife_edge_for_shear"]:
        parts.append(f"allowance on lane {_num(case['lane_dynamic_allowance'])}")
    lines.append("  " + "; ".join(parts))
    if case["train"] is not None:
        lines += _train_lines(case["train"], unit)
    if case["note"]:
        lines.append(f"  source: {case['note']}")
    return lines


def _traffic_lines(model: dict[str, Any]) -> list[str]:
    """Share of each lorry by traffic type, and heavy vehicles a year by traffic category."""
    lines: list[str] = []
    if model["traffic_types"]:
        names = list(dict.fromkeys(c for t in model["traffic_types"] for c in t["shares"]))
        rows = [["traffic type", *names]]
        rows += [[t["name"], *(f"{_num(100 * t['shares'].get(c, 0.0))} %" for c in names)]
                 for t in model["traffic_types"]]
        lines += ["", "share of the heavy vehicles:", *("  " + r for r in render_columns(rows)
                                                         .splitlines())]
        lines += [f"  {t['name']}: {t['note']}" for t in model["traffic_types"] if t["note"]]
    if model["traffic_categories"]:
        lines += ["", "heavy vehicles a year on one slow lane:"]
        lines += [f"  {t['name']}: {_num(t['heavy_vehicles_per_year'])}"
                  + (f" ({t['note']})" if t["note"] else "") for t in model["traffic_categories"]]
    return lines


def model_text(model: dict[str, Any]) -> str:
    """One model in full (a description from :func:`vehicles.output.describe.details`)."""
    unit = labels(model["units"])
    lines = [f"{model['name']}: {model['title']}"]
    if model["category"]:
        lines.append(f"category: {model['category']}")
    if model["standard"]:
        lines.append(f"standard: {model['standard']}, clause {model['clause']}")
    lines.append(f"units: {unit.force}, {unit.length}, {unit.force_per_length}, {unit.moment}"
                 "; loads act downward")
    for number, case in enumerate(model["cases"], start=1):
        lines += ["", *_case_lines(number, case, unit)]
    if model["adjustments"]:
        lines += ["", "adjustments (change with --adjust NAME=VALUE):"]
        for item in model["adjustments"]:
            acts = ", ".join([f"scales {s}" for s in item["scales"]]
                             + [f"sets {s}" for s in item["sets"]])
            lines.append(f"  {item['name']} = {_num(item['value'])} ({acts}): {item['note']}")
    lines += _traffic_lines(model)
    if model["notes"]:
        lines += ["", "notes:", *(f"  - {note}" for note in model["notes"])]
    return "\n".join(lines)


def as_json(description: object) -> str:
    """Any description as indented JSON text."""
    return json.dumps(description, indent=2, ensure_ascii=False)
