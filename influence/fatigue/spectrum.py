"""Traffic spectrum files: one truck a row, as weigh-in-motion stations report them.

A spectrum file is CSV with a header naming every column and its unit in brackets::

    axle_1 [kip],axle_2 [kip],axle_3 [kip],spacing_1 [ft],spacing_2 [ft],per_day [-]
    8,32,32,14,30,120
    12,34,,16,,40

``axle_N`` is the load of axle N, front first [kip or kN]; ``spacing_N`` the gap between axles N and
N+1 [ft or m]; the last column is either ``per_day`` (trucks of that row a day in the lane) or
``count`` (trucks of that row observed; the day's number then follows from the (ADTT)SL). A truck
with fewer axles leaves its last axle and spacing cells empty (or 0). All axle columns share one
force unit and all spacing columns one length unit; loads and gaps are converted exactly to the
unit system asked for (1 kip = 4.4482216152605 kN, 1 ft = 0.3048 m).

Example:
    >>> text = "axle_1 [kN],axle_2 [kN],spacing_1 [m],count [-]\\n50,80,4.0,3\\n60,,,1\\n"
    >>> spectrum = parse_spectrum(text, "wim.csv")
    >>> [t.axle_loads for t in spectrum.trucks]
    [(50.0, 80.0), (60.0,)]
    >>> spectrum.daily_passages(adtt_sl=2000.0).tolist()
    [1500.0, 500.0]
    >>> parse_spectrum(text, "wim.csv", units="kip-ft").trucks[0].axle_gaps[0] == 4.0 / 0.3048
    True
"""

from __future__ import annotations

import csv
import io
import math
import re
from dataclasses import dataclass
from pathlib import Path

import numpy as np

from influence.errors import ModelError
from influence.fatigue.units import FORCE_KN, LENGTH_M, SYSTEMS
from vehicles.tomlfile import MAX_MAGNITUDE, decoded, read_capped

FREQUENCIES = ("per_day", "count")
"""Names of the frequency column: trucks a day, or trucks observed."""

_HEADER = re.compile(r"^\s*(?P<name>[A-Za-z_]+?)(?:_(?P<index>\d+))?\s*\[(?P<unit>[^\]]*)\]\s*$")


@dataclass(frozen=True)
class SpectrumTruck:
    """One row of a spectrum: a truck and how often it passes.

    Attributes:
        axle_loads: axle loads, front first [force].
        axle_gaps: gap from each axle to the next one, one fewer than the axles [length].
        frequency: trucks a day, or trucks observed (see :attr:`TrafficSpectrum.frequency`).
        row: line of the file the truck was read from (0 when built in Python).
    """

    axle_loads: tuple[float, ...]
    axle_gaps: tuple[float, ...]
    frequency: float
    row: int = 0

    def __post_init__(self) -> None:
        if not self.axle_loads or len(self.axle_gaps) != len(self.axle_loads) - 1:
            raise ModelError(f"{len(self.axle_loads)} axles with {len(self.axle_gaps)} gaps",
                             item=f"row {self.row}", fix="give one gap fewer than axles")
        if not all(math.isfinite(v) and v > 0 for v in self.axle_loads + self.axle_gaps):
            raise ModelError("axle loads and gaps must be positive", item=f"row {self.row}",
                             fix="give positive finite loads and gaps")
        if not (math.isfinite(self.frequency) and self.frequency >= 0):
            raise ModelError(f"frequency {self.frequency} is negative", item=f"row {self.row}",
                             fix="give a frequency of at least 0")


@dataclass(frozen=True)
class TrafficSpectrum:
    """The trucks of a spectrum file in one unit system.

    Attributes:
        source: the file.
        units: "kip-ft" or "kN-m".
        frequency: "per_day" or "count".
        trucks: the rows in file order.
    """

    source: str
    units: str
    frequency: str
    trucks: tuple[SpectrumTruck, ...]

    def daily_passages(self, adtt_sl: float | None = None) -> np.ndarray:
        """Passages a day of each truck: the per_day column, or each count's share of
        ``adtt_sl`` (trucks a day in one lane), which counts need.

        Raises:
            ModelError: for counts without a positive ``adtt_sl``.
        """
        given = np.array([truck.frequency for truck in self.trucks])
        if self.frequency == "per_day":
            return given
        total = float(given.sum())
        if adtt_sl is None or not adtt_sl > 0 or total <= 0:
            raise ModelError("the spectrum gives counts, which need the trucks a day",
                             source=self.source, item="count",
                             fix="give adtt (and lanes or p) in [fatigue], or per_day columns")
        return given / total * adtt_sl


def read_spectrum(path: str | Path, units: str | None = None) -> TrafficSpectrum:
    """Read a spectrum file (see the module note), converted to ``units`` if given."""
    source = str(path)
    what = "spectrum CSV file"
    text = decoded(read_capped(path, ModelError, what), source, ModelError, what)
    return parse_spectrum(text, source, units)


