"""The one table renderer of both packages: a :class:`Table` as aligned text, CSV and JSON, and
the cell texts that the PDF report sets in its own tables.

Numbers are printed as engineers print them: fixed point, never in scientific notation, every
value of a column with the same number of decimals (so that the decimal points line up when the
column is right-aligned), about four significant figures of the column's largest value, forces
and moments to 0.1 at least, positions to 0.01 at least. A value smaller than
:data:`ROUND_OFF` times the largest value of its kind in the table is round-off and printed
as 0. Text is left-aligned, numbers right-aligned. CSV keeps every number at full precision.

Example:
    >>> table = Table(["Demo"], ("x [m]", "M [kN-m]", "note"),
    ...               [(0.0, 1250.26, "end"), (12.5, -3.0e-12, "mid")],
    ...               formats=("position", "effect", "text"))
    >>> print(render_table(table))
    Demo
    x [m]  M [kN-m]  note
    -----  --------  ----
     0.00    1250.3  end
    12.50       0.0  mid
"""

from __future__ import annotations

import csv
import io
import json
import math
from collections.abc import Sequence
from dataclasses import dataclass, field
from typing import Any

import numpy as np

ROUND_OFF = 1e-9
"""Values below this fraction [-] of the largest value of their kind in a table print as 0."""
SIGNIFICANT = 4
"""Significant figures [-] given to the largest value of a numeric column."""
MAX_DECIMALS = 10
"""Most decimals [-] a printed number gets."""

FORMATS = ("text", "number", "effect", "position", "ratio", "factor", "count")
"""How a column is printed: text; a plain number; a force, moment or other effect (0.1 at
least); a chainage or length (0.01 at least); a ratio (3 decimals); a load factor (as many
decimals as its values need, at most 3); a whole number."""

_LEAST_DECIMALS = {"number": 0, "effect": 1, "position": 2}


@dataclass(frozen=True)
class Table:
    """Header lines, column names (with units), rows, and how each column is printed.

    Attributes:
        header: lines printed above the table (title, units, conventions, notes).
        columns: column names, each with its unit in brackets.
        rows: one tuple a row; numbers as float or int, text as str ("-" for nothing).
        formats: one of :data:`FORMATS` per column; empty: numbers as "number", the rest text.
    """

    header: list[str]
    columns: tuple[str, ...]
    rows: list[tuple[Any, ...]] = field(default_factory=list)
    formats: tuple[str, ...] = ()

    def __post_init__(self) -> None:
        if self.formats and len(self.formats) != len(self.columns):
            raise ValueError(f"{len(self.formats)} formats for {len(self.columns)} columns")
        unknown = set(self.formats) - set(FORMATS)
        if unknown:
            raise ValueError(f"unknown column format {sorted(unknown)[0]!r}")

    def format_of(self, column: int) -> str:
        """How column ``column`` is printed (see :data:`FORMATS`)."""
        if self.formats:
            return self.formats[column]
        numeric = any(_is_number(row[column]) for row in self.rows)
        return "number" if numeric else "text"


def _is_number(value: Any) -> bool:
    return isinstance(value, int | float | np.integer | np.floating) and not isinstance(
        value, bool)


def _decimals(values: Sequence[float], form: str) -> int:
    """Decimals of a column: four significant figures of its largest value, within the least
    its format asks and :data:`MAX_DECIMALS`."""
    if form == "count":
        return 0
    if form == "ratio":
        return 3
    if form == "factor":
        for decimals in range(4):
            if all(abs(round(v, decimals) - v) < 1e-9 * max(abs(v), 1.0) for v in values):
                return decimals
        return 3
    least = _LEAST_DECIMALS.get(form, 0)
    scale = max((abs(v) for v in values), default=0.0)
    if scale == 0.0:
        return least
    digits = math.floor(math.log10(scale)) + 1
    return min(max(SIGNIFICANT - digits, least), MAX_DECIMALS)


def fixed(value: float, decimals: int) -> str:
    """A number in fixed point with ``decimals`` decimals, never "-0".

    Example:
        >>> fixed(-0.0004, 2), fixed(1234567.0, 0), fixed(2.5e-7, 6)
        ('0.00', '1234567', '0.000000')
    """
    text = f"{value:.{decimals}f}"
    if text.startswith("-") and float(text) == 0.0:
        text = text[1:]
    return text


