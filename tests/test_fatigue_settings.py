"""[fatigue] and [[fatigue_detail]] tables: values read, stresses per unit effect, and every
bad input as a one-line error naming the file, the key and the fix."""

from __future__ import annotations

import copy
import math
from typing import Any

import pytest

from influence.errors import ModelError
from influence.fatigue import detail_resistance, fatigue_details, fatigue_settings

EXACT = 1e-12

DOCUMENT: dict[str, Any] = {
    "fatigue": {"standard": "AASHTO", "edition": 2020, "adtt": 3000, "lanes": 2,
                "age_years": 41},
    "fatigue_detail": [
        {"name": "cover plate end", "location": "span2@12.5", "response": "moment",
         "category": "E'", "section_modulus": 1450.0},
        {"name": "stiffener weld", "location": 96.0, "response": "moment", "category": "C'",
         "inertia": 98000.0, "distance": 30.0, "stress_concentration": 1.1,
         "cycles_per_passage": 1.5},
        {"name": "hanger", "location": "H3", "response": "axial", "category": "B",
         "area": 24.0},
    ],
}


def test_aashto_settings_and_details():
    settings = fatigue_settings(DOCUMENT, "bridge.toml", units="kip-ft")
    assert settings is not None
    assert (settings.design_life_years, settings.age_years, settings.section_units) == (
        75.0, 41.0, "in")
    assert settings.adtt_sl == 0.85 * 3000 and settings.passages_per_year == 365 * 0.85 * 3000
    assert settings.dynamic_allowance == 0.15 and settings.stress_unit == "ksi"
    cover, stiffener, hanger = fatigue_details(DOCUMENT, settings, "bridge.toml")
    assert math.isclose(cover.stress_per_effect, 12.0 / 1450.0, rel_tol=EXACT)  # kip-ft -> ksi
    assert math.isclose(stiffener.stress_per_effect, 12.0 * 30.0 / 98000.0 * 1.1, rel_tol=EXACT)
    assert stiffener.location == "96.0" and stiffener.cycles_per_passage == 1.5
    assert math.isclose(hanger.stress_per_effect, 1.0 / 24.0, rel_tol=EXACT)  # kip / in^2
    resistance = detail_resistance(cover, settings)
    assert resistance.curve.category == "E'" and math.isclose(resistance.damage_factor, 0.92)


def test_en_settings_and_shear_curve():
    document = {"fatigue": {"standard": "EN", "gamma_Mf": 1.35, "p": 1.0, "adtt": 500},
                "fatigue_detail": [{"name": "web", "location": "B", "response": "shear",
                                    "category": 80, "area": 12000.0}]}
    settings = fatigue_settings(document, "bridge.toml", units="kN-m")
    assert settings is not None and settings.gamma_Mf == 1.35 and settings.dynamic_allowance == 0
    detail = fatigue_details(document, settings, "bridge.toml")[0]
    assert math.isclose(detail.stress_per_effect, 1000.0 / 12000.0, rel_tol=EXACT)  # kN/mm^2
    curve = detail_resistance(detail, settings).curve
    assert curve.slope == 5.0 and math.isclose(curve.reference_range, 80.0 / 1.35, rel_tol=EXACT)


def test_no_fatigue_table():
    assert fatigue_settings({}, "bridge.toml", "kN-m") is None
    assert fatigue_details({}, None, "bridge.toml") == ()


def broken(path: tuple[Any, ...], value: Any) -> dict[str, Any]:
    """DOCUMENT with the key at ``path`` set to ``value`` (removed when value is ...)."""
    document = copy.deepcopy(DOCUMENT)
    where: Any = document
    for step in path[:-1]:
        where = where[step]
    if value is ...:
        del where[path[-1]]
    else:
        where[path[-1]] = value
    return document


