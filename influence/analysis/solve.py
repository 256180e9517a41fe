"""Assemble the frame's stiffness once, factorise it once, and solve for many responses at once.

Each node has the unknowns ux, uy and rz, except that a node whose every member end is released
(a pin joint of a truss, the hinge of a suspended span with no continuous member through it)
carries no rotation unknown. Restrained directions are kept as known zero displacements so their
reactions can be read; springs add to the stiffness of a free direction.

A response R is linear in the load: for a unit load anywhere, R = h . F, where F are the
equivalent nodal loads of that load over every unknown (free and restrained) and h is the
response's weight vector: h = K_ff^-1 g on the free unknowns (one back-substitution per response,
g the response's extraction vector), plus a direct term on restrained ones for reactions. This is
the Mueller-Breslau principle in matrix form.

Conditioning. Girders may join an EI of 1e3 to one of 1e11, or a spring of 1e12 to a member of
EI 1e3. The free stiffness K_ff is therefore *equilibrated* before it is factorised: rows and
columns are scaled by S = diag(K_ff)^-1/2, so that S K_ff S has a unit diagonal (for a symmetric
positive definite matrix this scaling is within a factor of its order of the best diagonal one,
van der Sluis 1969), and S K_ff S is factorised by Cholesky. Each solve is refined with residuals
computed in extended precision. Whether the structure is a mechanism is judged apart, on a copy
of the stiffness whose members all have the same normalised stiffness: a mechanism is a matter of
geometry, releases and restraints, so no contrast of stiffness can fake one or hide one.

Accuracy guaranteed: every analysis measures how well its vertical reaction lines balance the
unit load (:attr:`influence.analysis.lines.Analysis.equilibrium_residual`, exact) and
:func:`influence.analysis.lines.analyse_model` refuses a structure whose residual exceeds
:data:`influence.analysis.lines.EQUILIBRIUM_LIMIT` (1e-6 of the largest reaction ordinate) with a
one-line :class:`~influence.errors.ConditioningError`. Girders of ordinary proportions (EI within
1e4 from span to span), with springs up to 1e12 beside an EI of 1e3, reach 1e-11; only a short,
very stiff piece beside a very soft one (an EI step of 1e6 or more a few centimetres from a
support, or a 1 m span 1e8 times stiffer than its neighbour) can reach the limit, since its
stiffness then differs from its neighbours' by more than double precision resolves.
:attr:`Structure.condition` gives the condition number of S K_ff S. Maxwell-Betti reciprocity of
displacement lines holds to 1e-9 of their largest ordinate.

References: W. McGuire, R. H. Gallagher and R. D. Ziemian, "Matrix Structural Analysis", 2nd ed.,
2000, ch. 4 (direct stiffness method) and 7.2 (member end releases by condensation);
A. van der Sluis, "Condition numbers and equilibration of matrices", Numerische Mathematik 14
(1969) 14-23.

Example (a two-span girder whose spans differ 1e8 times in EI, held by a spring of 1e12: no
mechanism, and a well-conditioned equilibrated stiffness):
    >>> from influence.model.beamform import continuous_beam
    >>> from influence.model.structure import Support
    >>> girder = continuous_beam([10.0, 10.0], [1.0e3, 1.0e11],
    ...                          ["pinned", Support(uy=1.0e12), "roller"])
    >>> analyse(girder).condition < 1e6
    True
"""

from __future__ import annotations

from collections.abc import Iterable
from dataclasses import dataclass, replace
from functools import cached_property
from typing import Any

import numpy as np
import scipy.linalg

from influence.analysis.element import MemberLaw, rotation_matrix
from influence.analysis.haunch import section_of
from influence.analysis.variable_member import VariableMemberLaw
from influence.errors import MechanismError
from influence.model.structure import DIRECTION_WORDS, DIRECTIONS, Member, Model

MECHANISM_TOLERANCE = 1e-10
"""Smallest eigenvalue [-] of the kinematic matrix (every member's stiffness normalised, scaled to
a unit diagonal), relative to its largest, taken as zero: a mechanism."""
REFINEMENT_STEPS = 4
"""Most steps of iterative refinement of a solve (two suffice unless the stiffness is extremely
ill-conditioned)."""
_EPS = float(np.finfo(float).eps)


