"""Reading the rating tables of a model file: the keys each table takes, typed values, errors.

Every problem is a one-line :class:`~influence.errors.ModelError` naming the file, the key and
the fix. A key written in the wrong table is answered with the table it belongs in.

Example:
    >>> try:
    ...     check_keys({"nominal": 1.0}, "[rating]", "bridge.toml", "rating")
    ... except ModelError as error:
    ...     print(error)
    bridge.toml: rating: unknown key 'nominal' (it belongs in [[capacity]])
    >>> number(2, "rating.adtt", "bridge.toml")
    2.0
"""

from __future__ import annotations

import math
from typing import Any

from influence.errors import ModelError

TABLE_KEYS: dict[str, frozenset[str]] = {
    "[rating]": frozenset({
        "method", "edition", "adtt", "condition_factor", "condition_rating", "system_factor",
        "impact", "surface", "material", "limit_states", "levels", "overlay_measured",
        "distribution", "permit", "sign_increment", "dead_loads"}),
    "[rating.distribution]": frozenset({
        "girder", "spacing", "span", "slab_thickness", "stiffness_parameter", "girders",
        "edge_distance", "skew", "rigid_section"}),
    "[rating.permit]": frozenset({"type", "frequency", "loading", "gross_weight"}),
    "[rating.dead_loads]": frozenset({"DC", "DW", "P"}),
    "[[capacity]]": frozenset({
        "name", "response", "sense", "from", "to", "members", "sections", "nominal",
        "resistance_factor", "service", "allowable"}),
    "capacity.allowable": frozenset({"inventory", "operating"}),
}


def check_keys(table: dict[str, Any], here: str, source: str, item: str) -> None:
    """Refuse a key that ``here`` (a name in TABLE_KEYS) does not take, saying where it goes."""
    for key in table:
        if key in TABLE_KEYS[here]:
            continue
        homes = [name for name, keys in TABLE_KEYS.items() if key in keys]
        fix = (f"it belongs in {' or '.join(homes)}" if homes else
               "allowed keys: " + ", ".join(sorted(TABLE_KEYS[here])))
        raise ModelError(f"unknown key {key!r}", source=source, item=item, fix=fix)


def table(value: Any, item: str, source: str) -> dict[str, Any]:
    """A TOML table, or an error saying to write one."""
    if not isinstance(value, dict):
        raise ModelError(f"{item} must be a table, not {value!r}", source=source, item=item,
                         fix=f"write it as [{item}] or {item} = {{ ... }}")
    return value


def number(value: Any, item: str, source: str) -> float:
    """A finite number (int or float, not a bool)."""
    if isinstance(value, bool) or not isinstance(value, int | float) or not math.isfinite(value):
        raise ModelError(f"{item} = {value!r} is not a number", source=source, item=item,
                         fix="give a number")
    return float(value)


def positive(value: Any, item: str, source: str) -> float:
    """A number greater than 0."""
    result = number(value, item, source)
    if not result > 0.0:
        raise ModelError(f"{item} = {value!r}", source=source, item=item,
                         fix="give a number greater than 0")
    return result


def fraction(value: Any, item: str, source: str) -> float:
    """A factor in (0, 1]."""
    result = number(value, item, source)
    if not 0.0 < result <= 1.0:
        raise ModelError(f"{item} = {value!r} is outside (0, 1]", source=source, item=item,
                         fix="give a factor greater than 0 and at most 1.0")
    return result


def choice(value: Any, allowed: tuple[str, ...], item: str, source: str) -> str:
    """One of ``allowed``."""
    if value not in allowed:
        raise ModelError(f"{item} = {value!r} is not known", source=source, item=item,
                         fix="use one of: " + ", ".join(f'"{a}"' for a in allowed))
    return str(value)


def names(value: Any, item: str, source: str) -> tuple[str, ...]:
    """A list of strings, as a tuple."""
    if not isinstance(value, list) or not all(isinstance(v, str) for v in value) or not value:
        raise ModelError(f"{item} = {value!r}", source=source, item=item,
                         fix='give a list of names, e.g. ["a", "b"]')
    return tuple(value)


def flag(value: Any, item: str, source: str) -> bool:
    """A TOML boolean."""
    if not isinstance(value, bool):
        raise ModelError(f"{item} = {value!r}", source=source, item=item,
                         fix="write true or false")
    return value
