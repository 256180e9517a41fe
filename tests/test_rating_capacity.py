"""[[capacity]] entries: reading, checks with and without the structure, and the lookup."""

from __future__ import annotations

import pytest

from influence.errors import ModelError
from influence.rating import Capacity, capacities, capacity_at, check_on_structure

SOURCE = "bridge.toml"
SAG_1 = {"response": "moment", "sense": "positive", "from": 0.0, "to": 24.0, "nominal": 5400.0}
SAG_2 = {"response": "moment", "sense": "positive", "from": 24.0, "to": 56.0, "nominal": 7000.0,
         "resistance_factor": 0.9}
HOG = {"response": "moment", "sense": "negative", "sections": ["P1", "56.0"], "nominal": -6000.0,
       "service": -4200.0}
SHEAR = {"response": "shear", "sense": "positive", "members": ["span1"], "nominal": 400.0,
         "name": "span 1 shear"}
MEMBERS = {"span1": (0.0, 24.0), "span2": (24.0, 56.0), "span3": (56.0, 80.0)}


def read(*entries: dict, method: str = "LRFR"):
    return capacities({"capacity": list(entries)}, method, SOURCE)


def refused(*entries: dict, method: str = "LRFR", document: dict | None = None) -> ModelError:
    with pytest.raises(ModelError) as caught:
        capacities(document if document is not None else {"capacity": list(entries)}, method,
                   SOURCE)
    message = str(caught.value)
    assert "\n" not in message and message.startswith(SOURCE) and caught.value.fix
    return caught.value


ENTRIES = read(SAG_1, SAG_2, HOG, SHEAR)


def test_entries_are_read():
    first, second, hogging, shear = ENTRIES
    assert (first.start, first.end, first.nominal, first.resistance_factor) == (
        0.0, 24.0, 5400.0, 1.0)
    assert second.factored == pytest.approx(6300.0)
    assert hogging.sections == ("P1", "56.0") and hogging.service == -4200.0
    assert shear.members == ("span1",) and shear.label == "capacity 'span 1 shear'"
    check_on_structure(ENTRIES, 80.0, MEMBERS, SOURCE)


def test_lookup_by_range_member_and_section():
    assert capacity_at(ENTRIES, "moment", "positive", chainage=10.0).nominal == 5400.0
    assert capacity_at(ENTRIES, "moment", "positive", chainage=30.0).nominal == 7000.0
    assert capacity_at(ENTRIES, "moment", "negative", label="P1").nominal == -6000.0
    assert capacity_at(ENTRIES, "moment", "negative", chainage=56.0).nominal == -6000.0
    assert capacity_at(ENTRIES, "shear", "positive", member="span1").nominal == 400.0


def test_a_section_without_capacity_is_not_rated():
    assert capacity_at(ENTRIES, "moment", "positive", chainage=70.0) is None
    assert capacity_at(ENTRIES, "moment", "negative", chainage=30.0) is None
    assert capacity_at(ENTRIES, "shear", "negative", member="span1") is None
    assert capacity_at(ENTRIES, "axial", "positive", chainage=10.0) is None


def test_shared_range_end_takes_the_weaker_capacity():
    # at 24.0 both ranges apply: 1.0 x 5400 is weaker than 0.9 x 7000 = 6300
    assert capacity_at(ENTRIES, "moment", "positive", chainage=24.0).nominal == 5400.0


def test_a_section_entry_wins_over_a_member_and_a_member_over_a_range():
    entries = read(SAG_1, {"response": "moment", "sense": "positive", "members": ["span2"],
                           "nominal": 100.0},
                   {"response": "moment", "sense": "positive", "sections": ["S7"],
                    "nominal": 50.0})
    assert capacity_at(entries, "moment", "positive", chainage=10.0, member="span2",
                       label="S7").nominal == 50.0
    assert capacity_at(entries, "moment", "positive", chainage=10.0,
                       member="span2").nominal == 100.0


def test_asr_entries_carry_allowable_effects():
    entries = read({"response": "moment", "sense": "negative", "from": 0.0, "to": 10.0,
                    "allowable": {"inventory": -2900.0, "operating": -3950.0}}, method="ASR")
    assert entries[0].nominal is None and entries[0].factored is None
    assert entries[0].allowable_at("operating") == -3950.0
    assert entries[0].allowable_at("legal") is None
    assert capacity_at(entries, "moment", "negative", chainage=5.0) is entries[0]


