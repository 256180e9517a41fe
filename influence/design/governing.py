"""Governing positions at one section: the exact largest and smallest effects of load models,
the top distinct positions, and the effects of other responses concurrent with them.

Example (one 100 kN axle on a 10 m simple span: the largest midspan moment is PL/4 = 250 kN m,
and the reaction concurrent with it is P/2):
    >>> from influence.model.beamform import simple_beam
    >>> from influence.analysis.lines import analyse_model
    >>> from vehicles.loadmodel import LoadCase, LoadModel
    >>> from vehicles.train import Axle, Train
    >>> axle = LoadModel("P", "one axle", "kN-m", (LoadCase("axle", Train("P", (Axle(100.0),))),))
    >>> result = governing(analyse_model(simple_beam(10.0)), Response("moment", "5"), [axle],
    ...                    concurrent_with=[Response("reaction", "S1")])
    >>> round(result.governing.max.value, 9), round(result.concurrent_max[0].value, 9)
    (250.0, 50.0)
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

from influence.analysis.lines import Analysis, InfluenceLine
from influence.analysis.responses import RESPONSE_KINDS, SIDES, Response
from influence.errors import LocationError
from vehicles.loadmodel import LoadModel
from vehicles.search.concurrent import Concurrent, concurrent
from vehicles.search.govern import Governing, govern
from vehicles.search.placement import Placement


@dataclass(frozen=True)
class GoverningResult:
    """The governing search at one section and what goes with it.

    Attributes:
        line: the influence line searched.
        governing: max, min and the top lists.
        others: the influence lines of the concurrent responses.
        concurrent_max, concurrent_min: their values under the max and min placements.
        concurrent_top_max, concurrent_top_min: the same for every top placement.
    """

    line: InfluenceLine
    governing: Governing
    others: tuple[InfluenceLine, ...]
    concurrent_max: tuple[Concurrent, ...]
    concurrent_min: tuple[Concurrent, ...]
    concurrent_top_max: tuple[tuple[Concurrent, ...], ...]
    concurrent_top_min: tuple[tuple[Concurrent, ...], ...]


def parse_concurrent(text: str) -> Response:
    """A concurrent response written RESPONSE@LOCATION[:left|right], such as shear@P1:left or
    moment@C1@2.0."""
    kind, _, location = text.partition("@")
    if kind not in RESPONSE_KINDS or not location:
        raise LocationError(
            f"{text!r} is not RESPONSE@LOCATION", item="--concurrent",
            fix="write it like shear@P1, reaction@A1 or moment@C1@2.0 (add :left for a side)",
        )
    side = "right"
    head, _, tail = location.rpartition(":")
    if head and tail in SIDES:
        location, side = head, tail
    return Response(kind, location, side)


def governing(analysis: Analysis, response: Response, models: Sequence[LoadModel], *,
              top: int = 1, concurrent_with: Sequence[Response] = ()) -> GoverningResult:
    """The governing search for one response and the concurrent effects of others."""
    line, *others = analysis.lines([response, *concurrent_with])
    result = govern(line.function, list(models), kind=response.kind,
                    interior=line.scope_interior, section=line.section_chainage, top=top)

    def along(placement: Placement | None) -> tuple[Concurrent, ...]:
        if placement is None:
            return ()
        return tuple(concurrent(placement, other.function) for other in others)

    return GoverningResult(
        line=line,
        governing=result,
        others=tuple(others),
        concurrent_max=along(result.max),
        concurrent_min=along(result.min),
        concurrent_top_max=tuple(along(p) for p in result.top_max),
        concurrent_top_min=tuple(along(p) for p in result.top_min),
    )
