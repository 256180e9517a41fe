"""The ``govern`` job kind: the governing placements of each vehicle at named sections.

Settings of a ``[[run]]`` table:

    at = ["moment@P1", "shear@A1", "moment@0.4 of span 1", "shear@P1:left"]
    compare_with = ["HL-93"]          # optional: check every value against these load models
                                      # ("model": each model file's own vehicles)

Each entry of ``at`` is RESPONSE@LOCATION[:left|right], the location as every command takes it
(a chainage, a node or support name, MEMBER@DISTANCE) or, so that one job fits girders of any
spans, a fraction of a span: ``F of span N`` (the chainage F of the way along span N, spans
counted between supports from the start of the path). A structure that lacks a named location
gets an ``error`` row.

Rows: for every section and vehicle, a ``max`` and a ``min`` row with the effect of one lane (as
:func:`influence.design.governing.governing` gives it: no live-load scale) and the governing
placement; with ``compare_with`` the reference's effect, the ratio and pass or fail.

Example:
    >>> from influence.model.beamform import continuous_beam
    >>> from influence.analysis.lines import analyse_model
    >>> analysis = analyse_model(continuous_beam([10.0, 20.0], 1.0, ["pinned"] * 3))
    >>> section_response("moment@0.25 of span 2", analysis)
    Response(kind='moment', location='15', side='right', component='')
"""

from __future__ import annotations

import re
from dataclasses import dataclass, replace
from pathlib import Path
from typing import Any

from influence.analysis.lines import Analysis
from influence.analysis.responses import Response
from influence.batch.comparison import Comparison, check, magnitude, read_comparison
from influence.batch.fields import text_list
from influence.batch.rows import ResultRow, Subject, placed
from influence.design.governing import governing, parse_concurrent
from influence.design.sections import spans
from influence.errors import BatchError, LocationError
from influence.output.conventions import effect_unit

GOVERN_KEYS = ("at", "compare_with")
SPAN_FRACTION = re.compile(r"^\s*([0-9]*\.?[0-9]+)\s+of\s+span\s+([0-9]+)\s*$")


@dataclass(frozen=True)
class GovernSettings:
    """Where a govern run searches, and what it checks against.

    Attributes:
        at: RESPONSE@LOCATION[:side] texts (see the module docstring).
        compare_with: the reference load models, if any.
    """

    at: tuple[str, ...]
    compare_with: Comparison = Comparison()


def read_govern_settings(table: dict[str, Any], folder: Path, source: str,
                         item: str) -> GovernSettings:
    """The govern keys of a run table; every ``at`` entry's form is checked now."""
    if "at" not in table:
        raise BatchError("a govern run needs sections", source=source, item=item,
                         fix='add at = ["moment@P1", "shear@0.5 of span 1", ...]')
    at = text_list(table["at"], source, f"{item}.at")
    for text in at:
        try:
            parse_concurrent(text)
        except LocationError as error:
            raise BatchError(error.problem, source=source, item=f"{item}.at",
                             fix=error.fix) from None
    compare = (read_comparison(table["compare_with"], folder, source, item)
               if "compare_with" in table else Comparison())
    return GovernSettings(at, compare)


def section_response(text: str, analysis: Analysis) -> Response:
    """The response a RESPONSE@LOCATION[:side] text names on this structure."""
    response = parse_concurrent(text)
    fraction = SPAN_FRACTION.match(response.location)
    if fraction is None:
        return response
    share, number = float(fraction.group(1)), int(fraction.group(2))
    stretches = spans(analysis.model, analysis.path)
    if not 1 <= number <= len(stretches) or share > 1.0:
        raise LocationError(f"{response.location!r} is not on the structure", item=text,
                            fix=f"spans 1 to {len(stretches)}, fractions 0 to 1")
    span = stretches[number - 1]
    chainage = span.start + share * span.length
    return replace(response, location=f"{chainage:.10g}")


def govern_rows(settings: GovernSettings, subject: Subject) -> list[ResultRow]:
    """The rows of one structure: see the module docstring."""
    analysis = subject.analysis
    references = settings.compare_with.models(subject)
    found = []
    for text in settings.at:
        response = section_response(text, analysis)
        found.append((text, response,
                      [governing(analysis, response, [model]) for model in subject.models],
                      governing(analysis, response, references).governing if references
                      else None))
    scales: dict[str, float] = {}  # the largest magnitude of each response, any section
    for _, response, results, against in found:
        values = [p.value for r in results for p in (r.governing.max, r.governing.min) if p]
        if against is not None:
            values += [p.value for p in (against.max, against.min) if p]
        scales[response.kind] = max(scales.get(response.kind, 0.0), magnitude(*values))
    rows = []
    for text, response, results, against in found:
        unit = effect_unit(response.kind, subject.units, response.component)
        for model, result in zip(subject.models, results, strict=True):
            for sense in ("max", "min"):
                placement = result.governing.max if sense == "max" else result.governing.min
                value = placement.value if placement is not None else None
                row = placed(ResultRow(section=text.partition("@")[2],
                                       chainage=result.line.section_chainage,
                                       response=response.kind, vehicle=model.name, level=sense,
                                       value=value, unit=unit),
                             placement)
                if against is not None:
                    best = against.max if sense == "max" else against.min
                    reference = best.value if best is not None else None
                    ratio, status = check(value, reference, sense, scales[response.kind])
                    row = replace(row, reference=reference, ratio=ratio, status=status)
                rows.append(row)
    return rows