@pytest.mark.parametrize(("path", "value", "message"), [
    (("fatigue", "standard"), "BS5400", "bridge.toml: fatigue.standard: unknown standard"),
    (("fatigue", "edition"), 1990, "bridge.toml: fatigue.edition: no AASHTO edition before 1990"),
    (("fatigue", "edition"), "9th", "fatigue.edition: edition '9th' is not a year"),
    (("fatigue", "adtt"), -5, "fatigue.adtt: adtt = -5 is out of range (give a value at least 0)"),
    (("fatigue", "lanes"), 0, "fatigue.lanes: lanes must be a whole number from 1"),
    (("fatigue", "p"), 0.9, "fatigue.p: both lanes and p"),
    (("fatigue", "lanes"), ..., "fatigue.adtt: adtt without lanes or p"),
    (("fatigue", "gamma_Mf"), 1.35, "fatigue.gamma_Mf: gamma_Mf belongs to EN"),
    (("fatigue", "section_units"), "yd", "fatigue.section_units: unknown section unit 'yd'"),
    (("fatigue", "design_life_years"), 0, "design_life_years = 0 is out of range"),
    (("fatigue", "colour"), "red", "fatigue.colour: unknown key 'colour' (allowed keys:"),
    (("fatigue_detail", 0, "category"), "F",
     "fatigue_detail 'cover plate end'.category: unknown AASHTO detail category 'F' "
     "(use one of A, B, B', C, C', D, E, E')"),
    (("fatigue_detail", 0, "response"), "torsion", "'cover plate end'.response: unknown"),
    (("fatigue_detail", 0, "location"), "", "'cover plate end'.location: location ''"),
    (("fatigue_detail", 0, "name"), ..., "fatigue_detail 1.name: a detail without a name"),
    (("fatigue_detail", 1, "name"), "cover plate end", "two details named 'cover plate end'"),
    (("fatigue_detail", 0, "inertia"), 5.0, "moment detail with ['inertia', 'section_modulus']"),
    (("fatigue_detail", 0, "section_modulus"), -1.0, "section_modulus = -1.0 is out of range"),
    (("fatigue_detail", 0, "section_modulus"), "big", "section_modulus = 'big' is not a number"),
    (("fatigue_detail", 2, "area"), ..., "'hanger'.area: axial detail with no section property"),
    (("fatigue_detail", 1, "cycles_per_passage"), 0, "cycles_per_passage = 0 is out of range"),
    (("fatigue_detail", 1, "stress_concentration"), -2, "stress_concentration = -2 is out of"),
])
def test_bad_settings_say_file_key_and_fix(path, value, message):
    document = broken(path, value)
    with pytest.raises(ModelError) as caught:
        settings = fatigue_settings(document, "bridge.toml", units="kip-ft")
        fatigue_details(document, settings, "bridge.toml")
    assert message in str(caught.value)
    assert "\n" not in str(caught.value) and "(" in str(caught.value)


def test_en_needs_gamma_mf():
    with pytest.raises(ModelError, match="fatigue.gamma_Mf: EN needs gamma_Mf"):
        fatigue_settings({"fatigue": {"standard": "EN"}}, "bridge.toml", "kN-m")


def test_details_need_the_fatigue_table():
    with pytest.raises(ModelError, match="fatigue details without a \\[fatigue\\] table"):
        fatigue_settings({"fatigue_detail": DOCUMENT["fatigue_detail"]}, "bridge.toml", "kN-m")


def test_en_category_of_the_wrong_stress_kind():
    document = {"fatigue": {"standard": "EN", "gamma_Mf": 1.15},
                "fatigue_detail": [{"name": "web", "location": "B", "response": "shear",
                                    "category": "71", "area": 1.0}]}
    settings = fatigue_settings(document, "bridge.toml", "kN-m")
    with pytest.raises(ModelError, match="unknown EN detail category '71' \\(use one of 100, 80"):
        fatigue_details(document, settings, "bridge.toml")


def test_en_refuses_lanes():
    document = {"fatigue": {"standard": "EN", "gamma_Mf": 1.15, "adtt": 400, "lanes": 2}}
    with pytest.raises(ModelError, match="fatigue.lanes: lanes gives p by the AASHTO table"):
        fatigue_settings(document, "bridge.toml", "kN-m")
