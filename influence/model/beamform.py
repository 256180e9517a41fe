"""The compact continuous-beam form, compiled to the general frame model.

A girder is a row of spans on supports, left to right along x at y = 0. Each span becomes one
member, or several where its EI steps or a hinge stands inside it; the path runs along all of them
from the left end (chainage 0). Supports are named S1, S2, ... left to right unless names are given;
nodes the compiler adds are named H1, H2, ... (hinges) and J1, J2, ... (EI steps).

Example:
    >>> model = continuous_beam([10.0, 12.0], 2.0e5, ["pinned", "roller", "roller"])
    >>> [m.name for m in model.members], [n.name for n in model.nodes]
    (['span1', 'span2'], ['S1', 'S2', 'S3'])
"""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass

from influence.errors import ModelError
from influence.model.structure import MIN_LENGTH, Member, Model, Node, PathLeg, Support
from influence.model.variation import SectionVariation

POSITION_TOLERANCE = 1e-9
"""Relative distance [-] within which two chainages are taken as the same point."""

AXIAL_TO_BENDING = 12.0
"""EA = AXIAL_TO_BENDING * EI / L^2 (the largest EI and the longest span) for every member when a
beam gives no EA: axial and bending stiffness of the same order. A straight girder under vertical
load does not stretch, so the value does not affect any vertical response; one value for the
whole girder keeps the axial stiffness free of the contrasts of EI and of piece lengths."""

EIRanges = Sequence[Sequence[float]]


@dataclass(frozen=True)
class _Segment:
    start: float  # chainage [length]
    end: float
    EI: float
    span: int


def continuous_beam(
    spans: Sequence[float],
    EI: float | Sequence[float | EIRanges],
    supports: Sequence[str | Support],
    *,
    names: Sequence[str] | None = None,
    hinges: Sequence[float] = (),
    EA: float | None = None,
    variations: Mapping[int, SectionVariation] | None = None,
    title: str = "",
    units: str = "kN-m",
    source: str = "",
) -> Model:
    """Compile a continuous girder.

    Args:
        spans: span lengths, left to right [length].
        EI: one value [force * length^2], or one per span; a span's entry may be a list of
            [from, to, EI] ranges measured from the span's left end that cover the span.
        supports: one per span end: a kind (pinned, roller, fixed, free, guided) or a Support.
        names: support names; default S1, S2, ...
        hinges: chainages of internal moment releases [length].
        EA: axial stiffness [force]; default see :data:`AXIAL_TO_BENDING`.
        variations: haunches of spans by span number (1 for the first): the span's EI is then
            that of its prismatic part; a haunched span is one member (no hinge or EI step in
            it).
        title, units, source: carried to the model.
    """
    for number in variations or {}:
        if not 1 <= number <= len(spans):
            raise ModelError(f"a haunch on span {number} of {len(spans)}", source=source,
                             item="beam.haunches", fix=f"give a span from 1 to {len(spans)}")
    if not spans:
        raise ModelError("no spans given", source=source, item="beam.spans",
                         fix="give at least one span length")
    for number, span in enumerate(spans, start=1):
        if not (math.isfinite(span) and span > 0):
            raise ModelError(f"span {number} length {span:g} is not positive", source=source,
                             item="beam.spans", fix="give positive span lengths")
        if span < MIN_LENGTH:
            raise ModelError(f"span {number} length {span:g} is less than {MIN_LENGTH:g}",
                             source=source, item="beam.spans", fix="give real span lengths")
    if len(supports) != len(spans) + 1:
        raise ModelError(
            f"{len(supports)} supports for {len(spans)} spans", source=source,
            item="beam.supports",
            fix=f"give one support per span end: {len(spans) + 1} entries, left to right",
        )
    support_names = list(names) if names else [f"S{i + 1}" for i in range(len(supports))]
    if len(support_names) != len(supports):
        raise ModelError(f"{len(support_names)} names for {len(supports)} supports",
                         source=source, item="beam.names", fix="give one name per support")
    chainages = [0.0]
    for span in spans:
        chainages.append(chainages[-1] + span)
    total = chainages[-1]
    tolerance = POSITION_TOLERANCE * total

    segments = _segments(spans, EI, chainages, source)
    for hinge in hinges:
        if not (0 < hinge < total) or not math.isfinite(hinge):
            raise ModelError(f"hinge at {hinge:g} is outside the beam (0 to {total:g})",
                             source=source, item="beam.hinges",
                             fix="give hinge chainages inside the beam")
        for name, at, support in zip(support_names, chainages, supports, strict=True):
            kind = support if isinstance(support, str) else support.description
            if abs(hinge - at) <= tolerance and kind != "free":
                raise ModelError(
                    f"hinge at {hinge:g} stands on support {name}", source=source,
                    item="beam.hinges", fix="move the hinge off the support (a hinge over a "
                    "support releases nothing the support does not already allow)",
                )

    ordered_hinges = sorted(hinges)
    for first, second in zip(ordered_hinges, ordered_hinges[1:], strict=False):
        if second - first <= tolerance:
            raise ModelError(f"a hinge at {first:g} is given twice", source=source,
                             item="beam.hinges", fix="list each hinge once")

    # nodes at span ends, hinges and EI steps
    points: dict[float, str] = {}
    for name, at in zip(support_names, chainages, strict=True):
        points[at] = name
    hinge_nodes = []
    for number, hinge in enumerate(sorted(hinges), start=1):
        existing = _near(points, hinge, tolerance)
        if existing is None:
            points[hinge] = f"H{number}"
            existing = hinge
        hinge_nodes.append(points[existing])
    step_number = 0
    for segment in segments:
        for at in (segment.start, segment.end):
            if _near(points, at, tolerance) is None:
                step_number += 1
                points[at] = f"J{step_number}"
    generated = {name for at, name in points.items() if at not in chainages}
    clash = sorted(generated & set(support_names))
    if clash:
        raise ModelError(f"support name {clash[0]!r} is also the name of a generated node",
                         source=source, item="beam.names",
                         fix="H1, H2, ... name the hinges and J1, J2, ... the EI steps: give "
                             "the support another name")
    ordered = sorted(points)
    support_at = {at: s for at, s in zip(chainages, supports, strict=True)}
    nodes = []
    for at in ordered:
        support = support_at.get(at, "free")
        nodes.append(Node(points[at], at, 0.0,
                          support if isinstance(support, Support) else Support.named(support)))

    members = []
    hinge_points = {at for at in ordered if points[at] in hinge_nodes}
    per_span: dict[int, int] = {}
    pieces = []
    for lo, hi in zip(ordered, ordered[1:], strict=False):
        segment = next(s for s in segments if s.start - tolerance <= lo and hi <= s.end + tolerance)
        pieces.append((lo, hi, segment))
        per_span[segment.span] = per_span.get(segment.span, 0) + 1
    # one axial stiffness for the whole girder: segments of very different EI or length would
    # otherwise make a chain of axial springs of extreme contrast that looks free to slide
    default_axial = AXIAL_TO_BENDING * max(s.EI for s in segments) / max(spans) ** 2
    seen: dict[int, int] = {}
    for lo, hi, segment in pieces:
        seen[segment.span] = seen.get(segment.span, 0) + 1
        name = f"span{segment.span + 1}"
        if per_span[segment.span] > 1:
            name += _letters(seen[segment.span])
        axial = EA if EA is not None else default_axial
        variation = (variations or {}).get(segment.span + 1)
        if variation is not None and per_span[segment.span] > 1:
            raise ModelError(f"span {segment.span + 1} is haunched and also split by a hinge or "
                             "an EI step", source=source, item="beam.haunches",
                             fix="haunch a span that is one member, or model it in the "
                                 "general form")
        members.append(Member(
            name, points[lo], points[hi], EA=axial, EI=segment.EI,
            release_end=hi in hinge_points, deck=True, variation=variation,
        ))
    return Model(title=title, units=units, nodes=tuple(nodes), members=tuple(members),
                 path=tuple(PathLeg(m.name) for m in members), source=source,
                 hinge_nodes=tuple(hinge_nodes), form="beam")


