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

Reference: W. McGuire, R. H. Gallagher and R. D. Ziemian, "Matrix Structural Analysis", 2nd ed.,
2000, ch. 4 (direct stiffness method) and 7.2 (member end releases by condensation).
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property

import numpy as np
import scipy.linalg

from influence.analysis.element import MemberLaw, rotation_matrix
from influence.errors import MechanismError
from influence.model.structure import DIRECTION_WORDS, DIRECTIONS, Model

MECHANISM_TOLERANCE = 1e-10
"""Smallest eigenvalue [-] of the diagonally scaled free stiffness taken as zero (a mechanism)."""


@dataclass(frozen=True)
class Unknown:
    """One displacement unknown: a node and a direction (ux, uy or rz)."""

    node: str
    direction: str


@dataclass(frozen=True)
class MemberFrame:
    """A member's law, orientation and where its six end displacements sit among the unknowns."""

    name: str
    law: MemberLaw
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

    @cached_property
    def equivalent_loads(self) -> np.ndarray:
        """Global equivalent nodal loads (6 x TERMS polynomials in the member position a)."""
        axial, transverse = self.unit_load_components
        fixed_end = self.law.end_forces_from_load(axial, transverse)
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
    _factor: tuple[np.ndarray, np.ndarray]

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
            result[self.free] = scipy.linalg.lu_solve(self._factor, columns[self.free])
        return result[:, 0] if single else result

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
    """Number the unknowns, assemble the stiffness and factorise it.

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
    stiffness = np.diag(springs)
    for member in model.members:
        cosine, sine = model.direction_of(member.name)
        law = MemberLaw(model.length_of(member.name), member.EA, member.EI,
                        member.release_start, member.release_end, member.sliding_end)
        dofs = tuple(index.get((node, d), -1) for node in (member.start, member.end)
                     for d in DIRECTIONS)
        frame = MemberFrame(member.name, law, cosine, sine, dofs)
        frames[member.name] = frame
        used = [i for i, dof in enumerate(dofs) if dof >= 0]
        targets = [dofs[i] for i in used]
        stiffness[np.ix_(targets, targets)] += frame.global_stiffness[np.ix_(used, used)]

    free = np.flatnonzero(~restrained)
    _check_stable(model, unknowns, stiffness, free)
    held = stiffness[np.ix_(free, free)] if free.size else np.eye(1)
    factor = scipy.linalg.lu_factor(held, check_finite=False)
    return Structure(model, tuple(unknowns), restrained, springs, frames, stiffness, factor)


def _nodes_with_rotation(model: Model) -> set[str]:
    """Nodes where at least one member end is continuous (not released)."""
    rotating = set()
    for member in model.members:
        if not member.release_start:
            rotating.add(member.start)
        if not member.release_end:
            rotating.add(member.end)
    return rotating


def _check_stable(model: Model, unknowns: list[Unknown], stiffness: np.ndarray,
                  free: np.ndarray) -> None:
    if free.size == 0:
        return
    free_stiffness = stiffness[np.ix_(free, free)]
    diagonal = np.diag(free_stiffness).copy()
    loose = np.flatnonzero(diagonal <= 0)
    if loose.size:
        mode = np.zeros(len(free))
        mode[loose[0]] = 1.0
    else:
        scale = 1.0 / np.sqrt(diagonal)
        scaled = free_stiffness * scale[:, None] * scale[None, :]
        values, vectors = np.linalg.eigh(scaled)
        if values[0] > MECHANISM_TOLERANCE * max(values[-1], 1.0):
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
