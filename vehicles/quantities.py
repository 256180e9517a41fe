"""Quantities with units in input files: ``"110 ft"``, ``"29000 ksi"``, ``"1.2 kip/ft"``.

A key of a model or vehicle file takes a plain number, in the file's unit system, or a text
quantity: a number and a unit, converted exactly to the file's system. :data:`KEY_DIMENSIONS` is
the one place that knows which dimension each key has. Units are read by pint; the conversion is
done in exact rational arithmetic (1 ft = 0.3048 m and 1 lbf = 4.4482216152605 N exactly) and
rounded to a float once.

Example:
    >>> quantity("29000 ksi", "E", "kip-ft")          # kip/ft^2
    4176000.0
    >>> round(quantity("1440 in^4", "I", "kip-ft"), 9)  # ft^4
    0.069444444
    >>> quantity(24.0, "spans", "kN-m")                # a plain number: the file's units
    24.0
    >>> try:
    ...     quantity("12 kip", "spans", "kip-ft", item="beam.spans[1]")
    ... except VehicleError as error:
    ...     print(error)
    beam.spans[1]: "12 kip" is a force, not a length (give a length, such as "110 ft" or "33.5 m")
"""

from __future__ import annotations

import functools
import re
from collections.abc import Callable
from dataclasses import dataclass
from fractions import Fraction
from typing import Any

from vehicles.errors import VehicleError
from vehicles.tomlfile import MAX_MAGNITUDE
from vehicles.units import SYSTEMS


@dataclass(frozen=True)
class Dimension:
    """A dimension as powers of force and length, with how messages name it."""

    name: str
    force: int
    length: int
    example: str

    def unit_in(self, system: str) -> str:
        """The unit of this dimension in a unit system, as pint reads it."""
        force, length = {"kN-m": ("kN", "m"), "kip-ft": ("kip", "ft")}[system]
        parts = [f"{force}**{self.force}" if self.force else "",
                 f"{length}**{self.length}" if self.length else ""]
        return " * ".join(part for part in parts if part) or "dimensionless"


LENGTH = Dimension("length", 0, 1, '"110 ft" or "33.5 m"')
FORCE = Dimension("force", 1, 0, '"32 kip" or "145 kN"')
FORCE_PER_LENGTH = Dimension("force per length", 1, -1, '"1.2 kip/ft" or "9.3 kN/m"')
MOMENT = Dimension("moment (force x length)", 1, 1, '"1.0e6 kip*ft" or "2.0e5 kN*m"')
FLEXURAL = Dimension("bending stiffness (force x length^2)", 1, 2,
                     '"2.9e5 kip*ft^2" or "4.0e6 kN*m^2"')
PRESSURE = Dimension("modulus (force per area)", 1, -2, '"29000 ksi" or "210 GPa"')
AREA = Dimension("area", 0, 2, '"42 in^2" or "0.03 m^2"')
SECOND_MOMENT = Dimension("second moment of area", 0, 4, '"1440 in^4" or "6.0e9 mm^4"')

KEY_DIMENSIONS: dict[str, Dimension] = {
    # structure model files
    "spans": LENGTH, "hinges": LENGTH, "x": LENGTH, "y": LENGTH,
    "panel_length": LENGTH, "depth": LENGTH,
    "EI": FLEXURAL, "EA": FORCE, "E": PRESSURE, "I": SECOND_MOMENT, "A": AREA,
    "horizontal": FORCE_PER_LENGTH, "vertical": FORCE_PER_LENGTH, "rotational": MOMENT,
    "ux": FORCE_PER_LENGTH, "uy": FORCE_PER_LENGTH, "rz": MOMENT,
    "stringer_EI": FLEXURAL, "stringer_EA": FORCE,
    # design basis
    "uniform": FORCE_PER_LENGTH, "point": FORCE, "at": LENGTH, "from": LENGTH, "to": LENGTH,
    "step": LENGTH,
    # vehicle and load-model files
    "loads": FORCE, "axle": FORCE, "spacings": LENGTH, "gap": LENGTH, "length": LENGTH,
    "headways": LENGTH, "intensity": FORCE_PER_LENGTH, "lane": FORCE_PER_LENGTH,
    "knife_edge_for_moment": FORCE, "knife_edge_for_shear": FORCE,
    "lane_clear_of_axles": LENGTH,
}
"""The dimension of every key that takes a quantity (the same key means the same dimension in
every table and file)."""

