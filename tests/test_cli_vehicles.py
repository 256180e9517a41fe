"""The ``influence vehicles`` command, run in-process with click's CliRunner."""

from __future__ import annotations

import json
from pathlib import Path

from click.testing import CliRunner

from influence.cli import main


def run(*args: str) -> tuple[int, str, str]:
    result = CliRunner().invoke(main, ["vehicles", *args])
    return result.exit_code, result.stdout, result.stderr


def test_no_argument_lists_the_library() -> None:
    code, out, _ = run()
    assert code == 0
    for name in ("HL-93", "HS20-44", "LM1", "LM71", "SW/2", "Cooper E80"):
        assert name in out
    assert "50 to 144 kip" in out  # HL-93: tandem 2 x 25 kip up to the 2 x 72 kip truck pair


def test_list_as_json_in_other_units() -> None:
    code, out, _ = run("--units", "kN-m", "--format", "json")
    rows = {row["name"]: row for row in json.loads(out)}
    assert code == 0 and rows["HL-93"]["units"] == "kN-m"


def test_one_model_shows_axles_cases_and_source() -> None:
    code, out, _ = run("hl-93")
    assert code == 0
    assert "design tandem + lane" in out and "14 to 30 ft" in out
    assert "AASHTO LRFD" in out
    assert "negative moment between contraflexure points, interior reaction" in out


def test_adjust_and_plot(tmp_path: Path) -> None:
    image = tmp_path / "lm71.png"
    code, out, err = run("LM71", "--adjust", "alpha=1.1", "--format", "json", "--plot", str(image))
    assert code == 0, err
    axle = json.loads(out)["cases"][0]["train"]["items"][0]
    assert abs(axle["load"] - 275.0) < 1e-9
    assert image.read_bytes().startswith(b"\x89PNG")
    assert [p.name for p in tmp_path.iterdir()] == ["lm71.png"]


def test_a_vehicle_file(tmp_path: Path) -> None:
    path = tmp_path / "crane.toml"
    path.write_text('[vehicle]\nname = "bay crane"\nunits = "kN-m"\nloads = [180, 180]\n'
                    "spacings = [3.6]\n")
    code, out, _ = run(str(path), "--units", "kip-ft")
    assert code == 0 and "bay crane" in out and "kip" in out


def test_errors_are_one_line_with_status_1(tmp_path: Path) -> None:
    code, _, err = run("LM 17")
    assert code == 1 and err.count("\n") == 1 and "did you mean" in err
    bad = tmp_path / "bad.toml"
    bad.write_text('[vehicle]\nname = "x"\nunits = "kN-m"\nloads = [10, 10]\nspacings = [0]\n')
    code, _, err = run(str(bad))
    assert code == 1 and "bad.toml" in err and "spacings[1]" in err


def test_usage_errors_have_status_2() -> None:
    assert run("--plot", "x.png")[0] == 2
    assert run("LM71", "--adjust", "alpha")[0] == 2
    assert run("LM71", "--units", "lb-in")[0] == 2


def test_a_bad_drawing_name_fails_before_any_output(tmp_path: Path) -> None:
    code, out, err = run("LM2", "--plot", str(tmp_path / "drawing.xyz"))
    assert code == 1 and out == "" and "'.xyz'" in err
    assert list(tmp_path.iterdir()) == []
