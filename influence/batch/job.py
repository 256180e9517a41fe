"""The job of a batch run: what to run on each structure, with which vehicles and settings.

A job file (TOML)::

    title = "Legal loads, Harrow County"
    routes = "routes.toml"        # optional: a route file (relative to this job file)
    route = "Quarry haul"         # optional: run only this route's structures, in its order

    [[run]]                       # one vehicle group: one task per structure
    kind = "envelope"             # envelope, govern, rate, permit or fatigue
    name = "legal"                # optional (default: the kind); names the rows
    vehicles = ["Type 3", "Type 3S2", "Type 3-3"]   # default: the model file's vehicles
    adjust = { alpha = 1.21 }     # optional load-model adjustments
    responses = ["moment", "shear"]                 # ...and the kind's own settings

Vehicle files are paths relative to the job file. Every name, kind and setting is checked when
the job is read, before any cluster starts.

Example:
    >>> import pathlib, tempfile
    >>> path = pathlib.Path(tempfile.mkdtemp()) / "job.toml"
    >>> _ = path.write_text('[[run]]\\nkind = "govern"\\nvehicles = ["Type 3"]\\n'
    ...                     'at = ["moment@0.5 of span 1"]\\n')
    >>> job = read_job(path)
    >>> [(run.name, run.kind.name, run.vehicles) for run in job.runs]
    [('govern', 'govern', ('Type 3',))]
    >>> _ = path.write_text('[[run]]\\nkind = "rating"\\n')
    >>> try:
    ...     read_job(path)
    ... except BatchError as error:
    ...     print(error.problem)
    unknown job kind 'rating'
"""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path
from typing import Any

from influence.batch.fields import read_document, refused, table_list, vehicle_names
from influence.batch.kinds import JobKind, job_kind
from influence.batch.routes import Route, read_route_file
from influence.errors import BatchError, ModelError
from influence.model.fields import read_number

JOB_KEYS = ("title", "routes", "route", "run")
RUN_KEYS = ("kind", "name", "vehicles", "adjust")


@dataclass(frozen=True)
class Run:
    """One vehicle group of a job: a kind, its load models and its settings.

    Attributes:
        name: names the rows of this run.
        kind: the job kind.
        vehicles: library names or vehicle files (empty: each model file's own vehicles).
        adjust: load-model adjustments by name [-].
        settings: what the kind's reader made of the run table.
    """

    name: str
    kind: JobKind
    vehicles: tuple[str, ...] = ()
    adjust: tuple[tuple[str, float], ...] = ()
    settings: Any = None


@dataclass(frozen=True)
class Job:
    """What a batch runs.

    Attributes:
        runs: the vehicle groups, each one task per structure.
        title: what the results are called.
        routes: routes from the job's route file.
        route: run only this route's structures ("" for every structure).
        source: the job file.
    """

    runs: tuple[Run, ...]
    title: str = ""
    routes: tuple[Route, ...] = ()
    route: str = ""
    source: str = ""

    def __post_init__(self) -> None:
        names = [run.name for run in self.runs]
        for name in names:
            if names.count(name) > 1:
                raise BatchError(f"two runs are named {name!r}", source=self.source,
                                 fix="give each [[run]] its own name")


def read_job(path: str | Path) -> Job:
    """Read and check a job file.

    Raises:
        BatchError: for a missing file, an unknown kind (or one this installation lacks), an
            unknown vehicle, a bad setting or a route file in error.
    """
    path = Path(path)
    source = str(path)
    if not path.is_file():
        raise BatchError("job file not found", source=source, fix="check the path of the job")
    document = read_document(path, set(JOB_KEYS))
    folder = path.resolve().parent
    tables = table_list(document, "run", source,
                        'add a [[run]] table with kind = "envelope" or "govern" and vehicles')
    runs = tuple(_run(table, item, folder, source) for item, table in tables)
    routes: tuple[Route, ...] = ()
    if "routes" in document:
        routes = read_route_file(folder / _text(document["routes"], source, "routes"))
    route = _text(document.get("route", ""), source, "route")
    if route and routes and route not in {r.name for r in routes}:
        raise BatchError(f"route {route!r} is not in the route file", source=source,
                         item="route", fix="routes: " + ", ".join(r.name for r in routes))
    return Job(runs, _text(document.get("title", ""), source, "title"), routes, route, source)


def _run(table: dict[str, Any], item: str, folder: Path, source: str) -> Run:
    kind = job_kind(table.get("kind"), source, item)
    own = {key: value for key, value in table.items() if key not in RUN_KEYS}
    if kind.keys is not None:
        unknown = [key for key in own if key not in kind.keys]
        if unknown:
            raise BatchError(f"unknown key {unknown[0]!r}", source=source, item=item,
                             fix=f"keys of a {kind.name} run: "
                                 + ", ".join((*RUN_KEYS, *kind.keys)))
    vehicles = (vehicle_names(table["vehicles"], folder, source, item)
                if "vehicles" in table else ())
    adjust = table.get("adjust", {})
    if not isinstance(adjust, dict):
        raise BatchError(f"adjust = {adjust!r} is not a table", source=source,
                         item=f"{item}.adjust", fix="write it as adjust = { alpha = 1.21 }")
    try:
        adjustments = tuple(sorted((str(k), read_number(v, f"{item}.adjust.{k}", source))
                                   for k, v in adjust.items()))
    except ModelError as error:
        raise refused(error) from None
    name = _text(table.get("name", kind.name), source, f"{item}.name") or kind.name
    return Run(name, kind, vehicles, adjustments, kind.read(own, folder, source, item))


def _text(value: Any, source: str, item: str) -> str:
    if not isinstance(value, str):
        raise BatchError(f"{item} = {value!r} is not text", source=source, item=item,
                         fix=f'write it in quotes: {item} = "..."')
    return value.strip()
