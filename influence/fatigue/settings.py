"""Fatigue settings and fatigue details in a model file, read into validated values.

The tables sit beside the structure in the model's TOML file::

    [fatigue]
    standard = "AASHTO"          # or "EN"
    edition = 2020               # year of the edition (default: the latest in the data)
    adtt = 2500                  # trucks a day, all lanes one way (needed for count spectra
    lanes = 2                    #   and the fatigue truck); lanes available to trucks, or
    # p = 0.85                   #   the single-lane fraction itself
    design_life_years = 75       # default: AASHTO 75, EN 100
    age_years = 32               # age today, for the remaining life (default 0)
    # gamma_Mf = 1.35            # EN only, required there; gamma_Ff = 1.0 by default
    # dynamic_allowance = 0.15   # on the stress ranges (default: AASHTO IM 15 %, EN 0)
    section_units = "in"         # unit of section properties (default: in for kip-ft, mm
                                 #   for kN-m models)

    [[fatigue_detail]]
    name = "G2 bottom flange, cover plate end"
    location = "span2@12.5"      # chainage, node name or MEMBER@DISTANCE
    response = "moment"          # moment, shear or axial
    category = "E'"
    section_modulus = 1450.0     # [section_units^3]; or inertia and distance (from the
    # inertia = 98000.0          #   neutral axis to the detail) [section_units^4, ...]
    # area = 42.0                # for shear or axial responses [section_units^2]
    stress_concentration = 1.0   # optional, multiplies the nominal stress
    # cycles_per_passage = 1.5   # optional: each crossing counts as n cycles of its full
                                 #   range (the AASHTO fatigue-truck rule) instead of rainflow

Checks that need the structure (the location lies on it) are the model reader's; everything else
is checked here. Stresses come out in ksi for kip-ft models and MPa for kN-m models.

Example:
    >>> doc = {"fatigue": {"standard": "EN", "gamma_Mf": 1.35},
    ...        "fatigue_detail": [{"name": "web stiffener", "location": "B", "response": "moment",
    ...                            "category": "80", "section_modulus": 2.5e7}]}
    >>> settings = fatigue_settings(doc, "bridge.toml", units="kN-m")
    >>> settings.design_life_years, settings.stress_unit, settings.section_units
    (100.0, 'MPa', 'mm')
    >>> detail = fatigue_details(doc, settings, "bridge.toml")[0]
    >>> round(detail.stress_per_effect, 6)  # 1 kN-m over 2.5e7 mm^3 [MPa]
    0.04
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Any

from influence.errors import ModelError
from influence.fatigue import aashto, eurocode
from influence.fatigue.sn_curve import Resistance
from influence.fatigue.tables import edition_key, table
from influence.fatigue.units import LENGTH_M, STRESS_OF_SYSTEM, stress_factor

STANDARDS = {"AASHTO": "aashto_lrfd", "EN": "en1993_1_9"}
"""The standards a [fatigue] table may name, and their data files."""

SETTING_KEYS = {"standard", "edition", "adtt", "lanes", "p", "design_life_years", "age_years",
                "gamma_Mf", "gamma_Ff", "dynamic_allowance", "section_units"}
DETAIL_KEYS = {"name", "location", "response", "category", "section_modulus", "inertia",
               "distance", "area", "stress_concentration", "cycles_per_passage"}
RESPONSES = ("moment", "shear", "axial")
DEFAULT_SECTION_UNITS = {"kip-ft": "in", "kN-m": "mm"}
DAYS_PER_YEAR = 365.0
"""Days of traffic a year (AASHTO LRFD Eq. 6.6.1.2.5-3 counts 365)."""


@dataclass(frozen=True)
class FatigueSettings:
    """The [fatigue] table.

    Attributes:
        source: the model file.
        standard: "AASHTO" or "EN".
        edition: edition year, or None for the latest.
        adtt: trucks a day, one direction, all lanes (None when not given).
        lane_fraction: p of (ADTT)SL = p x ADTT (None without adtt).
        design_life_years: [years].
        age_years: [years].
        gamma_Mf: EN partial factor on fatigue strength (None for AASHTO).
        gamma_Ff: EN partial factor on stress ranges (1.0 for AASHTO, unused).
        dynamic_allowance: fraction added to the stress ranges.
        units: the model's unit system, "kip-ft" or "kN-m".
        section_units: length unit of section properties.
    """

    source: str
    standard: str
    edition: int | None
    adtt: float | None
    lane_fraction: float | None
    design_life_years: float
    age_years: float
    gamma_Mf: float | None
    gamma_Ff: float
    dynamic_allowance: float
    units: str
    section_units: str

    @property
    def stress_unit(self) -> str:
        """"ksi" for kip-ft models, "MPa" for kN-m models."""
        return STRESS_OF_SYSTEM[self.units]

    @property
    def adtt_sl(self) -> float | None:
        """(ADTT)SL = p x ADTT [trucks a day in one lane], None without adtt."""
        if self.adtt is None or self.lane_fraction is None:
            return None
        return self.adtt * self.lane_fraction

    @property
    def passages_per_year(self) -> float | None:
        """365 x (ADTT)SL: passages a year of one truck standing for the traffic."""
        return None if self.adtt_sl is None else DAYS_PER_YEAR * self.adtt_sl


@dataclass(frozen=True)
class FatigueDetail:
    """One [[fatigue_detail]].

    Attributes:
        name: unique name.
        location: as the model's locations: chainage, node name or MEMBER@DISTANCE.
        response: "moment", "shear" or "axial".
        category: detail category of the standard.
        section_property: what turns the effect into a stress: ("section_modulus", S),
            ("inertia/distance", I / y) or ("area", A) [section_units^3 or ^2].
        stress_concentration: factor on the nominal stress.
        cycles_per_passage: n per crossing of the full range, or None for rainflow counts.
        stress_per_effect: stress per unit effect [ksi or MPa per kip-ft, kip, kN-m or kN],
            stress concentration included.
    """

    name: str
    location: str
    response: str
    category: str
    section_property: tuple[str, float]
    stress_concentration: float
    cycles_per_passage: float | None
    stress_per_effect: float


def fatigue_settings(document: dict[str, Any], source: str, units: str) -> FatigueSettings | None:
    """The [fatigue] table of a parsed model file (None when it has none).

    Args:
        document: the parsed TOML file.
        source: the file name, for errors.
        units: the model's unit system, "kip-ft" or "kN-m".

    Raises:
        ModelError: naming the file, key and fix.
    """
    if "fatigue" not in document:
        if document.get("fatigue_detail"):
            raise ModelError("fatigue details without a [fatigue] table", source=source,
                             item="fatigue", fix="add [fatigue] with standard = ...")
        return None
    given = document["fatigue"]
    if not isinstance(given, dict):
        raise ModelError("fatigue must be a table", source=source, item="fatigue",
                         fix="write [fatigue] with its keys below")
    _known_keys(given, SETTING_KEYS, "fatigue", source)
    if units not in DEFAULT_SECTION_UNITS:
        raise ModelError(f"unknown unit system {units!r}", source=source, item="units",
                         fix="use kip-ft or kN-m")
    standard = given.get("standard")
    if not isinstance(standard, str) or standard not in STANDARDS:
        raise ModelError(f"unknown standard {standard!r}", source=source,
                         item="fatigue.standard", fix="use " + " or ".join(STANDARDS))
    data = table(STANDARDS[standard])
    item = "fatigue."
    edition = given.get("edition")
    if edition is not None:
        if isinstance(edition, bool) or not isinstance(edition, int):
            raise ModelError(f"edition {edition!r} is not a year", source=source,
                             item=item + "edition", fix="write the edition's year, e.g. 2020")
        _within(source, item + "edition", lambda: edition_key(data, edition))
    adtt = _number(given, "adtt", None, source, item, minimum=0.0)
    fraction = _lane_fraction(given, adtt, standard, source)
    en = standard == "EN"
    if en and "gamma_Mf" not in given:
        raise ModelError("EN needs gamma_Mf", source=source, item=item + "gamma_Mf",
                         fix="give gamma_Mf (EN 1993-1-9 Table 3.1: 1.00 to 1.35)")
    for key in ("gamma_Mf", "gamma_Ff"):
        if not en and key in given:
            raise ModelError(f"{key} belongs to EN", source=source, item=item + key,
                             fix=f"remove {key} or use standard = \"EN\"")
    default_allowance = 0.0 if en else aashto.edition(edition)["dynamic_allowance"]
    section_units = given.get("section_units", DEFAULT_SECTION_UNITS[units])
    if not isinstance(section_units, str) or section_units not in LENGTH_M:
        raise ModelError(f"unknown section unit {section_units!r}", source=source,
                         item=item + "section_units", fix="use " + ", ".join(LENGTH_M))
    return FatigueSettings(
        source, standard, edition, adtt, fraction,
        _number(given, "design_life_years", float(data["standard"]["design_life_years"]),
                source, item, minimum=0.0, strict=True),
        _number(given, "age_years", 0.0, source, item, minimum=0.0),
        _number(given, "gamma_Mf", None, source, item, minimum=1.0) if en else None,
        _number(given, "gamma_Ff", 1.0, source, item, minimum=1.0) if en else 1.0,
        _number(given, "dynamic_allowance", float(default_allowance), source, item,
                minimum=0.0),
        units, section_units)


def fatigue_details(document: dict[str, Any], settings: FatigueSettings | None,
                    source: str) -> tuple[FatigueDetail, ...]:
    """The [[fatigue_detail]] entries of a parsed model file, checked against the settings.

    Raises:
        ModelError: naming the file, the detail and key, and the fix.
    """
    entries = document.get("fatigue_detail", [])
    if not entries:
        return ()
    if settings is None:
        raise ModelError("fatigue details without a [fatigue] table", source=source,
                         item="fatigue", fix="add [fatigue] with standard = ...")
    if not isinstance(entries, list) or not all(isinstance(e, dict) for e in entries):
        raise ModelError("fatigue_detail must be a list of tables", source=source,
                         item="fatigue_detail", fix="write each as [[fatigue_detail]]")
    details = tuple(_detail(entry, k, settings, source) for k, entry in enumerate(entries))
    names = [detail.name for detail in details]
    for name in names:
        if names.count(name) > 1:
            raise ModelError(f"two details named {name!r}", source=source,
                             item="fatigue_detail.name", fix="give each detail its own name")
    return details


def detail_resistance(detail: FatigueDetail, settings: FatigueSettings) -> Resistance:
    """The detail's curve with the settings' factors, in the settings' stress unit."""
    if settings.standard == "EN":
        assert settings.gamma_Mf is not None  # fatigue_settings requires it for EN
        return eurocode.en_resistance(
            detail.category, settings.gamma_Mf, settings.stress_unit, _en_stress(detail),
            settings.gamma_Ff, settings.dynamic_allowance, settings.edition)
    return aashto.aashto_resistance(detail.category, settings.stress_unit, settings.edition,
                                    settings.dynamic_allowance)


