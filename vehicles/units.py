"""The two unit systems of load trains and load models, and exact conversion between them.

A system fixes the force and length units; force/length and moment follow. The factors are exact
by definition: 1 ft = 0.3048 m (international foot, 1959) and 1 lbf = 4.4482216152605 N
(0.45359237 kg x 9.80665 m/s^2), so 1 kip = 4.4482216152605 kN.

Converting trains and load models lives in :mod:`vehicles.conversion`.

Example:
    >>> labels("kip-ft").force_per_length
    'kip/ft'
    >>> round(factors("kip-ft", "kN-m").force, 6)
    4.448222
"""

from __future__ import annotations

from dataclasses import dataclass

from vehicles.errors import VehicleError

KN_PER_KIP = 4.4482216152605
"""Exact: 1 lbf = 4.4482216152605 N."""

M_PER_FT = 0.3048
"""Exact: the international foot."""


@dataclass(frozen=True)
class UnitLabels:
    """The printed unit of each quantity in a system."""

    force: str
    length: str
    force_per_length: str
    moment: str


@dataclass(frozen=True)
class UnitSystem:
    """A unit system: its labels and its size in SI (kN and m)."""

    name: str
    labels: UnitLabels
    kn_per_force: float
    m_per_length: float


SYSTEMS = {
    "kN-m": UnitSystem("kN-m", UnitLabels("kN", "m", "kN/m", "kN-m"), 1.0, 1.0),
    "kip-ft": UnitSystem(
        "kip-ft", UnitLabels("kip", "ft", "kip/ft", "kip-ft"), KN_PER_KIP, M_PER_FT
    ),
}
"""Every unit system a file or a library model may use, by name."""


def system(name: str) -> UnitSystem:
    """The unit system called ``name`` ("kN-m" or "kip-ft").

    Raises:
        VehicleError: for any other name.

    Example:
        >>> system("kN-m").labels.moment
        'kN-m'
    """
    try:
        return SYSTEMS[name]
    except (KeyError, TypeError):
        raise VehicleError(
            f"unknown units '{name}'", item="units", fix="give units = " + " or ".join(
                f'"{known}"' for known in SYSTEMS)
        ) from None


def labels(name: str) -> UnitLabels:
    """The printed labels of the unit system ``name``."""
    return system(name).labels


@dataclass(frozen=True)
class Factors:
    """Multipliers that take values from one system to another."""

    force: float
    length: float

    @property
    def force_per_length(self) -> float:
        return self.force / self.length


def factors(source: str, target: str) -> Factors:
    """Multipliers from ``source`` units to ``target`` units.

    Example:
        >>> round(factors("kip-ft", "kN-m").force_per_length, 6)
        14.593903
        >>> factors("kN-m", "kN-m")
        Factors(force=1.0, length=1.0)
    """
    a, b = system(source), system(target)
    if a is b:
        return Factors(1.0, 1.0)
    return Factors(a.kn_per_force / b.kn_per_force, a.m_per_length / b.m_per_length)
