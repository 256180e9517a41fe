"""`influence envelope` and `influence report`, in-process: exit status, files, pages, units."""

from __future__ import annotations

import csv
import json
import re
from pathlib import Path

from tests.cli import invoke

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"
OVERPASS = str(EXAMPLES / "overpass.toml")


def pdf_pages(path: Path) -> int:
    """Count page objects in a PDF (matplotlib writes one '/Type /Page' object per page)."""
    return len(re.findall(rb"/Type\s*/Page\b", path.read_bytes()))


def test_report_writes_pdf_figures_and_csv_tables(tmp_path: Path) -> None:
    out = tmp_path / "package"
    code, output = invoke("report", OVERPASS, "--out", str(out), "--per-span", "4", "--quiet")
    assert code == 0, output
    pdf = out / "report.pdf"
    stated = int(re.search(r"\((\d+) pages\)", output).group(1))  # type: ignore[union-attr]
    # title, structure, load model text and trains, 3 influence-line pages, 4 envelopes,
    # 4 tables and the deflection check
    assert pdf_pages(pdf) == stated >= 15
    assert pdf.read_bytes()[:5] == b"%PDF-"
    figures = sorted(p.name for p in (out / "figures").glob("*.png"))
    assert "02-structure.png" in figures and "05-envelope-moment.png" in figures
    with open(out / "tables" / "envelope-moment.csv") as handle:
        rows = [row for row in csv.reader(line for line in handle if not line.startswith("#"))]
    assert rows[0][:3] == ["section", "chainage [m]", "LL+IM max [kN-m]"]
    assert "Strength I max [kN-m]" in rows[0]
    assert not list(out.glob(".report-*"))  # the temporary folder is gone


def test_envelope_json_traces_every_value_to_a_placement() -> None:
    code, output = invoke("envelope", OVERPASS, "--per-span", "2", "--responses", "moment",
                          "--format", "json", "--quiet")
    assert code == 0, output
    document = json.loads(output)
    entry = document["entries"][1]
    assert entry["response"] == "moment" and entry["max"]["vehicle"] == "HL-93"
    assert entry["max"]["axle_positions"] and "Strength I" in entry["combinations"]
    assert document["units"]["moment"] == "kN-m"


def test_envelope_needs_vehicles(tmp_path: Path) -> None:
    path = tmp_path / "m.toml"
    path.write_text('[beam]\nspans = [10.0]\nEI = 1.0e5\nsupports = ["pinned", "roller"]\n')
    code, output = invoke("envelope", str(path))
    assert code == 1 and "give --vehicle" in output
    code, output = invoke("envelope", str(path), "--vehicle", "HL93x")
    assert code == 1 and "HL-93" in output  # close matches listed
