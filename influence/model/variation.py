"""How a member's section varies along it: haunches at its ends, or a taper end to end.

Conventions (those of the Portland Cement Association's *Handbook of Frame Constants*, as its
tables are reproduced in J. C. McCormac, *Design of Reinforced Concrete*): a haunch at one end of
a member has length a L (or a given length) and depth hc (1 + r) at the member end, where hc is
the depth of the prismatic part; a straight haunch varies its depth linearly, a parabolic one as a
parabola with its vertex (zero slope) where it meets the prismatic part. A taper varies the depth
linearly from the start to the end, ending at ``taper`` times the start depth. I is proportional
to depth^n (n = 3 for a rectangle of constant width, or the exponent given) and A to depth^m.

The member's EI and EA are those of its prismatic part (haunches) or of its start (a taper).

Example:
    >>> SectionVariation(start=Haunch("parabolic", 1.0, length_fraction=0.2)).is_prismatic
    False
    >>> try:
    ...     SectionVariation(taper=1.5, end=Haunch("straight", 0.5, length=3.0))
    ... except ModelError as error:
    ...     print(error.fix)
    give haunches or a taper, not both
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from influence.errors import ModelError

HAUNCH_SHAPES = ("straight", "parabolic")
"""How a haunch's depth varies: linearly, or as a parabola with its vertex at the prismatic part."""

LENGTH_AGREEMENT = 1e-9
"""Relative disagreement [-] allowed between a haunch's fraction and length when both are given."""

_SOURCE = ""


def _fail(problem: str, item: str, fix: str) -> ModelError:
    return ModelError(problem, source=_SOURCE, item=item, fix=fix)


def _positive(value: float, item: str, unit: str) -> None:
    if not (math.isfinite(value) and value > 0):
        raise _fail(f"{item} is {value!r}", item, f"give a positive, finite {item} [{unit}]")


@dataclass(frozen=True)
class Haunch:
    """A haunch at one end of a member.

    Args:
        shape: "straight" (depth linear) or "parabolic" (vertex where the haunch meets the
            prismatic part).
        depth_ratio: r [-]: the depth at the member end is hc (1 + r), r >= 0.
        length_fraction: a [-]: the haunch length as a fraction of the member length (PCA style).
        length: the haunch length [length]; give it, the fraction, or both (they must agree).
    """

    shape: str
    depth_ratio: float
    length_fraction: float | None = None
    length: float | None = None

    def __post_init__(self) -> None:
        if self.shape not in HAUNCH_SHAPES:
            raise _fail(f"haunch shape {self.shape!r}", "shape", f"use one of {HAUNCH_SHAPES}")
        if not (math.isfinite(self.depth_ratio) and self.depth_ratio >= 0):
            raise _fail(f"depth ratio {self.depth_ratio!r}", "depth_ratio",
                        "give r >= 0: the end depth is hc (1 + r)")
        if self.length_fraction is None and self.length is None:
            raise _fail("haunch with neither length nor length fraction", "length",
                        "give length_fraction (a, of the member length) or length")
        if self.length_fraction is not None and not 0 < self.length_fraction <= 1:
            raise _fail(f"length fraction {self.length_fraction!r}", "length_fraction",
                        "give 0 < a <= 1")
        if self.length is not None:
            _positive(self.length, "haunch length", "length")

    def span(self, member_length: float) -> float:
        """The haunch length [length] on a member of ``member_length`` [length].

        Example:
            >>> Haunch("parabolic", 1.0, length_fraction=0.2).span(15.0)
            3.0
        """
        if self.length_fraction is None:
            assert self.length is not None
            return self.length
        from_fraction = self.length_fraction * member_length
        if self.length is not None and not math.isclose(
                self.length, from_fraction, rel_tol=LENGTH_AGREEMENT):
            raise _fail(f"haunch length {self.length} but fraction {self.length_fraction} of "
                        f"{member_length} is {from_fraction}", "length",
                        "give the length or the fraction, or make them agree")
        return from_fraction

    def depth(self, distance: float) -> tuple[float, float, float]:
        """Relative depth coefficients (c0, c1, c2) in t, the distance from the prismatic part
        toward the member end [length], over a haunch of length ``distance`` [length]."""
        r = self.depth_ratio
        if self.shape == "straight":
            return (1.0, r / distance, 0.0)
        return (1.0, 0.0, r / distance**2)



@dataclass(frozen=True)
class SectionVariation:
    """A member's variation of section.

    Args:
        start: the haunch at the start node, if any.
        end: the haunch at the end node, if any.
        taper: depth at the end over depth at the start [-] (a tapered member), if any.
        inertia_exponent: n in I proportional to depth^n [-] (3: a rectangle).
        area_exponent: m in A proportional to depth^m [-] (1: constant width).
    """

    start: Haunch | None = None
    end: Haunch | None = None
    taper: float | None = None
    inertia_exponent: float = 3.0
    area_exponent: float = 1.0

    def __post_init__(self) -> None:
        if self.taper is not None and (self.start is not None or self.end is not None):
            raise _fail("a member with both haunches and a taper", "variation",
                        "give haunches or a taper, not both")
        if self.taper is not None:
            _positive(self.taper, "taper", "-")
        for name in ("inertia_exponent", "area_exponent"):
            _positive(getattr(self, name), name, "-")

    def haunch_lengths(self, member_length: float) -> tuple[float, float]:
        """The lengths [length] of the start and end haunches (0 where there is none) on a
        member of ``member_length`` [length], checked to fit on it together.

        Example:
            >>> both = Haunch("straight", 1.0, length_fraction=0.25)
            >>> SectionVariation(start=both, end=Haunch("straight", 1.0, length=2.0)
            ...                  ).haunch_lengths(12.0)
            (3.0, 2.0)
        """
        near = self.start.span(member_length) if self.start else 0.0
        far = self.end.span(member_length) if self.end else 0.0
        if near + far > member_length * (1 + LENGTH_AGREEMENT):
            raise _fail(f"haunches of {near:g} and {far:g} on a member of {member_length:g}",
                        "length", "make the two haunches no longer than the member together")
        return near, far

    @property
    def is_prismatic(self) -> bool:
        """Whether the section does not vary after all (no haunch of any depth, no taper)."""
        haunched = [h for h in (self.start, self.end) if h is not None and h.depth_ratio > 0]
        return not haunched and (self.taper is None or self.taper == 1.0)
