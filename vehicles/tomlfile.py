"""Reading a TOML input file safely: size capped, UTF-8 (a byte-order mark allowed), parsed, and
every number in it checked to be finite and of a size a calculation can use.

Both the vehicle files and the structure model files are read here, so a file of random bytes,
a UTF-16 file, a Latin-1 byte, an endless device or an out-of-range number is refused the same
way whichever reader meets it. The error class is the caller's (each package raises its own),
built as ``error(problem, source=..., item=..., fix=...)``.

Example:
    >>> from vehicles.errors import VehicleError
    >>> parse_toml_text('x = 1.0', "a.toml", VehicleError)
    {'x': 1.0}
    >>> try:
    ...     parse_toml_text('[beam]\\nspans = [10.0, nan]', "a.toml", VehicleError)
    ... except VehicleError as error:
    ...     print(error)
    a.toml: beam.spans[2]: nan is not a usable number (give a finite number)
"""

from __future__ import annotations

import math
import re
import tomllib
from collections.abc import Callable
from pathlib import Path
from typing import Any

MAX_FILE_BYTES = 8 * 1024 * 1024
"""The largest input file read [bytes]: far above any real model or vehicle file, and a cap on
an endless input such as a device."""

MAX_MAGNITUDE = 1.0e15
"""The largest magnitude of any number in an input file: beyond every real length, force or
stiffness in kN and m or kip and ft, and far enough below the float range that sums, squares and
products of such numbers cannot overflow."""

MAX_ENTRIES = 100_000
"""The most entries of one array in an input file."""

MAX_INTEGER = 2**53
"""Integers beyond this are not held exactly as floats (TOML allows 64-bit integers)."""

ErrorType = Callable[..., Exception]

_UTF8_BOM = b"\xef\xbb\xbf"
_UTF16_BOMS = (b"\xff\xfe", b"\xfe\xff")
_NEWLINE = b"\n"
_ZERO = b"\x00"


def read_toml_file(path: str | Path, error: ErrorType,
                   what: str = "TOML file") -> dict[str, Any]:
    """Read, decode, parse and range-check a TOML file.

    Args:
        path: the file.
        error: the exception class to raise (``ModelError`` or ``VehicleError``).
        what: what the file should be, for messages ("model file", "vehicle file").

    Raises:
        error: one line naming the file, the place and the fix.
    """
    source = str(path)
    text = decoded(read_capped(path, error, what), source, error, what)
    return parse_toml_text(text, source, error)


def read_capped(path: str | Path, error: ErrorType, what: str = "TOML file") -> bytes:
    """The file's bytes, refusing a missing, unreadable or oversized (or endless) file."""
    source = str(path)
    try:
        with open(path, "rb") as stream:
            data = stream.read(MAX_FILE_BYTES + 1)
    except FileNotFoundError:
        raise error("file not found", source=source, fix="check the path") from None
    except IsADirectoryError:
        raise error("is a folder, not a file", source=source,
                    fix=f"give the path of a {what}") from None
    except OSError as failure:
        reason = failure.strerror or type(failure).__name__
        raise error(f"cannot be read ({reason})", source=source,
                    fix="check the path and permissions") from None
    if len(data) > MAX_FILE_BYTES:
        raise error(f"is larger than {MAX_FILE_BYTES // (1024 * 1024)} MiB", source=source,
                    fix=f"give a {what} (TOML text); this is not one, or is far too large")
    return data


def decoded(data: bytes, source: str, error: ErrorType, what: str = "TOML file") -> str:
    """UTF-8 text of the bytes (a leading byte-order mark dropped), or a one-line error."""
    head = data[:64]
    if data.startswith(_UTF16_BOMS) or (len(head) >= 4 and 2 * head.count(_ZERO) >= len(head)):
        raise error("is UTF-16 text, not UTF-8", source=source,
                    fix="save the file as UTF-8 (plain text)")
    if data.startswith(_UTF8_BOM):
        data = data[len(_UTF8_BOM):]
    if _ZERO in data:
        line = data[:data.index(_ZERO)].count(_NEWLINE) + 1
        raise error("holds binary data (a zero byte), not TOML text", source=source,
                    item=f"line {line}", fix=f"give a {what} (TOML text)")
    try:
        return data.decode("utf-8")
    except UnicodeDecodeError as failure:
        line = data[:failure.start].count(_NEWLINE) + 1
        byte = data[failure.start:failure.start + 1].hex()
        raise error(f"byte 0x{byte} is not UTF-8 text", source=source, item=f"line {line}",
                    fix="save the file as UTF-8 (an editor's 'UTF-8' encoding)") from None


def parse_toml_text(text: str, source: str, error: ErrorType) -> dict[str, Any]:
    """Parse TOML text and check every number in it (see :func:`check_numbers`)."""
    try:
        document = tomllib.loads(text)
    except tomllib.TOMLDecodeError as failure:
        message = str(failure)
        line = re.search(r"line (\d+)", message)
        raise error(f"is not valid TOML ({message})", source=source,
                    item=f"line {line.group(1)}" if line else "file",
                    fix="correct the syntax on that line") from None
    except RecursionError:
        raise error("nests arrays or tables too deeply to read", source=source, item="file",
                    fix="write a flat TOML file") from None
    check_numbers(document, source, error)
    return document


def check_numbers(value: Any, source: str, error: ErrorType, where: str = "") -> None:
    """Refuse NaN, infinity, integers beyond :data:`MAX_INTEGER` and numbers beyond
    :data:`MAX_MAGNITUDE` anywhere in a parsed document, naming the key path."""
    if isinstance(value, dict):
        for key, inner in value.items():
            check_numbers(inner, source, error, f"{where}.{key}" if where else str(key))
    elif isinstance(value, list):
        if len(value) > MAX_ENTRIES:
            raise error(f"an array of {len(value):,} entries is more than {MAX_ENTRIES:,}",
                        source=source, item=where, fix="give a model or vehicle of a real size")
        for index, inner in enumerate(value, start=1):
            check_numbers(inner, source, error, f"{where}[{index}]")
    elif isinstance(value, bool):
        return
    elif isinstance(value, int):
        if abs(value) > MAX_INTEGER:
            raise error(f"integer {_short(value)} is too large to hold exactly", source=source,
                        item=where, fix=f"give a number of at most {MAX_MAGNITUDE:g}")
        if abs(value) > MAX_MAGNITUDE:
            raise error(f"{value} is out of range", source=source, item=where,
                        fix=f"give a number of at most {MAX_MAGNITUDE:g} in magnitude")
    elif isinstance(value, float):
        if not math.isfinite(value):
            raise error(f"{value} is not a usable number", source=source, item=where,
                        fix="give a finite number")
        if abs(value) > MAX_MAGNITUDE:
            raise error(f"{value:g} is out of range", source=source, item=where,
                        fix=f"give a number of at most {MAX_MAGNITUDE:g} in magnitude")


def _short(value: int) -> str:
    text = str(value)
    return text if len(text) <= 24 else f"{text[:10]}...({len(text)} digits)"
