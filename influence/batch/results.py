"""The results of a batch: every row, a summary per structure and a verdict per route.

A structure's status is ``error`` if any of its rows is, else ``fail`` if any check fails, else
``pass`` if any check was made, else ``ok`` (computed, nothing checked). Its governing row is the
checked row of the largest ratio (demand over what is allowed).

A route passes only if every structure on it passes; it fails if any fails; its status is
``error`` when none fails but one could not be computed, and ``ok`` when nothing was checked. The
governing structure is the one of the largest governing ratio (for ``error``: the first structure
in error).

Example:
    >>> from influence.batch.inventory import Structure
    >>> from influence.batch.routes import Route
    >>> rows = (ResultRow("A", ratio=0.7, status="pass"), ResultRow("B", ratio=1.2, status="fail"))
    >>> structures = summaries((Structure("A", "a.toml"), Structure("B", "b.toml")), rows)
    >>> [(s.structure, s.status, s.governing_ratio) for s in structures]
    [('A', 'pass', 0.7), ('B', 'fail', 1.2)]
    >>> verdict = route_verdicts((Route("CR 4", ("B", "A")),), structures)[0]
    >>> verdict.status, verdict.governing_structure, verdict.structures
    ('fail', 'B', 'B > A')
    >>> route_verdicts((Route("CR 4", ("A",)),), structures)[0].status
    'pass'
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass, replace

from influence.batch.inventory import Structure
from influence.batch.routes import Route
from influence.batch.rows import ResultRow, route_text

ROUTE_ORDER = " > "
"""How a route's structures are written, in travel order."""


@dataclass(frozen=True)
class StructureSummary:
    """One structure's outcome.

    Attributes:
        structure, route, owner, location, model: from the inventory.
        status: "ok", "pass", "fail" or "error".
        rows: how many rows it has.
        governing_run, governing_section, governing_response, governing_vehicle,
            governing_level: where its largest ratio is.
        governing_value: the value there [governing_unit].
        governing_ratio: the largest ratio [-] (None: nothing checked).
        governing_unit: the unit of ``governing_value``.
        message: the first error message, if any.
    """

    structure: str
    route: str
    owner: str
    location: str
    model: str
    status: str
    rows: int
    governing_run: str = ""
    governing_section: str = ""
    governing_response: str = ""
    governing_vehicle: str = ""
    governing_level: str = ""
    governing_value: float | None = None
    governing_ratio: float | None = None
    governing_unit: str = ""
    message: str = ""


@dataclass(frozen=True)
class RouteVerdict:
    """A route's verdict.

    Attributes:
        route: its name.
        structures: its structures in travel order, joined by " > ".
        count: how many.
        status: "pass" only if every structure passes; "fail", "error" or "ok" otherwise.
        governing_structure: the structure that governs the verdict.
        governing_ratio: that structure's largest ratio [-].
        message: the governing structure's error message, if any.
    """

    route: str
    structures: str
    count: int
    status: str
    governing_structure: str = ""
    governing_ratio: float | None = None
    message: str = ""


@dataclass(frozen=True)
class BatchResults:
    """Everything a batch run found.

    Attributes:
        rows: every row, by structure in run order, then by run.
        structures: the summary of each structure.
        routes: the verdict of each route.
        title: the job's title.
        computed: tasks computed in this run.
        resumed: tasks whose finished parts were taken from an earlier run.
    """

    rows: tuple[ResultRow, ...]
    structures: tuple[StructureSummary, ...]
    routes: tuple[RouteVerdict, ...]
    title: str = ""
    computed: int = 0
    resumed: int = 0

    def of(self, identifier: str) -> list[ResultRow]:
        """The rows of one structure."""
        return [row for row in self.rows if row.structure == identifier]

    def count(self, status: str) -> int:
        """How many structures have this status."""
        return sum(1 for s in self.structures if s.status == status)


def summaries(structures: Sequence[Structure],
              rows: Sequence[ResultRow]) -> tuple[StructureSummary, ...]:
    """The summary of each structure from its rows."""
    by_structure: dict[str, list[ResultRow]] = {s.identifier: [] for s in structures}
    for row in rows:
        by_structure[row.structure].append(row)
    return tuple(_summary(s, by_structure[s.identifier]) for s in structures)


def _summary(structure: Structure, rows: list[ResultRow]) -> StructureSummary:
    statuses = {row.status for row in rows}
    status = next((s for s in ("error", "fail", "pass") if s in statuses), "ok")
    errors = [row.message for row in rows if row.status == "error"]
    summary = StructureSummary(structure.identifier, route_text(structure), structure.owner,
                               structure.location, structure.model_path, status, len(rows),
                               message=errors[0] if errors else "")
    checked = [row for row in rows if row.ratio is not None]
    if not checked:
        return summary
    worst = max(checked, key=lambda row: row.ratio or 0.0)
    return replace(summary, governing_run=worst.run, governing_section=worst.section,
                   governing_response=worst.response, governing_vehicle=worst.vehicle,
                   governing_level=worst.level, governing_value=worst.value,
                   governing_ratio=worst.ratio, governing_unit=worst.unit)


def route_verdicts(routes: Sequence[Route],
                   structures: Sequence[StructureSummary]) -> tuple[RouteVerdict, ...]:
    """The verdict of each route from its structures' summaries."""
    by_id = {s.structure: s for s in structures}
    return tuple(_verdict(route, [by_id[i] for i in route.structures if i in by_id])
                 for route in routes)


def _verdict(route: Route, members: list[StructureSummary]) -> RouteVerdict:
    statuses = [s.status for s in members]
    if "fail" in statuses:
        status = "fail"
    elif "error" in statuses:
        status = "error"
    elif statuses and all(s == "pass" for s in statuses):
        status = "pass"
    else:
        status = "ok"
    verdict = RouteVerdict(route.name, ROUTE_ORDER.join(route.structures), len(route.structures),
                           status)
    if status == "error":
        first = next(s for s in members if s.status == "error")
        return replace(verdict, governing_structure=first.structure, message=first.message)
    checked = [s for s in members if s.governing_ratio is not None]
    if not checked:
        return verdict
    worst = max(checked, key=lambda s: s.governing_ratio or 0.0)
    return replace(verdict, governing_structure=worst.structure,
                   governing_ratio=worst.governing_ratio)


def summary_lines(results: BatchResults) -> list[str]:
    """What a run found, in a few lines: the structures by status, each route's verdict.

    Example:
        >>> results = BatchResults((), (StructureSummary("A", "", "", "", "a.toml", "pass", 4),),
        ...                        (RouteVerdict("CR 4", "A", 1, "pass", "A", 0.75),), computed=1)
        >>> for line in summary_lines(results):
        ...     print(line)
        1 structure: 1 pass (1 task computed, 0 resumed)
        route CR 4: pass, governed by A (ratio 0.75)
    """
    count = len(results.structures)
    counts = ", ".join(f"{results.count(s)} {s}" for s in ("pass", "fail", "ok", "error")
                       if results.count(s))
    tasks = results.computed + results.resumed
    lines = [f"{count} structure{'s' * (count != 1)}: {counts or 'none'} "
             f"({results.computed} task{'s' * (tasks != 1)} computed, {results.resumed} resumed)"]
    for verdict in results.routes:
        line = f"route {verdict.route}: {verdict.status}"
        if verdict.governing_structure:
            line += f", governed by {verdict.governing_structure}"
            if verdict.status == "error":
                line += f" ({verdict.message})"
            elif verdict.governing_ratio is not None:
                line += f" (ratio {verdict.governing_ratio:.3g})"
        lines.append(line)
    return lines
