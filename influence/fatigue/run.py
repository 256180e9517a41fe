"""A whole fatigue run: a model file's [[fatigue_detail]] entries under a spectrum of real trucks,
a fatigue truck with its trucks a day, or EN 1991-2's FLM3 and FLM4 with a traffic category.

For every distinct response and location among the details, the influence line is found once and
every vehicle's crossing history is formed exactly and reduced to its turning points
(:mod:`influence.fatigue.crossings`), then rainflow-counted (ASTM E1049-85 5.4.4, half cycles)
in one batch. Each detail turns the counted effects into stresses (its stress per unit effect)
and adds up the damage of a year (:func:`~influence.fatigue.assessment.assess_counted`).
Where a detail gives ``cycles_per_passage`` its crossings count as that many cycles of their full
range (the AASHTO rule) instead; with the AASHTO standard the other way is given beside it, the
cycles per passage read from Table 6.6.1.2.5-2 (:mod:`~influence.fatigue.table_cycles`).

Signs and units (README): loads downward, moment positive sagging; effects in the model's units,
stresses in ksi (kip-ft models) or MPa (kN-m models); ranges are positive.

Example:
    >>> import pathlib, tempfile
    >>> folder = pathlib.Path(tempfile.mkdtemp())
    >>> _ = (folder / "span.toml").write_text(
    ...     'units = "kip-ft"\\n[beam]\\nspans = [60.0]\\nEI = 1.0e6\\n'
    ...     'supports = ["pinned", "roller"]\\n[fatigue]\\nstandard = "AASHTO"\\n'
    ...     'adtt = 1000\\nlanes = 1\\n[[fatigue_detail]]\\nname = "flange"\\n'
    ...     'location = "22.5"\\nresponse = "moment"\\ncategory = "E"\\n'
    ...     'section_modulus = 1200.0\\n')
    >>> results = fatigue(folder / "span.toml", vehicle="HL-93 fatigue")
    >>> detail = results.details[0]
    >>> detail.table_cycles_per_passage, detail.table_basis.split(": ")[1]
    (1.0, 'simple-span girder, span 60 ft')
    >>> round(detail.life.governing_range, 9)  # rear 32 kip on the section: 540 kip-ft x 12 / 1200
    5.4
"""

from __future__ import annotations

import os
from collections.abc import Sequence
from concurrent.futures import ThreadPoolExecutor
from dataclasses import dataclass
from pathlib import Path

import numpy as np

from influence.analysis.lines import Analysis, InfluenceLine, analyse_model
from influence.analysis.responses import Response
from influence.design.loading import vehicles_for
from influence.errors import InfluenceError, ModelError
from influence.fatigue.assessment import assess_counted
from influence.fatigue.batch_counting import CycleBatch, count_many
from influence.fatigue.checks import FatigueChecks, fatigue_checks
from influence.fatigue.counting import METHODS
from influence.fatigue.crossings import Crossing, crossing, crossing_histories
from influence.fatigue.damage import FatigueLife
from influence.fatigue.fleet import Fleet
from influence.fatigue.histories import Histories
from influence.fatigue.passages import Traffic, spectrum_traffic, vehicle_traffic
from influence.fatigue.settings import (
    FatigueDetail,
    FatigueSettings,
    detail_resistance,
    fatigue_details,
    fatigue_settings,
)
from influence.fatigue.spectrum import read_spectrum
from influence.fatigue.table_cycles import table_cycles
from influence.model.reader import ModelFile, read_model_file

DIRECTION_CHOICES = ("forward", "reverse", "both")
"""Which way the traffic travels; "both" sends half of every vehicle's passages each way."""

COUNTED = METHODS["rainflow"]


def table_method(n: float) -> str:
    """The words for n cycles of each crossing's full range."""
    return f"each passage counts n = {n:g} cycles of its full range (max - min)"


