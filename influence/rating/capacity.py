"""The ``[[capacity]]`` entries of a model file, their checks, and the capacity of a section.

::

    [[capacity]]
    name = "span 1 sagging"        # optional label for the report
    response = "moment"            # moment | shear | axial
    sense = "positive"             # positive | negative (signs as in the README)
    from = 0.0                     # where: a chainage range [length], or
    to = 24.0
    # members = ["span1"]          #   path members, or
    # sections = ["P1", "12.0"]    #   section labels or chainages
    nominal = 5400.0               # Rn, signed like the sense [force or force x length]
    resistance_factor = 1.0        # phi
    service = 3900.0               # optional: f_R as the effect at the allowable stress
    allowable = { inventory = 2900.0, operating = 3950.0 }   # ASR: effects at allowable stress

A negative sense takes negative capacities (a hogging capacity of -4000 kip-ft). Capacities for
the same response and sense may not overlap: ranges may touch at an end, and a section on a
shared end takes the weaker capacity (adverse). A section label or a member names its place
more closely than a range, so it wins. A section that no entry covers has no capacity and is
reported "not rated", never silently skipped.

Example:
    >>> entries = capacities({"capacity": [
    ...     {"response": "moment", "sense": "positive", "from": 0.0, "to": 24.0,
    ...      "nominal": 5400.0, "resistance_factor": 1.0},
    ...     {"response": "moment", "sense": "negative", "sections": ["P1"], "nominal": -4000.0,
    ...      "resistance_factor": 0.9}]}, "LRFR")
    >>> capacity_at(entries, "moment", "positive", chainage=12.0).nominal
    5400.0
    >>> capacity_at(entries, "moment", "negative", label="P1").factored
    -3600.0
    >>> capacity_at(entries, "shear", "positive", chainage=12.0) is None     # not rated
    True
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any

from influence.errors import ModelError
from influence.rating.load_factors import METHODS
from influence.rating.reading import check_keys, choice, fraction, names, number, table
from influence.rating.result import SENSES

CAPACITY_RESPONSES = ("moment", "shear", "axial")
TOLERANCE = 1e-9
"""Relative tolerance on chainages (ends that touch, sections given by chainage)."""


@dataclass(frozen=True)
class Capacity:
    """The resistance of a stretch of the structure for one response and sense.

    Attributes:
        response: "moment", "shear" or "axial".
        sense: "positive" or "negative".
        nominal: Rn, signed like the sense [force or force x length]; None for ASR entries
            that give allowable effects only.
        resistance_factor: phi [-].
        service: f_R as an effect, signed like the sense, or None.
        allowable: ASR effects at the allowable stress, (("inventory", value), ...).
        start, end: chainage range [length], or None.
        members: path members covered.
        sections: section labels or chainages covered.
        name: label for the report.
    """

    response: str
    sense: str
    nominal: float | None
    resistance_factor: float = 1.0
    service: float | None = None
    allowable: tuple[tuple[str, float], ...] = ()
    start: float | None = None
    end: float | None = None
    members: tuple[str, ...] = ()
    sections: tuple[str, ...] = ()
    name: str = ""

    def __post_init__(self) -> None:
        if self.response not in CAPACITY_RESPONSES or self.sense not in SENSES:
            raise ModelError(f"capacity for {self.response!r}, {self.sense!r}", item=self.label,
                             fix="response: moment, shear or axial; sense: positive or negative")
        sign = 1.0 if self.sense == "positive" else -1.0
        values = [("nominal", self.nominal), ("service", self.service),
                  *((f"allowable.{level}", value) for level, value in self.allowable)]
        for key, value in values:
            if value is not None and not sign * value > 0.0:
                raise ModelError(
                    f"{key} = {value:g} has the wrong sign for the {self.sense} sense",
                    item=self.label,
                    fix="positive sense: capacities greater than 0; negative sense: less than 0")
        places = sum((self.start is not None or self.end is not None, bool(self.members),
                      bool(self.sections)))
        if places != 1:
            raise ModelError("say where the capacity applies, in one way", item=self.label,
                             fix="give from and to, or members, or sections")
        if (self.start is None) != (self.end is None) or (
                self.start is not None and self.end is not None and not self.end > self.start):
            raise ModelError(f"range from {self.start} to {self.end}", item=self.label,
                             fix="give both from and to, with to greater than from")

    @property
    def label(self) -> str:
        """How errors and the report name this entry."""
        if self.name:
            return f"capacity {self.name!r}"
        return f"capacity ({self.response}, {self.sense})"

    @property
    def factored(self) -> float | None:
        """phi Rn, signed like the sense [as nominal]."""
        return None if self.nominal is None else self.resistance_factor * self.nominal

    def allowable_at(self, level: str) -> float | None:
        """The ASR allowable effect at "inventory" or "operating", or None."""
        return dict(self.allowable).get(level)


def _capacity(entry: Any, number_in_file: int, method: str, source: str) -> Capacity:
    item = f"capacity[{number_in_file}]"
    entry = table(entry, item, source)
    check_keys(entry, "[[capacity]]", source, item)
    for key in ("response", "sense"):
        if key not in entry:
            raise ModelError(f"missing key {key!r}", source=source, item=item, fix=f"add {key}")
    needed = "allowable" if method == "ASR" else "nominal"
    if needed not in entry:
        raise ModelError(f"missing key {needed!r}, needed for {method}", source=source,
                         item=item, fix=f"add {needed}")
    allowable = table(entry.get("allowable", {}), f"{item}.allowable", source)
    check_keys(allowable, "capacity.allowable", source, f"{item}.allowable")

    def optional(key: str) -> float | None:
        return None if key not in entry else number(entry[key], f"{item}.{key}", source)

    try:
        return Capacity(
            response=choice(entry["response"], CAPACITY_RESPONSES, f"{item}.response", source),
            sense=choice(entry["sense"], SENSES, f"{item}.sense", source),
            nominal=optional("nominal"),
            resistance_factor=fraction(entry.get("resistance_factor", 1.0),
                                       f"{item}.resistance_factor", source),
            service=optional("service"),
            allowable=tuple((level, number(value, f"{item}.allowable.{level}", source))
                            for level, value in allowable.items()),
            start=optional("from"), end=optional("to"),
            members=() if "members" not in entry else names(entry["members"],
                                                            f"{item}.members", source),
            sections=() if "sections" not in entry else tuple(
                str(s) for s in names(entry["sections"], f"{item}.sections", source)),
            name=str(entry.get("name", "")),
        )
    except ModelError as error:
        if error.source:
            raise
        raise ModelError(error.problem, source=source, item=item, fix=error.fix) from None


def _touching_only(a: tuple[float, float], b: tuple[float, float]) -> bool:
    scale = max(1.0, *(abs(v) for v in (*a, *b)))
    return min(a[1], b[1]) - max(a[0], b[0]) <= TOLERANCE * scale


def _check_overlaps(entries: tuple[Capacity, ...],
                    spans: Mapping[int, tuple[tuple[float, float], ...]], source: str) -> None:
    for i, first in enumerate(entries):
        for j in range(i + 1, len(entries)):
            second = entries[j]
            if (first.response, first.sense) != (second.response, second.sense):
                continue
            shared = (set(first.members) & set(second.members)) | (
                set(first.sections) & set(second.sections))
            clash = next((f"{a[0]:g} to {a[1]:g} and {b[0]:g} to {b[1]:g}"
                          for a in spans.get(i, ()) for b in spans.get(j, ())
                          if not _touching_only(a, b)), None)
            if shared or clash:
                where = ", ".join(sorted(shared)) if shared else f"chainages {clash}"
                raise ModelError(
                    f"{first.label} and {second.label} overlap at {where}", source=source,
                    item="capacity",
                    fix=f"give each {first.response} ({first.sense}) stretch one capacity")


def capacities(document: dict[str, Any], method: str, source: str = "") -> tuple[Capacity, ...]:
    """The ``[[capacity]]`` entries of a parsed model file, validated.

    Checks what needs no structure: keys, signs against the sense, one way of saying where, and
    no two chainage ranges, members or sections of the same response and sense overlapping.

    Args:
        document: the parsed TOML file.
        method: "LRFR", "LFR" or "ASR" (ASR entries need ``allowable``, others ``nominal``).
        source: file name for errors.

    Raises:
        ModelError: one line naming the file, the entry and the fix.
    """
    choice(method, METHODS, "rating.method", source)
    raw = document.get("capacity", [])
    if not isinstance(raw, list):
        raise ModelError("capacity must be a list of tables", source=source, item="capacity",
                         fix="write each entry as [[capacity]]")
    entries = tuple(_capacity(entry, n, method, source) for n, entry in enumerate(raw, start=1))
    _check_overlaps(entries, _spans(entries, {}), source)
    return entries


def _spans(entries: tuple[Capacity, ...], member_ranges: Mapping[str, tuple[float, float]]
           ) -> dict[int, tuple[tuple[float, float], ...]]:
    """The chainage stretches each entry covers: its range, or its members' ranges if known."""
    spans: dict[int, tuple[tuple[float, float], ...]] = {}
    for i, entry in enumerate(entries):
        if entry.start is not None and entry.end is not None:
            spans[i] = ((entry.start, entry.end),)
        elif entry.members and member_ranges:
            spans[i] = tuple(member_ranges[m] for m in entry.members)
    return spans


