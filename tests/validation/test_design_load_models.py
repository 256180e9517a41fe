"""Totals and lengths of the library's design load models against their standards.

References (editions and clauses as in the data files; confidence marks as in the project's
reference list: "confirmed" = read in a public reproduction, "from memory" = recalled, unconfirmed):

- AASHTO, *LRFD Bridge Design Specifications*, Art. 3.6.1.2.2 to 3.6.1.4.1, Table 3.6.2.1-1.
- AASHTO, *Standard Specifications for Highway Bridges*, 17th ed. (2002), Art. 3.7 and 3.8.
- CEN, EN 1991-2:2003 *Actions on structures, Part 2: Traffic loads on bridges*, 4.3.2, 4.3.3,
  6.3.2, 6.3.3 and Tables 4.2, 6.1.
- AREMA, *Manual for Railway Engineering*, Ch. 8 / Ch. 15, Art. 1.3 (Cooper E80).
"""

from __future__ import annotations

import pytest

from vehicles import LoadCase, LoadModel, Scope, Train, get_model
from vehicles.output.describe import train_totals

EXACT = 1e-12
"""Relative tolerance for sums of a few decimal numbers."""

SI_EDITION_ROUNDING = 0.02
"""The SI edition of AASHTO LRFD rounds its figures (8 kip = 35.6 kN is printed 35 kN): 2 %."""


def case(model: LoadModel, name: str) -> LoadCase:
    return next(c for c in model.cases if c.name == name)


def train(model: LoadModel, name: str) -> Train:
    found = case(model, name).train
    assert found is not None
    return found


def loads(t: Train) -> list[float]:
    return [float(x) for x in t.arranged().axle_loads]


# AASHTO LRFD HL-93


def test_hl93_design_truck() -> None:
    truck = train(get_model("HL-93"), "design truck + lane")
    # 3.6.1.2.2, Fig. 3.6.1.2.2-1 (confirmed): 8 + 32 + 32 = 72 kip; 14 ft, then 14 to 30 ft
    assert loads(truck) == [8.0, 32.0, 32.0] and truck.total_load() == 72.0
    assert truck.length([14.0]) == 14.0 + 14.0 and truck.length([30.0]) == 14.0 + 30.0


def test_hl93_tandem_lane_and_allowance() -> None:
    hl93 = get_model("HL-93")
    tandem = case(hl93, "design tandem + lane")
    assert tandem.train is not None
    # 3.6.1.2.3 (confirmed): 2 x 25 kip = 50 kip at 4 ft
    assert tandem.train.total_load() == 2 * 25.0 and tandem.train.length() == 4.0
    for c in hl93.cases:
        # 3.6.1.2.4 (confirmed): 0.64 klf, no dynamic allowance on the lane;
        # Table 3.6.2.1-1 (confirmed): IM = 33 % on truck and tandem
        assert (c.lane, c.lane_allowance, c.axle_allowance) == (0.64, 0.0, 0.33)


def test_hl93_truck_pair_for_negative_moment() -> None:
    # 3.6.1.3.1 (from memory, unconfirmed): 90 % of two trucks, 14 ft rear gaps, >= 50 ft apart,
    # with 90 % of the lane load, for negative moment and interior pier reactions only
    pair = case(get_model("HL-93"), "90% truck pair + lane")
    assert pair.train is not None
    assert pair.factor == 0.90 and pair.train.total_load() == 2 * 72.0
    (headway,) = pair.train.ranged_values
    assert headway.low == 50.0
    assert pair.train.length([headway.low]) == 28.0 + 50.0 + 28.0
    assert pair.scope == Scope(("negative moment between contraflexure points",
                                "interior reaction"))
    assert pair.applies_to("moment", "min", interior=True)
    assert not pair.applies_to("moment", "min", interior=False)  # outside the hogging region
    assert not pair.applies_to("moment", "max", interior=True)
    assert not pair.applies_to("reaction", "max", interior=False)


def test_hl93_in_si_agrees_with_the_si_edition() -> None:
    # AASHTO LRFD SI edition, 3.6.1.2.2 to 3.6.1.2.4 (confirmed): 35, 145, 145 kN at 4300 and
    # 4300 to 9000 mm; tandem 2 x 110 kN at 1200 mm; lane 9.3 N/mm
    hl93 = get_model("HL-93", units="kN-m")
    truck = train(hl93, "design truck + lane")
    assert loads(truck) == pytest.approx([35.0, 145.0, 145.0], rel=SI_EDITION_ROUNDING)
    assert truck.ranged_values[0].low == pytest.approx(4.3, rel=SI_EDITION_ROUNDING)
    assert truck.ranged_values[0].high == pytest.approx(9.0, rel=SI_EDITION_ROUNDING)
    tandem = train(hl93, "design tandem + lane")
    assert loads(tandem) == pytest.approx([110.0, 110.0], rel=SI_EDITION_ROUNDING)
    assert tandem.length() == pytest.approx(1.2, rel=SI_EDITION_ROUNDING)
    assert hl93.cases[0].lane == pytest.approx(9.3, rel=SI_EDITION_ROUNDING)


