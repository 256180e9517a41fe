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
from typing import Any

import numpy as np

from influence.analysis.certified import CERTIFIED_TOLERANCE, certify
from influence.analysis.haunched_pieces import (
    ALONE_DEGREES,
    ROUNDING_ALLOWANCE,
    line_pieces,
    member_basis,
)
from influence.analysis.integral_form import IntegralForm
from influence.analysis.responses import Extraction, Response, resolve_many
from influence.analysis.singularity import TERMS, substitute
from influence.analysis.solve import Structure, analyse
from influence.errors import ConditioningError
from influence.model.path import PathGeometry, trace
from influence.model.structure import Member, Model
from piecewise import Batch, Extremes, Piecewise
from piecewise.polynomial import taylor_shift
from piecewise.tolerances import NOISE, POSITION

READINGS = 17
"""Positions across each piece at which :attr:`Analysis.equilibrium_residual` reads the lines."""
EQUILIBRIUM_LIMIT = 1e-6
"""The largest equilibrium residual of the reaction lines an analysis may have [-], relative to
the largest reaction ordinate (see :attr:`Analysis.equilibrium_residual`)."""


@dataclass(frozen=True)
class InfluenceLine:
    """A response's influence line along the path.

    Attributes:
        response: what it measures and where.
        function: the exact piecewise polynomial in path chainage [length], ordinates per unit
            load, zero off the path.
        section_chainage: where the section (or support) sits on the path, if it does.
        interior_support: the response is a reaction at a support that is not a path end.
        units: "kN-m" or "kip-ft".
        scope_interior: whether the response lies in the interior region a load case's scope
            may name: a reaction at a support that is not a path end, or a moment where a
            uniform load on the whole path hogs (the line's net area is negative), that is
            between the points of contraflexure around an interior support.
    """

    response: Response
    function: Piecewise
    section_chainage: float | None = None
    interior_support: bool = False
    units: str = "kN-m"
    scope_interior: bool = False

    @property
    def breakpoints(self) -> np.ndarray:
        """Piece boundaries [length], ascending, from 0 to the path length."""
        return self.function.breaks

    @property
    def coefficients(self) -> np.ndarray:
        """One row per piece, polynomial in (chainage - piece start), lowest power first."""
        return self.function.coeffs.T

    @cached_property
    def ppoly(self) -> Any:
        """The line as scipy's PPoly (highest power first), NaN outside the path: an export
        for users (scipy is imported only when asked)."""
        return self.function.to_ppoly()

    @property
    def length(self) -> float:
        return self.function.length

    @property
    def scale(self) -> float:
        """The largest term of any piece: the size of the line's ordinates."""
        return self.function.scale

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
        values = self.function.values(positions, side)
        # round-off of the solve (a reaction line ending at 1e-16) reads as zero
        return np.where(np.abs(values) < NOISE * self.scale, 0.0, values)

    def limits(self) -> tuple[np.ndarray, np.ndarray]:
        """Left and right limits at every breakpoint (zero beyond the path ends)."""
        return self.function.limits()

    def jumps(self) -> np.ndarray:
        """Chainages where the line jumps [length]."""
        return self.function.jumps()

    def extremes(self) -> Extremes:
        """Largest and smallest ordinates (limits at jumps included) and where."""
        return self.function.extremes()

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
        return self.function.zero_crossings()

    def integral(self, start: float, end: float) -> float:
        """Exact area under the line between two chainages [ordinate * length] (zero off the
        path): the effect of a unit uniform load over that stretch."""
        return self.function.integral(start, end)

    def areas(self) -> tuple[float, float]:
        """(positive area, negative area) under the line [ordinate * length], exact."""
        return self.function.areas()


