"""Output places through the CLI and the library: a drawing or a package into a missing folder,
under a file, into a folder that is not ours or a place the system will not write, ends in one
line with exit status 1, no traceback, and nothing written or changed; a package is swapped in
whole, so a second report leaves nothing stale and a failing one leaves the old one intact."""

from __future__ import annotations

import os
from pathlib import Path

import pytest
from click.testing import CliRunner

from influence.cli import main
from vehicles.errors import OutputError
from vehicles.output.places import MANIFEST, written_folder

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"
OVERPASS = str(EXAMPLES / "overpass.toml")


def run(*args: str) -> tuple[int, str, str]:
    result = CliRunner().invoke(main, list(args))
    return result.exit_code, result.stdout, result.stderr


def snapshot(folder: Path) -> dict[str, bytes]:
    return {p.relative_to(folder).as_posix(): p.read_bytes() if p.is_file() else b"<dir>"
            for p in sorted(folder.rglob("*"))}


def one_line_error(code: int, err: str) -> None:
    assert code == 1
    lines = err.strip().splitlines()
    assert len(lines) == 1 and lines[0].startswith("error: ") and "Traceback" not in err


PLOTTING = [
    ("check", OVERPASS),
    ("line", OVERPASS, "moment", "--at", "12"),
    ("govern", OVERPASS, "moment", "--at", "12", "--vehicle", "HL-93"),
    ("sweep", OVERPASS, "moment", "--at", "12", "--vehicle", "LM2"),
    ("envelope", OVERPASS, "--per-span", "2", "--responses", "moment", "--quiet"),
    ("vehicles", "LM2"),
]


@pytest.mark.parametrize("command", PLOTTING, ids=[c[0] for c in PLOTTING])
def test_a_plot_into_a_missing_folder_or_under_a_file_is_refused_first(
        tmp_path: Path, command: tuple[str, ...]) -> None:
    (tmp_path / "a-file").write_text("keep")
    before = snapshot(tmp_path)
    for target in (tmp_path / "missing" / "plot.png", tmp_path / "a-file" / "plot.png"):
        code, out, err = run(*command, "--plot", str(target))
        one_line_error(code, err)
        assert out == ""  # refused before any work
        assert "--plot" in err
    assert snapshot(tmp_path) == before


def test_a_plot_where_the_system_will_not_write_is_one_line() -> None:
    code, _, err = run("line", OVERPASS, "moment", "--at", "12", "--plot", "/proc/plot.png")
    one_line_error(code, err)
    assert "cannot write" in err


@pytest.mark.skipif(os.geteuid() == 0, reason="root writes in read-only folders")
def test_a_plot_into_a_read_only_folder_is_one_line(tmp_path: Path) -> None:
    folder = tmp_path / "locked"
    folder.mkdir()
    folder.chmod(0o555)
    try:
        code, _, err = run("check", OVERPASS, "--plot", str(folder / "s.png"))
        one_line_error(code, err)
        assert list(folder.iterdir()) == []
    finally:
        folder.chmod(0o755)


def report(out: Path, *more: str) -> tuple[int, str, str]:
    return run("report", OVERPASS, "--out", str(out), "--per-span", "2", "--quiet", *more)


@pytest.mark.parametrize("where", ["missing-parent", "under-a-file", "a-file", "strangers",
                                   "tables-is-a-file", "empty"])
def test_report_places_that_are_refused_change_nothing(tmp_path: Path, where: str) -> None:
    (tmp_path / "a-file").write_text("keep")
    target = {"missing-parent": tmp_path / "missing" / "out",
              "under-a-file": tmp_path / "a-file" / "out",
              "a-file": tmp_path / "a-file",
              "strangers": tmp_path / "mine",
              "tables-is-a-file": tmp_path / "old",
              "empty": tmp_path / ""}[where]
    if where == "strangers":
        target.mkdir()
        (target / "notes.txt").write_text("my own notes")
    if where == "tables-is-a-file":
        target.mkdir()
        (target / "report.pdf").write_bytes(b"%PDF- old")
        (target / "tables").write_text("not a folder")
        (target / MANIFEST).write_text(f"{'0' * 64}  report.pdf\n")
    before = snapshot(tmp_path)
    code, out, err = report(target) if where != "empty" else run(
        "report", OVERPASS, "--out", "", "--quiet")
    one_line_error(code, err)
    assert snapshot(tmp_path) == before  # not a byte changed, no temporary folder left


def test_a_second_report_replaces_the_first_whole(tmp_path: Path) -> None:
    out = tmp_path / "package"
    code, _, err = report(out)
    assert code == 0, err
    assert (out / "tables" / "envelope-shear.csv").exists()
    code, _, err = report(out, "--responses", "moment")
    assert code == 0, err
    tables = sorted(p.name for p in (out / "tables").iterdir())
    assert tables == ["envelope-moment.csv"]  # the shear table of the first run is gone
    figures = sorted(p.name for p in (out / "figures").iterdir())
    assert "05-envelope-shear.png" not in figures
    assert sorted(p.name for p in tmp_path.iterdir()) == ["package"]  # no temporary folders


def test_a_failure_while_writing_leaves_the_earlier_package_exactly(tmp_path: Path) -> None:
    out = tmp_path / "package"

    def first(folder: Path) -> None:
        (folder / "report.pdf").write_text("first")

    written_folder(out, first)
    before = snapshot(tmp_path)

    def failing(folder: Path) -> None:
        (folder / "report.pdf").write_text("second, half")
        raise OSError(28, "No space left on device")

    with pytest.raises(OutputError, match="No space left"):
        written_folder(out, failing)
    assert snapshot(tmp_path) == before


def test_a_failing_report_run_leaves_the_earlier_package(tmp_path: Path) -> None:
    out = tmp_path / "package"
    assert report(out)[0] == 0
    before = snapshot(tmp_path)
    code, _, err = report(out, "--vehicle", "no-such-model")
    assert code == 1 and "Traceback" not in err
    assert snapshot(tmp_path) == before
