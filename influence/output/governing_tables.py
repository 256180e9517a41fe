"""Governing-position and sweep tables and documents, with the usual header."""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

from influence.design.governing import GoverningResult
from influence.output.conventions import effect_unit, header_lines
from influence.output.tables import Table
from vehicles.output.tabular import fixed
from vehicles.search.concurrent import Concurrent
from vehicles.search.placement import Placement
from vehicles.search.sweep import Sweep
from vehicles.units import labels


def positions_text(values: Sequence[float], decimals: int = 2) -> str:
    """Chainages [length] as a short list, front to rear: '12.18 16.45 20.72'.

    Example:
        >>> positions_text([12.183, 16.45, -0.0001])
        '12.18 16.45 0.00'
    """
    return " ".join(fixed(v, decimals) for v in values) or "-"


def segments_text(segments: Sequence[tuple[float, float]]) -> str:
    """Loaded stretches [length]: '0.00-24.00, 56.00-80.00'."""
    return ", ".join(f"{fixed(a, 2)}-{fixed(b, 2)}" for a, b in segments) or "-"


def _concurrent_document(result: GoverningResult,
                         values: Sequence[Concurrent]) -> list[dict[str, Any]]:
    return [{"response": other.response.kind, "location": other.response.location,
             "side": other.response.side, "value": c.value, "left": c.left, "right": c.right,
             "ambiguous": c.ambiguous}
            for other, c in zip(result.others, values, strict=True)]


def placement_fields(placement: Placement, scale: float = 1.0,
                     live_scale: float | None = None) -> dict[str, Any]:
    """A placement as plain data; ``value`` multiplied by ``scale`` (the live-load scale).
    ``live_scale``: the scale already in the placement's value, to give one lane's value too."""
    per_lane = {} if live_scale is None else {
        "value_per_lane": placement.value / live_scale if live_scale else None}
    return {
        "value": placement.value * scale,
        **per_lane,
        "vehicle": placement.model,
        "case": placement.case,
        "direction": placement.direction,
        "lead_position": placement.lead_position,
        "axle_positions": placement.axle_positions,
        "axle_loads": placement.axle_loads,
        "axle_over_section": placement.section_axle,
        "ranged_values": [{"item": r.item, "attribute": r.attribute, "range": [r.low, r.high],
                           "value": r.value} for r in placement.ranged_values],
        "patch_segments": placement.patch_segments,
        "lane_segments": placement.lane_segments,
        "lane_intensity": placement.lane_intensity,
        "knife_edge_position": placement.knife_edge_position,
        "knife_edge_load": placement.knife_edge_load,
        "limit_side": placement.limit_side,
    }


def placement_document(placement: Placement, result: GoverningResult,
                       values: Sequence[Concurrent]) -> dict[str, Any]:
    return {**placement_fields(placement, live_scale=result.live_scale),
            "concurrent": _concurrent_document(result, values)}


def _maybe(placement: Placement | None, result: GoverningResult) -> dict[str, Any] | None:
    return None if placement is None else placement_fields(placement,
                                                           live_scale=result.live_scale)


def governing_document(result: GoverningResult, title: str, notes: Sequence[str] = (),
                       live_note: str = "") -> dict[str, Any]:
    line = result.line
    names = labels(line.units)
    g = result.governing
    return {
        "title": title,
        "response": line.response.kind,
        "location": line.response.location,
        "side": line.response.side,
        "section_chainage": line.section_chainage,
        "units": {"force": names.force, "length": names.length, "moment": names.moment,
                  "effect": effect_unit(line.response.kind, line.units,
                                        line.response.component)},
        "notes": list(notes),
        "live_load": {"scale": result.live_scale, "per_girder_line": result.live_scale != 1.0,
                      "statement": live_note},
        "conventions": header_lines(title, line.units)[1:],
        "ranged_tolerance": g.ranged_tolerance,
        "max": None if g.max is None else placement_document(g.max, result,
                                                              result.concurrent_max),
        "min": None if g.min is None else placement_document(g.min, result,
                                                              result.concurrent_min),
        "top": {
            "max": [placement_document(p, result, c)
                    for p, c in zip(g.top_max, result.concurrent_top_max, strict=True)],
            "min": [placement_document(p, result, c)
                    for p, c in zip(g.top_min, result.concurrent_top_min, strict=True)],
        },
        "by_load_model": [{"vehicle": row.model, "case": row.case,
                           "max": _maybe(row.max, result), "min": _maybe(row.min, result)}
                          for row in result.by_case],
    }


