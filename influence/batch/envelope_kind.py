"""The ``envelope`` job kind: the live-load envelope of each vehicle at every section.

Settings of a ``[[run]]`` table (each optional):

    responses = ["moment", "shear"]   # default: moment, shear, reaction, deflection
    per_span = 10                     # or step = 0.5 [length]; default: the model file's
    compare_with = ["HL-93"]          # check every value against these load models, or
                                      # "model": each model file's own vehicles

Rows: for every vehicle, section and response, a ``max`` and a ``min`` row with the live-load
effect of one lane times the live-load scale of the model file (as
:func:`influence.design.envelope.envelope` gives it) and the governing placement. With
``compare_with``, each row carries the reference's effect and the ratio and passes or fails
(:mod:`influence.batch.comparison`). Where the model file sets a deflection limit and deflection
is enveloped, one ``limit`` row per span holds the vehicle's largest live deflection against
span / N (pass or fail).

Example (one 100 kN axle on a 10 m simple span: PL/4 = 250 kN m at midspan, with the axle over
it; no negative moment there):
    >>> from influence.analysis.lines import analyse_model
    >>> from influence.batch.inventory import Structure
    >>> from influence.model.reader import model_file_from_document
    >>> from vehicles.loadmodel import LoadCase, LoadModel
    >>> from vehicles.train import Axle, Train
    >>> read = model_file_from_document({"beam": {"spans": [10.0], "EI": 1.0,
    ...                                           "supports": ["pinned", "roller"]}})
    >>> axle = LoadModel("P", "one axle", "kN-m", (LoadCase("axle", Train("P", (Axle(100.0),))),))
    >>> subject = Subject(Structure("B-1", "b1.toml"), read, analyse_model(read.model), (axle,))
    >>> rows = envelope_rows(EnvelopeSettings(("moment",), per_span=2), subject)
    >>> [(r.level, r.value and round(r.value, 9), r.lead_position) for r in rows
    ...  if r.section == "5"]  # the sagging line has no negative extreme: none
    [('max', 250.0, 5.0), ('min', None, None)]
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass, replace
from pathlib import Path
from typing import Any

from influence.analysis.responses import Response
from influence.batch.comparison import Comparison, check, magnitude, read_comparison
from influence.batch.fields import positive_int, positive_number, text_list
from influence.batch.rows import ResultRow, Subject, placed
from influence.design.envelope import (
    ENVELOPE_CHOICES,
    ENVELOPE_RESPONSES,
    Envelope,
    EnvelopeEntry,
    envelope,
)
from influence.design.sections import envelope_sections
from influence.errors import BatchError
from influence.output.conventions import effect_unit
from vehicles.units import labels

ENVELOPE_KEYS = ("responses", "per_span", "step", "compare_with")
SENSES = ("max", "min")


@dataclass(frozen=True)
class EnvelopeSettings:
    """What an envelope run takes at each structure.

    Attributes:
        responses: the responses enveloped.
        per_span: divisions of each span (None: the model file's).
        step: section spacing [length] (None: the model file's).
        compare_with: the reference load models, if any.
    """

    responses: tuple[str, ...] = ENVELOPE_RESPONSES
    per_span: int | None = None
    step: float | None = None
    compare_with: Comparison = Comparison()


def read_envelope_settings(table: dict[str, Any], folder: Path, source: str,
                           item: str) -> EnvelopeSettings:
    """The envelope keys of a run table (checked: response names, numbers, vehicles)."""
    responses: tuple[str, ...] = ENVELOPE_RESPONSES
    if "responses" in table:
        responses = text_list(table["responses"], source, f"{item}.responses")
        unknown = [r for r in responses if r not in ENVELOPE_CHOICES]
        if unknown:
            raise BatchError(f"unknown response {unknown[0]!r}", source=source,
                             item=f"{item}.responses", fix="use " + ", ".join(ENVELOPE_CHOICES))
    if "per_span" in table and "step" in table:
        raise BatchError("per_span and step both given", source=source, item=item,
                         fix="give one of them")
    per_span = (positive_int(table["per_span"], source, f"{item}.per_span")
                if "per_span" in table else None)
    step = positive_number(table["step"], source, f"{item}.step") if "step" in table else None
    compare = (read_comparison(table["compare_with"], folder, source, item)
               if "compare_with" in table else Comparison())
    return EnvelopeSettings(responses, per_span, step, compare)


def envelope_rows(settings: EnvelopeSettings, subject: Subject) -> list[ResultRow]:
    """The rows of one structure: see the module docstring."""
    analysis, basis = subject.analysis, subject.model_file.basis
    given = basis.sections
    per_span, step = given.per_span, given.step
    if settings.per_span is not None or settings.step is not None:
        per_span, step = settings.per_span or given.per_span, settings.step
    sections = envelope_sections(analysis.model, analysis.path, per_span=per_span, step=step,
                                 extra=given.extra)

    reference = None
    if settings.compare_with.wanted:
        models = settings.compare_with.models(subject)
        # the reference's own deflection check is not wanted: only its effects are compared
        unchecked = replace(basis, live=replace(basis.live, deflection_limit=None))
        reference = envelope(analysis, models, unchecked, kinds=settings.responses,
                             sections=sections)
    per_vehicle = [envelope(analysis, [model], basis, kinds=settings.responses,
                            sections=sections) for model in subject.models]
    scales = _scales([*per_vehicle, *([reference] if reference else [])])
    rows = []
    for index, entries in enumerate(zip(*(e.entries for e in per_vehicle), strict=True)):
        against = reference.entries[index] if reference else None
        scale = scales[_response_name(entries[0].response)]
        for model, entry in zip(subject.models, entries, strict=True):
            rows += _entry_rows(subject, model.name, entry, against, scale)
    for model, result in zip(subject.models, per_vehicle, strict=True):
        rows += _deflection_rows(subject, model.name, result)
    return rows


def _response_name(response: Response) -> str:
    """"moment", "shear", "horizontal reaction", ...: the response without its place."""
    if response.component in ("", "vertical"):
        return response.kind
    return f"{response.component} {response.kind}"


def _scales(results: Sequence[Envelope]) -> dict[str, float]:
    """The largest magnitude of each response anywhere on the structure, any vehicle [its
    unit]: what an effect is negligible against."""
    found: dict[str, float] = {}
    for result in results:
        for entry in result.entries:
            name = _response_name(entry.response)
            found[name] = max(found.get(name, 0.0), magnitude(entry.live_max, entry.live_min))
    return found


def _entry_rows(subject: Subject, vehicle: str, entry: EnvelopeEntry,
                against: EnvelopeEntry | None, scale: float) -> list[ResultRow]:
    response = entry.response
    name = _response_name(response)
    section = response.location if response.kind == "reaction" else entry.section.label
    unit = effect_unit(response.kind, subject.units, response.component)
    rows = []
    for sense in SENSES:
        value = entry.live_max if sense == "max" else entry.live_min
        row = placed(ResultRow(section=section, chainage=entry.section.chainage, response=name,
                               vehicle=vehicle, level=sense, value=value, unit=unit),
                     entry.live.max if sense == "max" else entry.live.min)
        if against is not None:
            reference = against.live_max if sense == "max" else against.live_min
            ratio, status = check(value, reference, sense, scale)
            row = replace(row, reference=reference, ratio=ratio, status=status)
        rows.append(row)
    return rows


def _deflection_rows(subject: Subject, vehicle: str, result: Envelope) -> list[ResultRow]:
    """One row per span checked: the vehicle's largest live deflection against span / N."""
    length = labels(subject.units).length
    return [placed(ResultRow(section=f"span {found.span.number}", chainage=found.at,
                             response="deflection", vehicle=vehicle, level="limit",
                             value=found.deflection, unit=length,
                             reference=found.limit, ratio=found.ratio,
                             status="pass" if found.passes else "fail"),
                   found.placement)
            for found in result.deflection_checks]
