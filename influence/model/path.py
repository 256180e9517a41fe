"""The travel path: legs in order, their chainages, and routing between two nodes.

Chainage is measured along member axes from the start of the path's first leg. A leg walked
against its member (from the member's end node to its start node) maps chainage c to the member
position a = length - (c - leg start).

Example:
    >>> from influence.model.structure import Member, Model, Node, PathLeg, Support
    >>> nodes = (Node("A", 0, 0, Support.named("pinned")),
    ...          Node("B", 10, 0, Support.named("roller")),
    ...          Node("C", 25, 0, Support.named("roller")))
    >>> members = (Member("AB", "A", "B", 1.0, 1.0), Member("CB", "C", "B", 1.0, 1.0))
    >>> legs = (PathLeg("AB"), PathLeg("CB", True))
    >>> path = trace(Model("two spans", "kN-m", nodes, members, legs))
    >>> path.total_length, path.node_chainage("B"), path.locate(17.0)
    (25.0, 10.0, (1, 8.0))
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property

from influence.errors import LocationError, ModelError
from influence.model.structure import Member, Model, PathLeg

CHAINAGE_TOLERANCE = 1e-9
"""Relative tolerance [-] within which a chainage is taken to be at a node or a path end."""


@dataclass(frozen=True)
class Leg:
    """One member on the path with where it lies in chainage [length]."""

    member: str
    against_member: bool
    start_chainage: float
    length: float
    entry_node: str
    exit_node: str

    @property
    def end_chainage(self) -> float:
        return self.start_chainage + self.length

    def member_position(self, chainage: float) -> float:
        """Position along the member from its start node [length] of a path chainage."""
        along = chainage - self.start_chainage
        return self.length - along if self.against_member else along


@dataclass(frozen=True)
class PathGeometry:
    """The path's legs in order and the chainage along them."""

    legs: tuple[Leg, ...]

    @property
    def total_length(self) -> float:
        return self.legs[-1].end_chainage

    @cached_property
    def node_chainages(self) -> dict[str, float]:
        found = {self.legs[0].entry_node: 0.0}
        for leg in self.legs:
            found.setdefault(leg.exit_node, leg.end_chainage)
        return found

    def node_chainage(self, node: str) -> float | None:
        """Chainage of a node on the path [length], or None when the path does not pass it."""
        return self.node_chainages.get(node)

    @property
    def breakpoints(self) -> tuple[float, ...]:
        return (0.0, *(leg.end_chainage for leg in self.legs))

    def locate(self, chainage: float, side: str = "right") -> tuple[int, float]:
        """The leg index and member position [length] of a chainage.

        At a node between two legs, ``side`` picks the leg: "left" the one that ends there,
        "right" the one that starts there (at the path's ends the only leg is used).
        """
        total = self.total_length
        tolerance = CHAINAGE_TOLERANCE * max(total, 1.0)
        if chainage < -tolerance or chainage > total + tolerance:
            raise LocationError(
                f"chainage {chainage:g} is outside the path (0 to {total:g})",
                item="location", fix=f"give a chainage between 0 and {total:g}",
            )
        chainage = min(max(chainage, 0.0), total)
        for index, leg in enumerate(self.legs):
            at_end = abs(chainage - leg.end_chainage) <= tolerance
            last = index == len(self.legs) - 1
            if chainage < leg.end_chainage - tolerance or (at_end and (side == "left" or last)):
                position = leg.member_position(min(chainage, leg.end_chainage))
                return index, min(max(position, 0.0), leg.length)
        raise AssertionError("unreachable: chainage checked against the path length")


