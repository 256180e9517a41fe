"""The ``rate``, ``permit`` and ``fatigue`` job kinds: thin adapters over the assessment layers.

Each calls one library function, when the installation has it, as
``function(model_file, analysis, models, **settings)`` (the run table's own keys become the
keyword settings) and turns each item of its result into a row. An item offers ``section``,
``chainage``, ``response``, ``vehicle``, ``level``, ``value``, ``unit`` and ``placement`` (a
:class:`vehicles.search.placement.Placement` or None); a missing attribute leaves its column
empty.

- ``rate`` (:func:`influence.rating.run.rate`): one row per section, limit state (``response``),
  rating vehicle and rating level; ``value`` is the rating factor [-], ``ratio`` 1 / rating
  factor, ``pass`` where the factor is 1 or more; the placement of the vehicle that governs.
- ``permit`` (:func:`influence.rating.run.check_permit`): the same for the permit vehicle at the
  level "permit".
- ``fatigue`` (:func:`influence.fatigue.run.fatigue`): one row per detail (``section``), stress
  range or damage (``response``) and fatigue load model; ``value`` is the damage over the design
  life [-] (``ratio`` the same), ``pass`` where it is 1 or less; no placement (a crossing counts
  every position).

A job naming a kind that this installation lacks is refused when the job is read, with "not
available in this installation".

Example:
    >>> ratio_of_rating(0.8), ratio_of_damage(0.25)
    (1.25, 0.25)
    >>> ratio_of_rating(0.0)
    inf
"""

from __future__ import annotations

import importlib
import math
from collections.abc import Callable, Iterable
from functools import partial
from pathlib import Path
from typing import Any

from influence.batch.rows import ResultRow, Subject, placed
from influence.errors import BatchError

RATING_MODULE = "influence.rating.run"
FATIGUE_MODULE = "influence.fatigue.run"


def library_function(module: str, name: str) -> Callable[..., Iterable[Any]] | None:
    """The function ``name`` of ``module``, or None when this installation lacks it."""
    try:
        found = importlib.import_module(module)
    except ImportError:
        return None
    function = getattr(found, name, None)
    return function if callable(function) else None


def read_assessment_settings(kind: str, module: str, name: str, table: dict[str, Any],
                             folder: Path, source: str, item: str) -> tuple[tuple[str, Any], ...]:
    """Refuse the kind when its library function is missing; keep the run table's own keys as
    keyword settings (paths among them are the library's to resolve)."""
    del folder
    if library_function(module, name) is None:
        raise BatchError(f"job kind {kind!r} is not available in this installation",
                         source=source, item=item,
                         fix=f"it needs {module}.{name}; use envelope or govern")
    return tuple(sorted(table.items()))


def ratio_of_rating(rating_factor: float) -> float:
    """Demand over capacity of a rating factor: 1 / RF (a factor of 0 or less: infinite)."""
    return 1.0 / rating_factor if rating_factor > 0 else math.inf


def ratio_of_damage(damage: float) -> float:
    """A fatigue damage sum is already demand over capacity."""
    return damage


def assessed_rows(items: Iterable[Any], ratio_of: Callable[[float], float]) -> list[ResultRow]:
    """Rows from the items a library assessment returns (see the module docstring)."""
    rows = []
    for item in items:
        value = getattr(item, "value", None)
        ratio = ratio_of(value) if value is not None else None
        rows.append(placed(ResultRow(
            section=str(getattr(item, "section", "")), chainage=getattr(item, "chainage", None),
            response=str(getattr(item, "response", "")), vehicle=str(getattr(item, "vehicle", "")),
            level=str(getattr(item, "level", "")), value=value, unit=str(getattr(item, "unit", "")),
            ratio=ratio, status="ok" if ratio is None else ("pass" if ratio <= 1.0 else "fail"),
        ), getattr(item, "placement", None)))
    return rows


def _assessed(module: str, name: str, settings: tuple[tuple[str, Any], ...],
              subject: Subject) -> Iterable[Any]:
    function = library_function(module, name)
    if function is None:  # checked when the job was read; a remote worker may differ
        raise BatchError(f"{module}.{name} is not available on this worker",
                         fix="install the same version of influence-lines on every worker")
    return function(subject.model_file, subject.analysis, subject.models, **dict(settings))


def rate_rows(settings: tuple[tuple[str, Any], ...], subject: Subject) -> list[ResultRow]:
    """Rating factors of the rating vehicles (see the module docstring)."""
    return assessed_rows(_assessed(RATING_MODULE, "rate", settings, subject), ratio_of_rating)


def permit_rows(settings: tuple[tuple[str, Any], ...], subject: Subject) -> list[ResultRow]:
    """Rating factors of the permit vehicle (see the module docstring)."""
    return assessed_rows(_assessed(RATING_MODULE, "check_permit", settings, subject),
                         ratio_of_rating)


def fatigue_rows(settings: tuple[tuple[str, Any], ...], subject: Subject) -> list[ResultRow]:
    """Fatigue damage of the details (see the module docstring)."""
    return assessed_rows(_assessed(FATIGUE_MODULE, "fatigue", settings, subject),
                         ratio_of_damage)


read_rate_settings = partial(read_assessment_settings, "rate", RATING_MODULE, "rate")
read_permit_settings = partial(read_assessment_settings, "permit", RATING_MODULE,
                               "check_permit")
read_fatigue_settings = partial(read_assessment_settings, "fatigue", FATIGUE_MODULE, "fatigue")
