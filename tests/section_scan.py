"""Test helpers: one-model trains and the largest moment over many sections of a simple span."""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np

from tests.influence_forms import simple_moment
from vehicles.loadmodel import LoadCase, LoadModel
from vehicles.search.govern import govern
from vehicles.search.placement import Placement
from vehicles.train import Axle, Train


def axle_train(loads: Sequence[float], gaps: Sequence[float], name: str = "train") -> Train:
    """A train of point loads [force] with the given gaps between them [length]."""
    items = [Axle(loads[0])] + [Axle(p, g) for p, g in zip(loads[1:], gaps, strict=True)]
    return Train(name, tuple(items))


def one_case(train: Train | None = None, units: str = "kN-m", **case: float) -> LoadModel:
    """A load model with a single case (lane, factors... given as keywords)."""
    return LoadModel("test", "test model", units, (LoadCase("case", train, **case),))  # type: ignore[arg-type]


def largest_over_sections(L: float, model: LoadModel, sections: Sequence[float]) -> Placement:
    """The largest moment at any of ``sections`` of a simple span (exact search per section)."""
    best: Placement | None = None
    for c in sections:
        found = govern(simple_moment(L, float(c)), model, kind="moment", section=float(c)).max
        if found is not None and (best is None or found.value > best.value):
            best = found
    assert best is not None
    return best


def section_grid(L: float, count: int) -> np.ndarray:
    """Sections strictly inside the span, evenly spaced [length]."""
    return np.linspace(0.0, L, count + 2)[1:-1]