@dataclass(frozen=True)
class Unknown:
    """One displacement unknown: a node and a direction (ux, uy or rz)."""

    node: str
    direction: str


@dataclass(frozen=True)
class MemberFrame:
    """A member's law, orientation and where its six end displacements sit among the unknowns."""

    name: str
    law: MemberLaw | VariableMemberLaw
    cosine: float
    sine: float
    dofs: tuple[int, ...]  # -1 for an end rotation that is not an unknown

    @cached_property
    def transform(self) -> np.ndarray:
        return rotation_matrix(self.cosine, self.sine)

    @property
    def unit_load_components(self) -> tuple[float, float]:
        """Local (axial, transverse) components of a unit load acting downward (-y)."""
        return -self.sine, -self.cosine

    @cached_property
    def global_stiffness(self) -> np.ndarray:
        return self.transform.T @ self.law.stiffness @ self.transform

    @property
    def varies(self) -> bool:
        """Whether the member's section varies (its loads are integral forms, not cubics)."""
        return isinstance(self.law, VariableMemberLaw)

    @cached_property
    def equivalent_loads(self) -> np.ndarray:
        """Global equivalent nodal loads: (6, TERMS) polynomials in the member position a for a
        prismatic member; (6, 5, 4) integral-form terms (see
        :mod:`influence.analysis.integral_form`) for one of varying section."""
        axial, transverse = self.unit_load_components
        fixed_end = self.law.end_forces_from_load(axial, transverse)
        if isinstance(self.law, VariableMemberLaw):
            terms = np.stack([form.terms for form in fixed_end])
            return -np.einsum("ji,jrc->irc", self.transform, terms)
        return -self.transform.T @ fixed_end


@dataclass(frozen=True)
class Structure:
    """A model numbered, assembled and factorised: ready for any number of responses.

    Build it with :func:`analyse`.
    """

    model: Model
    unknowns: tuple[Unknown, ...]
    restrained: np.ndarray  # bool per unknown: held at zero by a fixed support
    springs: np.ndarray  # spring stiffness per unknown (0 where none)
    frames: dict[str, MemberFrame]
    stiffness: np.ndarray  # full, over every unknown, springs included
    _factor: tuple[str, Any]  # ("cholesky" or "lu", factor) of the equilibrated free stiffness
    _scale: np.ndarray  # the equilibration S: 1 / sqrt of the free stiffness's diagonal
    condition: float = 1.0  # 2-norm condition number of S K_ff S [-]

    @cached_property
    def index(self) -> dict[tuple[str, str], int]:
        return {(u.node, u.direction): i for i, u in enumerate(self.unknowns)}

    @cached_property
    def free(self) -> np.ndarray:
        return np.flatnonzero(~self.restrained)

    def unknown(self, node: str, direction: str) -> int | None:
        """Index of an unknown, or None (a rotation that is not an unknown)."""
        return self.index.get((node, direction))

    def weights(self, extraction: np.ndarray) -> np.ndarray:
        """h = K_ff^-1 g on the free unknowns, zero elsewhere, for one or many columns g."""
        extraction = np.asarray(extraction, dtype=float)
        single = extraction.ndim == 1
        columns = extraction[:, None] if single else extraction
        result = np.zeros_like(columns)
        if self.free.size:
            right = columns[self.free]
            solution = self._solved(right)
            # iterative refinement with residuals in extended precision (Wilkinson): each step
            # gains the digits the condition number took, until the correction is round-off
            held = self.stiffness[np.ix_(self.free, self.free)].astype(np.longdouble)
            for _ in range(REFINEMENT_STEPS):
                residual = (right.astype(np.longdouble)
                            - held @ solution.astype(np.longdouble)).astype(float)
                correction = self._solved(residual)
                solution = solution + correction
                if np.abs(correction).max() <= _EPS * np.abs(solution).max():
                    break
            result[self.free] = solution
        return result[:, 0] if single else result

    def _solved(self, right: np.ndarray) -> np.ndarray:
        """K_ff^-1 right through the equilibrated factor: K_ff = S^-1 (S K_ff S) S^-1."""
        kind, factor = self._factor
        solve = scipy.linalg.cho_solve if kind == "cholesky" else scipy.linalg.lu_solve
        scaled = solve(factor, self._scale[:, None] * right, check_finite=False)
        return self._scale[:, None] * scaled  # type: ignore[no-any-return]

    @cached_property
    def static_indeterminacy(self) -> int:
        """Degree of static indeterminacy: force unknowns less equilibrium equations."""
        member_forces = sum(
            3 - frame.law.release_start - frame.law.release_end - frame.law.sliding_end
            for frame in self.frames.values()
        )
        reactions = int(self.restrained.sum() + (self.springs > 0).sum())
        return member_forces + reactions - len(self.unknowns)


