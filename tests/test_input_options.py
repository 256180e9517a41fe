"""Options that make no sense and requests too large for the machine are refused before any work
starts, in one line naming the option and the fix, with nothing written; the library refuses
the same requests with our own errors."""

from __future__ import annotations

from pathlib import Path

import pytest
from click.testing import CliRunner
from hypothesis import given, settings
from hypothesis import strategies as st

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.cli import main
from influence.design.sections import envelope_sections
from influence.errors import InfluenceError, ModelError
from influence.model.limits import MAX_SECTIONS, MAX_TABLE_ROWS
from influence.model.reader import read_model, read_model_file
from influence.output.line_tables import positions
from tests.cli import invoke, refused
from vehicles.errors import VehicleError
from vehicles.library.catalog import load_model
from vehicles.search.sweep import sweep

OVERPASS = str(Path(__file__).resolve().parent.parent / "examples" / "overpass.toml")
LINE = ("line", OVERPASS, "moment", "--at", "P1")
SWEEP = ("sweep", OVERPASS, "moment", "--at", "P1", "--vehicle", "HL-93")
GOVERN = ("govern", OVERPASS, "moment", "--at", "P1", "--vehicle", "HL-93")
ENVELOPE = ("envelope", OVERPASS, "--quiet", "--responses", "moment")

SENSELESS = {
    "zero step": (LINE, ("--step", "0"), "--step", "not a positive length"),
    "negative step": (LINE, ("--step", "-1"), "--step", "not a positive length"),
    "NaN step": (LINE, ("--step", "nan"), "--step", "'nan' is not a number"),
    "infinite step": (LINE, ("--step", "inf"), "--step", "'inf' is not a number"),
    "text step": (LINE, ("--step", "abc"), "--step", "'abc' is not a number"),
    "NaN sweep step": (SWEEP, ("--step", "nan"), "--step", "not a number"),
    "zero envelope step": (ENVELOPE, ("--step", "0"), "--step", "not a positive length"),
    "zero per span": (ENVELOPE, ("--per-span", "0"), "--per-span", "0 is out of range"),
    "negative per span": (ENVELOPE, ("--per-span", "-3"), "--per-span", "out of range"),
    "empty positions": (LINE, ("--positions", ""), "--positions", "no positions given"),
    "only commas": (LINE, ("--positions", ",,"), "--positions", "no positions given"),
    "an empty position": (LINE, ("--positions", "1,,2"), "--positions", "an empty entry"),
    "NaN position": (LINE, ("--positions", "nan"), "--positions", "'nan' is not a number"),
    "position off the path": (LINE, ("--positions", "0,200"), "--positions",
                              "position 200 is off the path (0 to 80)"),
    "zero top": (GOVERN, ("--top", "0"), "--top", "0 is out of range"),
    "NaN adjustment": (("govern", OVERPASS, "moment", "--at", "P1", "--vehicle", "LM71"),
                       ("--adjust", "alpha=nan"), "adjustment alpha", "nan is not allowed"),
    "huge adjustment": (("govern", OVERPASS, "moment", "--at", "P1", "--vehicle", "LM71"),
                        ("--adjust", "alpha=1e300"), "adjustment alpha", "is not allowed"),
}

TOO_LARGE = {
    "a line step of 1e-8": (LINE, ("--step", "1e-8"), "table rows"),
    "a sweep step of 1e-8": (SWEEP, ("--step", "1e-8"), "rows"),
    "an envelope step of 1e-8": (ENVELOPE, ("--step", "1e-8"), "envelope sections"),
    "a billion divisions a span": (ENVELOPE, ("--per-span", "1000000000"), "out of range"),
    "a million positions": (LINE, ("--positions", ",".join(["1"] * (MAX_TABLE_ROWS + 1))),
                            "positions are more than"),
}


@pytest.mark.parametrize("case", SENSELESS, ids=list(SENSELESS))
def test_an_option_that_makes_no_sense_is_refused(tmp_path: Path, case: str) -> None:
    command, option, item, words = SENSELESS[case]
    plot = tmp_path / "figure.png"
    message = refused(*command, *option, "--plot", str(plot))
    assert item in message and words in message and "(" in message
    assert not plot.exists()


@pytest.mark.parametrize("case", TOO_LARGE, ids=list(TOO_LARGE))
def test_a_request_too_large_is_refused_with_its_size(tmp_path: Path, case: str) -> None:
    command, option, words = TOO_LARGE[case]
    plot = tmp_path / "figure.png"
    message = refused(*command, *option, "--plot", str(plot))
    assert words in message
    assert not plot.exists()


