"""The compact truss form, compiled to the general frame model.

A simply supported planar truss of equal panels, written in a dozen lines::

    [truss]
    panels = 8                  # number of panels (even for Pratt, Howe, Warren with verticals)
    panel_length = 6.0          # [length], or a quantity such as "20 ft"
    depth = 7.0                 # between chord centre lines [length]
    type = "Pratt"              # Pratt | Howe | Warren | Warren with verticals
    deck = "bottom"             # bottom (a through truss) | top (a deck truss)
    E = 2.1e8                   # [force/length^2], with areas [length^2] per group:
    chord_A = 0.030             #   chords and end posts
    diagonal_A = 0.012          #   diagonals
    vertical_A = 0.012          #   verticals (or A for all, or chord_EA ... / EA [force])
    stringer_EI = 3.0e5         # [force*length^2]; stringer_EA [force] optional
    supports = ["pinned", "roller"]   # at the two ends of the deck chord (the default)

Geometry: bottom-chord panel points L0, L1, ... at y = 0 and top-chord points U.. at y = depth,
panel point i at x = i x panel_length. The chord that carries the deck runs the full length (0 to
panels); the other chord stops one panel short at each end, joined to the supports by inclined
end posts (Pratt, Howe, Warren with verticals), or, for a Warren truss without verticals, has its
points at mid-panel. Pratt diagonals slope down toward midspan (tension under gravity load), Howe
diagonals up toward midspan; Warren diagonals alternate. Every bar is released at both ends.

The deck: a stringer ST1, ST2, ... spans each panel between two deck-chord panel points, released
at both ends and free to slide at its far end (an expansion bearing), so a load reaches the truss
only at the panel points, through the floor beams there (indirect loading). In this plane model a
floor beam is the panel point where two stringers bear: it carries the stringer reactions into the
truss. The travel path runs along the stringers from the left end.

Names: nodes by panel point (L0, U1, ...), members by their two panel points (chords and end posts
named left to right, verticals and diagonals top to bottom: L0L1, U1U2, L0U1, U1L1, U1L2), and
stringers ST1, ST2, .... ``influence check --expand`` writes the general form.

Example:
    >>> model = truss_from_table({"panels": 4, "panel_length": 5.0, "depth": 4.0,
    ...                           "type": "Pratt", "EA": 1.0e6, "stringer_EI": 1.0e4})
    >>> sorted(m.name for m in model.members if not m.name.startswith("ST"))[:6]
    ['L0L1', 'L0U1', 'L1L2', 'L2L3', 'L3L4', 'U1L1']
    >>> [leg.member for leg in model.path]
    ['ST1', 'ST2', 'ST3', 'ST4']
"""

from __future__ import annotations

from typing import Any

from influence.errors import ModelError
from influence.model.beamform import AXIAL_TO_BENDING
from influence.model.fields import check_keys, listed, read_integer, read_quantity, read_text
from influence.model.keys import TRUSS_KEYS
from influence.model.structure import (
    BAR_EI,
    MIN_LENGTH,
    Member,
    Model,
    Node,
    PathLeg,
    Support,
)

TRUSS_TYPES = ("Pratt", "Howe", "Warren", "Warren with verticals")
DECKS = ("bottom", "top")
GROUPS = ("chord", "diagonal", "vertical")
MAX_PANELS = 500
"""The most panels a compact truss may have."""


