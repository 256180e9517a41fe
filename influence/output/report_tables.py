"""The tables of the calculation package: the summary of governing results, the input echo,
the live-load tables with every governing position, the combination tables, bar forces and the
deflection check. Each is a :class:`vehicles.output.tabular.Table`, so the PDF prints numbers
as the text and CSV outputs do.

Live load is named as the standards name it: ``LL+IM`` (vehicular live load with its dynamic
load allowance), given for one lane and for the girder line, with the distribution factor
beside it. Deflections are printed in mm (or in).
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

from influence.design.envelope import Envelope, EnvelopeEntry
from influence.model.basis import LIVE_LOAD, DeadLoad, DesignBasis
from influence.output.conventions import LIVE_LABEL, printed_effect
from influence.output.governing_tables import positions_text, segments_text
from vehicles.loadmodel import LoadModel
from vehicles.output.tabular import ROUND_OFF, Table
from vehicles.search.placement import Placement
from vehicles.units import labels

KINDS_IN_ORDER = ("moment", "shear", "axial", "reaction", "deflection")


def _where(entry: EnvelopeEntry) -> float | str:
    return "-" if entry.section.chainage is None else entry.section.chainage


def kind_size(envelope: Envelope, kind: str) -> float:
    """The largest absolute one-lane value of a response in the envelope [effect units]."""
    return max((abs(p.value) for e in envelope.of(kind) for p in (e.live.max, e.live.min)
                if p is not None), default=0.0)


def effective(placement: Placement | None, size: float) -> Placement | None:
    """The placement, or None when its effect is nil (round-off of ``size``): no load model
    governs a zero, and no train is shown placed for it."""
    if placement is None or abs(placement.value) <= ROUND_OFF * size:
        return None
    return placement


def _placement_cells(placement: Placement | None) -> list[Any]:
    if placement is None:
        return ["-", "-", "-", "-", "-", "-"]
    lane = segments_text(placement.lane_segments)
    if placement.knife_edge_load:
        lane += (f"; knife edge {placement.knife_edge_load:.4g} at "
                 f"{placement.knife_edge_position:.2f}")
    return [f"{placement.model}: {placement.case}", placement.direction, placement.lead_position,
            positions_text(placement.axle_positions),
            " ".join(f"{p:.4g}" for p in placement.axle_loads) or "-", lane]


def live_columns(units: str) -> list[str]:
    """Column names of a governing placement [units of the model]."""
    names = labels(units)
    return ["load model: case", "direction", f"lead [{names.length}]",
            f"axles, front to rear [{names.length}]", f"axle loads incl. IM [{names.force}]",
            f"lane loaded [{names.length}]"]


_PLACEMENT_FORMATS = ("text", "text", "position", "text", "text", "text")


def summary_table(envelope: Envelope) -> Table:
    """The governing positive and negative value of every response enveloped, each with its
    section, load model, case, direction and train position."""
    names = labels(envelope.units)
    scale = envelope.basis.live.scale
    rows: list[tuple[Any, ...]] = []
    for kind in KINDS_IN_ORDER:
        entries = [e for e in envelope.of(kind) if e.live.max or e.live.min]
        if not entries:
            continue
        unit, factor = printed_effect(kind, envelope.units)
        size = kind_size(envelope, kind)
        for sense in ("max", "min"):
            valued = [(getattr(e, f"live_{sense}"), e) for e in entries
                      if getattr(e, f"live_{sense}") is not None]
            if not valued:
                continue
            value, entry = (max if sense == "max" else min)(valued, key=lambda pair: pair[0])
            word = {"deflection": ("down", "up")}.get(kind, ("positive", "negative"))
            rows.append((kind, word[0] if sense == "max" else word[1], unit, factor * value,
                         factor * value / scale if scale else value, entry.section.label,
                         _where(entry),
                         *_placement_cells(effective(getattr(entry.live, sense), size))))
    columns = ["response", "sense", "unit", f"{LIVE_LABEL} girder line",
               f"{LIVE_LABEL} one lane", "section", f"at [{names.length}]",
               *live_columns(envelope.units)]
    return Table([], tuple(columns), rows,
                 formats=("text", "text", "text", "effect", "effect", "text", "position",
                          *_PLACEMENT_FORMATS))


def live_table(envelope: Envelope, kind: str) -> Table:
    """Every section's LL+IM extremes with the whole governing placement: value for one lane,
    value for the girder line (x the live-load factor), load model, case, direction, lead axle,
    every axle's chainage and load, and where the lane load acts."""
    names = labels(envelope.units)
    unit, factor = printed_effect(kind, envelope.units)
    scale = envelope.basis.live.scale
    size = kind_size(envelope, kind)
    rows = []
    for entry in _in_order(envelope.of(kind)):
        for sense in ("max", "min"):
            placement = getattr(entry.live, sense)
            shown = effective(placement, size)
            lane_value = None if placement is None else factor * placement.value
            rows.append((entry.section.label, _where(entry), sense,
                         "-" if lane_value is None else lane_value,
                         "-" if lane_value is None else lane_value * scale,
                         *_placement_cells(shown)))
    columns = ("section", f"at [{names.length}]", "sense", f"{LIVE_LABEL} one lane [{unit}]",
               f"{LIVE_LABEL} x {scale:g} [{unit}]", *live_columns(envelope.units))
    return Table([], columns, rows, formats=("text", "position", "text", "effect", "effect",
                                             *_PLACEMENT_FORMATS))


