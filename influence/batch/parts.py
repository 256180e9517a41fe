"""Finished parts of a batch: the rows of one structure under one run, each in its own file.

A part is written whole (under a temporary name, then renamed) as soon as its task finishes, so
an interrupted run leaves only finished parts. Its file name carries a key made from everything
its rows depend on: the inventory row, the bytes of the model file, the run (kind, vehicles,
adjustments, settings) and the bytes of the vehicle files it names. A rerun with ``resume`` reads
a part whose key matches instead of computing it again; a changed structure, model or run has a
new key and is computed. Parts of structures in error are not written: a rerun tries them again.

Example:
    >>> from influence.batch.envelope_kind import EnvelopeSettings
    >>> from influence.batch.inventory import Structure
    >>> from influence.batch.job import Run
    >>> from influence.batch.kinds import KINDS
    >>> run = Run("legal", KINDS["envelope"], ("Type 3",), settings=EnvelopeSettings())
    >>> name = part_name(Structure("B/7", "/no/such.toml"), run)
    >>> name.startswith("B_7.legal.") and name.endswith(".parquet")
    True
"""

from __future__ import annotations

import hashlib
import re
from collections.abc import Sequence
from pathlib import Path

from influence.batch.inventory import Structure
from influence.batch.job import Run
from influence.batch.rows import ResultRow
from influence.batch.tables import read_records, write_table

PARTS_FOLDER = "parts"
"""The folder of finished parts inside the results folder."""
KEY_LENGTH = 20
"""Hex digits of the key in a part's file name."""


def part_name(structure: Structure, run: Run) -> str:
    """The file name of the part of one structure under one run."""
    digest = hashlib.sha256()
    digest.update(repr((structure.identifier, structure.model_path, structure.routes, run.name,
                        run.kind.name, run.vehicles, run.adjust, run.settings)).encode())
    for path in (structure.model_path, *run.vehicles,
                 *getattr(getattr(run.settings, "compare_with", None), "names", ())):
        digest.update(_file_digest(path))
    return f"{_safe(structure.identifier)}.{_safe(run.name)}.{digest.hexdigest()[:KEY_LENGTH]}" \
           ".parquet"


def write_part(folder: Path, name: str, rows: Sequence[ResultRow]) -> Path:
    """Write a finished part whole."""
    folder.mkdir(parents=True, exist_ok=True)
    return write_table(rows, ResultRow, folder / name, "finished part")


def read_part(path: Path) -> tuple[ResultRow, ...]:
    return tuple(read_records(path, ResultRow))


def _file_digest(path: str) -> bytes:
    """The bytes' digest of a file, or a marker where there is no such file here (a library
    name, or a model only the workers can reach)."""
    try:
        return hashlib.sha256(Path(path).read_bytes()).digest()
    except OSError:
        return b"-"


def _safe(text: str) -> str:
    return re.sub(r"[^A-Za-z0-9_-]+", "_", text).strip("_")[:40] or "x"
