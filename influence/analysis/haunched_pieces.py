"""Influence lines inside members of varying section as certified polynomial pieces, for many
lines at once.

Inside a haunched member every influence line is an integral form
g(a) = p_0(a) + p_1(a) F_0(a) + p_2(a) F_1(a) + p_3(a) F_2(a) + p_4(a) G_0(a)
(:mod:`influence.analysis.integral_form`): cubics p_r times the member's running flexibility
integrals F_k = int x^k / EI and G_0 = int 1 / EA. The integrals are the same for every line, so
they are certified once per member (:func:`member_basis`): on common pieces, each is replaced by a
polynomial with a proven bound beta_r on the error (:mod:`influence.analysis.certified`). A line's
pieces are then plain polynomial arithmetic, p_r(a) times the basis polynomials, and its error is
at most sum_r max|p_r| beta_r, computed for every line and required below
:data:`~influence.analysis.certified.CERTIFIED_TOLERANCE` times the line's scale, with the
estimated rounding below :data:`ROUNDING_ALLOWANCE` of it; a line that would not meet them (a
small difference of very large terms) is certified on its own instead.

The basis degree is capped (:data:`BASIS_DEGREES`), more pieces in exchange, so that the search's
root finding on effect functions stays on small companion matrices.

Example (a parabolic haunch at both ends: the fixed-end moment at A, certified through the basis,
agrees with the exact form within its bound):
    >>> from influence.analysis.haunch import Haunch, haunched_section
    >>> from influence.analysis.variable_member import VariableMemberLaw
    >>> haunch = Haunch("parabolic", 1.0, length_fraction=0.2)
    >>> law = VariableMemberLaw(haunched_section(10.0, 1.0, 1.0, start=haunch, end=haunch))
    >>> form = law.end_forces_from_load(0.0, -1.0)[2]
    >>> pieces = line_pieces(member_basis(law), form.terms[None], 0.0, 10.0, np.array([2.5]))
    >>> a = np.linspace(0.0, 10.0, 7)
    >>> bool(np.all(np.abs(pieces.values(0, a) - form.values(a)) <= pieces.bounds[0]))
    True
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from influence.analysis.certified import (
    CERTIFIED_TOLERANCE,
    CertifiedPieces,
    certify,
)
from influence.analysis.integral_form import BASIS, IntegralForm, form_from
from influence.analysis.variable_member import VariableMemberLaw
from piecewise.polynomial import horner, taylor_shift

BASIS_DEGREES = (3, 5, 8)
"""Chebyshev degrees the basis integrals may use on a piece (more pieces rather than higher
degrees): a line's piece is then of degree 8 + 3 at most."""

BASIS_TOLERANCE = 1e-15
"""Proven truncation bound of each basis integral, as a fraction of its own scale [-]: far
below the lines' tolerance, because a line is a sum of large terms that cancel (a fixed-end
moment is a difference of products of the integrals)."""


@dataclass(frozen=True, eq=False)
class MemberBasis:
    """The running integrals of one member, certified on common pieces.

    Attributes:
        law: the member law they belong to.
        breakpoints: piece ends in the member position [length], from 0 to the member length.
        coefficients: (5, pieces, degree+1): basis r on piece j in powers of (a - start_j);
            row 0 is the constant 1.
        truncation: (5, pieces) proven bound of each basis polynomial's truncation error on
            each piece [its units] (0 for the constant).
        rounding: (5, pieces) the floating-point allowance of each [its units].
    """

    law: VariableMemberLaw
    breakpoints: np.ndarray
    coefficients: np.ndarray
    truncation: np.ndarray
    rounding: np.ndarray

    @property
    def degree(self) -> int:
        return int(self.coefficients.shape[2] - 1)


@lru_cache(maxsize=256)
def member_basis(law: VariableMemberLaw) -> MemberBasis:
    """Certify the member's running integrals F_0, F_1, F_2 and G_0 on common pieces."""
    length = law.length
    certified: list[CertifiedPieces] = []
    for name in BASIS[1:]:
        form = form_from(law.compliance, {name: [1.0]})
        certified.append(certify(form, 0.0, length, tolerance=BASIS_TOLERANCE,
                                 degrees=BASIS_DEGREES))
    breakpoints = np.unique(np.concatenate([c.breakpoints for c in certified]))
    degree = max(c.degree for c in certified)
    count = breakpoints.size - 1
    coefficients = np.zeros((len(BASIS), count, degree + 1))
    coefficients[0, :, 0] = 1.0
    starts = breakpoints[:-1]
    for row, pieces in enumerate(certified, start=1):
        own = np.clip(np.searchsorted(pieces.breakpoints, starts, side="right") - 1, 0,
                      len(pieces.coefficients) - 1)
        shift = starts - pieces.breakpoints[own]
        rows = np.zeros((degree + 1, count))
        rows[: pieces.coefficients.shape[1]] = pieces.coefficients[own].T
        coefficients[row] = taylor_shift(rows, shift).T
    truncation = np.zeros((len(BASIS), count))
    rounding = np.zeros((len(BASIS), count))
    middles = 0.5 * (starts + breakpoints[1:])
    for row, pieces in enumerate(certified, start=1):
        own = np.clip(np.searchsorted(pieces.breakpoints, middles, side="right") - 1, 0,
                      len(pieces.coefficients) - 1)
        truncation[row], rounding[row] = pieces.truncation[own], pieces.rounding[own]
    return MemberBasis(law, breakpoints, coefficients, truncation, rounding)


