"""Batch results as columnar tables: Parquet through pyarrow, or CSV; each file written whole.

The columns are the fields of the records (:class:`influence.batch.rows.ResultRow`, the
structure summaries and the route verdicts), typed from their annotations: text, numbers (empty
where there is none), whole numbers and lists of numbers (axle positions; in CSV one cell, the
numbers separated by spaces). Parquet files carry the title, the conventions and the caution in
their metadata; CSV files carry them as ``#`` lines above the header, as every CSV of the tool
does.

Example:
    >>> import pathlib, tempfile
    >>> path = pathlib.Path(tempfile.mkdtemp()) / "rows.parquet"
    >>> rows = [ResultRow("B-1", section="5", value=12.5, axle_positions=(1.0, 5.3)),
    ...         ResultRow("B-2", status="error", message="file not found")]
    >>> _ = write_table(rows, ResultRow, path, "demo")
    >>> read_records(path, ResultRow) == rows
    True
"""

from __future__ import annotations

import csv
import io
import os
from collections.abc import Sequence
from dataclasses import fields
from pathlib import Path
from typing import Any

from influence.batch.results import BatchResults, RouteVerdict, StructureSummary
from influence.batch.rows import ResultRow
from influence.errors import BatchError
from influence.output.conventions import CAUTION, SIGN_CONVENTIONS
from vehicles.atomic import written_whole

FORMATS = ("parquet", "csv")
_TYPES = {"str": "string", "float | None": "float64", "int": "int64",
          "tuple[float, ...]": "list<float64>"}


def schema(record_type: type) -> Any:
    """The pyarrow schema of a record dataclass."""
    import pyarrow as pa

    arrow = {"string": pa.string(), "float64": pa.float64(), "int64": pa.int64(),
             "list<float64>": pa.list_(pa.float64())}
    return pa.schema([(f.name, arrow[_TYPES[str(f.type)]]) for f in fields(record_type)])


def header_lines(title: str) -> list[str]:
    """What opens every results file: the title, the conventions and the caution."""
    return [title or "Batch results",
            "Units: each value in the unit named beside it; chainages and positions in the "
            "length unit of the structure's unit system.",
            "Sign conventions: " + SIGN_CONVENTIONS, "Caution: " + CAUTION]


def write_table(records: Sequence[Any], record_type: type, path: str | Path,
                title: str = "") -> Path:
    """Write the records whole to ``path``: Parquet, or CSV when the suffix is ``.csv``."""
    path = Path(path)
    if path.suffix.lower() == ".csv":
        return written_whole(path, lambda name: Path(name).write_text(
            _csv(records, record_type, title), encoding="utf-8"))
    import pyarrow as pa
    import pyarrow.parquet as pq

    names = [f.name for f in fields(record_type)]
    columns = {name: [_arrow_value(getattr(r, name)) for r in records] for name in names}
    metadata = {f"header {i}": line for i, line in enumerate(header_lines(title))}
    table = pa.Table.from_pydict(columns, schema=schema(record_type).with_metadata(metadata))
    return written_whole(path, lambda name: pq.write_table(table, name))


def read_records(path: str | Path, record_type: type) -> list[Any]:
    """The records of a Parquet file written by :func:`write_table`."""
    import pyarrow.parquet as pq

    listed = {f.name for f in fields(record_type) if _TYPES[str(f.type)] == "list<float64>"}
    return [record_type(**{k: tuple(v) if k in listed else v for k, v in row.items()})
            for row in pq.read_table(path).to_pylist()]


def _arrow_value(value: Any) -> Any:
    return list(value) if isinstance(value, tuple) else value


def _csv(records: Sequence[Any], record_type: type, title: str) -> str:
    buffer = io.StringIO()
    for line in header_lines(title):
        buffer.write(f"# {line}\n")
    writer = csv.writer(buffer, lineterminator="\n")
    names = [f.name for f in fields(record_type)]
    writer.writerow(names)
    for record in records:
        writer.writerow([_cell(getattr(record, name)) for name in names])
    return buffer.getvalue()


def _cell(value: Any) -> str:
    if value is None:
        return ""
    if isinstance(value, float):
        return repr(value)
    if isinstance(value, tuple):
        return " ".join(repr(float(v)) for v in value)
    return str(value)


RESULT_FILES = ("rows", "structures", "routes")
"""The tables of a results folder, by file stem."""


def check_results_place(folder: str | Path, item: str = "--out") -> Path:
    """Refuse, before any work, a results folder that cannot be made or written: an empty
    name, a missing parent folder, a file in its place, a place this user cannot write.

    Example:
        >>> check_results_place("/no/such/parent/results")  # doctest: +ELLIPSIS
        Traceback (most recent call last):
        ...
        influence.errors.BatchError: ...: the folder '/no/such/parent' does not exist (...)
    """
    if str(folder).strip() == "":
        raise BatchError("no folder given", item=item, fix="give a folder name")
    target = Path(os.path.abspath(folder))
    parent = target.parent
    if target.exists() and not target.is_dir():
        raise BatchError("this is a file, not a folder", source=str(folder), item=item,
                         fix="give a new folder or the folder of an earlier batch run")
    if not target.exists() and not parent.is_dir():
        if parent.exists():
            raise BatchError(f"{str(parent)!r} is a file, not a folder", source=str(folder),
                             item=item, fix="give a place inside a folder")
        raise BatchError(f"the folder {str(parent)!r} does not exist", source=str(folder),
                         item=item, fix="create it first or give another place")
    if not os.access(target if target.exists() else parent, os.W_OK | os.X_OK):
        raise BatchError("this place cannot be written", source=str(folder), item=item,
                         fix="give a place in a folder you can write")
    return target


def write_results(results: BatchResults, folder: str | Path, fmt: str = "parquet") -> list[Path]:
    """Write the rows, the structure summaries and the route verdicts into ``folder`` as
    ``rows``, ``structures`` and ``routes`` Parquet (or CSV) files, each whole."""
    if fmt not in FORMATS:
        raise BatchError(f"unknown format {fmt!r}", item="--format",
                         fix="use " + " or ".join(FORMATS))
    folder = Path(folder)
    folder.mkdir(parents=True, exist_ok=True)
    tables = ((results.rows, ResultRow), (results.structures, StructureSummary),
              (results.routes, RouteVerdict))
    return [write_table(records, record_type, folder / f"{stem}.{fmt}", results.title)
            for stem, (records, record_type) in zip(RESULT_FILES, tables, strict=True)]
