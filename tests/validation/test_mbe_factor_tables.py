"""The factor tables of the AASHTO Manual for Bridge Evaluation, as recalled.

Reference: AASHTO, *The Manual for Bridge Evaluation*, 1st ed. (2008) and 2nd ed. (2011):
Table 6A.4.2.2-1 (limit states and load factors), Table 6A.4.2.3-1 (condition factor),
Table 6A.4.2.4-1 (system factor), Table 6A.4.4.2.3a-1 (legal live-load factors by ADTT),
Table 6A.4.5.4.2a-1 (permit live-load factors), Table C6A.4.4.3-1 (IM reductions), 6B.4.1
(LFR and ASR factors A1, A2). Every value here is from memory, unconfirmed (as in the data file);
the linear interpolation on ADTT and on the permit's gross weight is written out in each test
(computed).
"""

from __future__ import annotations

import pytest

from influence.errors import ModelError
from influence.rating import (
    PermitCrossing,
    allowable_factors,
    condition_factor,
    known_editions,
    legal_live_load_factor,
    limit_state_factors,
    limit_states,
    lrfr_impact,
    permit_live_load_factor,
    system_factor,
)

EXACT = 1e-12


def lerp(x, x0, y0, x1, y1):
    return y0 + (x - x0) / (x1 - x0) * (y1 - y0)


@pytest.mark.parametrize(("adtt", "expected"), [
    (50.0, 1.40), (100.0, 1.40), (550.0, lerp(550.0, 100.0, 1.40, 1000.0, 1.65)),
    (1000.0, 1.65), (3000.0, lerp(3000.0, 1000.0, 1.65, 5000.0, 1.80)), (5000.0, 1.80),
    (20000.0, 1.80), (None, 1.80),
])
def test_legal_factor_first_edition(adtt, expected):
    assert legal_live_load_factor("MBE 1st", adtt).factor == pytest.approx(expected, rel=EXACT)


@pytest.mark.parametrize(("adtt", "expected"), [
    (0.0, 1.30), (1000.0, 1.30), (2500.0, lerp(2500.0, 1000.0, 1.30, 5000.0, 1.45)),
    (5000.0, 1.45), (None, 1.45),
])
def test_legal_factor_second_edition(adtt, expected):
    assert legal_live_load_factor("MBE 2nd", adtt).factor == pytest.approx(expected, rel=EXACT)


def test_legal_factor_says_how_it_was_found():
    found = legal_live_load_factor("MBE 1st", 3000.0)
    assert "interpolated between 1000 and 5000" in found.basis
    assert "from memory, unconfirmed" in found.mark


@pytest.mark.parametrize(("edition", "frequency", "loading", "adtt", "expected"), [
    ("MBE 1st", "single trip", "escorted, no other vehicles", 3000.0, 1.15),
    ("MBE 1st", "single trip", "mixed with traffic", 5000.0, 1.50),
    ("MBE 1st", "single trip", "mixed with traffic", 100.0, 1.35),
    ("MBE 1st", "multiple trips", "mixed with traffic", 1000.0, 1.75),
    ("MBE 1st", "multiple trips", "mixed with traffic", 550.0,
     lerp(550.0, 100.0, 1.55, 1000.0, 1.75)),
    ("MBE 2nd", "single trip", "escorted, no other vehicles", None, 1.10),
    ("MBE 2nd", "single trip", "mixed with traffic", 3000.0, lerp(3000.0, 1000.0, 1.15,
                                                                  5000.0, 1.20)),
    ("MBE 2nd", "multiple trips", "mixed with traffic", None, 1.40),
])
def test_special_permit_factors(edition, frequency, loading, adtt, expected):
    crossing = PermitCrossing("special", frequency, loading)
    found = permit_live_load_factor(edition, crossing, adtt)
    assert found.factor == pytest.approx(expected, rel=EXACT)
    assert found.distribution == "one lane"


@pytest.mark.parametrize(("weight", "adtt", "expected"), [
    (100.0, 5000.0, 1.80), (150.0, 5000.0, 1.30), (80.0, 1000.0, 1.60), (200.0, 100.0, 1.10),
    (125.0, 1000.0, lerp(125.0, 100.0, 1.60, 150.0, 1.20)),
    (110.0, 3000.0, lerp(110.0, 100.0, lerp(3000.0, 1000.0, 1.60, 5000.0, 1.80),
                         150.0, lerp(3000.0, 1000.0, 1.20, 5000.0, 1.30))),
])
def test_first_edition_routine_permit_by_weight_and_adtt(weight, adtt, expected):
    crossing = PermitCrossing("routine", gross_weight_kip=weight)
    assert permit_live_load_factor("MBE 1st", crossing, adtt).factor == pytest.approx(
        expected, rel=EXACT)


def test_second_edition_routine_permit_ignores_weight():
    for weight in (None, 90.0, 180.0):
        crossing = PermitCrossing("annual", gross_weight_kip=weight)
        assert permit_live_load_factor("MBE 2nd", crossing, 1000.0).factor == 1.20


def test_permit_table_errors():
    with pytest.raises(ModelError, match="gross weight"):
        permit_live_load_factor("MBE 1st", PermitCrossing("routine"), 1000.0)
    with pytest.raises(ModelError, match="no row") as caught:
        permit_live_load_factor("MBE 2nd", PermitCrossing("routine", "single trip"), 1000.0)
    assert "rows: routine" in str(caught.value)
    with pytest.raises(ModelError, match="permit type"):
        PermitCrossing("occasional")
    with pytest.raises(ModelError, match="frequency"):
        PermitCrossing("special", "twice")
    with pytest.raises(ModelError, match="loading"):
        PermitCrossing("special", "single trip", "convoy")
    with pytest.raises(ModelError, match="gross weight"):
        PermitCrossing("routine", gross_weight_kip=-5.0)