def parse_spectrum(text: str, source: str = "", units: str | None = None) -> TrafficSpectrum:
    """A spectrum from CSV text (``source`` names it in errors).

    Raises:
        ModelError: naming the file, row and column of the first bad header or cell.
    """
    reader = csv.reader(io.StringIO(text))
    header = next(reader, None)
    if header is None:
        raise ModelError("the file is empty", source=source, fix="start with a header row")
    columns = _columns(header, source)
    rows, lines = [], []
    for cells in reader:
        if not any(cell.strip() for cell in cells):
            continue
        if len(cells) != len(header):
            raise ModelError(f"{len(cells)} cells for {len(header)} columns", source=source,
                             item=f"row {reader.line_num}", fix="give one cell a column")
        rows.append(cells)
        lines.append(reader.line_num)
    table = _numbers(rows, lines, header, source)
    loads, gaps, counts = _trucks(table, lines, columns, header, source)
    file_units = next(name for name, pair in SYSTEMS.items()
                      if pair == (columns.force_unit, columns.length_unit))
    target = file_units if units is None else units
    if target not in SYSTEMS:
        raise ModelError(f"unknown unit system {target!r}", source=source, item="units",
                         fix="use " + " or ".join(SYSTEMS))
    force, length = SYSTEMS[target]
    loads = loads * (FORCE_KN[columns.force_unit] / FORCE_KN[force])
    gaps = gaps * (LENGTH_M[columns.length_unit] / LENGTH_M[length])
    axles = (loads > 0).sum(axis=1).tolist()
    load_rows, gap_rows = loads.tolist(), gaps.tolist()
    trucks = tuple(
        SpectrumTruck(tuple(load_rows[i][:n]), tuple(gap_rows[i][:n - 1]), count, line)
        for i, (n, count, line) in enumerate(zip(axles, counts.tolist(), lines, strict=True)))
    return TrafficSpectrum(source, target, columns.frequency, trucks)


@dataclass(frozen=True)
class _Columns:
    axles: tuple[int, ...]  # column of axle 1, 2, ...
    spacings: tuple[int, ...]  # column of spacing 1, 2, ...
    frequency_column: int
    frequency: str
    force_unit: str
    length_unit: str


def _columns(header: list[str], source: str) -> _Columns:
    found: dict[str, dict[int, tuple[int, str]]] = {"axle": {}, "spacing": {}}
    frequency: tuple[int, str] | None = None
    for column, title in enumerate(header):
        match = _HEADER.match(title)
        if match is None:
            raise ModelError(f"column {title!r} has no unit in brackets", source=source,
                             item=f"column {column + 1}",
                             fix="write e.g. 'axle_1 [kip]', 'spacing_1 [ft]', 'per_day [-]'")
        name, index, unit = match["name"], match["index"], match["unit"].strip()
        if name in found and index is not None:
            if int(index) in found[name]:
                raise ModelError(f"column {title!r} appears twice", source=source,
                                 item=title.strip(), fix="give each column once")
            found[name][int(index)] = (column, unit)
        elif name in FREQUENCIES and index is None:
            if frequency is not None:
                raise ModelError("both per_day and count columns", source=source,
                                 item=title.strip(), fix="give one frequency column")
            if unit != "-":
                raise ModelError(f"unit [{unit}] of {name}", source=source, item=title.strip(),
                                 fix=f"write '{name} [-]'")
            frequency = (column, name)
        else:
            raise ModelError(f"unknown column {title.strip()!r}", source=source,
                             item=f"column {column + 1}",
                             fix="columns are axle_N [kip|kN], spacing_N [ft|m], per_day [-] "
                                 "or count [-]")
    if frequency is None:
        raise ModelError("no frequency column", source=source, item="header",
                         fix="add 'per_day [-]' or 'count [-]'")
    axles = _numbered(found["axle"], "axle", source, range(1, len(found["axle"]) + 1))
    spacings = _numbered(found["spacing"], "spacing", source, range(1, len(axles)))
    force = _one_unit(found["axle"], "axle", FORCE_KN, source)
    length = _one_unit(found["spacing"], "spacing", LENGTH_M, source) if spacings else (
        "ft" if force == "kip" else "m")
    if (force, length) not in SYSTEMS.values():
        raise ModelError(f"axles in {force} with spacings in {length}", source=source,
                         item="header", fix="use kip with ft, or kN with m")
    return _Columns(axles, spacings, frequency[0], frequency[1], force, length)


