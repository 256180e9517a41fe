"""Live-load factors gL for legal and permit loads, by edition and truck traffic (ADTT).

Legal loads: MBE Table 6A.4.4.2.3a-1, gL by ADTT (one direction), interpolated linearly between
the tabulated ADTT values and held beyond them. Permit loads: MBE Table 6A.4.5.4.2a-1, gL by
permit type (routine/annual or special/limited crossing), frequency, loading condition and ADTT,
and in the 1st edition by the routine permit's gross weight (interpolated between 100 and
150 kip). Values are from memory, unconfirmed; each result carries its mark.

Example:
    >>> legal_live_load_factor("MBE 1st", 3000.0).factor      # 1.65 + (2000/4000)(1.80 - 1.65)
    1.725
    >>> legal_live_load_factor("MBE 2nd", None).factor         # ADTT unknown
    1.45
    >>> crossing = PermitCrossing("special", "single trip", "escorted, no other vehicles")
    >>> permit_live_load_factor("MBE 2nd", crossing, 800.0).factor
    1.1
    >>> routine = PermitCrossing("annual", gross_weight_kip=125.0)
    >>> permit_live_load_factor("MBE 1st", routine, 5000.0).factor   # halfway 1.80 -> 1.30
    1.55
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from influence.errors import ModelError
from influence.rating.tables import edition_table, interpolated

PERMIT_TYPES = {"routine": "routine", "annual": "routine", "special": "special",
                "limited crossing": "special"}
FREQUENCIES = ("unlimited crossings", "single trip", "multiple trips")
LOADINGS = ("mixed with traffic", "escorted, no other vehicles")


@dataclass(frozen=True)
class LiveLoadFactor:
    """A live-load factor and how it was found.

    Attributes:
        factor: gL [-].
        basis: the table entry and interpolation used, in words.
        distribution: for permits, the distribution it goes with ("one lane" for special
            permits, with the multiple presence factor divided out; "two or more lanes" for
            routine permits); "" for legal loads.
        mark: clause and confidence.
    """

    factor: float
    basis: str
    distribution: str
    mark: str


@dataclass(frozen=True)
class PermitCrossing:
    """What the permit allows, as the MBE permit table distinguishes it.

    Attributes:
        kind: "routine" (alias "annual") or "special" (alias "limited crossing").
        frequency: "unlimited crossings" (routine), "single trip" or "multiple trips".
        loading: "mixed with traffic" or "escorted, no other vehicles".
        gross_weight_kip: the permit vehicle's gross weight [kip]; needed for routine permits
            in the MBE 1st edition.
    """

    kind: str
    frequency: str = "unlimited crossings"
    loading: str = "mixed with traffic"
    gross_weight_kip: float | None = None

    def __post_init__(self) -> None:
        if self.kind not in PERMIT_TYPES:
            raise ModelError(f"unknown permit type {self.kind!r}", item="permit.type",
                             fix="use one of: " + ", ".join(f'"{k}"' for k in PERMIT_TYPES))
        object.__setattr__(self, "kind", PERMIT_TYPES[self.kind])
        for value, allowed, key in ((self.frequency, FREQUENCIES, "frequency"),
                                    (self.loading, LOADINGS, "loading")):
            if value not in allowed:
                raise ModelError(f"unknown permit {key} {value!r}", item=f"permit.{key}",
                                 fix="use one of: " + ", ".join(f'"{a}"' for a in allowed))
        if self.gross_weight_kip is not None and not self.gross_weight_kip > 0.0:
            raise ModelError(f"gross weight {self.gross_weight_kip!r} kip",
                             item="permit.gross_weight",
                             fix="give the permit vehicle's gross weight, greater than 0")


def checked_adtt(adtt: float | None, item: str = "rating.adtt") -> None:
    """Refuse an ADTT that is negative or not a number (NaN)."""
    if adtt is not None and not adtt >= 0.0:
        problem = "is negative" if adtt < 0 else "is not a number"
        raise ModelError(f"ADTT {adtt!r} {problem}", item=item,
                         fix="give the average daily truck traffic in one direction, 0 or more, "
                             "or leave it out when unknown")


def legal_live_load_factor(edition: str, adtt: float | None) -> LiveLoadFactor:
    """gL for legal loads (MBE Table 6A.4.4.2.3a-1, from memory, unconfirmed).

    Args:
        edition: "MBE 1st" or "MBE 2nd".
        adtt: average daily truck traffic, one direction [trucks/day]; None when unknown.

    Raises:
        ModelError: for an unknown edition or a negative ADTT.
    """
    table = edition_table(edition)["legal"]
    checked_adtt(adtt)
    if adtt is None:
        return LiveLoadFactor(float(table["unknown"]), "ADTT unknown", "",
                              f"{table['clause']}; {table['unknown_mark']}")
    points = tuple((float(p["adtt"]), float(p["factor"])) for p in table["points"])
    marks = sorted({p["mark"] for p in table["points"]})
    return LiveLoadFactor(interpolated(points, adtt), _adtt_basis(adtt, points), "",
                          f"{table['clause']}; {', '.join(marks)}")


def _adtt_basis(adtt: float, points: tuple[tuple[float, float], ...]) -> str:
    low, high = points[0][0], points[-1][0]
    if adtt <= low:
        return f"ADTT {adtt:g} at or below {low:g}"
    if adtt >= high:
        return f"ADTT {adtt:g} at or above {high:g}"
    below = max(x for x, _ in points if x <= adtt)
    above = min(x for x, _ in points if x >= adtt)
    if below == above:
        return f"ADTT {adtt:g} tabulated"
    return f"ADTT {adtt:g} interpolated between {below:g} and {above:g}"


def _permit_row(edition: str, crossing: PermitCrossing) -> dict[str, Any]:
    rows = edition_table(edition)["permit"]
    for row in rows:
        if (row["permit"], row["frequency"], row["loading"]) == (
                crossing.kind, crossing.frequency, crossing.loading):
            return dict(row)
    listed = "; ".join(f"{r['permit']}, {r['frequency']}, {r['loading']}" for r in rows)
    raise ModelError(
        f"the {edition} permit table has no row for a {crossing.kind} permit, "
        f"{crossing.frequency}, {crossing.loading}", item="permit", fix=f"rows: {listed}")


def permit_live_load_factor(edition: str, crossing: PermitCrossing,
                            adtt: float | None) -> LiveLoadFactor:
    """gL for a permit load (MBE Table 6A.4.5.4.2a-1, from memory, unconfirmed).

    An unknown ADTT takes the highest tabulated ADTT (common practice: the adverse value).

    Args:
        edition: "MBE 1st" or "MBE 2nd".
        crossing: permit type, frequency, loading condition and (1st edition routine permits)
            gross weight [kip].
        adtt: average daily truck traffic, one direction [trucks/day]; None when unknown.

    Raises:
        ModelError: for an unknown edition, a negative ADTT, a combination the table does not
            hold, or a missing gross weight where the factor depends on it.
    """
    checked_adtt(adtt)
    row = _permit_row(edition, crossing)
    clause = edition_table(edition)["permit_clause"]
    if "factor" in row:
        return LiveLoadFactor(float(row["factor"]), "ADTT does not apply", row["distribution"],
                              f"{clause}; {row['mark']}")
    adtts = [float(a) for a in row["adtt"]]
    at = adtts[-1] if adtt is None else adtt
    basis = "ADTT unknown, highest column taken" if adtt is None else _adtt_basis(
        at, tuple((a, 0.0) for a in adtts))
    if "factors" in row:
        factor = interpolated(tuple(zip(adtts, row["factors"], strict=True)), at)
        return LiveLoadFactor(factor, basis, row["distribution"], f"{clause}; {row['mark']}")
    if crossing.gross_weight_kip is None:
        raise ModelError(f"the {edition} factor for routine permits depends on the gross weight",
                         item="permit.gross_weight",
                         fix="give the permit vehicle's gross weight [kip]")
    by_weight = tuple(
        (float(w["gross_weight_kip"]),
         interpolated(tuple(zip(adtts, w["factors"], strict=True)), at)) for w in row["by_weight"])
    factor = interpolated(by_weight, crossing.gross_weight_kip)
    marks = ", ".join(sorted({w["mark"] for w in row["by_weight"]}))
    return LiveLoadFactor(
        factor, f"{basis}; gross weight {crossing.gross_weight_kip:g} kip between "
                f"{by_weight[0][0]:g} and {by_weight[-1][0]:g} kip, interpolated",
        row["distribution"], f"{clause}; {marks}")
