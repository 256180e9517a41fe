"""The rows of a batch result, and what a job kind is given to compute them.

One row holds one value of one structure: a section, a response, a vehicle and a level (the
sense "max" or "min" of an effect, or a rating level), with the governing placement and a
status:

- ``ok``: computed, with no check against an allowance;
- ``pass`` / ``fail``: checked; ``ratio`` is the demand over what is allowed, 1 or less passes;
- ``error``: the structure could not be computed; ``message`` says why in one line.

Example:
    >>> row = error_row(Structure("B-7", "/nowhere/b7.toml", ("CR 4",)), "legal", "envelope",
    ...                 "file not found")
    >>> row.status, row.route, row.value
    ('error', 'CR 4', None)
"""

from __future__ import annotations

from dataclasses import dataclass, replace

from influence.analysis.lines import Analysis
from influence.batch.inventory import ROUTE_SEPARATOR, Structure
from influence.model.reader import ModelFile
from vehicles.loadmodel import LoadModel
from vehicles.search.placement import Placement

STATUSES = ("ok", "pass", "fail", "error")


@dataclass(frozen=True)
class ResultRow:
    """One value of one structure.

    Attributes:
        structure: the structure's id.
        route: its routes, separated by "; ".
        run: the name of the job's run (vehicle group) that gave it.
        kind: the job kind ("envelope", "govern", ...).
        section: the section's label ("P1 left", "7.2").
        chainage: the section's chainage [length], None off the path.
        response: the response and component ("moment", "shear", "horizontal reaction").
        vehicle: the load model.
        case: the governing case of the load model.
        level: "max" or "min" for effects; the rating level for ratings.
        value: the effect [unit] or the rating factor [-]; None where the vehicle has no effect.
        unit: the unit of ``value``.
        reference: what ``value`` is checked against, in ``unit`` (None: no check).
        ratio: demand over what is allowed [-] (1 or less passes; None: no check).
        direction: "forward" or "reverse" travel of the governing placement.
        lead_position: chainage of the governing train's reference point [length].
        axle_positions: chainage of every axle of the governing placement [length].
        status: one of :data:`STATUSES`.
        message: why the status is ``error`` (else "" or a note).
        unit_system: the structure's unit system ("kN-m" or "kip-ft"): chainages and positions
            are in its length unit.
    """

    structure: str = ""
    route: str = ""
    run: str = ""
    kind: str = ""
    section: str = ""
    chainage: float | None = None
    response: str = ""
    vehicle: str = ""
    case: str = ""
    level: str = ""
    value: float | None = None
    unit: str = ""
    reference: float | None = None
    ratio: float | None = None
    direction: str = ""
    lead_position: float | None = None
    axle_positions: tuple[float, ...] = ()
    status: str = "ok"
    message: str = ""
    unit_system: str = ""


@dataclass(frozen=True)
class Subject:
    """One structure, read and factorised once, with the load models of one run: what a job
    kind's adapter is given.

    Attributes:
        structure: the inventory row.
        model_file: everything its model file says.
        analysis: the factorised model.
        models: the run's load models in the structure's units (none for the kinds that choose
            their own: rate, permit, fatigue).
        notes: remarks on those load models (unit conversions, adjustments).
        vehicles: the run's vehicles as the job names them (library names or vehicle files,
            resolved against the job's folder); empty when the job names none.
    """

    structure: Structure
    model_file: ModelFile
    analysis: Analysis
    models: tuple[LoadModel, ...]
    notes: tuple[str, ...] = ()
    vehicles: tuple[str, ...] = ()

    @property
    def units(self) -> str:
        return self.model_file.model.units


def route_text(structure: Structure) -> str:
    return f"{ROUTE_SEPARATOR} ".join(structure.routes)


def stamped(row: ResultRow, structure: Structure, run: str, kind: str,
            unit_system: str = "") -> ResultRow:
    """The row with the structure, its routes, the run, the kind and the unit system filled in
    (a job kind's adapter leaves them to the engine)."""
    return replace(row, structure=structure.identifier, route=route_text(structure), run=run,
                   kind=kind, unit_system=unit_system)


def error_row(structure: Structure, run: str, kind: str, message: str) -> ResultRow:
    """The row a structure gets when its model or its task fails."""
    return stamped(ResultRow(status="error", message=message), structure, run, kind)


def placed(row: ResultRow, placement: Placement | None) -> ResultRow:
    """The row with the governing placement's columns (unchanged when no case applies)."""
    if placement is None:
        return row
    return replace(row, case=placement.case, direction=placement.direction,
                   lead_position=placement.lead_position,
                   axle_positions=tuple(placement.axle_positions))
