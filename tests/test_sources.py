"""Every source the repository names is a published book, standard or paper.

Course material (handouts, lecture notes, problem sets of a course, note-sharing sites) is not a
source for this project, and the project's list of sources is its own `docs/references.md`: no
file may point at a reference file kept outside the repository. This test reads every text file
of the repository and fails on any such mention, naming the file and line.
"""

from __future__ import annotations

import re
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
SKIPPED_FOLDERS = {".git", "__pycache__", ".mypy_cache", ".ruff_cache", ".pytest_cache",
                   ".hypothesis", "build", "dist", "node_modules", ".venv", "venv"}
TEXT_SUFFIXES = {".py", ".md", ".toml", ".txt", ".cfg", ".ini", ".yml", ".yaml", ".json", ".csv",
                 ".rst", ".sh", ""}

FORBIDDEN = {
    "a reference file outside the repository": re.compile(r"REFERENCES(-ASSESSMENT)?\.md"),
    "a path into the shared folder": re.compile(r"\.\./shared|\bshared/[A-Z]"),
    "a course number": re.compile(r"\b(?:CE|CEE|CIVE|CIV|CVEN|ENCE|CE&M)\s?\d{3}[A-Z]?\b"),
    "a term of a course": re.compile(r"\b(?:semester|quarter of 20\d\d)\b", re.IGNORECASE),
    "course material": re.compile(
        r"\b(?:handouts?|lecture|lectures|problem sets?|homework|course notes|class notes|"
        r"syllabus)\b", re.IGNORECASE),
    "a note-sharing site": re.compile(
        r"course\s?hero|chegg|studocu|scribd|quizlet|bartleby|slideshare|brainly", re.IGNORECASE),
}


def repository_text_files() -> list[Path]:
    found = []
    for path in ROOT.rglob("*"):
        relative = path.relative_to(ROOT)
        if any(part in SKIPPED_FOLDERS or part.endswith(".egg-info") for part in relative.parts):
            continue
        if path.is_file() and path.suffix in TEXT_SUFFIXES and path != Path(__file__).resolve():
            found.append(path)
    return found


def offences(text: str) -> list[tuple[int, str, str]]:
    """(line number, what, the line) for every forbidden mention in ``text``."""
    found = []
    for number, line in enumerate(text.splitlines(), start=1):
        for what, pattern in FORBIDDEN.items():
            if pattern.search(line):
                found.append((number, what, line.strip()))
    return found


def test_the_patterns_catch_what_they_are_for() -> None:
    examples = ["see ../shared/" + "REFERENCES.md section 1", "CE 331 " + "hand" + "out",
                "Spring 2009 sem" + "ester", "Course" + "Hero notes", "lecture notes",
                "problem set 4"]
    for example in examples:
        assert offences(example), example
    assert not offences("T. G. Hicks, Handbook of Civil Engineering Calculations, p. 1.77")
    assert not offences("EN 1991-2:2003, 6.3.2; AASHTO LRFD 3.6.1.2.2; docs/references.md")


def test_no_file_cites_course_material_or_outside_reference_files() -> None:
    files = repository_text_files()
    assert len(files) > 50  # the walk found the repository
    found = []
    for path in files:
        try:
            text = path.read_text(encoding="utf-8")
        except UnicodeDecodeError:
            continue
        found += [f"{path.relative_to(ROOT)}:{number}: {what}: {line}"
                  for number, what, line in offences(text)]
    assert not found, "\n".join(found)
