"""Influence lines: exact piecewise polynomials in path chainage.

An influence line gives a response per unit downward load standing at each chainage of the path.
Inside every piece (between nodes, hinges and the section) it is a polynomial of degree three at
most; it may jump at the section (shear, axial force) and is zero off the path. Its largest and
smallest ordinates, areas and zero crossings come from the piece polynomials, never from sampling.

Example (simple span of 10, moment at midspan: the peak ordinate L/4 = 2.5 at the section):
    >>> from influence.model.beamform import simple_beam
    >>> line = influence_line(simple_beam(10.0), Response("moment", "5"))
    >>> peak = line.extremes().largest
    >>> round(peak.value, 12), peak.at
    (2.5, 5.0)
    >>> (line.values([0.0, 2.0, 10.0]).round(12) + 0.0).tolist()
    [0.0, 1.0, 0.0]
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property
from typing import Literal

import numpy as np
from numpy.polynomial import polynomial as P
from scipy.interpolate import PPoly

from influence.analysis.responses import Extraction, Response, resolve_many
from influence.analysis.singularity import TERMS, substitute
from influence.analysis.solve import Structure, analyse
from influence.model.path import PathGeometry, trace
from influence.model.structure import Model

NOISE = 1e-14
"""A term of a piece smaller than this fraction [-] of the line's largest term is round-off of the
solve (a reaction line that should end at exactly zero, say) and is set to zero."""

SNAP = 1e-12
"""Relative distance [-] within which a load chainage is taken to stand on a breakpoint."""

ROOT_TOLERANCE = 1e-12
"""Imaginary part [-] (relative) below which a polynomial root is taken as real."""


@dataclass(frozen=True)
class Extreme:
    """An extreme ordinate and the load chainage [length] where it occurs."""

    value: float
    at: float


@dataclass(frozen=True)
class Extremes:
    largest: Extreme
    smallest: Extreme


@dataclass(frozen=True)
class InfluenceLine:
    """A response's influence line along the path.

    Attributes:
        response: what it measures and where.
        breakpoints: piece boundaries [length], ascending, from 0 to the path length.
        coefficients: one row per piece, polynomial in (chainage - piece start), lowest power
            first, ordinates per unit load.
        section_chainage: where the section (or support) sits on the path, if it does.
        interior_support: the response is a reaction at a support that is not a path end.
        units: "kN-m" or "kip-ft".
    """

    response: Response
    breakpoints: np.ndarray
    coefficients: np.ndarray
    section_chainage: float | None = None
    interior_support: bool = False
    units: str = "kN-m"

    @cached_property
    def ppoly(self) -> PPoly:
        """The line as scipy's PPoly (highest power first), zero outside the path."""
        return PPoly(self.coefficients[:, ::-1].T.copy(), self.breakpoints, extrapolate=False)

    @property
    def length(self) -> float:
        return float(self.breakpoints[-1] - self.breakpoints[0])

    def values(self, positions: np.ndarray | list[float], side: str = "right") -> np.ndarray:
        """Ordinates at load chainages; at a jump ``side`` picks the left or right limit.

        Example (10 m simple span, shear at 4: a load standing exactly on the section gives
        -a/L from the left and (L - a)/L from the right; one standing on a support is carried
        by the support alone):
            >>> from influence.model.beamform import simple_beam
            >>> shear = influence_line(simple_beam(10.0), Response("shear", "4"))
            >>> left, right = shear.values([4.0], side="left")[0], shear.values([4.0])[0]
            >>> round(float(left), 12), round(float(right), 12)
            (-0.4, 0.6)
            >>> float(shear.values([0.0])[0]), float(shear.values([10.0])[0])
            (0.0, 0.0)
        """
        x = np.atleast_1d(np.asarray(positions, dtype=float))
        # a chainage within round-off of a breakpoint is that breakpoint (so sides are honoured)
        nearest = np.clip(np.searchsorted(self.breakpoints, x), 1, len(self.breakpoints) - 1)
        for candidate in (nearest - 1, nearest):
            snap = np.abs(x - self.breakpoints[candidate]) <= SNAP * max(self.length, 1.0)
            x = np.where(snap, self.breakpoints[candidate], x)
        rule: Literal["left", "right"] = "left" if side == "left" else "right"
        pieces = np.searchsorted(self.breakpoints, x, side=rule) - 1
        pieces = np.clip(pieces, 0, len(self.coefficients) - 1)
        local = x - self.breakpoints[pieces]
        result = P.polyval(local, self.coefficients[pieces].T, tensor=False)
        outside = (x < self.breakpoints[0]) | (x > self.breakpoints[-1])
        return np.where(outside | (np.abs(result) < NOISE * self.scale), 0.0, result)

    @cached_property
    def scale(self) -> float:
        """The largest term of any piece: the size of the line's ordinates."""
        widths = np.diff(self.breakpoints)[:, None] ** np.arange(TERMS)
        return float((np.abs(self.coefficients) * widths).max(initial=0.0))

    def limits(self) -> tuple[np.ndarray, np.ndarray]:
        """Left and right limits at every breakpoint (zero beyond the path ends)."""
        widths = np.diff(self.breakpoints)
        ends = P.polyval(widths, self.coefficients.T, tensor=False)
        ends = np.where(np.abs(ends) < NOISE * self.scale, 0.0, ends)
        starts = self.coefficients[:, 0]
        left = np.concatenate([[0.0], ends])
        right = np.concatenate([starts, [0.0]])
        return left, right

    def _candidates(self) -> tuple[np.ndarray, np.ndarray]:
        """Every place an extreme can sit: both limits at breakpoints and stationary points."""
        left, right = self.limits()
        xs = [self.breakpoints, self.breakpoints]
        vs = [left, right]
        for x, value in self._stationary_points():
            xs.append(np.array([x]))
            vs.append(np.array([value]))
        return np.concatenate(xs), np.concatenate(vs)

    def _stationary_points(self) -> list[tuple[float, float]]:
        found = []
        for start, width, row in zip(self.breakpoints, np.diff(self.breakpoints),
                                     self.coefficients, strict=False):
            for t in _real_roots_in(P.polyder(row), width):
                found.append((start + t, float(P.polyval(t, row))))
        return found

    def extremes(self) -> Extremes:
        """Largest and smallest ordinates (limits at jumps included) and where."""
        x, v = self._candidates()
        high, low = int(np.argmax(v)), int(np.argmin(v))
        return Extremes(Extreme(float(v[high]), float(x[high])),
                        Extreme(float(v[low]), float(x[low])))

    def zero_crossings(self) -> np.ndarray:
        """Chainages where the line changes sign [length]: roots inside pieces, and breakpoints
        where it jumps across zero or passes through zero from one piece to the next.

        Example (moment over the middle support of two 10 m spans: negative throughout, so
        no crossing; the midspan moment of the first span changes sign at the middle support):
            >>> from influence.model.beamform import continuous_beam
            >>> beam = continuous_beam([10.0, 10.0], 1.0, ["pinned", "roller", "roller"])
            >>> influence_line(beam, Response("moment", "S2")).zero_crossings().tolist()
            []
            >>> influence_line(beam, Response("moment", "5")).zero_crossings().tolist()
            [10.0]
        """
        points = [self.breakpoints]
        for start, width, row in zip(self.breakpoints, np.diff(self.breakpoints),
                                     self.coefficients, strict=False):
            points.append(start + np.array(_real_roots_in(row, width)))
        edges = np.unique(np.concatenate(points))
        middles = (edges[:-1] + edges[1:]) / 2
        signs = np.sign(self.values(middles))  # round-off below NOISE already reads as zero
        crossings = []
        previous = 0.0
        for where, sign in zip(edges[:-1], signs, strict=True):
            if sign == 0:
                continue
            if previous and sign != previous:
                crossings.append(float(where))
            previous = sign
        return np.array(crossings, dtype=float)

    @cached_property
    def scope_interior(self) -> bool:
        """Whether the response lies in the interior region a load case's scope may name: a
        reaction at a support that is not a path end, or a moment where a uniform load on the
        whole path hogs (its line's net area is negative), that is between the points of
        contraflexure around an interior support."""
        if self.response.kind == "reaction":
            return self.interior_support
        if self.response.kind == "moment":
            positive, negative = self.areas()
            return positive + negative < -NOISE * self.scale * self.length
        return False

    def integral(self, start: float, end: float) -> float:
        """Exact area under the line between two chainages [ordinate * length] (zero off the
        path): the effect of a unit uniform load over that stretch."""
        lo = max(min(start, end), float(self.breakpoints[0]))
        hi = min(max(start, end), float(self.breakpoints[-1]))
        if hi <= lo:
            return 0.0
        return float(self.ppoly.integrate(lo, hi))

    def areas(self) -> tuple[float, float]:
        """(positive area, negative area) under the line [ordinate * length], exact."""
        positive = negative = 0.0
        for _, width, row in zip(self.breakpoints, np.diff(self.breakpoints), self.coefficients,
                                 strict=False):
            cuts = [0.0, *sorted(_real_roots_in(row, width)), width]
            integral = P.polyint(row)
            for lo, hi in zip(cuts, cuts[1:], strict=False):
                part = float(P.polyval(hi, integral) - P.polyval(lo, integral))
                if part > 0:
                    positive += part
                else:
                    negative += part
        return positive, negative


