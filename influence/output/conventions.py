"""The words every output carries: sign conventions, units and the cautions.

Example:
    >>> ordinate_unit("moment", "kN-m")
    'kN-m/kN'
"""

from __future__ import annotations

from vehicles.units import labels

CAUTION = (
    "Results need review by a qualified engineer before use; local codes, the owner's rules and "
    "licensed practice govern. Check the model, loads and units against the design basis."
)

SIGN_CONVENTIONS = (
    "Axes x along the structure, y up; loads act downward. Chainage is measured along member "
    "axes from the start of the path. Reactions positive along +x, +y and counter-clockwise. "
    "Axial force positive in tension; moment positive sagging; shear positive when the "
    "transverse resultant on the start side of the section acts along the member's +y' (upward "
    "for a member drawn left to right). Deflection positive downward; rotation counter-clockwise."
)

_ORDINATE_DIMENSION = {
    "reaction": "force/force",
    "shear": "force/force",
    "axial": "force/force",
    "moment": "moment/force",
    "deflection": "length/force",
    "rotation": "rad/force",
}

_EFFECT_DIMENSION = {
    "reaction": "force",
    "shear": "force",
    "axial": "force",
    "moment": "moment",
    "deflection": "length",
    "rotation": "rad",
}


def _render(dimension: str, units: str) -> str:
    names = labels(units)
    table = {"force": names.force, "moment": names.moment, "length": names.length, "rad": "rad"}
    return "/".join(table[part] for part in dimension.split("/"))


def ordinate_unit(kind: str, units: str, component: str = "") -> str:
    """Unit of an influence ordinate (response per unit load) of a response kind."""
    dimension = _ORDINATE_DIMENSION[kind]
    if kind == "reaction" and component == "moment":
        dimension = "moment/force"
    return _render(dimension, units)


def effect_unit(kind: str, units: str, component: str = "") -> str:
    """Unit of a response under real loads."""
    dimension = _EFFECT_DIMENSION[kind]
    if kind == "reaction" and component == "moment":
        dimension = "moment"
    return _render(dimension, units)


_SMALL_LENGTH = {"m": ("mm", 1000.0), "ft": ("in", 12.0)}


def printed_effect(kind: str, units: str, component: str = "") -> tuple[str, float]:
    """(unit, factor) of a response as printed tables and plots show it: deflections in mm or
    in, everything else in the model's own units (factor 1).

    Example:
        >>> printed_effect("deflection", "kN-m"), printed_effect("moment", "kip-ft")
        (('mm', 1000.0), ('kip-ft', 1.0))
    """
    unit = effect_unit(kind, units, component)
    if kind == "deflection" and unit in _SMALL_LENGTH:
        return _SMALL_LENGTH[unit]
    return unit, 1.0


LIVE_LABEL = "LL+IM"
"""How tables and plots name the live load with its dynamic load allowance, as the standards do
(AASHTO LRFD Bridge Design Specifications, 3.3.2 load designations: LL vehicular live load, IM
vehicular dynamic load allowance; from memory, unconfirmed)."""


def header_lines(title: str, units: str) -> list[str]:
    """The lines that open every output: title, units, conventions and the caution."""
    names = labels(units)
    return [
        title,
        f"Units: force {names.force}, length {names.length}, moment {names.moment}.",
        "Sign conventions: " + SIGN_CONVENTIONS,
        "Caution: " + CAUTION,
    ]
