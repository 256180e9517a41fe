"""The ``rate``, ``permit`` and ``fatigue`` job kinds: thin adapters over the assessment layers.

Each calls one library function on the structure's model file and turns its results into rows:

- ``rate`` (:func:`influence.rating.run.rate`): one row per rated section, response and sense
  (``response`` = "moment positive", ...), vehicle and level (``level`` = the rating level with
  its limit state); ``value`` is the rating factor [-], ``ratio`` 1 / rating factor, ``pass``
  where the factor is 1 or more; the governing placement of the vehicle. Sections without a
  capacity give an ``ok`` row with the reason in ``message`` (never silently skipped). Run keys:
  ``vehicles`` (default: each level's rating vehicles), ``levels``, ``adtt``.
- ``permit`` (:func:`influence.rating.permit_check.check_permit`): one row per rated section
  with the permit's lowest factor there; the vehicle is the run's one vehicle. Run keys:
  ``vehicles`` (exactly one), ``escorted``, ``crawl``, ``trips``, ``adtt``.
- ``fatigue`` (:func:`influence.fatigue.run.fatigue`): one row per fatigue detail (``section``
  = the detail's name); ``value`` is the damage over the detail's remaining design life [-]
  (``ratio`` the same), ``pass`` where it is 1 or less; no placement (a crossing counts every
  position). Run keys: ``vehicles`` (one fatigue load model) or ``spectrum`` (a spectrum file,
  relative to the job), ``adtt``, ``traffic_category``, ``traffic_type``, ``direction``.

Example:
    >>> ratio_of_rating(0.8), ratio_of_rating(0.0)
    (1.25, inf)
"""

from __future__ import annotations

import math
import os
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from influence.batch.fields import text_list
from influence.batch.rows import ResultRow, Subject, placed
from influence.errors import BatchError, ModelError
from influence.model.fields import read_number
from influence.rating.load_factors import ALLOWABLE_LEVELS, LRFR_LEVELS
from influence.rating.rating_vehicles import SHORT_LEVELS

RATE_KEYS = ("levels", "adtt")
PERMIT_KEYS = ("escorted", "crawl", "trips", "adtt")
FATIGUE_KEYS = ("spectrum", "adtt", "traffic_category", "traffic_type", "direction")


@dataclass(frozen=True)
class AssessmentSettings:
    """What a run table asks of an assessment kind (every key checked when the job is read).

    Attributes:
        levels: rating levels (rate; empty: the model file's).
        adtt: trucks a day in one direction, instead of the model file's.
        escorted, crawl, trips: the permit's crossing (permit).
        spectrum: a spectrum file, made absolute (fatigue).
        traffic_category, traffic_type, direction: the fatigue traffic (fatigue).
    """

    levels: tuple[str, ...] = ()
    adtt: float | None = None
    escorted: bool = False
    crawl: bool = False
    trips: str | None = None
    spectrum: str | None = None
    traffic_category: str | None = None
    traffic_type: str | None = None
    direction: str = "forward"


def ratio_of_rating(rating_factor: float) -> float:
    """Demand over capacity of a rating factor: 1 / RF (a factor of 0 or less: infinite)."""
    return 1.0 / rating_factor if rating_factor > 0 else math.inf


def _flag(table: dict[str, Any], key: str, source: str, item: str) -> bool:
    value = table.get(key, False)
    if not isinstance(value, bool):
        raise BatchError(f"{key} = {value!r} is not true or false", source=source,
                         item=f"{item}.{key}", fix=f"write {key} = true or {key} = false")
    return value


def _text(table: dict[str, Any], key: str, source: str, item: str) -> str | None:
    value = table.get(key)
    if value is not None and not isinstance(value, str):
        raise BatchError(f"{key} = {value!r} is not text", source=source, item=f"{item}.{key}",
                         fix=f'write it in quotes: {key} = "..."')
    return value


