"""Emergency vehicles EV2 and EV3 against the FAST Act weight limits.

References:
- Fixing America's Surface Transportation (FAST) Act, Pub. L. 114-94 (2015), sec. 1410 (section
  number from memory): emergency vehicles on the Interstate up to 24,000 lb on a single steering
  axle, 33,500 lb on a single drive axle, 62,000 lb on a tandem axle and 86,000 lb gross;
  confirmed as reported by J. J. Keller & Associates, "FHWA responds to FAST Act impacts size and
  weight limits", 2 Mar 2016.
- FHWA memorandum, *Load Rating for the FAST Act's Emergency Vehicles*, 3 Nov 2016, and FHWA
  *Questions and Answers*, rev. R01, 16 Mar 2018: the EV2 and EV3 rating vehicles (gaps 15 ft
  and 4 ft, and the 31 + 31 kip split of the tandem: from memory, unconfirmed).
- 23 CFR 658.5, definition of a tandem axle: consecutive axles more than 40 in. and not more than
  96 in. apart, centre to centre (from memory, unconfirmed).
"""

from __future__ import annotations

import pytest

from tests.axles import loads_and_gaps
from vehicles import LoadModel, get_model
from vehicles.train import Span

EXACT = 1e-12
"""Relative tolerance for sums of a few decimal numbers."""

KIP_PER_LB = 1.0e-3
"""1 kip = 1000 lb (common practice)."""

STEERING_AXLE_LB = 24_000.0  # FAST Act, confirmed
SINGLE_DRIVE_AXLE_LB = 33_500.0  # FAST Act, confirmed
TANDEM_AXLE_LB = 62_000.0  # FAST Act, confirmed
GROSS_LB = 86_000.0  # FAST Act, confirmed
TANDEM_GAP_IN = (40.0, 96.0)  # 23 CFR 658.5, from memory: more than 40 in., up to 96 in.
IN_PER_FT = 12.0


def axles(model: LoadModel) -> tuple[list[float], list[Span]]:
    """Axle loads [kip] and gaps [ft] of the model's only case."""
    (case,) = model.cases
    assert case.train is not None
    return loads_and_gaps(case.train)


def test_ev2_single_axles_at_the_limits() -> None:
    ev2 = get_model("EV2")
    loads, gaps = axles(ev2)
    assert loads == [STEERING_AXLE_LB * KIP_PER_LB, SINGLE_DRIVE_AXLE_LB * KIP_PER_LB]
    assert gaps == [15.0]  # from memory, unconfirmed
    assert ev2.gross_weight == pytest.approx(57.5, rel=EXACT)
    assert ev2.gross_weight_tons == pytest.approx(28.75, rel=EXACT)
    assert ev2.gross_weight <= GROSS_LB * KIP_PER_LB


def test_ev3_tandem_and_gross_at_the_limits() -> None:
    ev3 = get_model("EV3")
    loads, gaps = axles(ev3)
    assert len(loads) == 3
    assert loads[0] == STEERING_AXLE_LB * KIP_PER_LB
    assert sum(loads[1:]) == pytest.approx(TANDEM_AXLE_LB * KIP_PER_LB, rel=EXACT)
    assert ev3.gross_weight == pytest.approx(GROSS_LB * KIP_PER_LB, rel=EXACT)
    assert ev3.gross_weight_tons == pytest.approx(43.0, rel=EXACT)
    assert loads[1:] == [31.0, 31.0] and gaps == [15.0, 4.0]  # from memory, unconfirmed
    low, high = TANDEM_GAP_IN
    tandem_gap = gaps[1]
    assert isinstance(tandem_gap, float)
    assert low < tandem_gap * IN_PER_FT <= high  # the rear pair is a tandem by definition


@pytest.mark.parametrize("name", ["EV2", "EV3"])
def test_emergency_category_and_allowance(name: str) -> None:
    model = get_model(name)
    assert model.category == "emergency" and model.units == "kip-ft"
    case = model.cases[0]
    # rated as legal loads, IM = 33 % (MBE 6A.4.4.3, from memory, unconfirmed); no lane load
    assert case.axle_allowance == 0.33 and case.lane == 0.0
    assert not case.neglect_relieving_axles
