"""Test helper: a train of axles as the lists a standard's table prints."""

from __future__ import annotations

from vehicles.train import Axle, Span, Train


def loads_and_gaps(train: Train) -> tuple[list[float], list[Span]]:
    """Axle loads front to rear [force] and the gap of each axle to the one ahead [length]."""
    axles = [item for item in train.items if isinstance(item, Axle)]
    assert len(axles) == len(train.items), "a train of axles only"
    return [axle.load for axle in axles], [axle.gap for axle in axles[1:]]