def combination_table(envelope: Envelope, kind: str) -> Table:
    """LL+IM for the girder line, each dead load name and every combination's largest and
    smallest factored value (deflections: no factored values, a service check)."""
    names = labels(envelope.units)
    unit, factor = printed_effect(kind, envelope.units)
    loads = envelope.basis.load_names
    combinations = envelope.basis.combinations if kind != "deflection" else ()
    columns = ["section", f"at [{names.length}]", f"{LIVE_LABEL} max [{unit}]",
               f"{LIVE_LABEL} min [{unit}]", *(f"{load} [{unit}]" for load in loads)]
    for combination in combinations:
        columns += [f"{combination.name} max [{unit}]", f"{combination.name} min [{unit}]"]
    rows = []
    for entry in _in_order(envelope.of(kind)):
        row: list[Any] = [entry.section.label, _where(entry),
                          "-" if entry.live_max is None else factor * entry.live_max,
                          "-" if entry.live_min is None else factor * entry.live_min]
        row += [factor * entry.dead_effect(load) for load in loads]
        for combination in combinations:
            row += [factor * value for value in entry.combined(combination)]
        rows.append(tuple(row))
    formats = ("text", "position", *(["effect"] * (len(columns) - 2)))
    return Table([], tuple(columns), rows, formats=formats)


def bar_table(envelope: Envelope, entries: Sequence[EnvelopeEntry]) -> Table:
    """Bar forces, one row a bar: LL+IM tension and compression with the governing model and
    lead position, the dead loads and every combination (tension positive)."""
    names = labels(envelope.units)
    unit, _ = printed_effect("axial", envelope.units)
    loads = envelope.basis.load_names
    scale = envelope.basis.live.scale
    columns = ["bar", f"{LIVE_LABEL} x {scale:g} tension [{unit}]", "tension: load model, case",
               f"tension: lead [{names.length}]", f"{LIVE_LABEL} x {scale:g} compression [{unit}]",
               "compression: load model, case", f"compression: lead [{names.length}]",
               *(f"{load} [{unit}]" for load in loads)]
    for combination in envelope.basis.combinations:
        columns += [f"{combination.name} max [{unit}]", f"{combination.name} min [{unit}]"]
    size = kind_size(envelope, "axial")
    rows = []
    for entry in entries:
        row: list[Any] = [entry.section.label]
        for sense in ("max", "min"):
            placement = effective(getattr(entry.live, sense), size)
            value = getattr(entry, f"live_{sense}")
            row += ["-" if value is None else value,
                    "-" if placement is None else f"{placement.model}: {placement.case}, "
                                                  f"{placement.direction}",
                    "-" if placement is None else placement.lead_position]
        row += [entry.dead_effect(load) for load in loads]
        for combination in envelope.basis.combinations:
            row += list(entry.combined(combination))
        rows.append(tuple(row))
    formats = ("text", "effect", "text", "position", "effect", "text", "position",
               *(["effect"] * (len(columns) - 7)))
    return Table([], tuple(columns), rows, formats=formats)


def deflection_check_table(envelope: Envelope) -> Table:
    """Each span's largest LL+IM deflection against span / N, with the governing position."""
    names = labels(envelope.units)
    unit, factor = printed_effect("deflection", envelope.units)
    rows = []
    for check in envelope.deflection_checks:
        placement = check.placement
        rows.append((check.span.number, check.span.length, check.at, factor * check.deflection,
                     factor * check.limit, check.ratio, "pass" if check.passes else "FAIL",
                     *_placement_cells(placement)[:4]))
    columns = ("span", f"length [{names.length}]", f"at [{names.length}]",
               f"{LIVE_LABEL} deflection [{unit}]", f"limit [{unit}]", "ratio [-]", "check",
               *live_columns(envelope.units)[:4])
    return Table([], columns, rows, formats=("count", "position", "position", "effect",
                                             "effect", "ratio", "text", "text", "text",
                                             "position", "text"))


