"""The cycles per truck passage of AASHTO LRFD Table 6.6.1.2.5-2 for a detail of a girder line.

The table's row follows from where the detail sits among the supports that hold the travel path
vertically: beyond the end supports, a cantilever girder; on a path with two supports, a
simple-span girder; otherwise a continuous girder, near an interior support when within 0.1 of
the span on either side of it; a structure of bars alone, a truss. The span is the one holding
the detail (the overhang for a cantilever). Hinges, and supports off the travel path, are not
looked at: a detail's own ``cycles_per_passage`` in the model file overrides this reading.

Example:
    >>> from influence.model.beamform import continuous_beam
    >>> from influence.model.path import trace
    >>> girder = continuous_beam([90.0, 90.0], 1.0, ["pinned", "roller", "roller"],
    ...                          units="kip-ft")
    >>> table_cycles(girder, trace(girder), 85.0)
    (1.5, 'AASHTO LRFD Table 6.6.1.2.5-2: continuous girder, span 90 ft, near an interior support')
    >>> table_cycles(girder, trace(girder), 45.0)[0], table_cycles(girder, trace(girder), None)
    (1.0, None)
"""

from __future__ import annotations

import numpy as np

from influence.fatigue import aashto
from influence.model.path import CHAINAGE_TOLERANCE, PathGeometry
from influence.model.structure import Model

LENGTH_UNIT = {"kip-ft": "ft", "kN-m": "m"}


def table_cycles(model: Model, path: PathGeometry,
                 chainage: float | None) -> tuple[float, str] | None:
    """(n, the row read) for a detail at ``chainage`` [length], or None where the table's row
    cannot be read from the model (a detail off the path, fewer than two supports on it)."""
    if chainage is None:
        return None
    unit = LENGTH_UNIT[model.units]
    clause = "AASHTO LRFD Table 6.6.1.2.5-2: "
    if all(member.is_bar for member in model.members):
        n = aashto.cycles_per_passage("truss", path.total_length, unit)
        return n, clause + "truss"
    supports = np.array(sorted(at for name, at in path.node_chainages.items()
                               if model.node(name).support.restraint("uy") != "free"))
    if supports.size < 2:
        return None
    tolerance = CHAINAGE_TOLERANCE * max(path.total_length, 1.0)
    if chainage < supports[0] - tolerance or chainage > supports[-1] + tolerance:
        overhang = supports[0] if chainage < supports[0] else path.total_length - supports[-1]
        n = aashto.cycles_per_passage("cantilever girder", overhang, unit)
        return n, clause + f"cantilever girder, overhang {overhang:g} {unit}"
    spans = np.diff(supports)
    index = int(np.clip(np.searchsorted(supports, chainage, side="right") - 1, 0, spans.size - 1))
    span = float(spans[index])
    if supports.size == 2:
        n = aashto.cycles_per_passage("simple-span girder", span, unit)
        return n, clause + f"simple-span girder, span {span:g} {unit}"
    near = False
    for k in range(1, supports.size - 1):
        before = aashto.near_support_distance(float(spans[k - 1]))
        after = aashto.near_support_distance(float(spans[k]))
        near |= supports[k] - before - tolerance <= chainage <= supports[k] + after + tolerance
    n = aashto.cycles_per_passage("continuous girder", span, unit, near_interior_support=near)
    where = ", near an interior support" if near else ""
    return n, clause + f"continuous girder, span {span:g} {unit}{where}"
