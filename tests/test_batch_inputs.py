"""Batch inputs, checks, tables and bad input, without a cluster: inventories (TOML and CSV),
route files, jobs and their kinds, the comparison with a reference loading, summaries and route
verdicts, Parquet and CSV tables, and the command's one-line errors.

Outside facts used: statics of a simple span (common practice): a vehicle compared with itself
has the ratio 1 wherever it has an effect; a unit load's reactions sum to the load.
"""

from __future__ import annotations

from pathlib import Path

import pytest
from click.testing import CliRunner
from hypothesis import given
from hypothesis import strategies as st

from influence.batch import engine
from influence.batch.comparison import Comparison, check
from influence.batch.envelope_kind import EnvelopeSettings
from influence.batch.govern_kind import GovernSettings
from influence.batch.inventory import read_inventory
from influence.batch.job import Run, read_job
from influence.batch.kinds import KINDS
from influence.batch.results import route_verdicts, summaries
from influence.batch.routes import Route, read_route_file, routes_of
from influence.batch.rows import ResultRow
from influence.batch.tables import read_records, write_results
from influence.batch.task import run_task
from influence.cli import main
from influence.errors import BatchError
from tests.batch_inventory import GOOD, write_inventory

EXAMPLES = Path(__file__).resolve().parent.parent / "examples" / "batch"
EXACT = 1e-12
"""Relative tolerance of values computed the same way twice."""


def test_the_example_inventory_reads_alike_from_toml_and_csv() -> None:
    from_toml = read_inventory(EXAMPLES / "harrow-county.toml")
    from_csv = read_inventory(EXAMPLES / "harrow-county.csv")
    fields = [(s.identifier, s.model_path, s.routes, s.owner, s.location)
              for s in from_toml.structures]
    assert fields == [(s.identifier, s.model_path, s.routes, s.owner, s.location)
                      for s in from_csv.structures]
    assert fields[2][2] == ("CR 12", "CR 30")
    assert all(Path(s.model_path).is_file() for s in from_toml.structures)


@pytest.mark.parametrize(("text", "problem"), [
    ("id,model\nB-1,\n", "the row has no model"),
    ("id,model\n,b1.toml\n", "the row has no id"),
    ("id,model,year\nB-1,b1.toml,1958\n", "unknown column 'year'"),
    ("id,route\nB-1,CR 4\n", "the header lacks the id or model column"),
    ("id,model\nB-1,b1.toml\nB-1,b2.toml\n", "id 'B-1' is used twice"),
    ("id,model\n", "no structures"),
])
def test_bad_inventory_rows_are_one_line_errors(tmp_path: Path, text: str, problem: str) -> None:
    path = tmp_path / "inventory.csv"
    path.write_text(text)
    with pytest.raises(BatchError) as caught:
        read_inventory(path)
    assert caught.value.problem == problem
    assert "\n" not in str(caught.value)


def test_a_model_path_that_does_not_exist_is_read_and_becomes_an_error_row(
        tmp_path: Path) -> None:
    path = tmp_path / "inventory.toml"
    path.write_text('[[structures]]\nid = "B-1"\nmodel = "nowhere/b1.toml"\n')
    (structure,) = read_inventory(path).structures
    run = Run("legal", KINDS["envelope"], ("Type 3",), settings=EnvelopeSettings())
    (row,) = run_task(structure, run)
    assert (row.structure, row.run, row.kind, row.status) == ("B-1", "legal", "envelope",
                                                              "error")
    assert row.message.endswith("b1.toml: file not found (check the path)")


def test_route_file_and_inventory_routes() -> None:
    inventory = read_inventory(EXAMPLES / "harrow-county.toml")
    named = read_route_file(EXAMPLES / "routes.toml")
    routes = routes_of(inventory, named)
    assert [r.name for r in routes] == ["Sedge Beck quarry to the A-road", "CR 12", "CR 30"]
    assert routes[0].structures == ("HC-131", "HC-122", "HC-114", "HC-107")
    assert routes[1].structures == ("HC-101", "HC-102", "HC-107")
    with pytest.raises(BatchError, match="names 'HC-999'"):
        routes_of(inventory, (Route("Ghost road", ("HC-101", "HC-999")),))


