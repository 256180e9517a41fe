"""Model files: both forms read, and every bad input gives one clear line naming file and fix."""

from __future__ import annotations

from pathlib import Path

import pytest

from influence.analysis.lines import analyse_model
from influence.errors import MechanismError, ModelError
from influence.model.reader import read_model
from tests.cli import invoke

GOOD = """
title = "test girder"
units = "kN-m"
[beam]
spans = [10.0, 12.0]
EI = 2.0e5
supports = ["pinned", "roller", "roller"]
"""


def write(tmp_path: Path, text: str, name: str = "model.toml") -> Path:
    path = tmp_path / name
    path.write_text(text)
    return path


def test_beam_form_reads(tmp_path: Path) -> None:
    model = read_model(write(tmp_path, GOOD))
    assert [n.name for n in model.nodes] == ["S1", "S2", "S3"]
    assert model.form == "beam"


def test_stepped_EI_and_springs_and_names(tmp_path: Path) -> None:
    text = GOOD.replace('EI = 2.0e5', 'EI = [[[0, 4, 2.0e5], [4, 10, 3.0e5]], 2.5e5]').replace(
        'supports = ["pinned", "roller", "roller"]',
        'supports = ["pinned", {vertical = 5.0e4, rotational = 1.0e6}, "roller"]\n'
        'names = ["W", "M", "E"]')
    model = read_model(write(tmp_path, text))
    assert [m.name for m in model.members] == ["span1a", "span1b", "span2"]
    assert model.node("M").support.uy == 5.0e4


@pytest.mark.parametrize(("change", "expected"), [
    (("spans = [10.0, 12.0]", "spans = [10.0, 12.0"), "line"),
    (("units = \"kN-m\"", "units = \"kN-m\"\ncolour = \"red\""), "unknown key 'colour'"),
    (("spans = [10.0, 12.0]", "spans = [10.0, -12.0]"), "span 2 length -12 is not positive"),
    (("EI = 2.0e5", "EI = 0.0"), "not positive"),
    (('["pinned", "roller", "roller"]', '["pinned", "roller"]'), "2 supports for 2 spans"),
    (('["pinned", "roller", "roller"]', '["pinned", "sliding", "roller"]'), "'sliding'"),
    (("EI = 2.0e5", "EI = 2.0e5\nhinges = [10.0]"), "stands on support S2"),
    (("units = \"kN-m\"", "units = \"N-mm\""), "units 'N-mm'"),
])
def test_bad_inputs_give_one_line(tmp_path: Path, change: tuple[str, str], expected: str) -> None:
    path = write(tmp_path, GOOD.replace(*change))
    with pytest.raises(ModelError) as caught:
        read_model(path)
    assert expected in str(caught.value) and str(path) in str(caught.value)
    code, output = invoke("check", str(path))
    assert code == 1
    lines = output.strip().splitlines()
    assert len(lines) == 1 and lines[0].startswith("error:") and "Traceback" not in output


def test_mechanism_names_the_part_and_the_fix(tmp_path: Path) -> None:
    # a hinge in the middle of a two-span girder whose end support is missing
    text = GOOD.replace('["pinned", "roller", "roller"]', '["pinned", "roller", "free"]') + \
        "hinges = [15.0]\n"
    with pytest.raises(MechanismError) as caught:
        analyse_model(read_model(write(tmp_path, text)))
    message = str(caught.value)
    assert "mechanism" in message and "S3" in message and "add a support" in message


def test_all_rollers_slide(tmp_path: Path) -> None:
    text = GOOD.replace('["pinned", "roller", "roller"]', '["roller", "roller", "roller"]')
    code, output = invoke("check", str(write(tmp_path, text)))
    assert code == 1 and "horizontally" in output


def test_location_errors(tmp_path: Path) -> None:
    path = str(write(tmp_path, GOOD))
    code, output = invoke("line", path, "moment", "--at", "30")
    assert code == 1 and "outside the path (0 to 22)" in output
    code, output = invoke("line", path, "reaction", "--at", "Q7")
    assert code == 1 and "'Q7' is not a chainage, a node or MEMBER@DISTANCE" in output
    code, output = invoke("line", path, "reaction", "--at", "5")
    assert code == 1 and "supports are: S1, S2, S3" in output


def test_missing_file() -> None:
    code, output = invoke("check", "no-such-model.toml")
    assert code == 1 and "file not found" in output
