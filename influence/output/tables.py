"""Plain text tables, CSV and JSON (files are written whole by :mod:`vehicles.atomic`).

Example:
    >>> print(render_table(Table(["Demo"], ("x [m]", "y [-]"), [(0.0, 1.0), (2.5, -0.25)])))
    Demo
    x [m]  y [-]
    -----  -----
        0      1
      2.5  -0.25
"""

from __future__ import annotations

import csv
import io
import json
from dataclasses import dataclass, field
from typing import Any

import numpy as np


@dataclass(frozen=True)
class Table:
    """Header lines, column names (with units) and rows."""

    header: list[str]
    columns: tuple[str, ...]
    rows: list[tuple[Any, ...]] = field(default_factory=list)


def _cell(value: Any) -> str:
    if isinstance(value, float | np.floating):
        return f"{float(value):.6g}" if value != 0 else "0"
    return str(value)


def render_table(table: Table) -> str:
    """Aligned text: header lines, then the columns."""
    cells = [[_cell(v) for v in row] for row in table.rows]
    widths = [max([len(c)] + [len(r[i]) for r in cells]) for i, c in enumerate(table.columns)]
    lines = list(table.header)
    lines.append("  ".join(c.rjust(w) for c, w in zip(table.columns, widths, strict=True)))
    lines.append("  ".join("-" * w for w in widths))
    for row in cells:
        lines.append("  ".join(c.rjust(w) for c, w in zip(row, widths, strict=True)))
    return "\n".join(lines)


def render_csv(table: Table) -> str:
    """CSV with the header lines as '#' comments and units in the column names."""
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


def render_json(document: dict[str, Any]) -> str:
    return json.dumps(to_jsonable(document), indent=2)
