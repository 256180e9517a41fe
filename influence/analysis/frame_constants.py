"""Frame constants of a member of varying section: flexibilities, stiffness and carry-over
factors, fixed-end moments, in the form of the published haunch tables.

With xi = x / L and the running integrals F_k = ∫ x^k / EI of the member (exact, see
:mod:`influence.analysis.depth_integrals`), the end-rotation flexibilities of the simply supported
member under end moments are

    f_AA = ∫ (1 - xi)^2 / EI dx = F_0 - 2 F_1 / L + F_2 / L^2
    f_BB = ∫ xi^2 / EI dx       = F_2 / L^2
    f_AB = ∫ xi (1 - xi) / EI dx = F_1 / L - F_2 / L^2                       (all at x = L)

and with D = f_AA f_BB - f_AB^2 the end stiffnesses are K_AA = f_BB / D, K_BB = f_AA / D,
K_AB = f_AB / D. As in the Portland Cement Association's *Handbook of Frame Constants* (1947/1958;
its tables for straight and parabolic haunches are reproduced in J. C. McCormac, *Design of
Reinforced Concrete*, appendix, and R. C. Hibbeler, *Structural Analysis*, chapter on
nonprismatic members):

- stiffness factor k_AB = K_AA L / (E Ic): the moment at A for a unit rotation of A, B fixed, in
  units of E Ic / L (Ic the prismatic part; k = 4 for a prismatic member);
- carry-over factor C_AB = f_AB / f_BB: the moment induced at B over the moment at A (0.5
  prismatic); Maxwell's reciprocal theorem gives k_AB C_AB = k_BA C_BA;
- fixed-end moments, hogging positive, solve [[f_AA, f_AB], [f_AB, f_BB]] [M_A, M_B] =
  [∫ M0 (1 - xi) / EI, ∫ M0 xi / EI] with M0 the simple-span moment of the load; the uniform-load
  coefficient m gives FEM = m w L^2 (1/12 prismatic), the point-load coefficient FEM = m P L for P
  at b L (1/8 at midspan, prismatic).

Example (a prismatic member):
    >>> from influence.analysis.haunch import haunched_section
    >>> constants = frame_constants(haunched_section(9.0, 2.0, 1.0))
    >>> round(constants.stiffness_start, 12), round(constants.carry_over_start, 12)
    (4.0, 0.5)
    >>> round(constants.uniform_start * 12, 12)
    1.0
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from influence.analysis.compliance import Compliance
from influence.analysis.haunch import VariableSection


@dataclass(frozen=True)
class FrameConstants:
    """The member's constants in the published tables' terms (A the start, B the end).

    Attributes:
        flexibility_start: f_AA, rotation at A per unit moment at A [1 / (force length)].
        flexibility_end: f_BB, rotation at B per unit moment at B [1 / (force length)].
        flexibility_cross: f_AB, rotation at one end per unit moment at the other
            [1 / (force length)].
        stiffness_start: k_AB [-], in units of EI_reference / L.
        stiffness_end: k_BA [-].
        carry_over_start: C_AB [-], from A to B.
        carry_over_end: C_BA [-], from B to A.
        uniform_start: m_AB [-]: fixed-end moment at A = m_AB w L^2 (hogging positive).
        uniform_end: m_BA [-]: fixed-end moment at B = m_BA w L^2.
        relative_error: estimated relative error [-] of the constants (closed forms: rounding;
            quadrature: quad's error estimates), amplified by the cancellation in D.
        method: "closed form" or "quadrature" (some piece has no closed form kept).
    """

    flexibility_start: float
    flexibility_end: float
    flexibility_cross: float
    stiffness_start: float
    stiffness_end: float
    carry_over_start: float
    carry_over_end: float
    uniform_start: float
    uniform_end: float
    relative_error: float
    method: str


def _running(compliance: Compliance, power: int, x: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    values, errors, carried = compliance.integrals("bending", power, x)
    return values, errors + carried


def _flexibilities(section: VariableSection) -> tuple[float, float, float, float]:
    """f_AA, f_BB, f_AB and the largest relative error of the integrals behind them."""
    L = section.length
    compliance = Compliance(section)
    at = np.array([L])
    (F0, e0), (F1, e1), (F2, e2) = (_running(compliance, k, at) for k in (0, 1, 2))
    f_AA = float(F0[0] - 2 * F1[0] / L + F2[0] / L**2)
    f_BB = float(F2[0] / L**2)
    f_AB = float(F1[0] / L - F2[0] / L**2)
    error = max(float(e[0] / abs(F[0])) for F, e in ((F0, e0), (F1, e1), (F2, e2)))
    # f_AA and f_AB are differences: the error of the terms relative to the result
    spread = max((F0[0] + 2 * F1[0] / L + F2[0] / L**2) / f_AA,
                 (F1[0] / L + F2[0] / L**2) / f_AB)
    return f_AA, f_BB, f_AB, error * float(spread)


def frame_constants(section: VariableSection) -> FrameConstants:
    """Flexibilities, stiffness and carry-over factors and uniform-load fixed-end moment
    coefficients of a member.

    Args:
        section: the member's section variation; EI_reference is the Ic of the tables.

    Example (a straight haunch at A only: A is stiffer, so k_AB > k_BA; Maxwell's theorem):
        >>> from influence.analysis.haunch import Haunch, haunched_section
        >>> c = frame_constants(haunched_section(
        ...     10.0, 1.0, 1.0, start=Haunch("straight", 1.0, length_fraction=0.3)))
        >>> c.stiffness_start > c.stiffness_end, c.method
        (True, 'closed form')
        >>> bool(np.isclose(c.stiffness_start * c.carry_over_start,
        ...                 c.stiffness_end * c.carry_over_end, rtol=1e-13))
        True
    """
    L = section.length
    f_AA, f_BB, f_AB, error = _flexibilities(section)
    D = f_AA * f_BB - f_AB**2
    unit = section.EI_reference / L
    compliance = Compliance(section)
    # uniform load w = 1: M0 = (L x - x^2) / 2, so ∫ M0 x^j / EI = (L F_(j+1) - F_(j+2)) / 2
    F1, F2, F3 = (float(compliance.bending(k, [L])[0]) for k in (1, 2, 3))
    I0, I1 = (L * F1 - F2) / 2, (L * F2 - F3) / 2
    # hogging end moments from the simple-span end rotations of the load
    M_A, M_B = np.linalg.solve([[f_AA, f_AB], [f_AB, f_BB]], [I0 - I1 / L, I1 / L])
    return FrameConstants(
        flexibility_start=f_AA,
        flexibility_end=f_BB,
        flexibility_cross=f_AB,
        stiffness_start=f_BB / D / unit,
        stiffness_end=f_AA / D / unit,
        carry_over_start=f_AB / f_BB,
        carry_over_end=f_AB / f_AA,
        uniform_start=float(M_A) / L**2,
        uniform_end=float(M_B) / L**2,
        relative_error=error * (f_AA * f_BB + f_AB**2) / D,
        method="quadrature" if compliance.uses_quadrature else "closed form",
    )


def point_load_coefficients(section: VariableSection,
                            fractions: np.ndarray | list[float]) -> tuple[np.ndarray, np.ndarray]:
    """Fixed-end moment coefficients (m_AB, m_BA) [-] for a point load P at b L: the hogging
    fixed-end moments are m P L.

    Args:
        section: the member's section variation.
        fractions: load positions b [-], 0 <= b <= 1 (the tables print b = 0.1 ... 0.9).

    Example (prismatic: P L / 8 at midspan, nothing for a load on a support):
        >>> from influence.analysis.haunch import haunched_section
        >>> m_AB, m_BA = point_load_coefficients(haunched_section(4.0, 1.0, 1.0), [0.5, 0.0])
        >>> m_AB.round(12).tolist(), m_BA.round(12).tolist()
        ([0.125, 0.0], [0.125, 0.0])
    """
    L = section.length
    b = np.atleast_1d(np.asarray(fractions, dtype=float))
    compliance = Compliance(section)
    e = b * L
    F = [compliance.bending(k, e) for k in range(3)]
    FL = [float(compliance.bending(k, [L])[0]) for k in range(3)]
    # M0 = (1 - b) x before the load, b (L - x) after it, for P = 1
    I = [(1 - b) * F[j + 1] + b * (L * (FL[j] - F[j]) - (FL[j + 1] - F[j + 1]))
         for j in (0, 1)]
    f_AA, f_BB, f_AB, _ = _flexibilities(section)
    flex = np.array([[f_AA, f_AB], [f_AB, f_BB]])
    moments = np.linalg.solve(flex, np.array([I[0] - I[1] / L, I[1] / L]))
    return moments[0] / L, moments[1] / L
