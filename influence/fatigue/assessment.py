"""From the stress histories of vehicle crossings to a detail's fatigue life.

Each crossing (one vehicle, or one spectrum row) gives a history at the detail; it passes a number
of times a year. Its cycles are rainflow-counted (ASTM E1049-85 5.4.4, half cycles, in batches),
or, where the detail says so, taken as n cycles of the crossing's full range (max - min) a passage
(the AASHTO fatigue-truck rule, LRFD Table 6.6.1.2.5-2). The cycles a year of all crossings make
the spectrum of :func:`influence.fatigue.damage.assess_spectrum`.

Counting does not depend on the size of a history (its noise gate is relative), so details that
see the same effect at the same place count once: :func:`assess_counted` takes counted effect
histories and a stress per unit effect, and :func:`assess_detail` does so with a detail and the
[fatigue] settings of a model file.

Example:
    >>> from influence.fatigue.aashto import aashto_resistance
    >>> trucks = Histories.of([[0.0, 6.0, -1.0, 5.0, 0.0], [0.0, 3.0, 0.0]])  # [ksi]
    >>> life = assess_histories(trucks, [200.0 * 365, 800.0 * 365],
    ...                         aashto_resistance("E", year=2020), design_life_years=75.0)
    >>> life.pairs()
    [[7.0, 36500.0], [6.0, 73000.0], [5.0, 36500.0], [3.0, 292000.0]]
    >>> life.infinite_life, round(life.life_years, 1)
    (False, 34.7)
"""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np

from influence.errors import InfluenceError
from influence.fatigue.batch_counting import CycleBatch, count_many
from influence.fatigue.damage import FatigueLife, assess_spectrum
from influence.fatigue.histories import Histories
from influence.fatigue.settings import FatigueDetail, FatigueSettings, detail_resistance
from influence.fatigue.sn_curve import Resistance


def assess_histories(histories: Histories, passages_per_year: np.ndarray | Sequence[float],
                     resistance: Resistance, design_life_years: float, age_years: float = 0.0,
                     cycles_per_passage: float | None = None) -> FatigueLife:
    """A detail's life under crossings given by their stress histories.

    Args:
        histories: one stress history (turning points) a crossing [resistance's stress unit].
        passages_per_year: passages of each crossing a year.
        resistance: curve and factors of the detail.
        design_life_years: [years].
        age_years: age of the detail now [years].
        cycles_per_passage: n cycles of the full range a passage instead of rainflow counts.
    """
    return assess_counted(count_many(histories), passages_per_year, resistance,
                          design_life_years, age_years, cycles_per_passage)


def assess_counted(cycles: CycleBatch, passages_per_year: np.ndarray | Sequence[float],
                   resistance: Resistance, design_life_years: float, age_years: float = 0.0,
                   cycles_per_passage: float | None = None,
                   stress_per_effect: float = 1.0) -> FatigueLife:
    """A detail's life from counted crossings (see :func:`assess_histories`).

    Args:
        cycles: the crossings' counted histories, one row a crossing [effect or stress unit].
        stress_per_effect: stress per unit of the counted histories [stress unit per effect
            unit]; 1 when they are stresses already.

    Raises:
        InfluenceError: for a passages count per crossing that does not fit, or a bad factor.
    """
    passages = np.asarray(passages_per_year, dtype=float).ravel()
    if passages.size != cycles.counts.shape[0]:
        raise InfluenceError(f"{passages.size} passage numbers for {cycles.counts.shape[0]} "
                             "crossings", item="passages", fix="give one number a crossing")
    if not (np.isfinite(stress_per_effect) and stress_per_effect != 0):
        raise InfluenceError(f"stress per unit effect {stress_per_effect}", item="detail",
                             fix="give a finite, non-zero section property")
    scale = abs(stress_per_effect)
    if cycles_per_passage is not None:
        if not cycles_per_passage > 0:
            raise InfluenceError(f"cycles per passage {cycles_per_passage}", item="detail",
                                 fix="give a positive number of cycles")
        counted = np.where(cycles.counts > 0, cycles.ranges, 0.0)
        full = counted.max(axis=1, initial=0.0)
        return assess_spectrum(full * scale, passages * cycles_per_passage, resistance,
                               design_life_years, age_years)
    return assess_spectrum(cycles.ranges.ravel() * scale,
                           (cycles.counts * passages[:, None]).ravel(), resistance,
                           design_life_years, age_years)


def assess_detail(detail: FatigueDetail, settings: FatigueSettings, effects: CycleBatch,
                  passages_per_year: np.ndarray | Sequence[float]) -> FatigueLife:
    """A detail's life from the counted effect histories at its location and response.

    Args:
        detail: the detail (its category, stress per unit effect, cycles per passage).
        settings: the [fatigue] table (standard, factors, design life, age).
        effects: counted histories of the detail's response, one row a crossing
            [kip-ft, kip, kN-m or kN].
        passages_per_year: passages of each crossing a year.

    Example:
        >>> doc = {"fatigue": {"standard": "AASHTO", "age_years": 20},
        ...        "fatigue_detail": [{"name": "cover plate", "location": "30.0",
        ...                            "response": "moment", "category": "E'",
        ...                            "section_modulus": 1200.0}]}
        >>> from influence.fatigue.settings import fatigue_details, fatigue_settings
        >>> settings = fatigue_settings(doc, "bridge.toml", units="kip-ft")
        >>> detail = fatigue_details(doc, settings, "bridge.toml")[0]
        >>> effects = count_many(Histories.of([[0.0, 450.0, 0.0]]))  # [kip-ft]
        >>> life = assess_detail(detail, settings, effects, [365 * 400.0])
        >>> round(life.governing_range, 9), round(life.remaining_years, 1)  # 450 x 12 / 1200
        (4.5, 17.6)
    """
    return assess_counted(effects, passages_per_year, detail_resistance(detail, settings),
                          settings.design_life_years, settings.age_years,
                          detail.cycles_per_passage, detail.stress_per_effect)
