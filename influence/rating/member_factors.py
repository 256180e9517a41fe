"""LRFR condition factor phi_c and system factor phi_s, and their product's lower limit 0.85.

phi_c by the member's condition (MBE Table 6A.4.2.3-1) and phi_s by the superstructure type
(MBE Table 6A.4.2.4-1) are recalled (from memory, unconfirmed); phi_s = 1.0 when rating shear
(from memory, unconfirmed). The lower limit phi_c phi_s >= 0.85 is confirmed (M. A. Khan,
*Bridge and Highway Structure Rehabilitation and Repair*, McGraw-Hill 2010, ch. 5 p. 187).

Example:
    >>> condition_factor("fair"), condition_factor(4)     # a word or an NBI rating 0-9
    (0.95, 0.85)
    >>> system_factor("welded members in two-girder, truss or arch bridges")
    0.85
    >>> system_factor("welded members in two-girder, truss or arch bridges", response="shear")
    1.0
    >>> combined_member_factor(0.85, 0.85)     # 0.7225 raised to the floor
    (0.85, True)
    >>> combined_member_factor(1.0, 0.9)
    (0.9, False)
"""

from __future__ import annotations

from influence.errors import ModelError
from influence.rating.tables import FACTORS_FILE, data_file


def condition_factor(condition: str | int, source: str = "",
                     item: str = "rating.condition_factor") -> float:
    """phi_c for a condition word ("good", "satisfactory", "fair", "poor") or NBI rating 0-9.

    Raises:
        ModelError: for an unknown word or a rating outside 0-9.
    """
    rows = data_file(FACTORS_FILE)["condition"]
    if isinstance(condition, bool) or not isinstance(condition, str | int):
        raise ModelError(f"condition {condition!r}", source=source, item=item,
                         fix="give a factor, a condition word or an NBI rating 0-9")
    if isinstance(condition, int):
        if not 0 <= condition <= 9:
            raise ModelError(f"NBI condition rating {condition} is outside 0-9", source=source,
                             item=item, fix="give the superstructure condition rating, 0 to 9")
        return float(max((r for r in rows if r["rating"] <= condition),
                         key=lambda r: r["rating"])["factor"])
    for row in rows:
        if row["name"] == condition:
            return float(row["factor"])
    raise ModelError(f"unknown condition {condition!r}", source=source, item=item,
                     fix="use one of: " + ", ".join(f'"{r["name"]}"' for r in rows))


def system_kinds() -> tuple[str, ...]:
    """The superstructure types of the system-factor table."""
    return tuple(row["name"] for row in data_file(FACTORS_FILE)["system"]["kind"])


def system_factor(kind: str, response: str = "moment", source: str = "",
                  item: str = "rating.system_factor") -> float:
    """phi_s for a superstructure type; 1.0 for shear.

    Raises:
        ModelError: for a type the table does not hold, listing them.
    """
    table = data_file(FACTORS_FILE)["system"]
    for row in table["kind"]:
        if row["name"] == kind:
            return float(table["shear"]) if response == "shear" else float(row["factor"])
    raise ModelError(f"unknown superstructure type {kind!r}", source=source, item=item,
                     fix="give a factor or one of: " + "; ".join(f'"{k}"' for k in system_kinds()))


def combined_member_factor(condition: float, system: float) -> tuple[float, bool]:
    """phi_c phi_s with its lower limit, and whether the limit was applied.

    Args:
        condition: phi_c [-].
        system: phi_s [-].

    Returns:
        (max(phi_c phi_s, 0.85), True when the floor raised the product).
    """
    floor = float(data_file(FACTORS_FILE)["system"]["floor"])
    product = condition * system
    return (floor, True) if product < floor else (round(product, 12), False)
