"""Two equal continuous spans against the handbook formulas.

Source: piping-designer.com, "Two Span Continuous Beam - Equal Spans, Concentrated Load at Any
Point" (reproduces the AISC Manual beam-diagram case; confirmed there, ../shared/REFERENCES.md 1):
load at a in span AB, b = L - a:
    R_A = b[4L^2 - a(L + a)]/(4L^3),  R_B = a[2L^2 + b(L + a)]/(2L^3),  R_C = -ab(L + a)/(4L^3),
    M_B = -ab(L + a)/(4L^2); the extreme M_B ordinate is -L/(6 sqrt 3) at a = L/sqrt 3 (computed).
"""

from __future__ import annotations

import math

import numpy as np

from tests.beams import beam_line, close

L = 15.0
SPANS = [L, L]
SUPPORTS = ["pinned", "roller", "roller"]
a = np.linspace(0.0, L, 31)
b = L - a


def test_reactions() -> None:
    expected = {
        "S1": b * (4 * L**2 - a * (L + a)) / (4 * L**3),
        "S2": a * (2 * L**2 + b * (L + a)) / (2 * L**3),
        "S3": -a * b * (L + a) / (4 * L**3),
    }
    for support, values in expected.items():
        assert close(beam_line(SPANS, SUPPORTS, "reaction", support).values(a), values)


def test_moment_over_the_middle_support() -> None:
    line = beam_line(SPANS, SUPPORTS, "moment", "S2")
    assert close(line.values(a), -a * b * (L + a) / (4 * L**2), scale=L)
    smallest = line.extremes().smallest
    assert close(smallest.value, -L / (6 * math.sqrt(3)))
    assert close(min(smallest.at, 2 * L - smallest.at), L / math.sqrt(3))