def significant(value: float, figures: int = SIGNIFICANT) -> str:
    """A number to about ``figures`` significant figures in fixed point (never scientific),
    for labels in drawings and text.

    Example:
        >>> significant(4.8321), significant(2.345e-5), significant(189316.3), significant(-0.0)
        ('4.832', '0.00002345', '189316', '0')
    """
    if value == 0 or not math.isfinite(value):
        return "0" if value == 0 else str(value)
    digits = math.floor(math.log10(abs(value))) + 1
    text = fixed(value, min(max(figures - digits, 0), MAX_DECIMALS))
    return text.rstrip("0").rstrip(".") if "." in text else text


def cell_texts(table: Table) -> list[list[str]]:
    """Every cell of the table as printed text, row by row (see the module's rules)."""
    count = len(table.columns)
    forms = [table.format_of(i) for i in range(count)]
    scale_of: dict[str, float] = {}  # round-off is judged against the table's scale of a kind
    for i, form in enumerate(forms):
        numbers = [abs(float(row[i])) for row in table.rows if _is_number(row[i])
                   and math.isfinite(float(row[i]))]
        scale_of[form] = max([scale_of.get(form, 0.0), *numbers])
    columns: list[list[str]] = []
    for i, form in enumerate(forms):
        values = [row[i] for row in table.rows]
        if form == "text":
            columns.append([str(v) for v in values])
            continue
        numbers = [0.0 if abs(float(v)) < ROUND_OFF * scale_of[form] else float(v)
                   for v in values if _is_number(v) and math.isfinite(float(v))]
        whole = all(isinstance(v, int | np.integer) for v in values if _is_number(v))
        decimals = 0 if whole and form == "number" else _decimals(numbers, form)
        texts = []
        for v in values:
            if not _is_number(v):
                texts.append(str(v))
            elif not math.isfinite(float(v)):
                texts.append(str(float(v)))
            else:
                number = float(v)
                texts.append(fixed(0.0 if abs(number) < ROUND_OFF * scale_of[form]
                                   else number, decimals))
        columns.append(texts)
    return [list(row) for row in zip(*columns, strict=True)] if table.rows else []


def right_aligned(table: Table) -> list[bool]:
    """Whether each column is right-aligned (numbers) or left-aligned (text)."""
    return [table.format_of(i) != "text" for i in range(len(table.columns))]


def render_table(table: Table) -> str:
    """Aligned text: the header lines, then the columns (text left, numbers right)."""
    cells = cell_texts(table)
    right = right_aligned(table)
    widths = [max([len(c)] + [len(r[i]) for r in cells]) for i, c in enumerate(table.columns)]

    def line(texts: Sequence[str]) -> str:
        return "  ".join(t.rjust(w) if r else t.ljust(w)
                         for t, w, r in zip(texts, widths, right, strict=True)).rstrip()

    lines = list(table.header)
    lines.append(line(table.columns))
    lines.append("  ".join("-" * w for w in widths))
    lines.extend(line(row) for row in cells)
    return "\n".join(lines)


def render_columns(rows: Sequence[Sequence[str]]) -> str:
    """Rows of text in left-aligned columns, the first row being the column names."""
    table = Table([], tuple(rows[0]), [tuple(r) for r in rows[1:]],
                  formats=("text",) * len(rows[0]))
    text = render_table(table).splitlines()
    return "\n".join([text[0], *text[2:]])


def render_csv(table: Table) -> str:
    """CSV with the header lines as '#' comments, units in the column names and every number at
    full precision."""
    buffer = io.StringIO()
    for line in table.header:
        buffer.write(f"# {line}\n")
    writer = csv.writer(buffer, lineterminator="\n")
    writer.writerow(table.columns)
    for row in table.rows:
        writer.writerow([repr(float(v)) if isinstance(v, float | np.floating) else v
                         for v in row])
    return buffer.getvalue()


def to_jsonable(value: Any) -> Any:
    """Numbers, arrays and tuples as plain JSON values (non-finite numbers as strings)."""
    if isinstance(value, dict):
        return {str(k): to_jsonable(v) for k, v in value.items()}
    if isinstance(value, list | tuple):
        return [to_jsonable(v) for v in value]
    if isinstance(value, np.ndarray):
        return [to_jsonable(v) for v in value.tolist()]
    if isinstance(value, np.generic):
        value = value.item()
    if isinstance(value, float) and not np.isfinite(value):
        return str(value)
    return value


def render_json(document: Any) -> str:
    """Any document of dicts, lists, numbers and text as indented JSON."""
    return json.dumps(to_jsonable(document), indent=2, ensure_ascii=False)
