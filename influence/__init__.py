"""Exact influence lines for girders, frames and trusses, built from singularity functions.

Example (a 10 m simple span: the midspan moment line peaks at L/4 under the section):
    >>> import influence
    >>> line = influence.influence_line(influence.simple_beam(10.0),
    ...                                 influence.Response("moment", "5"))
    >>> round(line.extremes().largest.value, 12), line.areas()[1]
    (2.5, 0.0)
"""

from influence.analysis.lines import Analysis, InfluenceLine, analyse_model, influence_line
from influence.analysis.responses import Response
from influence.errors import InfluenceError, LocationError, MechanismError, ModelError
from influence.model.beamform import continuous_beam, simple_beam
from influence.model.reader import read_model

__all__ = [
    "Analysis",
    "InfluenceError",
    "InfluenceLine",
    "LocationError",
    "MechanismError",
    "ModelError",
    "Response",
    "analyse_model",
    "continuous_beam",
    "influence_line",
    "read_model",
    "simple_beam",
]
