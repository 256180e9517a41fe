"""Influence lines of statically determinate and simple indeterminate beams against closed forms.

Sources (listed in full in docs/references.md):
- Simple beam R_A, V(c), M(c): statics of the simple beam, as R. C. Hibbeler, *Structural
  Analysis*, ch. 6 (influence lines for statically determinate structures) derives them;
  written here as closed forms (computed).
- Overhang reaction R_B = (L + e)/L and R_A = -e/L at the tip (moments about the other support;
  the same chapter of Hibbeler): 16 m span + 4 m overhang gives 1.25 and -0.25 (computed).
- Cantilever R_A = 1, M_A = -a, V(c) = 1 beyond c: common practice.
- Propped cantilever R_B = a^2(3L - a)/(2L^3), M_A = -ab(2L - a)/(2L^2), largest |M_A| =
  L/(3 sqrt 3) at a = L(1 - 1/sqrt 3): AISC Manual beam diagrams, "beam fixed at one end,
  supported at other, concentrated load at any point" (case number recalled from memory).
- Fixed-fixed end moment -ab^2/L^2 and reaction b^2(3a + b)/L^3: AISC Manual beam diagrams,
  "beam fixed at both ends, concentrated load at any point" (recalled from memory; the formula is
  the textbook one, e.g. Hibbeler, Structural Analysis, table of fixed-end moments).
- Midspan deflection line of a simple beam a(3L^2 - 4a^2)/(48EI) for a <= L/2: T. G. Hicks,
  Handbook of Civil Engineering Calculations, 2nd ed., p. 1.77 (confirmed there).
"""

from __future__ import annotations

import math

import numpy as np
import pytest

from tests.beams import beam_line, close

L = 12.0
LOADS = np.linspace(0.0, L, 25)


def test_simple_beam_reaction_is_linear_from_one_to_zero() -> None:
    line = beam_line([L], ["pinned", "roller"], "reaction", "S1")
    assert close(line.values(LOADS), (L - LOADS) / L)


@pytest.mark.parametrize("c", [3.0, 6.0, 8.5])
def test_simple_beam_shear_jumps_by_one_at_the_section(c: float) -> None:
    left = beam_line([L], ["pinned", "roller"], "shear", str(c), side="left")
    expected = np.where(c > LOADS, -LOADS / L, (L - LOADS) / L)
    off_section = c != LOADS
    assert close(left.values(LOADS[off_section]), expected[off_section])
    assert close(left.values([c], side="left"), [-c / L])
    assert close(left.values([c], side="right"), [(L - c) / L])


@pytest.mark.parametrize("c", [3.0, 6.0, 8.5])
def test_simple_beam_moment_peaks_at_the_section(c: float) -> None:
    line = beam_line([L], ["pinned", "roller"], "moment", str(c))
    expected = np.where(c >= LOADS, LOADS * (L - c) / L, c * (L - LOADS) / L)
    assert close(line.values(LOADS), expected, scale=L)
    peak = line.extremes().largest
    assert close(peak.value, c * (L - c) / L) and close(peak.at, c)


def test_simple_beam_midspan_deflection_line_hicks() -> None:
    EI = 3.0e4
    line = beam_line([L], ["pinned", "roller"], "deflection", str(L / 2), EI=EI)
    a = np.linspace(0.0, L / 2, 13)
    expected = a * (3 * L**2 - 4 * a**2) / (48 * EI)
    assert close(line.values(a), expected, scale=L**3 / EI)
    assert close(line.values(L - a), expected, scale=L**3 / EI)


def test_overhang_reaction_at_the_tip() -> None:
    # 16 m span plus a 4 m overhang: R_B(tip) = (L + e)/L = 1.25, R_A(tip) = -e/L = -0.25
    spans, supports = [16.0, 4.0], ["pinned", "roller", "free"]
    tip = 20.0
    assert close(beam_line(spans, supports, "reaction", "S2").values([tip]), [1.25])
    assert close(beam_line(spans, supports, "reaction", "S1").values([tip]), [-0.25])


def test_cantilever_lines() -> None:
    line_r = beam_line([L], ["fixed", "free"], "reaction", "S1")
    line_m = beam_line([L], ["fixed", "free"], "reaction", "S1", component="moment")
    assert close(line_r.values(LOADS), np.ones_like(LOADS))
    # the wall's moment reaction on the beam is counter-clockwise: +a for a load at a
    assert close(line_m.values(LOADS), LOADS, scale=L)
    section = beam_line([L], ["fixed", "free"], "moment", "4")
    assert close(section.values(LOADS), -np.clip(LOADS - 4.0, 0, None), scale=L)


def test_propped_cantilever_closed_forms() -> None:
    a = LOADS
    b = L - a
    prop = beam_line([L], ["fixed", "roller"], "reaction", "S2")
    root = beam_line([L], ["fixed", "roller"], "moment", "0")
    assert close(prop.values(a), a**2 * (3 * L - a) / (2 * L**3))
    assert close(root.values(a), -a * b * (2 * L - a) / (2 * L**2), scale=L)
    smallest = root.extremes().smallest
    assert close(smallest.value, -L / (3 * math.sqrt(3)))
    assert close(smallest.at, L * (1 - 1 / math.sqrt(3)))


def test_fixed_fixed_end_moment_and_reaction() -> None:
    a = LOADS
    b = L - a
    moment = beam_line([L], ["fixed", "fixed"], "moment", "0")
    reaction = beam_line([L], ["fixed", "fixed"], "reaction", "S1")
    assert close(moment.values(a), -a * b**2 / L**2, scale=L)
    assert close(reaction.values(a), b**2 * (3 * a + b) / L**3)


def test_areas_of_the_simple_span_moment_line() -> None:
    # triangle of height c(L - c)/L over the span: area c(L - c)/2
    c = 5.0
    positive, negative = beam_line([L], ["pinned", "roller"], "moment", str(c)).areas()
    assert close(positive, c * (L - c) / 2) and negative == 0.0