@pytest.mark.parametrize("adtt", [-1.0, -1000.0])
def test_negative_adtt(adtt):
    with pytest.raises(ModelError, match="negative"):
        legal_live_load_factor("MBE 2nd", adtt)
    with pytest.raises(ModelError, match="negative"):
        permit_live_load_factor("MBE 2nd", PermitCrossing("routine"), adtt)


def test_unknown_edition_lists_the_known_ones_in_one_line():
    with pytest.raises(ModelError) as caught:
        legal_live_load_factor("MBE 9th", 1000.0)
    message = str(caught.value)
    assert "\n" not in message
    assert all(f'"{edition}"' in message for edition in known_editions())


def test_limit_states_by_material_and_level():
    names = {(m, lvl): [r.limit_state for r in limit_states(m, lvl)]
             for m in ("steel", "reinforced concrete", "prestressed concrete", "wood")
             for lvl in ("design inventory", "design operating", "legal", "permit")}
    assert names["steel", "design inventory"] == ["Strength I", "Service II"]
    assert names["steel", "permit"] == ["Strength II", "Service II"]
    assert names["reinforced concrete", "permit"] == ["Strength II", "Service I"]
    assert names["prestressed concrete", "design inventory"] == ["Strength I", "Service III"]
    assert names["prestressed concrete", "legal"] == ["Strength I", "Service III"]
    assert names["wood", "legal"] == ["Strength I"]


def test_load_factors_of_table_6a4221():
    strength = limit_state_factors("steel", "design inventory", "Strength I")
    assert (strength.dead_components, strength.dead_wearing, strength.live) == (1.25, 1.50, 1.75)
    assert limit_state_factors("wood", "design operating", "Strength I").live == 1.35
    legal = limit_state_factors("reinforced concrete", "legal", "Strength I")
    assert legal.live is None and legal.live_table == "legal table"
    assert limit_state_factors("steel", "legal", "Service II").live == 1.30
    assert limit_state_factors("steel", "permit", "Service II").live == 1.00
    assert limit_state_factors("prestressed concrete", "legal", "Service III").optional
    assert limit_state_factors("prestressed concrete", "design inventory",
                               "Service III").live == 0.80
    assert limit_state_factors("steel", "legal", "Strength I",
                               overlay_measured=True).dead_wearing == 1.25
    assert limit_state_factors("steel", "legal", "Service II",
                               overlay_measured=True).dead_wearing == 1.00


@pytest.mark.parametrize(("material", "level", "state"), [
    ("concrete", "legal", "Strength I"), ("steel", "inventory", "Strength I"),
    ("steel", "legal", "Strength II"), ("wood", "permit", "Service I"),
])
def test_limit_state_errors(material, level, state):
    with pytest.raises(ModelError) as caught:
        limit_state_factors(material, level, state)
    assert "use one of" in str(caught.value)


def test_condition_and_system_factors():
    assert [condition_factor(w) for w in ("good", "satisfactory", "fair", "poor")] == [
        1.00, 1.00, 0.95, 0.85]
    assert [condition_factor(r) for r in (9, 6, 5, 4, 0)] == [1.00, 1.00, 0.95, 0.85, 0.85]
    assert system_factor("riveted members in two-girder, truss or arch bridges") == 0.90
    assert system_factor("four-girder bridges, girder spacing up to 4 ft") == 0.95
    assert system_factor("three-girder bridges, girder spacing up to 6 ft", "shear") == 1.00
    for bad in ("excellent", 10, -1, 2.5):
        with pytest.raises(ModelError):
            condition_factor(bad)  # type: ignore[arg-type]
    with pytest.raises(ModelError, match="superstructure"):
        system_factor("suspension bridge")


def test_lfr_and_asr_factors():
    assert (allowable_factors("LFR", "inventory").dead,
            allowable_factors("LFR", "inventory").live) == (1.30, 2.17)
    assert allowable_factors("LFR", "operating").live == 1.30
    assert (allowable_factors("ASR", "operating").dead,
            allowable_factors("ASR", "inventory").live) == (1.00, 1.00)
    with pytest.raises(ModelError):
        allowable_factors("LRFR", "inventory")
    with pytest.raises(ModelError):
        allowable_factors("LFR", "legal")


def test_lrfr_impact_rules():
    assert lrfr_impact("design inventory", 100.0, "kip-ft").fraction == 0.33
    assert lrfr_impact("legal", 40.0, "kip-ft", surface="minor surface deviations").fraction \
        == 0.20
    assert lrfr_impact("permit", 13.0, "kN-m", surface="smooth riding surface").fraction == 0.10
    assert lrfr_impact("permit", 12.0, "kN-m", surface="smooth riding surface").fraction == 0.33
    assert lrfr_impact("permit", 12.0, "kN-m", escorted_crawl=True).fraction == 0.0
    for kwargs in ({"surface": "gravel"}, {"escorted_crawl": True}):
        with pytest.raises(ModelError):
            lrfr_impact("legal", 50.0, "kip-ft", **kwargs)
    with pytest.raises(ModelError, match="33 %"):
        lrfr_impact("design operating", 50.0, "kip-ft", surface="smooth riding surface")
