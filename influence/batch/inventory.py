"""The inventory of a batch run: one row per structure, read from TOML or CSV.

Each row names the structure (``id``), its model file (``model``, a path relative to the
inventory file) and, optionally, the routes it stands on (``route``; several separated by ``;``),
its ``owner`` and its ``location``. A TOML inventory lists the rows as ``[[structures]]`` tables
under an optional ``title``; a CSV inventory has a header row with those column names (lines
starting with ``#`` are comments).

A model path that does not exist is not an error here: that structure gets an ``error`` row when
the batch runs, and the others go on.

Example:
    >>> import pathlib, tempfile
    >>> folder = pathlib.Path(tempfile.mkdtemp())
    >>> _ = (folder / "county.csv").write_text(
    ...     "id,model,route\\nB-1,b1.toml,CR 4; CR 9\\nB-2,b2.toml,\\n")
    >>> inventory = read_inventory(folder / "county.csv")
    >>> [(s.identifier, s.routes) for s in inventory.structures]
    [('B-1', ('CR 4', 'CR 9')), ('B-2', ())]
    >>> try:
    ...     read_inventory(folder / "none.toml")
    ... except BatchError as error:
    ...     print(error.problem)
    inventory not found
"""

from __future__ import annotations

import csv
import io
import os
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from influence.batch.fields import read_document, table_list
from influence.errors import BatchError

ROW_KEYS = ("id", "model", "route", "owner", "location")
"""The fields of an inventory row; ``id`` and ``model`` are required."""
ROUTE_SEPARATOR = ";"


@dataclass(frozen=True)
class Structure:
    """One row of the inventory.

    Attributes:
        identifier: the structure's id, unique in the inventory.
        model_path: its model file, made absolute from the inventory's folder.
        routes: the routes it stands on.
        owner: who owns it ("" if not given).
        location: where it is ("" if not given).
        row: where the row is in the inventory, for messages ("row 4", "structures[3]").
    """

    identifier: str
    model_path: str
    routes: tuple[str, ...] = ()
    owner: str = ""
    location: str = ""
    row: str = ""


@dataclass(frozen=True)
class Inventory:
    """The structures of a batch run, in file order, and the file they came from."""

    structures: tuple[Structure, ...]
    title: str = ""
    source: str = ""

    def __post_init__(self) -> None:
        seen: set[str] = set()
        for structure in self.structures:
            if structure.identifier in seen:
                raise BatchError(f"id {structure.identifier!r} is used twice",
                                 source=self.source, item=structure.row,
                                 fix="give every structure its own id")
            seen.add(structure.identifier)

    def structure(self, identifier: str) -> Structure:
        """The structure with this id."""
        for structure in self.structures:
            if structure.identifier == identifier:
                return structure
        raise BatchError(f"no structure with id {identifier!r}", source=self.source,
                         fix="use an id of the inventory")


def read_inventory(path: str | Path) -> Inventory:
    """Read an inventory file: ``.csv`` as CSV, anything else as TOML.

    Raises:
        BatchError: when the file is missing or unreadable, a row lacks its id or model path,
            or a column is unknown.
    """
    path = Path(path)
    source = str(path)
    if not path.is_file():
        raise BatchError("inventory not found", source=source,
                         fix="check the path of the inventory file")
    if path.suffix.lower() == ".csv":
        title, records = "", _csv_records(path)
    else:
        title, records = _toml_records(path)
    folder = path.resolve().parent
    structures = tuple(_structure(record, item, folder, source) for item, record in records)
    return Inventory(structures, title, source)


def _toml_records(path: Path) -> tuple[str, list[tuple[str, dict[str, Any]]]]:
    document = read_document(path, {"title", "structures"})
    records = table_list(document, "structures", str(path),
                         "list each structure as a [[structures]] table with id and model")
    return str(document.get("title", "")), records


def _csv_records(path: Path) -> list[tuple[str, dict[str, Any]]]:
    source = str(path)
    try:
        text = path.read_text(encoding="utf-8-sig")
    except (OSError, UnicodeDecodeError) as error:
        raise BatchError(f"cannot be read ({error})", source=source,
                         fix="save the inventory as UTF-8 text") from None
    lines = [line for line in text.splitlines() if line.strip() and not line.startswith("#")]
    reader = csv.DictReader(io.StringIO("\n".join(lines)))
    columns = [c.strip() for c in reader.fieldnames or ()]
    unknown = [c for c in columns if c not in ROW_KEYS]
    if unknown or not {"id", "model"} <= set(columns):
        problem = (f"unknown column {unknown[0]!r}" if unknown
                   else "the header lacks the id or model column")
        raise BatchError(problem, source=source, item="header",
                         fix="columns: " + ", ".join(ROW_KEYS) + " (id and model required)")
    records = []
    for number, row in enumerate(reader, start=2):
        if None in row:
            raise BatchError("more cells than columns", source=source, item=f"row {number}",
                             fix="quote cells that hold commas")
        records.append((f"row {number}", {k.strip(): (v or "").strip() for k, v in row.items()
                                          if (v or "").strip()}))
    if not records:
        raise BatchError("no structures", source=source, fix="add one row per structure")
    return records


def _structure(record: dict[str, Any], item: str, folder: Path, source: str) -> Structure:
    unknown = [key for key in record if key not in ROW_KEYS]
    if unknown:
        raise BatchError(f"unknown key {unknown[0]!r}", source=source, item=item,
                         fix="keys: " + ", ".join(ROW_KEYS))
    values = {}
    for key, value in record.items():
        if key == "route" and isinstance(value, list):
            value = ROUTE_SEPARATOR.join(str(v) for v in value)
        if not isinstance(value, str | int) or isinstance(value, bool):
            raise BatchError(f"{key} = {value!r} is not text", source=source, item=item,
                             fix=f'write it in quotes: {key} = "..."')
        values[key] = str(value).strip()
    for key in ("id", "model"):
        if not values.get(key):
            what = "an id" if key == "id" else "a model path"
            raise BatchError(f"the row has no {key}", source=source, item=item,
                             fix=f"give {what} in the {key} field")
    routes = tuple(r.strip() for r in values.get("route", "").split(ROUTE_SEPARATOR)
                   if r.strip())
    model = os.path.abspath(folder / values["model"])
    return Structure(values["id"], model, routes, values.get("owner", ""),
                     values.get("location", ""), item)
