"""The AASHTO LRFD deflection loading and the deflection check that uses it.

Source: AASHTO LRFD Bridge Design Specifications 3.6.1.3.2 (recalled from memory, unconfirmed):
the live-load deflection is the larger of the design truck alone and 25 % of the design truck
taken with the design lane load; design truck 72 kip (8 + 32 + 32) and lane 0.64 kip/ft
(AASHTO LRFD Bridge Design Specifications, Fig. 3.6.1.2.2-1 and 3.6.1.2.4: confirmed).
Closed form for the check: the midspan deflection of a simple span under one load P at midspan
is PL^3/(48EI) (any beam table, e.g. AISC Manual "simple beam, concentrated load at center").
"""

from __future__ import annotations

import pytest

from influence.analysis.lines import analyse_model
from influence.design.envelope import envelope
from influence.model.basis import DesignBasis, LiveLoadSettings
from influence.model.beamform import simple_beam
from vehicles.library.catalog import get_model
from vehicles.loadmodel import LoadCase, LoadModel
from vehicles.train import Axle, Train


def test_deflection_loading_cases() -> None:
    model = get_model("HL-93 deflection")
    alone, quarter = model.cases
    assert alone.train is not None and quarter.train is not None
    assert alone.train.total_load() == 72.0 and alone.lane == 0.0
    assert quarter.train.total_load() == pytest.approx(0.25 * 72.0) and quarter.lane == 0.64
    assert alone.axle_allowance == quarter.axle_allowance == 0.33
    assert quarter.lane_allowance == 0.0


def test_check_uses_its_own_load_models() -> None:
    L, EI, P = 20.0, 4.0e5, 100.0
    analysis = analyse_model(simple_beam(L, EI))
    one_axle = LoadModel("one axle", "a single axle", "kN-m",
                         (LoadCase("axle", Train("P", (Axle(P),))),))
    heavy = LoadModel("two axles", "for the envelope", "kN-m",
                      (LoadCase("pair", Train("pair", (Axle(300.0), Axle(300.0, 3.0)))),))
    basis = DesignBasis(live=LiveLoadSettings(deflection_limit=800))
    result = envelope(analysis, [heavy], basis, kinds=("deflection",),
                      deflection_models=[one_axle])
    (check,) = result.deflection_checks
    assert check.placement is not None and check.placement.model == "one axle"
    assert check.deflection == pytest.approx(P * L**3 / (48 * EI), rel=1e-6)
    assert check.limit == pytest.approx(L / 800)
