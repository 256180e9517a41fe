"""The structure in a model file: the compact beam form, the compact truss form
(:mod:`influence.model.trussform`) or the general form of nodes and members.

Beam form::

    title = "Three-span overpass"
    units = "kN-m"
    [beam]
    spans = [24.0, 32.0, 24.0]
    EI = [4.0e6, 6.4e6, 4.0e6]        # one value, one per span, or per span [[from, to, EI], ...]
    supports = ["pinned", "roller", {vertical = 2.0e5}, "roller"]
    names = ["A1", "P1", "P2", "A2"]  # optional
    hinges = [40.0]                   # optional

General form::

    [[nodes]]
    name = "A"
    x = 0.0
    y = 0.0
    support = "pinned"                # or {ux = "fixed", uy = 1.0e5, rz = "free"}
    [[members]]
    name = "deck1"
    start = "A"
    end = "B"
    EI = 2.0e6                        # or E and I
    EA = 8.0e6                        # or E and A
    release_start = false             # moment release (hinge) at an end
    release_end = false
    sliding_end = false               # true: an expansion bearing at the end (no axial force)
    bar = false                       # true: released at both ends (a truss bar)
    deck = true                       # the path may route along it
    [path]
    members = ["deck1", "deck2"]      # or start = "A" and end = "E" through deck members

Lengths, stiffnesses and springs take a plain number in the file's units or a quantity such as
``"110 ft"`` or ``"29000 ksi"`` (:mod:`vehicles.quantities`); flags are TOML booleans and names
quoted text (:mod:`influence.model.fields`). Every problem raises
:class:`~influence.errors.ModelError` naming the file, the item and the fix.

Example:
    >>> model = model_from_document({"units": "kip-ft", "beam": {
    ...     "spans": ["40 ft", "12.192 m"], "EI": "4.176e7 kip*in^2",
    ...     "supports": ["pinned", "roller", "roller"]}})
    >>> [round(model.length_of(m.name), 9) for m in model.members]
    [40.0, 40.0]
    >>> round(model.members[0].EI, 6)   # kip-ft^2
    290000.0
"""

from __future__ import annotations

from pathlib import Path
from typing import Any

from influence.errors import ModelError
from influence.model.beamform import continuous_beam
from influence.model.fields import (
    check_keys,
    listed,
    read_flag,
    read_name,
    read_quantity,
    read_text,
    read_texts,
    required,
    table,
    tables,
)
from influence.model.keys import BEAM_KEYS, MEMBER_KEYS, NODE_KEYS, PATH_KEYS
from influence.model.path import orient, route
from influence.model.structure import (
    BAR_EI,
    MAX_MEMBERS,
    Member,
    Model,
    Node,
    PathLeg,
    Support,
)
from influence.model.trussform import truss_from_table
from influence.model.variation_form import beam_variations, check_fit, member_variation
from vehicles.units import SYSTEMS

SPRING_WORDS = {"horizontal": "ux", "vertical": "uy", "rotational": "rz"}


def model_from_document(document: dict[str, Any], source: str = "") -> Model:
    """Build a model from parsed TOML (any form); the top-level keys are checked by
    :func:`influence.model.reader.read_model_file`."""
    default_title = Path(source).stem if source else "untitled"
    title = read_text(document.get("title", default_title), "title", source)
    units = model_units(document, source)
    forms = [form for form, present in (
        ("[beam]", "beam" in document), ("[truss]", "truss" in document),
        ("[[nodes]] and [[members]]", "nodes" in document or "members" in document))
        if present]
    if len(forms) != 1:
        raise ModelError(
            "the file must describe one structure: " + (" and ".join(forms) or "none found"),
            source=source, item="top level",
            fix="keep one form: a [beam] table, a [truss] table, or node and member lists "
                "with a [path]",
        )
    if "beam" in document:
        return _beam(table(document["beam"], "beam", source), title, units, source)
    if "truss" in document:
        if "path" in document:
            raise ModelError("a [truss] makes its own path", source=source, item="path",
                             fix="remove [path]: the load travels along the deck stringers")
        return truss_from_table(table(document["truss"], "truss", source), title, units,
                                source)
    return _general(document, title, units, source)