@dataclass(frozen=True)
class Analysis:
    """A model traced, assembled and factorised once; influence lines come from it on demand."""

    model: Model
    structure: Structure
    path: PathGeometry

    def lines(self, responses: tuple[Response, ...] | list[Response]) -> list[InfluenceLine]:
        """Influence lines of many responses, from one multi-column solve.

        Along a prismatic member a line is a cubic between breakpoints; inside a member of
        varying section it is certified polynomial pieces
        (:mod:`influence.analysis.haunched_pieces`), whose proven truncation bound is checked
        against the whole line's scale once the line is assembled.
        """
        extractions = resolve_many(self.structure, self.path, tuple(responses))
        if not extractions:
            return []
        count = len(extractions)
        weights = np.stack([e.weights for e in extractions])
        # every leg's load terms for every line at once: polynomials in the member position a
        # (prismatic) or integral-form terms (varying section), and for a prismatic leg the
        # polynomial in chainage from the leg's start (the form a leg without the section keeps)
        in_member = []
        in_chainage = []
        for used, loads, change in self._leg_terms:
            flat = weights[:, used] @ loads.reshape(loads.shape[0], -1)
            in_member.append(flat.reshape((count, *loads.shape[1:])))
            in_chainage.append(None if change is None else flat @ change)
        pending: list[tuple[int, int, np.ndarray, float, float]] = []
        haunched: dict[tuple[int, float, float], list[tuple[int, int, np.ndarray]]] = {}
        pieces = [self._pieces(i, e, [b[i] for b in in_member],
                               [None if c is None else c[i] for c in in_chainage],
                               pending, haunched) for i, e in enumerate(extractions)]
        if pending:
            # the own member's pieces re-expressed in chainage, all in one Taylor shift
            polys = np.array([poly for _, _, poly, _, _ in pending]).T
            offsets = np.array([offset for _, _, _, offset, _ in pending])
            scales = np.array([scale for _, _, _, _, scale in pending])
            rows = taylor_shift(polys, offsets) * scales ** np.arange(TERMS)[:, None]
            for column, (line, slot, _, _, _) in enumerate(pending):
                pieces[line][1][slot] = rows[:, column]
        bounds = self._haunched(haunched, pieces)
        # the size of the terms each line is a sum of: what its round-off is relative to
        magnitudes = np.zeros(count)
        for (used, loads, change), leg in zip(self._leg_terms, self.path.legs, strict=True):
            if change is None:
                continue
            reach = np.abs(loads) * leg.length ** np.arange(loads.shape[1])
            magnitudes = np.maximum(magnitudes, (np.abs(weights[:, used]) @ reach).max(axis=1))
        batch = _assembled(pieces).cleaned(magnitudes)
        if haunched:
            batch = self._recertified(batch, haunched, pieces, bounds, magnitudes)
        # the interior region of a moment: a uniform load on the whole path hogs there
        positive, negative = batch.areas()
        hogging = positive + negative < -NOISE * batch.scales * batch.extents
        return [InfluenceLine(
            response=e.response,
            function=Piecewise.from_batch(batch, i),
            section_chainage=e.section_chainage,
            interior_support=e.interior_support,
            units=self.model.units,
            scope_interior=(e.interior_support if e.response.kind == "reaction"
                            else bool(hogging[i]) and e.response.kind == "moment"),
        ) for i, e in enumerate(extractions)]

    def _haunched(self, requests: dict[tuple[int, float, float],
                                      list[tuple[int, int, np.ndarray]]],
                  pieces: list[tuple[list[float], list[Any]]],
                  ) -> dict[tuple[int, int], tuple[float, float]]:
        """Fill the slots of every stretch of a member of varying section with its certified
        pieces, for all lines of a stretch at once; returns (line, slot) -> (proven truncation
        bound, rounding allowance) [line units], to be judged against the line's scale."""
        found: dict[tuple[int, int], tuple[float, float]] = {}
        for (index, lo, hi), wanted in requests.items():
            leg = self.path.legs[index]
            frame = self.structure.frames[leg.member]
            basis = member_basis(frame.law)  # type: ignore[arg-type]
            terms = np.stack([w for _, _, w in wanted])
            made = line_pieces(basis, terms, lo, hi, None)
            for k, (line, slot, _) in enumerate(wanted):
                pieces[line][1][slot] = _in_chainage(made.breakpoints[k], made.coefficients[k],
                                                     leg.against_member, leg.length)
                found[(line, slot)] = (float(made.truncation[k]), float(made.rounding[k]))
        return found

    def _recertified(self, batch: Batch,
                     requests: dict[tuple[int, float, float], list[tuple[int, int, np.ndarray]]],
                     pieces: list[tuple[list[float], list[Any]]],
                     bounds: dict[tuple[int, int], tuple[float, float]],
                     magnitudes: np.ndarray) -> Batch:
        """Certify on its own, against its line's scale, every stretch whose shared-basis bound
        is not within the tolerances of that scale (a line that is a small difference of large
        terms there), and rebuild those lines."""
        scales = batch.scales
        redo: set[int] = set()
        for (index, lo, hi), wanted in requests.items():
            leg = self.path.legs[index]
            law = self.structure.frames[leg.member].law
            for line, slot, terms in wanted:
                truncation, rounding = bounds[(line, slot)]
                scale = float(scales[line])
                if truncation <= CERTIFIED_TOLERANCE * scale and \
                        rounding <= ROUNDING_ALLOWANCE * scale:
                    continue
                alone = certify(IntegralForm(law.compliance, terms), lo, hi,  # type: ignore[union-attr]
                                scale=scale, degrees=ALONE_DEGREES)
                pieces[line][1][slot] = _in_chainage(alone.breakpoints, alone.coefficients.T,
                                                     leg.against_member, leg.length)
                redo.add(line)
        if not redo:
            return batch
        return _assembled(pieces).cleaned(magnitudes)

    def line(self, response: Response) -> InfluenceLine:
        return self.lines((response,))[0]

    @cached_property
    def equilibrium_residual(self) -> float:
        """How far the vertical reaction lines are from balancing the unit load [-].

        The largest |sum of the vertical reaction lines - 1| anywhere on the path (exact: the
        sum is a piecewise cubic, read where it peaks up to the round-off of reading the lines),
        over the largest reaction ordinate (at least 1). Statics makes it zero; an analysis is
        refused above :data:`EQUILIBRIUM_LIMIT` (see :mod:`influence.analysis.solve`).

        Example (a three-span girder: round-off only):
            >>> from influence.model.beamform import continuous_beam
            >>> girder = continuous_beam([8.0, 12.0, 8.0], [1e4, 3e5, 1e4],
            ...                          ["pinned", "roller", "roller", "fixed"])
            >>> analyse_model(girder).equilibrium_residual < 1e-12
            True
        """
        responses = [Response("reaction", node.name) for node in self.model.nodes
                     if node.support.uy != "free"]
        if not responses:
            return 0.0
        lines = self.lines(responses)
        breaks = np.unique(np.concatenate([line.breakpoints for line in lines]))
        middles = 0.5 * (breaks[:-1] + breaks[1:])
        # every reaction line is a piecewise polynomial: sum them on the union of breakpoints
        degree = max(line.function.degree for line in lines)
        total = np.zeros((degree + 1, middles.size))
        for line in lines:
            piece = np.searchsorted(line.breakpoints, middles) - 1
            own = line.function.coeffs[:, piece]
            total[: own.shape[0]] += taylor_shift(own, breaks[:-1] - line.breakpoints[piece])
        total[0] -= 1.0
        found = Piecewise(breaks, total).extremes()
        # read the sum from the lines themselves, as every output reads them: where the summed
        # cubic peaks, at every breakpoint and across every piece (the residual is round-off,
        # so where it peaks when read may differ a little from where the sum peaks)
        across = (breaks[:-1, None] + np.diff(breaks)[:, None] * np.linspace(0, 1, READINGS)[None])
        at = np.concatenate([breaks, [found.largest.at, found.smallest.at], across.ravel()])
        residual = max(float(np.abs(sum(line.values(at, side) for line in lines) - 1.0).max())
                       for side in ("left", "right"))
        largest = max(max(abs(e.largest.value), abs(e.smallest.value))
                      for e in (line.extremes() for line in lines))
        return max(residual, abs(found.largest.value), abs(found.smallest.value)) / max(
            largest, 1.0)

    @cached_property
    def _leg_terms(self) -> list[tuple[np.ndarray, np.ndarray, np.ndarray | None]]:
        """Per leg: the unknowns its member's end displacements sit at, its equivalent nodal
        loads there (polynomials in a, or integral-form terms for a member of varying section),
        and the matrix re-expressing a polynomial in a as one in chainage from the leg's start
        (a = t, or a = L - t walked against the member; None for varying section)."""
        terms: list[tuple[np.ndarray, np.ndarray, np.ndarray | None]] = []
        for leg in self.path.legs:
            frame = self.structure.frames[leg.member]
            dofs = np.array(frame.dofs)
            used = dofs >= 0
            if frame.varies:  # integral-form terms; certified into pieces per stretch
                terms.append((dofs[used], frame.equivalent_loads[used], None))
                continue
            offset, scale = (leg.length, -1.0) if leg.against_member else (0.0, 1.0)
            change = np.array([substitute(unit, offset, scale) for unit in np.eye(TERMS)])
            terms.append((dofs[used], frame.equivalent_loads[used], change))
        return terms

    def _pieces(self, line: int, extraction: Extraction, in_member: list[np.ndarray],
                in_chainage: list[np.ndarray | None],
                pending: list[tuple[int, int, np.ndarray, float, float]],
                haunched: dict[tuple[int, float, float], list[tuple[int, int, np.ndarray]]],
                ) -> tuple[list[float], list[Any]]:
        """(breakpoints, one coefficient row per piece) of one line, before cleaning. Slots left
        to fill: the prismatic member holding the section, listed in ``pending`` as (line, slot,
        polynomial in the member position, offset, scale); and every stretch of a member of
        varying section, listed in ``haunched`` by (leg, from, to) as (line, slot, terms)."""
        breakpoints: list[float] = [0.0]
        rows: list[Any] = []
        section = extraction.section_chainage
        tolerance = POSITION * max(self.path.total_length, 1.0)
        for index, leg in enumerate(self.path.legs):
            own = extraction.own_member == leg.member and extraction.own_rules is not None
            varying = in_chainage[index] is None
            if not own and not varying:
                rows.append(in_chainage[index])
                end = leg.end_chainage
                if section is not None and abs(end - section) <= tolerance:
                    end = section
                breakpoints.append(end)
                continue
            # the member holding the section: its own part changes where the load passes it
            base = in_member[index]
            if own:
                assert extraction.own_rules is not None
                s = extraction.own_position
                behind, ahead = extraction.own_rules
                member_pieces = [(0.0, s, _plus(base, behind)), (s, leg.length, _plus(base, ahead))]
            else:
                member_pieces = [(0.0, leg.length, base)]
            for lo, hi, poly in _in_travel_order(member_pieces, leg.against_member, leg.length):
                if hi - lo <= 0:
                    continue
                start = leg.start_chainage + lo
                if varying:
                    span = (leg.length - hi, leg.length - lo) if leg.against_member else (lo, hi)
                    haunched.setdefault((index, *span), []).append((line, len(rows), poly))
                else:
                    # member position a = offset + scale * (chainage - start)
                    offset, scale = (leg.length - lo, -1.0) if leg.against_member else (lo, 1.0)
                    pending.append((line, len(rows), poly, offset, scale))
                rows.append(None)
                end = start + (hi - lo)
                if section is not None and abs(end - section) <= tolerance:
                    end = section  # the section's own chainage, not a sum that differs by an ulp
                breakpoints.append(end)
        return breakpoints, rows


