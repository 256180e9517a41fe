"""A train of concentrated loads over a truss with floor beams, end to end: model, influence line
of the diagonal through the stringers, exact placement.

Source: T. G. Hicks, *Handbook of Civil Engineering Calculations*, 2nd ed., McGraw-Hill, 2007,
pp. 1.72-1.73 (confirmed): span 200 ft of 8 panels of 25 ft, depth 30 ft; loads 5, 12, 18 and
15 kip at 0, 6, 16 and 22 ft. Published: the largest shear in panel de is 23.0 kip (load 4 at e,
moving left to right) and the diagonal De carries 23.0 x 1.30 = 29.9 kip. Computed exactly (a
brute-force search over positions in both directions, and the panel-shear line of
tests/validation/test_truss_panel_hicks.py): 22.95 kip and 29.87 kip; the published figures are
those rounded.
"""

from __future__ import annotations

import math

import pytest

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.design.governing import governing
from tests.frames import pratt_truss
from vehicles.loadmodel import LoadCase, LoadModel
from vehicles.train import Axle, Train

TRAIN = LoadModel("Hicks train", "four concentrated loads", "kip-ft", (LoadCase(
    "train", Train("loads 1-4", (Axle(5.0), Axle(12.0, 6.0), Axle(18.0, 10.0),
                                 Axle(15.0, 6.0)))),))
PANEL, DEPTH = 25.0, 30.0
COSECANT = math.hypot(PANEL, DEPTH) / DEPTH


def test_largest_force_in_the_diagonal_of_panel_de() -> None:
    analysis = analyse_model(pratt_truss(8, PANEL, DEPTH))
    result = governing(analysis, Response("axial", "U3L4@5.0"), [TRAIN])
    assert result.governing.max is not None
    shear = result.governing.max.value / COSECANT
    assert shear == pytest.approx(22.95, abs=0.005)  # computed; Hicks prints 23.0
    assert result.governing.max.value == pytest.approx(29.87, abs=0.01)  # Hicks: 29.9
    assert round(result.governing.max.value, 1) == 29.9