def _real_roots_in(row: np.ndarray, width: float) -> list[float]:
    """Real roots of a polynomial (lowest power first) strictly inside (0, width)."""
    trimmed = np.trim_zeros(np.asarray(row, dtype=float), "b")
    if len(trimmed) < 2:
        return []
    roots = P.polyroots(trimmed)
    real = roots[np.abs(roots.imag) <= ROOT_TOLERANCE * np.maximum(1.0, np.abs(roots))].real
    return sorted(float(t) for t in real if 0.0 < t < width)


@dataclass(frozen=True)
class Analysis:
    """A model traced, assembled and factorised once; influence lines come from it on demand."""

    model: Model
    structure: Structure
    path: PathGeometry

    def lines(self, responses: tuple[Response, ...] | list[Response]) -> list[InfluenceLine]:
        """Influence lines of many responses, from one multi-column solve."""
        extractions = resolve_many(self.structure, self.path, tuple(responses))
        if not extractions:
            return []
        weights = np.stack([e.weights for e in extractions])
        # every leg's polynomial for every line at once: in the member position a, and in
        # chainage from the leg's start (the form a leg without the section keeps whole)
        in_member = [weights[:, used] @ loads for used, loads, _ in self._leg_terms]
        in_chainage = [base @ change for base, (_, _, change) in
                       zip(in_member, self._leg_terms, strict=True)]
        return [self._line(e, [b[i] for b in in_member], [c[i] for c in in_chainage])
                for i, e in enumerate(extractions)]

    def line(self, response: Response) -> InfluenceLine:
        return self.lines((response,))[0]

    @cached_property
    def _leg_terms(self) -> list[tuple[np.ndarray, np.ndarray, np.ndarray]]:
        """Per leg: the unknowns its member's end displacements sit at, its equivalent nodal
        loads (polynomials in a) there, and the matrix re-expressing a polynomial in a as one in
        chainage from the leg's start (a = t, or a = L - t walked against the member)."""
        terms = []
        for leg in self.path.legs:
            frame = self.structure.frames[leg.member]
            dofs = np.array(frame.dofs)
            used = dofs >= 0
            offset, scale = (leg.length, -1.0) if leg.against_member else (0.0, 1.0)
            change = np.array([substitute(unit, offset, scale) for unit in np.eye(TERMS)])
            terms.append((dofs[used], frame.equivalent_loads[used], change))
        return terms

    def _line(self, extraction: Extraction, in_member: list[np.ndarray],
              in_chainage: list[np.ndarray]) -> InfluenceLine:
        breakpoints: list[float] = [0.0]
        rows: list[np.ndarray] = []
        section = extraction.section_chainage
        tolerance = SNAP * self.path.total_length
        for index, leg in enumerate(self.path.legs):
            if extraction.own_member != leg.member or extraction.own_rules is None:
                rows.append(in_chainage[index])
                end = leg.end_chainage
                if section is not None and abs(end - section) <= tolerance:
                    end = section
                breakpoints.append(end)
                continue
            # the member holding the section: its own part changes where the load passes it
            base = in_member[index]
            s = extraction.own_position
            behind, ahead = extraction.own_rules
            member_pieces = [(0.0, s, base + behind), (s, leg.length, base + ahead)]
            for lo, hi, poly in _in_travel_order(member_pieces, leg.against_member, leg.length):
                if hi - lo <= 0:
                    continue
                start = leg.start_chainage + lo
                # member position a = offset + scale * (chainage - start)
                if leg.against_member:
                    row = substitute(poly, leg.length - lo, -1.0)
                else:
                    row = substitute(poly, lo, 1.0)
                rows.append(row)
                end = start + (hi - lo)
                if section is not None and abs(end - section) <= tolerance:
                    end = section  # the section's own chainage, not a sum that differs by an ulp
                breakpoints.append(end)
        edges = np.array(breakpoints)
        return InfluenceLine(
            response=extraction.response,
            breakpoints=edges,
            coefficients=_without_noise(np.array(rows).reshape(-1, TERMS), np.diff(edges)),
            section_chainage=extraction.section_chainage,
            interior_support=extraction.interior_support,
            units=self.model.units,
        )


def _without_noise(rows: np.ndarray, widths: np.ndarray) -> np.ndarray:
    reach = np.abs(rows) * widths[:, None] ** np.arange(TERMS)
    scale = reach.max(initial=0.0)
    return np.where(reach < NOISE * scale, 0.0, rows)


def _in_travel_order(pieces: list[tuple[float, float, np.ndarray]], against: bool,
                     length: float) -> list[tuple[float, float, np.ndarray]]:
    """Member pieces as (from, to) distances along the travel direction, in travel order."""
    if not against:
        return pieces
    return [(length - hi, length - lo, poly) for lo, hi, poly in reversed(pieces)]


def analyse_model(model: Model) -> Analysis:
    """Trace the path and factorise the structure once."""
    return Analysis(model, analyse(model), trace(model))


def influence_line(model: Model | Analysis, response: Response) -> InfluenceLine:
    """The exact influence line of one response (see :class:`Response` for locations)."""
    analysis = model if isinstance(model, Analysis) else analyse_model(model)
    return analysis.line(response)