def analyse(model: Model) -> Structure:
    """Number the unknowns, assemble the stiffness, equilibrate and factorise it.

    Raises:
        MechanismError: the structure can move without straining; the message names the nodes and
            the direction that can move.
    """
    rotating = _nodes_with_rotation(model)
    unknowns: list[Unknown] = []
    for node in model.nodes:
        for direction in DIRECTIONS:
            if direction != "rz" or node.name in rotating:
                unknowns.append(Unknown(node.name, direction))
    index = {(u.node, u.direction): i for i, u in enumerate(unknowns)}
    restrained = np.zeros(len(unknowns), dtype=bool)
    springs = np.zeros(len(unknowns))
    for i, unknown in enumerate(unknowns):
        restraint = model.node(unknown.node).support.restraint(unknown.direction)
        if restraint == "fixed":
            restrained[i] = True
        elif isinstance(restraint, float):
            springs[i] = restraint

    frames = {}
    for member in model.members:
        cosine, sine = model.direction_of(member.name)
        law = member_law(member, model.length_of(member.name))
        dofs = tuple(index.get((node, d), -1) for node in (member.start, member.end)
                     for d in DIRECTIONS)
        frames[member.name] = MemberFrame(member.name, law, cosine, sine, dofs)
    stiffness = _assembled(frames.values(), springs)

    free = np.flatnonzero(~restrained)
    _check_stable(model, unknowns, _kinematic(frames.values(), springs, unknowns), free)
    held = stiffness[np.ix_(free, free)] if free.size else np.eye(1)
    scale = 1.0 / np.sqrt(np.diag(held))
    equilibrated = held * scale[:, None] * scale[None, :]
    return Structure(model, tuple(unknowns), restrained, springs, frames, stiffness,
                     _factorised(equilibrated), scale, _condition(equilibrated))


def _assembled(frames: Iterable[MemberFrame], springs: np.ndarray) -> np.ndarray:
    """The stiffness over every unknown: members' global stiffness and the springs."""
    stiffness = np.diag(springs)
    for frame in frames:
        used = [i for i, dof in enumerate(frame.dofs) if dof >= 0]
        targets = [frame.dofs[i] for i in used]
        stiffness[np.ix_(targets, targets)] += frame.global_stiffness[np.ix_(used, used)]
    return stiffness


def _kinematic(frames: Iterable[MemberFrame], springs: np.ndarray,
               unknowns: list[Unknown]) -> np.ndarray:
    """The stiffness of the same structure with every member's stiffness normalised.

    Whether a structure can move without straining depends on its geometry, releases and
    restraints only, never on how stiff its parts are (every member and spring of positive
    stiffness strains under any motion that is not one of its own rigid-body modes). Each member
    here has EA/L = 1 and 12 EI/L^3 = 1, each spring 1 (a rotational one L^2, L the members'
    median length), so no contrast of stiffness can hide a mechanism or fake one.
    """
    frames = list(frames)
    lengths = np.array([f.law.length for f in frames]) if frames else np.ones(1)
    typical = float(np.median(lengths))
    normalised = np.where(springs > 0, 1.0, 0.0)
    for i, unknown in enumerate(unknowns):
        if unknown.direction == "rz":
            normalised[i] *= typical**2
    return _assembled((replace(f, law=MemberLaw(f.law.length, f.law.length, f.law.length**3 / 12,
                                                f.law.release_start, f.law.release_end,
                                                f.law.sliding_end))
                       for f in frames), normalised)