def test_hl93_fatigue_truck() -> None:
    fatigue = get_model("HL-93 fatigue").cases[0]
    assert fatigue.train is not None
    # 3.6.1.4.1 (confirmed): one design truck, 30 ft between the 32 kip axles
    assert fatigue.train.total_load() == 72.0 and fatigue.train.length() == 14.0 + 30.0
    assert fatigue.train.ranged_values == ()
    # Table 3.6.2.1-1, fatigue and fracture (from memory, unconfirmed): IM = 15 %; no lane load
    assert fatigue.axle_allowance == 0.15 and fatigue.lane == 0.0


# AASHTO Standard Specifications HS20-44


def test_hs20_truck_and_lane_loading() -> None:
    hs20 = get_model("HS20-44")
    truck = train(hs20, "HS20 truck")
    # 3.7 (axles and 14 ft confirmed; 14 to 30 ft rear gap from memory): 36 tons = 72 kip
    assert truck.total_load() == 36 * 2.0 and loads(truck) == [8.0, 32.0, 32.0]
    assert (truck.ranged_values[0].low, truck.ranged_values[0].high) == (14.0, 30.0)
    lane = case(hs20, "HS20 lane loading")
    # lane loading (confirmed, Khan 2010 Table 6.7): 0.64 klf + 18 kip (moment) / 26 kip (shear)
    assert lane.train is None and lane.lane == 0.64
    assert lane.knife_edge_for("moment") == 18.0
    assert lane.knife_edge_for("shear") == lane.knife_edge_for("reaction") == 26.0
    # impact is span dependent (3.8.2, from memory): an input, not applied in the stored model
    assert all(c.axle_allowance == c.lane_allowance == 0.0 for c in hs20.cases)


# EN 1991-2 road bridges


def test_lm1_lane_1() -> None:
    lm1 = get_model("LM1").cases[0]
    assert lm1.train is not None
    # Table 4.2 (confirmed): Q1k = 300 kN per axle, q1k = 9 kN/m2; Table 4.1: lane width 3 m
    # (confirmed); Fig. 4.2a: axles 1.2 m apart (from memory)
    assert loads(lm1.train) == [300.0, 300.0] and lm1.train.length() == 1.2
    assert lm1.lane == 9.0 * 3.0
    # 4.3.2 (confirmed): dynamic amplification included, so no allowance is added
    assert (lm1.axle_allowance, lm1.lane_allowance) == (0.0, 0.0)
    assert {a.name: a.value for a in get_model("LM1").adjustments} == {
        "alpha_Q1": 1.0, "alpha_q1": 1.0}  # 4.3.2(3), recommended values (confirmed)


def test_lm2_single_axle() -> None:
    lm2 = get_model("LM2").cases[0]
    assert lm2.train is not None
    # 4.3.3 (confirmed): beta_Q x 400 kN, dynamic amplification included
    assert loads(lm2.train) == [400.0] and lm2.train.length() == 0.0


# EN 1991-2 railway bridges


def test_lm71() -> None:
    lm71 = get_model("LM71")
    c = lm71.cases[0]
    assert c.train is not None
    # 6.3.2 (250 kN confirmed; 1.6 m, 80 kN/m and 0.8 m from memory)
    assert loads(c.train) == [250.0] * 4 and c.train.total_load() == 4 * 250.0
    assert c.train.length() == pytest.approx(3 * 1.6, rel=EXACT)
    assert (c.lane, c.lane_clear_of_train) == (80.0, 0.8)
    # 6.3.2(3) (confirmed): classification factor alpha, 1.0 unless specified
    assert [(a.name, a.value) for a in lm71.adjustments if a.name == "alpha"] == [("alpha", 1.0)]


@pytest.mark.parametrize(
    ("name", "q", "a", "c"),
    [("SW/0", 133.0, 15.0, 5.3), ("SW/2", 150.0, 25.0, 7.0)],  # Table 6.1, from memory
)
def test_sw_blocks(name: str, q: float, a: float, c: float) -> None:
    sw = get_model(name).cases[0]
    assert sw.train is not None
    assert sw.train.total_load() == pytest.approx(2 * q * a, rel=EXACT)
    assert sw.train.length() == pytest.approx(2 * a + c, rel=EXACT)
    blocks = sw.train.arranged()
    assert blocks.patch_starts.tolist() == pytest.approx([0.0, a + c], rel=EXACT)
    assert blocks.axle_loads.size == 0


# AREMA Cooper E80


def test_cooper_e80_locomotives() -> None:
    e80 = train(get_model("Cooper E80"), "E80 locomotives + uniform")
    # E80 = 8 x E10 (confirmed): per locomotive 5 + 4 x 10 + 4 x 6.5 = 71 kip in E10
    per_locomotive = 8 * (5.0 + 4 * 10.0 + 4 * 6.5)
    totals = train_totals(e80)
    assert totals["total_load"] == [2 * per_locomotive] * 2
    assert totals["unlimited_uniform"] == 8 * 1.0  # 1 kip/ft in E10 (confirmed)
    # axle positions and the start of the uniform load (from memory, unconfirmed)
    arranged = e80.arranged()
    assert arranged.axle_offsets.tolist() == [0, 8, 13, 18, 23, 32, 37, 43, 48, 56, 64, 69, 74,
                                              79, 88, 93, 99, 104]
    assert arranged.patch_starts.tolist() == [109.0]


def test_cooper_e80_alternate() -> None:
    alternate = train(get_model("Cooper E80"), "E80 alternate")
    # four 100 kip axles at 5, 6, 5 ft (from memory, unconfirmed)
    assert loads(alternate) == [100.0] * 4 and alternate.length() == 5.0 + 6.0 + 5.0
