"""The structure in a model file: the compact beam form or the general form of nodes and members.

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

Every problem raises :class:`~influence.errors.ModelError` naming the file, the item and the fix.
"""

from __future__ import annotations

from pathlib import Path
from typing import Any

from influence.errors import ModelError
from influence.model.beamform import continuous_beam
from influence.model.fields import check_keys, listed, read_number, required, table
from influence.model.path import orient, route
from influence.model.structure import Member, Model, Node, PathLeg, Support

BEAM_KEYS = {"spans", "EI", "EA", "supports", "names", "hinges"}
NODE_KEYS = {"name", "x", "y", "support"}
MEMBER_KEYS = {"name", "start", "end", "EI", "EA", "E", "I", "A", "release_start",
               "release_end", "sliding_end", "bar", "deck"}
PATH_KEYS = {"members", "start", "end"}
SPRING_WORDS = {"horizontal": "ux", "vertical": "uy", "rotational": "rz"}


def model_from_document(document: dict[str, Any], source: str = "") -> Model:
    """Build a model from parsed TOML (either form); the top-level keys are checked by
    :func:`influence.model.reader.read_model_file`."""
    title = str(document.get("title", Path(source).stem if source else "untitled"))
    units = document.get("units", "kN-m")
    has_beam = "beam" in document
    has_general = "nodes" in document or "members" in document
    if has_beam == has_general:
        raise ModelError(
            "the file must describe either a [beam] or [[nodes]] and [[members]]",
            source=source, item="top level",
            fix="keep one form: a [beam] table, or node and member lists with a [path]",
        )
    if has_beam:
        return _beam(document["beam"], title, units, source)
    return _general(document, title, units, source)


def _beam(table: dict[str, Any], title: str, units: str, source: str) -> Model:
    check_keys(table, BEAM_KEYS, "beam", source)
    for key in ("spans", "EI", "supports"):
        if key not in table:
            raise ModelError(f"missing key {key!r}", source=source, item="beam",
                             fix=f"add beam.{key}")
    spans = [read_number(v, "beam.spans", source)
             for v in listed(table["spans"], "beam.spans", source)]
    stiffness = table["EI"]
    if not isinstance(stiffness, list):
        stiffness = read_number(stiffness, "beam.EI", source)
    supports = [
        _support(entry, f"beam.supports[{i + 1}]", source, words=SPRING_WORDS)
        for i, entry in enumerate(listed(table["supports"], "beam.supports", source))
    ]
    hinges = [read_number(v, "beam.hinges", source)
              for v in listed(table.get("hinges", []), "beam.hinges", source)]
    names = table.get("names")
    if names is not None:
        names = [str(n) for n in listed(names, "beam.names", source)]
        if len(set(names)) != len(names):
            raise ModelError("a support name is used twice", source=source, item="beam.names",
                             fix="give each support its own name")
    EA = read_number(table["EA"], "beam.EA", source) if "EA" in table else None
    return continuous_beam(spans, stiffness, supports, names=names, hinges=hinges, EA=EA,
                           title=title, units=units, source=source)


def _general(document: dict[str, Any], title: str, units: str, source: str) -> Model:
    nodes = []
    for number, entry in enumerate(listed(document.get("nodes", []), "nodes", source), start=1):
        item = f"nodes[{number}]"
        entry = table(entry, item, source)
        check_keys(entry, NODE_KEYS, item, source)
        name = required(entry, "name", item, source)
        support = _support(entry.get("support", "free"), f"node {name}", source,
                           words={"ux": "ux", "uy": "uy", "rz": "rz"})
        x = read_number(required(entry, "x", item, source), item, source)
        y = read_number(required(entry, "y", item, source), item, source)
        nodes.append(Node(str(name), x, y, support))
    members = []
    for number, entry in enumerate(listed(document.get("members", []), "members", source), 1):
        item = f"members[{number}]"
        entry = table(entry, item, source)
        check_keys(entry, MEMBER_KEYS, item, source)
        name = str(required(entry, "name", item, source))
        item = f"member {name}"
        bar = bool(entry.get("bar", False))
        members.append(Member(
            name, str(required(entry, "start", item, source)),
            str(required(entry, "end", item, source)),
            EA=_stiffness(entry, "EA", "A", item, source),
            EI=_stiffness(entry, "EI", "I", item, source, default=None if not bar else 1.0),
            release_start=bar or bool(entry.get("release_start", False)),
            release_end=bar or bool(entry.get("release_end", False)),
            sliding_end=bool(entry.get("sliding_end", False)),
            deck=bool(entry.get("deck", False)),
        ))
    if not nodes or not members:
        raise ModelError("a general model needs nodes and members", source=source,
                         item="top level", fix="add [[nodes]] and [[members]] entries")
    path_table = table(document.get("path"), "path", source)
    check_keys(path_table, PATH_KEYS, "path", source)
    legs: tuple[PathLeg, ...]
    if "members" in path_table:
        names = tuple(str(n) for n in listed(path_table["members"], "path.members", source))
        if not names:
            raise ModelError("path.members is empty", source=source, item="path",
                             fix="list the members the load travels along")
        legs = orient(tuple(members), names, source)
    elif "start" in path_table and "end" in path_table:
        legs = route(tuple(members), str(path_table["start"]), str(path_table["end"]), source)
    else:
        raise ModelError("the path is not given", source=source, item="path",
                         fix="give path.members, or path.start and path.end nodes")
    return Model(title=title, units=units, nodes=tuple(nodes), members=tuple(members),
                 path=legs, source=source, form="general")


def _stiffness(entry: dict[str, Any], product: str, section: str, item: str, source: str,
               default: float | None = None) -> float:
    if product in entry:
        return read_number(entry[product], f"{item}.{product}", source)
    if "E" in entry and section in entry:
        modulus = read_number(entry["E"], f"{item}.E", source)
        return modulus * read_number(entry[section], f"{item}.{section}", source)
    if default is not None:
        return default
    raise ModelError(f"no {product} given", source=source, item=item,
                     fix=f"give {product}, or E and {section}")


def _support(entry: Any, item: str, source: str, words: dict[str, str]) -> Support:
    if isinstance(entry, str):
        try:
            return Support.named(entry)
        except ModelError as error:
            raise ModelError(error.problem, source=source, item=item, fix=error.fix) from None
    if isinstance(entry, dict):
        allowed = set(words) | {"kind"}
        check_keys(entry, allowed, item, source)
        base = Support.named(str(entry.get("kind", "free")))
        values: dict[str, Any] = {"ux": base.ux, "uy": base.uy, "rz": base.rz}
        for word, direction in words.items():
            if word in entry:
                value = entry[word]
                values[direction] = value if isinstance(value, str) else read_number(
                    value, f"{item}.{word}", source)
        try:
            return Support(**values)
        except ModelError as error:
            raise ModelError(error.problem, source=source, item=item, fix=error.fix) from None
    raise ModelError(f"support {entry!r} is neither a kind nor a table of springs",
                     source=source, item=item,
                     fix='write "pinned", "roller", "fixed", "free" or {vertical = 1.0e5}')