def trace(model: Model) -> PathGeometry:
    """Lay the model's path out in chainage, checking that it is one connected chain."""
    legs: list[Leg] = []
    chainage = 0.0
    previous_exit = None
    for number, path_leg in enumerate(model.path, start=1):
        if path_leg.member not in model.member_index:
            raise ModelError(
                f"path names unknown member {path_leg.member!r}", source=model.source,
                item=f"path item {number}", fix="list members defined in the file",
            )
        member = model.member(path_leg.member)
        entry, exit_ = (member.end, member.start) if path_leg.against_member else (
            member.start, member.end)
        if previous_exit is not None and entry != previous_exit:
            raise ModelError(
                f"path is not a connected chain: member {member.name} does not start at node "
                f"{previous_exit}", source=model.source, item=f"path item {number}",
                fix="list the path members in order, each sharing a node with the previous",
            )
        if any(leg.member == member.name for leg in legs):
            raise ModelError(
                f"the path travels member {member.name} twice", source=model.source,
                item=f"path item {number}", fix="list each path member once")
        if any(leg.entry_node == exit_ for leg in legs):
            raise ModelError(
                f"the path comes back to node {exit_}", source=model.source,
                item=f"path item {number}",
                fix="a travel path runs one way: it may not visit a node twice")
        length = model.length_of(member.name)
        legs.append(Leg(member.name, path_leg.against_member, chainage, length, entry, exit_))
        chainage += length
        previous_exit = exit_
    return PathGeometry(tuple(legs))


def orient(
    members: tuple[Member, ...], names: tuple[str, ...], source: str = ""
) -> tuple[PathLeg, ...]:
    """Legs for members listed in travel order, each walked away from the previous one.

    The first member is walked toward the node it shares with the second (start to end when it is
    alone). A member that shares no node with the one before it breaks the chain.
    """
    index = {member.name: member for member in members}
    for number, name in enumerate(names, start=1):
        if name not in index:
            raise ModelError(
                f"path names unknown member {name!r}", source=source,
                item=f"path item {number}", fix="list members defined in the file",
            )
    for number, name in enumerate(names, start=1):
        if name in names[:number - 1]:
            raise ModelError(f"the path lists member {name!r} twice", source=source,
                             item=f"path item {number}", fix="list each path member once")
    chosen = [index[name] for name in names]
    first = chosen[0]
    current = first.start
    if len(chosen) > 1 and first.start in (chosen[1].start, chosen[1].end):
        current = first.end
    legs = []
    for number, member in enumerate(chosen, start=1):
        if current not in (member.start, member.end):
            raise ModelError(
                f"path is not a connected chain: member {member.name} does not touch node "
                f"{current}", source=source, item=f"path item {number}",
                fix="list the path members in order, each sharing a node with the previous",
            )
        against = current == member.end
        legs.append(PathLeg(member.name, against_member=against))
        current = member.start if against else member.end
    return tuple(legs)


def route(
    members: tuple[Member, ...], start: str, end: str, source: str = ""
) -> tuple[PathLeg, ...]:
    """The path from node ``start`` to node ``end`` through deck members (shortest by length
    count of members), each leg oriented along the way travelled."""
    import networkx as nx  # only routing needs a graph library; loaded when a path is routed

    graph = nx.MultiGraph()
    for member in members:
        if member.deck:
            graph.add_edge(member.start, member.end, key=member.name)
    for node in (start, end):
        if node not in graph:
            raise ModelError(
                f"node {node!r} is not on any deck member", source=source, item="path",
                fix="mark the members the load travels on with deck = true",
            )
    try:
        nodes = nx.shortest_path(graph, start, end)
    except nx.NetworkXNoPath:
        raise ModelError(
            f"no chain of deck members joins {start} to {end}", source=source, item="path",
            fix="mark the missing members with deck = true or list the path members",
        ) from None
    legs = []
    for here, there in zip(nodes, nodes[1:], strict=False):
        names = sorted(graph.get_edge_data(here, there))
        if len(names) > 1:
            raise ModelError(
                f"deck members {', '.join(names)} both join {here} and {there}", source=source,
                item="path", fix="mark only one of them as deck, or list the path members",
            )
        member = next(m for m in members if m.name == names[0])
        legs.append(PathLeg(member.name, against_member=member.start != here))
    return tuple(legs)
