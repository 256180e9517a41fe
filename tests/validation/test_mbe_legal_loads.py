"""AASHTO legal loads, specialized hauling vehicles and the NRL against the Manual for Bridge
Evaluation, and one of them placed on a simple span against closed forms.

References:
- AASHTO, *The Manual for Bridge Evaluation* (MBE), Art. 6A.4.4.2.1 (legal loads for routine
  commercial traffic, lane-type legal loads, specialized hauling vehicles and the notional rating
  load; article and figure numbers from memory) and 6A.4.4.3 (dynamic load allowance 33 %).
  Axle weights, gaps and gross weights: from memory, unconfirmed.
- Closed forms of the simple span (statics, common practice): the midspan moment line has the
  ordinate L/4 at midspan falling by 1/2 per unit distance, and the largest midspan moment stands
  with an axle over midspan. Barre's theorem (T. G. Hicks, *Civil Engineering Formulas*, ch. 2):
  the largest moment anywhere stands under an axle next to the resultant when midspan halves the
  distance between that axle and the resultant.
"""

from __future__ import annotations

import pytest

from tests.axles import loads_and_gaps
from tests.influence_forms import simple_moment
from tests.section_scan import largest_over_sections, section_grid
from vehicles import LoadModel, Train, get_model
from vehicles.search.govern import govern

EXACT = 1e-9
"""Relative tolerance of an exact placement against a closed form (float round-off only)."""

SPAN = 60.0
"""Simple span [ft]: long enough that the 19 ft Type 3 stands wholly on it at the extremes."""

GRID_SECTIONS = 39
"""Sections scanned across the span to confirm that Barre's value is the largest anywhere."""


def only_train(model: LoadModel) -> Train:
    (case,) = model.cases
    assert case.train is not None
    return case.train


def axle_loads(train: Train) -> list[float]:
    return loads_and_gaps(train)[0]


@pytest.mark.parametrize(
    ("name", "loads", "spacings", "gross_kip", "tons"),
    [
        # MBE 6A.4.4.2.1, routine commercial traffic (from memory, unconfirmed)
        ("Type 3", [16.0, 17.0, 17.0], [15.0, 4.0], 50.0, 25.0),
        ("Type 3S2", [10.0, 15.5, 15.5, 15.5, 15.5], [11.0, 4.0, 22.0, 4.0], 72.0, 36.0),
        ("Type 3-3", [12.0, 12.0, 12.0, 16.0, 14.0, 14.0], [15.0, 4.0, 15.0, 16.0, 4.0], 80.0,
         40.0),
        # MBE 6A.4.4.2.1, specialized hauling vehicles (from memory, unconfirmed)
        ("SU4", [12.0, 8.0, 17.0, 17.0], [10.0, 4.0, 4.0], 54.0, 27.0),
        ("SU5", [12.0, 8.0, 8.0, 17.0, 17.0], [10.0, 4.0, 4.0, 4.0], 62.0, 31.0),
        ("SU6", [11.5, 8.0, 8.0, 17.0, 17.0, 8.0], [10.0, 4.0, 4.0, 4.0, 4.0], 69.5, 34.75),
        ("SU7", [11.5, 8.0, 8.0, 17.0, 17.0, 8.0, 8.0], [10.0, 4.0, 4.0, 4.0, 4.0, 4.0], 77.5,
         38.75),
        # MBE 6A.4.4.2.1, notional rating load (from memory, unconfirmed)
        ("NRL", [6.0, 8.0, 8.0, 17.0, 17.0, 8.0, 8.0, 8.0], [6.0, 4.0, 4.0, 4.0, 4.0, 4.0, 4.0],
         80.0, 40.0),
    ],
)
def test_axles_and_gross_weights(name: str, loads: list[float], spacings: list[float],
                                 gross_kip: float, tons: float) -> None:
    model = get_model(name)
    train = only_train(model)
    assert model.name == name and model.units == "kip-ft"
    assert train.axle_count == len(loads)
    assert loads_and_gaps(train) == (loads, spacings)
    assert train.ranged_values == ()  # legal vehicles have fixed gaps
    assert model.gross_weight == pytest.approx(gross_kip, rel=EXACT)
    assert model.gross_weight_tons == pytest.approx(tons, rel=EXACT)  # tons of 2000 lb
    # MBE 6A.4.4.3 (from memory, unconfirmed): IM = 33 % on the vehicle, an input
    assert model.cases[0].axle_allowance == 0.33 and model.cases[0].lane == 0.0
    assert [(a.name, a.value, a.sets) for a in model.adjustments] == [
        ("IM", 0.33, ("dynamic_allowance",))]


@pytest.mark.parametrize(
    ("name", "category"),
    [("Type 3", "legal"), ("Type 3S2", "legal"), ("Type 3-3", "legal"),
     ("Type 3-3 lane-type", "legal"), ("SU4", "specialized hauling"),
     ("SU5", "specialized hauling"), ("SU6", "specialized hauling"),
     ("SU7", "specialized hauling"), ("NRL", "notional")],
)
def test_categories(name: str, category: str) -> None:
    assert get_model(name).category == category


def test_nrl_neglects_relieving_axles_and_the_su_trucks_do_not() -> None:
    # note to the NRL figure (from memory, unconfirmed): axles that do not contribute to the
    # extreme are neglected
    assert get_model("NRL").cases[0].neglect_relieving_axles
    for name in ("SU4", "SU5", "SU6", "SU7", "Type 3", "Type 3S2", "Type 3-3"):
        assert not get_model(name).cases[0].neglect_relieving_axles


