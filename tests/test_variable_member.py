"""The member law of a varying section: prismatic limit, reciprocity, equilibrium, stepped members.

- Prismatic limit: a section of constant depth must reproduce influence.analysis.element.MemberLaw
  (itself checked against McGuire, Gallagher and Ziemian in tests/validation).
- Maxwell-Betti reciprocal theorem (J. C. Maxwell, 1864; E. Betti, 1872): the stiffness matrix
  is symmetric, and in the fixed member the deflection at s for a unit load at a equals the
  deflection at a for a unit load at s.
- Statics (common practice): the fixed-end forces and the load are in equilibrium.
- A stepped member (prismatic pieces) must equal the chain of prismatic MemberLaw elements with
  the inner nodes condensed out (static condensation, McGuire, Gallagher and Ziemian, "Matrix
  Structural Analysis", 2nd ed., 2000, sec. 7.2).
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from influence.analysis.element import FIELDS, MemberLaw
from influence.analysis.frame_constants import frame_constants, point_load_coefficients
from influence.analysis.haunch import DepthProfile, Haunch, VariableSection, haunched_section
from influence.analysis.singularity import evaluate
from influence.analysis.variable_member import VariableMemberLaw

PRISMATIC_TOLERANCE = 1e-11
"""Relative [-] agreement with MemberLaw, against the size of each quantity along the member."""

RECIPROCITY_TOLERANCE = 1e-11
EQUILIBRIUM_TOLERANCE = 1e-11
CHAIN_TOLERANCE = 1e-10
TWO_WAYS_TOLERANCE = 1e-12


def haunched(L: float = 10.0) -> VariableSection:
    return haunched_section(L, 2.0e4, 5.0e5, start=Haunch("parabolic", 1.5, length_fraction=0.3),
                            end=Haunch("straight", 0.6, length_fraction=0.2))


@settings(max_examples=25, deadline=None)
@given(L=st.floats(2.0, 40.0), EI=st.floats(1e2, 1e7), EA=st.floats(1e3, 1e8),
       releases=st.sampled_from([(False, False), (True, False), (False, True)]),
       sliding=st.booleans(), s_fraction=st.floats(0.0, 1.0),
       angle=st.floats(0.0, 2 * np.pi))
def test_prismatic_section_reproduces_member_law(L, EI, EA, releases, sliding,  # type: ignore[no-untyped-def]
                                                 s_fraction, angle) -> None:
    new = VariableMemberLaw(haunched_section(L, EI, EA), *releases, sliding)
    old = MemberLaw(L, EA, EI, *releases, sliding)
    scale = np.abs(old.stiffness).max()
    assert np.allclose(new.stiffness, old.stiffness, rtol=0, atol=PRISMATIC_TOLERANCE * scale)
    px, pt = np.cos(angle), np.sin(angle)
    a = np.linspace(0.0, L, 13)
    expected = np.array([evaluate(row, a) for row in old.end_forces_from_load(px, pt)])
    got = new.end_forces_at(a, px, pt)
    assert np.allclose(got, expected, rtol=0, atol=PRISMATIC_TOLERANCE * max(1.0, L))
    s = s_fraction * L
    for quantity in FIELDS:
        mine, theirs = new.field(quantity, s, px, pt), old.field(quantity, s, px, pt)
        for form, poly in ((mine.behind, theirs.behind), (mine.ahead, theirs.ahead)):
            want = evaluate(poly, a)
            size = max(np.abs(want).max(), np.abs(np.array([evaluate(p, a) for p in (
                theirs.behind, theirs.ahead)])).max(), 1e-300)
            assert np.allclose(form.values(a), want, rtol=0, atol=PRISMATIC_TOLERANCE * size)


@pytest.mark.parametrize("releases", [(False, False), (True, False), (False, True)])
def test_stiffness_is_symmetric(releases: tuple[bool, bool]) -> None:
    k = VariableMemberLaw(haunched(), *releases).stiffness
    assert np.allclose(k, k.T, rtol=0, atol=RECIPROCITY_TOLERANCE * np.abs(k).max())


def test_stiffness_and_carry_over_match_the_frame_constants() -> None:
    section = haunched()
    k = VariableMemberLaw(section).stiffness
    constants = frame_constants(section)
    unit = section.EI_reference / section.length
    assert k[2, 2] / unit == pytest.approx(constants.stiffness_start, rel=RECIPROCITY_TOLERANCE)
    assert k[5, 5] / unit == pytest.approx(constants.stiffness_end, rel=RECIPROCITY_TOLERANCE)
    assert k[5, 2] / k[2, 2] == pytest.approx(constants.carry_over_start, rel=RECIPROCITY_TOLERANCE)
    assert k[2, 5] / k[5, 5] == pytest.approx(constants.carry_over_end, rel=RECIPROCITY_TOLERANCE)


@settings(max_examples=20, deadline=None)
@given(a=st.floats(0.0, 10.0), s=st.floats(0.0, 10.0),
       releases=st.sampled_from([(False, False), (True, False), (False, True)]))
def test_deflections_are_reciprocal(a: float, s: float, releases: tuple[bool, bool]) -> None:
    law = VariableMemberLaw(haunched(), *releases)
    at_s = law.field("transverse_displacement", s, 0.0, -1.0).values([a])[0]
    at_a = law.field("transverse_displacement", a, 0.0, -1.0).values([s])[0]
    size = abs(law.field("transverse_displacement", 5.0, 0.0, -1.0).values([5.0])[0])
    assert at_s == pytest.approx(at_a, abs=RECIPROCITY_TOLERANCE * size)


@pytest.mark.parametrize("releases", [(False, False), (True, False), (False, True)])
def test_fixed_end_forces_balance_the_load(releases: tuple[bool, bool]) -> None:
    section = haunched()
    L = section.length
    law = VariableMemberLaw(section, *releases)
    px, pt = 0.6, -0.8
    a = np.linspace(0.0, L, 21)
    f = law.end_forces_at(a, px, pt)
    assert np.allclose(f[0] + f[3] + px, 0.0, atol=EQUILIBRIUM_TOLERANCE)
    assert np.allclose(f[1] + f[4] + pt, 0.0, atol=EQUILIBRIUM_TOLERANCE)
    # moments about the start node
    assert np.allclose(f[2] + f[5] + L * f[4] + a * pt, 0.0, atol=EQUILIBRIUM_TOLERANCE * L)


def test_uniform_load_two_ways() -> None:
    """The point-load forms integrated over a (the member law) against the flexibility solution
    with the uniform load's own simple-span moment (the frame constants): computed two ways."""
    section = haunched()
    L = section.length
    forces = VariableMemberLaw(section).end_forces_from_uniform_load(0.0, -1.0)
    constants = frame_constants(section)
    assert forces[2] == pytest.approx(constants.uniform_start * L**2, rel=TWO_WAYS_TOLERANCE)
    assert -forces[5] == pytest.approx(constants.uniform_end * L**2, rel=TWO_WAYS_TOLERANCE)
    assert forces[1] + forces[4] == pytest.approx(L, rel=TWO_WAYS_TOLERANCE)