def check_on_structure(entries: tuple[Capacity, ...], path_length: float,
                       member_ranges: Mapping[str, tuple[float, float]],
                       source: str = "") -> None:
    """Check the entries against the structure: ranges on the path, members that exist, and
    no overlap between a range and a member's chainages.

    Args:
        entries: the capacities.
        path_length: length of the travel path [length].
        member_ranges: path member name -> (start, end) chainage [length].
        source: file name for errors.

    Raises:
        ModelError: one line naming the file, the entry and the fix.

    Example:
        >>> entry = Capacity("moment", "positive", 100.0, start=0.0, end=30.0)
        >>> check_on_structure((entry,), 24.0, {})
        Traceback (most recent call last):
        ...
        influence.errors.ModelError: capacity (moment, positive): range 0 to 30 runs off the \
path, 0 to 24 (keep from and to on the path)
    """
    for entry in entries:
        if entry.start is not None and entry.end is not None:
            slack = TOLERANCE * max(1.0, path_length)
            if entry.start < -slack or entry.end > path_length + slack:
                raise ModelError(
                    f"range {entry.start:g} to {entry.end:g} runs off the path, 0 to "
                    f"{path_length:g}", source=source, item=entry.label,
                    fix="keep from and to on the path")
        for member in entry.members:
            if member not in member_ranges:
                raise ModelError(f"no path member named {member!r}", source=source,
                                 item=entry.label,
                                 fix="use one of: " + ", ".join(sorted(member_ranges)))
    _check_overlaps(entries, _spans(entries, member_ranges), source)


