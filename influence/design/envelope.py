"""Envelopes: the largest and smallest live-load effect at every section, with the dead-load
effects and the factored combinations, each value traceable to its governing placement.

For each section and response the influence line is built exactly and handed to the exact
placement search of :mod:`vehicles.search.govern`; dead loads are integrated exactly on the same
line (:mod:`influence.design.deadload`). Live-load values of one lane are multiplied by the
live-load scale (distribution factor x multiple presence factor) of the design basis.

A combination factors each load name with its maximum and minimum factors and the live load
with its factor: largest = sum of max(f_max D, f_min D) + f_LL max(LL_max, 0); smallest the same
with min (the usual rule for permanent loads that may help or hurt).
"""

from __future__ import annotations

from collections.abc import Callable, Sequence
from dataclasses import dataclass, replace
from functools import partial

import numpy as np

from influence.analysis.lines import Analysis, InfluenceLine
from influence.analysis.responses import Response
from influence.design.deadload import dead_load_effects
from influence.design.sections import Section, Span, envelope_sections, spans
from influence.model.basis import LIVE_LOAD, Combination, DesignBasis
from influence.model.structure import Model
from vehicles.loadmodel import LoadModel
from vehicles.search.govern import Governing, govern, govern_many
from vehicles.search.placement import Placement
from vehicles.units import labels

ENVELOPE_RESPONSES = ("moment", "shear", "reaction", "deflection")
"""Responses enveloped by default."""
ENVELOPE_CHOICES = (*ENVELOPE_RESPONSES, "axial")
"""Responses an envelope can take (axial force for truss bars and frame members)."""
DEFLECTION_REFINEMENT = 1e-4
"""Bracket [fraction of the span] of the search for the section of largest live deflection
between envelope sections; the deflection at each trial section is exact."""

LIVE_BLOCK = 256
"""Influence lines searched together (vehicles.search.govern.govern_many); progress is
reported a block at a time."""

Progress = Callable[[int], None]


@dataclass(frozen=True)
class EnvelopeEntry:
    """One response at one section.

    Attributes:
        section: where.
        response: what.
        live: the governing placements of the load models for one lane (values include each
            case's factors and dynamic allowance, not the live-load scale).
        live_scale: distribution x multiple presence factor applied to the live values [-].
        dead: effects of the dead loads by load name.
    """

    section: Section
    response: Response
    live: Governing
    live_scale: float
    dead: tuple[tuple[str, float], ...]

    @property
    def kind(self) -> str:
        return self.response.kind

    @property
    def live_max(self) -> float | None:
        return None if self.live.max is None else self.live.max.value * self.live_scale

    @property
    def live_min(self) -> float | None:
        return None if self.live.min is None else self.live.min.value * self.live_scale

    def dead_effect(self, load: str) -> float:
        return dict(self.dead).get(load, 0.0)

    def combined(self, combination: Combination) -> tuple[float, float]:
        """(largest, smallest) factored effect of a combination."""
        high = low = 0.0
        for load, effect in self.dead:
            f_max, f_min = combination.factor(load)
            high += max(f_max * effect, f_min * effect)
            low += min(f_max * effect, f_min * effect)
        f_live, _ = combination.factor(LIVE_LOAD)
        high += f_live * max(self.live_max or 0.0, 0.0)
        low += f_live * min(self.live_min or 0.0, 0.0)
        return high, low


@dataclass(frozen=True)
class DeflectionCheck:
    """The largest live-load deflection of a span against span / N."""

    span: Span
    deflection: float  # [length], downward positive, live scale included
    at: float  # chainage of the section [length]
    placement: Placement | None
    limit: float  # [length]

    @property
    def ratio(self) -> float:
        return self.deflection / self.limit if self.limit else float("nan")

    @property
    def passes(self) -> bool:
        return self.deflection <= self.limit


@dataclass(frozen=True)
class Envelope:
    """Every envelope entry of a run, and the deflection check."""

    entries: tuple[EnvelopeEntry, ...]
    models: tuple[LoadModel, ...]
    basis: DesignBasis
    units: str
    deflection_checks: tuple[DeflectionCheck, ...] = ()
    notes: tuple[str, ...] = ()

    def of(self, kind: str) -> list[EnvelopeEntry]:
        return [e for e in self.entries if e.kind == kind]


def section_responses(sections: Sequence[Section], kinds: Sequence[str],
                      model: Model) -> list[tuple[Section, Response]]:
    """The (section, response) pairs of an envelope: reactions only where supports stand, for
    every direction they restrain (horizontal ones only in the general form: a girder under
    vertical load has none), moment reactions labelled with their unit."""
    pairs = []
    for kind in kinds:
        for section in sections:
            if kind == "reaction":
                if section.support and section.side == "right":
                    pairs.extend(_reaction_pairs(section, section.support, model))
                continue
            if section.reaction_only:
                continue
            if kind in ("moment", "deflection", "rotation"):
                if section.side == "left":
                    continue  # no applied moments: moments and displacements do not jump
                section = replace(section, label=section.label.removesuffix(" right"))
            pairs.append((section, Response(kind, section.location, section.side)))
    return pairs