@pytest.mark.parametrize(("text", "problem"), [
    ('[[run]]\nkind = "rating"\n', "unknown job kind 'rating'"),
    ('[[run]]\nkind = "envelope"\nvehicles = ["Type 9"]\n', "no load model named 'Type 9'"),
    ('[[run]]\nkind = "envelope"\nper_span = 0\n', "expected a whole number of 1 or more, got 0"),
    ('[[run]]\nkind = "envelope"\nresponses = ["torsion"]\n', "unknown response 'torsion'"),
    ('[[run]]\nkind = "envelope"\nat = ["moment@P1"]\n', "unknown key 'at'"),
    ('[[run]]\nkind = "govern"\n', "a govern run needs sections"),
    ('[[run]]\nkind = "govern"\nat = ["moment P1"]\n', "'moment P1' is not RESPONSE@LOCATION"),
    ('[[run]]\nkind = "envelope"\ncompare_with = "design"\n', "compare_with = 'design'"),
    ('[[run]]\nkind = "envelope"\n[[run]]\nkind = "envelope"\n',
     "two runs are named 'envelope'"),
    ('title = "nothing to run"\n', "no run"),
    ('route = "Quarry haul"\nroutes = "routes.toml"\n[[run]]\nkind = "envelope"\n',
     "route 'Quarry haul' is not in the route file"),
])
def test_bad_jobs_are_one_line_errors(tmp_path: Path, text: str, problem: str) -> None:
    (tmp_path / "routes.toml").write_text('[[routes]]\nname = "CR 4"\nstructures = ["B-1"]\n')
    path = tmp_path / "job.toml"
    path.write_text(text)
    with pytest.raises(BatchError) as caught:
        read_job(path)
    assert caught.value.problem == problem


ROOT_EXAMPLES = EXAMPLES.parent


def _one_structure(tmp_path: Path, model: str, job: str):  # type: ignore[no-untyped-def]
    """Run one job table on one example model file, as a worker would."""
    inventory = tmp_path / "inventory.toml"
    inventory.write_text(f'[[structures]]\nid = "X-1"\nmodel = "{ROOT_EXAMPLES / model}"\n')
    path = tmp_path / "job.toml"
    path.write_text(job)
    (run,) = read_job(path).runs
    return run_task(read_inventory(inventory).structures[0], run)


def test_the_rate_adapter_gives_the_library_ratings_row_by_row(tmp_path: Path) -> None:
    """Batch rows equal rating the structure alone with influence.rating.run.rate."""
    from influence.rating.run import rate

    rows = _one_structure(tmp_path, "pellow-brook-bridge.toml",
                          '[[run]]\nkind = "rate"\nvehicles = ["Type 3"]\nlevels = ["legal"]\n')
    alone = rate(str(ROOT_EXAMPLES / "pellow-brook-bridge.toml"), vehicles=["Type 3"],
                 levels=["legal"])
    rated = [r for r in rows if r.value is not None]
    assert len(rated) == len(alone.ratings) > 0
    for row, rating in zip(rated, alone.ratings, strict=True):
        assert row.value == pytest.approx(rating.rating_factor, rel=EXACT)
        assert row.status == ("pass" if rating.rating_factor >= 1.0 else "fail")
        assert row.lead_position == rating.live.placement.lead_position
    assert len(rows) - len(rated) == len(alone.not_rated)


def test_the_permit_adapter_gives_each_sections_verdict(tmp_path: Path) -> None:
    from influence.rating.permit_check import check_permit

    vehicle = ROOT_EXAMPLES / "vehicles" / "crane-carrier-5-axle.toml"
    rows = _one_structure(tmp_path, "pellow-brook-bridge.toml",
                          f'[[run]]\nkind = "permit"\nvehicles = ["{vehicle}"]\n'
                          'escorted = true\n')
    alone = check_permit(str(ROOT_EXAMPLES / "pellow-brook-bridge.toml"), str(vehicle),
                         escorted=True)
    assert [r.value for r in rows] == pytest.approx([v.rating_factor for v in alone.sections])
    assert [r.status == "pass" for r in rows] == [v.passes for v in alone.sections]


def test_the_fatigue_adapter_gives_the_damage_of_every_detail(tmp_path: Path) -> None:
    from influence.fatigue.run import fatigue

    rows = _one_structure(tmp_path, "wrenfield-girder.toml",
                          '[[run]]\nkind = "fatigue"\nvehicles = ["HL-93 fatigue"]\n')
    alone = fatigue(str(ROOT_EXAMPLES / "wrenfield-girder.toml"), vehicle="HL-93 fatigue")
    assert [r.section for r in rows] == [d.detail.name for d in alone.details]
    for row, detail in zip(rows, alone.details, strict=True):
        life = detail.life
        damage = life.damage_per_year * max(life.design_life_years - life.age_years, 0.0)
        assert row.value == pytest.approx(damage, rel=EXACT)


