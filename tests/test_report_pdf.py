"""The calculation package read back from its PDF text (pypdf): the summary first, the title
block from [project], the running header and footer with the input's SHA-256 and "page n of N"
on every page, the contents, the input echo, the LL+IM labels, the governing positions in the
printed tables, engineers' number formatting, and vector figures."""

from __future__ import annotations

import hashlib
import re
from pathlib import Path

import pytest
from pypdf import PdfReader

from influence.analysis.lines import analyse_model
from influence.design.envelope import envelope
from influence.design.loading import vehicles_for
from influence.design.sections import envelope_sections
from influence.model.reader import read_model_file
from tests.cli import invoke

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"
OVERPASS = EXAMPLES / "overpass.toml"


@pytest.fixture(scope="module")
def package(tmp_path_factory: pytest.TempPathFactory) -> Path:
    out = tmp_path_factory.mktemp("report") / "package"
    code, output = invoke("report", str(OVERPASS), "--out", str(out), "--per-span", "5",
                          "--quiet")
    assert code == 0, output
    return out


@pytest.fixture(scope="module")
def pages(package: Path) -> list[str]:
    return [page.extract_text() for page in PdfReader(package / "report.pdf").pages]


@pytest.fixture(scope="module")
def overpass_envelope():  # type: ignore[no-untyped-def]
    read = read_model_file(OVERPASS)
    analysis = analyse_model(read.model)
    models, _ = vehicles_for(read.basis.live.vehicles, "kN-m")
    sections = envelope_sections(read.model, analysis.path, per_span=5)
    return envelope(analysis, models, read.basis, sections=sections)


def test_every_page_carries_the_running_header_and_footer(pages: list[str]) -> None:
    digest = hashlib.sha256(OVERPASS.read_bytes()).hexdigest()
    total = len(pages)
    assert total >= 12
    for number, text in enumerate(pages, start=1):
        assert f"page {number} of {total}" in text
        assert "overpass.toml" in text and digest in text
        assert "Millbrook Road overpass, girder G2" in text  # the structure
        assert "Job MR-114" in text  # the project title line
        assert re.search(r"influence-lines \d+\.\d+", text)
        assert re.search(r"\d{4}-\d{2}-\d{2}", text)  # the date


def test_the_first_page_is_the_title_block_cautions_and_summary(pages: list[str],
                                                                overpass_envelope) -> None:  # type: ignore[no-untyped-def]
    first = pages[0]
    for field, value in (("job number", "MR-114"), ("designed by", "A. Petrov"),
                         ("checked by", "J. Okafor"), ("revision", "A")):
        assert field in first and value in first
    assert "qualified engineer" in first and "licensed practice govern" in first
    assert "Summary of governing results" in first
    # the largest positive LL+IM moment of the girder line, with its section and position
    best = max(overpass_envelope.of("moment"), key=lambda e: e.live_max or 0.0)
    assert f"{best.live_max:.1f}" in first
    assert f"{best.live.max.lead_position:.2f}" in first
    assert " ".join(f"{x:.2f}" for x in best.live.max.axle_positions) in first
    for kind in ("moment", "shear", "reaction", "deflection"):
        assert kind in first
    assert "Live-load deflection check" in first and "passes in every span" in first


def test_contents_and_the_input_echo(pages: list[str]) -> None:
    text = "\n".join(pages)
    assert "Contents" in pages[1] and "Input echo" in pages[1]
    for dead in ("girder and deck slab", "pier diaphragms", "surfacing, 75 mm"):
        assert dead in text
    for words in ("Strength I", "Service I", "1.25", "0.90", "1.50", "0.65", "1.75"):
        assert words in text
    assert "distribution factor" in text and "0.62" in text
    assert "multiple presence factor" in text
    assert "HL-93 deflection" in text and "span / 800" in text  # the deflection loading
    assert "dynamic load allowance axles 0.33" in text
    assert "AASHTO LRFD" in text and "from memory" in text  # sources and confidence notes


def test_live_load_is_labelled_as_the_standards_do(pages: list[str]) -> None:
    text = re.sub(r"\s+", " ", " ".join(pages))  # column names wrap inside their cells
    assert "LL+IM one lane" in text and "LL+IM x 0.62" in text
    assert not re.search(r"\bLL (max|min)\b", text)


def test_printed_tables_carry_the_governing_positions(pages: list[str],
                                                      overpass_envelope) -> None:  # type: ignore[no-untyped-def]
    text = re.sub(r"\s+", " ", " ".join(pages))
    for entry in overpass_envelope.of("moment")[:6]:
        placement = entry.live.max
        if placement is None or abs(placement.value) < 1e-6:
            continue
        row = f"{placement.value:.1f} {entry.live_max:.1f}"
        assert row in text, row
        assert " ".join(f"{x:.2f}" for x in placement.axle_positions) in text


def test_numbers_are_printed_as_engineers_print_them(pages: list[str]) -> None:
    body = "\n".join(line for text in pages for line in text.splitlines()
                     if "SHA" not in line and not re.fullmatch(r"[0-9a-f ]{64,}", line.strip()))
    assert not re.search(r"\d\.?\d*[eE][+-]?\d", body)  # no scientific notation
    assert "deflection [mm]" in body or "[mm]" in body  # deflections in mm
    assert "-0.0 " not in body


def test_figures_are_vector_and_written_as_png(package: Path) -> None:
    raw = (package / "report.pdf").read_bytes()
    assert b"/Subtype /Image" not in raw  # figures embedded as drawing operators, not bitmaps
    names = sorted(p.name for p in (package / "figures").glob("*.png"))
    assert "02-structure.png" in names and "05-envelope-moment.png" in names
    assert any(n.startswith("04-influence-line") for n in names)
    listed = (package / "SHA256SUMS").read_text().splitlines()
    assert any(line.endswith("  report.pdf") for line in listed)
    for line in listed:
        digest, name = line.split("  ")
        assert hashlib.sha256((package / name).read_bytes()).hexdigest() == digest


def test_each_figure_is_drawn_once(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    from matplotlib.figure import Figure

    from influence.output.report import write_report

    calls: list[str] = []
    original = Figure.savefig

    def counted(self, *args, **kwargs):  # type: ignore[no-untyped-def]
        calls.append(kwargs.get("format", ""))
        return original(self, *args, **kwargs)

    monkeypatch.setattr(Figure, "savefig", counted)
    read = read_model_file(OVERPASS)
    analysis = analyse_model(read.model)
    models, _ = vehicles_for(("LM2",), "kN-m")
    sections = envelope_sections(read.model, analysis.path, per_span=2)
    result = envelope(analysis, models, read.basis, kinds=("moment",), sections=sections)
    files = write_report(analysis, result, tmp_path / "p", ("moment",), deflection_models=())
    assert calls and set(calls) == {"pdf"}  # drawn once, to vector PDF
    assert len(calls) == len(files.figures)  # every PNG rasterised from that same drawing
