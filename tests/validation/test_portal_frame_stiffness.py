"""A portal frame with inclined legs against an independent direct-stiffness solution.

Reference: W. McGuire, R. H. Gallagher and R. D. Ziemian, "Matrix Structural Analysis", 2nd ed.
(2000): the textbook 6x6 frame element stiffness (eq. 4.34) and its rotation to global axes
(eq. 5.8), with the point load entered as the classical fixed-end forces of a beam fixed at both
ends, V = Pb^2(3a + b)/L^3, M = Pab^2/L^2 (AISC Manual beam diagrams, "beam fixed at both ends,
concentrated load at any point"; recalled from memory). The code below is written independently
of the project's singularity-function derivation: one stiffness assembly and solve per load
position, as a general frame program does it.
"""

from __future__ import annotations

import numpy as np
import pytest

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from tests.beams import close
from tests.frames import portal_frame

MODEL = portal_frame("fixed")
NODES = {n.name: i for i, n in enumerate(MODEL.nodes)}


def element_stiffness(EA: float, EI: float, L: float) -> np.ndarray:
    a, b, c, d = EA / L, 12 * EI / L**3, 6 * EI / L**2, 4 * EI / L
    return np.array([
        [a, 0, 0, -a, 0, 0],
        [0, b, c, 0, -b, c],
        [0, c, d, 0, -c, d / 2],
        [-a, 0, 0, a, 0, 0],
        [0, -b, -c, 0, b, -c],
        [0, c, d / 2, 0, -c, d],
    ])


def rotation(cosine: float, sine: float) -> np.ndarray:
    r = np.array([[cosine, sine, 0], [-sine, cosine, 0], [0, 0, 1]])
    return np.kron(np.eye(2), r)


def solve_for_load(member_name: str, a: float) -> dict[str, np.ndarray]:
    """Member end forces (local) of every member for a unit downward load on a deck member."""
    size = 3 * len(MODEL.nodes)
    K = np.zeros((size, size))
    F = np.zeros(size)
    parts = {}
    for member in MODEL.members:
        start, end = MODEL.node(member.start), MODEL.node(member.end)
        L = float(np.hypot(end.x - start.x, end.y - start.y))
        T = rotation((end.x - start.x) / L, (end.y - start.y) / L)
        k = element_stiffness(member.EA, member.EI, L)
        dofs = [3 * NODES[member.start] + i for i in range(3)] + \
               [3 * NODES[member.end] + i for i in range(3)]
        K[np.ix_(dofs, dofs)] += T.T @ k @ T
        fixed_end = np.zeros(6)
        if member.name == member_name:  # deck members are horizontal: local y' is global y
            b = L - a
            fixed_end = np.array([0, b**2 * (3 * a + b) / L**3, a * b**2 / L**2,
                                  0, a**2 * (a + 3 * b) / L**3, -(a**2) * b / L**2])
            F[dofs] -= T.T @ fixed_end
        parts[member.name] = (dofs, T, k, fixed_end)
    free = [i for i in range(size) if i // 3 not in (NODES["WB"], NODES["EB"])]
    D = np.zeros(size)
    D[free] = np.linalg.solve(K[np.ix_(free, free)], F[free])
    return {name: k @ T @ D[dofs] + fixed_end for name, (dofs, T, k, fixed_end) in parts.items()}


analysis = analyse_model(MODEL)
LOAD_POSITIONS = [("D1", 2.0), ("D1", 6.5), ("D2", 1.0), ("D2", 7.25)]


def chainage(member: str, a: float) -> float:
    return a if member == "D1" else 9.0 + a


@pytest.mark.parametrize(("member", "a"), LOAD_POSITIONS)
def test_base_reactions(member: str, a: float) -> None:
    forces = solve_for_load(member, a)
    c = chainage(member, a)
    # the west leg starts at the west base: reaction = force of the base node on the leg, global
    T = rotation(3 / 5, 4 / 5)
    west = T.T @ forces["WL"]
    for component, value in (("horizontal", west[0]), ("vertical", west[1]),
                             ("moment", west[2])):
        line = analysis.line(Response("reaction", "WB", component=component))
        assert close(line.values([c]), [value]), component


@pytest.mark.parametrize(("member", "a"), LOAD_POSITIONS)
def test_moments_and_axial_forces(member: str, a: float) -> None:
    forces = solve_for_load(member, a)
    c = chainage(member, a)
    # sagging moment at s from a member's start: -m_start + V_start * s
    leg = forces["WL"]
    assert close(analysis.line(Response("moment", "WL@2.5")).values([c]),
                 [-leg[2] + leg[1] * 2.5], scale=10.0)
    assert close(analysis.line(Response("axial", "WL@1.0")).values([c]), [-leg[0]])
    knee = forces["D1"]
    assert close(analysis.line(Response("moment", "0")).values([c]), [-knee[2]], scale=10.0)
    middle = forces["D2"]
    assert close(analysis.line(Response("moment", "M", side="right")).values([c]),
                 [-middle[2]], scale=10.0)


def test_sway_of_the_knee_is_antisymmetric() -> None:
    # the frame is symmetric: a load at c sways the knee as much as a load at 18 - c, opposite way
    line = analysis.line(Response("deflection", "WK", component="horizontal"))
    c = np.array([1.0, 4.0, 7.5])
    assert close(line.values(c), -analysis.line(
        Response("deflection", "EK", component="horizontal")).values(18.0 - c), scale=1e-6)
