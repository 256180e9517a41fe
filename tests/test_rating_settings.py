"""The [rating] table: what it reads, and a one-line error for every bad input."""

from __future__ import annotations

import pytest

from influence.errors import ModelError
from influence.rating import rating_settings
from influence.rating.settings import KN_PER_KIP, GirderDistribution

SOURCE = "bridge.toml"
STEEL = {"material": "steel"}


def read(rating: dict, units: str = "kip-ft"):
    return rating_settings({"rating": rating}, units, SOURCE)


def refused(rating: dict, units: str = "kip-ft", document: dict | None = None) -> ModelError:
    with pytest.raises(ModelError) as caught:
        rating_settings(document if document is not None else {"rating": rating}, units, SOURCE)
    message = str(caught.value)
    assert "\n" not in message and message.startswith(SOURCE)
    assert caught.value.fix
    return caught.value


def test_defaults_for_lrfr():
    settings = read(STEEL)
    assert (settings.method, settings.edition, settings.adtt) == ("LRFR", "MBE 2nd", None)
    assert settings.levels == ("design inventory", "design operating", "legal")
    assert settings.limit_states == ("Strength I", "Service II")
    assert (settings.condition_factor, settings.system_factor) == (1.0, 1.0)
    assert settings.distribution is None and settings.permit is None


def test_full_lrfr_table():
    settings = read({
        "method": "LRFR", "edition": "MBE 1st", "adtt": 1200, "material": "prestressed concrete",
        "condition_rating": 5,
        "system_factor": "welded members in two-girder, truss or arch bridges",
        "limit_states": ["Strength I", "Service III"], "overlay_measured": True, "impact": 0.2,
        "surface": "minor surface deviations", "sign_increment": 1.0, "distribution": 0.62,
        "permit": {"type": "routine", "gross_weight": 130.0},
    })
    assert settings.edition == "MBE 1st" and settings.adtt == 1200.0
    assert settings.condition_factor == 0.95 and settings.system_factor == 0.85
    assert settings.system_factor_for("shear") == 1.0
    assert settings.system_factor_for("moment") == 0.85
    assert settings.levels[-1] == "permit"
    assert settings.permit is not None and settings.permit.kind == "routine"
    assert settings.permit.frequency == "unlimited crossings"
    assert settings.permit.gross_weight_kip == 130.0
    assert settings.distribution == 0.62 and settings.overlay_measured
    assert (settings.impact, settings.surface, settings.sign_increment) == (
        0.2, "minor surface deviations", 1.0)


def test_lfr_defaults():
    settings = read({"method": "LFR", "adtt": 0})
    assert settings.levels == ("inventory", "operating")
    assert settings.limit_states == () and settings.material is None


def test_girder_geometry_in_a_metric_model():
    settings = read({**STEEL, "distribution": {
        "girder": "exterior", "spacing": 2.4384, "span": 18.288, "slab_thickness": 203.2,
        "stiffness_parameter": 500_000.0 * 25.4**4, "girders": 5, "edge_distance": 0.6096,
        "rigid_section": True}, "permit": {"type": "special", "gross_weight": 534.0}},
        units="kN-m")
    distribution = settings.distribution
    assert isinstance(distribution, GirderDistribution)
    assert distribution.geometry.spacing == pytest.approx(8.0)
    assert distribution.geometry.edge_distance == pytest.approx(2.0)
    assert distribution.rigid_section
    assert distribution.factors("shear").response == "shear"
    assert distribution.factors("axial").response == "moment"
    assert settings.permit is not None
    assert settings.permit.gross_weight_kip == pytest.approx(534.0 / KN_PER_KIP)
    assert settings.permit.frequency == "single trip"


