"""Shared test helpers: build beam models and read ordinates in one call."""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np

from influence.analysis.lines import InfluenceLine, analyse_model
from influence.analysis.responses import Response
from influence.model.beamform import continuous_beam

RELATIVE = 1e-9
"""Agreement required of ordinates against outside references [-] (issue 2)."""


def beam_line(spans: Sequence[float], supports: Sequence[str], kind: str, location: str,
              EI: float | Sequence[object] = 1.0, side: str = "right", component: str = "",
              hinges: Sequence[float] = ()) -> InfluenceLine:
    model = continuous_beam(list(spans), EI, list(supports), hinges=list(hinges))
    return analyse_model(model).line(Response(kind, location, side, component))


def close(actual: np.ndarray | float, expected: np.ndarray | float, scale: float = 1.0) -> bool:
    """Agreement to RELATIVE of the larger of |expected| and a scale of the quantity."""
    actual, expected = np.asarray(actual, float), np.asarray(expected, float)
    bound = RELATIVE * np.maximum(np.abs(expected), scale)
    return bool(np.all(np.abs(actual - expected) <= bound))
