"""The design checks a fatigue life stands for, written out as the standards state them.

- AASHTO LRFD 6.6.1.2.2 and 6.6.1.2.5: Fatigue I (infinite life), gamma_I (1 + IM) (delta f)max
  <= (delta F)TH; Fatigue II (finite life), gamma_II (1 + IM) (delta f)eff <= (delta F)n =
  (A / N)^(1/3) with N the cycles of the design life. With (delta f)eff the root-mean-cube of the
  counted ranges and N their number, Fatigue II is exactly the Miner sum over the design life at
  most 1 (the slope-3 line extended below the threshold).
- EN 1993-1-9 8(2) with Annex A: the fatigue limit, gamma_Ff delta sigma_max <=
  delta sigma_D / gamma_Mf, and the equivalent range gamma_Ff delta sigma_E,2 <=
  delta sigma_C / gamma_Mf, the same as the design-life damage at most 1 (from memory,
  unconfirmed clause numbers).

Ranges are in the life's stress unit.

Example:
    >>> from influence.fatigue.aashto import aashto_resistance
    >>> from influence.fatigue.damage import assess_spectrum
    >>> resistance = aashto_resistance("C", year=2020)
    >>> life = assess_spectrum([6.0], [365 * 1000.0], resistance, design_life_years=75.0)
    >>> checks = fatigue_checks(life, resistance)  # 0.92 x 6 against (44e8 / N)^(1/3)
    >>> round(checks.finite_range, 3), round(checks.finite_resistance, 3)
    (5.52, 5.437)
    >>> checks.infinite_life, checks.finite_life
    (False, False)
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from influence.fatigue.damage import FatigueLife
from influence.fatigue.sn_curve import Resistance


@dataclass(frozen=True)
class FatigueChecks:
    """Both checks of a detail, factored ranges against resistances [stress unit].

    Attributes:
        infinite_range: the largest range times the infinite-life factor.
        infinite_limit: the constant-amplitude limit ((delta F)TH; delta sigma_D / gamma_Mf).
        finite_range: the equivalent range times the damage factor.
        finite_resistance: (A / N)^(1/3) at the design life's cycles (AASHTO), or
            delta sigma_C / gamma_Mf (EN).
        design_life_cycles: cycles in the design life (all counted ranges).
        clause: the clauses, in words.
    """

    infinite_range: float
    infinite_limit: float
    finite_range: float
    finite_resistance: float
    design_life_cycles: float
    clause: str

    @property
    def infinite_life(self) -> bool:
        """The infinite-life check holds."""
        return self.infinite_range <= self.infinite_limit

    @property
    def finite_life(self) -> bool:
        """The finite-life check holds."""
        return self.finite_range <= self.finite_resistance


def fatigue_checks(life: FatigueLife, resistance: Resistance) -> FatigueChecks:
    """The infinite- and finite-life checks behind a life (see the module note)."""
    curve = resistance.curve
    cycles = float(np.sum(life.cycles_per_year)) * life.design_life_years
    infinite = resistance.limit_factor * life.governing_range
    finite = resistance.damage_factor * life.equivalent_range
    if curve.equivalent_cycles is None:
        constant = curve.reference_cycles * curve.reference_range ** curve.slope
        strength = (constant / cycles) ** (1 / curve.slope) if cycles > 0 else float("inf")
        clause = ("AASHTO LRFD 6.6.1.2.2: Fatigue I gamma (delta f)max <= (delta F)TH; "
                  "Fatigue II gamma (delta f)eff <= (A/N)^(1/3), Eq. 6.6.1.2.5-2")
    else:
        strength = curve.reference_range
        clause = ("EN 1993-1-9 8 and Annex A: gamma_Ff delta sigma_max <= delta sigma_D / "
                  "gamma_Mf; gamma_Ff delta sigma_E,2 <= delta sigma_C / gamma_Mf")
    return FatigueChecks(infinite, curve.fatigue_limit, finite, strength, cycles, clause)
