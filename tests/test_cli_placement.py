"""`influence govern` and `influence sweep`, in-process."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from tests.cli import invoke

OVERPASS = str(Path(__file__).resolve().parent.parent / "examples" / "overpass.toml")


def test_govern_json_carries_the_documented_fields(tmp_path: Path) -> None:
    plot = tmp_path / "govern.png"
    code, output = invoke("govern", OVERPASS, "moment", "--at", "40", "--vehicle", "HL-93",
                          "--top", "3", "--concurrent", "reaction@P1", "--format", "json",
                          "--plot", str(plot))
    assert code == 0, output
    document = json.loads(output)
    for key in ("response", "location", "units", "max", "min", "top"):
        assert key in document
    best = document["max"]
    for key in ("value", "vehicle", "case", "direction", "lead_position", "axle_positions",
                "ranged_values", "lane_segments", "concurrent"):
        assert key in best
    assert best["vehicle"] == "HL-93" and best["concurrent"][0]["response"] == "reaction"
    assert "converted from kip-ft to kN-m" in document["notes"][0]
    # the girder is symmetric about 40: each reverse placement mirrors a forward one, and the
    # tandem's two peaks mirror each other, so two distinct positions remain (truck, tandem)
    assert [p["case"] for p in document["top"]["max"]] == ["design truck + lane",
                                                           "design tandem + lane"]
    values = [p["value"] for p in document["top"]["max"]]
    assert values == sorted(values, reverse=True) and values[0] == best["value"]
    assert plot.stat().st_size > 10_000


def test_unknown_vehicle_lists_close_matches() -> None:
    code, output = invoke("govern", OVERPASS, "moment", "--at", "40", "--vehicle", "HL93x")
    assert code == 1 and "HL-93" in output and len(output.strip().splitlines()) == 1


def test_sweep_table_and_bad_case(tmp_path: Path) -> None:
    plot = tmp_path / "sweep.pdf"
    code, output = invoke("sweep", OVERPASS, "reaction", "--at", "A1", "--vehicle", "LM2",
                          "--direction", "forward", "--step", "10", "--format", "csv",
                          "--plot", str(plot))
    assert code == 0, output
    assert plot.read_bytes()[:5] == b"%PDF-"
    rows = [line for line in output.splitlines() if not line.startswith("#")]
    assert rows[0].startswith("case,direction,lane for,gaps used [m],lead [m],effect [kN]")
    code, output = invoke("sweep", OVERPASS, "moment", "--at", "40", "--vehicle", "LM2",
                          "--case", "nope")
    assert code == 1 and "no case named 'nope'" in output


def test_bad_concurrent_spec() -> None:
    code, output = invoke("govern", OVERPASS, "moment", "--at", "40", "--vehicle", "LM2",
                          "--concurrent", "torque@P1")
    assert code == 1 and "RESPONSE@LOCATION" in output


def test_adjustment_scales_the_effect_and_unknown_names_are_refused() -> None:
    # EN 1991-2 6.3.2(3): the classification factor alpha multiplies Load Model 71 (axles and
    # uniform load alike), so every effect scales with it
    args = ("govern", OVERPASS, "moment", "--at", "40", "--vehicle", "LM71", "--format", "json")
    plain = json.loads(invoke(*args)[1])["max"]["value"]
    code, output = invoke(*args, "--adjust", "alpha=1.21")
    assert code == 0, output
    assert json.loads(output)["max"]["value"] == pytest.approx(1.21 * plain)
    code, output = invoke(*args, "--adjust", "beta=2")
    assert code == 1 and "no load model given has an adjustment named 'beta'" in output
