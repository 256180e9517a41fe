"""EN 1993-1-9 fatigue strength curves of steel details, with the partial factor gamma_Mf.

Reference: EN 1993-1-9 Eurocode 3, Part 1-9: Fatigue, 7.1 and Figures 7.1 (direct stress) and 7.2
(shear stress); Annex A (Miner sum). Direct stress: delta_sigma^3 N = delta_sigma_C^3 x 2e6 down to
the constant-amplitude fatigue limit delta_sigma_D at 5e6 cycles, delta_sigma^5 N = delta_sigma_D^5
x 5e6 down to the cut-off delta_sigma_L at 1e8; so delta_sigma_D = (2/5)^(1/3) delta_sigma_C =
0.737 delta_sigma_C and delta_sigma_L = (5/100)^(1/5) delta_sigma_D = 0.549 delta_sigma_D. Shear:
slope 5 throughout, cut-off at 1e8. The data and confidence marks are in
``data/en1993_1_9.toml``. The design curve is the curve divided by gamma_Mf (the user's choice;
EN 1993-1-9 Table 3.1 recommends 1.00 to 1.35).

Example:
    >>> curve = en_curve("71", gamma_Mf=1.0)
    >>> round(curve.knee_range, 2), round(curve.cutoff_range, 2)
    (52.31, 28.73)
    >>> round(en_curve("71", gamma_Mf=1.35).fatigue_limit, 2)
    38.75
"""

from __future__ import annotations

from typing import Any, Literal

from influence.errors import ModelError
from influence.fatigue.sn_curve import Resistance, SNCurve
from influence.fatigue.tables import edition_key, table
from influence.fatigue.units import STRESS_MPA

STANDARD = "EN"
DATA = "en1993_1_9"

StressKind = Literal["normal", "shear"]


def _curves(year: int | None) -> dict[str, Any]:
    data = table(DATA)
    entry: dict[str, Any] = data["editions"][edition_key(data, year)]
    return entry


def categories(stress: StressKind = "normal", year: int | None = None) -> tuple[str, ...]:
    """The detail categories (delta sigma_C or delta tau_C at 2e6 cycles [MPa]) as names."""
    return tuple(str(value) for value in _curves(year)[stress]["categories"])


def en_curve(category: str, gamma_Mf: float, stress_unit: str = "MPa",
             stress: StressKind = "normal", year: int | None = None) -> SNCurve:
    """The design curve of a detail category, divided by gamma_Mf.

    Args:
        category: delta sigma_C (or delta tau_C for shear) as a name, "36" to "160" [MPa].
        gamma_Mf: partial factor for fatigue strength, at least 1.
        stress_unit: "MPa" or "ksi" (the curve converted exactly).
        stress: "normal" (Figure 7.1) or "shear" (Figure 7.2).
        year: edition year (None: the latest).

    Raises:
        ModelError: for an unknown category, stress kind or unit, or gamma_Mf below 1.

    Example:
        >>> round(en_curve("160", 1.0, stress_unit="ksi").reference_range, 3)
        23.206
        >>> round(en_curve("100", 1.0, stress="shear").cutoff_range, 2)  # 0.457 x 100
        45.73
    """
    curves = _curves(year)
    if stress not in ("normal", "shear"):
        raise ModelError(f"unknown stress kind {stress!r}", item="stress",
                         fix="use normal or shear")
    data = curves[stress]
    known = categories(stress, year)
    if category not in known:
        raise ModelError(f"unknown EN 1993-1-9 {stress}-stress detail category {category!r}",
                         item="category", fix="use one of " + ", ".join(known))
    if isinstance(gamma_Mf, bool) or not isinstance(gamma_Mf, int | float) or gamma_Mf < 1.0:
        raise ModelError(f"gamma_Mf must be a number of at least 1, got {gamma_Mf!r}",
                         item="gamma_Mf", fix="give the partial factor of EN 1993-1-9 Table 3.1")
    if stress_unit not in STRESS_MPA:
        raise ModelError(f"unknown stress unit {stress_unit!r}", item="stress unit",
                         fix="use MPa or ksi")
    reference = float(category) / STRESS_MPA[stress_unit] / gamma_Mf
    m1, m2 = float(data["slope_above_knee"]), float(data["slope_below_knee"])
    n_ref, n_knee, n_cut = (float(data[key]) for key in
                            ("reference_cycles", "knee_cycles", "cutoff_cycles"))
    knee = reference * (n_ref / n_knee) ** (1 / m1)
    cutoff = knee * (n_knee / n_cut) ** (1 / m2)
    return SNCurve(STANDARD, category, stress_unit, reference, n_ref, m1, m2, knee, cutoff, knee,
                   n_ref)


def en_resistance(category: str, gamma_Mf: float, stress_unit: str = "MPa",
                  stress: StressKind = "normal", gamma_Ff: float = 1.0,
                  dynamic_allowance: float = 0.0, year: int | None = None) -> Resistance:
    """The design curve with gamma_Ff (and any dynamic allowance not already in the histories)
    on the stress ranges, for both the Miner sum and the fatigue-limit check.

    Example:
        >>> r = en_resistance("71", gamma_Mf=1.35)
        >>> round(r.limit_range, 2), r.damage_factor
        (38.75, 1.0)
    """
    factor = gamma_Ff * (1.0 + dynamic_allowance)
    basis = (f"EN 1993-1-9 {stress} stress, delta C = {category} MPa, gamma_Mf {gamma_Mf:g}, "
             f"gamma_Ff {gamma_Ff:g}, dynamic allowance {dynamic_allowance:g}")
    return Resistance(en_curve(category, gamma_Mf, stress_unit, stress, year), factor, factor,
                      basis)
