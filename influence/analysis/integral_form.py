"""Functions of the load position built from a member's running flexibility integrals.

Inside a prismatic member every fixed-end force and every field at a section is a cubic in the
load position a. With a varying section the same quantities are

    g(a) = p(a) + q_0(a) F_0(a) + q_1(a) F_1(a) + q_2(a) F_2(a) + r(a) G_0(a),

where p, q_k, r are polynomials (degree three at most) and F_k, G_0 the running integrals of
:class:`~influence.analysis.compliance.Compliance`. An :class:`IntegralForm` keeps the five
polynomials as rows of one array, so the member law is plain linear algebra on those arrays, the
functions evaluate exactly (to the accuracy of the integrals) at any a, integrate exactly over a
(for uniform loads), and can be bounded on a complex ellipse for the certified polynomial pieces.

Example (the prismatic member of unit EI and length 4: ∫_a^4 (xi - a) dxi = (4 - a)^2 / 2):
    >>> from influence.analysis.compliance import Compliance
    >>> from influence.analysis.haunch import haunched_section
    >>> compliance = Compliance(haunched_section(4.0, 1.0, 1.0))
    >>> form = rotation_load(compliance, 4.0)
    >>> form.values([0.0, 2.0, 4.0]).round(12).tolist()
    [8.0, 2.0, 0.0]
    >>> round(form.integral(0.0, 4.0), 12)   # ∫_0^4 (4 - a)^2 / 2 da
    10.666666666667
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np
from numpy.polynomial import polynomial as P

from influence.analysis.compliance import Compliance

BASIS = ("one", "F0", "F1", "F2", "G0")
"""What each row of an integral form multiplies: 1, F_0(a), F_1(a), F_2(a) and G_0(a)."""

DEGREE = 3
"""Highest power of a in a row."""

_SHAPE = (len(BASIS), DEGREE + 1)
_BENDING_ROWS = {1: 0, 2: 1, 3: 2}  # row -> power k of F_k


@dataclass(frozen=True, eq=False)
class IntegralForm:
    """g(a) = sum over rows of (polynomial in a) x (basis function of a).

    Attributes:
        compliance: the member's running integrals.
        terms: array of shape (5, 4): row i holds the coefficients (lowest power of a first) of
            the polynomial multiplying BASIS[i].
    """

    compliance: Compliance
    terms: np.ndarray

    def __post_init__(self) -> None:
        if self.terms.shape != _SHAPE:
            raise ValueError(f"integral form terms of shape {self.terms.shape}, not {_SHAPE}")

    def plus(self, other: IntegralForm) -> IntegralForm:
        """The sum of two forms of the same member."""
        return IntegralForm(self.compliance, self.terms + other.terms)

    def times(self, factor: float) -> IntegralForm:
        """The form scaled by a constant."""
        return IntegralForm(self.compliance, factor * self.terms)

    # arithmetic as with the polynomial rules of prismatic members: w * rule, sum of rules
    def __mul__(self, factor: float) -> IntegralForm:
        return self.times(float(factor))

    __rmul__ = __mul__

    def __add__(self, other: IntegralForm | int) -> IntegralForm:
        if isinstance(other, int) and other == 0:
            return self
        if not isinstance(other, IntegralForm):
            return NotImplemented
        return self.plus(other)

    __radd__ = __add__

    def _basis(self, a: np.ndarray) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """Basis values (5, n) and their error estimates: within the depth piece, and carried
        from the piece start."""
        values = np.ones((len(BASIS), len(a)))
        errors = np.zeros((len(BASIS), len(a)))
        carried = np.zeros((len(BASIS), len(a)))
        rows = [(row, "bending", power) for row, power in _BENDING_ROWS.items()]
        rows.append((4, "axial", 0))
        for row, kind, power in rows:
            if np.any(self.terms[row]):
                values[row], errors[row], carried[row] = self.compliance.integrals(kind, power, a)
        return values, errors, carried

    def values_and_errors(self, positions: np.ndarray | list[float] | float
                          ) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """g at load positions [length] and two error estimates of each value.

        The first is the error of the integrals over the depth piece holding a, times their
        polynomial weights, plus a few units of rounding on every term added; the second is the
        error of the integrals carried to the piece start, times the weights: along one depth
        piece that part is a fixed polynomial in a (of degree three at most).
        """
        a = np.atleast_1d(np.asarray(positions, dtype=float))
        basis, basis_errors, carried = self._basis(a)
        weights = np.abs(P.polyval(a, self.terms.T))  # (5, n): each row's polynomial at a
        magnitudes = P.polyval(np.abs(a), np.abs(self.terms).T)
        values = (P.polyval(a, self.terms.T) * basis).sum(axis=0)
        rounding = 8 * np.finfo(float).eps * (magnitudes * np.abs(basis)).sum(axis=0)
        return (values, (weights * basis_errors).sum(axis=0) + rounding,
                (magnitudes * carried).sum(axis=0))

    def values(self, positions: np.ndarray | list[float] | float) -> np.ndarray:
        """g at load positions ``positions`` [length]."""
        return self.values_and_errors(positions)[0]

    def integral(self, lo: float, hi: float) -> float:
        """∫_lo^hi g(a) da, exactly: ∫ a^j F_k(a) da = [a^(j+1) F_k(a) - F_(k+j+1)(a)] / (j+1)."""
        powers = np.arange(DEGREE + 1)
        total = float(np.sum(self.terms[0] * (hi ** (powers + 1) - lo ** (powers + 1))
                             / (powers + 1)))
        kinds = [(row, "bending", power) for row, power in _BENDING_ROWS.items()]
        kinds.append((4, "axial", 0))
        ends = np.array([lo, hi])
        for row, kind, k in kinds:
            for j in np.flatnonzero(self.terms[row]):
                own = self.compliance.integrals(kind, k, ends)[0]
                higher = self.compliance.integrals(kind, k + int(j) + 1, ends)[0]
                at_hi = hi ** (j + 1) * own[1] - higher[1]
                at_lo = lo ** (j + 1) * own[0] - higher[0]
                total += float(self.terms[row, j] * (at_hi - at_lo) / (j + 1))
        return total

    def ellipse_bounds(self, piece: int, centre: float, half_width: float, rhos: np.ndarray,
                       start: float) -> np.ndarray:
        """Upper bounds of |g| on the closed Bernstein ellipses with foci centre -/+ half_width
        and parameters ``rhos`` (> 1), for a stretch starting at ``start`` [length] inside depth
        piece ``piece`` (infinite where an ellipse reaches a singularity of 1/EI or 1/EA).

        Each running integral is its value at ``start`` plus the integral along the straight
        segment from ``start`` to z, which stays in the (convex) ellipse:
        |F_k(z)| <= |F_k(start)| + |z - start| sup|xi|^k sup|1/EI|.
        """
        rhos = np.asarray(rhos, dtype=float)
        A = half_width * (rhos + 1 / rhos) / 2
        reach = abs(centre) + A          # sup |z| on each ellipse
        travel = abs(centre - start) + A  # sup |z - start|
        polys = P.polyval(reach, np.abs(self.terms).T)  # (5, len(rhos)): sup of each row
        bound = polys[0].copy()
        at_start = np.array([start])
        rows = [(row, "bending", power) for row, power in _BENDING_ROWS.items()]
        rows.append((4, "axial", 0))
        for row, kind, power in rows:
            if not np.any(self.terms[row]):
                continue
            weight = np.array([self.compliance.weight_bound(kind, piece, centre, half_width, r)
                               for r in rhos])
            own = abs(float(self.compliance.integrals(kind, power, at_start)[0][0]))
            with np.errstate(invalid="ignore"):
                bound += polys[row] * (own + travel * reach**power * weight)
        return np.where(np.isnan(bound), np.inf, bound)


def form_from(compliance: Compliance, rows: dict[str, Sequence[float]]) -> IntegralForm:
    """An integral form from named rows, e.g. {"one": [2.0, -1.0], "F0": [0.0, 1.0]}."""
    terms = np.zeros(_SHAPE)
    for name, coefficients in rows.items():
        terms[BASIS.index(name), : len(coefficients)] = coefficients
    return IntegralForm(compliance, terms)


def combine(forms: Sequence[IntegralForm], weights: Sequence[float] | np.ndarray
            ) -> IntegralForm:
    """sum_i weights[i] forms[i]: for an influence line lambda . f_e(a) + R0(a).

    Example:
        >>> from influence.analysis.haunch import haunched_section
        >>> c = Compliance(haunched_section(4.0, 1.0, 1.0))
        >>> combine([polynomial(c, [1.0]), polynomial(c, [0.0, 1.0])], [2.0, 3.0]).values(
        ...     [1.0]).tolist()
        [5.0]
    """
    if not forms:
        raise ValueError("combine needs at least one form")
    terms = sum((w * f.terms for f, w in zip(forms, weights, strict=True)),
                start=np.zeros(_SHAPE))
    return IntegralForm(forms[0].compliance, terms)


def polynomial(compliance: Compliance, coefficients: Sequence[float]) -> IntegralForm:
    """A plain polynomial in a (lowest power first)."""
    return form_from(compliance, {"one": coefficients})


def axial_load(compliance: Compliance, x: float) -> IntegralForm:
    """∫_a^x dxi / EA = G_0(x) - G_0(a): the stretch between a load at a and the section x."""
    G0x = float(compliance.axial(0, [x])[0])
    return form_from(compliance, {"one": [G0x], "G0": [-1.0]})


def rotation_load(compliance: Compliance, x: float) -> IntegralForm:
    """∫_a^x (xi - a) / EI dxi: the rotation at x from a unit moment ramp starting at a."""
    F0x, F1x = (float(compliance.bending(k, [x])[0]) for k in (0, 1))
    return form_from(compliance, {"one": [F1x, -F0x], "F1": [-1.0], "F0": [0.0, 1.0]})


def deflection_load(compliance: Compliance, x: float) -> IntegralForm:
    """∫_a^x (x - xi)(xi - a) / EI dxi: the deflection at x from a unit moment ramp from a."""
    F0x, F1x, F2x = (float(compliance.bending(k, [x])[0]) for k in (0, 1, 2))
    return form_from(compliance, {
        "one": [x * F1x - F2x, F1x - x * F0x],
        "F2": [1.0],
        "F1": [-x, -1.0],
        "F0": [0.0, x],
    })
