"""Responses and where they are taken: turning "moment at P1" into weights on the unknowns.

A response is a reaction component at a support, an internal force (axial, shear, moment) at a
member section, or a displacement or rotation at a node or section. Locations are written as
    12.5          a path chainage [length]
    P1            a node name (a support for reactions)
    C1@2.0        member C1, 2.0 [length] from its start node (sections off the path)

Signs (DESIGN.md): reactions positive along +x, +y and counter-clockwise; axial positive in
tension; moment positive sagging; shear positive when the transverse resultant on the start side of
the section acts along the member's +y' (upward for a member drawn left to right); deflection
positive downward; horizontal displacement positive along +x; rotation counter-clockwise.

Example:
    >>> Response("shear", "12", side="left").label
    'shear at 12 (left side)'
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

import numpy as np

from influence.analysis.solve import Structure
from influence.errors import LocationError, ModelError
from influence.model.locations import as_chainage
from influence.model.path import CHAINAGE_TOLERANCE, PathGeometry

RESPONSE_KINDS = ("reaction", "shear", "moment", "axial", "deflection", "rotation")
SIDES = ("left", "right")
COMPONENTS = {
    "reaction": ("vertical", "horizontal", "moment"),
    "deflection": ("vertical", "horizontal"),
}
_DIRECTION_OF = {"vertical": "uy", "horizontal": "ux", "moment": "rz"}


@dataclass(frozen=True)
class Response:
    """What to measure and where.

    Args:
        kind: one of :data:`RESPONSE_KINDS`.
        location: a chainage, a node name or MEMBER@DISTANCE (see the module docstring).
        side: at a chainage where two members meet (or a jump), which side: "left" or "right".
        component: for reactions "vertical" (default), "horizontal" or "moment"; for
            deflections "vertical" (default, positive down) or "horizontal" (positive along +x).
    """

    kind: str
    location: str
    side: str = "right"
    component: str = ""

    def __post_init__(self) -> None:
        if self.kind not in RESPONSE_KINDS:
            raise ModelError(f"unknown response {self.kind!r}", item="response",
                             fix="use one of " + ", ".join(RESPONSE_KINDS))
        if self.side not in SIDES:
            raise ModelError(f"unknown side {self.side!r}", item="side", fix="use left or right")
        allowed = COMPONENTS.get(self.kind, ())
        component = self.component or (allowed[0] if allowed else "")
        if component and component not in allowed:
            raise ModelError(
                f"component {component!r} does not apply to {self.kind}", item="component",
                fix=("use one of " + ", ".join(allowed)) if allowed else "leave it out",
            )
        object.__setattr__(self, "component", component)

    @property
    def label(self) -> str:
        name = self.kind if self.component in ("", "vertical") else f"{self.component} {self.kind}"
        if self.kind == "reaction" and self.component == "moment":
            name = "moment reaction"
        text = f"{name} at {self.location}"
        return f"{text} ({self.side} side)" if self.kind in ("shear", "axial") else text


@dataclass(frozen=True)
class Extraction:
    """A response resolved on a structure.

    ``weights`` h gives the response for equivalent nodal loads F as h . F; ``own_member`` with
    ``own_rules`` adds the part of a load inside the member that holds the section:
    own_rules[0] applies while the load lies between the member start and ``own_position``,
    own_rules[1] beyond it (polynomials in the member position, per unit load).
    """

    response: Response
    weights: np.ndarray
    own_member: str | None = None
    own_position: float = 0.0
    own_rules: tuple[np.ndarray, np.ndarray] | None = None
    section_chainage: float | None = None
    interior_support: bool = False


def resolve_many(structure: Structure, path: PathGeometry,
                 responses: tuple[Response, ...]) -> list[Extraction]:
    """Resolve many responses with one multi-column back-substitution."""
    parts = [_extraction_parts(structure, path, r) for r in responses]
    columns = np.column_stack([p[0] for p in parts]) if parts else np.zeros((0, 0))
    weights = structure.weights(columns) if parts else columns
    return [
        Extraction(response=r, weights=weights[:, i] + direct, **extra)
        for i, (r, (_, direct, extra)) in enumerate(zip(responses, parts, strict=True))
    ]


def _extraction_parts(structure: Structure, path: PathGeometry,
                      response: Response) -> tuple[np.ndarray, np.ndarray, dict[str, Any]]:
    """(extraction vector g, direct weights on restrained unknowns, extra Extraction fields)."""
    size = len(structure.unknowns)
    g = np.zeros(size)
    direct = np.zeros(size)
    model = structure.model
    if response.kind == "reaction":
        support = _node_for_support(structure, path, response)
        direction = _DIRECTION_OF[response.component]
        dof = structure.unknown(support, direction)
        restraint = model.node(support).support.restraint(direction)
        if dof is None or restraint == "free":
            raise LocationError(
                f"node {support} has no {response.component} restraint", source=model.source,
                item=response.location, fix="ask for a component that the support restrains",
            )
        if restraint == "fixed":
            g = structure.stiffness[:, dof].copy()
            direct[dof] = -1.0
        else:
            g[dof] = -float(restraint)
        chainage = path.node_chainage(support)
        ends = (0.0, path.total_length)
        interior = chainage is not None and all(
            abs(chainage - end) > CHAINAGE_TOLERANCE * max(path.total_length, 1.0) for end in ends
        )
        return g, direct, {"section_chainage": chainage, "interior_support": interior}

    if response.kind in ("deflection", "rotation") and not _is_section(response.location):
        node = _node_name(structure, path, response.location)
        if node is not None:
            direction = "rz" if response.kind == "rotation" else _DIRECTION_OF[response.component]
            dof = structure.unknown(node, direction)
            if dof is None:
                raise LocationError(
                    f"node {node} has no rotation (every member end there is released)",
                    source=model.source, item=response.location,
                    fix="ask for the rotation at a member section, MEMBER@DISTANCE",
                )
            g[dof] = -1.0 if (response.kind == "deflection" and direction == "uy") else 1.0
            return g, direct, {"section_chainage": path.node_chainage(node)}

    member, position, chainage = _section(structure, path, response)
    frame = structure.frames[member]
    axial, transverse = frame.unit_load_components
    cosine, sine = frame.cosine, frame.sine
    if response.kind in ("shear", "moment", "axial", "rotation"):
        rules = [(1.0, frame.law.field(response.kind, position, axial, transverse))]
    else:
        # global displacement from the local pair (u along x', v along y')
        weights = (cosine, -sine) if response.component == "horizontal" else (sine, cosine)
        sign = 1.0 if response.component == "horizontal" else -1.0
        rules = [
            (sign * w, frame.law.field(q, position, axial, transverse))
            for w, q in zip(weights, ("axial_displacement", "transverse_displacement"),
                            strict=True)
        ]
    local = sum(w * rule.by_displacement for w, rule in rules)
    behind = sum(w * rule.behind for w, rule in rules)
    ahead = sum(w * rule.ahead for w, rule in rules)
    member_g = frame.transform.T @ local
    for k, dof in enumerate(frame.dofs):
        if dof >= 0:
            g[dof] += member_g[k]
    on_path = any(leg.member == member for leg in path.legs)
    extra: dict[str, Any] = {"section_chainage": chainage}
    if on_path:
        # polynomials in a (prismatic member) or integral forms (member of varying section)
        own = (behind, ahead) if frame.varies else (np.asarray(behind), np.asarray(ahead))
        extra.update(own_member=member, own_position=position, own_rules=own)
    return g, direct, extra


def _is_section(location: str) -> bool:
    return "@" in location


def _as_chainage(location: str) -> float | None:
    return as_chainage(location)


def _node_name(structure: Structure, path: PathGeometry, location: str) -> str | None:
    """The node a location names, by name or by a chainage that falls on a node."""
    model = structure.model
    if location in model.node_index:
        return location
    chainage = _as_chainage(location)
    if chainage is None:
        raise _unknown_location(structure, location)
    tolerance = CHAINAGE_TOLERANCE * max(path.total_length, 1.0)
    for name, at in path.node_chainages.items():
        if abs(at - chainage) <= tolerance:
            return name
    return None


def _unknown_location(structure: Structure, location: str) -> LocationError:
    model = structure.model
    return LocationError(
        f"{location!r} is not a chainage, a node or MEMBER@DISTANCE", source=model.source,
        item="location", fix="names are: " + ", ".join(n.name for n in model.nodes[:12]),
    )


def _node_for_support(structure: Structure, path: PathGeometry, response: Response) -> str:
    model = structure.model
    node = None if _is_section(response.location) else _node_name(
        structure, path, response.location)
    if node is None or not model.node(node).support.is_support:
        supports = [n.name for n in model.nodes if n.support.is_support]
        raise LocationError(
            f"{response.location!r} is not a support", source=model.source,
            item=response.location, fix="supports are: " + ", ".join(supports),
        )
    return node


def _section(structure: Structure, path: PathGeometry,
             response: Response) -> tuple[str, float, float | None]:
    """(member, position from its start [length], path chainage or None) of a section."""
    model = structure.model
    location = response.location
    if _is_section(location):
        member, _, distance_text = location.partition("@")
        if member not in model.member_index:
            raise LocationError(
                f"member {member!r} is not defined", source=model.source, item=location,
                fix="write MEMBER@DISTANCE with a member from the file",
            )
        length = model.length_of(member)
        distance = _as_chainage(distance_text)
        if distance is None or distance < -CHAINAGE_TOLERANCE * length or (
                distance > length * (1 + CHAINAGE_TOLERANCE)):
            raise LocationError(
                f"{distance_text!r} is not on member {member} (length {length:g})",
                source=model.source, item=location,
                fix=f"give a distance from 0 to {length:g} from its start node",
            )
        distance = min(max(distance, 0.0), length)
        chainage = None
        for leg in path.legs:
            if leg.member == member:
                along = length - distance if leg.against_member else distance
                chainage = leg.start_chainage + along
        return member, distance, chainage
    chainage = _as_chainage(location)
    if chainage is None:
        if location in model.node_index:
            chainage = path.node_chainage(location)
            if chainage is None:
                raise LocationError(
                    f"node {location} is not on the travel path", source=model.source,
                    item=location, fix="give the section as MEMBER@DISTANCE",
                )
        else:
            raise _unknown_location(structure, location)
    try:
        leg_index, position = path.locate(chainage, response.side)
    except LocationError as error:
        raise LocationError(error.problem, source=model.source, item=location,
                            fix=error.fix) from None
    return path.legs[leg_index].member, position, chainage
