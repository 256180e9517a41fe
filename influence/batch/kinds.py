"""The job kinds: what a batch can run on each structure, each a settings reader and an adapter.

An adapter is a plain function over the library, ``adapter(settings, subject) -> rows``: it is
given one structure read and factorised once with the run's load models
(:class:`influence.batch.rows.Subject`) and returns its rows; the engine fills in the
structure, route, run and kind. A settings reader checks the run table's own keys when the job
is read, so a bad job fails before any cluster starts.

Example:
    >>> sorted(KINDS)
    ['envelope', 'fatigue', 'govern', 'permit', 'rate']
    >>> try:
    ...     job_kind("rating", "job.toml", "run[0]")
    ... except BatchError as error:
    ...     print(error.fix)
    kinds: envelope, govern, rate, permit, fatigue
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from influence.batch.assessment_kinds import (
    FATIGUE_KEYS,
    PERMIT_KEYS,
    RATE_KEYS,
    fatigue_rows,
    permit_rows,
    rate_rows,
    read_fatigue_settings,
    read_permit_settings,
    read_rate_settings,
)
from influence.batch.envelope_kind import ENVELOPE_KEYS, envelope_rows, read_envelope_settings
from influence.batch.govern_kind import GOVERN_KEYS, govern_rows, read_govern_settings
from influence.batch.rows import ResultRow, Subject
from influence.errors import BatchError

SettingsReader = Callable[[dict[str, Any], Path, str, str], Any]
"""(the run table's own keys, the job's folder, source, item) -> settings."""
Adapter = Callable[[Any, Subject], list[ResultRow]]
"""(settings, subject) -> rows."""


@dataclass(frozen=True)
class JobKind:
    """One kind of job.

    Attributes:
        name: what a run table's ``kind`` says.
        read: the settings reader.
        run: the adapter.
        keys: the run-table keys the reader takes (None: any key, passed to the library).
        loads_vehicles: the task loads the run's load models for the adapter (False: the
            library function chooses and loads its own, as rating and fatigue do).
    """

    name: str
    read: SettingsReader
    run: Adapter
    keys: tuple[str, ...] | None
    loads_vehicles: bool = True


KINDS: dict[str, JobKind] = {kind.name: kind for kind in (
    JobKind("envelope", read_envelope_settings, envelope_rows, ENVELOPE_KEYS),
    JobKind("govern", read_govern_settings, govern_rows, GOVERN_KEYS),
    JobKind("rate", read_rate_settings, rate_rows, RATE_KEYS, loads_vehicles=False),
    JobKind("permit", read_permit_settings, permit_rows, PERMIT_KEYS, loads_vehicles=False),
    JobKind("fatigue", read_fatigue_settings, fatigue_rows, FATIGUE_KEYS, loads_vehicles=False),
)}


def job_kind(name: Any, source: str, item: str) -> JobKind:
    """The job kind called ``name``."""
    if name not in KINDS:
        raise BatchError(f"unknown job kind {name!r}", source=source, item=f"{item}.kind",
                         fix="kinds: " + ", ".join(KINDS))
    return KINDS[name]
