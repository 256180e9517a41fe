"""One exact piecewise polynomial: the carrier of influence lines, effect functions and stress
histories.

A :class:`Piecewise` holds increasing breakpoints ``breaks`` (n+1,) and coefficients ``coeffs``
(degree+1, n) in ascending powers of the local coordinate ``u = x - breaks[j]``. It is zero
outside its first and last breakpoints. Where neighbouring pieces disagree at a breakpoint the
function jumps and both one-sided limits exist: every query that can land on a jump takes a
``side``. Its extremes, roots, areas and integrals come from the piece polynomials, never from
sampling. It is a batch of one (:class:`piecewise.batch.Batch`), so the same arithmetic serves
one function and thousands.

scipy's ``PPoly`` is an export (:meth:`Piecewise.to_ppoly`) and an import
(:func:`Piecewise.from_ppoly`), not the carrier; scipy is imported only when one is asked for.

Example (the midspan moment line of a 10 m simple span, and a load on the section):
    >>> m = Piecewise(np.array([0.0, 5.0, 10.0]), np.array([[0.0, 2.5], [0.5, -0.5]]))
    >>> m.values([5.0, 7.5]).tolist(), m.extremes().largest
    ([2.5, 1.25], Extreme(value=2.5, at=5.0))
    >>> m.areas(), m.integral(0.0, 5.0)
    ((12.5, 0.0), 6.25)
"""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property
from typing import Any

import numpy as np

from piecewise.batch import Batch


@dataclass(frozen=True)
class Extreme:
    """An extreme value and the position [length] where it occurs."""

    value: float
    at: float


@dataclass(frozen=True)
class Extremes:
    largest: Extreme
    smallest: Extreme


class PiecewiseError(ValueError):
    """A piecewise polynomial that cannot be built: the message says what and how to fix it."""


