"""Typed values of a model file: the TOML document itself, and keys read with one-line errors
that name the file, the item, the type expected and the fix.

Every key has one type. A flag is ``true`` or ``false`` (never the text "false"), a name is
text (never a number), a number is finite, and a key with a dimension takes a plain number in
the file's units or a quantity such as ``"110 ft"`` (see :mod:`vehicles.quantities`).

Example:
    >>> try:
    ...     read_flag("false", "member D1.release_end", "bridge.toml")
    ... except ModelError as error:
    ...     print(error)
    bridge.toml: member D1.release_end: expected true or false, got text 'false' (write \
true or false without quotes)
    >>> read_quantity("110 ft", "spans", "beam.spans[1]", "bridge.toml", "kip-ft")
    110.0
"""

from __future__ import annotations

import difflib
import math
from pathlib import Path
from typing import Any

from influence.errors import ModelError
from influence.model.keys import homes
from influence.model.structure import name_problem
from vehicles.quantities import quantity
from vehicles.tomlfile import read_toml_file


def read_toml(path: str | Path) -> dict[str, Any]:
    """Read a model file: size capped, UTF-8 (a byte-order mark allowed), TOML, every number
    finite and in range; any problem is a one-line ModelError naming the file and place."""
    return read_toml_file(path, ModelError, "model file")


def check_keys(table: dict[str, Any], allowed: set[str] | frozenset[str], item: str,
               source: str) -> None:
    """Refuse a key that is not among ``allowed``, saying where it belongs or what is allowed."""
    for key in table:
        if key in allowed:
            continue
        tables = homes(str(key))
        if tables:
            fix = f"{key} belongs in {' or '.join(tables)}"
        else:
            close = difflib.get_close_matches(str(key), sorted(allowed), n=1)
            fix = (f"did you mean {close[0]!r}? " if close else "") + "allowed keys: " + \
                ", ".join(sorted(allowed))
        raise ModelError(f"unknown key {key!r}", source=source, item=item, fix=fix)


def required(table: dict[str, Any], key: str, item: str, source: str) -> Any:
    if key not in table:
        raise ModelError(f"missing key {key!r}", source=source, item=item, fix=f"add {key}")
    return table[key]


def table(value: Any, item: str, source: str) -> dict[str, Any]:
    if value is None:
        return {}
    if not isinstance(value, dict):
        raise ModelError(f"expected a table, got {_shown(value)}", source=source, item=item,
                         fix="write it as a TOML table")
    return value


def tables(document: dict[str, Any], key: str, source: str) -> list[dict[str, Any]]:
    """The ``[[key]]`` array of tables (empty when absent)."""
    value = document.get(key, [])
    if not isinstance(value, list) or not all(isinstance(v, dict) for v in value):
        raise ModelError(f"{key} must be an array of tables, got {_shown(value)}",
                         source=source, item=key, fix=f"write each entry as [[{key}]]")
    return value


def listed(value: Any, item: str, source: str) -> list[Any]:
    if not isinstance(value, list):
        raise ModelError(f"expected a list, got {_shown(value)}", source=source, item=item,
                         fix="write it as [a, b, ...]")
    return value


def read_number(value: Any, item: str, source: str) -> float:
    """A plain finite number (an int or a float, not a flag or text)."""
    if isinstance(value, bool) or not isinstance(value, int | float) or not math.isfinite(value):
        raise ModelError(f"expected a number, got {_shown(value)}", source=source, item=item,
                         fix="write a plain number")
    return float(value)


def read_integer(value: Any, item: str, source: str, minimum: int = 1) -> int:
    """A whole number of at least ``minimum``."""
    if isinstance(value, bool) or not isinstance(value, int) or value < minimum:
        raise ModelError(f"expected a whole number of {minimum} or more, got {_shown(value)}",
                         source=source, item=item, fix=f"write a whole number, {minimum} or more")
    return value


def read_quantity(value: Any, key: str, item: str, source: str, units: str) -> float:
    """A number in the file's units, or a quantity such as ``"110 ft"`` converted to them
    (``key`` names the dimension)."""
    return quantity(value, key, units, item=item, source=source, error=ModelError)


def read_flag(value: Any, item: str, source: str) -> bool:
    """``true`` or ``false``."""
    if not isinstance(value, bool):
        raise ModelError(f"expected true or false, got {_shown(value)}", source=source,
                         item=item, fix="write true or false without quotes")
    return value


def read_text(value: Any, item: str, source: str) -> str:
    """Text (a quoted TOML string)."""
    if not isinstance(value, str):
        raise ModelError(f"expected text, got {_shown(value)}", source=source, item=item,
                         fix=f'write it in quotes, such as "{_plain(value)}"')
    return value


def read_texts(value: Any, item: str, source: str) -> tuple[str, ...]:
    """A list of text."""
    if isinstance(value, str):
        raise ModelError(f"expected a list, got the text {value!r}", source=source, item=item,
                         fix=f'write it as a list: ["{value}"]')
    return tuple(read_text(entry, f"{item}[{number}]", source)
                 for number, entry in enumerate(listed(value, item, source), start=1))


def read_name(value: Any, item: str, source: str, *, node: bool = False) -> str:
    """A name (see :func:`influence.model.structure.name_problem`): text without ``@ : , "``
    or spaces at its ends; a node name may not read as a number.

    Example:
        >>> try:
        ...     read_name("20", "beam.names[2]", "g.toml", node=True)
        ... except ModelError as error:
        ...     print(error.problem)
        node name '20' reads as a chainage
    """
    name = read_text(value, item, source)
    problem = name_problem(name, node)
    if problem is not None:
        raise ModelError(problem[0], source=source, item=item, fix=problem[1])
    return name


def _shown(value: Any) -> str:
    """A value as a message shows it: its TOML type and a short form."""
    kind = {bool: "a flag", int: "a number", float: "a number", str: "text", list: "a list",
            dict: "a table"}.get(type(value), type(value).__name__)
    text = repr(value)
    return f"{kind} {text if len(text) <= 40 else text[:37] + '...'}"


def _plain(value: Any) -> str:
    if isinstance(value, bool):
        return "true" if value else "false"
    text = str(value)
    return text if len(text) <= 20 and '"' not in text else "..."
