"""Load trains: ordered point axles and uniform patches, and their realised arrangements.

Conventions: every load acts downward (-y) and is given as a positive magnitude. A train is
described front to rear; each item's ``gap`` is the clear distance from the rear of the previous
item (the previous axle, or the rear end of the previous patch) to the front of this one. The
first item's gap is ignored. A gap or a patch length may be a closed range ``(min, max)``; the
placement search chooses the value that governs. A patch of length ``None`` is unlimited (it
extends without end behind the train, or ahead of it when it is the first item).

Offsets in an :class:`Arrangement` are measured backward from the train's reference point, the
front of its first item that is not an unlimited patch. Units are those of the train (force,
length); the train itself is unit-agnostic.

Example:
    >>> truck = Train("truck", (Axle(35.0), Axle(145.0, 4.3), Axle(145.0, (4.3, 9.0))))
    >>> truck.arranged((9.0,)).axle_offsets.tolist()
    [0.0, 4.3, 13.3]
    >>> truck.total_load()
    325.0
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, field

import numpy as np

from vehicles.errors import VehicleError

Span = float | tuple[float, float]
"""A fixed distance, or a closed range (min, max) that the placement search optimises."""


def _check_span(value: Span, what: str, *, allow_zero: bool) -> Span:
    if isinstance(value, tuple):
        low, high = (float(v) for v in value)
        if not math.isfinite(high):
            # NaN slipped through the min/max comparison; an open range has no search bound
            raise VehicleError(
                f"range [{low:g}, {high:g}] has no finite max", item=what, fix="give a finite max"
            )
        if low > high:
            raise VehicleError(
                f"range [{low:g}, {high:g}] has min above max", item=what, fix="give [min, max]"
            )
        _check_span(low, what, allow_zero=allow_zero)
        return (low, high)
    number = float(value)
    if not math.isfinite(number) or number < 0 or (number == 0 and not allow_zero):
        need = "zero or positive" if allow_zero else "positive"
        raise VehicleError(f"{number:g} is not allowed", item=what, fix=f"give a {need} distance")
    return number


@dataclass(frozen=True)
class Axle:
    """A point load.

    Args:
        load: axle load [force], positive downward.
        gap: distance from the previous item's rear [length]; fixed or a (min, max) range.
    """

    load: float
    gap: Span = 0.0

    def __post_init__(self) -> None:
        if not (math.isfinite(self.load) and self.load > 0):
            raise VehicleError(f"axle load {self.load:g} is not positive", fix="give loads > 0")
        object.__setattr__(self, "gap", _check_span(self.gap, "gap", allow_zero=True))


@dataclass(frozen=True)
class Patch:
    """A uniform load carried by the train (a trailing uniform load, a wagon, SW/0 block).

    Args:
        intensity: load per unit length [force/length], positive downward.
        length: extent [length]; fixed, a (min, max) range, or None for unlimited.
        gap: distance from the previous item's rear [length].
    """

    intensity: float
    length: Span | None = None
    gap: Span = 0.0

    def __post_init__(self) -> None:
        if not (math.isfinite(self.intensity) and self.intensity > 0):
            raise VehicleError(
                f"patch intensity {self.intensity:g} is not positive", fix="give intensity > 0"
            )
        if self.length is not None:
            object.__setattr__(self, "length", _check_span(self.length, "length", allow_zero=False))
        object.__setattr__(self, "gap", _check_span(self.gap, "gap", allow_zero=True))


Item = Axle | Patch


@dataclass(frozen=True)
class RangedValue:
    """A ranged gap or length of a train: which item, which attribute, its bounds and, once
    the placement search has chosen it, the value used [length].

    Attributes:
        item: index of the train item (0 = the first) whose gap or length it is.
        attribute: "gap" or "length".
        low, high: the range [length].
        value: the value used [length]; None on the train itself, where nothing is chosen yet.
    """

    item: int
    attribute: str
    low: float
    high: float
    value: float | None = None

    def at(self, value: float) -> RangedValue:
        """The same range with ``value`` chosen (clipped to the range)."""
        return RangedValue(self.item, self.attribute, self.low, self.high,
                           min(max(float(value), self.low), self.high))


@dataclass(frozen=True)
class Arrangement:
    """A train with every range fixed: plain arrays for the placement code.

    All offsets [length] are measured backward (toward the rear) from the train's reference point;
    a patch covers offsets ``patch_starts[j] <= d <= patch_ends[j]`` (either may be infinite).
    """

    axle_offsets: np.ndarray
    axle_loads: np.ndarray
    patch_starts: np.ndarray
    patch_ends: np.ndarray
    patch_intensities: np.ndarray
    ranged_values: tuple[RangedValue, ...] = field(default=())

    @property
    def values(self) -> tuple[float, ...]:
        """The chosen value of every ranged gap or length, in order [length]."""
        return tuple(float(r.value) for r in self.ranged_values if r.value is not None)

    @property
    def extent(self) -> tuple[float, float]:
        """Front-most and rear-most offsets [length] of anything loaded (may be infinite)."""
        starts = np.concatenate([self.axle_offsets, self.patch_starts])
        ends = np.concatenate([self.axle_offsets, self.patch_ends])
        return float(starts.min()), float(ends.max())


MAX_ITEMS = 1000
"""The most axles and patches of one train (a long freight train has a few hundred)."""

@dataclass(frozen=True)
class Train:
    """An ordered set of axles and patches, front to rear.

    Args:
        name: label for tables.
        items: axles and patches, front to rear.
    """

    name: str
    items: tuple[Item, ...]

    def __post_init__(self) -> None:
        object.__setattr__(self, "items", tuple(self.items))
        if not self.items:
            raise VehicleError("a train needs at least one axle or patch", item=self.name)
        if self.items[0].gap != 0.0:
            # the first gap means nothing; zeroing it lets equal trains compare equal
            object.__setattr__(self, "items", (_with_gap(self.items[0], 0.0), *self.items[1:]))
        if len(self.items) > MAX_ITEMS:
            raise VehicleError(f"{len(self.items)} axles and patches are more than {MAX_ITEMS}",
                               item=self.name, fix="split the train, or give a uniform load for "
                               "a long run of equal axles")
        for index, item in enumerate(self.items):
            inner = 0 < index < len(self.items) - 1
            if isinstance(item, Patch) and item.length is None and inner:
                raise VehicleError(
                    "an unlimited patch can only be the first or last item",
                    item=f"{self.name} item {index + 1}",
                    fix="give the patch a length",
                )

    @property
    def ranged_values(self) -> tuple[RangedValue, ...]:
        """Every ranged gap or length, in item order (the first item's gap is ignored)."""
        found = []
        for index, item in enumerate(self.items):
            if index > 0 and isinstance(item.gap, tuple):
                found.append(RangedValue(index, "gap", *item.gap))
            if isinstance(item, Patch) and isinstance(item.length, tuple):
                found.append(RangedValue(index, "length", *item.length))
        return tuple(found)

    @property
    def axle_count(self) -> int:
        return sum(isinstance(item, Axle) for item in self.items)

    def arranged(self, ranged_values: Sequence[float] | None = None) -> Arrangement:
        """Fix every range and return the arrays.

        Args:
            ranged_values: one value per entry of :attr:`ranged_values`, in order [length];
                default each range's minimum. Values are clipped to their range.
        """
        ranges = self.ranged_values
        values = ([r.low for r in ranges] if ranged_values is None
                  else [float(c) for c in ranged_values])
        if len(values) != len(ranges):
            raise VehicleError(
                f"{len(values)} values given for {len(ranges)} ranged gaps or lengths",
                item=self.name,
                fix="give one value per range",
            )
        chosen = {
            (r.item, r.attribute): min(max(v, r.low), r.high)
            for r, v in zip(ranges, values, strict=True)
        }

        def pick(index: int, attribute: str, value: Span | None) -> float | None:
            if value is None:
                return None
            return chosen.get((index, attribute), value if isinstance(value, float) else 0.0)

        offsets, loads, starts, ends, intensities = [], [], [], [], []
        cursor = 0.0  # offset of the previous item's rear
        for index, item in enumerate(self.items):
            gap = 0.0 if index == 0 else pick(index, "gap", item.gap) or 0.0
            front = cursor + gap
            if isinstance(item, Axle):
                offsets.append(front)
                loads.append(item.load)
                cursor = front
                continue
            length = pick(index, "length", item.length)
            if length is None and index == 0 and len(self.items) > 1:
                starts.append(-math.inf)  # unlimited ahead of the train
                ends.append(0.0)
                cursor = 0.0
            else:
                rear = math.inf if length is None else front + length
                starts.append(front)
                ends.append(rear)
                cursor = rear
            intensities.append(item.intensity)
        if starts and starts[0] == -math.inf:
            # the gap after a leading unlimited patch separates it from the reference point
            lead_gap = pick(1, "gap", self.items[1].gap) or 0.0
            ends[0] = -lead_gap
            offsets = [o - lead_gap for o in offsets]
            starts = [starts[0]] + [s - lead_gap for s in starts[1:]]
            ends = [ends[0]] + [e - lead_gap for e in ends[1:]]
        return Arrangement(
            axle_offsets=np.asarray(offsets, dtype=float),
            axle_loads=np.asarray(loads, dtype=float),
            patch_starts=np.asarray(starts, dtype=float),
            patch_ends=np.asarray(ends, dtype=float),
            patch_intensities=np.asarray(intensities, dtype=float),
            ranged_values=tuple(r.at(chosen[(r.item, r.attribute)]) for r in ranges),
        )

    def reversed(self) -> Train:
        """The same train described rear to front (gaps move with the items they follow).

        Reversing twice gives the train back, name included.

        Example:
            >>> truck = Train("truck", (Axle(8.0), Axle(32.0, 14.0), Axle(32.0, (14.0, 30.0))))
            >>> [(a.load, a.gap) for a in truck.reversed().items]
            [(32.0, 0.0), (32.0, (14.0, 30.0)), (8.0, 14.0)]
            >>> truck.reversed().reversed() == truck
            True
        """
        items = list(self.items)
        gaps = [item.gap for item in items[1:]] + [0.0]
        flipped = []
        for item, gap in zip(reversed(items), reversed(gaps), strict=True):
            flipped.append(_with_gap(item, gap))
        suffix = " (reversed)"
        name = self.name.removesuffix(suffix) if self.name.endswith(suffix) else self.name + suffix
        return Train(name, tuple(flipped))

    def followed_by(self, other: Train, headway: Span, name: str | None = None) -> Train:
        """This train, then ``other`` at a clear ``headway`` [length] (fixed or a range)."""
        first, *rest = other.items
        joined = (*self.items, _with_gap(first, headway), *rest)
        return Train(name or f"{self.name} + {other.name}", joined)

    def total_load(self, ranged_values: Sequence[float] | None = None) -> float:
        """Sum of axle loads and patch loads [force]; infinite with an unlimited patch."""
        a = self.arranged(ranged_values)
        patches = a.patch_intensities * (a.patch_ends - a.patch_starts)
        return float(a.axle_loads.sum() + patches.sum())

    def length(self, ranged_values: Sequence[float] | None = None) -> float:
        """Distance from the front of the first item to the rear of the last [length]."""
        front, rear = self.arranged(ranged_values).extent
        return rear - front

    def centroid(self, ranged_values: Sequence[float] | None = None) -> float:
        """Offset of the resultant behind the reference point [length] (finite trains only)."""
        a = self.arranged(ranged_values)
        lengths = a.patch_ends - a.patch_starts
        if not np.all(np.isfinite(lengths)):
            raise VehicleError("an unlimited train has no centroid", item=self.name)
        moment = (a.axle_loads * a.axle_offsets).sum() + (
            a.patch_intensities * lengths * (a.patch_starts + a.patch_ends) / 2
        ).sum()
        return float(moment / self.total_load(ranged_values))


def _with_gap(item: Item, gap: Span) -> Item:
    if isinstance(item, Axle):
        return Axle(item.load, gap)
    return Patch(item.intensity, item.length, gap)
