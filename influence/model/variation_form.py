"""Haunches and tapers in a model file: the keys that give a member a varying section.

General form, on a member::

    [[members]]
    name = "P1-left"
    start = "A1"
    end = "P1"
    EI = 4.0e6                      # of the prismatic part (of the start, for a taper)
    haunch_end = { shape = "parabolic", length = "6 m", depth_ratio = 1.0 }
    # or haunch_start = {...}; length_fraction = 0.2 for a length as a fraction of the member;
    # inertia_ratio = 8.0 for I at the member end over I of the prismatic part, instead of
    # depth_ratio; taper = 1.5 (depth at the end over depth at the start) instead of haunches
    inertia_exponent = 3.0          # I proportional to depth^n (3: a rectangle)

Beam form::

    [beam]
    ...
    inertia_exponent = 3.0
    [[beam.haunches]]
    span = 2                        # 1 for the first span
    at = "both"                     # start, end or both ends of the span
    shape = "parabolic"             # or straight
    length = "8 m"                  # or length_fraction
    depth_ratio = 1.0               # or inertia_ratio

Every problem is a one-line ModelError naming the file, the key and the fix.

Example:
    >>> read_haunch({"shape": "straight", "length": "10 ft", "inertia_ratio": 8.0},
    ...             "members[1].haunch_end", "f.toml", "kip-ft", 3.0)
    Haunch(shape='straight', depth_ratio=1.0, length_fraction=None, length=10.0)
"""

from __future__ import annotations

from collections.abc import Callable
from typing import Any

from influence.errors import ModelError
from influence.model.fields import check_keys, read_integer, read_number, read_quantity, read_text
from influence.model.keys import BEAM_HAUNCH_KEYS, HAUNCH_KEYS, MEMBER_VARIATION_KEYS
from influence.model.structure import Member, Model
from influence.model.variation import HAUNCH_SHAPES, Haunch, SectionVariation

ENDS = ("start", "end", "both")


def read_haunch(entry: Any, item: str, source: str, units: str,
                inertia_exponent: float) -> Haunch:
    """One haunch table."""
    if not isinstance(entry, dict):
        raise ModelError(f"{item} = {entry!r} is not a table", source=source, item=item,
                         fix='write it as { shape = "parabolic", length = ..., '
                             'depth_ratio = ... }')
    check_keys(entry, HAUNCH_KEYS | (BEAM_HAUNCH_KEYS - HAUNCH_KEYS if "span" in entry
                                     else frozenset()), item, source)
    shape = read_text(entry.get("shape", ""), f"{item}.shape", source)
    if shape not in HAUNCH_SHAPES:
        raise ModelError(f"shape {shape!r}", source=source, item=f"{item}.shape",
                         fix="use " + " or ".join(f'"{s}"' for s in HAUNCH_SHAPES))
    if ("depth_ratio" in entry) == ("inertia_ratio" in entry):
        raise ModelError("give depth_ratio or inertia_ratio, one of them", source=source,
                         item=item, fix="depth_ratio = r (end depth hc (1 + r)), or "
                                        "inertia_ratio = I at the end / I of the middle")
    if "depth_ratio" in entry:
        depth_ratio = read_number(entry["depth_ratio"], f"{item}.depth_ratio", source)
    else:
        ratio = read_number(entry["inertia_ratio"], f"{item}.inertia_ratio", source)
        if ratio < 1.0 or inertia_exponent <= 0:
            raise ModelError(f"inertia_ratio = {ratio:g}", source=source,
                             item=f"{item}.inertia_ratio",
                             fix="give I at the end over I of the prismatic part, 1 or more, "
                                 "with a positive inertia_exponent")
        depth_ratio = ratio ** (1.0 / inertia_exponent) - 1.0
    length = (read_quantity(entry["length"], "length", f"{item}.length", source, units)
              if "length" in entry else None)
    fraction = (read_number(entry["length_fraction"], f"{item}.length_fraction", source)
                if "length_fraction" in entry else None)
    try:
        return Haunch(shape, depth_ratio, fraction, length)
    except ModelError as error:
        raise ModelError(error.problem, source=source, item=f"{item}.{error.item}",
                         fix=error.fix) from None