_NUMBER = r"[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d{1,3})?"
_QUANTITY = re.compile(rf"^\s*({_NUMBER})\s*([A-Za-z][A-Za-z0-9_ */^().\-]*?)\s*$")
_LONG_DIGITS = re.compile(r"\d{3,}")
MAX_UNIT_TEXT = 40
"""The longest unit text read [characters]."""


def quantity(value: Any, key: str, system: str, *, item: str = "", source: str = "",
             error: Callable[..., Exception] = VehicleError) -> float:
    """The value of ``key`` in ``system`` units: a plain number as it is, a text quantity
    converted exactly.

    Args:
        value: a number, or text such as ``"110 ft"``.
        key: the file key (its dimension is :data:`KEY_DIMENSIONS` [key]).
        system: the file's unit system, "kN-m" or "kip-ft".
        item: where the value stands, for messages (default: the key).
        source: the file, for messages.
        error: the exception class to raise.

    Raises:
        error: for another type, an unknown unit, a wrong dimension or a value out of range.
    """
    dimension = KEY_DIMENSIONS[key]
    item = item or key
    if isinstance(value, bool) or not isinstance(value, int | float | str):
        raise error(f"expected a number or a quantity, got {value!r}", source=source,
                    item=item, fix=f"give a {dimension.name}: a number in {system}, or text "
                    f"such as {dimension.example}")
    if not isinstance(value, str):
        return float(value)
    exact = _converted(value, dimension, system, item, source, error)
    if abs(exact) > MAX_MAGNITUDE:
        raise error(f"{value!r} is out of range in {system} units", source=source,
                    item=item, fix=f"give a {dimension.name} of at most {MAX_MAGNITUDE:g} in "
                                   f"{system} units")
    return float(exact)


def is_quantity_text(value: Any) -> bool:
    """Whether ``value`` looks like a number followed by a unit."""
    return isinstance(value, str) and _QUANTITY.match(value) is not None


def _converted(text: str, dimension: Dimension, system: str, item: str, source: str,
               error: Callable[..., Exception]) -> Fraction:
    if system not in SYSTEMS:
        raise error(f"units {system!r} are not known", source=source, item="units",
                    fix="use " + " or ".join(f'"{name}"' for name in SYSTEMS))
    match = _QUANTITY.match(text)
    if match is None or len(match.group(2)) > MAX_UNIT_TEXT or _LONG_DIGITS.search(
            match.group(2)):
        raise error(f"{text!r} is not a number with a unit", source=source, item=item,
                    fix=f"write a number and a unit, such as {dimension.example}, or a plain "
                        f"number in {system}")
    number, unit = match.groups()
    registry = _registry()
    try:
        parsed = registry.parse_units(unit)
    except Exception:  # pint raises several kinds for text it cannot read
        raise error(f"unknown unit {unit!r} in {text!r}", source=source, item=item,
                    fix=f"use a unit such as {dimension.example}") from None
    target = registry.parse_units(dimension.unit_in(system))
    if parsed.dimensionality != target.dimensionality:
        found = _dimension_name(parsed, registry)
        raise error(f'"{text}" is {found}, not a {dimension.name}', source=source, item=item,
                    fix=f"give a {dimension.name}, such as {dimension.example}")
    factor = registry.Quantity(Fraction(1), parsed).to(target).magnitude
    return Fraction(number) * Fraction(factor)


def _dimension_name(unit: Any, registry: Any) -> str:
    for known in (LENGTH, FORCE, FORCE_PER_LENGTH, MOMENT, FLEXURAL, PRESSURE, AREA,
                  SECOND_MOMENT):
        if registry.parse_units(known.unit_in("kN-m")).dimensionality == unit.dimensionality:
            return f"a {known.name}"
    return f"in {unit}"


@functools.cache
def _registry() -> Any:
    """pint's unit registry with exact rational arithmetic, built once when first needed."""
    import pint

    return pint.UnitRegistry(non_int_type=Fraction)