def _plus(base: np.ndarray, rule: Any) -> np.ndarray:
    """A leg's load terms plus the own member's rule: polynomials, or integral-form terms."""
    return base + (rule.terms if isinstance(rule, IntegralForm) else rule)  # type: ignore[no-any-return]


def _in_chainage(breaks: np.ndarray, coeffs: np.ndarray, against: bool,
                 length: float) -> tuple[np.ndarray, np.ndarray]:
    """Certified pieces in the member position (breakpoints, (degree+1, pieces)) as pieces in
    chainage from the leg's start (walked against the member: a = L - t, pieces reversed)."""
    if not against:
        return breaks, coeffs
    widths = np.diff(breaks)[::-1]
    flipped = taylor_shift(coeffs[:, ::-1], widths)  # p(w - u): shift by w, then u -> -u
    flipped = flipped * (-1.0) ** np.arange(coeffs.shape[0])[:, None]
    return length - breaks[::-1], flipped


def _assembled(pieces: list[tuple[list[float], list[Any]]]) -> Batch:
    """The lines as one batch: prismatic rows (cubics) and certified stretches (pieces of
    higher degree) laid in order, all raised to the highest degree present."""
    degree = TERMS - 1
    for _, rows in pieces:
        for row in rows:
            if isinstance(row, tuple):
                degree = max(degree, row[1].shape[0] - 1)
    breaks_of, coeffs_of = [], []
    for breakpoints, rows in pieces:
        breaks: list[float] = [breakpoints[0]]
        columns: list[np.ndarray] = []
        for end, row in zip(breakpoints[1:], rows, strict=True):
            if isinstance(row, tuple):  # certified pieces: (member-relative breaks, coeffs)
                local_breaks, local = row
                origin = breaks[-1] - local_breaks[0]
                breaks.extend((origin + local_breaks[1:-1]).tolist())
                breaks.append(end)
                block = np.zeros((degree + 1, local.shape[1]))
                block[: local.shape[0]] = local
                columns.extend(block.T)
            else:
                column = np.zeros(degree + 1)
                column[:TERMS] = row
                columns.append(column)
                breaks.append(end)
        breaks_of.append(np.array(breaks))
        coeffs_of.append(np.array(columns).T)
    return Batch.of_arrays(breaks_of, coeffs_of)