def _exponent(table: dict[str, Any], key: str, item: str, source: str, default: float) -> float:
    if key not in table:
        return default
    value = read_number(table[key], f"{item}.{key}", source)
    if not value > 0:
        raise ModelError(f"{key} = {value:g}", source=source, item=f"{item}.{key}",
                         fix="give a positive exponent (3 for a rectangle of constant width)")
    return value


def member_variation(entry: dict[str, Any], item: str, source: str,
                     units: str) -> SectionVariation | None:
    """The varying section of a general-form member (None: prismatic)."""
    if not any(key in entry for key in MEMBER_VARIATION_KEYS):
        return None
    n = _exponent(entry, "inertia_exponent", item, source, 3.0)
    m = _exponent(entry, "area_exponent", item, source, 1.0)
    start = (read_haunch(entry["haunch_start"], f"{item}.haunch_start", source, units, n)
             if "haunch_start" in entry else None)
    end = (read_haunch(entry["haunch_end"], f"{item}.haunch_end", source, units, n)
           if "haunch_end" in entry else None)
    taper = read_number(entry["taper"], f"{item}.taper", source) if "taper" in entry else None
    try:
        return SectionVariation(start, end, taper, n, m)
    except ModelError as error:
        raise ModelError(error.problem, source=source, item=item, fix=error.fix) from None


def beam_variations(table: dict[str, Any], spans: int, source: str,
                    units: str) -> dict[int, SectionVariation]:
    """The haunched spans of a [beam] table, by span number (1 for the first)."""
    entries = table.get("haunches", [])
    if not isinstance(entries, list) or not all(isinstance(e, dict) for e in entries):
        raise ModelError("beam.haunches must be a list of tables", source=source,
                         item="beam.haunches", fix="write each as [[beam.haunches]]")
    n = _exponent(table, "inertia_exponent", "beam", source, 3.0)
    found: dict[int, dict[str, Haunch]] = {}
    for number, entry in enumerate(entries, start=1):
        item = f"beam.haunches[{number}]"
        check_keys(entry, BEAM_HAUNCH_KEYS, item, source)
        if "span" not in entry:
            raise ModelError("no span given", source=source, item=item,
                             fix="add span = N (1 for the first span)")
        span = read_integer(entry["span"], f"{item}.span", source)
        if span > spans:
            raise ModelError(f"span {span} of {spans}", source=source, item=f"{item}.span",
                             fix=f"give a span from 1 to {spans}")
        at = read_text(entry.get("at", "both"), f"{item}.at", source)
        if at not in ENDS:
            raise ModelError(f"at = {at!r}", source=source, item=f"{item}.at",
                             fix="use " + ", ".join(f'"{e}"' for e in ENDS))
        haunch = read_haunch({k: v for k, v in entry.items() if k not in ("span", "at")}, item,
                             source, units, n)
        ends = found.setdefault(span, {})
        for end in (("start", "end") if at == "both" else (at,)):
            if end in ends:
                raise ModelError(f"the {end} of span {span} is haunched twice", source=source,
                                 item=item, fix="give each end of a span one haunch")
            ends[end] = haunch
    return {span: SectionVariation(ends.get("start"), ends.get("end"), None, n)
            for span, ends in found.items()}


def check_fit(model: Model, source: str, item_of: Callable[[Member], str]) -> Model:
    """Every haunch checked against its member's length once the geometry is known (haunch
    lengths that overrun the member, or a length and a fraction that disagree), the error naming
    the file and ``item_of(member)``."""
    for member in model.members:
        if member.variation is None:
            continue
        try:
            member.variation.haunch_lengths(model.length_of(member.name))
        except ModelError as error:
            raise ModelError(error.problem, source=source, item=item_of(member),
                             fix=error.fix) from None
    return model
