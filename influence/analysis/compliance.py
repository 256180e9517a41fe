"""Cumulative flexibility integrals of a member with varying section.

For a member with bending stiffness EI(x) and axial stiffness EA(x), everything the member law
needs is a handful of running integrals from the member start,

    F_k(x) = ∫_0^x xi^k / EI(xi) dxi        G_k(x) = ∫_0^x xi^k / EA(xi) dxi,

(k = 0, 1, 2 for the fields of a point load; higher k when those fields are integrated again for a
uniform load). They are summed piece by piece of the depth profile from the exact integrals of
:mod:`influence.analysis.depth_integrals`.

For the certified polynomial pieces the module also bounds |1/EI| on a Bernstein ellipse around a
stretch of one depth piece: the depth d is a polynomial of degree two at most, so on the ellipse's
boundary x = c + A cos(theta) + i B sin(theta) its real part is a quadratic in cos(theta) and its
smallest value is found exactly; Re d is harmonic, so that is its smallest value on the whole
ellipse. Where it is positive, d has no zero and d^-n no branch cut inside, and
|1/EI| <= 1 / (EI_ref (min Re d)^n).

Example (a prismatic member: F_0(L) = L / EI, F_2(L) = L^3 / (3 EI)):
    >>> from influence.analysis.haunch import haunched_section
    >>> compliance = Compliance(haunched_section(6.0, 2.0, 10.0))
    >>> compliance.bending(0, [6.0]).tolist(), compliance.bending(2, [6.0]).tolist()
    ([3.0], [36.0])
    >>> compliance.axial(0, [0.0]).tolist()
    [0.0]
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from influence.analysis.depth_integrals import piece_moments, uses_quadrature
from influence.analysis.haunch import VariableSection

KINDS = ("bending", "axial")
"""Which stiffness an integral weighs by: 1/EI ("bending") or 1/EA ("axial")."""


@dataclass(frozen=True)
class Compliance:
    """The running flexibility integrals of one member.

    Args:
        section: the member's section variation.
    """

    section: VariableSection

    def _law(self, kind: str) -> tuple[float, float]:
        """(reference stiffness, exponent) of the weight 1/EI or 1/EA."""
        if kind == "bending":
            return self.section.EI_reference, self.section.inertia_exponent
        if kind == "axial":
            return self.section.EA_reference, self.section.area_exponent
        raise ValueError(f"unknown stiffness kind {kind!r}; use one of {KINDS}")

    @property
    def uses_quadrature(self) -> bool:
        """Whether some piece has no closed form here and is integrated numerically."""
        profile = self.section.profile
        return any(uses_quadrature(row, exponent)
                   for row in profile.coefficients
                   for exponent in (self.section.inertia_exponent, self.section.area_exponent))

    def integrals(self, kind: str, power: int, x: np.ndarray | list[float]
                  ) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """∫_0^x xi^power / EI (or / EA) dxi for each x [length], with error estimates in two
        parts: that of the integral over the piece holding x, and that of the running total up
        to the piece start (one constant per piece, so it is smooth along the piece).

        Units: length^(power+1) / (force length^2) for "bending", length^(power+1) / force for
        "axial".
        """
        at = np.atleast_1d(np.asarray(x, dtype=float))
        reference, exponent = self._law(kind)
        starts, start_errors = _running_starts(self, kind, power)
        profile = self.section.profile
        pieces = profile.piece_of(at)
        values = starts[pieces].copy()
        errors = np.zeros_like(values)
        for piece in np.unique(pieces):
            mask = pieces == piece
            origin = profile.breakpoints[piece]
            v, e = piece_moments(profile.coefficients[piece], exponent, origin, power,
                                 at[mask] - origin)
            values[mask] += v / reference
            errors[mask] += e / reference
        return values, errors, start_errors[pieces]

    def bending(self, power: int, x: np.ndarray | list[float]) -> np.ndarray:
        """F_power(x) = ∫_0^x xi^power / EI dxi [length^(power+1) / (force length^2)]."""
        return self.integrals("bending", power, x)[0]

    def axial(self, power: int, x: np.ndarray | list[float]) -> np.ndarray:
        """G_power(x) = ∫_0^x xi^power / EA dxi [length^(power+1) / force]."""
        return self.integrals("axial", power, x)[0]

    def weight_bound(self, kind: str, piece: int, centre: float, half_width: float,
                     rho: float) -> float:
        """Upper bound of |1/EI| (or |1/EA|) on the closed Bernstein ellipse with foci
        centre -/+ half_width and parameter rho > 1, using depth piece ``piece``'s polynomial;
        infinity where the ellipse reaches a zero of the depth or the branch cut of d^-n.

        Args:
            kind: "bending" or "axial".
            piece: index of the depth piece whose polynomial continues into the ellipse.
            centre: the ellipse centre [length from the member start].
            half_width: half the distance between the foci [length].
            rho: the ellipse parameter (sum of its semi-axes over half_width) [-].
        """
        reference, exponent = self._law(kind)
        profile = self.section.profile
        c0, c1, c2 = profile.coefficients[piece]
        tc = centre - profile.breakpoints[piece]
        A = half_width * (rho + 1 / rho) / 2
        B = half_width * (rho - 1 / rho) / 2
        # Re d on the boundary, as alpha u^2 + beta u + gamma with u = cos(theta) in [-1, 1]
        alpha = c2 * (A * A + B * B)
        beta = c1 * A + 2 * c2 * tc * A
        gamma = c0 + c1 * tc + c2 * (tc * tc - B * B)
        candidates = [-1.0, 1.0]
        if alpha > 0 and -1 < -beta / (2 * alpha) < 1:
            candidates.append(-beta / (2 * alpha))
        lowest = min(alpha * u * u + beta * u + gamma for u in candidates)
        if not lowest > 0:
            return math.inf
        return 1.0 / (reference * lowest**exponent)


@lru_cache(maxsize=4096)
def _running_starts(compliance: Compliance, kind: str,
                    power: int) -> tuple[np.ndarray, np.ndarray]:
    """The integral from 0 to each piece start, and its error estimate (computed once)."""
    reference, exponent = compliance._law(kind)
    profile = compliance.section.profile
    cuts = profile.breakpoints
    values = np.zeros(len(cuts) - 1)
    errors = np.zeros(len(cuts) - 1)
    for piece in range(1, len(cuts) - 1):
        width = cuts[piece] - cuts[piece - 1]
        v, e = piece_moments(profile.coefficients[piece - 1], exponent, cuts[piece - 1], power,
                             np.array([width]))
        values[piece] = values[piece - 1] + v[0] / reference
        errors[piece] = errors[piece - 1] + e[0] / reference
    return values, errors