def model_units(document: dict[str, Any], source: str) -> str:
    """The file's unit system, checked first: every quantity is converted to it."""
    units = document.get("units", "kN-m")
    if not isinstance(units, str) or units not in SYSTEMS:
        raise ModelError(f"units {units!r} are not known", source=source, item="units",
                         fix="use " + " or ".join(f'"{name}"' for name in SYSTEMS))
    return units


def _beam(table: dict[str, Any], title: str, units: str, source: str) -> Model:
    check_keys(table, BEAM_KEYS, "beam", source)
    for key in ("spans", "EI", "supports"):
        if key not in table:
            raise ModelError(f"missing key {key!r}", source=source, item="beam",
                             fix=f"add beam.{key}")
    spans = [read_quantity(v, "spans", f"beam.spans[{i}]", source, units)
             for i, v in enumerate(_capped(table["spans"], "beam.spans", source), start=1)]
    stiffness = _beam_stiffness(table["EI"], units, source)
    supports = [
        _support(entry, f"beam.supports[{i + 1}]", source, SPRING_WORDS, units)
        for i, entry in enumerate(listed(table["supports"], "beam.supports", source))
    ]
    hinges = [read_quantity(v, "hinges", f"beam.hinges[{i}]", source, units)
              for i, v in enumerate(listed(table.get("hinges", []), "beam.hinges", source), 1)]
    names = table.get("names")
    if names is not None:
        names = [read_name(n, f"beam.names[{i}]", source, node=True)
                 for i, n in enumerate(listed(names, "beam.names", source), start=1)]
        if len(set(names)) != len(names):
            raise ModelError("a support name is used twice", source=source, item="beam.names",
                             fix="give each support its own name")
    EA = read_quantity(table["EA"], "EA", "beam.EA", source, units) if "EA" in table else None
    variations = beam_variations(table, len(spans), source, units)
    model = continuous_beam(spans, stiffness, supports, names=names, hinges=hinges, EA=EA,
                            variations=variations, title=title, units=units, source=source)
    return check_fit(model, source, lambda member: f"beam.haunches on {member.name}")


def _beam_stiffness(value: Any, units: str, source: str) -> Any:
    """beam.EI: one value, one per span, or per span a list of [from, to, EI] ranges."""
    item = "beam.EI"
    if not isinstance(value, list):
        return read_quantity(value, "EI", item, source, units)
    per_span: list[Any] = []
    for number, entry in enumerate(value, start=1):
        where = f"{item}[{number}]"
        if not isinstance(entry, list):
            per_span.append(read_quantity(entry, "EI", where, source, units))
            continue
        ranges = []
        for count, stretch in enumerate(entry, start=1):
            here = f"{where}[{count}]"
            if not isinstance(stretch, list) or len(stretch) != 3:
                raise ModelError(f"EI range {stretch!r} is not [from, to, EI]", source=source,
                                 item=here, fix="write each range as [from, to, EI]")
            ranges.append([read_quantity(stretch[0], "from", here, source, units),
                           read_quantity(stretch[1], "to", here, source, units),
                           read_quantity(stretch[2], "EI", here, source, units)])
        per_span.append(ranges)
    return per_span


def _capped(value: Any, item: str, source: str) -> list[Any]:
    entries = listed(value, item, source)
    if len(entries) > MAX_MEMBERS:
        raise ModelError(f"{len(entries)} entries are more than this tool solves",
                         source=source, item=item, fix=f"give at most {MAX_MEMBERS}")
    return entries