@pytest.mark.parametrize(("entry", "words"), [
    ({**SAG_1, "nominal": -5400.0}, "wrong sign"),
    ({**HOG, "nominal": 6000.0}, "wrong sign"),
    ({**HOG, "service": 4200.0}, "service = 4200 has the wrong sign"),
    ({**SAG_1, "allowable": {"inventory": -10.0}}, "allowable.inventory"),
    ({**SAG_1, "members": ["span1"]}, "one way"),
    ({"response": "moment", "sense": "positive", "nominal": 10.0}, "one way"),
    ({**SAG_1, "to": 0.0}, "to greater than from"),
    ({k: v for k, v in SAG_1.items() if k != "to"}, "from and to"),
    ({**SAG_1, "response": "torque"}, "not known"),
    ({**SAG_1, "sense": "sagging"}, "not known"),
    ({k: v for k, v in SAG_1.items() if k != "response"}, "missing key 'response'"),
    ({k: v for k, v in SAG_1.items() if k != "nominal"}, "missing key 'nominal'"),
    ({**SAG_1, "resistance_factor": 1.1}, "outside (0, 1]"),
    ({**SAG_1, "resistance_factor": 0.0}, "outside (0, 1]"),
    ({**SAG_1, "nominal": "big"}, "not a number"),
    ({**SHEAR, "members": "span1"}, "give a list of names"),
    ({**SAG_1, "allowable": {"legal": 3.0}}, "unknown key 'legal'"),
    ({**SAG_1, "adtt": 300}, "unknown key 'adtt'"),
    ({**SAG_1, "colour": "red"}, "unknown key 'colour'"),
])
def test_bad_entry(entry, words):
    assert words in str(refused(entry))


def test_key_of_another_table_says_where_it_belongs():
    assert refused({**SAG_1, "adtt": 300}).fix == "it belongs in [rating]"
    assert refused({**SAG_1, "girders": 5}).fix == "it belongs in [rating.distribution]"


def test_asr_needs_allowable_effects():
    assert "allowable" in str(refused(SAG_1, method="ASR"))


def test_not_a_list_or_unknown_method():
    refused(document={"capacity": {"response": "moment"}})
    refused(document={"capacity": ["moment"]})
    refused(SAG_1, method="LRFD")


@pytest.mark.parametrize(("first", "second"), [
    (SAG_1, {**SAG_1, "from": 20.0, "to": 30.0}),
    (SAG_1, {**SAG_1, "from": 5.0, "to": 10.0}),
    (SHEAR, {**SHEAR, "members": ["span2", "span1"], "name": ""}),
    (HOG, {**HOG, "sections": ["P1"]}),
])
def test_overlaps_of_the_same_response_and_sense(first, second):
    assert "overlap" in str(refused(first, second))


def test_touching_ranges_and_other_senses_do_not_overlap():
    read(SAG_1, SAG_2, {**SAG_1, "sense": "negative", "nominal": -1.0},
         {**SAG_1, "response": "shear"})


def test_checks_on_the_structure():
    with pytest.raises(ModelError, match="runs off the path"):
        check_on_structure(read(SAG_1, SAG_2), 50.0, MEMBERS, SOURCE)
    with pytest.raises(ModelError, match="no path member named 'span9'") as caught:
        check_on_structure(read({**SHEAR, "members": ["span9"]}), 80.0, MEMBERS, SOURCE)
    assert "span1, span2, span3" in str(caught.value)
    member_and_range = read({**SHEAR, "members": ["span2"]},
                            {"response": "shear", "sense": "positive", "from": 40.0,
                             "to": 60.0, "nominal": 300.0})
    with pytest.raises(ModelError, match="overlap at chainages 24 to 56 and 40 to 60"):
        check_on_structure(member_and_range, 80.0, MEMBERS, SOURCE)


def test_capacity_value_checks_itself():
    with pytest.raises(ModelError, match="wrong sign"):
        Capacity("shear", "negative", 10.0, start=0.0, end=1.0)
    with pytest.raises(ModelError, match="response"):
        Capacity("torque", "positive", 10.0, start=0.0, end=1.0)
