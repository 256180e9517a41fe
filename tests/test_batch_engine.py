"""The batch engine on a Dask LocalCluster of two worker processes (one cluster for the module).

The reference for every computed row is the library called directly on that structure alone
(read, factorise, :func:`influence.design.envelope.envelope` or
:func:`influence.design.governing.governing`): the batch must give the same values and
placements. One model file is broken and one is missing: each gets one ``error`` row and the
others complete. A rerun with resume computes nothing finished: counted by the engine and seen on
the part files themselves (same inode and modification time: not written again). A worker killed
in the middle of a task is replaced and the task run again by Dask.

The example inventory and the permit route (examples/batch) run through the command with the
module's cluster as ``--scheduler``; one value is checked against statics (common practice): the
largest end reaction of a simple span under an axle group that fits on it stands with an axle over
the support, R = sum P_i (1 - d_i / L) (1 + IM) times the live-load scale.
"""

from __future__ import annotations

import logging
import os
from collections.abc import Iterator
from dataclasses import replace
from pathlib import Path
from typing import Any

import pytest
from click.testing import CliRunner

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.batch import read_inventory, run_batch
from influence.batch.envelope_kind import EnvelopeSettings
from influence.batch.govern_kind import GovernSettings
from influence.batch.job import Job, Run
from influence.batch.kinds import KINDS
from influence.batch.parts import PARTS_FOLDER
from influence.batch.results import RouteVerdict, StructureSummary
from influence.batch.rows import ResultRow
from influence.batch.tables import read_records
from influence.cli import main
from influence.design.envelope import envelope
from influence.design.governing import governing
from influence.design.loading import vehicles_for
from influence.design.sections import envelope_sections
from influence.model.reader import read_model_file
from tests.batch_inventory import BROKEN, CRASH_ONCE, GOOD, MISSING, CrashOnce, write_inventory

EXAMPLES = Path(__file__).resolve().parent.parent / "examples" / "batch"
SAME = 1e-12
"""Relative tolerance between a worker's value and the library's here: the same arithmetic, in
another process."""
LEGAL = ("Type 3", "Type 3S2", "Type 3-3")
RESPONSES = ("moment", "shear", "reaction")


@pytest.fixture(scope="module")
def client() -> Iterator[Any]:
    from distributed import Client, LocalCluster

    with LocalCluster(n_workers=2, threads_per_worker=1, processes=True,
                      dashboard_address=":0", silence_logs=logging.ERROR) as cluster, \
            Client(cluster, set_as_default=False) as made:
        yield made


@pytest.fixture(scope="module")
def inventory_file(tmp_path_factory: pytest.TempPathFactory) -> Path:
    return write_inventory(tmp_path_factory.mktemp("fenn-valley"))


def envelope_job(per_span: int = 4) -> Job:
    """Two vehicle groups: two tasks per structure."""
    settings = EnvelopeSettings(RESPONSES, per_span=per_span)
    return Job((Run("legal", KINDS["envelope"], LEGAL, settings=settings),
                Run("design", KINDS["envelope"], ("HL-93",), settings=settings)))


def library_envelope_values(model_path: str, vehicle: str, per_span: int) -> list[tuple]:
    """(section, response, level, value, lead position) of one vehicle, straight from the
    library on this structure alone."""
    read = read_model_file(model_path)
    analysis = analyse_model(read.model)
    (model,), _ = vehicles_for((vehicle,), read.model.units)
    sections = envelope_sections(read.model, analysis.path, per_span=per_span)
    found = envelope(analysis, [model], read.basis, kinds=RESPONSES, sections=sections)
    values = []
    for entry in found.entries:
        for level, value, placement in (("max", entry.live_max, entry.live.max),
                                        ("min", entry.live_min, entry.live.min)):
            values.append((entry.response.kind, level, value,
                           placement.lead_position if placement else None))
    return values


