"""`influence rate` and `influence permit`: outputs, the JSON the issue asks for, and bad input
answered in one line with exit status 1."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from influence.errors import ModelError
from influence.rating.run import rate
from tests.cli import invoke
from tests.rating_files import simple_span, vehicle_file, write_toml

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"
BRIDGE = str(EXAMPLES / "pellow-brook-bridge.toml")
CARRIER = str(EXAMPLES / "vehicles" / "crane-carrier-5-axle.toml")

RATING_KEYS = {"section", "chainage", "response", "sense", "vehicle", "level", "method",
               "limit_state", "rating_factor", "capacity", "dead", "live", "live_load_factor",
               "placement"}


@pytest.fixture(scope="module")
def document():
    code, output = invoke("rate", BRIDGE, "--vehicle", "Type 3", "--vehicle", "NRL",
                          "--vehicle", "SU4", "--vehicle", "SU5", "--vehicle", "SU6",
                          "--vehicle", "SU7", "--level", "legal", "--format", "json")
    assert code == 0, output
    return json.loads(output)


def test_rate_json_has_the_fields_of_the_issue(document):
    assert document["ratings"]
    for entry in document["ratings"]:
        assert set(entry) >= RATING_KEYS
        assert entry["method"] == "LRFR"
        assert set(entry["dead"]) == {"deck", "parapet", "surfacing"}
        assert entry["placement"]["vehicle"] == entry["vehicle"]
    summary = {(s["vehicle"], s["level"]) for s in document["summary"]}
    assert summary == {(v, "legal") for v in ("Type 3", "NRL", "SU4", "SU5", "SU6", "SU7")}
    assert all("why" in s and s["section"] for s in document["summary"])


def test_rate_json_traces_each_factor(document):
    entry = next(e for e in document["ratings"] if e["rating_factor"] != "inf")
    detail = entry["live_detail"]
    live = detail["distribution"] * (detail["vehicle_static"] * (1 + detail["impact"])
                                     + detail["lane"])
    assert abs(live) == pytest.approx(entry["live"], rel=1e-12)
    dead = sum(term["factor"] * term["effect"] for term in entry["dead_factored"])
    assert entry["rating_factor"] == pytest.approx(
        (entry["capacity"] - dead) / (entry["live_load_factor"] * entry["live"]), rel=1e-12)


def test_rate_json_postings(document):
    postings = document["postings"]
    assert postings["level"] == "legal"
    assert [p["vehicle"] for p in postings["legal"]] == ["Type 3"]
    screening = postings["single_unit"]
    assert screening["screening_vehicle"] == "NRL"
    assert screening["screened_out"] == (screening["screening_factor"] >= 1.0)
    assert [p["vehicle"] for p in screening["postings"]] == ["SU4", "SU5", "SU6", "SU7"]


def test_rate_table_carries_the_header_and_every_table():
    code, output = invoke("rate", BRIDGE, "--level", "inventory")
    assert code == 0, output
    for words in ("Units: force kip, length ft, moment kip-ft.", "Sign conventions:",
                  "Caution:", "lowest rating factor per vehicle and level", "postings",
                  "rating factors", "not rated", "from memory, unconfirmed"):
        assert words in output
    assert "HL-93" in output and "design inventory" in output


def test_rate_csv():
    code, output = invoke("rate", BRIDGE, "--level", "operating", "--format", "csv")
    assert code == 0, output
    assert output.startswith("# Quarry Lane bridge")
    assert "vehicle,level,limit state,RF [-]" in output


def test_permit_pass_and_fail():
    code, output = invoke("permit", BRIDGE, "--vehicle", CARRIER, "--escorted")
    assert code == 0, output
    assert "Overall: PASS" in output
    assert "Restriction assumed: special permit, single trip, escorted" in output
    code, output = invoke("permit", BRIDGE, "--vehicle", CARRIER)
    assert "Overall: FAIL; governing section P1" in output
    assert " FAIL " in output and " PASS " in output


def test_permit_json():
    code, output = invoke("permit", BRIDGE, "--vehicle", CARRIER, "--escorted", "--crawl",
                          "--trips", "single", "--adtt", "400", "--format", "json")
    assert code == 0, output
    document = json.loads(output)
    assert document["verdict"] == "PASS"
    assert document["crossing"] == {"type": "special", "frequency": "single trip",
                                    "loading": "escorted, no other vehicles", "crawl": True}
    assert document["adtt"] == 400.0
    assert all(e["live_detail"]["impact"] == 0.0 for e in document["ratings"])
    assert {s["result"] for s in document["sections"]} == {"PASS"}


def _one_line_error(code: int, output: str, words: str) -> None:
    assert code == 1, output
    assert "Traceback" not in output
    lines = [line for line in output.splitlines() if line.strip()]
    assert len(lines) == 1 and lines[0].startswith("error:"), output
    assert words in lines[0], output


def _capacity(**changes):
    return [{"response": "moment", "sense": "positive", "from": 0.0, "to": 20.0,
             "nominal": 1000.0, **changes}]


@pytest.mark.parametrize(("document", "words"), [
    (simple_span(20.0, capacities=_capacity(nominal=-1000.0)), "has the wrong sign"),
    (simple_span(20.0, capacities=_capacity(to=30.0)), "runs off the path, 0 to 20"),
    (simple_span(20.0, capacities=_capacity(to=12.0) + _capacity(**{"from": 10.0})),
     "overlap at chainages 0 to 12 and 10 to 20"),
    (simple_span(20.0, rating={"method": "LRFR", "edition": "MBE 9th", "material": "steel"}),
     "unknown edition 'MBE 9th'"),
    (simple_span(20.0, rating={"method": "LRFD", "material": "steel"}),
     "rating.method = 'LRFD' is not known"),
    (simple_span(20.0, rating={"method": "LRFR", "material": "steel", "adtt": -10}),
     "adtt = -10 is negative"),
], ids=["capacity sign", "off the structure", "overlap", "edition", "method", "adtt"])
def test_bad_model_files(tmp_path, document, words):
    path = write_toml(tmp_path / "bad.toml", document)
    _one_line_error(*invoke("rate", str(path)), words)


def test_negative_huge_or_nan_adtt_on_the_command_line():
    _one_line_error(*invoke("permit", BRIDGE, "--vehicle", CARRIER, "--adtt", "-5"),
                    "--adtt: -5 is out of range")
    _one_line_error(*invoke("rate", BRIDGE, "--adtt", "1e300"), "--adtt: 1e300 is out of range")
    _one_line_error(*invoke("permit", BRIDGE, "--vehicle", CARRIER, "--adtt", "nan"),
                    "--adtt: 'nan' is not a number")


def test_the_library_refuses_a_negative_or_nan_adtt():
    for adtt, problem in ((-5.0, "ADTT -5.0 is negative"), (float("nan"), "ADTT nan is not")):
        with pytest.raises(ModelError, match=problem):
            rate(BRIDGE, adtt=adtt)


def test_permit_file_without_axles(tmp_path):
    path = write_toml(tmp_path / "lane.toml", {"vehicle": {
        "name": "lane only", "units": "kip-ft", "lane": 0.5}})
    _one_line_error(*invoke("permit", BRIDGE, "--vehicle", str(path)),
                    "the permit vehicle has no axles")


def test_crawl_needs_an_escort():
    _one_line_error(*invoke("permit", BRIDGE, "--vehicle", CARRIER, "--crawl"),
                    "a crawl crossing is an escorted permit rule")


def test_no_rating_table(tmp_path):
    document = simple_span(20.0)
    del document["rating"]
    _one_line_error(*invoke("rate", str(write_toml(tmp_path / "m.toml", document))),
                    "no [rating] table")


def test_vehicle_at_the_wrong_level(tmp_path):
    truck = vehicle_file(tmp_path, "truck", [20.0], [], "legal")
    path = write_toml(tmp_path / "m.toml", simple_span(20.0))
    _one_line_error(*invoke("rate", str(path), "--vehicle", str(truck), "--level",
                            "inventory"), "is rated at legal, not at design inventory")