def test_point_load_two_ways() -> None:
    section = haunched()
    L = section.length
    b = np.array([0.0, 0.1, 0.35, 0.5, 0.8, 1.0])
    m_AB, m_BA = point_load_coefficients(section, b)
    forces = VariableMemberLaw(section).end_forces_at(b * L, 0.0, -1.0)
    assert np.allclose(forces[2] / L, m_AB, rtol=0, atol=TWO_WAYS_TOLERANCE)
    assert np.allclose(-forces[5] / L, m_BA, rtol=0, atol=TWO_WAYS_TOLERANCE)


def condensed_chain(cuts: np.ndarray, EI: np.ndarray, EA: np.ndarray) -> np.ndarray:
    """6x6 stiffness of prismatic MemberLaw pieces in a row, inner nodes condensed out."""
    count = len(EI)
    size = 3 * (count + 1)
    K = np.zeros((size, size))
    for i in range(count):
        k = MemberLaw(float(cuts[i + 1] - cuts[i]), float(EA[i]), float(EI[i])).stiffness
        K[3 * i: 3 * i + 6, 3 * i: 3 * i + 6] += k
    outer = [0, 1, 2, size - 3, size - 2, size - 1]
    inner = [i for i in range(size) if i not in outer]
    Koo, Koi = K[np.ix_(outer, outer)], K[np.ix_(outer, inner)]
    Kii = K[np.ix_(inner, inner)]
    return np.asarray(Koo - Koi @ np.linalg.solve(Kii, Koi.T))


def test_stepped_member_equals_the_condensed_chain() -> None:
    cuts = np.array([0.0, 1.5, 4.0, 7.0, 10.0])
    depths = np.array([1.8, 1.3, 1.0, 1.4])
    profile = DepthProfile(tuple(cuts), tuple((float(d), 0.0, 0.0) for d in depths))
    section = VariableSection(profile, 3.0e3, 4.0e4)
    chain = condensed_chain(cuts, 3.0e3 * depths**3, 4.0e4 * depths)
    k = VariableMemberLaw(section).stiffness
    assert np.allclose(k, chain, rtol=0, atol=CHAIN_TOLERANCE * np.abs(chain).max())
