"""The calculation package gains load-rating pages when the model file has [rating], and fatigue
pages when it has [[fatigue_detail]] (read back from the PDF's text).

The structure is invented: a 60 ft simple span in kip and ft. Outside facts used: the largest
midspan moment of one 32 kip axle on a simple span, P L / 4 (statics, common practice).
"""

from __future__ import annotations

from pathlib import Path

import pytest
from pypdf import PdfReader

from influence.model.reader import read_model_file
from influence.output.report import assessments_of, report_from_file

MODEL = """
title = "Test span for the assessment pages"
units = "kip-ft"
[beam]
spans = [60.0]
EI = 4.0e6
supports = ["pinned", "roller"]
[[loads]]
name = "deck"
load = "DC"
uniform = 0.8
[live_load]
vehicles = ["HL-93"]
[sections]
per_span = 2
[rating]
method = "LRFR"
edition = "MBE 2nd"
adtt = 1000
material = "steel"
distribution = 0.6
[[capacity]]
response = "moment"
sense = "positive"
from = 0.0
to = 60.0
nominal = 3000.0
resistance_factor = 1.0
[fatigue]
standard = "AASHTO"
edition = 2020
adtt = 800
lanes = 1
age_years = 10
section_units = "in"
[[fatigue_detail]]
name = "bottom flange at midspan"
location = "30.0"
response = "moment"
category = "C"
section_modulus = 2000.0
"""


@pytest.fixture(scope="module")
def model_file(tmp_path_factory: pytest.TempPathFactory) -> Path:
    path = tmp_path_factory.mktemp("assess") / "span.toml"
    path.write_text(MODEL)
    return path


def test_the_model_files_assessments_are_run_for_the_report(model_file: Path) -> None:
    found = assessments_of(read_model_file(model_file))
    assert found.ratings is not None and found.fatigue is not None and not found.notes
    midspan = [r for r in found.ratings.ratings if r.section == "30" and r.vehicle == "HL-93"]
    assert midspan and all(r.rating_factor > 0 for r in midspan)
    assert [d.detail.name for d in found.fatigue.details] == ["bottom flange at midspan"]


def test_the_report_has_rating_and_fatigue_pages_and_says_so_first(model_file: Path,
                                                                   tmp_path: Path) -> None:
    files = report_from_file(model_file, tmp_path / "package")
    text = [page.extract_text() for page in PdfReader(files.pdf).pages]
    assert "Load rating (LRFR): lowest factor" in text[0]
    assert "Fatigue (" in text[0]
    whole = "\n".join(text)
    for words in ("Load rating, postings and permits", "lowest factor per vehicle and level",
                  "postings", "every factor", "Fatigue", "details, damage and life",
                  "ASTM E1049", "bottom flange at midspan"):
        assert words in whole, words
    assert any(p.name.startswith("rating-governing") for p in files.figures)
    assert any(p.name.startswith("fatigue-") for p in files.figures)


def test_an_assessment_that_cannot_run_is_named_instead_of_its_pages(tmp_path: Path) -> None:
    path = tmp_path / "span.toml"
    path.write_text(MODEL.replace("adtt = 800\n", ""))  # fatigue truck without trucks a day
    found = assessments_of(read_model_file(path))
    assert found.fatigue is None
    assert found.notes and found.notes[0].startswith("Fatigue left out:")