@pytest.mark.parametrize(("text", "problem"), [
    ('[[run]]\nkind = "rate"\nadtt = -3\n', "adtt = -3 is negative"),
    ('[[run]]\nkind = "permit"\ntrips = "daily"\n', "trips = 'daily'"),
    ('[[run]]\nkind = "fatigue"\nspectrum = "nowhere.csv"\n', "spectrum file not found"),
    ('[[run]]\nkind = "rate"\nedition = "MBE 3rd"\n', "unknown key 'edition'"),
    ('[[run]]\nkind = "rate"\nlevels = ["bogus"]\n', "level 'bogus'"),
])
def test_bad_assessment_runs_are_refused_when_the_job_is_read(tmp_path: Path, text: str,
                                                            problem: str) -> None:
    path = tmp_path / "job.toml"
    path.write_text(text)
    with pytest.raises(BatchError) as caught:
        read_job(path)
    assert caught.value.problem == problem


def test_a_vehicle_checked_against_itself_has_the_ratio_one_where_it_acts(
        tmp_path: Path) -> None:
    inventory = read_inventory(write_inventory(tmp_path, GOOD))
    settings = EnvelopeSettings(("moment", "shear", "reaction"), per_span=5,
                                compare_with=Comparison(("Type 3S2",)))
    run = Run("self", KINDS["envelope"], ("Type 3S2",), settings=settings)
    for structure in inventory.structures:
        rows = run_task(structure, run)
        assert rows and all(r.status == "pass" for r in rows)
        acting = [r for r in rows if r.value and abs(r.value) > 1e-6]
        assert acting and all(r.ratio == pytest.approx(1.0, rel=EXACT) for r in acting)
        # statics: a reaction line of a girder peaks at 1 over its support (Mueller-Breslau),
        # so no reaction exceeds the vehicle's weight (72 kip) x (1 + IM 0.33) x scale 0.6
        reactions = [r for r in rows if r.response == "reaction" and r.level == "max"]
        assert reactions and all(r.value <= 72.0 * 1.33 * 0.6 for r in reactions)


def test_govern_at_a_fraction_of_a_span_names_the_chainage(tmp_path: Path) -> None:
    inventory = read_inventory(write_inventory(tmp_path, GOOD))
    run = Run("g", KINDS["govern"], ("Type 3",),
              settings=GovernSettings(("moment@0.5 of span 2",)))
    rows = run_task(inventory.structure("FV-02"), run)
    assert [r.chainage for r in rows] == [36.0 + 24.0, 36.0 + 24.0]
    (error,) = run_task(inventory.structure("FV-01"), run)  # one span only
    assert error.status == "error" and "spans 1 to 1" in error.message


@given(st.floats(-1e3, 1e3), st.floats(-1e3, 1e3), st.sampled_from(["max", "min"]))
def test_check_is_the_ratio_of_adverse_parts(value: float, reference: float, sense: str) -> None:
    ratio, status = check(value, reference, sense, scale=1e3)
    sign = 1.0 if sense == "max" else -1.0
    assert (status == "pass") == (ratio <= 1.0)
    if sign * value <= 1e-6:  # not adverse: no demand
        assert ratio == 0.0
    elif sign * reference > 1e-6:
        assert ratio == pytest.approx(sign * value / (sign * reference), rel=EXACT)


def test_summaries_and_verdicts() -> None:
    inventory = read_inventory(EXAMPLES / "harrow-county.toml")
    structures = inventory.structures
    rows = (ResultRow("HC-101", ratio=0.5, status="pass"),
            ResultRow("HC-102", ratio=0.9, status="pass", section="12", vehicle="Type 3"),
            ResultRow("HC-107", status="error", message="file not found"),
            ResultRow("HC-114", ratio=1.1, status="fail"),
            ResultRow("HC-122", ratio=0.7, status="pass"),
            ResultRow("HC-131", value=3.0))
    found = summaries(structures, rows)
    assert [s.status for s in found] == ["pass", "pass", "error", "fail", "pass", "ok"]
    assert (found[1].governing_section, found[1].governing_vehicle) == ("12", "Type 3")
    verdicts = route_verdicts((Route("west", ("HC-102", "HC-101")),
                               Route("east", ("HC-107", "HC-114")),
                               Route("north", ("HC-107", "HC-122")),
                               Route("south", ("HC-131", "HC-122"))), found)
    assert [(v.status, v.governing_structure) for v in verdicts] == [
        ("pass", "HC-102"), ("fail", "HC-114"), ("error", "HC-107"), ("ok", "HC-122")]