@dataclass(frozen=True, eq=False)
class Piecewise:
    """A piecewise polynomial, zero outside its breakpoints.

    Attributes:
        breaks: increasing breakpoints [length], at least two.
        coeffs: (degree+1, pieces) ascending coefficients in the local coordinate.
    """

    breaks: np.ndarray
    coeffs: np.ndarray

    def __post_init__(self) -> None:
        breaks = np.asarray(self.breaks, dtype=float)
        coeffs = np.asarray(self.coeffs, dtype=float)
        if coeffs.ndim == 1:
            coeffs = coeffs[:, None]
        if breaks.ndim != 1 or breaks.size < 2 or coeffs.ndim != 2:
            raise PiecewiseError(f"breakpoints of shape {breaks.shape} and coefficients of "
                                 f"shape {coeffs.shape}: give n+1 breakpoints and "
                                 "(degree+1, n) coefficients")
        if coeffs.shape[1] != breaks.size - 1:
            raise PiecewiseError(f"{breaks.size} breakpoints for {coeffs.shape[1]} pieces: "
                                 "give one more breakpoint than pieces")
        if not (np.all(np.isfinite(breaks)) and np.all(np.isfinite(coeffs))):
            raise PiecewiseError("breakpoints or coefficients hold inf or nan: give finite "
                                 "values")
        if np.any(np.diff(breaks) <= 0):
            raise PiecewiseError("breakpoints are not increasing: give them in increasing order")
        object.__setattr__(self, "breaks", breaks)
        object.__setattr__(self, "coeffs", coeffs)

    @staticmethod
    def trusted(breaks: np.ndarray, coeffs: np.ndarray) -> Piecewise:
        """A Piecewise from arrays already known to be valid (float, finite, increasing, of
        matching shapes): no checks, for code that builds many at once from checked pieces."""
        function = object.__new__(Piecewise)
        object.__setattr__(function, "breaks", breaks)
        object.__setattr__(function, "coeffs", coeffs)
        return function

    @cached_property
    def batch(self) -> Batch:
        """This function as a batch of one."""
        return Batch(self.breaks, self.coeffs, np.array([0, self.breaks.size]))

    @staticmethod
    def from_batch(batch: Batch, k: int = 0) -> Piecewise:
        """Function ``k`` of a batch (whose functions are valid by construction)."""
        breaks, coeffs = batch.function(k)
        return Piecewise.trusted(breaks, coeffs)

    @staticmethod
    def from_ppoly(ppoly: Any) -> Piecewise:
        """A scipy ``PPoly`` of one curve (descending powers) as a Piecewise; the PPoly's
        extrapolation beyond its breakpoints is dropped (a Piecewise is zero there)."""
        breaks = np.asarray(ppoly.x, dtype=float)
        coeffs = np.asarray(ppoly.c, dtype=float)
        if coeffs.ndim != 2:
            raise PiecewiseError(f"a PPoly with coefficients of shape {coeffs.shape}: give one "
                                 "curve, coefficients of shape (degree+1, pieces)")
        return Piecewise(breaks, coeffs[::-1].copy())

    def to_ppoly(self, extrapolate: bool = False) -> Any:
        """The same function as scipy's ``PPoly`` (highest power first); NaN outside the
        breakpoints unless ``extrapolate``."""
        from scipy.interpolate import PPoly

        return PPoly(self.coeffs[::-1].copy(), self.breaks.copy(), extrapolate=extrapolate)

    # ------------------------------------------------------------------ shape and size

    @property
    def degree(self) -> int:
        return int(self.coeffs.shape[0] - 1)

    @property
    def widths(self) -> np.ndarray:
        return np.diff(self.breaks)

    @property
    def start(self) -> float:
        return float(self.breaks[0])

    @property
    def end(self) -> float:
        return float(self.breaks[-1])

    @property
    def length(self) -> float:
        return self.end - self.start

    @property
    def scale(self) -> float:
        """The largest term of any piece: the size of the values."""
        return float(self.batch.scales[0])

    def cleaned(self) -> Piecewise:
        """Terms below the noise tolerance of the scale set to zero."""
        return Piecewise(self.breaks, self.batch.cleaned().coeffs)

    # ------------------------------------------------------------------ values

    def values(self, positions: np.ndarray | list[float] | float,
               side: str = "right") -> np.ndarray:
        """Values at ``positions`` [length]; at a jump ``side`` picks the left or right limit;
        zero outside the breakpoints. A position within the position tolerance of a breakpoint
        stands on it.

        Example (a step at 1: both limits, and a position a hair from the step):
            >>> step = Piecewise(np.array([0.0, 1.0, 2.0]), np.array([[0.0, 1.0]]))
            >>> step.values([1.0], side="left").tolist(), step.values([1.0 + 1e-13]).tolist()
            ([0.0], [1.0])
        """
        x = np.atleast_1d(np.asarray(positions, dtype=float))
        return self.batch.values(np.zeros(x.size, dtype=np.int64), x.ravel(), side).reshape(
            x.shape)

    def limits(self) -> tuple[np.ndarray, np.ndarray]:
        """Left and right limits at every breakpoint (zero beyond the ends)."""
        return self.batch.limits()

    def jumps(self) -> np.ndarray:
        """Positions where the function jumps [length]."""
        return self.batch.jumps()[0]

    # ------------------------------------------------------------------ calculus

    def derivative(self) -> Piecewise:
        from piecewise.polynomial import derivative

        return Piecewise(self.breaks, derivative(self.coeffs))

    def antiderivative(self) -> Piecewise:
        """The integral from the first breakpoint (continuous, one degree higher)."""
        return Piecewise.from_batch(self.batch.antiderivative()[0])

    def integral(self, start: float, end: float) -> float:
        """Exact area between two positions [value x length] (zero outside the breakpoints)."""
        lo = max(min(start, end), self.start)
        hi = min(max(start, end), self.end)
        if hi <= lo:
            return 0.0
        integral, total = self.batch.antiderivative()
        primitive = Piecewise.from_batch(integral)
        at_hi = total[0] if hi >= self.end else primitive.values([hi], side="left")[0]
        at_lo = primitive.values([lo], side="right")[0]
        return float(at_hi - at_lo)

    def areas(self) -> tuple[float, float]:
        """(positive area, negative area) [value x length], exact."""
        positive, negative = self.batch.areas()
        return float(positive[0]), float(negative[0])

    # ------------------------------------------------------------------ extremes and roots

    def extremes(self) -> Extremes:
        """Largest and smallest values (limits at jumps included) and where."""
        (high, high_at), (low, low_at) = self.batch.extremes()
        return Extremes(Extreme(float(high[0]), float(high_at[0])),
                        Extreme(float(low[0]), float(low_at[0])))

    def roots(self) -> np.ndarray:
        """Real roots strictly inside pieces [length], increasing."""
        return self.batch.roots()[1]

    def zero_crossings(self) -> np.ndarray:
        """Positions where the function changes sign [length]."""
        return self.batch.zero_crossings()[0]

    def split_at_zeros(self) -> Piecewise:
        """The same function with a breakpoint at every zero crossing inside a piece."""
        return Piecewise.from_batch(self.batch.split_at_zeros())
