"""The exact effects a rating needs at every section: dead loads by name, and the governing
live load of each vehicle with the rating's dynamic allowance.

Sections are the envelope sections of the model file (supports, both sides where shear jumps,
tenth points or a step, extras; :mod:`influence.design.sections`). For each section and response
the influence line is built once; dead loads are integrated exactly on it
(:mod:`influence.design.deadload`), and the one governing search (:func:`govern_many`) places each
vehicle, in both directions, with its cases' allowances set to the rating's (see
:mod:`influence.rating.rating_vehicles`). A placement's value is then split into the vehicle's
part and the lane part (the lane and knife-edge loads exactly as placed, integrated on the same
line), so the rating equation applies IM to the vehicle alone and shows each part.

The span a section belongs to gives the LFR impact and the span rules: the span holding the
section; for moment over an interior support, the mean of the two spans it joins (AASHTO
Standard Specifications 3.8.2.2, from memory, unconfirmed); off the travel path, the shortest
span (the largest allowance; common practice).

Signs as in the README: sagging moment positive, shear positive when the resultant on the start
side of the section acts upward; values in the model's units.
"""

from __future__ import annotations

import dataclasses
from collections.abc import Sequence
from dataclasses import dataclass, field

from influence.analysis.lines import Analysis, InfluenceLine
from influence.analysis.responses import Response
from influence.design.deadload import dead_load_effects
from influence.design.envelope import section_responses
from influence.design.sections import Section, Span, envelope_sections, spans
from influence.model.basis import DesignBasis
from influence.rating.impact import span_in_feet
from influence.rating.rating_vehicles import for_span, with_allowance
from influence.rating.tables import data_file
from piecewise.tolerances import VALUE
from vehicles.loadmodel import LoadModel
from vehicles.search.concurrent import concurrent
from vehicles.search.govern import govern_many
from vehicles.search.placement import Placement

RATED_RESPONSES = ("moment", "shear", "axial")
"""Responses a capacity can be given for."""


@dataclass(frozen=True)
class RatedSection:
    """One section and response a rating looks at, with its dead-load effects.

    Attributes:
        section: where (label, chainage, span number, side).
        response: what.
        line: its exact influence line.
        member: the path member holding the section, None off the path.
        span_length: the span for the dynamic allowance and the span rules [length].
        span_basis: how that span was taken, in words.
        dead: effect of each dead load name [response unit x force], signed.
        moment_line: for a shear section, the moment line at the same place (concurrent
            moment), else None.
        dead_moment: dead-load moments by load name at the section, for shear sections.
        ordinate_scale: the size the line's ordinates reach [response unit per force]: values
            far below it times the loads are round-off and read as zero.
    """

    section: Section
    response: Response
    line: InfluenceLine = field(repr=False, compare=False)
    member: str | None
    span_length: float
    span_basis: str
    dead: tuple[tuple[str, float], ...]
    moment_line: InfluenceLine | None = field(default=None, repr=False, compare=False)
    dead_moment: tuple[tuple[str, float], ...] = ()
    ordinate_scale: float = 1.0

    @property
    def label(self) -> str:
        return self.section.label


@dataclass(frozen=True)
class LiveEffect:
    """A vehicle's governing placement at a section in one sense, split into its parts.

    Attributes:
        placement: the placement as the search gives it (axle loads with the allowance).
        vehicle: the vehicle's static effect, without allowance [response unit x force],
            signed.
        lane: the lane and knife-edge loads' effect as placed, signed (with ``lane_allowance``).
        allowance: the dynamic allowance on the vehicle [-].
        lane_allowance: the dynamic allowance on the lane load [-].
    """

    placement: Placement
    vehicle: float
    lane: float
    allowance: float
    lane_allowance: float

    @property
    def total(self) -> float:
        """The effect as placed: vehicle (1 + allowance) + lane."""
        return self.placement.value


def _span_length(section: Section, response: Response, found: list[Span]) -> tuple[float, str]:
    rules = data_file("vehicles.toml")["span"]
    by_number = {s.number: s for s in found}
    if section.span not in by_number:
        shortest = min(found, key=lambda s: s.length)
        return shortest.length, f"off the path: {rules['off_path']} ({rules['off_path_mark']})"
    own = by_number[section.span]
    if (response.kind == "moment" and section.support is not None
            and section.span - 1 in by_number and abs(own.start - (section.chainage or 0.0))
            <= 1e-9 * max(1.0, own.end)):
        before = by_number[section.span - 1]
        mean = 0.5 * (before.length + own.length)
        return mean, (f"moment over support {section.support}: {rules['support_moment']}"
                      f" ({rules['support_moment_mark']})")
    return own.length, f"span {own.number}"


def _member(analysis: Analysis, section: Section) -> str | None:
    if section.chainage is None:
        return None
    index, _ = analysis.path.locate(section.chainage, section.side)
    return analysis.path.legs[index].member


