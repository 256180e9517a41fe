"""The check and line commands, in-process (exit status and key output)."""

from __future__ import annotations

import json
from pathlib import Path

from tests.cli import invoke

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"


def test_check_summarises_the_overpass() -> None:
    code, output = invoke("check", str(EXAMPLES / "overpass.toml"))
    assert code == 0
    assert "Degree of static indeterminacy: 2" in output
    assert "path length 80 m" in output and "qualified engineer" in output


def test_line_json_carries_the_documented_fields(tmp_path: Path) -> None:
    plot = tmp_path / "line.svg"
    code, output = invoke("line", str(EXAMPLES / "overpass.toml"), "shear", "--at", "P1",
                          "--side", "left", "--positions", "0,12,24,40", "--format", "json",
                          "--plot", str(plot))
    assert code == 0
    document = json.loads(output)
    for key in ("response", "location", "side", "units", "positions", "ordinates",
                "breakpoints", "extremes", "areas"):
        assert key in document
    assert document["units"]["force"] == "kN" and document["side"] == "left"
    assert document["positions"] == [0.0, 12.0, 24.0, 40.0]
    # a load standing on the end support A1 goes straight into it: no shear anywhere (statics)
    assert abs(document["ordinates"][0]) < 1e-12
    assert plot.exists() and plot.read_text().startswith("<?xml")


def test_line_csv_has_units_in_the_column_names() -> None:
    code, output = invoke("line", str(EXAMPLES / "crane-runway.toml"), "reaction", "--at", "B4",
                          "--format", "csv", "--step", "5")
    assert code == 0
    header = [line for line in output.splitlines() if not line.startswith("#")][0]
    assert header == "load chainage [ft],ordinate [kip/kip]"


def test_bad_plot_extension_is_refused_without_a_file(tmp_path: Path) -> None:
    target = tmp_path / "line.gif"
    code, output = invoke("line", str(EXAMPLES / "overpass.toml"), "moment", "--at", "40",
                          "--plot", str(target))
    assert code == 1 and ".png, .svg or .pdf" in output and not target.exists()