NO_EXTREME = "none: no position gives an effect of this sign"
"""What a table says for a sense whose extreme is zero (no vehicle is placed for it)."""


def governing_table(result: GoverningResult, title: str, notes: Sequence[str] = (),
                    live_note: str = "") -> Table:
    line = result.line
    names = labels(line.units)
    unit = effect_unit(line.response.kind, line.units, line.response.component)
    header = header_lines(f"{title}: governing positions for {line.response.label}",
                          line.units) + ([live_note] if live_note else []) + list(notes)
    header.append("Lead position: chainage of the train's front axle (reference point); "
                  "axle chainages front to rear as the train is described.")
    columns = ["sense", "rank", f"effect [{unit}]", "vehicle", "case", "direction",
               f"lead [{names.length}]", f"axles [{names.length}]", f"gaps used [{names.length}]",
               "axle over section", f"lane loaded [{names.length}]"]
    columns += [f"concurrent {o.response.label} [{effect_unit(o.response.kind, line.units)}]"
                for o in result.others]
    rows: list[tuple[Any, ...]] = []
    g = result.governing
    for sense, placements, concurrents in (("max", g.top_max, result.concurrent_top_max),
                                           ("min", g.top_min, result.concurrent_top_min)):
        if not placements:
            rows.append((sense, "-", "-", NO_EXTREME, *["-"] * (len(columns) - 4)))
        for rank, (p, c) in enumerate(zip(placements, concurrents, strict=True), start=1):
            rows.append((
                sense, rank, p.value, p.model, p.case, p.direction, p.lead_position,
                positions_text(p.axle_positions),
                positions_text([r.value for r in p.ranged_values if r.value is not None]),
                "-" if p.section_axle is None else f"axle {p.section_axle + 1}",
                segments_text(p.lane_segments),
                *(value.value for value in c),
            ))
    formats = ("text", "count", "effect", "text", "text", "text", "position", "text", "text",
               "text", "text", *(["effect"] * len(result.others)))
    return Table(header, tuple(columns), rows, formats=formats)


def case_table(result: GoverningResult, title: str) -> Table:
    """One row per load model and case: each case's own largest and smallest effect and where,
    so that no model's result is hidden behind another's."""
    line = result.line
    names = labels(line.units)
    unit = effect_unit(line.response.kind, line.units, line.response.component)
    header = [f"{title}: each load model and case alone, {line.response.label}"]
    rows: list[tuple[Any, ...]] = []
    for row in result.by_case:
        cells: list[Any] = [row.model, row.case]
        for placement in (row.max, row.min):
            cells += (["-", "-", "-"] if placement is None else
                      [placement.value, placement.direction, placement.lead_position])
        rows.append(tuple(cells))
    return Table(header, ("vehicle", "case", f"max [{unit}]", "direction",
                          f"lead [{names.length}]", f"min [{unit}]", "direction",
                          f"lead [{names.length}]"), rows)


def sweep_table(sweeps: Sequence[Sweep], kind: str, units: str, title: str,
                notes: Sequence[str] = ()) -> Table:
    names = labels(units)
    unit = effect_unit(kind, units)
    header = header_lines(title, units) + list(notes)
    header.append("Lead position: chainage of the train's reference point; where the effect "
                  "jumps a position is listed twice (left, then right limit).")
    rows = []
    for s in sweeps:
        gaps = positions_text([r.value for r in s.ranged_values if r.value is not None])
        for x, v in zip(s.lead_positions, s.values, strict=True):
            rows.append((s.case, s.direction, s.sense, gaps, float(x), float(v)))
    return Table(header, ("case", "direction", "lane for", f"gaps used [{names.length}]",
                          f"lead [{names.length}]", f"effect [{unit}]"), rows,
                 formats=("text", "text", "text", "text", "position", "effect"))


def sweep_document(sweeps: Sequence[Sweep], kind: str, units: str, title: str,
                   notes: Sequence[str] = (), live_scale: float = 1.0,
                   live_note: str = "") -> dict[str, Any]:
    names = labels(units)
    return {
        "title": title, "response": kind, "notes": list(notes),
        "live_load": {"scale": live_scale, "per_girder_line": live_scale != 1.0,
                      "statement": live_note},
        "units": {"force": names.force, "length": names.length,
                  "effect": effect_unit(kind, units)},
        "sweeps": [{"case": s.case, "direction": s.direction, "sense": s.sense,
                    "ranged_values": [r.value for r in s.ranged_values],
                    "lead_positions": s.lead_positions, "values": s.values}
                   for s in sweeps],
    }