def _detail(entry: dict[str, Any], k: int, settings: FatigueSettings,
            source: str) -> FatigueDetail:
    name = entry.get("name")
    item = f"fatigue_detail {name!r}." if isinstance(name, str) and name else (
        f"fatigue_detail {k + 1}.")
    _known_keys(entry, DETAIL_KEYS, item.rstrip("."), source)
    if not isinstance(name, str) or not name.strip():
        raise ModelError("a detail without a name", source=source, item=item + "name",
                         fix="give name = \"...\"")
    location = entry.get("location")
    if isinstance(location, int | float) and not isinstance(location, bool):
        location = repr(float(location))
    if not isinstance(location, str) or not location.strip():
        raise ModelError(f"location {location!r} is not a location", source=source,
                         item=item + "location",
                         fix="give a chainage, a node name or MEMBER@DISTANCE")
    response = entry.get("response")
    if response not in RESPONSES:
        raise ModelError(f"unknown response {response!r}", source=source,
                         item=item + "response", fix="use " + ", ".join(RESPONSES))
    category = entry.get("category")
    if isinstance(category, int) and not isinstance(category, bool):
        category = str(category)  # EN categories may be written as numbers
    known = (aashto.categories() if settings.standard == "AASHTO" else
             eurocode.categories("shear" if response == "shear" else "normal", settings.edition))
    if category not in known:
        raise ModelError(f"unknown {settings.standard} detail category {category!r}",
                         source=source, item=item + "category", fix="use one of " +
                         ", ".join(known))
    prop, power = _section_property(entry, response, source, item)
    concentration = _number(entry, "stress_concentration", 1.0, source, item, minimum=0.0,
                            strict=True)
    cycles = _number(entry, "cycles_per_passage", None, source, item, minimum=0.0, strict=True)
    factor = stress_factor(settings.units, settings.section_units, settings.stress_unit, power)
    return FatigueDetail(name, location.strip(), response, category, prop, concentration, cycles,
                         factor * concentration / prop[1])