def _in_travel_order(pieces: list[tuple[float, float, np.ndarray]], against: bool,
                     length: float) -> list[tuple[float, float, np.ndarray]]:
    """Member pieces as (from, to) distances along the travel direction, in travel order."""
    if not against:
        return pieces
    return [(length - hi, length - lo, poly) for lo, hi, poly in reversed(pieces)]


def analyse_model(model: Model) -> Analysis:
    """Trace the path and factorise the structure once; check that it keeps statics.

    Raises:
        MechanismError: the structure can move without straining.
        ConditioningError: its reaction lines balance the unit load only to more than
            :data:`EQUILIBRIUM_LIMIT` of the largest reaction: the stiffness contrast is beyond
            what double precision resolves.
    """
    analysis = Analysis(model, analyse(model), trace(model))
    residual = analysis.equilibrium_residual
    if residual > EQUILIBRIUM_LIMIT:
        raise ConditioningError(
            f"the stiffness contrast is too large to solve reliably: the reaction lines balance "
            f"the unit load only to {residual:.1e} of the largest reaction "
            f"({_contrast(model)})", source=model.source, item="stiffness",
            fix="merge very short pieces of very different EI into their neighbours, or keep "
                "the bending stiffness of neighbouring pieces within about 1e6 of each other")
    return analysis


def _contrast(model: Model) -> str:
    """The stiffest and the softest member in bending, 12 EI / L^3, as words."""
    def stiffness(member: Member) -> float:
        return 12 * member.EI / model.length_of(member.name) ** 3

    stiff = max(model.members, key=stiffness)
    soft = min(model.members, key=stiffness)
    return (f"member {stiff.name}, {model.length_of(stiff.name):.4g} long with EI "
            f"{stiff.EI:.3g}, beside {soft.name}, {model.length_of(soft.name):.4g} long with EI "
            f"{soft.EI:.3g}")


def influence_line(model: Model | Analysis, response: Response) -> InfluenceLine:
    """The exact influence line of one response (see :class:`Response` for locations)."""
    analysis = model if isinstance(model, Analysis) else analyse_model(model)
    return analysis.line(response)
