"""Locations in a model file checked against the structure when it is read.

A location is read by one rule (the README's): text holding ``@`` is MEMBER@DISTANCE (a member of
the model and a distance from its start node, 0 to its length); otherwise the name of a node;
otherwise a number, a chainage on the travel path. Node names never read as numbers and no name
holds ``@`` (:func:`influence.model.structure.name_problem`), so no location means two things.

Example:
    >>> from influence.model.beamform import continuous_beam
    >>> from influence.model.path import trace
    >>> model = continuous_beam([10.0], 1.0, ["pinned", "roller"])
    >>> check_location(model, trace(model), "S2", "sections.extra[1]")
    >>> try:
    ...     check_location(model, trace(model), "12.5", "sections.extra[1]")
    ... except ModelError as error:
    ...     print(error.problem)
    chainage 12.5 is off the path (0 to 10)
"""

from __future__ import annotations

import math
from typing import Any

from influence.errors import ModelError
from influence.model.path import CHAINAGE_TOLERANCE, PathGeometry
from influence.model.structure import Model


def check_location(model: Model, path: PathGeometry, text: Any, item: str,
                   source: str = "") -> None:
    """Refuse a location that does not name a place on the structure."""
    source = source or model.source
    if not isinstance(text, str):
        raise ModelError(f"expected a location as text, got {text!r}", source=source, item=item,
                         fix='write it in quotes: a chainage "12.5", a node "P1" or "C1@2.0"')
    if "@" in text:
        member, _, distance_text = text.partition("@")
        if member not in model.member_index:
            raise ModelError(f"no member named {member!r}", source=source, item=item,
                             fix="write MEMBER@DISTANCE with a member of the model")
        length = model.length_of(member)
        distance = as_chainage(distance_text)
        slack = CHAINAGE_TOLERANCE * length
        if distance is None or not -slack <= distance <= length + slack:
            raise ModelError(f"{distance_text!r} is not a distance on member {member} "
                             f"(0 to {length:g})", source=source, item=item,
                             fix=f"give a distance from 0 to {length:g} from its start node")
        return
    if text in model.node_index:
        return
    chainage = as_chainage(text)
    if chainage is None:
        raise ModelError(f"{text!r} is not a chainage, a node or MEMBER@DISTANCE", source=source,
                         item=item, fix="nodes are: " + ", ".join(
                             n.name for n in model.nodes[:12]))
    check_chainage(path, chainage, item, source)


def check_chainage(path: PathGeometry, chainage: float, item: str, source: str,
                   what: str = "chainage") -> None:
    """Refuse a chainage [length] off the travel path (0 to its length)."""
    total = path.total_length
    slack = CHAINAGE_TOLERANCE * max(total, 1.0)
    if not -slack <= chainage <= total + slack:
        raise ModelError(f"{what} {chainage:g} is off the path (0 to {total:g})",
                         source=source, item=item,
                         fix=f"give a chainage from 0 to {total:g}")


def as_chainage(text: str) -> float | None:
    """The finite number a location text reads as, or None (then it is a name)."""
    try:
        value = float(text)
    except ValueError:
        return None
    return value if math.isfinite(value) else None