def _section_property(entry: dict[str, Any], response: str, source: str,
                      item: str) -> tuple[tuple[str, float], int]:
    """(name, value) of the property the effect is divided by, and its length power."""
    given = {key for key in ("section_modulus", "inertia", "distance", "area") if key in entry}
    if response == "moment":
        if given == {"section_modulus"}:
            value = _number(entry, "section_modulus", None, source, item, 0.0, strict=True)
            return ("section_modulus", value), 3
        if given == {"inertia", "distance"}:
            inertia = _number(entry, "inertia", None, source, item, 0.0, strict=True)
            distance = _number(entry, "distance", None, source, item, 0.0, strict=True)
            return ("inertia/distance", inertia / distance), 3
        raise ModelError(f"moment detail with {sorted(given) or 'no section property'}",
                         source=source, item=item + "section_modulus",
                         fix="give section_modulus, or inertia and distance")
    if given != {"area"}:
        raise ModelError(f"{response} detail with {sorted(given) or 'no section property'}",
                         source=source, item=item + "area",
                         fix=f"give area, the area carrying the {response} force")
    return ("area", _number(entry, "area", None, source, item, 0.0, strict=True)), 2


def _en_stress(detail: FatigueDetail) -> eurocode.StressKind:
    return "shear" if detail.response == "shear" else "normal"


