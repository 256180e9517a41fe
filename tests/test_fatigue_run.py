"""The fatigue run's traffic: passages from the trucks a day, EN 1991-2 traffic categories and
the shares of a set of lorries; both directions; the example model.

- EN 1991-2:2003 4.6.1, Table 4.5 (heavy vehicles a year on the slow lane, confirmed as
  reproduced by E. Ellobody, *Finite Element Analysis and Design of Steel and Steel-Concrete
  Composite Bridges*, 2014, ch. 3) and Table 4.7 (FLM4 shares, from memory).
- AASHTO LRFD 3.6.1.4.2: (ADTT)SL = p x ADTT (from memory); 365 days a year (Eq. 6.6.1.2.5-3).
- Palmgren-Miner damage adds over the vehicles (EN 1993-1-9 Annex A): the set of lorries does
  the damage of each lorry run alone with its share of the passages (computed two ways).
"""

from __future__ import annotations

import math
from pathlib import Path

import pytest

from influence.errors import ModelError
from influence.fatigue.run import fatigue
from influence.model.reader import read_model_file
from tests.fatigue_files import girder_file, vehicle_file
from vehicles import get_model

EXACT = 1e-12
ROUNDING = 1e-9
"""Relative: the same damage summed in another order."""

EXAMPLE = Path(__file__).resolve().parent.parent / "examples" / "wrenfield-girder.toml"


def _en_model(folder: Path, p: float | None = None) -> Path:
    settings: dict[str, object] = {"standard": "EN", "gamma_Mf": 1.15}
    if p is not None:
        settings["p"] = p
    # a slender section: every lorry's largest range above the knee, so every one does damage
    return girder_file(folder, [18.0, 18.0], [{
        "name": "flange", "location": "7.0", "response": "moment", "category": "71",
        "section_modulus": 4.0e6}], settings, units="kN-m")


def test_flm4_does_the_damage_of_its_lorries_run_alone(tmp_path):
    model = _en_model(tmp_path, p=1.0)
    whole = fatigue(model, vehicle="FLM4", traffic_category="category 1",
                    traffic_type="long distance").details[0].life
    flm4 = get_model("FLM4")
    (long_distance,) = [t for t in flm4.traffic_types if t.name == "long distance"]
    alone = 0.0
    for case in flm4.cases:
        assert case.train is not None
        arranged = case.train.arranged()
        lorry = vehicle_file(tmp_path, arranged.axle_loads.tolist(),
                             [float(g) for g in (arranged.axle_offsets[1:]
                                                 - arranged.axle_offsets[:-1])],
                             units="kN-m", name=f"{case.name}.toml")
        per_day = long_distance.share(case.name) * 2.0e6 / 365
        life = fatigue(model, vehicle=str(lorry), adtt=per_day).details[0].life
        assert life.damage_per_year > 0
        alone += life.damage_per_year
    assert math.isclose(whole.damage_per_year, alone, rel_tol=ROUNDING)


def test_flm3_passes_as_often_as_its_traffic_category_says(tmp_path):
    results = fatigue(_en_model(tmp_path), vehicle="FLM3", traffic_category="category 3")
    assert results.traffic.fleet.passages_per_year.tolist() == [0.125e6]
    with pytest.raises(ModelError, match="category 1"):
        fatigue(_en_model(tmp_path), vehicle="FLM3", traffic_category="category 9")


def test_trucks_a_day_make_365_p_adtt_passages_a_year():
    results = fatigue(EXAMPLE, vehicle="HL-93 fatigue", adtt=2000.0)
    assert math.isclose(float(results.traffic.fleet.passages_per_year[0]),
                        365 * 0.85 * 2000.0, rel_tol=EXACT)  # two lanes: p = 0.85


def test_both_directions_at_midspan_of_a_simple_span_match_one_by_symmetry(tmp_path):
    model = girder_file(tmp_path, [70.0], [{
        "name": "flange", "location": "35.0", "response": "moment", "category": "E",
        "section_modulus": 600.0}], {"standard": "AASHTO", "adtt": 800, "lanes": 1})
    one = fatigue(model, vehicle="HL-93 fatigue").details[0].life
    both = fatigue(model, vehicle="HL-93 fatigue", direction="both").details[0].life
    assert math.isclose(both.damage_per_year, one.damage_per_year, rel_tol=ROUNDING)


def test_the_example_reads_the_table_and_its_section_properties():
    results = fatigue(read_model_file(EXAMPLE), vehicle="HL-93 fatigue")
    by_name = {r.detail.name: r for r in results.details}
    # AASHTO LRFD Table 6.6.1.2.5-2 (from memory): 110 ft spans, n = 1.5 within 11 ft of P1
    assert by_name["G3 top flange splice near P1"].table_cycles_per_passage == 1.5
    assert by_name["G3 bottom flange, cover plate end"].table_cycles_per_passage == 1.0
    # 1 kip-ft = 12 kip-in: stress = M x 12 y / I [ksi]
    splice = by_name["G3 top flange splice near P1"].detail
    assert math.isclose(splice.stress_per_effect, 12 * 30.5 / 61500.0, rel_tol=EXACT)
    assert results.counting.startswith("ASTM E1049-85 5.4.4")


def test_a_model_without_fatigue_tables_is_refused(tmp_path):
    plain = tmp_path / "plain.toml"
    plain.write_text('[beam]\nspans = [10.0]\nEI = 1.0\nsupports = ["pinned", "roller"]\n')
    with pytest.raises(ModelError, match=r"no \[fatigue\] table"):
        fatigue(plain, vehicle="FLM3")


def test_the_table_row_follows_the_supports_around_the_detail():
    """AASHTO LRFD Table 6.6.1.2.5-2 (from memory): cantilever girders 5.0, trusses 1.0."""
    from influence.fatigue.table_cycles import table_cycles
    from influence.model.beamform import continuous_beam
    from influence.model.path import trace
    from influence.model.reader import read_model

    overhang = continuous_beam([12.0, 60.0], 1.0, ["free", "pinned", "roller"], units="kip-ft")
    n, basis = table_cycles(overhang, trace(overhang), 5.0) or (None, "")
    assert n == 5.0 and "cantilever girder, overhang 12 ft" in basis
    assert table_cycles(overhang, trace(overhang), 40.0) == (
        1.0, "AASHTO LRFD Table 6.6.1.2.5-2: simple-span girder, span 60 ft")
    truss = read_model(EXAMPLE.parent / "truss-rail-bridge.toml")
    assert table_cycles(truss, trace(truss), 20.0) == (
        1.0, "AASHTO LRFD Table 6.6.1.2.5-2: truss")
