"""Palmgren-Miner damage of a stress-range spectrum, life, and the infinite-life verdict.

Damage: D = sum n_i / N_i, N_i the endurance at the factored range (EN 1993-1-9 Annex A; AASHTO
LRFD 6.6.1.2.5 in the Miner form of its Fatigue II check). Infinite life: the largest range, times
the limit factor, at most the constant-amplitude limit ((delta F)TH for AASHTO, Fatigue I;
delta sigma_D / gamma_Mf for EN). A spectrum that passes it does no damage: AASHTO states it as the
Fatigue I check (6.6.1.2.2); for EN the slope-5 branch describes ranges below delta sigma_D only
when larger ranges are present, so a spectrum wholly below it is taken as undamaging (common
practice). A spectrum that fails it counts every range on the curve: AASHTO's single slope 3 is
extended below the threshold, EN's ranges at or below delta sigma_L / gamma_Mf do no damage.

Equivalent constant-amplitude range, unfactored:
- one-slope curve (AASHTO): the root-mean-cube of the ranges, (sum n S^3 / sum n)^(1/3), at the
  spectrum's own number of cycles (the effective range (delta f)eff of AASHTO LRFD C6.6.1.2.5 and
  the MBE, from memory, unconfirmed);
- two-slope curve (EN): delta sigma_E,2, the range that applied 2e6 times does the damage of the
  design life on the same design curve: delta sigma_E,2 = delta sigma_C / (gamma_Mf x factor) x
  D_life^(1/3), so gamma_Ff delta sigma_E,2 <= delta sigma_C / gamma_Mf is the same check as
  D_life <= 1 (as EN 1993-2 9.4.1 uses it, from memory, unconfirmed).

Stress ranges are in the resistance's stress unit; cycles are per year.

Example:
    >>> from influence.fatigue.eurocode import en_resistance
    >>> life = assess_spectrum([100.0, 40.0], [1e4, 1e5], en_resistance("71", gamma_Mf=1.0),
    ...                        design_life_years=100.0)
    >>> round(life.damage_per_year, 6), round(life.life_years, 1), life.infinite_life
    (0.019197, 52.1, False)
    >>> assess_spectrum([30.0], [1e6], en_resistance("71", 1.0), 100.0).life_years
    inf
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from influence.errors import InfluenceError
from influence.fatigue.sn_curve import Resistance, SNCurve

SAME_RANGE = 1e-9
"""Ranges closer than this fraction [-] of the largest range are one range (rounding)."""

ROOT_MEAN_CUBE = "root-mean-cube of the counted ranges at their own number of cycles"
AT_REFERENCE = ("range applied {cycles:.0e} times doing the design-life damage on the same "
                "design curve")


@dataclass(frozen=True, eq=False)
class FatigueLife:
    """The verdict on one detail under a spectrum.

    Attributes:
        stress_unit: unit of every range here ("ksi" or "MPa").
        ranges: distinct unfactored stress ranges, largest first (read-only) [stress unit].
        cycles_per_year: cycles of each range a year (read-only).
        damage_per_year: Miner sum of one year (0 with infinite life).
        life_years: 1 / damage_per_year [years] (inf without damage).
        age_years: age of the detail at the assessment [years].
        remaining_years: life less age, not below 0 [years].
        design_life_years: design life [years].
        equivalent_range: unfactored equivalent constant-amplitude range [stress unit].
        equivalent_definition: how the equivalent range is defined, in words.
        infinite_life: the largest factored range is within the constant-amplitude limit.
        governing_range: the largest unfactored range [stress unit].
        limit_range: the largest unfactored range allowed for infinite life [stress unit].
        basis: standard, category, factors, in words.
    """

    stress_unit: str
    ranges: np.ndarray
    cycles_per_year: np.ndarray
    damage_per_year: float
    life_years: float
    age_years: float
    remaining_years: float
    design_life_years: float
    equivalent_range: float
    equivalent_definition: str
    infinite_life: bool
    governing_range: float
    limit_range: float
    basis: str

    @property
    def design_life_damage(self) -> float:
        """Miner sum over the design life."""
        return self.damage_per_year * self.design_life_years

    def pairs(self) -> list[list[float]]:
        """[range, cycles per year] pairs, largest range first, for tables and JSON."""
        return [[r, n] for r, n in zip(self.ranges.tolist(), self.cycles_per_year.tolist(),
                                       strict=True)]


def miner_sum(ranges: np.ndarray | Sequence[float], cycles: np.ndarray | Sequence[float],
              curve: SNCurve) -> float:
    """sum n_i / N_i of factored ranges on a design curve (ranges below the cut-off add 0).

    Args:
        ranges: factored stress ranges [curve's stress unit].
        cycles: number of cycles of each range.

    Example:
        >>> from influence.fatigue.aashto import aashto_curve
        >>> miner_sum([10.0, 5.0], [1e6, 8e6], aashto_curve("C"))  # 1e6 x 1e3/44e8 + ...
        0.45454545454545453
        >>> miner_sum([], [], aashto_curve("C"))
        0.0
    """
    size = np.asarray(ranges, dtype=float)
    count = np.asarray(cycles, dtype=float)
    return float(np.sum(count / curve.endurance(size)))


def assess_spectrum(ranges: np.ndarray | Sequence[float],
                    cycles_per_year: np.ndarray | Sequence[float], resistance: Resistance,
                    design_life_years: float, age_years: float = 0.0) -> FatigueLife:
    """Damage a year, life, remaining life, equivalent range and infinite-life verdict.

    Args:
        ranges: unfactored stress ranges [resistance's stress unit], at least 0.
        cycles_per_year: cycles of each range a year, at least 0.
        resistance: the detail's curve and factors.
        design_life_years: design life [years], positive.
        age_years: age of the detail now [years], at least 0.

    Raises:
        InfluenceError: for mismatched, negative or non-finite inputs.
    """
    size, count = _checked(ranges, cycles_per_year, design_life_years, age_years)
    used = (count > 0) & (size > 0)
    distinct, where = np.unique(size[used], return_inverse=True)
    if distinct.size:
        # ranges that differ by rounding alone (the same cycle counted through different
        # sums) are one range: the largest of them stands for all
        fresh = np.ones(distinct.size, dtype=bool)
        fresh[1:] = np.diff(distinct) > SAME_RANGE * distinct[-1]
        last = np.flatnonzero(np.append(fresh[1:], True))
        where = (np.cumsum(fresh) - 1)[where]
        distinct = distinct[last]
    totals = np.bincount(where, weights=count[used], minlength=distinct.size)
    distinct, totals = distinct[::-1].copy(), totals[::-1].copy()
    curve = resistance.curve
    governing = float(distinct[0]) if distinct.size else 0.0
    infinite = governing * resistance.limit_factor <= curve.fatigue_limit
    raw = miner_sum(distinct * resistance.damage_factor, totals, curve)
    damage = 0.0 if infinite else raw
    life = 1.0 / damage if damage > 0 else math.inf
    equivalent, definition = _equivalent(distinct, totals, raw * design_life_years, resistance)
    for array in (distinct, totals):
        array.setflags(write=False)
    return FatigueLife(curve.stress_unit, distinct, totals, damage, life, float(age_years),
                       max(life - age_years, 0.0), float(design_life_years), equivalent,
                       definition, bool(infinite), governing, resistance.limit_range,
                       f"{resistance.basis}; category {curve.category}")


def _equivalent(ranges: np.ndarray, cycles: np.ndarray, life_damage: float,
                resistance: Resistance) -> tuple[float, str]:
    curve = resistance.curve
    if curve.equivalent_cycles is None:
        total = float(np.sum(cycles))
        mean = float(np.sum(cycles * ranges**curve.slope)) / total if total > 0 else 0.0
        return mean ** (1 / curve.slope), ROOT_MEAN_CUBE.replace(
            "cube", "cube" if curve.slope == 3 else f"power {curve.slope:g}")
    factored = curve.reference_range * (
        life_damage * curve.reference_cycles / curve.equivalent_cycles) ** (1 / curve.slope)
    return factored / resistance.damage_factor, AT_REFERENCE.format(
        cycles=curve.equivalent_cycles)


def _checked(ranges: np.ndarray | Sequence[float], cycles: np.ndarray | Sequence[float],
             design_life_years: float, age_years: float) -> tuple[np.ndarray, np.ndarray]:
    size = np.asarray(ranges, dtype=float).ravel()
    count = np.asarray(cycles, dtype=float).ravel()
    if size.shape != count.shape:
        raise InfluenceError(f"{size.size} ranges but {count.size} cycle numbers",
                             item="spectrum", fix="give one number of cycles per range")
    for name, values in (("stress range", size), ("cycles per year", count)):
        bad = ~np.isfinite(values) | (values < 0)
        if np.any(bad):
            raise InfluenceError(f"{name} {values[bad][0]} is negative or not finite",
                                 item="spectrum", fix=f"give finite {name}s of at least 0")
    if not (math.isfinite(design_life_years) and design_life_years > 0):
        raise InfluenceError(f"design life {design_life_years} must be positive",
                             item="design life", fix="give the design life in years")
    if not (math.isfinite(age_years) and age_years >= 0):
        raise InfluenceError(f"age {age_years} must be at least 0", item="age",
                             fix="give the age in years")
    return size, count