def test_rows_equal_the_library_on_each_structure_alone(client: Any, inventory_file: Path) -> None:
    inventory = read_inventory(inventory_file)
    results = run_batch(inventory, envelope_job(), client)
    for identifier in GOOD:
        path = inventory.structure(identifier).model_path
        for run, vehicles in (("legal", LEGAL), ("design", ("HL-93",))):
            for vehicle in vehicles:
                rows = [r for r in results.of(identifier) if r.run == run and r.vehicle == vehicle
                        and r.level in ("max", "min")]
                expected = library_envelope_values(path, vehicle, 4)
                assert len(rows) == len(expected)
                for row, (kind, level, value, lead) in zip(rows, expected, strict=True):
                    assert (row.response, row.level, row.status) == (kind, level, "ok")
                    if value is None:  # no load position gives an effect of that sign
                        assert row.value is None and row.lead_position is None
                        continue
                    assert row.value == pytest.approx(value, rel=SAME, abs=SAME)
                    assert row.lead_position == pytest.approx(lead, rel=SAME, abs=SAME)


def test_broken_and_missing_models_are_reported_the_rest_complete(
        client: Any, inventory_file: Path) -> None:
    results = run_batch(inventory_file, envelope_job(), client)
    status = {s.structure: s.status for s in results.structures}
    assert status == {**dict.fromkeys(GOOD, "ok"), BROKEN: "error", MISSING: "error"}
    broken = results.of(BROKEN)
    assert [r.status for r in broken] == ["error", "error"]  # one row per run
    assert "rocker" in broken[0].message and "\n" not in broken[0].message
    assert "file not found" in results.of(MISSING)[0].message
    verdict = results.routes[0]
    assert (verdict.route, verdict.status, verdict.governing_structure) == (
        "Fenn Way", "error", BROKEN)


def test_govern_rows_equal_the_library(client: Any, inventory_file: Path) -> None:
    settings = GovernSettings(("moment@0.5 of span 1", "shear@S1", "reaction@S2"))
    job = Job((Run("legal", KINDS["govern"], LEGAL, settings=settings),))
    inventory = read_inventory(inventory_file)
    results = run_batch(inventory, job, client)
    for identifier in GOOD:
        read = read_model_file(inventory.structure(identifier).model_path)
        analysis = analyse_model(read.model)
        models, _ = vehicles_for(LEGAL, read.model.units)
        expected = []
        first = float(analysis.path.node_chainages["S2"])
        for response in (Response("moment", repr(first / 2)), Response("shear", "S1"),
                         Response("reaction", "S2")):
            for model in models:
                found = governing(analysis, response, [model]).governing
                expected += [found.max.value if found.max else None,
                             found.min.value if found.min else None]
        values = [row.value for row in results.of(identifier)]
        assert [v is None for v in values] == [v is None for v in expected]
        assert [v for v in values if v is not None] == pytest.approx(
            [v for v in expected if v is not None], rel=SAME, abs=SAME)


def test_resume_computes_nothing_finished(
        client: Any, inventory_file: Path, tmp_path: Path) -> None:
    parts = tmp_path / PARTS_FOLDER
    # an interrupted run: only the first two structures finished
    first_two = write_inventory(inventory_file.parent, GOOD[:2])
    started = run_batch(first_two, envelope_job(), client, parts=parts)
    assert (started.computed, started.resumed) == (4, 0)
    written = {p.name: (p.stat().st_ino, p.stat().st_mtime_ns) for p in parts.iterdir()}
    assert len(written) == 4

    whole = run_batch(inventory_file, envelope_job(), client, parts=parts, resume=True)
    # the third girder's two runs and the two error structures' (never kept) are computed
    assert (whole.computed, whole.resumed) == (6, 4)
    for name, (inode, modified) in written.items():
        stat = (parts / name).stat()
        assert (stat.st_ino, stat.st_mtime_ns) == (inode, modified)
    assert len(list(parts.iterdir())) == 6  # error rows are not kept as parts

    again = run_batch(inventory_file, envelope_job(), client, parts=parts, resume=True)
    assert (again.computed, again.resumed) == (4, 6)
    assert again.rows == whole.rows
    # a changed run is new work, not a finished part
    changed = run_batch(inventory_file, envelope_job(per_span=2), client, parts=parts,
                        resume=True)
    assert changed.resumed == 0