def _reaction_pairs(section: Section, support: str,
                    model: Model) -> list[tuple[Section, Response]]:
    restraint = model.node(support).support
    found = []
    for component, direction in (("vertical", "uy"), ("horizontal", "ux"), ("moment", "rz")):
        if restraint.restraint(direction) == "free":
            continue
        if component == "horizontal" and model.form == "beam":
            continue
        label = support if component == "vertical" else f"{support} {component}"
        if component == "moment":
            label += f" [{labels(model.units).moment}]"
        found.append((replace(section, label=label),
                      Response("reaction", support, component=component)))
    return found


def envelope(
    analysis: Analysis,
    models: Sequence[LoadModel],
    basis: DesignBasis,
    *,
    kinds: Sequence[str] = ENVELOPE_RESPONSES,
    sections: Sequence[Section] | None = None,
    progress: Progress | None = None,
    notes: Sequence[str] = (),
    deflection_models: Sequence[LoadModel] = (),
) -> Envelope:
    """Envelopes of the responses at the sections, for the load models and the dead loads.

    Args:
        analysis: the factorised model.
        models: load models in the model's units.
        basis: dead loads, combinations, live-load settings.
        kinds: responses to envelope.
        sections: where; default from the basis (tenth points, supports, hinges, extras).
        progress: called with the number of entries finished since the last call.
        notes: remarks carried to the outputs (such as unit conversions of load models).
        deflection_models: load models for the deflection check, if not the envelope's.
    """
    if sections is None:
        settings = basis.sections
        sections = envelope_sections(analysis.model, analysis.path, per_span=settings.per_span,
                                     step=settings.step, extra=settings.extra)
    pairs = section_responses(sections, kinds, analysis.model)
    lines = analysis.lines([response for _, response in pairs])
    entries = []
    for start in range(0, len(lines), LIVE_BLOCK):
        block = lines[start : start + LIVE_BLOCK]
        lives = govern_many([line.function for line in block], models,
                            kinds=[line.response.kind for line in block],
                            interiors=[line.scope_interior for line in block],
                            sections=[line.section_chainage for line in block])
        for (section, _), line, live in zip(pairs[start : start + LIVE_BLOCK], block, lives,
                                            strict=True):
            entries.append(_entry(analysis, section, line, live, basis))
        if progress:
            progress(len(block))
    checks: tuple[DeflectionCheck, ...] = ()
    if basis.live.deflection_limit and "deflection" in kinds:
        chainages = [e.section.chainage for e in entries
                     if e.kind == "deflection" and e.section.chainage is not None]
        checks = tuple(deflection_checks(analysis, deflection_models or models, basis,
                                         chainages))
    return Envelope(tuple(entries), tuple(models), basis, analysis.model.units, checks,
                    tuple(notes))


def _entry(analysis: Analysis, section: Section, line: InfluenceLine, live: Governing,
           basis: DesignBasis) -> EnvelopeEntry:
    dead = dead_load_effects(line, basis.loads, analysis.path)
    return EnvelopeEntry(section, line.response, live, basis.live.scale,
                         tuple(dead.items()))


def deflection_checks(analysis: Analysis, models: Sequence[LoadModel], basis: DesignBasis,
                      chainages: Sequence[float]) -> list[DeflectionCheck]:
    """Largest live deflection of each span against span / N.

    The load models may differ from the envelope's (a code's deflection loading). Every section
    chainage given is searched exactly; around the largest of each span a bounded search between
    its neighbours refines the section (bracket :data:`DEFLECTION_REFINEMENT` of the span; the
    deflection at every trial section is exact).
    """
    from scipy.optimize import minimize_scalar  # only here: scipy.optimize is slow to import

    assert basis.live.deflection_limit
    found = []
    for span in spans(analysis.model, analysis.path):
        inside = sorted(c for c in chainages if span.start <= c <= span.end)
        if not inside:
            continue
        lines = analysis.lines([Response("deflection", repr(float(c))) for c in inside])
        results = govern_many([line.function for line in lines], models,
                              kinds=["deflection"] * len(lines),
                              interiors=[False] * len(lines),
                              sections=[line.section_chainage for line in lines])
        values = [r.max.value if r.max is not None else 0.0 for r in results]
        index = int(np.argmax(values))
        at, value, placement = inside[index], values[index], results[index].max
        lo, hi = inside[max(index - 1, 0)], inside[min(index + 1, len(inside) - 1)]

        trials: dict[float, Placement | None] = {}  # every trial's placement, by chainage
        if hi > lo:
            objective = partial(_negative_deflection, analysis=analysis, models=models,
                                trials=trials)
            from scipy.optimize import minimize_scalar  # loaded only for the refinement

            search = minimize_scalar(objective, bounds=(lo, hi), method="bounded",
                                     options={"xatol": DEFLECTION_REFINEMENT * span.length})
            if -search.fun > value:
                at, value = float(search.x), float(-search.fun)
                placement = trials[at]
        limit = span.length / basis.live.deflection_limit
        found.append(DeflectionCheck(span, value * basis.live.scale, at, placement, limit))
    return found


def _negative_deflection(chainage: float, *, analysis: Analysis, models: Sequence[LoadModel],
                         trials: dict[float, Placement | None]) -> float:
    """Minus the largest live deflection at a section (for a minimiser), keeping its placement."""
    line = analysis.line(Response("deflection", repr(float(chainage))))
    placement = govern(line.function, models, kind="deflection").max
    trials[float(chainage)] = placement
    return -(placement.value if placement else 0.0)


def governing_label(placement: Placement | None) -> str:
    """'model: case, direction' for tables."""
    if placement is None:
        return "-"
    return f"{placement.model}: {placement.case} ({placement.direction})"
