"""Where envelopes are taken: supports and hinges (both sides where shear jumps), the tenth points
of each span (common practice for girders) or a finer step, and named sections off the path.

A span is the stretch of path between two consecutive supported nodes (or a path end).

Example:
    >>> from influence.model.beamform import continuous_beam
    >>> from influence.model.path import trace
    >>> model = continuous_beam([10.0, 10.0], 1.0, ["pinned", "roller", "roller"])
    >>> [s.label for s in envelope_sections(model, trace(model), per_span=2)]
    ['S1', '5', 'S2 left', 'S2 right', '15', 'S3']
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from influence.model.limits import MAX_SECTIONS, check_size, estimated_sections
from influence.model.path import CHAINAGE_TOLERANCE, PathGeometry
from influence.model.structure import Model


@dataclass(frozen=True)
class Section:
    """One place an envelope is taken.

    Attributes:
        label: how tables name it ("P1 left", "36", "C1@2").
        location: the location as a Response takes it.
        side: "left" or "right".
        chainage: on the path [length], or None for a section off the path.
        span: number of the span it lies in (1, 2, ...), 0 off the path.
        support: the support node standing here, if any.
        reaction_only: a support off the path: only its reactions are enveloped there.
    """

    label: str
    location: str
    side: str
    chainage: float | None
    span: int
    support: str | None = None
    reaction_only: bool = False


@dataclass(frozen=True)
class Span:
    number: int
    start: float
    end: float
    start_node: str
    end_node: str

    @property
    def length(self) -> float:
        return self.end - self.start


def spans(model: Model, path: PathGeometry) -> list[Span]:
    """Stretches of path between supported nodes (and the path ends)."""
    marks = [(0.0, path.legs[0].entry_node)]
    for leg in path.legs:
        node = model.node(leg.exit_node)
        if node.support.is_support or leg is path.legs[-1]:
            marks.append((leg.end_chainage, leg.exit_node))
    return [Span(i + 1, a, b, na, nb)
            for i, ((a, na), (b, nb)) in enumerate(zip(marks, marks[1:], strict=False))]


def envelope_sections(model: Model, path: PathGeometry, *, per_span: int = 10,
                      step: float | None = None, extra: tuple[str, ...] = ()) -> list[Section]:
    """The sections of an envelope, in chainage order, then supports off the path (for their
    reactions) and the extra sections."""
    stretches = spans(model, path)
    check_size(estimated_sections(path.total_length, len(stretches), per_span, step),
               MAX_SECTIONS, "envelope sections", "step" if step else "per_span", model.source)
    tolerance = CHAINAGE_TOLERANCE * max(path.total_length, 1.0)
    special: dict[float, str] = {}  # chainage -> node name: supports and hinges on the path
    for node_name, at in path.node_chainages.items():
        node = model.node(node_name)
        if node.support.is_support or node_name in model.hinge_nodes or _is_release(
                model, node_name):
            special[at] = node_name
    found: list[Section] = []
    for span in stretches:
        count = max(int(np.ceil(span.length / step - 1e-9)), 1) if step else per_span
        points = span.start + span.length * np.arange(count + 1) / count
        points = np.unique(np.concatenate([points, [c for c in special
                                                    if span.start < c < span.end]]))
        for chainage in points:
            if found and found[-1].chainage is not None and abs(
                    found[-1].chainage - chainage) <= tolerance:
                continue
            name = next(
                (n for c, n in special.items() if abs(c - chainage) <= tolerance), None)
            interior = tolerance < chainage < path.total_length - tolerance
            location = name or f"{chainage:.10g}"
            if name is not None and interior:
                found.append(Section(f"{name} left", location, "left", float(chainage),
                                     span.number,
                                     name if model.node(name).support.is_support else None))
                is_support = model.node(name).support.is_support
                found.append(Section(f"{name} right", location, "right", float(chainage),
                                     span.number + 1 if is_support else span.number,
                                     name if is_support else None))
            else:
                support = name if name and model.node(name).support.is_support else None
                found.append(Section(name or f"{chainage:.6g}", location, "right",
                                     float(chainage), span.number, support))
    on_path = set(path.node_chainages)
    for node in model.nodes:
        if node.support.is_support and node.name not in on_path:
            found.append(Section(node.name, node.name, "right", None, 0, node.name,
                                 reaction_only=True))
    for location in extra:
        try:
            given: float | None = float(location)
        except ValueError:
            given = None
        number = next((s.number for s in stretches if given is not None
                       and s.start <= given <= s.end), 0)
        found.append(Section(location, location, "right", given, number))
    return found


def _is_release(model: Model, node: str) -> bool:
    return any((m.start == node and m.release_start) or (m.end == node and m.release_end)
               for m in model.members)
