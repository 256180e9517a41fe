"""Trusses: the envelope and the report of a structure whose sections are truss bars take axial
force at every bar by default (one section a bar, none twice, none nil), draw the bars'
influence lines and list bar forces in a table rather than against chainage."""

from __future__ import annotations

import json
import re
from pathlib import Path

import pytest
from pypdf import PdfReader

from influence.analysis.lines import analyse_model
from influence.design.bars import default_responses, structure_envelope, truss_bars
from influence.design.loading import vehicles_for
from influence.design.sections import envelope_sections
from influence.model.reader import read_model, read_model_file
from influence.output.report_story import key_sections
from tests.cli import invoke

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"
TRUSS = EXAMPLES / "truss-rail-bridge.toml"


def test_only_a_structure_with_bars_off_the_path_is_a_truss() -> None:
    assert truss_bars(read_model(TRUSS))
    assert default_responses(read_model(TRUSS))[0] == "axial"
    for girder in ("gerber-girder", "overpass", "portal-footbridge"):  # a suspended span is
        assert default_responses(read_model(EXAMPLES / f"{girder}.toml"))[0] == "moment"


@pytest.fixture(scope="module")
def truss_envelope():  # type: ignore[no-untyped-def]
    read = read_model_file(TRUSS)
    analysis = analyse_model(read.model)
    models, _ = vehicles_for(read.basis.live.vehicles, read.model.units)
    sections = envelope_sections(read.model, analysis.path, per_span=4,
                                 extra=read.basis.sections.extra)
    return structure_envelope(analysis, models, read.basis, kinds=default_responses(read.model),
                              sections=sections)


def test_every_bar_once_and_key_sections_neither_nil_nor_twice(truss_envelope) -> None:  # type: ignore[no-untyped-def]
    bars = [e.section.label for e in truss_envelope.of("axial")]
    assert sorted(bars) == sorted(truss_bars(read_model(TRUSS)))
    keys = key_sections(truss_envelope)
    assert 2 <= len(keys) <= 6 and all(k.kind == "axial" for k in keys)
    assert len({(k.response.location, k.response.side) for k in keys}) == len(keys)
    assert all(max(abs(k.live_max or 0), abs(k.live_min or 0)) > 1.0 for k in keys)


def test_the_envelope_command_defaults_to_bar_forces() -> None:
    code, output = invoke("envelope", str(TRUSS), "--per-span", "2", "--format", "json",
                          "--quiet")
    assert code == 0, output
    kinds = {e["response"] for e in json.loads(output)["entries"]}
    assert kinds == {"axial", "reaction", "deflection"}


def test_the_report_of_a_truss_lists_bar_forces(tmp_path: Path) -> None:
    code, output = invoke("report", str(TRUSS), "--out", str(tmp_path / "t"), "--per-span",
                          "2", "--quiet")
    assert code == 0, output
    text = re.sub(r"\s+", " ", " ".join(p.extract_text()
                                        for p in PdfReader(tmp_path / "t" / "report.pdf").pages))
    assert "axial at L" in text or "axial at U" in text  # captions of the bars' lines
    assert "6.1 axial" in text and "bar" in text and "compression" in text
    for bar in ("L3L4", "U3U4", "U1L2"):
        assert bar in text
    figures = sorted(p.name for p in (tmp_path / "t" / "figures").iterdir())
    assert "05-envelope-axial.png" in figures
    assert sum(name.startswith("04-influence-line") for name in figures) >= 2
