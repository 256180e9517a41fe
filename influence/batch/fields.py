"""Typed values of the batch files (inventory, routes, job), read with one-line errors that name
the file, the item and the fix.

Example:
    >>> import pathlib
    >>> vehicle_names(["Type 3", "TYPE 3S2"], pathlib.Path("."), "job.toml", "run[0]")
    ('Type 3', 'TYPE 3S2')
    >>> try:
    ...     vehicle_names(["Type 9"], pathlib.Path("."), "job.toml", "run[0]")
    ... except BatchError as error:
    ...     print(error.item)
    run[0].vehicles
"""

from __future__ import annotations

import os
from pathlib import Path
from typing import Any

from influence.errors import BatchError, ModelError
from influence.model.fields import check_keys, read_toml
from vehicles.errors import VehicleError
from vehicles.library.catalog import load_model


def refused(error: ModelError) -> BatchError:
    """A model-file reader's error about a batch file, as a batch error."""
    return BatchError(error.problem, source=error.source, item=error.item, fix=error.fix)


def read_document(path: str | Path, keys: set[str]) -> dict[str, Any]:
    """A TOML file whose top level holds only ``keys``."""
    try:
        document = read_toml(path)
        check_keys(document, keys, "top level", str(path))
    except ModelError as error:
        raise refused(error) from None
    return document


def table_list(document: dict[str, Any], key: str, source: str,
               fix: str) -> list[tuple[str, dict[str, Any]]]:
    """The tables of the array ``[[key]]``, each with its item label ("key[0]", ...)."""
    tables = document.get(key)
    if not isinstance(tables, list) or not tables:
        raise BatchError(f"no {key}", source=source, item=key, fix=fix)
    found = []
    for index, table in enumerate(tables):
        item = f"{key}[{index}]"
        if not isinstance(table, dict):
            raise BatchError(f"expected a table, got {table!r}", source=source, item=item,
                             fix=f"write each as a [[{key}]] table")
        found.append((item, table))
    return found


def text_list(value: Any, source: str, item: str) -> tuple[str, ...]:
    """A list of non-empty strings."""
    if not isinstance(value, list) or not all(isinstance(v, str) and v.strip() for v in value):
        raise BatchError(f"expected a list of names, got {value!r}", source=source, item=item,
                         fix='write it as ["a", "b"]')
    return tuple(v.strip() for v in value)


def vehicle_names(value: Any, folder: Path, source: str, item: str,
                  key: str = "vehicles") -> tuple[str, ...]:
    """Library names or vehicle files (made absolute from ``folder``), each checked by loading
    it once."""
    found = []
    for name in text_list(value, source, f"{item}.{key}"):
        local = folder / name
        chosen = os.path.abspath(local) if name.lower().endswith(".toml") or local.is_file() \
            else name
        try:
            load_model(chosen)
        except VehicleError as error:
            raise BatchError(error.problem, source=source, item=f"{item}.{key}",
                             fix=error.fix or "use a library name or a vehicle file") from None
        found.append(chosen)
    return tuple(found)


def positive_int(value: Any, source: str, item: str) -> int:
    if isinstance(value, bool) or not isinstance(value, int) or value < 1:
        raise BatchError(f"expected a whole number of 1 or more, got {value!r}", source=source,
                         item=item, fix="write a whole number such as 10")
    return value


def positive_number(value: Any, source: str, item: str) -> float:
    if isinstance(value, bool) or not isinstance(value, int | float) or not value > 0:
        raise BatchError(f"expected a positive number, got {value!r}", source=source,
                         item=item, fix="write a number greater than 0")
    return float(value)
