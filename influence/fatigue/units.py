"""Exact unit factors of the fatigue layer: forces, lengths and stresses.

Definitions: 1 ft = 0.3048 m and 1 in = 0.0254 m (international foot and inch, 1959);
1 lbf = 4.4482216152605 N (0.45359237 kg x 9.80665 m/s^2), so 1 kip = 4.4482216152605 kN and
1 ksi = 1 kip/in^2 = 6.894757293168361 MPa.

Example:
    >>> round(STRESS_MPA["ksi"], 9)
    6.894757293
    >>> round(stress_factor("kip-ft", "in", "ksi", power=3), 12)  # kip-ft over in^3 to ksi
    12.0
"""

from __future__ import annotations

from influence.errors import ModelError

FORCE_KN = {"kN": 1.0, "kip": 4.4482216152605}
"""Size of each force unit [kN]."""

LENGTH_M = {"m": 1.0, "mm": 0.001, "cm": 0.01, "ft": 0.3048, "in": 0.0254}
"""Size of each length unit [m]."""

STRESS_MPA = {"MPa": 1.0, "ksi": FORCE_KN["kip"] / LENGTH_M["in"] ** 2 / 1000.0}
"""Size of each stress unit [MPa]."""

SYSTEMS = {"kN-m": ("kN", "m"), "kip-ft": ("kip", "ft")}
"""The model unit systems: their force and length units."""

STRESS_OF_SYSTEM = {"kN-m": "MPa", "kip-ft": "ksi"}
"""The stress unit results are given in for a model in each system."""


def stress_factor(system: str, section_unit: str, stress_unit: str, power: int) -> float:
    """Stress per unit effect for a section property of length dimension ``power``.

    A moment [force x length of ``system``] over a section modulus [section_unit^3] (power 3),
    or a force [force of ``system``] over an area [section_unit^2] (power 2), in ``stress_unit``.

    Example:
        >>> round(stress_factor("kN-m", "mm", "MPa", power=3), 6)  # kN-m over mm^3
        1000000.0
        >>> round(stress_factor("kN-m", "mm", "MPa", power=2), 9)  # kN over mm^2
        1000.0
    """
    for name, allowed in ((system, SYSTEMS), (section_unit, LENGTH_M),
                          (stress_unit, STRESS_MPA)):
        if name not in allowed:
            raise ModelError(f"unknown unit {name!r}", item="units",
                             fix="use one of " + ", ".join(allowed))
    force, length = SYSTEMS[system]
    effect_kn_m = FORCE_KN[force] * (LENGTH_M[length] if power == 3 else 1.0)
    kpa = effect_kn_m / LENGTH_M[section_unit] ** power
    return kpa / 1000.0 / STRESS_MPA[stress_unit]