def _in_order(entries: Sequence[EnvelopeEntry]) -> list[EnvelopeEntry]:
    """Sections on the path by chainage (left side first), then those off the path."""
    on = [e for e in entries if e.section.chainage is not None]
    off = [e for e in entries if e.section.chainage is None]
    on.sort(key=lambda e: (e.section.chainage, e.section.side != "left"))
    return on + off


def dead_load_table(loads: Sequence[DeadLoad], units: str) -> Table:
    """The dead loads as read: name, load name, intensity and where it acts."""
    names = labels(units)
    rows = []
    for load in loads:
        if load.point:
            rows.append((load.name, load.load, "point", load.point, names.force,
                         f"at {load.at:g} {names.length}"))
            continue
        where = []
        if load.members:
            where.append("members " + ", ".join(load.members))
        if load.start is not None or load.end is not None:
            start = "path start" if load.start is None else f"{load.start:g}"
            end = "path end" if load.end is None else f"{load.end:g}"
            where.append(f"from {start} to {end} {names.length}")
        rows.append((load.name, load.load, "uniform", load.uniform, names.force_per_length,
                     "; ".join(where) or "the whole path"))
    return Table([], ("name", "load name", "kind", "intensity", "unit", "where"), rows,
                 formats=("text", "text", "text", "number", "text", "text"))


def combination_factor_table(basis: DesignBasis) -> Table:
    """Every factor of every combination: combination, load name, largest and smallest."""
    rows = []
    for combination in basis.combinations:
        for load, high, low in combination.factors:
            label = f"{LIVE_LABEL} (live load)" if load == LIVE_LOAD else load
            rows.append((combination.name, label, high, low))
    return Table([], ("combination", "load", "factor max [-]", "factor min [-]"), rows,
                 formats=("text", "text", "factor", "factor"))


def live_settings_table(basis: DesignBasis, models: Sequence[LoadModel],
                        deflection_models: Sequence[LoadModel], kinds: Sequence[str],
                        per_span: int, step: float | None) -> Table:
    """Live-load and section settings as used: distribution, multiple presence, their product,
    load models, deflection loading and limit, every adjustment, sections and responses."""
    live = basis.live
    rows: list[tuple[str, str, str]] = [
        ("distribution factor", f"{live.distribution:g}", "lanes carried by this girder line"),
        ("multiple presence factor", f"{live.multiple_presence:g}", ""),
        ("live-load factor on one lane", f"{live.scale:g}",
         f"{LIVE_LABEL} girder line = {LIVE_LABEL} one lane x this"),
        ("load models", ", ".join(m.name for m in models), "each case's dynamic load allowance "
         "(IM) is in its axle loads"),
        ("deflection loading", ", ".join(m.name for m in deflection_models) or
         ", ".join(m.name for m in models) if live.deflection_limit else "-",
         "load models of the deflection check"),
        ("deflection limit", f"span / {live.deflection_limit:g}" if live.deflection_limit
         else "none", ""),
    ]
    for name, value in sorted(live.adjust.items()):
        rows.append((f"adjustment {name}", f"{value:g}", "from [live_load] adjust"))
    for model in (*models, *deflection_models):
        for item in model.adjustments:
            rows.append((f"{model.name}: {item.name}", f"{item.value:g}", item.note))
        for case in model.cases:
            allowance = f"axles {case.axle_allowance:g}"
            if case.lane:
                allowance += f", lane {case.lane_allowance:g}"
            rows.append((f"{model.name}: {case.name}", f"factor {case.factor:g}",
                         f"dynamic load allowance {allowance}"))
    sections = f"every {step:g}" if step else f"{per_span} divisions a span"
    rows.append(("sections", sections, "supports and hinges on both sides where shear jumps"))
    if basis.sections.extra:
        rows.append(("extra sections", ", ".join(basis.sections.extra), ""))
    rows.append(("responses", ", ".join(kinds), ""))
    return Table([], ("setting", "value", "note"), rows, formats=("text", "text", "text"))


def load_model_table(models: Sequence[LoadModel], deflection_models: Sequence[LoadModel]) -> Table:
    """Every load model used: what for, its source and the confidence notes it carries."""
    rows = []
    used = [(m, "envelopes") for m in models] + [(m, "deflection check")
                                                 for m in deflection_models]
    for model, purpose in used:
        source = model.standard + (f", clause {model.clause}" if model.clause else "")
        rows.append((model.name, purpose, model.category or "-", source or "user's file",
                     " ".join(model.notes) or "-"))
    return Table([], ("load model", "used for", "category", "source", "notes and confidence"),
                 rows, formats=("text",) * 5)