def test_nrl_envelopes_the_su_trucks_in_weight() -> None:
    # the NRL is the screening load for SU4 to SU7 (FHWA Q&A on SHVs, 2014, confirmed in
    # substance); in the tabled values (from memory) it weighs at least as much as each of them
    # and, lined up at the 17 kip tandem, each axle behind the steering axle is at least as
    # heavy as theirs (computed)
    nrl = get_model("NRL")
    nrl_axles = axle_loads(only_train(nrl))
    for name in ("SU4", "SU5", "SU6", "SU7"):
        su = get_model(name)
        assert su.gross_weight <= nrl.gross_weight
        su_axles = axle_loads(only_train(su))
        shift = su_axles.index(17.0) - nrl_axles.index(17.0)  # line up the 17 kip tandem
        for index, load in enumerate(su_axles[1:], start=1):
            assert load <= nrl_axles[index - shift]


def test_lane_type_legal_load() -> None:
    # MBE 6A.4.4.2.1 (from memory, unconfirmed): 0.75 x Type 3-3 + 0.2 kip/ft lane (spans over
    # 200 ft); two 0.75 x Type 3-3, 30 ft clear, + 0.2 kip/ft for negative moment and interior
    # reactions; IM on the trucks only
    model = get_model("Type 3-3 lane-type")
    one, two = model.cases
    type33 = axle_loads(only_train(get_model("Type 3-3")))
    assert one.train is not None and two.train is not None
    assert axle_loads(one.train) == pytest.approx([0.75 * p for p in type33], rel=EXACT)
    assert axle_loads(two.train) == pytest.approx([0.75 * p for p in type33] * 2, rel=EXACT)
    assert one.train.total_load() == pytest.approx(0.75 * 80.0, rel=EXACT)
    truck_length = 15.0 + 4.0 + 15.0 + 16.0 + 4.0
    assert two.train.length() == truck_length + 30.0 + truck_length
    assert two.train.ranged_values == ()  # the 30 ft is fixed
    for case in (one, two):
        assert (case.lane, case.lane_allowance, case.axle_allowance, case.factor) == (
            0.2, 0.0, 0.33, 1.0)
    # the single truck counts for every response (the 200 ft rule is the rating's)
    assert one.scope.effects == ()
    assert two.scope.effects == ("negative moment", "interior reaction")
    assert two.applies_to("moment", "min", interior=False)
    assert two.applies_to("reaction", "max", interior=True)
    assert not two.applies_to("reaction", "max", interior=False)
    assert not two.applies_to("moment", "max", interior=True)
    assert not two.applies_to("shear", "min", interior=True)
    assert any("200 ft" in note for note in model.notes)


def test_type3_largest_midspan_moment() -> None:
    model = get_model("Type 3")
    P1, P2, P3 = 16.0, 17.0, 17.0  # [kip]
    a12, a23 = 15.0, 4.0  # [ft]
    L = SPAN

    def ordinate(distance: float) -> float:
        """Midspan moment line at ``distance`` from midspan [ft]."""
        return L / 4 - distance / 2

    # an axle over midspan; the others at their gaps, the heavier side kept close
    by_axle = [
        P1 * ordinate(0) + P2 * ordinate(a12) + P3 * ordinate(a12 + a23),
        P1 * ordinate(a12) + P2 * ordinate(0) + P3 * ordinate(a23),
        P1 * ordinate(a12 + a23) + P2 * ordinate(a23) + P3 * ordinate(0),
    ]
    closed_form = max(by_axle)
    assert closed_form == by_axle[1] == 12.5 * L - 154.0  # the middle axle over midspan
    found = govern(simple_moment(L, L / 2), model, kind="moment", section=L / 2).max
    assert found is not None
    assert found.value == pytest.approx((1 + 0.33) * closed_form, rel=EXACT)
    assert found.section_axle == 1


def test_type3_absolute_maximum_by_barre() -> None:
    model = get_model("Type 3")
    loads, offsets = [16.0, 17.0, 17.0], [0.0, 15.0, 19.0]  # [kip], [ft] from the front axle
    L = SPAN
    W = sum(loads)
    resultant = sum(p * d for p, d in zip(loads, offsets, strict=True)) / W  # 11.56 ft
    # the axle nearest the resultant is the second; midspan halves the distance between them
    e = (offsets[1] - resultant) / 2
    section = L / 2 + e
    # right reaction x distance to the right support, less the axle behind the section
    barre = W * (L / 2 - e) ** 2 / L - loads[2] * (offsets[2] - offsets[1])
    assert section - offsets[1] >= 0 and section + (offsets[2] - offsets[1]) <= L  # all on span
    found = govern(simple_moment(L, section), model, kind="moment", section=section).max
    assert found is not None
    assert found.value == pytest.approx((1 + 0.33) * barre, rel=EXACT)
    assert found.section_axle == 1
    midspan = govern(simple_moment(L, L / 2), model, kind="moment", section=L / 2).max
    assert midspan is not None and midspan.value < found.value
    scanned = largest_over_sections(L, model, section_grid(L, GRID_SECTIONS))
    assert scanned.value <= found.value * (1 + EXACT)
