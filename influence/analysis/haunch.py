"""Section variation along a member: straight and parabolic haunches, tapers, EI(x) and EA(x).

Conventions (those of the Portland Cement Association's *Handbook of Frame Constants*, 1947/1958,
as its tables are reproduced in J. C. McCormac, *Design of Reinforced Concrete*, appendix tables
for straight and parabolic haunches): member AB of length L, a prismatic middle part of depth hc
with moment of inertia Ic; a haunch at A of length aA L whose depth at A is hc (1 + rA), likewise
aB, rB at B; constant width, so I is proportional to depth^3. A straight haunch varies its depth
linearly; a parabolic haunch varies it as a parabola whose vertex (zero slope) is where the haunch
meets the prismatic part.

Here a section is described by its relative depth d(x) = h(x) / h_ref, a piecewise polynomial of
degree two at most (:class:`DepthProfile`), and the stiffnesses

    EI(x) = EI_ref d(x)^n        EA(x) = EA_ref d(x)^m

with n = 3 for a rectangle (or any exponent the user gives, e.g. for flanged sections) and m = 1
(area proportional to depth at constant width). h_ref is the prismatic part of a haunched member and
the start of a tapered one.

Example (a 10 m member, 3 m straight haunch at A doubling the depth: EI at A is 8 EIc):
    >>> section = haunched_section(10.0, 1.0, 1.0, start=Haunch("straight", 1.0, length=3.0))
    >>> section.EI([0.0, 1.5, 3.0, 10.0]).tolist()
    [8.0, 3.375, 1.0, 1.0]
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from influence.errors import ModelError
from influence.model.variation import HAUNCH_SHAPES, LENGTH_AGREEMENT, Haunch, SectionVariation

__all__ = ["HAUNCH_SHAPES", "LENGTH_AGREEMENT", "DepthProfile", "Haunch", "SectionVariation",
           "VariableSection", "depth_ratio_for_inertia", "haunched_section", "section_of",
           "tapered_section"]

_SOURCE = "haunched member"


def _fail(problem: str, item: str, fix: str) -> ModelError:
    return ModelError(problem, source=_SOURCE, item=item, fix=fix)


def _positive(value: float, item: str, unit: str) -> None:
    if not (math.isfinite(value) and value > 0):
        raise _fail(f"{item} is {value!r}", item, f"give a positive, finite {item} [{unit}]")


@dataclass(frozen=True)
class DepthProfile:
    """Relative depth d(x) along a member: a polynomial of degree two at most on each piece.

    Args:
        breakpoints: piece ends from 0 to the member length, ascending [length].
        coefficients: per piece (c0, c1, c2): d = c0 + c1 t + c2 t^2, t = x - piece start [-].
    """

    breakpoints: tuple[float, ...]
    coefficients: tuple[tuple[float, float, float], ...]

    def __post_init__(self) -> None:
        cuts = np.asarray(self.breakpoints, dtype=float)
        if len(cuts) < 2 or cuts[0] != 0.0 or not np.all(np.diff(cuts) > 0):
            raise _fail(f"breakpoints {self.breakpoints}", "breakpoints",
                        "give ascending piece ends starting at 0")
        if len(self.coefficients) != len(cuts) - 1 or any(
                len(row) != 3 for row in self.coefficients):
            raise _fail(f"{len(self.coefficients)} coefficient rows for {len(cuts) - 1} pieces",
                        "coefficients", "give (c0, c1, c2) for every piece")
        for start, width, row in zip(cuts[:-1], np.diff(cuts), self.coefficients, strict=True):
            c0, c1, c2 = row
            candidates = [0.0, width]
            if c2 != 0 and 0 < -c1 / (2 * c2) < width:
                candidates.append(-c1 / (2 * c2))
            lowest = min(c0 + c1 * t + c2 * t * t for t in candidates)
            if not (math.isfinite(lowest) and lowest > 0):
                raise _fail(f"relative depth {lowest} on the piece from {start}", "coefficients",
                            "keep the depth positive along the whole member")

    @property
    def length(self) -> float:
        return self.breakpoints[-1]

    def piece_of(self, x: np.ndarray) -> np.ndarray:
        """Index of the piece holding each position (a breakpoint belongs to the piece after it,
        the member end to the last piece)."""
        cuts = np.asarray(self.breakpoints)
        return np.clip(np.searchsorted(cuts, x, side="right") - 1, 0, len(cuts) - 2)

    def values(self, x: np.ndarray | list[float] | float) -> np.ndarray:
        """Relative depth d [-] at positions ``x`` [length]."""
        at = np.asarray(x, dtype=float)
        pieces = self.piece_of(at)
        table = np.asarray(self.coefficients)[pieces]
        t = at - np.asarray(self.breakpoints)[pieces]
        return np.asarray(table[..., 0] + t * (table[..., 1] + t * table[..., 2]))


@dataclass(frozen=True)
class VariableSection:
    """The stiffness of a member whose section varies along it.

    Args:
        profile: relative depth d(x).
        EI_reference: bending stiffness where d = 1 [force * length^2].
        EA_reference: axial stiffness where d = 1 [force].
        inertia_exponent: n in EI = EI_ref d^n [-] (3 for a rectangle of constant width).
        area_exponent: m in EA = EA_ref d^m [-] (1 for constant width).
    """

    profile: DepthProfile
    EI_reference: float
    EA_reference: float
    inertia_exponent: float = 3.0
    area_exponent: float = 1.0

    def __post_init__(self) -> None:
        _positive(self.EI_reference, "EI_reference", "force * length^2")
        _positive(self.EA_reference, "EA_reference", "force")
        _positive(self.inertia_exponent, "inertia_exponent", "-")
        _positive(self.area_exponent, "area_exponent", "-")

    @property
    def length(self) -> float:
        """Member length [length]."""
        return self.profile.length

    def EI(self, x: np.ndarray | list[float] | float) -> np.ndarray:
        """Bending stiffness [force * length^2] at positions ``x`` [length]."""
        return self.EI_reference * self.profile.values(x) ** self.inertia_exponent

    def EA(self, x: np.ndarray | list[float] | float) -> np.ndarray:
        """Axial stiffness [force] at positions ``x`` [length]."""
        return self.EA_reference * self.profile.values(x) ** self.area_exponent

    def bending_compliance(self, x: np.ndarray | list[float] | float) -> np.ndarray:
        """1/EI [1 / (force * length^2)] at positions ``x`` [length]."""
        return 1.0 / self.EI(x)

    def axial_compliance(self, x: np.ndarray | list[float] | float) -> np.ndarray:
        """1/EA [1 / force] at positions ``x`` [length]."""
        return 1.0 / self.EA(x)


def haunched_section(length: float, EI_middle: float, EA_middle: float, *,
                     start: Haunch | None = None, end: Haunch | None = None,
                     inertia_exponent: float = 3.0, area_exponent: float = 1.0
                     ) -> VariableSection:
    """A member with a prismatic middle part and a haunch at either end, or both, or neither.

    Args:
        length: member length L [length].
        EI_middle: EIc of the prismatic part [force * length^2].
        EA_middle: EAc of the prismatic part [force].
        start: the haunch at A (the start node), if any.
        end: the haunch at B (the end node), if any.
        inertia_exponent: n in I proportional to depth^n [-].
        area_exponent: m in A proportional to depth^m [-].

    Example (parabolic haunches a = 0.2, r = 1 at both ends; a haunch of zero depth ratio leaves
    the member prismatic):
        >>> both = Haunch("parabolic", 1.0, length_fraction=0.2)
        >>> s = haunched_section(10.0, 2.0, 5.0, start=both, end=both)
        >>> s.profile.breakpoints, s.EI([0.0, 1.0, 5.0, 10.0]).tolist()
        ((0.0, 2.0, 8.0, 10.0), [16.0, 3.90625, 2.0, 16.0])
        >>> flat = Haunch("straight", 0.0, length_fraction=0.3)
        >>> haunched_section(10.0, 2.0, 5.0, start=flat).EI([0.0, 10.0]).tolist()
        [2.0, 2.0]
    """
    _positive(length, "length", "length")
    near, far = SectionVariation(start, end).haunch_lengths(length)
    cuts = [0.0]
    rows: list[tuple[float, float, float]] = []
    if start:
        c0, c1, c2 = start.depth(near)
        # written in t from the member start: the haunch's own distance is near - t
        rows.append((c0 + c1 * near + c2 * near**2, -c1 - 2 * c2 * near, c2))
        cuts.append(near)
    if length - near - far > LENGTH_AGREEMENT * length:
        rows.append((1.0, 0.0, 0.0))
        cuts.append(length - far)
    if end:
        rows.append(end.depth(far))
        cuts.append(length)
    cuts[-1] = length  # haunches that meet or fill the member end exactly at L
    profile = DepthProfile(tuple(cuts), tuple(rows))
    return VariableSection(profile, EI_middle, EA_middle, inertia_exponent, area_exponent)


def tapered_section(length: float, EI_start: float, EA_start: float, depth_ratio: float, *,
                    inertia_exponent: float = 3.0, area_exponent: float = 1.0
                    ) -> VariableSection:
    """A member whose depth varies linearly from end to end.

    Args:
        length: member length [length].
        EI_start: bending stiffness at the start [force * length^2].
        EA_start: axial stiffness at the start [force].
        depth_ratio: depth at the end over depth at the start [-], positive.
        inertia_exponent: n in I proportional to depth^n [-].
        area_exponent: m in A proportional to depth^m [-].

    Example (depth doubling over 8 m; a ratio of one is prismatic):
        >>> tapered_section(8.0, 1.0, 1.0, 2.0).EI([0.0, 4.0, 8.0]).tolist()
        [1.0, 3.375, 8.0]
        >>> tapered_section(8.0, 1.0, 1.0, 1.0).EI([8.0]).tolist()
        [1.0]
    """
    _positive(length, "length", "length")
    _positive(depth_ratio, "depth_ratio", "-")
    profile = DepthProfile((0.0, length), ((1.0, (depth_ratio - 1.0) / length, 0.0),))
    return VariableSection(profile, EI_start, EA_start, inertia_exponent, area_exponent)


def depth_ratio_for_inertia(inertia_ratio: float, inertia_exponent: float = 3.0) -> float:
    """The haunch depth ratio r [-] that gives I_end / I_middle = ``inertia_ratio`` [-] when I is
    proportional to depth^n: (1 + r)^n = I_end / I_middle. Use it when I is given at the ends and
    the middle rather than the depths.

    Example:
        >>> depth_ratio_for_inertia(8.0), depth_ratio_for_inertia(1.0)
        (1.0, 0.0)
    """
    _positive(inertia_ratio, "inertia_ratio", "-")
    _positive(inertia_exponent, "inertia_exponent", "-")
    if inertia_ratio < 1:
        raise _fail(f"end inertia {inertia_ratio} times the middle", "inertia_ratio",
                    "a haunch deepens the member: give I_end >= I_middle")
    return float(inertia_ratio ** (1.0 / inertia_exponent) - 1.0)


def section_of(variation: SectionVariation, length: float, EI: float,
               EA: float) -> VariableSection:
    """The section of a member of ``length`` [length] whose variation the model describes; EI
    [force * length^2] and EA [force] are those of its prismatic part (haunches) or of its start
    (a taper).

    Example:
        >>> taper = SectionVariation(taper=2.0)
        >>> section_of(taper, 8.0, 1.0, 1.0).EI([8.0]).tolist()
        [8.0]
    """
    if variation.taper is not None:
        return tapered_section(length, EI, EA, variation.taper,
                               inertia_exponent=variation.inertia_exponent,
                               area_exponent=variation.area_exponent)
    return haunched_section(length, EI, EA, start=variation.start, end=variation.end,
                            inertia_exponent=variation.inertia_exponent,
                            area_exponent=variation.area_exponent)
