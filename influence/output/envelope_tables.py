"""Envelope tables: text, CSV (units in every column name) and JSON, with the usual header."""

from __future__ import annotations

from typing import Any

from influence.design.envelope import Envelope, EnvelopeEntry, governing_label
from influence.design.loading import live_load_scale
from influence.output.conventions import LIVE_LABEL, header_lines, printed_effect
from influence.output.governing_tables import placement_fields
from influence.output.tables import Table
from vehicles.output.tabular import ROUND_OFF
from vehicles.search.placement import Placement
from vehicles.units import labels


def _number(value: float | None, factor: float = 1.0) -> float | str:
    return "-" if value is None else factor * float(value)


def envelope_header(envelope: Envelope, title: str) -> list[str]:
    live = envelope.basis.live
    lines = header_lines(title, envelope.units)
    lines.append("Load models: " + "; ".join(
        f"{m.name} ({m.standard}{', ' + m.clause if m.clause else ''})" if m.standard else m.name
        for m in envelope.models))
    lines.append(f"{LIVE_LABEL}: " + live_load_scale(live)[1])
    lines.extend(envelope.notes)
    return lines


def tidy_columns(rows: list[tuple[Any, ...]]) -> list[tuple[Any, ...]]:
    """Zero the round-off in numeric columns (a moment line that is exactly zero at an end
    support still carries 1e-13 from the solve)."""
    if not rows:
        return rows
    columns = list(zip(*rows, strict=True))
    cleaned = []
    for values in columns:
        numbers = [abs(v) for v in values if isinstance(v, float)]
        scale = max(numbers, default=0.0)
        cleaned.append([0.0 if isinstance(v, float) and abs(v) < ROUND_OFF * scale else v
                        for v in values])
    return [tuple(row) for row in zip(*cleaned, strict=True)]


def envelope_table(envelope: Envelope, kind: str, title: str) -> Table:
    """One response's envelope: section, LL+IM largest and smallest for the girder line with
    their governing placements, dead loads and each combination's largest and smallest value
    (deflections in mm or in, and no factored deflections: a service check)."""
    names = labels(envelope.units)
    unit, factor = printed_effect(kind, envelope.units)
    loads = envelope.basis.load_names
    combinations = envelope.basis.combinations if kind != "deflection" else ()
    columns = ["section", f"chainage [{names.length}]", f"{LIVE_LABEL} max [{unit}]",
               "governing max", f"lead at max [{names.length}]", f"{LIVE_LABEL} min [{unit}]",
               "governing min", f"lead at min [{names.length}]"]
    columns += [f"{load} [{unit}]" for load in loads]
    for combination in combinations:
        columns += [f"{combination.name} max [{unit}]", f"{combination.name} min [{unit}]"]
    rows = []
    for entry in envelope.of(kind):
        at = "-" if entry.section.chainage is None else entry.section.chainage
        row: list[Any] = [entry.section.label, at, _number(entry.live_max, factor),
                          governing_label(entry.live.max), _lead(entry.live.max),
                          _number(entry.live_min, factor), governing_label(entry.live.min),
                          _lead(entry.live.min)]
        row += [factor * entry.dead_effect(load) for load in loads]
        for combination in combinations:
            row += [factor * value for value in entry.combined(combination)]
        rows.append(tuple(row))
    header = envelope_header(envelope, f"{title}: envelope of {kind}")
    formats = ("text", "position", "effect", "text", "position", "effect", "text", "position",
               *(["effect"] * (len(columns) - 8)))
    return Table(header, tuple(columns), tidy_columns(rows), formats=formats)


def _short(placement: Placement | None) -> str:
    if placement is None:
        return "-"
    way = {"forward": "fwd", "reverse": "rev"}.get(placement.direction, placement.direction)
    return f"{placement.case} {way}"


def _lead(placement: Placement | None) -> float | str:
    return "-" if placement is None else placement.lead_position


def placement_document(placement: Placement | None, scale: float) -> dict[str, Any] | None:
    if placement is None:
        return None
    return {**placement_fields(placement, scale), "value_one_lane": placement.value}


def entry_document(entry: EnvelopeEntry, envelope: Envelope) -> dict[str, Any]:
    return {
        "section": entry.section.label,
        "location": entry.section.location,
        "side": entry.section.side,
        "chainage": entry.section.chainage,
        "response": entry.kind,
        "max": placement_document(entry.live.max, entry.live_scale),
        "min": placement_document(entry.live.min, entry.live_scale),
        "dead": dict(entry.dead),
        "combinations": {c.name: dict(zip(("max", "min"), entry.combined(c), strict=True))
                         for c in envelope.basis.combinations},
    }


def envelope_document(envelope: Envelope, title: str) -> dict[str, Any]:
    names = labels(envelope.units)
    return {
        "title": title,
        "units": {"force": names.force, "length": names.length, "moment": names.moment},
        "conventions": envelope_header(envelope, title)[1:],
        "load_models": [{"name": m.name, "standard": m.standard, "clause": m.clause}
                        for m in envelope.models],
        "live_scale": envelope.basis.live.scale,
        "entries": [entry_document(e, envelope) for e in envelope.entries],
        "deflection_checks": [
            {"span": c.span.number, "length": c.span.length, "deflection": c.deflection,
             "at": c.at, "limit": c.limit, "ratio": c.ratio, "passes": c.passes,
             "governing": governing_label(c.placement)}
            for c in envelope.deflection_checks
        ],
    }


def deflection_table(envelope: Envelope, title: str) -> Table:
    """Each span's largest LL+IM deflection against span / N (deflections in mm or in)."""
    names = labels(envelope.units)
    unit, factor = printed_effect("deflection", envelope.units)
    limit = envelope.basis.live.deflection_limit
    header = envelope_header(envelope, f"{title}: live-load deflection check, limit span/{limit:g}")
    rows = [(c.span.number, c.span.length, c.at, factor * c.deflection, factor * c.limit,
             c.ratio, "pass" if c.passes else "FAIL", governing_label(c.placement))
            for c in envelope.deflection_checks]
    return Table(header, ("span", f"length [{names.length}]", f"at [{names.length}]",
                          f"{LIVE_LABEL} deflection [{unit}]", f"limit [{unit}]",
                          "ratio [-]", "check", "governing"), rows,
                 formats=("count", "position", "position", "effect", "effect", "ratio", "text",
                          "text"))
