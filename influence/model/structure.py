"""The structure as values: nodes, supports, members and the travel path.

Every model, whatever form its file used, is this general 2-D frame. Axes: x along the structure,
y up. Supports restrain each of ux, uy and rz as "fixed", "free" or with a spring stiffness
[force/length or force*length/rad]. Members are prismatic; a moment release at an end makes a hinge
there. The path is the ordered chain of members the unit load travels along, each walked from its
start node or from its end node; chainage is measured along member axes from the path's start.

Example:
    >>> Support.named("pinned")
    Support(ux='fixed', uy='fixed', rz='free')
    >>> Support(uy=5.0e4).is_elastic
    True
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from functools import cached_property

from influence.errors import ModelError
from influence.model.variation import SectionVariation
from vehicles.units import SYSTEMS

Restraint = str | float
"""'fixed', 'free', or a spring stiffness (positive number)."""

DIRECTIONS = ("ux", "uy", "rz")
DIRECTION_WORDS = {"ux": "horizontally", "uy": "vertically", "rz": "in rotation"}

_NAMED_SUPPORTS: dict[str, tuple[Restraint, Restraint, Restraint]] = {
    "pinned": ("fixed", "fixed", "free"),
    "roller": ("free", "fixed", "free"),
    "fixed": ("fixed", "fixed", "fixed"),
    "free": ("free", "free", "free"),
    "guided": ("fixed", "free", "fixed"),
}
SUPPORT_KINDS = tuple(_NAMED_SUPPORTS)

MIN_STIFFNESS = 1.0e-6
"""The smallest member or spring stiffness [force, force*length^2, force/length]: smaller values
are slips (a millionth of a kN-m^2 or kip-ft^2), and the deflections they give overflow."""

MAX_MEMBERS = 2000
"""The most members of a model: the stiffness is solved as a dense matrix, which for 2,000
members of three unknowns a node takes some 300 MB."""

MIN_LENGTH = 1.0e-6
"""The shortest member [length]: a micrometre or less in metres or feet is a typing slip, and
shorter members overflow the stiffness (it grows with 1 / length^3)."""

BAR_EI = 1.0
"""The bending stiffness a bar (released at both ends) gets when none is given [force*length^2]:
a bar carries no moment, so the value changes no response; 1.0 keeps the stiffness well scaled."""


def _check_restraint(value: Restraint, direction: str) -> Restraint:
    if isinstance(value, str):
        if value not in ("fixed", "free"):
            raise ModelError(
                f"restraint {value!r} is not known",
                item=direction,
                fix="use 'fixed', 'free' or a positive spring stiffness",
            )
        return value
    number = float(value)
    if not (math.isfinite(number) and number >= MIN_STIFFNESS):
        raise ModelError(
            f"spring stiffness {number:g} is not positive" if not number > 0 else
            f"spring stiffness {number:g} is too small to be a stiffness",
            item=direction,
            fix=f"give a stiffness of at least {MIN_STIFFNESS:g}, or 'free'",
        )
    return number


@dataclass(frozen=True)
class Support:
    """Restraint of a node in each direction: 'fixed', 'free' or a spring stiffness."""

    ux: Restraint = "free"
    uy: Restraint = "free"
    rz: Restraint = "free"

    def __post_init__(self) -> None:
        for direction in DIRECTIONS:
            object.__setattr__(
                self, direction, _check_restraint(getattr(self, direction), direction)
            )

    @classmethod
    def named(cls, kind: str) -> Support:
        """A support by its common name: pinned, roller, fixed, free or guided."""
        if kind not in _NAMED_SUPPORTS:
            raise ModelError(
                f"support kind {kind!r} is not known",
                item="support",
                fix="use one of " + ", ".join(SUPPORT_KINDS) + " or a table of springs",
            )
        return cls(*_NAMED_SUPPORTS[kind])

    def restraint(self, direction: str) -> Restraint:
        return getattr(self, direction)  # type: ignore[no-any-return]

    @property
    def is_elastic(self) -> bool:
        return any(isinstance(self.restraint(d), float) for d in DIRECTIONS)

    @property
    def is_support(self) -> bool:
        return any(self.restraint(d) != "free" for d in DIRECTIONS)

    @property
    def description(self) -> str:
        """A short name: the common one where it matches, otherwise the restraints listed."""
        for name, restraints in _NAMED_SUPPORTS.items():
            if (self.ux, self.uy, self.rz) == restraints:
                return name
        parts = []
        for direction in DIRECTIONS:
            value = self.restraint(direction)
            if value != "free":
                parts.append(f"{direction} {'fixed' if value == 'fixed' else f'spring {value:g}'}")
        return ", ".join(parts)


@dataclass(frozen=True)
class Node:
    """A named point [length] with its support (free by default)."""

    name: str
    x: float
    y: float
    support: Support = field(default_factory=Support)


@dataclass(frozen=True)
class Member:
    """A member between two named nodes: prismatic, or of varying section (haunched, tapered).

    Args:
        name: member name.
        start: start node name (local x' runs from start to end).
        end: end node name.
        EA: axial stiffness [force].
        EI: bending stiffness [force * length^2].
        release_start: moment release at the start.
        release_end: moment release at the end.
        sliding_end: the end node does not hold the member along its axis (an expansion bearing,
            as under one end of a stringer), so the member carries no axial force.
        deck: whether the travel path may use this member when routed between two nodes.
        variation: how the section varies along the member (None: prismatic); EA and EI are
            then those of its prismatic part (haunches) or of its start (a taper).
    """

    name: str
    start: str
    end: str
    EA: float
    EI: float
    release_start: bool = False
    release_end: bool = False
    sliding_end: bool = False
    deck: bool = False
    variation: SectionVariation | None = None

    def __post_init__(self) -> None:
        for label in ("EA", "EI"):
            value = getattr(self, label)
            if not (math.isfinite(value) and value > 0):
                raise ModelError(
                    f"{label} = {value:g} is not positive", item=f"member {self.name}",
                    fix=f"give a positive {label}",
                )
            if value < MIN_STIFFNESS:
                raise ModelError(
                    f"{label} = {value:g} is too small to be a stiffness",
                    item=f"member {self.name}", fix=f"give {label} of at least {MIN_STIFFNESS:g}")
        if self.start == self.end:
            raise ModelError("starts and ends at the same node", item=f"member {self.name}",
                             fix="join two different nodes")

    @property
    def varies(self) -> bool:
        """Whether the section varies along the member."""
        return self.variation is not None and not self.variation.is_prismatic

    @property
    def is_bar(self) -> bool:
        """Released at both ends: carries axial force only (a truss bar or a link)."""
        return self.release_start and self.release_end


@dataclass(frozen=True)
class PathLeg:
    """One member of the travel path and the way it is walked."""

    member: str
    against_member: bool = False  # walked from the member's end node to its start node


@dataclass(frozen=True)
class Model:
    """A structure and its travel path.

    Args:
        title: a line for headers.
        units: "kN-m" or "kip-ft".
        nodes: the nodes.
        members: the members.
        path: the ordered members the unit load travels along.
        source: the file the model came from ("" when built in Python).
        hinge_nodes: names of nodes that stand for internal hinges of a beam-form girder.
        form: "beam" or "general": the form the model was written in.
    """

    title: str
    units: str
    nodes: tuple[Node, ...]
    members: tuple[Member, ...]
    path: tuple[PathLeg, ...]
    source: str = ""
    hinge_nodes: tuple[str, ...] = ()
    form: str = "general"

    def __post_init__(self) -> None:
        if not isinstance(self.units, str) or self.units not in SYSTEMS:
            raise ModelError(f"units {self.units!r} are not known", source=self.source,
                             item="units",
                             fix="use " + " or ".join(f'"{name}"' for name in SYSTEMS))
        for name in ("nodes", "members", "path", "hinge_nodes"):
            object.__setattr__(self, name, tuple(getattr(self, name)))
        if len(self.members) > MAX_MEMBERS or len(self.nodes) > MAX_MEMBERS + 1:
            raise ModelError(f"{len(self.members)} members and {len(self.nodes)} nodes are more "
                             "than this tool solves", source=self.source, item="members",
                             fix=f"give at most {MAX_MEMBERS} members")
        _check_names(self)
        _check_unique(self.nodes, "node", self.source)
        _check_unique(self.members, "member", self.source)
        nodes = self.node_index
        for member in self.members:
            for end in (member.start, member.end):
                if end not in nodes:
                    raise ModelError(
                        f"member {member.name} names unknown node {end!r}", source=self.source,
                        item=f"member {member.name}", fix="define the node or correct the name",
                    )
            length = self.length_of(member.name)
            if not length >= MIN_LENGTH:
                raise ModelError(
                    f"member {member.name} has length {length:g}, less than {MIN_LENGTH:g}",
                    source=self.source, item=f"member {member.name}",
                    fix="give its nodes different coordinates",
                )
        if not self.path:
            raise ModelError("the travel path is empty", source=self.source, item="path",
                             fix="list the members the load travels along")

    @cached_property
    def node_index(self) -> dict[str, Node]:
        return {node.name: node for node in self.nodes}

    @cached_property
    def member_index(self) -> dict[str, Member]:
        return {member.name: member for member in self.members}

    def node(self, name: str) -> Node:
        return self.node_index[name]

    def member(self, name: str) -> Member:
        return self.member_index[name]

    def length_of(self, member_name: str) -> float:
        member = self.member(member_name)
        a, b = self.node(member.start), self.node(member.end)
        return math.hypot(b.x - a.x, b.y - a.y)

    def direction_of(self, member_name: str) -> tuple[float, float]:
        """Direction cosines (cos, sin) of the member's local x' axis."""
        member = self.member(member_name)
        a, b = self.node(member.start), self.node(member.end)
        length = self.length_of(member_name)
        return (b.x - a.x) / length, (b.y - a.y) / length


NAME_FORBIDDEN = "@:,\"'"
"""Characters a name may not hold: ``@`` writes MEMBER@DISTANCE, ``:`` a side, ``,`` a list."""

MAX_NAME = 64
"""The longest name [characters]."""


def name_problem(name: object, node: bool = False) -> tuple[str, str] | None:
    """What is wrong with a node or member name, and the fix; None when it is a good name.

    A name is text of 1 to :data:`MAX_NAME` printable characters without spaces at its ends and
    without ``@ : , "``; a node name may not read as a number, since a location that reads as
    a number is a chainage (the README's rule for locations).

    Example:
        >>> name_problem("P1", node=True) is None, name_problem("20", node=True)[0]
        (True, "node name '20' reads as a chainage")
    """
    if not isinstance(name, str):
        return f"name {name!r} is not text", f'write it in quotes, such as "{name}"'
    if not name.strip() or name != name.strip() or len(name) > MAX_NAME or not name.isprintable():
        return (f"name {name!r} is empty, too long or has spaces at its ends",
                f"give a name of 1 to {MAX_NAME} printable characters")
    bad = sorted(set(name) & set(NAME_FORBIDDEN))
    if bad:
        return (f"name {name!r} holds {' '.join(bad)}",
                "leave out @ (it writes MEMBER@DISTANCE), : , and quotes")
    if node:
        try:
            float(name)
        except ValueError:
            return None
        return (f"node name {name!r} reads as a chainage",
                "start a node name with a letter, such as P20")
    return None


def _check_names(model: Model) -> None:
    for items, node in ((model.nodes, True), (model.members, False)):
        for item in items:
            problem = name_problem(item.name, node)
            if problem is not None:
                what = "node" if node else "member"
                raise ModelError(problem[0], source=model.source, item=f"{what} {item.name}",
                                 fix=problem[1])


def _check_unique(items: tuple[Node, ...] | tuple[Member, ...], what: str, source: str) -> None:
    seen: set[str] = set()
    for item in items:
        if item.name in seen:
            raise ModelError(f"{what} name {item.name!r} is used twice", source=source,
                             item=f"{what} {item.name}", fix=f"give each {what} its own name")
        seen.add(item.name)
