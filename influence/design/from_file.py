"""Runs on a model file, each the library function behind one command: the envelope
(``influence envelope`` and ``report``), the governing positions at one section (``govern``) and
the sweeps of a load model (``sweep``).

All three read the file once, take the load models named (or the file's
``live_load.vehicles``) with the file's ``live_load.adjust`` and the adjustments given, and
multiply one lane's effects by the file's distribution and multiple presence factors, so that the
same section gives the same value in every output; ``per_lane=True`` gives one lane's values
instead (governing positions and sweeps), and every result states which (its ``live_note``).

Example (the bundled overpass: the largest midspan moment of HL-93 is the same number from the
governing search and from the envelope, both per girder line):
    >>> from pathlib import Path
    >>> from influence.analysis.responses import Response
    >>> overpass = Path(__file__).parents[2] / "examples" / "overpass.toml"
    >>> found = governing_from_file(overpass, Response("moment", "40"))
    >>> run = envelope_from_file(overpass, responses=("moment",))
    >>> at_40 = next(e for e in run.envelope.of("moment") if e.section.chainage == 40.0)
    >>> round(found.result.governing.max.value, 2), round(at_40.live_max, 2)
    (1702.74, 1702.74)
    >>> one_lane = governing_from_file(overpass, Response("moment", "40"), per_lane=True)
    >>> round(one_lane.result.governing.max.value, 2), one_lane.live_note[:24]
    (2746.35, 'Live load of ONE LANE: l')
    >>> governing_from_file(overpass, Response("moment", "A1")).result.governing.max is None
    True
"""

from __future__ import annotations

from collections.abc import Callable, Mapping, Sequence
from dataclasses import dataclass, replace
from pathlib import Path

from influence.analysis.lines import Analysis, InfluenceLine, analyse_model
from influence.analysis.responses import Response
from influence.design.bars import count_entries, default_responses, structure_envelope
from influence.design.envelope import Envelope
from influence.design.governing import GoverningResult, governing
from influence.design.loading import live_load_scale, model_vehicles, vehicles_for
from influence.design.sections import envelope_sections
from influence.errors import ModelError
from influence.model.basis import SectionSettings
from influence.model.reader import ModelFile, read_model_file
from piecewise import Piecewise
from vehicles.errors import VehicleError
from vehicles.loadmodel import LoadModel
from vehicles.search.govern import govern
from vehicles.search.placement import Placement
from vehicles.search.sweep import Sweep, sweep

Progress = Callable[[int, int], None]
"""Called with (entries finished so far, entries in all)."""
DIRECTIONS = ("forward", "reverse", "both")


@dataclass(frozen=True)
class EnvelopeRun:
    """An envelope from a model file.

    Attributes:
        read: the model file as read (structure, design basis, project).
        analysis: the factorised structure.
        envelope: the envelope entries, combinations and deflection checks.
    """

    read: ModelFile
    analysis: Analysis
    envelope: Envelope


@dataclass(frozen=True)
class LiveLoadRun:
    """What a run on a model file read and what it did to the live load.

    Attributes:
        read: the model file as read (structure, design basis, project).
        notes: unit conversions and adjustments of the load models.
        live_scale: what one lane's effect was multiplied by [-].
        live_note: the sentence that says so.
    """

    read: ModelFile
    notes: tuple[str, ...]
    live_scale: float
    live_note: str


@dataclass(frozen=True)
class GoverningRun(LiveLoadRun):
    """The governing positions at one section of a model file.

    Attributes:
        analysis: the factorised structure.
        result: the governing search (values times ``live_scale``).
        models: the load models used, in the structure's units.
    """

    analysis: Analysis
    result: GoverningResult
    models: tuple[LoadModel, ...]


@dataclass(frozen=True)
class SweepRun(LiveLoadRun):
    """The sweeps of one load model at one section of a model file.

    Attributes:
        line: the influence line swept.
        model: the load model with the swept cases only.
        sweeps: one per case and direction (values times ``live_scale``).
        placement: where the swept cases govern in the swept sense (None where they give no
            effect of that sign), for drawing.
    """

    line: InfluenceLine
    model: LoadModel
    sweeps: tuple[Sweep, ...]
    placement: Placement | None

    @property
    def title(self) -> str:
        return f"{self.read.model.title}: sweep of {self.line.response.label}, {self.model.name}"