def test_tables_round_trip_in_parquet_and_keep_the_header_in_csv(tmp_path: Path) -> None:
    from influence.batch.results import BatchResults

    rows = (ResultRow("B-1", "CR 4", "legal", "envelope", "5", 5.0, "moment", "Type 3",
                      "Type 3", "max", 250.0, "kip-ft", axle_positions=(5.0, -10.0, -14.0)),
            ResultRow("B-2", status="error", message="file not found"))
    results = BatchResults(rows, summaries(read_inventory(_two(tmp_path)).structures, rows), (),
                           "Demo county")
    files = write_results(results, tmp_path / "out")
    assert tuple(read_records(files[0], ResultRow)) == rows
    csv_files = write_results(results, tmp_path / "out", "csv")
    text = csv_files[0].read_text().splitlines()
    assert text[0] == "# Demo county"
    assert text[4].startswith("structure,route,run,kind,section,chainage")
    assert text[5].endswith("5.0 -10.0 -14.0,ok,,")
    with pytest.raises(BatchError, match="unknown format"):
        write_results(results, tmp_path / "out", "xlsx")


def _two(folder: Path) -> Path:
    path = folder / "two.csv"
    path.write_text("id,model\nB-1,b1.toml\nB-2,b2.toml\n")
    return path


@pytest.mark.parametrize(("arguments", "message"), [
    (["missing.toml", "--job", str(EXAMPLES / "legal-loads.toml")], "inventory not found"),
    ([str(EXAMPLES / "harrow-county.toml"), "--job", "missing.toml"], "job file not found"),
    ([str(EXAMPLES / "harrow-county.toml"), "--job", "{unknown_kind}"],
     "unknown job kind 'rating'"),
    (["{no_model}", "--job", str(EXAMPLES / "legal-loads.toml")],
     "row 3: the row has no model"),
    ([str(EXAMPLES / "harrow-county.toml"), "--job", str(EXAMPLES / "legal-loads.toml"),
      "--scheduler", "no address"], "is not a scheduler address"),
    ([str(EXAMPLES / "harrow-county.toml"), "--job", str(EXAMPLES / "legal-loads.toml"),
      "--scheduler", "tcp://127.0.0.1:1"], "cannot reach the scheduler at tcp://127.0.0.1:1"),
])
def test_bad_input_is_one_line_and_exit_1(tmp_path: Path, monkeypatch: pytest.MonkeyPatch,
                                          arguments: list[str], message: str) -> None:
    monkeypatch.setattr(engine, "CONNECT_TIMEOUT", 0.5)  # nothing listens on port 1
    made = {"{unknown_kind}": tmp_path / "unknown-kind.toml", "{no_model}": tmp_path / "no.csv"}
    made["{unknown_kind}"].write_text('[[run]]\nkind = "rating"\n')
    made["{no_model}"].write_text("id,model\nB-1,b1.toml\nB-2,\n")
    arguments = [str(made.get(a, a)) for a in arguments]
    result = CliRunner().invoke(main, ["batch", *arguments, "--out", str(tmp_path / "out")])
    assert result.exit_code == 1
    assert message in result.stderr
    assert len(result.stderr.strip().splitlines()) == 1
    assert "Traceback" not in result.output
    assert not (tmp_path / "out").exists()


@pytest.mark.parametrize("place", ["{missing}/out", "{file}/out", "{file}", " "])
def test_a_results_place_that_cannot_be_written_is_refused_before_any_work(
        tmp_path: Path, place: str) -> None:
    (tmp_path / "a-file").write_text("not a folder")
    out = place.format(missing=tmp_path / "missing", file=tmp_path / "a-file")
    result = CliRunner().invoke(main, ["batch", str(EXAMPLES / "harrow-county.toml"), "--job",
                                       str(EXAMPLES / "legal-loads.toml"), "--out", out])
    assert result.exit_code == 1
    assert "Traceback" not in result.output and len(result.stderr.strip().splitlines()) == 1
    assert "--out" in result.stderr
    assert not (tmp_path / "missing").exists()
    assert (tmp_path / "a-file").read_text() == "not a folder"