def member_law(member: Member, length: float) -> MemberLaw | VariableMemberLaw:
    """The law of a member of ``length`` [length]: closed-form for a prismatic member, from its
    flexibility integrals for one of varying section."""
    if member.variation is None or not member.varies:
        return MemberLaw(length, member.EA, member.EI, member.release_start, member.release_end,
                         member.sliding_end)
    section = section_of(member.variation, length, member.EI, member.EA)
    return VariableMemberLaw(section, member.release_start, member.release_end,
                             member.sliding_end)


def _factorised(equilibrated: np.ndarray) -> tuple[str, Any]:
    """Cholesky factor of the equilibrated stiffness; LU with pivoting where round-off of an
    extreme contrast leaves it not quite positive definite (the structure is no mechanism)."""
    try:
        return "cholesky", scipy.linalg.cho_factor(equilibrated, lower=True, check_finite=False)
    except np.linalg.LinAlgError:
        return "lu", scipy.linalg.lu_factor(equilibrated, check_finite=False)


def _condition(equilibrated: np.ndarray) -> float:
    """2-norm condition number of the equilibrated stiffness [-] (infinite if round-off makes
    its smallest eigenvalue vanish)."""
    values = np.linalg.eigvalsh(equilibrated)
    return float(values[-1] / values[0]) if values[0] > 0 else float("inf")


def _nodes_with_rotation(model: Model) -> set[str]:
    """Nodes where at least one member end is continuous (not released)."""
    rotating = set()
    for member in model.members:
        if not member.release_start:
            rotating.add(member.start)
        if not member.release_end:
            rotating.add(member.end)
    return rotating


def _check_stable(model: Model, unknowns: list[Unknown], kinematic: np.ndarray,
                  free: np.ndarray) -> None:
    """Raise when the structure has a mode that strains nothing.

    Judged on the kinematic matrix (:func:`_kinematic`) restricted to the free unknowns and
    scaled to a unit diagonal: its eigenvalues lie between 0 and its order, and one below
    :data:`MECHANISM_TOLERANCE` of the largest is a mode of zero strain energy.
    """
    if free.size == 0:
        return
    held = kinematic[np.ix_(free, free)]
    diagonal = np.diag(held).copy()
    loose = np.flatnonzero(~(diagonal > 0))
    if loose.size:
        raise _mechanism(model, [unknowns[free[loose[0]]]])
    scale = 1.0 / np.sqrt(diagonal)
    values, vectors = np.linalg.eigh(held * scale[:, None] * scale[None, :])
    if values[0] > MECHANISM_TOLERANCE * values[-1]:
        return
    mode = vectors[:, 0] * scale
    # compare translations with translations: rotations are per unit length
    mode = mode / np.abs(mode).max()
    moving = [unknowns[free[i]] for i in np.flatnonzero(np.abs(mode) > 0.5 * np.abs(mode).max())]
    raise _mechanism(model, moving)


def _mechanism(model: Model, moving: list[Unknown]) -> MechanismError:
    nodes = sorted({u.node for u in moving}, key=[n.name for n in model.nodes].index)
    directions = sorted({u.direction for u in moving}, key=DIRECTIONS.index)
    how = " and ".join(DIRECTION_WORDS[d] for d in directions)
    shown = ", ".join(nodes[:6]) + (" ..." if len(nodes) > 6 else "")
    truss = all(member.is_bar for member in model.members)
    if truss:
        return MechanismError(
            f"the truss is unstable: node(s) {shown} can move {how} without straining any bar",
            source=model.source, item="structure",
            fix="add a bar or a support so that every panel is triangulated and the truss is held",
        )
    if model.form == "beam" and directions == ["ux"]:
        return MechanismError(
            "the beam can slide horizontally: no support holds it along its axis",
            source=model.source, item="supports",
            fix="make one support pinned (or fixed)",
        )
    if model.form == "beam":
        return MechanismError(
            f"the beam is a mechanism: the part at {shown} can move {how} without bending",
            source=model.source, item="supports",
            fix="add a support there (or make an end support fixed), or remove a hinge",
        )
    return MechanismError(
        f"the structure is a mechanism: node(s) {shown} can move {how} without straining it",
        source=model.source, item="structure",
        fix="add a support or a member there, or remove a moment release",
    )