def _general(document: dict[str, Any], title: str, units: str, source: str) -> Model:
    nodes = []
    node_entries = tables(document, "nodes", source)
    member_entries = tables(document, "members", source)
    if max(len(node_entries), len(member_entries)) > MAX_MEMBERS:
        raise ModelError(f"{len(member_entries)} members and {len(node_entries)} nodes are more "
                         "than this tool solves", source=source, item="members",
                         fix=f"give at most {MAX_MEMBERS} of each")
    for number, entry in enumerate(node_entries, start=1):
        item = f"nodes[{number}]"
        check_keys(entry, NODE_KEYS, item, source)
        name = read_name(required(entry, "name", item, source), f"{item}.name", source,
                         node=True)
        item = f"node {name}"
        support = _support(entry.get("support", "free"), f"{item}.support", source,
                           {"ux": "ux", "uy": "uy", "rz": "rz"}, units)
        x = read_quantity(required(entry, "x", item, source), "x", f"{item}.x", source, units)
        y = read_quantity(required(entry, "y", item, source), "y", f"{item}.y", source, units)
        nodes.append(Node(name, x, y, support))
    members = []
    for number, entry in enumerate(member_entries, start=1):
        item = f"members[{number}]"
        check_keys(entry, MEMBER_KEYS, item, source)
        name = read_name(required(entry, "name", item, source), f"{item}.name", source)
        item = f"member {name}"
        flags = {key: read_flag(entry.get(key, False), f"{item}.{key}", source)
                 for key in ("bar", "release_start", "release_end", "sliding_end", "deck")}
        bar = flags["bar"]
        try:
            members.append(Member(
                name, read_name(required(entry, "start", item, source), f"{item}.start", source),
                read_name(required(entry, "end", item, source), f"{item}.end", source),
                EA=_stiffness(entry, "EA", "A", item, source, units),
                EI=_stiffness(entry, "EI", "I", item, source, units,
                              default=None if not bar else BAR_EI),
                release_start=bar or flags["release_start"],
                release_end=bar or flags["release_end"],
                sliding_end=flags["sliding_end"], deck=flags["deck"],
                variation=member_variation(entry, item, source, units),
            ))
        except ModelError as error:
            raise ModelError(error.problem, source=source, item=error.item or item,
                             fix=error.fix) from None
    if not nodes or not members:
        raise ModelError("a general model needs nodes and members", source=source,
                         item="top level", fix="add [[nodes]] and [[members]] entries")
    path_table = table(document.get("path"), "path", source)
    check_keys(path_table, PATH_KEYS, "path", source)
    legs: tuple[PathLeg, ...]
    if "members" in path_table:
        names = read_texts(path_table["members"], "path.members", source)
        if not names:
            raise ModelError("path.members is empty", source=source, item="path",
                             fix="list the members the load travels along")
        legs = orient(tuple(members), names, source)
    elif "start" in path_table and "end" in path_table:
        legs = route(tuple(members), read_text(path_table["start"], "path.start", source),
                     read_text(path_table["end"], "path.end", source), source)
    else:
        raise ModelError("the path is not given", source=source, item="path",
                         fix="give path.members, or path.start and path.end nodes")
    model = Model(title=title, units=units, nodes=tuple(nodes), members=tuple(members),
                  path=legs, source=source, form="general")
    return check_fit(model, source, lambda member: f"member {member.name}")


def _stiffness(entry: dict[str, Any], product: str, section: str, item: str, source: str,
               units: str, default: float | None = None) -> float:
    if product in entry:
        return read_quantity(entry[product], product, f"{item}.{product}", source, units)
    if "E" in entry and section in entry:
        modulus = read_quantity(entry["E"], "E", f"{item}.E", source, units)
        return modulus * read_quantity(entry[section], section, f"{item}.{section}", source,
                                       units)
    if default is not None:
        return default
    raise ModelError(f"no {product} given", source=source, item=item,
                     fix=f"give {product}, or E and {section}")


def _support(entry: Any, item: str, source: str, words: dict[str, str], units: str) -> Support:
    if isinstance(entry, str):
        try:
            return Support.named(entry)
        except ModelError as error:
            raise ModelError(error.problem, source=source, item=item, fix=error.fix) from None
    if isinstance(entry, dict):
        allowed = set(words) | {"kind"}
        check_keys(entry, allowed, item, source)
        kind = read_text(entry.get("kind", "free"), f"{item}.kind", source)
        try:
            base = Support.named(kind)
        except ModelError as error:
            raise ModelError(error.problem, source=source, item=f"{item}.kind",
                             fix=error.fix) from None
        values: dict[str, Any] = {"ux": base.ux, "uy": base.uy, "rz": base.rz}
        for word, direction in words.items():
            if word in entry:
                value = entry[word]
                values[direction] = value if value in ("fixed", "free") else read_quantity(
                    value, word, f"{item}.{word}", source, units)
        try:
            return Support(**values)
        except ModelError as error:
            raise ModelError(error.problem, source=source, item=item, fix=error.fix) from None
    raise ModelError(f"support {entry!r} is neither a kind nor a table of springs",
                     source=source, item=item,
                     fix='write "pinned", "roller", "fixed", "free" or {vertical = 1.0e5}')