@dataclass(frozen=True, eq=False)
class DetailFatigue:
    """One detail's fatigue under the run's traffic.

    Attributes:
        detail: the [[fatigue_detail]] entry.
        line: the influence line of its response at its location.
        life: the assessment by ``method``: stress ranges a year, damage, life, equivalent
            range, infinite-life verdict [stress unit].
        method: how each crossing's cycles were found.
        checks: the standard's two checks behind ``life``.
        counted_cycles_per_passage: rainflow cycles a passage, half cycles as 0.5, averaged
            over the passages.
        equivalent_cycles_per_passage: the damage of a passage's counted cycles as cycles of its
            full range (sum of count x (range / full range)^m, m the curve's first slope),
            averaged over the passages: what the table's n stands for.
        table_cycles_per_passage: n of AASHTO LRFD Table 6.6.1.2.5-2 (or the detail's own),
            None when not read.
        table_basis: where n comes from, in words ("" when not read).
        alternative: AASHTO only, the assessment by the other way (table n when ``life`` is
            counted, counted when the detail gives n), or None.
        alternative_method: how ``alternative`` found its cycles ("" without one).
        largest_vehicle: index in the fleet of the crossing with the largest range here.
    """

    detail: FatigueDetail
    line: InfluenceLine
    life: FatigueLife
    method: str
    checks: FatigueChecks
    counted_cycles_per_passage: float
    equivalent_cycles_per_passage: float
    table_cycles_per_passage: float | None
    table_basis: str
    alternative: FatigueLife | None
    alternative_method: str
    largest_vehicle: int


@dataclass(frozen=True, eq=False)
class FatigueResults:
    """A run's results, detail by detail.

    Attributes:
        title: the model's title.
        source: the model file.
        units: "kip-ft" or "kN-m".
        settings: the [fatigue] table.
        traffic: the vehicles and how often they pass, described.
        direction: "forward", "reverse" or "both".
        counting: the cycle-counting practice, with its clause.
        details: one result a detail, in file order.
        notes: remarks for the output.
    """

    title: str
    source: str
    units: str
    settings: FatigueSettings
    traffic: Traffic
    direction: str
    counting: str
    details: tuple[DetailFatigue, ...]
    notes: tuple[str, ...]

    @property
    def stress_unit(self) -> str:
        return self.settings.stress_unit

    def detail(self, name: str | None = None) -> DetailFatigue:
        """The detail called ``name`` (the first when None).

        Raises:
            ModelError: for an unknown name.
        """
        if name is None:
            return self.details[0]
        for result in self.details:
            if result.detail.name == name:
                return result
        raise ModelError(f"no fatigue detail named {name!r}", source=self.source,
                         item="detail", fix="use one of " + ", ".join(
                             r.detail.name for r in self.details))

    def crossing(self, name: str | None = None, vehicle: int | None = None) -> Crossing:
        """The exact history of one crossing at a detail: the vehicle with the largest range
        there unless ``vehicle`` (an index in the fleet) is given; the first direction run."""
        result = self.detail(name)
        fleet = self.traffic.fleet
        k = result.largest_vehicle if vehicle is None else vehicle
        if not 0 <= k < fleet.count:
            raise ModelError(f"no vehicle {k}", source=self.source, item="vehicle",
                             fix=f"give 0 to {fleet.count - 1}")
        direction = "reverse" if self.direction == "reverse" else "forward"
        return crossing(result.line, fleet.train(k), direction)