@pytest.mark.parametrize(("rating", "item", "words"), [
    ({"method": "LRFD"}, "rating.method", "not known"),
    ({**STEEL, "edition": "MBE 7th"}, "rating.edition", "unknown edition"),
    ({**STEEL, "adtt": -5}, "rating.adtt", "negative"),
    ({**STEEL, "adtt": "high"}, "rating.adtt", "not a number"),
    ({**STEEL, "adtt": True}, "rating.adtt", "not a number"),
    ({**STEEL, "nominal": 5.0}, "rating", "unknown key 'nominal'"),
    ({**STEEL, "spacing": 5.0}, "rating", "unknown key 'spacing'"),
    ({**STEEL, "colour": "red"}, "rating", "unknown key 'colour'"),
    ({}, "rating", "material"),
    ({"material": "stone"}, "rating.material", "not known"),
    ({**STEEL, "condition_factor": 1.2}, "rating.condition_factor", "outside"),
    ({**STEEL, "condition_factor": "excellent"}, "rating.condition_factor", "unknown condition"),
    ({**STEEL, "condition_rating": 11}, "rating.condition_rating", "outside 0-9"),
    ({**STEEL, "condition_rating": 5.5}, "rating.condition_rating", "5.5"),
    ({**STEEL, "condition_rating": 5, "condition_factor": 0.95}, "rating", "both"),
    ({**STEEL, "system_factor": "arch"}, "rating.system_factor", "superstructure"),
    ({**STEEL, "system_factor": 0.0}, "rating.system_factor", "outside"),
    ({"method": "LFR", "condition_factor": 0.9}, "rating.condition_factor", "LRFR setting"),
    ({"method": "ASR", "material": "steel"}, "rating.material", "LRFR setting"),
    ({**STEEL, "limit_states": ["Service III"]}, "rating.limit_states (for steel)", "not known"),
    ({**STEEL, "limit_states": "Strength I"}, "rating.limit_states", "list"),
    ({**STEEL, "levels": ["operating"]}, "rating.levels", "not known"),
    ({"method": "LFR", "levels": ["legal"]}, "rating.levels", "not known"),
    ({**STEEL, "levels": ["permit"]}, "rating.levels", "needs a permit"),
    ({**STEEL, "permit": {"frequency": "single trip"}}, "rating.permit", "type"),
    ({**STEEL, "permit": {"type": "sometimes"}}, "rating.permit.type", "permit type"),
    ({**STEEL, "permit": {"type": "special", "speed": 5}}, "rating.permit", "unknown key"),
    ({**STEEL, "permit": {"type": "special", "gross_weight": 0}}, "rating.permit.gross_weight",
     "greater than 0"),
    ({**STEEL, "permit": "special"}, "rating.permit", "must be a table"),
    ({**STEEL, "distribution": 0.0}, "rating.distribution", "greater than 0"),
    ({**STEEL, "distribution": {"girder": "interior"}}, "rating.distribution", "missing key"),
    ({**STEEL, "distribution": {"girder": "middle", "spacing": 8, "span": 60,
                                "slab_thickness": 8, "stiffness_parameter": 5e5, "girders": 5}},
     "rating.distribution.girder", "not known"),
    ({**STEEL, "distribution": {"girder": "interior", "spacing": 8, "span": 60,
                                "slab_thickness": 8, "stiffness_parameter": 5e5,
                                "girders": 5.0}}, "rating.distribution.girders", "whole number"),
    ({**STEEL, "distribution": {"girder": "interior", "spacing": -8, "span": 60,
                                "slab_thickness": 8, "stiffness_parameter": 5e5, "girders": 5}},
     "rating.distribution.spacing", "spacing"),
    ({**STEEL, "distribution": {"girder": "interior", "spacing": 18, "span": 60,
                                "slab_thickness": 8, "stiffness_parameter": 5e5, "girders": 5}},
     "rating.distribution.spacing", "outside the range"),
    ({**STEEL, "distribution": {"girder": "exterior", "spacing": 8, "span": 60,
                                "slab_thickness": 8, "stiffness_parameter": 5e5, "girders": 5,
                                "edge_distance": 7.0}}, "rating.distribution.edge_distance",
     "outside the range"),
    ({**STEEL, "distribution": {"girder": "interior", "spacing": 8, "span": 60,
                                "slab_thickness": 8, "stiffness_parameter": 5e5, "girders": 5,
                                "nominal": 3}}, "rating.distribution", "[[capacity]]"),
    ({**STEEL, "distribution": {"girder": "interior", "spacing": 8, "span": 60,
                                "slab_thickness": 8, "stiffness_parameter": 5e5, "girders": 5,
                                "rigid_section": "yes"}}, "rating.distribution.rigid_section",
     "true or false"),
    ({**STEEL, "impact": 1.5}, "rating.impact", "fraction"),
    ({**STEEL, "sign_increment": -1.0}, "rating.sign_increment", "greater than 0"),
    ({**STEEL, "overlay_measured": 1}, "rating.overlay_measured", "true or false"),
    ({**STEEL, "surface": "rough"}, "rating.surface", "not known"),
])
def test_bad_rating_table(rating, item, words):
    error = refused(rating)
    assert error.item == item
    assert words in str(error)


def test_a_key_of_another_table_says_where_it_belongs():
    error = refused({**STEEL, "nominal": 5.0})
    assert error.fix == "it belongs in [[capacity]]"
    error = refused({**STEEL, "spacing": 5.0})
    assert error.fix == "it belongs in [rating.distribution]"
    error = refused({**STEEL, "colour": "red"})
    assert error.fix.startswith("allowed keys: adtt, condition_factor")


def test_rating_must_be_a_table_and_units_known():
    assert refused({}, document={"rating": 3}).item == "rating"
    assert refused(STEEL, units="lb-in").item == "units"