def truss_from_table(table: dict[str, Any], title: str = "truss", units: str = "kN-m",
                     source: str = "") -> Model:
    """Compile a ``[truss]`` table to the general model (nodes, bars, stringers, path)."""
    check_keys(table, TRUSS_KEYS, "truss", source)
    for key in ("panels", "panel_length", "depth", "type", "stringer_EI"):
        if key not in table:
            raise ModelError(f"missing key {key!r}", source=source, item="truss",
                             fix=f"add truss.{key}")
    kind = _choice(table["type"], TRUSS_TYPES, "truss.type", source)
    deck = _choice(table.get("deck", "bottom"), DECKS, "truss.deck", source)
    panels = read_integer(table["panels"], "truss.panels", source, minimum=1)
    if panels > MAX_PANELS:
        raise ModelError(f"{panels} panels are more than this tool builds", source=source,
                         item="truss.panels", fix=f"give at most {MAX_PANELS}")
    least = 1 if kind == "Warren" else 2
    if panels < least or (kind != "Warren" and panels % 2):
        raise ModelError(f"a {kind} truss of {panels} panels", source=source,
                         item="truss.panels",
                         fix="give an even number of panels, 2 or more (the diagonals mirror "
                             "about midspan)" if kind != "Warren" else "give 1 or more panels")
    length = _positive(table["panel_length"], "panel_length", source, units)
    depth = _positive(table["depth"], "depth", source, units)
    for key, value in (("panel_length", length), ("depth", depth)):
        if value < MIN_LENGTH:
            raise ModelError(f"{key} = {value:g} is less than {MIN_LENGTH:g}", source=source,
                             item=f"truss.{key}", fix=f"give a real {key}")
    stiffness = {group: _axial(table, group, source, units) for group in GROUPS
                 if group != "vertical" or kind != "Warren"}
    stringer_EI = _positive(table["stringer_EI"], "stringer_EI", source, units)
    stringer_EA = (_positive(table["stringer_EA"], "stringer_EA", source, units)
                   if "stringer_EA" in table else AXIAL_TO_BENDING * stringer_EI / length**2)
    supports = _supports(table.get("supports", ["pinned", "roller"]), source)
    layout = _Layout(panels, length, depth, kind, deck)
    nodes = layout.nodes(supports)
    members = [Member(name, start, end, EA=stiffness[group], EI=BAR_EI, release_start=True,
                      release_end=True) for name, start, end, group in layout.bars()]
    deck_letter = layout.deck_letter
    stringers = [Member(f"ST{i}", f"{deck_letter}{i - 1}", f"{deck_letter}{i}", EA=stringer_EA,
                        EI=stringer_EI, release_start=True, release_end=True, sliding_end=True,
                        deck=True) for i in range(1, panels + 1)]
    return Model(title=title, units=units, nodes=tuple(nodes),
                 members=tuple(members + stringers),
                 path=tuple(PathLeg(m.name) for m in stringers), source=source, form="truss")


class _Layout:
    """Panel points and bars of one truss type."""

    def __init__(self, panels: int, length: float, depth: float, kind: str, deck: str) -> None:
        self.panels, self.length, self.depth, self.kind = panels, length, depth, kind
        self.deck_letter = "L" if deck == "bottom" else "U"
        self.other_letter = "U" if deck == "bottom" else "L"

    def _y(self, letter: str) -> float:
        return self.depth if letter == "U" else 0.0

    def other_points(self) -> list[tuple[int, float]]:
        """(number, x) of the chord that does not carry the deck."""
        if self.kind == "Warren":
            return [(i, (i - 0.5) * self.length) for i in range(1, self.panels + 1)]
        return [(i, i * self.length) for i in range(1, self.panels)]

    def nodes(self, supports: tuple[Support, Support]) -> list[Node]:
        deck, other = self.deck_letter, self.other_letter
        found = []
        for i in range(self.panels + 1):
            support = supports[0] if i == 0 else supports[1] if i == self.panels else Support()
            found.append(Node(f"{deck}{i}", i * self.length, self._y(deck), support))
        found += [Node(f"{other}{i}", x, self._y(other)) for i, x in self.other_points()]
        return found

    def bars(self) -> list[tuple[str, str, str, str]]:
        """(name, start, end, group) of every truss bar."""
        deck, other, n = self.deck_letter, self.other_letter, self.panels
        bars = [_named(f"{deck}{i - 1}", f"{deck}{i}", "chord") for i in range(1, n + 1)]
        points = [i for i, _ in self.other_points()]
        bars += [_named(f"{other}{a}", f"{other}{b}", "chord")
                 for a, b in zip(points, points[1:], strict=False)]
        if self.kind == "Warren":
            for i in range(1, n + 1):
                left = _named(f"{deck}{i - 1}", f"{other}{i}", "chord" if i == 1 else "diagonal")
                right = _named(f"{other}{i}", f"{deck}{i}", "chord" if i == n else "diagonal")
                bars += [left if i == 1 else _web(left), right if i == n else _web(right)]
            return bars
        bars.append(_named(f"{deck}0", f"{other}1", "chord"))  # end posts, left to right
        bars.append(_named(f"{other}{n - 1}", f"{deck}{n}", "chord"))
        bars += [_web(_named(f"U{i}", f"L{i}", "vertical")) for i in range(1, n)]
        for i in range(2, n):
            a, b = (f"U{i - 1}", f"L{i}") if self._falls(i) else (f"L{i - 1}", f"U{i}")
            bars.append(_web(_named(a, b, "diagonal")))
        return bars

    def _falls(self, panel: int) -> bool:
        """Whether the diagonal of a panel runs from its top-left to its bottom-right."""
        left_half = 2 * panel <= self.panels
        if self.kind == "Pratt":
            return left_half
        if self.kind == "Howe":
            return not left_half
        # Warren with verticals: alternate from the end post of the first panel
        first_falls = self.deck_letter == "U"
        return first_falls == (panel % 2 == 1)