def simple_beam(span: float, EI: float = 1.0, units: str = "kN-m") -> Model:
    """A single simply supported span, pinned at S1 and on a roller at S2."""
    return continuous_beam([span], EI, ["pinned", "roller"], title="simple span", units=units)


def _segments(spans: Sequence[float], EI: float | Sequence[float | EIRanges],
              chainages: list[float], source: str) -> list[_Segment]:
    per_span: list[float | EIRanges]
    if isinstance(EI, int | float):
        per_span = [float(EI)] * len(spans)
    else:
        per_span = list(EI)
        if len(per_span) == 1:
            per_span = per_span * len(spans)
        if len(per_span) != len(spans):
            raise ModelError(f"{len(per_span)} EI values for {len(spans)} spans", source=source,
                             item="beam.EI", fix="give one EI, or one per span")
    segments = []
    for index, (entry, span) in enumerate(zip(per_span, spans, strict=True)):
        left = chainages[index]
        if isinstance(entry, int | float):
            ranges: list[tuple[float, float, float]] = [(0.0, span, float(entry))]
        else:
            ranges = [_range(r, index, source) for r in entry]
            ranges.sort()
            covered = 0.0
            for lo, hi, _ in ranges:
                if abs(lo - covered) > POSITION_TOLERANCE * span or hi <= lo:
                    raise ModelError(
                        f"EI ranges of span {index + 1} leave a gap or overlap at {covered:g}",
                        source=source, item="beam.EI",
                        fix="give [from, to, EI] ranges that cover the span end to end",
                    )
                covered = hi
            if abs(covered - span) > POSITION_TOLERANCE * span:
                raise ModelError(
                    f"EI ranges of span {index + 1} end at {covered:g}, not at the span "
                    f"length {span:g}", source=source, item="beam.EI",
                    fix="give [from, to, EI] ranges that cover the span end to end",
                )
        for lo, hi, stiffness in ranges:
            if not (math.isfinite(stiffness) and stiffness > 0):
                raise ModelError(f"EI {stiffness:g} of span {index + 1} is not positive",
                                 source=source, item="beam.EI", fix="give positive EI values")
            segments.append(_Segment(left + lo, left + hi, stiffness, index))
    return segments


def _range(entry: Sequence[float], index: int, source: str) -> tuple[float, float, float]:
    if isinstance(entry, int | float) or len(entry) != 3:
        raise ModelError(f"EI range {entry!r} of span {index + 1} is not [from, to, EI]",
                         source=source, item="beam.EI", fix="write each range as [from, to, EI]")
    lo, hi, stiffness = (float(v) for v in entry)
    return lo, hi, stiffness


def _near(points: dict[float, str], at: float, tolerance: float) -> float | None:
    for existing in points:
        if abs(existing - at) <= tolerance:
            return existing
    return None


def _letters(number: int) -> str:
    return "abcdefghijklmnopqrstuvwxyz"[number - 1] if number <= 26 else f"_{number}"