def envelope_from_file(path: str | Path, *, vehicles: Sequence[str] = (),
                       responses: Sequence[str] = (), step: float | None = None,
                       per_span: int | None = None, adjust: Mapping[str, float] | None = None,
                       progress: Progress | None = None) -> EnvelopeRun:
    """The envelope of a model file with its dead loads, combinations and deflection check.

    Args:
        path: the model file.
        vehicles: library names or vehicle files (default: the file's ``live_load.vehicles``).
        responses: responses to envelope (default moment, shear, reaction, deflection; for a
            truss axial force at every bar, reactions and deflection).
        step: section spacing along each span [length], instead of the file's sections.
        per_span: divisions of each span, instead of the file's sections.
        adjust: load-model adjustments by name, over the file's ``live_load.adjust``.
        progress: told how many entries are done, as they finish.

    Raises:
        ModelError: both ``step`` and ``per_span`` given, or no vehicle anywhere.

    Example (the bundled overpass's reactions, per girder line; sections and divisions together
    are refused):
        >>> overpass = Path(__file__).parents[2] / "examples" / "overpass.toml"
        >>> run = envelope_from_file(overpass, responses=("reaction",))
        >>> entries = run.envelope.entries
        >>> [e.section.label for e in entries], round(entries[1].live_max, 2)
        (['A1', 'P1', 'P2', 'A2'], 519.76)
        >>> try:
        ...     envelope_from_file(overpass, step=1.0, per_span=4)
        ... except ModelError as error:
        ...     print(error.fix)
        give --step or --per-span, not both
    """
    if step is not None and per_span is not None:
        raise ModelError("both a section step and divisions per span are given",
                         item="sections", fix="give --step or --per-span, not both")
    read = read_model_file(path)
    model, basis = read.model, read.basis
    models, notes = model_vehicles(vehicles, model, basis, adjust)
    deflection_models: list[LoadModel] = []
    if basis.live.deflection_vehicles:
        deflection_models, more = vehicles_for(basis.live.deflection_vehicles, model.units,
                                               basis.live.adjust)
        notes += more + ["Deflection check with " + ", ".join(
            m.name for m in deflection_models) + "."]
    analysis = analyse_model(model)
    settings = basis.sections
    if step is not None or per_span is not None:
        settings = SectionSettings(per_span=per_span or settings.per_span, step=step,
                                   extra=settings.extra)
    sections = envelope_sections(model, analysis.path, per_span=settings.per_span,
                                 step=settings.step, extra=settings.extra)
    kinds = tuple(responses) or default_responses(model)
    total = count_entries(model, sections, kinds)
    done = [0]

    def advance(count: int) -> None:
        done[0] += count
        if progress is not None:
            progress(done[0], total)

    result = structure_envelope(analysis, models, basis, kinds=kinds, sections=sections,
                                progress=advance, notes=notes,
                                deflection_models=deflection_models)
    return EnvelopeRun(read, analysis, result)


def governing_from_file(path: str | Path, response: Response, *,
                        vehicles: Sequence[str] = (), adjust: Mapping[str, float] | None = None,
                        top: int = 1, concurrent_with: Sequence[Response] = (),
                        per_lane: bool = False) -> GoverningRun:
    """Where the load models must stand for the largest and smallest ``response`` of a model
    file, per girder line as the envelope gives it (or one lane's with ``per_lane``).

    Args:
        path: the model file.
        response: what to search, and where.
        vehicles: library names or vehicle files (default: the file's ``live_load.vehicles``).
        adjust: load-model adjustments by name, over the file's ``live_load.adjust``.
        top: distinct positions to list for each sense.
        concurrent_with: other responses under the same loads.
        per_lane: leave out the file's distribution and multiple presence factors.

    Example (the reaction over pier P1 of the bundled overpass: the truck pair governs; every
    case of HL-93 keeps its own row):
        >>> overpass = Path(__file__).parents[2] / "examples" / "overpass.toml"
        >>> run = governing_from_file(overpass, Response("reaction", "P1"))
        >>> best = run.result.governing.max
        >>> round(best.value, 2), best.case, len(run.result.by_case), run.live_scale
        (519.76, '90% truck pair + lane', 3, 0.62)
    """
    read = read_model_file(path)
    models, notes = model_vehicles(vehicles, read.model, read.basis, adjust)
    scale, note = live_load_scale(read.basis.live, per_lane)
    analysis = analyse_model(read.model)
    result = governing(analysis, response, models, top=top, concurrent_with=concurrent_with,
                       live_scale=scale)
    return GoverningRun(read=read, notes=tuple(notes), live_scale=scale, live_note=note,
                        analysis=analysis, result=result, models=tuple(models))


