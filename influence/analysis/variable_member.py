"""One member of varying section: stiffness, fixed-end forces and in-member fields for a unit load.

The law of :class:`influence.analysis.element.MemberLaw` with EI(x) and EA(x) in place of
constants. The unit load at ``a`` has local components ``p_axial`` (along x') and
``p_transverse`` (along y'); with the start-end unknowns w = (N0, theta0, M0, V0),

    N(x) = N0 - p_axial H(x - a)             u(x) = u_start + ∫_0^x N / EA
    V(x) = V0 + p_transverse H(x - a)        M(x) = M0 + V0 x + p_transverse <x - a>
    theta(x) = theta0 + ∫_0^x M / EI         v(x) = v_start + theta0 x + ∫_0^x (x - xi) M / EI

and every integral is a combination of the running integrals F_k = ∫ xi^k / EI, G_0 = ∫ 1 / EA
(:mod:`influence.analysis.integral_form`). The four end conditions (far-end u and v, and at each
end the rotation or, at a moment release, M = 0; no axial force at a sliding end) give w; the
stiffness, the fixed-end forces and the fields at a section are that one solution read off in
different ways, exactly as for the prismatic member, so a prismatic section reproduces MemberLaw.

Signs and orders are MemberLaw's: N tension-positive, M sagging-positive, V the resultant of the
transverse forces on the start side along +y'; end forces are those the nodes exert on the member,
(start axial, start transverse, start moment, end axial, end transverse, end moment), moments
counter-clockwise positive; end displacements in the same order.

Reference: the flexibility of a non-prismatic member by the unit-load method, e.g. W. Weaver Jr.
and J. M. Gere, *Matrix Analysis of Framed Structures*, 3rd ed. (1990), sec. 6.3 (members of
variable cross section); end releases by condensation as in W. McGuire, R. H. Gallagher and
R. D. Ziemian, *Matrix Structural Analysis*, 2nd ed. (2000), sec. 7.2.

Example (fixed-fixed prismatic span of 10, unit transverse load at midspan: end moments PL/8):
    >>> from influence.analysis.haunch import haunched_section
    >>> law = VariableMemberLaw(haunched_section(10.0, 1.0, 1.0))
    >>> forces = law.end_forces_at([5.0], p_axial=0.0, p_transverse=-1.0)
    >>> forces[[2, 5], 0].round(12).tolist()
    [1.25, -1.25]
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property

import numpy as np

from influence.analysis.compliance import Compliance
from influence.analysis.element import FIELDS
from influence.analysis.haunch import VariableSection
from influence.analysis.integral_form import (
    IntegralForm,
    axial_load,
    combine,
    deflection_load,
    polynomial,
    rotation_load,
)

_N0, _THETA0, _M0, _V0 = range(4)
_END_FORCE_SIGNS = (-1.0, 1.0, -1.0, 1.0, -1.0, 1.0)


@dataclass(frozen=True, eq=False)
class FormRule:
    """A local quantity at section ``s`` as an affine function of end displacements and load.

    value = by_displacement @ d + (behind(a) if a < s else ahead(a)) per unit load.

    Attributes:
        by_displacement: coefficients on the six local end displacements.
        behind: the load term, a function of a, when the load lies between the start and s.
        ahead: the load term when the load lies between s and the end.
        s: the section position [length from the start].
    """

    by_displacement: np.ndarray
    behind: IntegralForm
    ahead: IntegralForm
    s: float

    def values(self, positions: np.ndarray | list[float], side: str = "right") -> np.ndarray:
        """The load term at load positions [length] (end displacements zero); a load exactly on
        the section counts as behind it for ``side="left"`` (the limit from below), ahead of
        it otherwise."""
        a = np.atleast_1d(np.asarray(positions, dtype=float))
        behind = a < self.s if side == "right" else a <= self.s
        return np.where(behind, self.behind.values(a), self.ahead.values(a))


@dataclass(frozen=True, eq=False)
class VariableMemberLaw:
    """The law of one member whose EI and EA vary along it.

    Args:
        section: the section variation (length, EI(x), EA(x)).
        release_start: moment release (hinge) at the start node.
        release_end: moment release at the end node.
        sliding_end: the end node does not hold the member along its axis.
    """

    section: VariableSection
    release_start: bool = False
    release_end: bool = False
    sliding_end: bool = False

    @cached_property
    def compliance(self) -> Compliance:
        return Compliance(self.section)

    @property
    def length(self) -> float:
        """Member length [length]."""
        return self.section.length

    def _constants(self, x: float) -> tuple[float, float, float, float]:
        """F_0(x), F_1(x), F_2(x), G_0(x)."""
        c = self.compliance
        F0, F1, F2 = (float(c.bending(k, [x])[0]) for k in (0, 1, 2))
        return F0, F1, F2, float(c.axial(0, [x])[0])

    @cached_property
    def _solution(self) -> tuple[np.ndarray, list[IntegralForm], list[IntegralForm]]:
        """Unknowns w = W_d d + W_ax(a) p_axial + W_tr(a) p_transverse."""
        L = self.length
        c = self.compliance
        F0, F1, F2, G0 = self._constants(L)
        zero = polynomial(c, [0.0])
        system = np.zeros((4, 4))
        by_d = np.zeros((4, 6))
        by_axial = [zero] * 4
        by_transverse = [zero] * 4
        if self.sliding_end:
            # no axial force at the far end: N0 - p_axial = 0
            system[0, _N0] = 1.0
            by_axial[0] = polynomial(c, [1.0])
        else:
            # far-end axial displacement: N0 G0(L) = u_end - u_start + p_axial ∫_a^L 1/EA
            system[0, _N0] = G0
            by_d[0, [0, 3]] = -1.0, 1.0
            by_axial[0] = axial_load(c, L)
        # far-end transverse displacement
        system[1, [_THETA0, _M0, _V0]] = L, L * F0 - F1, L * F1 - F2
        by_d[1, [1, 4]] = -1.0, 1.0
        by_transverse[1] = deflection_load(c, L).times(-1.0)
        # start: no moment at a release, else the node's rotation
        system[2, _M0 if self.release_start else _THETA0] = 1.0
        by_d[2, 2] = 0.0 if self.release_start else 1.0
        if self.release_end:
            system[3, [_M0, _V0]] = 1.0, L
            by_transverse[3] = polynomial(c, [-L, 1.0])
        else:
            system[3, [_THETA0, _M0, _V0]] = 1.0, F0, F1
            by_d[3, 5] = 1.0
            by_transverse[3] = rotation_load(c, L).times(-1.0)
        inverse = np.linalg.inv(system)
        axial = [combine(by_axial, row) for row in inverse]
        transverse = [combine(by_transverse, row) for row in inverse]
        return inverse @ by_d, axial, transverse

    def field(self, quantity: str, s: float, p_axial: float,
              p_transverse: float) -> FormRule:
        """The rule for a local quantity at section ``s`` [length from the start].

        Args:
            quantity: one of ``influence.analysis.element.FIELDS``.
            s: section position, 0 <= s <= length [length].
            p_axial: the unit load's component along x' [-].
            p_transverse: the unit load's component along y' [-].

        Example (a prismatic section: fixed-fixed span 10, load at 2, moment at 5
        equals MemberLaw's):
            >>> from influence.analysis.haunch import haunched_section
            >>> from influence.analysis.element import MemberLaw
            >>> from influence.analysis.singularity import evaluate
            >>> law = VariableMemberLaw(haunched_section(10.0, 3.0, 7.0))
            >>> rule = law.field("moment", 5.0, 0.0, -1.0)
            >>> old = MemberLaw(10.0, 7.0, 3.0).field("moment", 5.0, 0.0, -1.0)
            >>> bool(np.isclose(rule.values([2.0])[0], evaluate(old.behind, 2.0)))
            True
        """
        c = self.compliance
        F0, F1, F2, G0 = self._constants(s)
        on_w = np.zeros(4)
        on_d = np.zeros(6)
        zero = polynomial(c, [0.0])
        behind_axial, behind_transverse = zero, zero
        if quantity == "axial":
            on_w[_N0] = 1.0
            behind_axial = polynomial(c, [-1.0])
        elif quantity == "shear":
            on_w[_V0] = 1.0
            behind_transverse = polynomial(c, [1.0])
        elif quantity == "moment":
            on_w[[_M0, _V0]] = 1.0, s
            behind_transverse = polynomial(c, [s, -1.0])
        elif quantity == "axial_displacement":
            on_d[0] = 1.0
            on_w[_N0] = G0
            behind_axial = axial_load(c, s).times(-1.0)
        elif quantity == "rotation":
            on_w[[_THETA0, _M0, _V0]] = 1.0, F0, F1
            behind_transverse = rotation_load(c, s)
        elif quantity == "transverse_displacement":
            on_d[1] = 1.0
            on_w[[_THETA0, _M0, _V0]] = s, s * F0 - F1, s * F1 - F2
            behind_transverse = deflection_load(c, s)
        else:
            raise ValueError(f"unknown field {quantity!r}; use one of {FIELDS}")
        w_d, w_axial, w_transverse = self._solution
        ahead = combine([*w_axial, *w_transverse],
                        np.concatenate([p_axial * on_w, p_transverse * on_w]))
        behind = combine([ahead, behind_axial, behind_transverse], [1.0, p_axial, p_transverse])
        return FormRule(by_displacement=on_w @ w_d + on_d, behind=behind, ahead=ahead, s=s)

    def _end_force_rules(self, p_axial: float, p_transverse: float) -> list[FormRule]:
        L = self.length
        quantities = ("axial", "shear", "moment")
        rules = [self.field(q, 0.0, p_axial, p_transverse) for q in quantities]
        rules += [self.field(q, L, p_axial, p_transverse) for q in quantities]
        # forces of the nodes on the member from the internal forces just inside each end
        return [FormRule(sign * rule.by_displacement, rule.behind.times(sign),
                            rule.ahead.times(sign), s=rule.s)
                for sign, rule in zip(_END_FORCE_SIGNS, rules, strict=True)]

    @cached_property
    def stiffness(self) -> np.ndarray:
        """Local 6x6 stiffness: end forces per unit end displacement (releases condensed)
        [force / length, force, force * length as the entries pair forces and moments with
        displacements and rotations]."""
        return np.array([rule.by_displacement for rule in self._end_force_rules(0.0, 0.0)])

    def end_forces_from_load(self, p_axial: float, p_transverse: float
                             ) -> tuple[IntegralForm, ...]:
        """Fixed-end forces (end displacements held at zero) for a unit load at a, six functions
        of the load position a [length], as integral forms (forces per unit load [-], moments
        [length])."""
        # at the start the load is always ahead of the section; at the end, always behind
        rules = self._end_force_rules(p_axial, p_transverse)
        return tuple(rule.ahead if i < 3 else rule.behind for i, rule in enumerate(rules))

    def end_forces_at(self, positions: np.ndarray | list[float], p_axial: float,
                      p_transverse: float) -> np.ndarray:
        """Fixed-end forces for a unit load at each position [length]: array (6, n)."""
        return np.array([form.values(positions)
                         for form in self.end_forces_from_load(p_axial, p_transverse)])

    def end_forces_from_uniform_load(self, q_axial: float, q_transverse: float) -> np.ndarray:
        """Fixed-end forces (6,) for a load of unit intensity along the whole member with local
        components ``q_axial``, ``q_transverse`` [force per length per unit intensity]: the
        point-load forms integrated exactly over a.

        Example (prismatic, downward: end moments wL^2/12 = 12 for w = 1, L = 12):
            >>> from influence.analysis.haunch import haunched_section
            >>> law = VariableMemberLaw(haunched_section(12.0, 1.0, 1.0))
            >>> law.end_forces_from_uniform_load(0.0, -1.0)[[1, 2, 4, 5]].round(9).tolist()
            [6.0, 12.0, 6.0, -12.0]
        """
        L = self.length
        return np.array([form.integral(0.0, L)
                         for form in self.end_forces_from_load(q_axial, q_transverse)])
