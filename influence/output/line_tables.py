"""Influence lines as tables and documents: exact ordinates at chosen or stepped positions.

Example:
    >>> from influence.model.beamform import simple_beam
    >>> from influence.analysis.lines import influence_line
    >>> from influence.analysis.responses import Response
    >>> line = influence_line(simple_beam(8.0), Response("shear", "2"))
    >>> positions(line, step=4.0).tolist()
    [0.0, 2.0, 2.0, 4.0, 8.0]
"""

from __future__ import annotations

from typing import Any

import numpy as np

from influence.analysis.lines import NOISE, InfluenceLine
from influence.model.limits import MAX_TABLE_ROWS, check_size, estimated_rows
from influence.output.conventions import header_lines, ordinate_unit
from influence.output.tables import Table
from vehicles.units import labels

DEFAULT_STEPS = 50
"""Tabulation points along the path when no step is given (plus every breakpoint)."""


def positions(line: InfluenceLine, step: float | None = None) -> np.ndarray:
    """Every breakpoint (twice where the line jumps, for its left and right limits) and a grid
    at ``step`` [length] (default: the path length / :data:`DEFAULT_STEPS`)."""
    step = step if step and step > 0 else line.length / DEFAULT_STEPS
    start, end = float(line.breakpoints[0]), float(line.breakpoints[-1])
    check_size(estimated_rows(end - start, step, 2 * line.breakpoints.size), MAX_TABLE_ROWS,
               "table rows", "step", fix=f"give a step of at least {line.length / 1e5:.3g}")
    grid = start + step * np.arange(int(np.floor((end - start) / step + 1e-9)) + 1)
    left, right = line.limits()
    jumps = line.breakpoints[np.abs(left - right) > NOISE * line.scale]
    jumps = jumps[(jumps > start) & (jumps < end)]
    points = np.unique(np.concatenate([grid, line.breakpoints, [end]]))
    return np.sort(np.concatenate([points, jumps]))


def ordinates(line: InfluenceLine, at: np.ndarray) -> np.ndarray:
    """Ordinates at positions as listed by :func:`positions`: where a chainage appears twice,
    the first gets the left limit and the second the right limit."""
    at = np.asarray(at, dtype=float)
    values = line.values(at, side="right")
    repeated = np.flatnonzero(np.diff(at) == 0)
    values[repeated] = line.values(at[repeated], side="left")
    return values


def line_document(line: InfluenceLine, title: str, at: np.ndarray) -> dict[str, Any]:
    """The JSON document of a line: response, units, ordinates, extremes, areas."""
    names = labels(line.units)
    extremes = line.extremes()
    positive, negative = line.areas()
    response = line.response
    return {
        "title": title,
        "response": response.kind,
        "component": response.component or None,
        "location": response.location,
        "side": response.side,
        "section_chainage": line.section_chainage,
        "units": {"force": names.force, "length": names.length, "moment": names.moment,
                  "ordinate": ordinate_unit(response.kind, line.units, response.component)},
        "positions": at,
        "ordinates": ordinates(line, at),
        "breakpoints": line.breakpoints,
        "pieces": [{"from": float(a), "to": float(b), "coefficients": row}
                   for a, b, row in zip(line.breakpoints, line.breakpoints[1:],
                                        line.coefficients, strict=False)],
        "extremes": {"max": {"value": extremes.largest.value, "at": extremes.largest.at},
                     "min": {"value": extremes.smallest.value, "at": extremes.smallest.at}},
        "areas": {"positive": positive, "negative": negative},
        "zero_crossings": line.zero_crossings(),
        "conventions": header_lines(title, line.units)[1:],
    }


def line_table(line: InfluenceLine, title: str, at: np.ndarray) -> Table:
    """The line as a table with a header of conventions, extremes and areas."""
    names = labels(line.units)
    unit = ordinate_unit(line.response.kind, line.units, line.response.component)
    extremes = line.extremes()
    positive, negative = line.areas()
    header = header_lines(f"{title}: influence line of {line.response.label}", line.units)
    header += [
        f"Largest ordinate {extremes.largest.value:.6g} {unit} at {extremes.largest.at:.6g} "
        f"{names.length}; smallest {extremes.smallest.value:.6g} {unit} at "
        f"{extremes.smallest.at:.6g} {names.length}.",
        f"Areas: positive {positive:.6g}, negative {negative:.6g} [{unit}*{names.length}].",
    ]
    crossings = line.zero_crossings()
    if crossings.size:
        header.append("Zero crossings at " + ", ".join(f"{c:.6g}" for c in crossings)
                      + f" {names.length}.")
    rows = [(float(x), float(v)) for x, v in zip(at, ordinates(line, at), strict=True)]
    return Table(header, (f"load chainage [{names.length}]", f"ordinate [{unit}]"), rows,
                 formats=("position", "number"))
