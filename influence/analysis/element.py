"""One prismatic member: its stiffness, fixed-end forces and in-member fields for a unit load.

The member is an Euler-Bernoulli beam with axial stiffness, in local axes x' (start node to end
node) and y' (x' turned 90 degrees counter-clockwise). A unit load acts at distance ``a`` from the
start with local components ``p_axial`` (along x') and ``p_transverse`` (along y'). Integrating the
impulse with singularity terms gives, for any state of the member,

    N(x) = N0 - p_axial H(x - a)                 EA u(x) = EA u0 + N0 x - p_axial <x - a>
    V(x) = V0 + p_transverse H(x - a)            M(x)    = M0 + V0 x + p_transverse <x - a>
    EI theta(x) = EI theta0 + M0 x + V0 x^2/2 + p_transverse <x - a>^2/2
    EI v(x)     = EI v0 + EI theta0 x + M0 x^2/2 + V0 x^3/6 + p_transverse <x - a>^3/6

with N tension-positive, M sagging-positive (tension on the -y' face), and V the resultant of the
transverse forces on the start side, positive along +y'. Four unknowns (N0, theta0, M0, V0) follow
from the end conditions: u and v at the far end, and at each end either the rotation (continuous
end) or M = 0 (a moment release). Everything below (stiffness, fixed-end forces, fields at a
section) is that one solution read off in different ways, so no special case is typed by hand.

End forces are the forces the nodes exert on the member, local axes, in the order
(start axial, start transverse, start moment, end axial, end transverse, end moment), moments
counter-clockwise positive. End displacements are in the same order.

Example (a fixed-fixed span of 10, unit transverse load at midspan: end moments PL/8):
    >>> member = MemberLaw(length=10.0, EA=1.0, EI=1.0)
    >>> forces = member.end_forces_from_load(p_axial=0.0, p_transverse=-1.0)
    >>> [round(float(evaluate(row, 5.0)), 9) for row in forces[[2, 5]]]
    [1.25, -1.25]
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property

import numpy as np

from influence.analysis.singularity import TERMS, bracket, evaluate

__all__ = ["FIELDS", "FieldRule", "MemberLaw", "evaluate"]

FIELDS = ("axial", "shear", "moment", "axial_displacement", "transverse_displacement", "rotation")
"""Local quantities available at a section of a member."""

# index of each unknown in w = (N0, theta0, M0, V0)
_N0, _THETA0, _M0, _V0 = range(4)


@dataclass(frozen=True)
class FieldRule:
    """A local quantity at section ``s`` as an affine function of end displacements and load.

    value = by_displacement @ d + load * (behind if a < s else ahead)

    Attributes:
        by_displacement: coefficients on the six local end displacements.
        behind: polynomial in ``a`` (per unit load) when the load lies between the start and s.
        ahead: polynomial in ``a`` when the load lies between s and the end.
    """

    by_displacement: np.ndarray
    behind: np.ndarray
    ahead: np.ndarray


@dataclass(frozen=True)
class MemberLaw:
    """The closed-form law of one prismatic member.

    Args:
        length: member length [length].
        EA: axial stiffness [force].
        EI: bending stiffness [force * length^2].
        release_start: moment release (hinge) at the start node.
        release_end: moment release at the end node.
        sliding_end: the end node does not hold the member along its axis (an expansion bearing
            of a stringer): no axial force passes there.
    """

    length: float
    EA: float
    EI: float
    release_start: bool = False
    release_end: bool = False
    sliding_end: bool = False

    @cached_property
    def _solution(self) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """Unknowns w = W_d d + W_ax p_axial(a) + W_tr p_transverse(a), as three matrices."""
        L, EA, EI = self.length, self.EA, self.EI
        system = np.zeros((4, 4))
        by_d = np.zeros((4, 6))
        by_axial = np.zeros((4, TERMS))
        by_transverse = np.zeros((4, TERMS))
        if self.sliding_end:
            # no axial force at the far end: N0 - p_axial = 0
            system[0, _N0] = 1.0
            by_axial[0] = bracket(L, 0)
        else:
            # far-end axial displacement
            system[0, _N0] = L
            by_d[0, [0, 3]] = -EA, EA
            by_axial[0] = bracket(L, 1)
        # far-end transverse displacement
        system[1, [_THETA0, _M0, _V0]] = EI * L, L**2 / 2, L**3 / 6
        by_d[1, [1, 4]] = -EI, EI
        by_transverse[1] = -bracket(L, 3)
        # start: rotation continuous with the node, or no moment
        if self.release_start:
            system[2, _M0] = 1.0
        else:
            system[2, _THETA0] = 1.0
            by_d[2, 2] = 1.0
        # end: rotation continuous with the node, or no moment
        if self.release_end:
            system[3, [_M0, _V0]] = 1.0, L
            by_transverse[3] = -bracket(L, 1)
        else:
            system[3, [_THETA0, _M0, _V0]] = EI, L, L**2 / 2
            by_d[3, 5] = EI
            by_transverse[3] = -bracket(L, 2)
        inverse = np.linalg.inv(system)
        return inverse @ by_d, inverse @ by_axial, inverse @ by_transverse

    def field(self, quantity: str, s: float, p_axial: float, p_transverse: float) -> FieldRule:
        """The rule for a local quantity at section ``s`` [length from the start].

        Args:
            quantity: one of :data:`FIELDS`.
            s: section position, 0 <= s <= length.
            p_axial: the unit load's component along x'.
            p_transverse: the unit load's component along y'.
        """
        EA, EI = self.EA, self.EI
        on_w = np.zeros(4)
        on_d = np.zeros(6)
        behind_axial = np.zeros(TERMS)
        behind_transverse = np.zeros(TERMS)
        if quantity == "axial":
            on_w[_N0] = 1.0
            behind_axial = -bracket(s, 0)
        elif quantity == "shear":
            on_w[_V0] = 1.0
            behind_transverse = bracket(s, 0)
        elif quantity == "moment":
            on_w[[_M0, _V0]] = 1.0, s
            behind_transverse = bracket(s, 1)
        elif quantity == "axial_displacement":
            on_d[0] = 1.0
            on_w[_N0] = s / EA
            behind_axial = -bracket(s, 1) / EA
        elif quantity == "rotation":
            on_w[[_THETA0, _M0, _V0]] = 1.0, s / EI, s**2 / (2 * EI)
            behind_transverse = bracket(s, 2) / EI
        elif quantity == "transverse_displacement":
            on_d[1] = 1.0
            on_w[[_THETA0, _M0, _V0]] = s, s**2 / (2 * EI), s**3 / (6 * EI)
            behind_transverse = bracket(s, 3) / EI
        else:
            raise ValueError(f"unknown field {quantity!r}; use one of {FIELDS}")
        w_d, w_axial, w_transverse = self._solution
        ahead = on_w @ (p_axial * w_axial + p_transverse * w_transverse)
        behind = ahead + p_axial * behind_axial + p_transverse * behind_transverse
        return FieldRule(by_displacement=on_w @ w_d + on_d, behind=behind, ahead=ahead)

    def _end_force_rules(self, p_axial: float, p_transverse: float) -> list[FieldRule]:
        L = self.length
        start = [self.field(q, 0.0, p_axial, p_transverse) for q in ("axial", "shear", "moment")]
        end = [self.field(q, L, p_axial, p_transverse) for q in ("axial", "shear", "moment")]
        # forces of the nodes on the member from the internal forces just inside each end
        signs = (-1.0, 1.0, -1.0, 1.0, -1.0, 1.0)
        rules = start + end
        return [
            FieldRule(
                by_displacement=sign * rule.by_displacement,
                behind=sign * rule.behind,
                ahead=sign * rule.ahead,
            )
            for sign, rule in zip(signs, rules, strict=True)
        ]

    @cached_property
    def stiffness(self) -> np.ndarray:
        """Local 6x6 stiffness: end forces per unit end displacement (releases condensed)."""
        rules = self._end_force_rules(0.0, 0.0)
        return np.array([rule.by_displacement for rule in rules])

    def end_forces_from_load(self, p_axial: float, p_transverse: float) -> np.ndarray:
        """Fixed-end forces (end displacements held at zero), a 6 x TERMS array of polynomials in
        the load position ``a`` [length] for a unit load with the given local components."""
        # at the start the load is always ahead of the section; at the end, always behind
        rules = self._end_force_rules(p_axial, p_transverse)
        return np.array([rule.ahead if i < 3 else rule.behind for i, rule in enumerate(rules)])


def rotation_matrix(cosine: float, sine: float) -> np.ndarray:
    """6x6 transformation from global (x, y, rz at both ends) to member-local components."""
    block = np.array([[cosine, sine, 0.0], [-sine, cosine, 0.0], [0.0, 0.0, 1.0]])
    transform = np.zeros((6, 6))
    transform[:3, :3] = block
    transform[3:, 3:] = block
    return transform
