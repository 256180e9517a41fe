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
from dataclasses import dataclass, replace
from functools import partial

from influence.analysis.lines import Analysis, InfluenceLine
from influence.analysis.responses import RESPONSE_KINDS, SIDES, Response
from influence.errors import LocationError
from vehicles.loadmodel import LoadModel
from vehicles.search.concurrent import Concurrent, concurrent
from vehicles.search.govern import Governing, govern
from vehicles.search.placement import Placement


@dataclass(frozen=True)
class CaseExtremes:
    """The largest and smallest effect of one case of one load model alone (values scaled as
    the result they belong to).

    Attributes:
        model, case: which.
        max, min: the governing placements of that case, None where it gives no effect of that
            sign or does not apply.
    """

    model: str
    case: str
    max: Placement | None
    min: Placement | None


@dataclass(frozen=True)
class GoverningResult:
    """The governing search at one section and what goes with it.

    Every value (placements, concurrent effects, the per-case summary) is one lane's effect
    times ``live_scale``.

    Attributes:
        line: the influence line searched.
        governing: max, min and the top lists.
        others: the influence lines of the concurrent responses.
        concurrent_max, concurrent_min: their values under the max and min placements.
        concurrent_top_max, concurrent_top_min: the same for every top placement.
        live_scale: what one lane's effect is multiplied by [-] (distribution x multiple
            presence; 1 for one lane).
        by_case: one row per load model and case: each case's own extremes, so that no model's
            result hides behind another's.
    """

    line: InfluenceLine
    governing: Governing
    others: tuple[InfluenceLine, ...]
    concurrent_max: tuple[Concurrent, ...]
    concurrent_min: tuple[Concurrent, ...]
    concurrent_top_max: tuple[tuple[Concurrent, ...], ...]
    concurrent_top_min: tuple[tuple[Concurrent, ...], ...]
    live_scale: float = 1.0
    by_case: tuple[CaseExtremes, ...] = ()


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
              top: int = 1, concurrent_with: Sequence[Response] = (),
              live_scale: float = 1.0) -> GoverningResult:
    """The governing search for one response, the concurrent effects of others, and each
    case's own extremes.

    Args:
        analysis: the factorised structure.
        response: what is searched.
        models: load models in the structure's units.
        top: distinct positions to list for each sense.
        concurrent_with: other responses under the same loads.
        live_scale: what one lane's effect is multiplied by [-] (a girder line's distribution
            times multiple presence factor); every value is multiplied.
    """
    line, *others = analysis.lines([response, *concurrent_with])
    search = partial(govern, line.function, kind=response.kind, interior=line.scope_interior,
                     section=line.section_chainage)
    result = scaled(search(list(models), top=top), live_scale)

    def along(placement: Placement | None) -> tuple[Concurrent, ...]:
        if placement is None:
            return ()
        # the loads a placement lists are one lane's: scale their effects as the value
        return tuple(_scaled_concurrent(concurrent(placement, other.function), live_scale)
                     for other in others)

    by_case = []
    for model in models:
        for case in model.cases:
            alone = scaled(search(replace(model, cases=(case,))), live_scale)
            by_case.append(CaseExtremes(model.name, case.name, alone.max, alone.min))
    return GoverningResult(
        line=line,
        governing=result,
        others=tuple(others),
        concurrent_max=along(result.max),
        concurrent_min=along(result.min),
        concurrent_top_max=tuple(along(p) for p in result.top_max),
        concurrent_top_min=tuple(along(p) for p in result.top_min),
        live_scale=live_scale,
        by_case=tuple(by_case),
    )


def scaled(result: Governing, scale: float) -> Governing:
    """A governing result with every placement's value multiplied by ``scale`` [-]."""
    if scale == 1.0:
        return result

    def one(placement: Placement | None) -> Placement | None:
        return None if placement is None else replace(placement, value=placement.value * scale)

    return replace(result, max=one(result.max), min=one(result.min),
                   top_max=tuple(replace(p, value=p.value * scale) for p in result.top_max),
                   top_min=tuple(replace(p, value=p.value * scale) for p in result.top_min))


def _scaled_concurrent(found: Concurrent, scale: float) -> Concurrent:
    return replace(found, left=found.left * scale, right=found.right * scale,
                   value=found.value * scale)
