"""The governing placements of load models on many influence lines at once.

:func:`govern_many` returns, line by line, exactly what :func:`vehicles.placement.govern`
returns (the same values, placements and ranged values, bit for bit), but does the work for a
whole batch of lines in a few numpy passes: lines of one response kind are laid end to end
(:mod:`vehicles.ragged`), the terms of each case and direction are built once for all of them
(:mod:`vehicles.batch_effects`), and only the effect functions that can govern a line are
described as placements. Exact: every piece of every effect function is examined, as for one
line; nothing is sampled.

Units as for :func:`vehicles.placement.govern`.

Example:
    >>> from scipy.interpolate import PPoly
    >>> from vehicles.loadmodel import LoadCase, LoadModel
    >>> from vehicles.placement import govern
    >>> from vehicles.train import Axle, Train
    >>> L = 20.0  # [ft]; moment lines of a simple span at its quarter point and midspan
    >>> lines = [PPoly([[1 - s / L, -s / L], [0.0, s * (1 - s / L)]], [0.0, s, L])
    ...          for s in (L / 4, L / 2)]
    >>> h20 = LoadModel("H20", "H20 truck", "kip-ft",
    ...                 (LoadCase("truck", Train("H20", (Axle(8.0), Axle(32.0, 14.0)))),))
    >>> found = govern_many(lines, h20, kinds=["moment", "moment"], sections=[L / 4, L / 2])
    >>> round(found[1].max.value, 6)  # the 32 kip axle over midspan [kip ft]
    160.0
    >>> found[0] == govern(lines[0], h20, kind="moment", section=L / 4)
    True
"""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np
from scipy.interpolate import PPoly

from vehicles.batch_effects import Effects, LineGroup, best_effects_many
from vehicles.effect import DIRECTIONS, PreparedInfluence, check_request
from vehicles.errors import VehicleError
from vehicles.extremes import Peak
from vehicles.loadmodel import LoadModel
from vehicles.placement import (
    Governing,
    Placement,
    chosen_peaks,
    placement_at,
    placements,
    ranked,
    visits,
)
from vehicles.preparation import prepare_many

CHUNK = 256
"""Lines handled together: bounds the memory of a batch (about 1 MB a line at most)."""


def govern_many(
    influences: Sequence[PPoly | PreparedInfluence],
    models: LoadModel | Sequence[LoadModel],
    *,
    kinds: Sequence[str],
    interiors: Sequence[bool] | None = None,
    sections: Sequence[float | None] | None = None,
    top: int = 1,
    directions: Sequence[str] = DIRECTIONS,
    gap_tolerance: float | None = None,
) -> list[Governing]:
    """:func:`vehicles.placement.govern` for every line, computed together.

    Args:
        influences: responses per unit downward load against path chainage [length].
        models: one load model or several; the worst case of all governs each line.
        kinds: each line's response kind.
        interiors: whether each line is a reaction at an interior support (default none is).
        sections: each line's section chainage [length] (to report the axle over it).
        top, directions, gap_tolerance: as for :func:`vehicles.placement.govern`.

    Returns:
        One :class:`~vehicles.placement.Governing` a line, in order.
    """
    if isinstance(models, LoadModel):
        models = (models,)
    count = len(influences)
    interiors = [False] * count if interiors is None else list(interiors)
    sections = [None] * count if sections is None else list(sections)
    if not len(kinds) == len(interiors) == len(sections) == count:
        raise VehicleError(
            f"{count} lines with {len(kinds)} kinds, {len(interiors)} interior flags and "
            f"{len(sections)} sections", item="govern_many", fix="give one of each a line")
    if top < 1:
        raise VehicleError(f"top = {top}", item="top", fix="ask for at least one placement")
    for kind in set(kinds):
        for direction in directions:
            check_request(kind, "max", direction)
    found: list[Governing | None] = [None] * count
    for start in range(0, count, CHUNK):
        chunk = range(start, min(start + CHUNK, count))
        prepared = dict(zip(chunk, prepare_many([influences[i] for i in chunk]), strict=True))
        groups: dict[tuple[str, bool, int], list[int]] = {}
        for i in chunk:
            degree = prepared[i].tables.shape[1]
            groups.setdefault((kinds[i], interiors[i], degree), []).append(i)
        for (kind, interior, _), members in groups.items():
            group = LineGroup(tuple(prepared[i] for i in members), kind)
            results = _govern_group(group, models, interior=interior, top=top,
                                    directions=directions, gap_tolerance=gap_tolerance,
                                    sections=[sections[i] for i in members])
            for i, result in zip(members, results, strict=True):
                found[i] = result
    return [g for g in found if g is not None]


def _govern_group(
    group: LineGroup,
    models: Sequence[LoadModel],
    *,
    interior: bool,
    top: int,
    directions: Sequence[str],
    gap_tolerance: float | None,
    sections: Sequence[float | None],
) -> list[Governing]:
    kind = group.kind
    # every (model, case, direction) in the order govern visits them
    visited: dict[str, list[tuple[str, Effects]]] = {"max": [], "min": []}
    for model, case, senses, direction in visits(models, kind, interior, directions):
        effects = best_effects_many(group, case, senses=senses, direction=direction,
                                    gap_tolerance=gap_tolerance)
        for sense, effect in effects.items():
            visited[sense].append((model.name, effect))
    highest = {sense: np.array([e.signed_highest() for _, e in visited[sense]]).reshape(
        len(visited[sense]), group.count) for sense in visited}
    results = []
    for k, prepared in enumerate(group.prepared):
        tops = {}
        for sense in ("max", "min"):
            if top == 1:
                tops[sense] = _winner(visited[sense], highest[sense][:, k], k, prepared,
                                      sense, sections[k])
            else:
                every = [p for model, e in visited[sense]
                         for p in placements(e.effect(k), prepared, model, section=sections[k],
                                             count=top)]
                tops[sense] = ranked(every, sense)[:top]
        results.append(Governing(kind, tops["max"][0] if tops["max"] else None,
                                 tops["min"][0] if tops["min"] else None,
                                 tuple(tops["max"]), tuple(tops["min"]), gap_tolerance))
    return results


def _winner(
    visited: list[tuple[str, Effects]],
    highest: np.ndarray,
    k: int,
    prepared: PreparedInfluence,
    sense: str,
    section: float | None,
) -> list[Placement]:
    """The one placement govern ranks first for line ``k``: the most adverse first peak of
    every effect function, the earliest visited on ties. A function's first peak is never
    above its highest skeleton value, so functions below the best peak found are skipped."""
    best: tuple[float, int, Peak] | None = None
    for index in np.argsort(-highest, kind="stable"):
        if best is not None and highest[index] < best[0]:
            break
        _, effects = visited[index]
        sk = effects.skeleton(k)
        signed = sk if sense == "max" else sk.negated()
        peak = chosen_peaks(signed, effects.breaks(k), 1)[0]
        if best is None or peak.value > best[0] or (peak.value == best[0] and index < best[1]):
            best = (peak.value, int(index), peak)
    if best is None:
        return []
    value, index, peak = best
    model, effects = visited[index]
    sign = 1.0 if sense == "max" else -1.0
    return [placement_at(effects.effect(k), prepared, model,
                         Peak(peak.position, sign * peak.value, peak.side), section=section)]