def test_an_empty_out_is_refused_and_nothing_is_written(tmp_path: Path) -> None:
    message = refused("report", OVERPASS, "--out", "", "--quiet")
    assert "--out" in message and "is empty" in message


def test_a_report_refused_for_its_options_writes_no_folder(tmp_path: Path) -> None:
    out = tmp_path / "report"
    refused("report", OVERPASS, "--out", str(out), "--quiet", "--step", "nan")
    assert not out.exists()


def test_sensible_options_still_work() -> None:
    status, output = invoke(*LINE, "--positions", " 0, 12.5 ,80")
    assert status == 0 and "12.5" in output
    status, _ = invoke(*ENVELOPE, "--per-span", "4")
    assert status == 0


def test_the_library_refuses_the_same_requests() -> None:
    model = read_model(OVERPASS)
    analysis = analyse_model(model)
    line = analysis.line(Response("moment", "P1"))
    with pytest.raises(ModelError, match="table rows"):
        positions(line, 1e-8)
    case = load_model("HL-93", units="kN-m").cases[0]
    for step in (1e-8, float("nan"), 0.0, -1.0):
        with pytest.raises(VehicleError):
            sweep(line.function, case, kind="moment", step=step)
    with pytest.raises(ModelError, match="envelope sections"):
        envelope_sections(model, analysis.path, step=1e-6)
    with pytest.raises(ModelError, match=f"more than {MAX_SECTIONS:,}"):
        envelope_sections(model, analysis.path, per_span=10**9)


@pytest.mark.parametrize(("settings", "item"), [
    ("per_span = 0", "sections.per_span"),
    ("per_span = 1000000000", "sections.per_span"),
    ("step = 1e-9", "sections.step"),
    ("step = 0.0", "sections.step"),
    ('step = "1e-9 m"', "sections.step"),
])
def test_file_section_settings_too_large_or_senseless(tmp_path: Path, settings: str,
                                                      item: str) -> None:
    path = tmp_path / "g.toml"
    path.write_text('[beam]\nspans = [10.0]\nEI = 1.0\nsupports = ["pinned", "roller"]\n'
                    f"[sections]\n{settings}\n")
    with pytest.raises(InfluenceError) as caught:
        read_model_file(path)
    assert caught.value.item == item
    assert item in refused("envelope", str(path), "--vehicle", "HL-93", "--quiet")


def test_a_train_with_too_many_ranged_gaps_is_refused(tmp_path: Path) -> None:
    from vehicles.limits import MAX_RANGED

    count = MAX_RANGED + 1
    path = tmp_path / "v.toml"
    path.write_text('[vehicle]\nname = "many"\nunits = "kN-m"\n'
                    f"loads = [{', '.join(['10'] * (count + 1))}]\n"
                    f"spacings = [{', '.join(['[1, 3]'] * count)}]\n")
    with pytest.raises(VehicleError, match=f"{count} ranged gaps and lengths are more than"):
        load_model(path)
    assert "ranged gaps" in refused(*GOVERN[:-1], str(path))


def test_a_train_of_too_many_axles_is_refused(tmp_path: Path) -> None:
    from vehicles.train import MAX_ITEMS

    path = tmp_path / "v.toml"
    path.write_text('[vehicle]\nname = "long"\nunits = "kN-m"\n'
                    f"loads = [{', '.join(['10'] * (MAX_ITEMS + 1))}]\n"
                    f"spacings = [{', '.join(['1.5'] * MAX_ITEMS)}]\n")
    with pytest.raises(VehicleError, match="axles and patches are more than"):
        load_model(path)


@settings(max_examples=60, deadline=None)
@given(option=st.sampled_from(["--step", "--positions", "--at"]),
       text=st.text(alphabet="0123456789.,-+eEnaifP1@span ", max_size=12))
def test_any_option_text_ends_in_a_result_or_one_line(option: str, text: str) -> None:
    args = ["line", OVERPASS, "moment", "--at", "P1"]
    args = args[:-1] + [text] if option == "--at" else [*args, option, text]
    result = CliRunner().invoke(main, args)
    assert result.exception is None or isinstance(result.exception, SystemExit), (
        f"{args}: {result.exception!r}")
    if result.exit_code == 1:
        assert result.output.startswith("error: ") and result.output.count("\n") == 1
    else:
        assert result.exit_code in (0, 2)
