"""Dead-load effects, exact from the influence lines: a uniform load q over a stretch gives q times
the area of the line there; a point load P gives P times the ordinate.

Example (a uniform load w on a simple span: wL^2/8 at midspan, wL/2 at each end; textbook):
    >>> from influence.model.beamform import simple_beam
    >>> from influence.analysis.lines import analyse_model
    >>> from influence.analysis.responses import Response
    >>> analysis = analyse_model(simple_beam(10.0))
    >>> deck = DeadLoad("deck", "DC", uniform=2.0)
    >>> round(dead_load_effect(analysis.line(Response("moment", "5")), deck, analysis.path), 9)
    25.0
"""

from __future__ import annotations

from influence.analysis.lines import InfluenceLine
from influence.model.basis import DeadLoad
from influence.model.path import PathGeometry


def loaded_stretches(load: DeadLoad, path: PathGeometry) -> list[tuple[float, float]]:
    """Chainage stretches [length] a uniform dead load covers."""
    if load.members:
        stretches = [(leg.start_chainage, leg.end_chainage) for leg in path.legs
                     if leg.member in load.members]
    else:
        stretches = [(0.0, path.total_length)]
    lo = load.start if load.start is not None else float("-inf")
    hi = load.end if load.end is not None else float("inf")
    clipped = [(max(a, lo), min(b, hi)) for a, b in stretches]
    return [(a, b) for a, b in clipped if b > a]


def dead_load_effect(line: InfluenceLine, load: DeadLoad, path: PathGeometry) -> float:
    """The effect of one dead load on the line's response [response unit x force]."""
    if load.point:
        assert load.at is not None
        # a point exactly on the section: the left side of a cut sees it as a load to its right
        side = "right" if line.response.side == "left" else "left"
        return load.point * float(line.values([load.at], side=side)[0])
    return load.uniform * sum(line.integral(a, b) for a, b in loaded_stretches(load, path))


def dead_load_effects(line: InfluenceLine, loads: tuple[DeadLoad, ...],
                      path: PathGeometry) -> dict[str, float]:
    """Effects summed by load name (DC, DW, ...)."""
    totals: dict[str, float] = {}
    for load in loads:
        totals[load.load] = totals.get(load.load, 0.0) + dead_load_effect(line, load, path)
    return totals