def fatigue(model: str | Path | ModelFile, *, spectrum: str | Path | None = None,
            vehicle: str | None = None, adtt: float | None = None,
            traffic_category: str | None = None, traffic_type: str | None = None,
            direction: str = "forward", workers: int | None = None) -> FatigueResults:
    """Fatigue of every detail of a model file under one traffic.

    Args:
        model: the model file (or one already read) with [fatigue] and [[fatigue_detail]].
        spectrum: a spectrum file of real trucks (see :mod:`influence.fatigue.spectrum`).
        vehicle: or a fatigue load model by library name or file (HL-93 fatigue, FLM3, FLM4).
        adtt: trucks a day, one direction, all lanes, instead of [fatigue] adtt; the lanes or p
            of [fatigue] make it single-lane.
        traffic_category: for a load model with traffic categories (EN 1991-2 Table 4.5).
        traffic_type: for a set of lorries, whose shares of the traffic it gives (FLM4).
        direction: "forward", "reverse" or "both" (half the passages each way).
        workers: lines worked on at once (default: the machine's cores).

    Raises:
        ModelError: naming the file, item and fix for every bad input.
    """
    read = model if isinstance(model, ModelFile) else read_model_file(model)
    source = read.source
    units = read.model.units
    settings = fatigue_settings(read.document, source, units)
    if settings is None:
        raise ModelError("the model has no [fatigue] table", source=source, item="fatigue",
                         fix="add [fatigue] and [[fatigue_detail]] tables")
    details = fatigue_details(read.document, settings, source)
    if not details:
        raise ModelError("the model has no fatigue details", source=source,
                         item="fatigue_detail", fix="add [[fatigue_detail]] tables")
    if direction not in DIRECTION_CHOICES:
        raise ModelError(f"unknown direction {direction!r}", item="direction",
                         fix="use " + ", ".join(DIRECTION_CHOICES))
    traffic = _traffic(settings, units, spectrum, vehicle, adtt, traffic_category,
                       traffic_type, source)
    analysis = analyse_model(read.model)
    lines = _lines(analysis, details, source)
    passages, directions = _passages(traffic.fleet, direction)
    by_line: dict[str, list[int]] = {}
    for index, line in enumerate(lines):
        by_line.setdefault(line.response.label, []).append(index)

    def work(members: list[int]) -> list[tuple[int, DetailFatigue]]:
        line = lines[members[0]]
        cycles = count_many(_joined([crossing_histories(line, traffic.fleet, way)
                                     for way in directions]))
        return [(i, _detail_result(details[i], line, settings, cycles, passages, analysis,
                                   traffic.fleet.count)) for i in members]

    threads = max(1, min(workers or os.cpu_count() or 1, len(by_line)))
    with ThreadPoolExecutor(threads) as pool:
        found = dict(pair for part in pool.map(work, by_line.values()) for pair in part)
    notes = list(traffic.notes)
    if any(r.table_cycles_per_passage is None for r in found.values()) and (
            settings.standard == "AASHTO"):
        notes.append("Table 6.6.1.2.5-2 could not be read for some details (no two supports "
                     "on the path around them): give cycles_per_passage to compare.")
    return FatigueResults(read.model.title, source, units, settings, traffic, direction,
                          COUNTED, tuple(found[i] for i in range(len(details))), tuple(notes))


def _traffic(settings: FatigueSettings, units: str, spectrum: str | Path | None,
             vehicle: str | None, adtt: float | None, traffic_category: str | None,
             traffic_type: str | None, source: str) -> Traffic:
    if (spectrum is None) == (vehicle is None):
        raise ModelError("give a spectrum file or a vehicle, one of them", source=source,
                         item="traffic", fix="give --spectrum FILE or --vehicle NAME")
    adtt_sl = settings.adtt_sl
    if adtt is not None:
        if not (np.isfinite(adtt) and adtt >= 0):
            raise ModelError(f"adtt {adtt} is not a number of trucks", item="adtt",
                             fix="give trucks a day, at least 0")
        if settings.lane_fraction is None:
            raise ModelError("adtt needs the lanes available to trucks", source=source,
                             item="fatigue.lanes",
                             fix="give lanes (AASHTO) or p in [fatigue] for the single-lane "
                                 "fraction")
        adtt_sl = settings.lane_fraction * adtt
    if spectrum is not None:
        trucks = read_spectrum(spectrum, units)
        traffic = spectrum_traffic(trucks, adtt_sl)
        if adtt is not None and trucks.frequency == "per_day":
            return Traffic(traffic.fleet, traffic.description,
                           ("the trucks a day given are not used: the spectrum gives its own "
                            "per_day column",))
        return traffic
    assert vehicle is not None
    models, converted = vehicles_for((vehicle,), units)
    traffic = vehicle_traffic(models[0], adtt_sl=adtt_sl, traffic_category=traffic_category,
                              traffic_type=traffic_type)
    return Traffic(traffic.fleet, traffic.description, (*converted, *traffic.notes))


