"""Every source the repository names is a published book, standard or paper.

Teaching material of a course (its notes, exercise sheets, note-sharing sites) is not a source
for this project, and the project's list of sources is its own `docs/references.md`: no file may
point at a reference file kept outside the project's folder. This test reads every text file
of the repository and fails on any such mention, naming the file and line.

The words it looks for are put together from pieces (``_words``), so that this file, which must
name them to find them, does not itself read as such a mention.
"""

from __future__ import annotations

import re
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
SKIPPED_FOLDERS = {".git", "__pycache__", ".mypy_cache", ".ruff_cache", ".pytest_cache",
                   ".hypothesis", "build", "dist", "node_modules", ".venv", "venv"}
TEXT_SUFFIXES = {".py", ".md", ".toml", ".txt", ".cfg", ".ini", ".yml", ".yaml", ".json", ".csv",
                 ".rst", ".sh", ""}



def _words(*pieces: str) -> str:
    """One alternation of whole words, each word given in two pieces."""
    return "|".join(pieces[i] + pieces[i + 1] for i in range(0, len(pieces), 2))


OUTSIDE_FOLDER = "sha" + "red"
"""The folder beside the repository that holds the briefs (not part of the project)."""

FORBIDDEN = {
    "a reference file outside the repository": re.compile(r"REFERENCES(-ASSESSMENT)?\.md"),
    "a path into the folder beside the repository": re.compile(
        rf"\.\./{OUTSIDE_FOLDER}|\b{OUTSIDE_FOLDER}/[A-Z]"),
    "a course number": re.compile(r"\b(?:CE|CEE|CIVE|CIV|CVEN|ENCE|CE&M)\s?\d{3}[A-Z]?\b"),
    "a term of a course": re.compile(
        rf"\b(?:{_words('seme', 'ster')}|quarter of 20\d\d)\b", re.IGNORECASE),
    "course material": re.compile(
        r"\b(?:" + _words("hand", "outs?", "lec", "tures?", "problem ", "sets?", "home", "work",
                           "course ", "notes", "class ", "notes", "sylla", "bus") + r")\b",
        re.IGNORECASE),
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
    examples = ["see ../" + OUTSIDE_FOLDER + "/REFERENCES.md section 1",
                "CE 331 " + "hand" + "out", "Spring 2009 sem" + "ester", "Course" + "Hero notes",
                "lec" + "ture notes", "problem " + "set 4"]
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
