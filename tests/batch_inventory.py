"""A small invented inventory for the batch tests: three girders of the Fenn Valley (invented)
that compute, one whose model file is broken and one whose model file is missing; and a job kind
that kills its worker the first time it runs (importable, so that Dask's worker processes can
run it)."""

from __future__ import annotations

import os
from dataclasses import dataclass
from pathlib import Path

from influence.batch.envelope_kind import EnvelopeSettings, envelope_rows
from influence.batch.kinds import JobKind
from influence.batch.rows import ResultRow, Subject

GIRDERS = {
    # id: (spans [ft], EI [kip ft^2], supports)
    "FV-01": ((42.0,), 2.8e6, ("pinned", "roller")),
    "FV-02": ((36.0, 48.0), 3.6e6, ("pinned", "roller", "roller")),
    "FV-03": ((30.0, 40.0, 30.0), 3.1e6, ("pinned", "roller", "roller", "roller")),
}
BROKEN = "FV-04"
MISSING = "FV-05"
GOOD = tuple(GIRDERS)


def girder_text(spans: tuple[float, ...], EI: float, supports: tuple[str, ...]) -> str:
    quoted = ", ".join(f'"{s}"' for s in supports)
    return (f'title = "Fenn Valley girder"\nunits = "kip-ft"\n[beam]\n'
            f"spans = {list(spans)}\nEI = {EI}\nsupports = [{quoted}]\n"
            "[[loads]]\nname = \"deck\"\nload = \"DC\"\nuniform = 0.9\n"
            "[live_load]\ndistribution = 0.6\nvehicles = [\"HL-93\"]\n")


def write_inventory(folder: Path, ids: tuple[str, ...] = (*GIRDERS, BROKEN, MISSING)) -> Path:
    """Model files and an inventory (CSV) of the structures ``ids`` in ``folder``."""
    models = folder / "models"
    models.mkdir(parents=True, exist_ok=True)
    for identifier, (spans, EI, supports) in GIRDERS.items():
        (models / f"{identifier}.toml").write_text(girder_text(spans, EI, supports))
    # a support type that does not exist: the reader refuses it
    (models / f"{BROKEN}.toml").write_text(
        '[beam]\nspans = [30.0]\nEI = 1.0e6\nsupports = ["pinned", "rocker"]\n')
    rows = "\n".join(f"{i},models/{i}.toml,Fenn Way" for i in ids)
    path = folder / f"inventory-{len(ids)}.csv"
    path.write_text(f"id,model,route\n{rows}\n")
    return path


@dataclass(frozen=True)
class CrashOnce:
    """Settings of the crashing kind: the marker file that says the crash has happened."""

    marker: str
    envelope: EnvelopeSettings


def crash_once_rows(settings: CrashOnce, subject: Subject) -> list[ResultRow]:
    """Kill this worker process the first time (as a lost machine would), then compute the
    envelope rows."""
    marker = Path(settings.marker)
    if not marker.exists():
        marker.write_text(str(os.getpid()))
        os._exit(1)
    return envelope_rows(settings.envelope, subject)


def _no_settings(*_: object) -> None:
    return None


CRASH_ONCE = JobKind("crash once", _no_settings, crash_once_rows, ())
