"""Typed values of a model file: the TOML document itself, and keys read with one-line errors
that name the file, the item and the fix.
"""

from __future__ import annotations

import math
import re
import tomllib
from pathlib import Path
from typing import Any

from influence.errors import ModelError


def read_toml(path: str | Path) -> dict[str, Any]:
    """Parse a TOML file, turning a syntax error into a one-line ModelError with its line."""
    source = str(path)
    try:
        text = Path(path).read_text(encoding="utf-8")
    except FileNotFoundError:
        raise ModelError("file not found", source=source, fix="check the path") from None
    except OSError as error:
        raise ModelError(f"cannot be read ({error.strerror})", source=source,
                         fix="check the path and permissions") from None
    try:
        return tomllib.loads(text)
    except tomllib.TOMLDecodeError as error:
        message = str(error)
        line = re.search(r"line (\d+)", message)
        where = f"line {line.group(1)}" if line else "file"
        raise ModelError(f"is not valid TOML ({message})", source=source, item=where,
                         fix="correct the syntax on that line") from None


def check_keys(table: dict[str, Any], allowed: set[str], item: str, source: str) -> None:
    """Refuse a key that is not among ``allowed``, naming the allowed ones."""
    for key in table:
        if key not in allowed:
            raise ModelError(f"unknown key {key!r}", source=source, item=item,
                             fix="allowed keys: " + ", ".join(sorted(allowed)))


def required(table: dict[str, Any], key: str, item: str, source: str) -> Any:
    if key not in table:
        raise ModelError(f"missing key {key!r}", source=source, item=item, fix=f"add {key}")
    return table[key]


def table(value: Any, item: str, source: str) -> dict[str, Any]:
    if value is None:
        return {}
    if not isinstance(value, dict):
        raise ModelError(f"expected a table, got {value!r}", source=source, item=item,
                         fix="write it as a TOML table")
    return value


def listed(value: Any, item: str, source: str) -> list[Any]:
    if not isinstance(value, list):
        raise ModelError(f"expected a list, got {value!r}", source=source, item=item,
                         fix="write it as [a, b, ...]")
    return value


def read_number(value: Any, item: str, source: str) -> float:
    if isinstance(value, bool) or not isinstance(value, int | float) or not math.isfinite(value):
        raise ModelError(f"expected a number, got {value!r}", source=source, item=item,
                         fix="write a plain number")
    return float(value)