def _named(start: str, end: str, group: str) -> tuple[str, str, str, str]:
    return start + end, start, end, group


def _web(bar: tuple[str, str, str, str]) -> tuple[str, str, str, str]:
    """Web members run from the top chord to the bottom chord."""
    _, start, end, group = bar
    if start.startswith("L") and end.startswith("U"):
        start, end = end, start
    return start + end, start, end, group


def _choice(value: Any, allowed: tuple[str, ...], item: str, source: str) -> str:
    text = read_text(value, item, source)
    for known in allowed:
        if text.casefold() == known.casefold():
            return known
    raise ModelError(f"{text!r} is not known", source=source, item=item,
                     fix="use one of: " + ", ".join(f'"{a}"' for a in allowed))


def _positive(value: Any, key: str, source: str, units: str, dimension: str = "") -> float:
    """A positive quantity of ``truss.key`` (its dimension that of ``dimension`` or ``key``)."""
    number = read_quantity(value, dimension or key, f"truss.{key}", source, units)
    if not number > 0:
        raise ModelError(f"{key} = {number:g} is not positive", source=source,
                         item=f"truss.{key}", fix=f"give a positive {key}")
    return number


def _axial(table: dict[str, Any], group: str, source: str, units: str) -> float:
    """EA [force] of a group of bars: its own EA, the common EA, or E times an area."""
    for key in (f"{group}_EA", "EA"):
        if key in table:
            return _positive(table[key], key, source, units, "EA")
    for key in (f"{group}_A", "A"):
        if key in table and "E" in table:
            return (_positive(table["E"], "E", source, units)
                    * _positive(table[key], key, source, units, "A"))
    raise ModelError(f"no axial stiffness for the {group} bars", source=source, item="truss",
                     fix=f"give E with {group}_A (or A), or {group}_EA (or EA)")


def _supports(value: Any, source: str) -> tuple[Support, Support]:
    entries = listed(value, "truss.supports", source)
    if len(entries) != 2:
        raise ModelError(f"{len(entries)} supports", source=source, item="truss.supports",
                         fix='give two: the left and right ends, such as ["pinned", "roller"]')
    found = []
    for number, entry in enumerate(entries, start=1):
        kind = read_text(entry, f"truss.supports[{number}]", source)
        try:
            found.append(Support.named(kind))
        except ModelError as error:
            raise ModelError(error.problem, source=source, item=f"truss.supports[{number}]",
                             fix=error.fix) from None
    return found[0], found[1]
