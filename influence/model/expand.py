"""A model file written out in the general form: every node and member the compact forms
generate, so the user can see and edit each one (``influence check --expand``).

The structure becomes ``[[nodes]]``, ``[[members]]`` and ``[path]`` with every number in the
file's unit system (quantities converted); every other table of the file (loads, combinations,
live load, sections, project, rating, fatigue) is carried over as it was written. Reading the
result gives the same structure.

Example:
    >>> from influence.model.reader import model_file_from_document
    >>> read = model_file_from_document({"beam": {"spans": [10.0, 12.0], "EI": 2.0e5,
    ...     "supports": ["pinned", "roller", "roller"]}, "sections": {"per_span": 4}})
    >>> text = general_form_toml(read)
    >>> "[[members]]" in text and 'name = "span2"' in text and "per_span = 4" in text
    True
"""

from __future__ import annotations

from typing import Any

import tomli_w

from influence.errors import ModelError
from influence.model.keys import STRUCTURE_KEYS
from influence.model.path import orient
from influence.model.reader import ModelFile
from influence.model.structure import BAR_EI, DIRECTIONS, Model, Support

_FLAGS = ("release_start", "release_end", "sliding_end", "deck")


def general_form_document(read: ModelFile) -> dict[str, Any]:
    """The model file as a TOML document in the general form."""
    model = read.model
    document: dict[str, Any] = {"title": model.title, "units": model.units}
    document["nodes"] = [_node(node.name, node.x, node.y, node.support) for node in model.nodes]
    document["members"] = [_member(model, name) for name in model.member_index]
    names = [leg.member for leg in model.path]
    if orient(model.members, tuple(names), read.source) != model.path:
        raise ModelError("the path walks a lone member against its direction",
                         source=read.source, item="path",
                         fix="write the general form by hand with path.start and path.end")
    document["path"] = {"members": names}
    for key, value in read.document.items():
        if key not in STRUCTURE_KEYS:
            document[key] = value
    return document


def general_form_toml(read: ModelFile) -> str:
    """The general-form model file as TOML text, with a heading comment."""
    heading = (f"# The general form of {read.source or 'a model'}, written by influence check "
               f"--expand:\n# every node and member of the structure; numbers in "
               f"{read.model.units}.\n")
    return heading + tomli_w.dumps(general_form_document(read))


def _node(name: str, x: float, y: float, support: Support) -> dict[str, Any]:
    entry: dict[str, Any] = {"name": name, "x": x, "y": y}
    if support.is_support:
        named = support.description
        entry["support"] = named if named in ("pinned", "roller", "fixed", "guided") else {
            direction: support.restraint(direction) for direction in DIRECTIONS}
    return entry


def _member(model: Model, name: str) -> dict[str, Any]:
    member = model.member(name)
    entry: dict[str, Any] = {"name": name, "start": member.start, "end": member.end}
    if member.is_bar and member.EI == BAR_EI and not (member.deck or member.sliding_end):
        return {**entry, "EA": member.EA, "bar": True}
    entry.update(EI=member.EI, EA=member.EA)
    for flag in _FLAGS:
        if getattr(member, flag):
            entry[flag] = True
    variation = member.variation
    if variation is not None:
        for key, haunch in (("haunch_start", variation.start), ("haunch_end", variation.end)):
            if haunch is not None:
                entry[key] = {"shape": haunch.shape, "depth_ratio": haunch.depth_ratio,
                              "length": haunch.span(model.length_of(name))}
        if variation.taper is not None:
            entry["taper"] = variation.taper
        entry["inertia_exponent"] = variation.inertia_exponent
        entry["area_exponent"] = variation.area_exponent
    return entry