def _lines(analysis: Analysis, details: Sequence[FatigueDetail],
           source: str) -> list[InfluenceLine]:
    """Each detail's influence line, one solve; a location off the structure names its
    detail."""
    responses = [Response(d.response, d.location) for d in details]
    try:
        return analysis.lines(responses)
    except InfluenceError:
        for detail, response in zip(details, responses, strict=True):
            try:
                analysis.line(response)
            except InfluenceError as error:
                raise ModelError(error.problem, source=source,
                                 item=f"fatigue_detail {detail.name!r}.location",
                                 fix=error.fix) from None
        raise


def _passages(fleet: Fleet, direction: str) -> tuple[np.ndarray, tuple[str, ...]]:
    """Passages a year of every history (forward ones first) and the directions run."""
    if direction == "both":
        half = 0.5 * fleet.passages_per_year
        return np.concatenate([half, half]), ("forward", "reverse")
    return fleet.passages_per_year, (direction,)


def _joined(parts: Sequence[Histories]) -> Histories:
    if len(parts) == 1:
        return parts[0]
    shift = np.cumsum([0] + [p.values.size for p in parts[:-1]])
    offsets = np.concatenate([parts[0].offsets] + [p.offsets[1:] + s for p, s in
                                                   zip(parts[1:], shift[1:], strict=True)])
    return Histories(np.concatenate([p.values for p in parts]), offsets)


def _detail_result(detail: FatigueDetail, line: InfluenceLine, settings: FatigueSettings,
                   cycles: CycleBatch, passages: np.ndarray, analysis: Analysis,
                   vehicles: int) -> DetailFatigue:
    resistance = detail_resistance(detail, settings)
    scale = detail.stress_per_effect
    args = (cycles, passages, resistance, settings.design_life_years, settings.age_years)
    counted = assess_counted(*args, stress_per_effect=scale)
    table = None
    basis = ""
    if detail.cycles_per_passage is not None:
        table, basis = detail.cycles_per_passage, "given in the model file"
    elif settings.standard == "AASHTO":
        read = table_cycles(analysis.model, analysis.path, line.section_chainage)
        if read is not None:
            table, basis = read
    by_table = None if table is None else assess_counted(*args, cycles_per_passage=table,
                                                         stress_per_effect=scale)
    life, method, other, other_method = counted, COUNTED, by_table, ""
    if by_table is not None:
        other_method = table_method(float(table or 0.0))
    if detail.cycles_per_passage is not None and by_table is not None:
        life, method, other, other_method = by_table, other_method, counted, COUNTED
    if settings.standard != "AASHTO" and detail.cycles_per_passage is None:
        other, other_method = None, ""
    used = np.where(cycles.counts > 0, cycles.ranges, 0.0)
    full = used.max(axis=1, initial=0.0)
    weights = passages / max(float(passages.sum()), 1e-300)
    slope = resistance.curve.slope
    with np.errstate(invalid="ignore", divide="ignore"):
        relative = np.where(full[:, None] > 0, used / full[:, None], 0.0)
    equivalent = float(weights @ (cycles.counts * relative**slope).sum(axis=1))
    largest = int(np.argmax(full) % vehicles) if full.size else 0
    return DetailFatigue(detail, line, life, method, fatigue_checks(life, resistance),
                         float(weights @ cycles.counts.sum(axis=1)), equivalent, table, basis,
                         other, other_method, largest)