def rated_sections(analysis: Analysis, basis: DesignBasis, kinds: Sequence[str], *,
                   sections: Sequence[Section] | None = None,
                   concurrent_moment: bool = False) -> tuple[RatedSection, ...]:
    """Every envelope section for the responses ``kinds``, with lines and dead-load effects.

    Args:
        analysis: the factorised model.
        basis: dead loads and section settings of the model file.
        kinds: responses among :data:`RATED_RESPONSES`.
        sections: where (default: the envelope sections of the basis).
        concurrent_moment: also build the moment line at each shear section.
    """
    if sections is None:
        settings = basis.sections
        sections = envelope_sections(analysis.model, analysis.path, per_span=settings.per_span,
                                     step=settings.step, extra=settings.extra)
    pairs = [(s, r) for s, r in section_responses(sections, kinds, analysis.model)
             if r.kind in RATED_RESPONSES]
    lines = analysis.lines([r for _, r in pairs])
    moments: dict[str, InfluenceLine] = {}
    if concurrent_moment:
        places = list(dict.fromkeys(r.location for _, r in pairs if r.kind == "shear"))
        moments = dict(zip(places, analysis.lines([Response("moment", p) for p in places]),
                           strict=True))
    found = spans(analysis.model, analysis.path)
    rated = []
    for (section, response), line in zip(pairs, lines, strict=True):
        length, basis_text = _span_length(section, response, found)
        moment = moments.get(response.location) if response.kind == "shear" else None
        rated.append(RatedSection(
            section, response, line, _member(analysis, section), length, basis_text,
            _dead(line, basis, analysis), moment,
            () if moment is None else _dead(moment, basis, analysis),
            _ordinate_scale(response.kind, analysis)))
    return tuple(rated)


def _ordinate_scale(kind: str, analysis: Analysis) -> float:
    """The size influence ordinates of a response reach: the path length for moment [length],
    1 for forces [-] (a support's moment line is round-off alone, so its own size says
    nothing)."""
    return analysis.path.total_length if kind == "moment" else 1.0


def _rounded(value: float, scale: float) -> float:
    """A value that is round-off of a sum whose terms reach ``scale`` reads as zero (a support
    section's moment, say)."""
    return 0.0 if abs(value) <= VALUE * scale else value


def _dead(line: InfluenceLine, basis: DesignBasis, analysis: Analysis
          ) -> tuple[tuple[str, float], ...]:
    total = analysis.path.total_length
    scale = _ordinate_scale(line.response.kind, analysis) * sum(
        load.uniform * total + load.point for load in basis.loads)
    return tuple((name, _rounded(value, scale)) for name, value in
                 dead_load_effects(line, basis.loads, analysis.path).items())


def _split(placement: Placement, rated: RatedSection, allowance: float,
           lane_allowance: float) -> LiveEffect:
    """The placement's value as vehicle and lane parts: the lane and knife-edge loads alone,
    exactly as placed, on the same line."""
    lane_only = dataclasses.replace(placement, axle_positions=(), axle_loads=(),
                                    patch_segments=())
    lane = concurrent(lane_only, rated.line.function).value if (
        placement.lane_segments or placement.knife_edge_position is not None) else 0.0
    loads = (sum(placement.axle_loads) + placement.knife_edge_load
             + sum(q * (b - a) for a, b, q in placement.patch_segments)
             + sum(placement.lane_intensity * (b - a) for a, b in placement.lane_segments))
    scale = rated.ordinate_scale * loads
    vehicle = _rounded((placement.value - lane) / (1.0 + allowance), scale)
    return LiveEffect(placement, vehicle, _rounded(lane, scale), allowance, lane_allowance)


@dataclass
class LiveSearch:
    """The governing searches of a rating, each (vehicle, allowances, cases) done once.

    ``effects`` answers for any sections; a search already made for a section is not repeated
    (the design inventory and operating levels share theirs, for example).
    """

    sections: tuple[RatedSection, ...]
    units: str
    _done: dict[tuple[str, float, float, tuple[str, ...], int],
                tuple[LiveEffect | None, LiveEffect | None]] = field(default_factory=dict)

    def effects(self, model: LoadModel, indices: Sequence[int],
                allowances: Sequence[tuple[float, float]]
                ) -> list[tuple[LiveEffect | None, LiveEffect | None] | None]:
        """(largest, smallest) live effect of ``model`` at each section ``indices[k]`` with its
        (vehicle, lane) allowances ``allowances[k]``; None where no case of the model applies
        on that span (the lane-type load's span rule)."""
        keys = []
        for index, (vehicle, lane) in zip(indices, allowances, strict=True):
            feet = span_in_feet(self.sections[index].span_length, self.units)
            cases = tuple(c.name for c in for_span(model, feet).cases)
            keys.append((model.name, vehicle, lane, cases, index))
        missing: dict[tuple[str, float, float, tuple[str, ...]], list[int]] = {}
        for key in keys:
            if key not in self._done:
                missing.setdefault(key[:4], []).append(key[4])
        for (_, vehicle, lane, cases), members in missing.items():
            self._search(model, vehicle, lane, cases, members)
        return [self._done.get(key) for key in keys]

    def _search(self, model: LoadModel, vehicle: float, lane: float, cases: tuple[str, ...],
                members: list[int]) -> None:
        kept = tuple(c for c in model.cases if c.name in cases)
        if not kept:
            return
        ready = with_allowance(dataclasses.replace(model, cases=kept), vehicle, lane)
        chosen = [self.sections[i] for i in members]
        results = govern_many([s.line.function for s in chosen], ready,
                              kinds=[s.response.kind for s in chosen],
                              interiors=[s.line.scope_interior for s in chosen],
                              sections=[s.line.section_chainage for s in chosen])
        for index, rated, result in zip(members, chosen, results, strict=True):
            pair = tuple(None if p is None else _split(p, rated, vehicle, lane)
                         for p in (result.max, result.min))
            self._done[(model.name, vehicle, lane, cases, index)] = (pair[0], pair[1])