def read_assessment_settings(table: dict[str, Any], folder: Path, source: str,
                             item: str) -> AssessmentSettings:
    """The assessment keys of a run table, checked (the kind's own keys are checked by the job
    reader against RATE_KEYS, PERMIT_KEYS or FATIGUE_KEYS)."""
    adtt = None
    if "adtt" in table:
        try:
            adtt = read_number(table["adtt"], f"{item}.adtt", source)
        except ModelError as error:
            raise BatchError(error.problem, source=source, item=f"{item}.adtt",
                             fix=error.fix) from None
        if adtt < 0:
            raise BatchError(f"adtt = {adtt:g} is negative", source=source, item=f"{item}.adtt",
                             fix="give trucks a day, 0 or more")
    levels = text_list(table["levels"], source, f"{item}.levels") if "levels" in table else ()
    # each structure's method decides which of these it rates at; a name no method knows is a
    # mistake in the job, refused before any structure runs
    known = tuple(dict.fromkeys((*SHORT_LEVELS, *LRFR_LEVELS, *ALLOWABLE_LEVELS)))
    for level in levels:
        if level not in known:
            raise BatchError(f"level {level!r}", source=source, item=f"{item}.levels",
                             fix="use " + ", ".join(f'"{k}"' for k in known))
    spectrum = _text(table, "spectrum", source, item)
    if spectrum is not None:
        spectrum = os.path.abspath(folder / spectrum)
        if not Path(spectrum).is_file():
            raise BatchError("spectrum file not found", source=source, item=f"{item}.spectrum",
                             fix="give the path of the spectrum CSV, relative to the job file")
    trips = _text(table, "trips", source, item)
    if trips not in (None, "single", "multiple"):
        raise BatchError(f"trips = {trips!r}", source=source, item=f"{item}.trips",
                         fix='write trips = "single" or "multiple"')
    direction = _text(table, "direction", source, item) or "forward"
    if direction not in ("forward", "reverse", "both"):
        raise BatchError(f"direction = {direction!r}", source=source, item=f"{item}.direction",
                         fix='write "forward", "reverse" or "both"')
    return AssessmentSettings(levels, adtt, _flag(table, "escorted", source, item),
                              _flag(table, "crawl", source, item), trips, spectrum,
                              _text(table, "traffic_category", source, item),
                              _text(table, "traffic_type", source, item), direction)


def rate_rows(settings: AssessmentSettings, subject: Subject) -> list[ResultRow]:
    """Rating factors of the rating vehicles (see the module docstring)."""
    from influence.rating.run import rate

    ratings = rate(subject.model_file, vehicles=subject.vehicles, levels=settings.levels,
                   adtt=settings.adtt)
    rows = [_rating_row(r, r.vehicle, r.level) for r in ratings.ratings]
    rows += [ResultRow(section=n.section, chainage=n.chainage,
                       response=f"{n.response} {n.sense}", level=n.level, status="ok",
                       message=f"not rated: {n.reason}") for n in ratings.not_rated]
    return rows


def permit_rows(settings: AssessmentSettings, subject: Subject) -> list[ResultRow]:
    """The permit vehicle's lowest factor at every rated section (see the module docstring)."""
    from influence.rating.permit_check import check_permit

    if len(subject.vehicles) != 1:
        raise BatchError(f"a permit run names {len(subject.vehicles)} vehicles",
                         item="vehicles", fix="give the one permit vehicle: vehicles = [FILE]")
    check = check_permit(subject.model_file, subject.vehicles[0], escorted=settings.escorted,
                         crawl=settings.crawl, trips=settings.trips, adtt=settings.adtt)
    return [_rating_row(verdict.governing, check.vehicle, check.level)
            for verdict in check.sections]


def _rating_row(rating: Any, vehicle: str, level: str) -> ResultRow:
    factor = float(rating.rating_factor)
    ratio = ratio_of_rating(factor)
    limit = f" {rating.limit_state}" if rating.limit_state else ""
    return placed(ResultRow(
        section=rating.section, chainage=rating.chainage,
        response=f"{rating.response} {rating.sense}", vehicle=vehicle, level=level + limit,
        value=factor, unit="-", ratio=ratio, status="pass" if ratio <= 1.0 else "fail",
    ), rating.live.placement)


def fatigue_rows(settings: AssessmentSettings, subject: Subject) -> list[ResultRow]:
    """Fatigue damage over the remaining design life of every detail (see the module
    docstring)."""
    from influence.fatigue.run import fatigue

    if settings.spectrum is None and len(subject.vehicles) != 1:
        raise BatchError("a fatigue run needs one traffic", item="vehicles",
                         fix='give vehicles = ["HL-93 fatigue"] (one load model) or spectrum')
    results = fatigue(subject.model_file, spectrum=settings.spectrum,
                      vehicle=None if settings.spectrum else subject.vehicles[0],
                      adtt=settings.adtt, traffic_category=settings.traffic_category,
                      traffic_type=settings.traffic_type, direction=settings.direction)
    rows = []
    for detail in results.details:
        life = detail.life
        remaining = max(life.design_life_years - life.age_years, 0.0)
        damage = life.damage_per_year * remaining
        rows.append(ResultRow(
            section=detail.detail.name, response=f"{detail.detail.response} stress range",
            vehicle=results.traffic.description,
            level="fatigue", value=damage, unit="-", ratio=damage,
            status="pass" if damage <= 1.0 else "fail",
            message=f"life {life.life_years:.4g} years, design life {life.design_life_years:g}"))
    return rows


read_rate_settings = read_assessment_settings
read_permit_settings = read_assessment_settings
read_fatigue_settings = read_assessment_settings
