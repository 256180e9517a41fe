"""Truss bar influence lines under stringer (indirect) loading against the method of sections.

References:
- Method of sections (textbook statics, e.g. R. C. Hibbeler, "Structural Analysis", ch. 3 and 6,
  influence lines for trusses): a chord's force is the moment of the simple span about the
  opposite panel point divided by the truss depth; a diagonal's vertical component carries the
  panel shear. With the load delivered at the panel points by stringers, each line equals the
  simple-span line at the panel points and is straight between them.
- Geometry and the panel-shear line: T. G. Hicks, "Handbook of Civil Engineering Calculations",
  2nd ed., pp. 1.72-1.73 (confirmed there): span 200 ft, 8 panels of 25 ft, depth 30 ft; the
  shear in panel de (75 to 100 ft) is -x/200 left of d, (200 - x)/200 right of e, straight
  between, and the diagonal force is the panel shear times csc(theta) = 1.3017 (computed).
"""

from __future__ import annotations

import math

import numpy as np

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from tests.beams import close
from tests.frames import pratt_truss

SPAN, PANELS, DEPTH = 200.0, 8, 30.0
PANEL = SPAN / PANELS
LOADS = np.linspace(0.0, SPAN, 161)  # every 1.25 ft: panel points and points between them


def simple_moment_line(x: np.ndarray, c: float) -> np.ndarray:
    return np.where(x <= c, x * (SPAN - c) / SPAN, c * (SPAN - x) / SPAN)


def panel_shear_line(x: np.ndarray, left: float, right: float) -> np.ndarray:
    at_left, at_right = -left / SPAN, (SPAN - right) / SPAN
    between = at_left + (x - left) * (at_right - at_left) / (right - left)
    return np.where(x <= left, -x / SPAN, np.where(x >= right, (SPAN - x) / SPAN, between))


analysis = analyse_model(pratt_truss(PANELS, PANEL, DEPTH))


def axial(member: str) -> np.ndarray:
    return analysis.line(Response("axial", f"{member}@1.0")).values(LOADS)


def test_bottom_chord_is_the_moment_line_over_depth() -> None:
    # L2L3 is cut with the top chord and the diagonal U2L3, which meet at U2 (x = 2 panels)
    expected = simple_moment_line(LOADS, 2 * PANEL) / DEPTH
    assert close(axial("L2L3"), expected)


def test_top_chord_is_the_moment_line_over_depth_in_compression() -> None:
    # U2U3 is cut with L2L3 and U2L3, which meet at L3 (x = 3 panels)
    expected = -simple_moment_line(LOADS, 3 * PANEL) / DEPTH
    assert close(axial("U2U3"), expected)


def test_diagonal_carries_the_panel_shear_hicks() -> None:
    # panel de of Hicks is 75..100 ft: panel points L3 and L4; its diagonal here is U3L4
    cosecant = math.hypot(PANEL, DEPTH) / DEPTH
    assert abs(cosecant - 1.3017) < 5e-5  # Hicks: csc(theta) = 1.30
    expected = panel_shear_line(LOADS, 3 * PANEL, 4 * PANEL) * cosecant
    assert close(axial("U3L4"), expected)


def test_bar_lines_are_straight_between_panel_points() -> None:
    line = analysis.line(Response("axial", "U3L4@2.0"))
    assert np.all(np.abs(line.coefficients[:, 2:]) == 0.0)
    assert set(np.round(line.breakpoints, 9)) <= {k * PANEL for k in range(PANELS + 1)}


def test_truss_nodes_have_no_rotation_unknown() -> None:
    rotating = {u.node for u in analysis.structure.unknowns if u.direction == "rz"}
    assert rotating == set()
    assert analysis.structure.static_indeterminacy == 0