def _lane_fraction(given: dict[str, Any], adtt: float | None, standard: str,
                   source: str) -> float | None:
    if "lanes" in given and "p" in given:
        raise ModelError("both lanes and p", source=source, item="fatigue.p",
                         fix="give lanes or p, not both")
    if "lanes" in given:
        if standard != "AASHTO":
            raise ModelError("lanes gives p by the AASHTO table", source=source,
                             item="fatigue.lanes", fix="give p, the single-lane fraction")
        lanes = given["lanes"]
        return _within(source, "fatigue.lanes", lambda: aashto.lane_fraction(lanes))
    if "p" in given:
        p = _number(given, "p", None, source, "fatigue.", minimum=0.0, strict=True)
        if p > 1.0:
            raise ModelError(f"p = {p} is more than 1", source=source, item="fatigue.p",
                             fix="give the single-lane fraction, at most 1")
        return p
    if adtt is not None:
        fix = "give lanes (available to trucks) or p" if standard == "AASHTO" else "give p"
        raise ModelError("adtt without lanes or p", source=source, item="fatigue.adtt", fix=fix)
    return None


def _within(source: str, item: str, read: Any) -> Any:
    """``read()``, with its error's file and key set to ours."""
    try:
        return read()
    except ModelError as error:
        raise ModelError(error.problem, source=source, item=item, fix=error.fix) from None


def _number(table: dict[str, Any], key: str, default: float | None, source: str, item: str,
            minimum: float, strict: bool = False) -> Any:
    """table[key] as a float at least (or, if strict, above) ``minimum``; ``default`` if
    absent (callers check required keys first)."""
    if key not in table:
        return default
    value = table[key]
    if isinstance(value, bool) or not isinstance(value, int | float) or not math.isfinite(value):
        raise ModelError(f"{key} = {value!r} is not a number", source=source, item=item + key,
                         fix="write a plain number")
    if value < minimum or (strict and value == minimum):
        bound = "above" if strict else "at least"
        raise ModelError(f"{key} = {value} is out of range", source=source, item=item + key,
                         fix=f"give a value {bound} {minimum:g}")
    return float(value)


def _known_keys(table: dict[str, Any], allowed: set[str], item: str, source: str) -> None:
    for key in table:
        if key not in allowed:
            raise ModelError(f"unknown key {key!r}", source=source, item=f"{item}.{key}",
                             fix="allowed keys: " + ", ".join(sorted(allowed)))
