"""Exact piecewise polynomials: the one carrier of influence lines, effect functions and
histories, one function or many at once, with one table of tolerances.

Dependencies: numpy only (scipy for the optional PPoly export). Both ``influence`` and
``vehicles`` import this package; it imports neither.

Example:
    >>> import numpy as np, piecewise
    >>> moment = piecewise.Piecewise(np.array([0.0, 4.0, 10.0]),  # 10 m span, section at 4 m
    ...                              np.array([[0.0, 2.4], [0.6, -0.4]]))
    >>> moment.extremes().largest, [round(a, 12) for a in moment.areas()]
    (Extreme(value=2.4, at=4.0), [12.0, 0.0])
"""

from piecewise.batch import Batch
from piecewise.function import Extreme, Extremes, Piecewise, PiecewiseError
from piecewise.tolerances import NOISE, POSITION, VALUE

__all__ = [
    "NOISE",
    "POSITION",
    "VALUE",
    "Batch",
    "Extreme",
    "Extremes",
    "Piecewise",
    "PiecewiseError",
]