def test_a_worker_lost_mid_task_is_retried(
        client: Any, inventory_file: Path, tmp_path: Path) -> None:
    marker = tmp_path / "crashed"
    settings = EnvelopeSettings(RESPONSES, per_span=4)
    inventory = read_inventory(inventory_file)
    only = replace(inventory, structures=inventory.structures[:1])
    crash = Run("legal", CRASH_ONCE, ("Type 3",), settings=CrashOnce(str(marker), settings))
    results = run_batch(only, Job((crash,)), client)
    assert marker.exists()  # the first attempt died with its worker, which is gone
    assert int(marker.read_text()) not in client.run(os.getpid).values()
    plain = run_batch(only, Job((Run("legal", KINDS["envelope"], ("Type 3",),
                                     settings=settings),)), client)
    assert [r.status for r in results.rows] == ["ok"] * len(plain.rows)
    assert [r.value for r in results.rows] == [r.value for r in plain.rows]


def test_example_permit_route_through_the_command(client: Any, tmp_path: Path) -> None:
    out = tmp_path / "permit"
    result = CliRunner().invoke(main, [
        "batch", str(EXAMPLES / "harrow-county.csv"), "--job", str(EXAMPLES / "permit-route.toml"),
        "--out", str(out), "--scheduler", client.scheduler.address, "--format", "csv"])
    assert result.exit_code == 0, result.output
    assert "Dask dashboard: http" in result.stderr
    assert "4 structures: 3 pass, 1 fail" in result.stdout
    assert "route Sedge Beck quarry to the A-road: fail, governed by HC-122" in result.stdout
    assert sorted(p.name for p in out.iterdir()) == [
        "parts", "routes.csv", "rows.csv", "structures.csv"]
    routes = (out / "routes.csv").read_text().splitlines()
    assert routes[0].startswith("# Permit 24-117")
    assert "HC-131 > HC-122 > HC-114 > HC-107,4,fail,HC-122" in routes[-1]
    before = (out / "routes.csv").read_text()
    resumed = CliRunner().invoke(main, [
        "batch", str(EXAMPLES / "harrow-county.csv"), "--job", str(EXAMPLES / "permit-route.toml"),
        "--out", str(out), "--scheduler", client.scheduler.address, "--format", "csv",
        "--resume", "--quiet"])
    assert "(0 tasks computed, 4 resumed)" in resumed.stdout
    assert (out / "routes.csv").read_text() == before


def test_example_legal_loads_against_statics(client: Any, tmp_path: Path) -> None:
    out = tmp_path / "legal"
    result = CliRunner().invoke(main, [
        "batch", str(EXAMPLES / "harrow-county.toml"), "--job", str(EXAMPLES / "legal-loads.toml"),
        "--out", str(out), "--scheduler", client.scheduler.address, "--quiet"])
    assert result.exit_code == 0, result.output
    assert result.stderr == ""
    summaries = {s.structure: s for s in read_records(out / "structures.parquet",
                                                      StructureSummary)}
    # the bridges designed for HS20-44 are the ones the legal loads exceed (to be rated)
    assert {k for k, s in summaries.items() if s.status == "fail"} == {"HC-102", "HC-122"}
    assert [r.route for r in read_records(out / "routes.parquet", RouteVerdict)] == [
        "CR 12", "CR 30"]
    rows = read_records(out / "rows.parquet", ResultRow)
    # HC-101: a 40 ft simple span; the Type 3 (16, 17, 17 kip at 15 and 4 ft, IM 33 %; MBE
    # 6A.4.4.2.1, from memory) with its rear axle over A1 and the others on the span
    span, scale = 40.0, 0.62
    reaction = max(
        16.0 + 17.0 * (1 - 15.0 / span) + 17.0 * (1 - 19.0 / span),   # front axle over A1
        17.0 + 17.0 * (1 - 4.0 / span) + 16.0 * (1 - 19.0 / span),    # rear axle over A1
    ) * 1.33 * scale
    (found,) = [r for r in rows if r.structure == "HC-101" and r.response == "shear"
                and r.section == "A1" and r.vehicle == "Type 3" and r.level == "max"]
    assert found.value == pytest.approx(reaction, rel=SAME)


def test_a_local_cluster_is_started_when_no_client_is_given(
        client: Any, inventory_file: Path) -> None:
    inventory = write_inventory(inventory_file.parent, GOOD[:1])
    settings = GovernSettings(("moment@0.5 of span 1",))
    job = Job((Run("legal", KINDS["govern"], ("Type 3",), settings=settings),))
    given = run_batch(inventory, job, client)
    assert [r.status for r in given.rows] == ["ok", "ok"]
    assert run_batch(inventory, job).rows == given.rows  # its own cluster, started and closed
