"""What ``influence fatigue`` prints, and the fatigue pages' tables: a row a detail, the checks,
the cycles per passage compared, and the stress ranges a year; with the usual header.

A spectrum of many trucks gives many distinct ranges; ``range_step`` groups them for printing
into steps of that width, each step's cycles shown at its upper end (on the safe side). The
damage, life and checks are always those of the exact ranges.

Example:
    >>> fatigue_columns("ksi")[5]
    'largest range [ksi]'
    >>> stepped_pairs([[4.93, 10.0], [4.51, 5.0], [0.2, 100.0]], 0.5)
    [[5.0, 15.0], [0.5, 100.0]]
"""

from __future__ import annotations

import math
from typing import Any

from influence.errors import InfluenceError
from influence.fatigue.run import DetailFatigue, FatigueResults
from influence.output.conventions import header_lines
from influence.output.tables import Table

STEP_ROUNDING = 1e-9
"""A range within this fraction [-] of a step above a step's end belongs to that step."""

TEXT_RANGE_ROWS = 120
"""Stress-range rows printed in the text output at most; CSV and JSON always give them all."""

RANGE_SIGNS = ("Stress ranges are positive: a range is the difference between a peak and a "
               "valley of the stress at the detail, the effect of the detail's response times "
               "its stress per unit effect (stress concentration included).")


def fatigue_header(results: FatigueResults) -> list[str]:
    """Title, units, conventions, caution, then the standard, the traffic and the counting."""
    settings = results.settings
    lines = header_lines(results.title, results.units)
    edition = "latest edition in the data" if settings.edition is None else (
        f"edition {settings.edition}")
    lines += [
        f"Fatigue: {settings.standard} ({edition}); stresses in {results.stress_unit}; "
        f"design life {settings.design_life_years:g} years; age {settings.age_years:g} years; "
        f"dynamic allowance on stress ranges {settings.dynamic_allowance:g}.",
        f"Traffic: {results.traffic.description}; direction {results.direction}.",
        f"Cycle counting: {results.counting}, each crossing from entering to leaving, its "
        "turning points exact (from the polynomial pieces of the effect, jumps included).",
        RANGE_SIGNS,
    ]
    lines += [f"Note: {note}" for note in results.notes]
    return lines


def fatigue_columns(stress_unit: str) -> tuple[str, ...]:
    """The columns of the main table."""
    return ("detail", "location", "response", "category", "cycles a passage [-]",
            f"largest range [{stress_unit}]", f"equivalent range [{stress_unit}]",
            "cycles a year [-]", "damage a year [-]", "life [years]", "remaining [years]",
            "infinite life", f"limit range [{stress_unit}]")


def fatigue_table(results: FatigueResults) -> Table:
    """One row a detail: its assessment by the method it names (see :func:`method_table`)."""
    rows = []
    for r in results.details:
        life = r.life
        rows.append((r.detail.name, r.detail.location, r.detail.response, r.detail.category,
                     r.counted_cycles_per_passage if r.method == results.counting
                     else r.table_cycles_per_passage, life.governing_range,
                     life.equivalent_range, float(life.cycles_per_year.sum()),
                     life.damage_per_year, life.life_years, life.remaining_years,
                     "yes" if life.infinite_life else "no", life.limit_range))
    return Table(fatigue_header(results), fatigue_columns(results.stress_unit), rows)


def method_table(results: FatigueResults) -> Table:
    """Cycles per passage counted and from the table, and the life each way."""
    rows = []
    for r in results.details:
        other = r.alternative
        rows.append((r.detail.name, r.counted_cycles_per_passage,
                     r.equivalent_cycles_per_passage,
                     "-" if r.table_cycles_per_passage is None else r.table_cycles_per_passage,
                     r.table_basis or "-", r.method, r.life.life_years,
                     other.life_years if other is not None else "-",
                     r.alternative_method or "-"))
    return Table(["Cycles per passage: counted (half cycles 0.5), their damage as cycles of the "
                  "full range, and the standard's table; the life by each way"],
                 ("detail", "counted [-]", "damage-equivalent [-]", "table n [-]",
                  "table row", "method used", "life [years]", "other life [years]",
                  "other method"), rows)


def checks_table(results: FatigueResults) -> Table:
    """The infinite- and finite-life checks of every detail, factored ranges against
    resistances."""
    unit = results.stress_unit
    rows = []
    for r in results.details:
        c = r.checks
        rows.append((r.detail.name, c.infinite_range, c.infinite_limit,
                     "ok" if c.infinite_life else "exceeded", c.finite_range,
                     c.finite_resistance, c.design_life_cycles,
                     "ok" if c.finite_life else "exceeded"))
    clause = results.details[0].checks.clause if results.details else ""
    return Table([f"Checks: {clause}"],
                 ("detail", f"factored largest [{unit}]", f"limit [{unit}]", "infinite life",
                  f"factored equivalent [{unit}]", f"resistance [{unit}]",
                  "cycles in design life [-]", "finite life"), rows)


