"""S-N curves of the standards in design form, and the factors a check applies to stress ranges.

A curve is straight on log-log axes with up to two slopes: N = N_ref (S_ref / S)^m1 down to the
knee range, then N = N_knee (S_knee / S)^m2 down to the cut-off, below which a range does no
damage. The AASHTO LRFD curves have one slope (m1 = 3) and neither knee nor cut-off (both 0); the
EN 1993-1-9 curves have the knee at 5e6 cycles and the cut-off at 1e8. Ranges are in the curve's
stress unit ("ksi" or "MPa"); partial factors on resistance are already divided into the curve.

Example:
    >>> curve = SNCurve("EN", "71", "MPa", 71.0, 2e6, 3.0, 5.0, 52.3, 28.7, 52.3, 2e6)
    >>> float(curve.endurance(np.array([71.0]))[0])
    2000000.0
    >>> float(curve.endurance(np.array([20.0]))[0])  # below the cut-off: no damage
    inf
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from influence.errors import InfluenceError


@dataclass(frozen=True)
class SNCurve:
    """A design S-N curve.

    Attributes:
        standard: "AASHTO" or "EN".
        category: the detail category ("C'", "71", ...).
        stress_unit: "ksi" or "MPa".
        reference_range: S_ref [stress unit].
        reference_cycles: N_ref, the endurance at S_ref.
        slope: m1, above the knee.
        slope_below_knee: m2, between the knee and the cut-off.
        knee_range: S_knee [stress unit] (0: no knee).
        cutoff_range: ranges at or below it do no damage [stress unit] (0: no cut-off).
        fatigue_limit: the constant-amplitude limit of the infinite-life check [stress unit].
        equivalent_cycles: cycles at which the equivalent constant-amplitude range is stated
            (None: at the spectrum's own number of cycles, root-mean-power with slope m1).
    """

    standard: str
    category: str
    stress_unit: str
    reference_range: float
    reference_cycles: float
    slope: float
    slope_below_knee: float
    knee_range: float
    cutoff_range: float
    fatigue_limit: float
    equivalent_cycles: float | None

    def __post_init__(self) -> None:
        if not (self.reference_range > 0 and self.reference_cycles > 0 and self.slope > 0
                and self.slope_below_knee > 0 and self.knee_range >= self.cutoff_range >= 0
                and self.fatigue_limit > 0):
            raise InfluenceError(f"S-N curve {self.category!r} is not a falling curve: {self}",
                                 item=self.category, fix="check the data file of the standard")

    @property
    def knee_cycles(self) -> float:
        """Endurance at the knee (inf when there is no knee)."""
        if self.knee_range == 0:
            return float("inf")
        return self.reference_cycles * (self.reference_range / self.knee_range) ** self.slope

    def endurance(self, ranges: np.ndarray) -> np.ndarray:
        """Cycles to failure at each range (inf at or below the cut-off and for zero range).

        Args:
            ranges: factored stress ranges [stress unit], at least 0.
        """
        ranges = np.asarray(ranges, dtype=float)
        with np.errstate(divide="ignore"):
            cycles = self.reference_cycles * (self.reference_range / ranges) ** self.slope
            if self.knee_range > 0:
                below = self.knee_cycles * (self.knee_range / ranges) ** self.slope_below_knee
                cycles = np.where(ranges >= self.knee_range, cycles, below)
        return np.where((ranges > self.cutoff_range) & (ranges > 0), cycles, np.inf)


@dataclass(frozen=True)
class Resistance:
    """A curve with the factors a check applies to the unfactored stress ranges.

    Attributes:
        curve: the design curve.
        damage_factor: multiplies every range of the Miner sum (AASHTO: Fatigue II load factor
            times 1 + IM; EN: gamma_Ff times 1 + dynamic allowance).
        limit_factor: multiplies the largest range of the infinite-life check (AASHTO: Fatigue I
            load factor times 1 + IM; EN: as damage_factor).
        basis: the factors and clauses, in words, for reports.
    """

    curve: SNCurve
    damage_factor: float
    limit_factor: float
    basis: str

    def __post_init__(self) -> None:
        if not (self.damage_factor > 0 and self.limit_factor > 0):
            raise InfluenceError(
                f"factors must be positive, got {self.damage_factor} and {self.limit_factor}",
                item=self.curve.category, fix="give positive load and partial factors")

    @property
    def limit_range(self) -> float:
        """The largest unfactored range that still gives infinite life [stress unit]."""
        return self.curve.fatigue_limit / self.limit_factor