def placement_sweeps(run: GoverningRun) -> list[Sweep]:
    """The sweeps of the cases that govern the largest and smallest effect, in the direction
    and with the gaps they govern with (values times the run's live-load scale): what the
    governing plot draws beside the trains."""
    found = []
    line = run.result.line
    cases = {(m.name, c.name): c for m in run.models for c in m.cases}  # models may share names
    for placement in (run.result.governing.max, run.result.governing.min):
        if placement is None:
            continue
        gaps = [r.value for r in placement.ranged_values if r.value is not None]
        found.append(_scaled(sweep(line.function, cases[placement.model, placement.case],
                                   placement.direction, kind=line.response.kind,
                                   sense=placement.sense, ranged_values=gaps), run.live_scale))
    return found


def sweeps_from_file(path: str | Path, response: Response, vehicle: str, *,
                     case: str | None = None, direction: str = "both", sense: str = "max",
                     step: float | None = None, adjust: Mapping[str, float] | None = None,
                     per_lane: bool = False) -> SweepRun:
    """The effect on ``response`` as a load model travels over a model file's structure, per
    girder line as the envelope gives it (or one lane's with ``per_lane``).

    Args:
        path: the model file.
        response: what to sweep, and where.
        vehicle: a library name or vehicle file.
        case: one case of the load model (default: every case).
        direction: "forward", "reverse" or "both".
        sense: "max" or "min": the adverse parts the lane covers, and the extreme whose
            governing gaps are used.
        step: tabulation step of the lead position [length] (breakpoints added).
        adjust: load-model adjustments by name, over the file's ``live_load.adjust``.
        per_lane: leave out the file's distribution and multiple presence factors.

    Raises:
        VehicleError: the load model has no case of that name.

    Example (the tandem over the end support A1 of the bundled overpass, per girder line: its
    largest value is where the tandem governs; a case the model lacks is refused):
        >>> overpass = Path(__file__).parents[2] / "examples" / "overpass.toml"
        >>> run = sweeps_from_file(overpass, Response("reaction", "A1"), "HL-93",
        ...                        case="design tandem + lane", direction="forward")
        >>> round(float(max(run.sweeps[0].values)), 2), round(run.placement.value, 2)
        (239.17, 239.17)
        >>> try:
        ...     sweeps_from_file(overpass, Response("reaction", "A1"), "HL-93", case="crane")
        ... except VehicleError as error:
        ...     print(error.fix)
        cases: design truck + lane, design tandem + lane, 90% truck pair + lane
    """
    if direction not in DIRECTIONS:
        raise VehicleError(f"direction {direction!r}", item="direction",
                           fix="give forward, reverse or both")
    read = read_model_file(path)
    models, notes = model_vehicles((vehicle,), read.model, read.basis, adjust)
    scale, note = live_load_scale(read.basis.live, per_lane)
    line = analyse_model(read.model).line(response)
    chosen = [c for c in models[0].cases if case in (None, c.name)]
    if not chosen:
        raise VehicleError(f"no case named {case!r}", item=models[0].name,
                           fix="cases: " + ", ".join(c.name for c in models[0].cases))
    ways = ("forward", "reverse") if direction == "both" else (direction,)
    sweeps = tuple(_scaled(sweep(line.function, c, way, kind=response.kind, sense=sense,
                                 step=step), scale)
                   for c in chosen for way in ways if c.train is not None or way == "forward")
    swept = replace(models[0], cases=tuple(chosen))
    best = govern(line.function, swept, kind=response.kind, interior=line.scope_interior,
                  section=line.section_chainage)
    extreme = best.max if sense == "max" else best.min
    placement = None if extreme is None else replace(extreme, value=extreme.value * scale)
    return SweepRun(read=read, notes=tuple(notes), live_scale=scale, live_note=note, line=line,
                    model=swept, sweeps=sweeps, placement=placement)


def _scaled(found: Sweep, scale: float) -> Sweep:
    if scale == 1.0:
        return found
    effect = Piecewise(found.effect.breaks, found.effect.coeffs * scale)
    return replace(found, effect=effect, values=found.values * scale)
