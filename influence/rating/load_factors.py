"""Limit states and load factors: LRFR (MBE Table 6A.4.2.2-1) and the LFR/ASR factors A1, A2.

LRFR rates each bridge material at four levels: "design inventory" and "design operating"
(HL-93), "legal" (legal vehicles) and "permit". Each level has its limit states, each with a
dead-load factor for components (gDC) and wearing surface (gDW) and a live-load factor gL; for
legal and permit loads gL comes from the ADTT tables (:mod:`influence.rating.live_factors`).
The values are recalled from the MBE (from memory, unconfirmed; the mark travels with each row).

LFR and ASR (MBE Part B) rate at "inventory" and "operating" with RF = (C - A1 D)/(A2 L (1 + I)).

Example:
    >>> [row.limit_state for row in limit_states("steel", "legal")]
    ['Strength I', 'Service II']
    >>> row = limit_state_factors("prestressed concrete", "design inventory", "Service III")
    >>> row.live, row.capacity, row.optional
    (0.8, 'service', False)
    >>> limit_state_factors("steel", "design inventory", "Strength I",
    ...                     overlay_measured=True).dead_wearing
    1.25
    >>> allowable_factors("LFR", "inventory").live
    2.17
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from influence.errors import ModelError
from influence.rating.tables import FACTORS_FILE, data_file

MATERIALS = ("steel", "reinforced concrete", "prestressed concrete", "wood")
LRFR_LEVELS = ("design inventory", "design operating", "legal", "permit")
ALLOWABLE_LEVELS = ("inventory", "operating")
METHODS = ("LRFR", "LFR", "ASR")
LIVE_TABLES = ("legal table", "permit table")


@dataclass(frozen=True)
class LimitStateFactors:
    """One row of MBE Table 6A.4.2.2-1 at one rating level.

    Attributes:
        material: bridge material ("steel", "reinforced concrete", ...).
        level: rating level ("design inventory", "design operating", "legal", "permit").
        limit_state: "Strength I", "Service II", ...
        capacity: "strength" (C = phi_c phi_s phi Rn) or "service" (C = f_R).
        dead_components: gDC [-].
        dead_wearing: gDW [-].
        live: gL [-], or None when it comes from the legal or permit table.
        live_table: "legal table" or "permit table" when ``live`` is None, else "".
        optional: whether the check is optional at this level.
        mark: clause and confidence.
    """

    material: str
    level: str
    limit_state: str
    capacity: str
    dead_components: float
    dead_wearing: float
    live: float | None
    live_table: str
    optional: bool
    mark: str


@dataclass(frozen=True)
class AllowableFactors:
    """LFR or ASR factors: RF = (C - A1 D) / (A2 L (1 + I)).

    Attributes:
        method: "LFR" or "ASR".
        level: "inventory" or "operating".
        dead: A1 [-].
        live: A2 [-].
        mark: clause and confidence.
    """

    method: str
    level: str
    dead: float
    live: float
    mark: str


def _choice(value: str, allowed: tuple[str, ...], what: str, source: str, item: str) -> str:
    if value not in allowed:
        raise ModelError(f"unknown {what} {value!r}", source=source, item=item,
                         fix="use one of: " + ", ".join(f'"{a}"' for a in allowed))
    return value


def _row_at(row: dict[str, Any], level: str, overlay_measured: bool) -> LimitStateFactors:
    live = row["live"][level]
    wearing = row.get("dw_measured", row["dw"]) if overlay_measured else row["dw"]
    return LimitStateFactors(
        material=row["material"], level=level, limit_state=row["name"],
        capacity=row["capacity"], dead_components=float(row["dc"]),
        dead_wearing=float(wearing),
        live=None if isinstance(live, str) else float(live),
        live_table=live if isinstance(live, str) else "",
        optional=level in row["optional"], mark=row["mark"],
    )


def limit_states(material: str, level: str, *, overlay_measured: bool = False,
                 source: str = "") -> tuple[LimitStateFactors, ...]:
    """Every LRFR limit state of a material at a rating level, required ones first.

    Args:
        material: one of MATERIALS.
        level: one of LRFR_LEVELS.
        overlay_measured: the wearing surface was measured in the field (gDW = 1.25 at the
            strength limit states, MBE 6A.4.2.2, from memory, unconfirmed).
        source: file named in errors.

    Raises:
        ModelError: for an unknown material or level.
    """
    _choice(material, MATERIALS, "material", source, "material")
    _choice(level, LRFR_LEVELS, "rating level", source, "level")
    rows = [_row_at(row, level, overlay_measured) for row in data_file(FACTORS_FILE)["limit_state"]
            if row["material"] == material and level in row["live"]]
    return tuple(sorted(rows, key=lambda r: r.optional))


def limit_state_factors(material: str, level: str, limit_state: str, *,
                        overlay_measured: bool = False, source: str = "") -> LimitStateFactors:
    """The factors of one LRFR limit state; an error if the MBE does not check it at that level.

    Raises:
        ModelError: for an unknown material or level, or a limit state not rated there.
    """
    rows = limit_states(material, level, overlay_measured=overlay_measured, source=source)
    names = tuple(row.limit_state for row in rows)
    _choice(limit_state, names, f"limit state for {material} at the {level} level", source,
            "limit_states")
    return rows[names.index(limit_state)]


def allowable_factors(method: str, level: str, source: str = "") -> AllowableFactors:
    """A1 and A2 of the LFR or ASR rating equation (MBE 6B.4.1, from memory, unconfirmed).

    Raises:
        ModelError: for a method other than LFR and ASR, or an unknown level.
    """
    _choice(method, METHODS[1:], "method with A1/A2 factors", source, "method")
    _choice(level, ALLOWABLE_LEVELS, "rating level", source, "level")
    row = next(r for r in data_file(FACTORS_FILE)["allowable_method"] if r["method"] == method)
    return AllowableFactors(method, level, float(row["dead"]), float(row["live"][level]),
                            row["mark"])