@dataclass(frozen=True)
class LinePieces:
    """Certified pieces of many lines on one stretch of a member.

    Attributes:
        breakpoints: each line's piece ends [length from the member start].
        coefficients: each line's (degree+1, pieces) in powers of (a - piece start).
        truncation: (lines,) the proven bound of each line's truncation error [line units]
            (at most :data:`CERTIFIED_TOLERANCE` of the line's scale where the scale was given).
        rounding: (lines,) each line's rounding allowance [line units] (at most
            :data:`ROUNDING_ALLOWANCE` of the scale where given).
    """

    breakpoints: tuple[np.ndarray, ...]
    coefficients: tuple[np.ndarray, ...]
    truncation: np.ndarray
    rounding: np.ndarray

    @property
    def bounds(self) -> np.ndarray:
        """Each line's bound: proven truncation plus rounding allowance [line units]."""
        return self.truncation + self.rounding  # type: ignore[no-any-return]

    def values(self, line: int, positions: np.ndarray | list[float]) -> np.ndarray:
        """Line ``line``'s pieces at member positions [length]."""
        a = np.atleast_1d(np.asarray(positions, dtype=float))
        breaks, coefficients = self.breakpoints[line], self.coefficients[line]
        piece = np.clip(np.searchsorted(breaks, a, side="right") - 1, 0,
                        coefficients.shape[1] - 1)
        return horner(coefficients[:, piece], a - breaks[piece])


ROUNDING_ALLOWANCE = 1e-9
"""Largest estimated floating-point error [-] of a line's pieces, as a fraction of its scale.
The estimate is a worst case over the products of large terms that cancel (a tapered member's
fixed-end moments cancel four orders of magnitude); the errors measured in the tests are about
1e-13 of the scale. The truncation error is proven below
:data:`~influence.analysis.certified.CERTIFIED_TOLERANCE` regardless."""

ALONE_DEGREES = (3, 5, 8, 11)
"""Chebyshev degrees for a line certified on its own (see :func:`line_pieces`)."""

_EPS = float(np.finfo(float).eps)


def line_pieces(basis: MemberBasis, terms: np.ndarray, lo: float, hi: float,
                scales: np.ndarray | None) -> LinePieces:
    """Certified pieces on [lo, hi] of the integral forms with ``terms`` (lines, 5, 4).

    Args:
        basis: the member's certified integrals.
        terms: each line's integral-form terms (rows: 1, F_0, F_1, F_2, G_0; cubic in a).
        lo, hi: the stretch of load positions [length from the member start].
        scales: each line's scale [line units]: a line whose bounds from the shared basis are
            not within the tolerances of it is certified on its own; None: no line is, and the
            caller judges the bounds returned (against the whole line's scale, once known).

    Raises:
        ModelError: when a line cannot be certified (see :func:`certify`).
    """
    inner = basis.breakpoints[(basis.breakpoints > lo) & (basis.breakpoints < hi)]
    breakpoints = np.concatenate([[lo], inner, [hi]])
    starts = breakpoints[:-1]
    own = np.clip(np.searchsorted(basis.breakpoints, starts, side="right") - 1, 0,
                  basis.coefficients.shape[1] - 1)
    shift = starts - basis.breakpoints[own]
    degree = basis.degree
    # each basis polynomial re-expanded at the piece starts: (5, degree+1, pieces)
    local = np.stack([taylor_shift(basis.coefficients[r, own].T, shift)
                      for r in range(len(BASIS))])
    # each line's row polynomials re-expanded at the piece starts: (lines, 5, 4, pieces)
    rows = np.moveaxis(taylor_shift(np.moveaxis(terms, 2, 0)[..., None], starts), 0, 2)
    count = terms.shape[0]
    coefficients = np.zeros((count, degree + 4, starts.size))
    for i in range(4):
        for j in range(degree + 1):
            coefficients[:, i + j] += np.einsum("lrp,rp->lp", rows[:, :, i], local[:, j])
    # proven, piece by piece: sum_r max |p_r| beta_r (each polynomial's maximum on the piece
    # bounded by its coefficient magnitudes); allowance: the basis's own, and the rounding of
    # the products and sums
    widths = np.diff(breakpoints)
    magnitude = np.einsum("lrkp,kp->lrp", np.abs(rows),
                          widths[None, :] ** np.arange(4)[:, None])
    sizes = np.einsum("rkp,kp->rp", np.abs(local),
                      widths[None, :] ** np.arange(degree + 1)[:, None])
    truncation = np.einsum("lrp,rp->lp", magnitude, basis.truncation[:, own]).max(axis=1)
    rounding = (np.einsum("lrp,rp->lp", magnitude, basis.rounding[:, own])
                + 4 * (degree + 4) * _EPS * np.einsum("lrp,rp->lp", magnitude, sizes)
                ).max(axis=1)
    found_breaks = [breakpoints] * count
    found = [coefficients[k] for k in range(count)]
    if scales is not None:
        failing = ((truncation > CERTIFIED_TOLERANCE * scales)
                   | (rounding > ROUNDING_ALLOWANCE * scales))
        for line in np.flatnonzero(failing):
            form = IntegralForm(basis.law.compliance, terms[line])
            alone = certify(form, lo, hi, scale=float(scales[line]), degrees=ALONE_DEGREES)
            found_breaks[line] = alone.breakpoints
            found[line] = alone.coefficients.T
            truncation[line] = float(alone.truncation.max())
            rounding[line] = float(alone.rounding.max())
    return LinePieces(tuple(found_breaks), tuple(found), truncation, rounding)