def stepped_pairs(pairs: list[list[float]], step: float | None) -> list[list[float]]:
    """[range, cycles] pairs grouped into steps of ``step`` [stress unit], each at its upper
    end, largest first (the pairs as they are when ``step`` is None).

    Raises:
        InfluenceError: for a step that is not positive.
    """
    if step is None:
        return pairs
    if not (math.isfinite(step) and step > 0):
        raise InfluenceError(f"range step {step} is not positive", item="--range-step",
                             fix="give a positive stress step")
    grouped: dict[int, float] = {}
    for size, cycles in pairs:
        top = max(math.ceil(size / step - STEP_ROUNDING), 1)
        grouped[top] = grouped.get(top, 0.0) + cycles
    return [[top * step, cycles] for top, cycles in sorted(grouped.items(), reverse=True)]


def range_table(results: FatigueResults, range_step: float | None = None) -> Table:
    """Every detail's stress ranges with their cycles a year, largest first (grouped into steps
    of ``range_step`` [stress unit] if given)."""
    rows = [(r.detail.name, size, cycles) for r in results.details
            for size, cycles in stepped_pairs(r.life.pairs(), range_step)]
    method = results.details[0].method if results.details else ""
    grouping = "" if range_step is None else (
        f"; grouped in steps of {range_step:g} {results.stress_unit}, each at its upper end")
    return Table([f"Stress ranges a year ({method}{grouping})"],
                 ("detail", f"stress range [{results.stress_unit}]", "cycles a year [-]"), rows)


def fatigue_tables(results: FatigueResults) -> list[Table]:
    """The tables of the fatigue pages, in order: details, methods, checks, stress ranges."""
    return [fatigue_table(results), method_table(results), checks_table(results),
            range_table(results)]


def _life_document(life: Any, range_step: float | None) -> dict[str, Any]:
    return {
        "stress_ranges": stepped_pairs(life.pairs(), range_step),
        "cycles_per_year": float(life.cycles_per_year.sum()),
        "damage_per_year": life.damage_per_year,
        "design_life_damage": life.design_life_damage,
        "life_years": life.life_years,
        "remaining_life_years": life.remaining_years,
        "equivalent_range": life.equivalent_range,
        "equivalent_definition": life.equivalent_definition,
        "infinite_life": life.infinite_life,
        "governing_range": life.governing_range,
        "infinite_life_limit_range": life.limit_range,
        "basis": life.basis,
    }


def _detail_document(r: DetailFatigue, range_step: float | None) -> dict[str, Any]:
    d = r.detail
    checks = r.checks
    return {
        "name": d.name,
        "location": d.location,
        "chainage": r.line.section_chainage,
        "response": d.response,
        "category": d.category,
        "stress_per_effect": d.stress_per_effect,
        "method": r.method,
        **_life_document(r.life, range_step),
        "cycles_per_passage": {
            "counted": r.counted_cycles_per_passage,
            "damage_equivalent": r.equivalent_cycles_per_passage,
            "table": r.table_cycles_per_passage,
            "table_basis": r.table_basis,
        },
        "checks": {
            "clause": checks.clause,
            "factored_largest_range": checks.infinite_range,
            "infinite_life_limit": checks.infinite_limit,
            "infinite_life": checks.infinite_life,
            "factored_equivalent_range": checks.finite_range,
            "finite_life_resistance": checks.finite_resistance,
            "design_life_cycles": checks.design_life_cycles,
            "finite_life": checks.finite_life,
        },
        "alternative": None if r.alternative is None else {
            "method": r.alternative_method, **_life_document(r.alternative, range_step)},
    }


def fatigue_document(results: FatigueResults,
                     range_step: float | None = None) -> dict[str, Any]:
    """Everything as plain data for JSON (stress ranges grouped into steps of ``range_step``
    [stress unit] if given)."""
    settings = results.settings
    return {
        "title": results.title,
        "model": results.source,
        "units": {"system": results.units, "stress": results.stress_unit},
        "conventions": fatigue_header(results)[1:4] + [RANGE_SIGNS],
        "standard": settings.standard,
        "edition": settings.edition,
        "design_life_years": settings.design_life_years,
        "age_years": settings.age_years,
        "dynamic_allowance": settings.dynamic_allowance,
        "traffic": results.traffic.description,
        "vehicles": results.traffic.fleet.count,
        "passages_per_year": float(results.traffic.fleet.passages_per_year.sum()),
        "direction": results.direction,
        "cycle_counting": results.counting,
        "notes": list(results.notes),
        "stress_range_step": range_step,
        "details": [_detail_document(r, range_step) for r in results.details],
    }