def _numbered(columns: dict[int, tuple[int, str]], name: str, source: str,
              expected: range) -> tuple[int, ...]:
    if name == "axle" and not columns:
        raise ModelError("no axle columns", source=source, item="header",
                         fix="add axle_1 [kip] (or [kN]) and the following axles")
    if sorted(columns) != list(expected):
        raise ModelError(f"{name} columns numbered {sorted(columns)}", source=source,
                         item="header",
                         fix=f"number them {expected.start} to {expected.stop - 1} without gaps")
    return tuple(columns[k][0] for k in expected)


def _one_unit(columns: dict[int, tuple[int, str]], name: str, known: dict[str, float],
              source: str) -> str:
    units = {k: unit for k, (_, unit) in sorted(columns.items())}
    first = units[min(units)]
    for k, unit in units.items():
        if unit not in known:
            choices = ("kip", "kN") if known is FORCE_KN else ("ft", "m")
            raise ModelError(f"unknown unit [{unit}]", source=source, item=f"{name}_{k}",
                             fix="use " + " or ".join(f"[{u}]" for u in choices))
        if unit != first:
            raise ModelError(f"{name}_{k} in [{unit}] but {name}_{min(units)} in [{first}]",
                             source=source, item=f"{name}_{k}",
                             fix=f"give every {name} column in one unit")
    return first


def _numbers(rows: list[list[str]], lines: list[int], header: list[str],
             source: str) -> np.ndarray:
    """The cells as numbers, NaN where empty."""
    if not rows:
        raise ModelError("no trucks below the header", source=source,
                         fix="give one truck a row")
    cells = np.array(rows, dtype=str)
    try:
        empty = cells == ""
        table = np.where(empty, "0", cells).astype(float)
    except ValueError:  # cells with spaces only, or text: the slow path finds which
        cells = np.char.strip(cells)
        empty = cells == ""
        for i, row in enumerate(np.where(empty, "0", cells).tolist()):
            for j, cell in enumerate(row):
                try:
                    float(cell)
                except ValueError:
                    raise ModelError(f"{cell!r} is not a number", source=source,
                                     item=f"row {lines[i]}, column {header[j].strip()!r}",
                                     fix="write a plain number or leave the cell empty"
                                     ) from None
        table = np.where(empty, "0", cells).astype(float)
    bad = ~np.isfinite(table)
    if np.any(bad):
        i, j = np.argwhere(bad)[0]
        raise ModelError(f"{rows[i][j].strip()!r} is not a finite number", source=source,
                         item=f"row {lines[i]}, column {header[j].strip()!r}",
                         fix="write a plain number")
    huge = np.abs(table) > MAX_MAGNITUDE
    if np.any(huge):
        i, j = np.argwhere(huge)[0]
        raise ModelError(f"{rows[i][j].strip()!r} is out of range", source=source,
                         item=f"row {lines[i]}, column {header[j].strip()!r}",
                         fix=f"give a number of at most {MAX_MAGNITUDE:g} in magnitude")
    table[empty] = np.nan
    return table


def _trucks(table: np.ndarray, lines: list[int], columns: _Columns, header: list[str],
            source: str) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """(loads, gaps, frequencies), missing axles and gaps as 0, rows checked."""

    def fail(mask: np.ndarray, column: int, problem: str, fix: str) -> None:
        if np.any(mask):
            i = int(np.argmax(mask))
            raise ModelError(problem, source=source,
                             item=f"row {lines[i]}, column {header[column].strip()!r}", fix=fix)

    loads = np.nan_to_num(table[:, list(columns.axles)], nan=0.0)
    gaps = np.nan_to_num(table[:, list(columns.spacings)], nan=0.0)
    frequency = table[:, columns.frequency_column]
    for k, column in enumerate(columns.axles):
        fail(loads[:, k] < 0, column, "negative axle load", "give axle loads as positive")
    fail(np.all(loads <= 0, axis=1), columns.axles[0], "a row without axles",
         "give the front axle's load in axle_1, or delete the row")
    for k, column in enumerate(columns.axles[1:], start=1):
        fail((loads[:, k] > 0) & (loads[:, k - 1] <= 0), column,
             f"axle_{k + 1} given after an empty axle_{k}", "fill the axles front first")
        fail((loads[:, k] > 0) & (gaps[:, k - 1] <= 0), columns.spacings[k - 1],
             f"axle_{k + 1} without a positive spacing_{k}", f"give spacing_{k}")
        fail((loads[:, k] <= 0) & (gaps[:, k - 1] != 0), columns.spacings[k - 1],
             f"spacing_{k} given but there is no axle_{k + 1}",
             f"leave spacing_{k} empty or give axle_{k + 1}")
    fail(np.isnan(frequency), columns.frequency_column, f"no {columns.frequency}",
         f"give the {columns.frequency}")
    fail(frequency < 0, columns.frequency_column, f"negative {columns.frequency}",
         f"give a {columns.frequency} of at least 0")
    return loads, gaps, frequency