def _at_section(entry: Capacity, label: str | None, chainage: float | None) -> bool:
    if label is not None and label in entry.sections:
        return True
    if chainage is None:
        return False
    for section in entry.sections:
        try:
            value = float(section)
        except ValueError:
            continue
        if abs(value - chainage) <= TOLERANCE * max(1.0, abs(chainage)):
            return True
    return False


def _in_range(entry: Capacity, chainage: float | None) -> bool:
    if chainage is None or entry.start is None or entry.end is None:
        return False
    slack = TOLERANCE * max(1.0, abs(chainage))
    return entry.start - slack <= chainage <= entry.end + slack


def capacity_at(entries: tuple[Capacity, ...], response: str, sense: str, *,
                chainage: float | None = None, member: str | None = None,
                label: str | None = None) -> Capacity | None:
    """The capacity that applies at a section, or None (the section is then "not rated").

    A section label (or a section given by chainage) wins over a member, a member over a range;
    where two entries of the same kind meet (a shared range end) the weaker one applies.

    Args:
        entries: the capacities.
        response: "moment", "shear" or "axial".
        sense: "positive" or "negative".
        chainage: the section's chainage [length].
        member: the path member holding the section.
        label: the section's label ("P1", "12.0", ...).
    """
    relevant = [c for c in entries if (c.response, c.sense) == (response, sense)]
    for matches in ([c for c in relevant if _at_section(c, label, chainage)],
                    [c for c in relevant if member is not None and member in c.members],
                    [c for c in relevant if _in_range(c, chainage)]):
        if matches:
            return min(matches, key=_strength)
    return None


def _strength(entry: Capacity) -> float:
    value = entry.factored
    if value is None:
        value = min((abs(v) for _, v in entry.allowable), default=math.inf)
    return abs(value)
