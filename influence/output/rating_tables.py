"""Tables and JSON documents of a rating run and a permit check, with the usual header.

Every output opens with the title, units, sign conventions and the caution, then the rating's
basis (method, edition, traffic), the confidence of the rating vehicles' data and the notes of
the run. Values are in the model's units; moments and shears rated in a sense are shown as
magnitudes in that sense (the rating equation's terms), signed effects where the column says
"signed".
"""

from __future__ import annotations

from typing import Any

from influence.output.conventions import effect_unit, header_lines
from influence.output.governing_tables import placement_fields
from influence.output.tables import Table
from influence.rating.permit_check import PermitCheck
from influence.rating.ratings import Ratings, SectionRating
from influence.rating.tables import POSTING_FILE, data_file
from vehicles.units import labels

MEMORY_NOTE = ("Legal and rating vehicles' axle data are from memory, unconfirmed against the "
               "standard, where the vehicles' notes say so: check them before use.")


def rating_header(ratings: Ratings, what: str, notes: bool = True) -> list[str]:
    """The lines that open every rating output; the run's notes in full, or (``notes`` False,
    for the tables that follow the summary) a pointer to them."""
    s = ratings.settings
    basis = (f"Rating: {s.method}, {s.edition}, ADTT "
             + ("unknown" if s.adtt is None else f"{s.adtt:g}")
             + (f", {s.material}" if s.material else "")
             + f"; levels {', '.join(ratings.levels)}.")
    return [*header_lines(f"{ratings.title}: {what}", ratings.units), basis,
            "Rating factors are magnitudes in the sense rated (positive: sagging moment, "
            "positive shear, tension; negative: hogging moment, negative shear, compression); "
            "inf: the vehicle does not load the section in that sense.",
            MEMORY_NOTE, *((f"Note: {n}" for n in ratings.notes) if notes else
                           ("Notes on the vehicles and allowances: see the summary.",))]


def _where(r: SectionRating) -> str:
    p = r.live.placement
    return (f"{p.case}, {p.direction}, lead axle at {p.lead_position:.6g}"
            + ("" if p.section_axle is None else f", axle {p.section_axle + 1} over the section"))


def _unit(r: SectionRating, units: str) -> str:
    return effect_unit(r.response, units)


def rating_fields(r: SectionRating, method: str) -> dict[str, Any]:
    """One rating as plain data: the issue's fields, then the details that trace them."""
    result, c = r.result, r.capacity
    section = r.rated.section
    entry: dict[str, Any] = {
        "section": r.section, "chainage": r.chainage, "response": r.response,
        "sense": r.sense, "vehicle": r.vehicle, "level": r.level, "method": method,
        "limit_state": r.limit_state, "rating_factor": r.rating_factor,
        "capacity": result.capacity,
        "dead": dict(r.rated.dead),
        "live": r.live_with_impact,
        "live_load_factor": result.live_factor,
        "placement": placement_fields(r.live.placement),
        "side": section.side, "span": section.span,
        "capacity_detail": {
            "entry": c.label, "nominal": c.nominal, "service": c.service,
            "allowable": dict(c.allowable), "resistance_factor": result.resistance_factor,
            "condition_factor": result.condition_factor,
            "system_factor": result.system_factor, "member_factor": result.member_factor,
            "member_factor_floor_applied": result.floor_applied},
        "dead_terms": dict(r.dead_terms),
        "dead_factored": [{"term": t.name, "factor": t.factor, "effect": t.effect}
                          for t in result.dead],
        "live_detail": {
            "vehicle_static": r.live.vehicle, "lane": r.live.lane,
            "impact": result.impact, "impact_basis": r.impact.basis, "impact_mark": r.impact.mark,
            "distribution": result.effects.distribution,
            "distribution_basis": r.distribution_basis,
            "span_length": r.rated.span_length, "span_basis": r.rated.span_basis},
        "live_load_factor_basis": r.live_factor_basis,
        "arithmetic": result.arithmetic(),
        "notes": list(result.notes),
    }
    if r.concurrent_moment is not None:
        entry["concurrent_moment"] = {"live": r.concurrent_moment.live,
                                      "dead": dict(r.concurrent_moment.dead)}
    return entry


def _summary_fields(r: SectionRating) -> dict[str, Any]:
    return {"vehicle": r.vehicle, "level": r.level, "rating_factor": r.rating_factor,
            "section": r.section, "chainage": r.chainage, "response": r.response,
            "sense": r.sense, "limit_state": r.limit_state,
            "why": f"{_where(r)}; {r.result.arithmetic()}",
            "placement": placement_fields(r.live.placement)}


def postings_fields(ratings: Ratings) -> dict[str, Any]:
    """The postings as plain data (weights and loads in tons of 2000 lb, EV limits in kip)."""
    p = ratings.postings
    single = p.single_unit
    ev = p.emergency
    return {
        "level": p.level,
        "legal": [{"vehicle": v.vehicle, "weight_tons": v.weight_tons,
                   "weight_basis": v.weight_basis, "rating_factor": v.posting.rating_factor,
                   "rating_tons": v.posting.rating, "action": v.posting.action,
                   "posting_load_tons": v.posting.load,
                   "exact_posting_load_tons": v.posting.exact_load,
                   "governing": {"section": v.governing.section, "response": v.governing.response,
                                 "sense": v.governing.sense,
                                 "limit_state": v.governing.limit_state},
                   "mark": v.posting.mark} for v in p.legal],
        "single_unit": None if single is None else {
            "screening_vehicle": "NRL", "screening_factor": single.screening_factor,
            "screened_out": single.screened_out,
            "postings": [{"vehicle": name, "rating_factor": q.rating_factor,
                          "weight_tons": q.weight, "rating_tons": q.rating, "action": q.action,
                          "posting_load_tons": q.load} for name, q in single.postings],
            "mark": single.mark},
        "emergency_vehicles": None if ev is None else {
            "posted": ev.posted, "single_axle_kip": ev.single_axle_kip,
            "tandem_kip": ev.tandem_kip, "gross_kip": ev.gross_kip, "mark": ev.mark},
        "notes": list(p.notes),
    }


def rating_document(ratings: Ratings) -> dict[str, Any]:
    """The whole run as JSON-ready data: ``ratings``, ``summary``, ``postings`` and the rest."""
    s = ratings.settings
    names = labels(ratings.units)
    return {
        "title": ratings.title,
        "units": {"force": names.force, "length": names.length, "moment": names.moment},
        "conventions": rating_header(ratings, "load rating")[1:],
        "method": s.method, "edition": s.edition, "adtt": s.adtt, "material": s.material,
        "levels": list(ratings.levels),
        "vehicles": [{"name": v.name, "category": v.category, "levels": list(v.levels),
                      "gross_weight_tons": v.gross_weight_tons, "standard": v.standard,
                      "notes": list(v.notes)} for v in ratings.vehicles],
        "ratings": [rating_fields(r, s.method) for r in ratings.ratings],
        "summary": [_summary_fields(r) for r in ratings.summary()],
        "postings": postings_fields(ratings),
        "not_rated": [{"section": n.section, "chainage": n.chainage, "response": n.response,
                       "side": n.side, "sense": n.sense, "level": n.level,
                       "limit_state": n.limit_state, "reason": n.reason}
                      for n in ratings.not_rated],
        "notes": list(ratings.notes),
    }


def summary_table(ratings: Ratings) -> Table:
    """The lowest factor of each vehicle at each level, where and why."""
    columns = ("vehicle", "level", "limit state", "RF [-]", "section",
               f"chainage [{labels(ratings.units).length}]", "response", "sense",
               "governing position", "arithmetic (magnitudes in the sense)")
    rows = [(r.vehicle, r.level, r.limit_state or "-", r.rating_factor, r.section,
             "-" if r.chainage is None else r.chainage, r.response, r.sense, _where(r),
             r.result.arithmetic()) for r in ratings.summary()]
    return Table(rating_header(ratings, "lowest rating factor per vehicle and level"), columns,
                 rows)


def ratings_table(ratings: Ratings) -> Table:
    """Every rating factor with the terms of its equation."""
    length = labels(ratings.units).length
    columns = ("section", f"chainage [{length}]", "response", "sense", "vehicle", "level",
               "limit state", "RF [-]", "C", "factored dead", "LL+IM (after distribution)",
               "gL [-]", "IM [-]", "distribution [lanes]", "unit", "governing position")
    rows = [(r.section, "-" if r.chainage is None else r.chainage, r.response, r.sense,
             r.vehicle, r.level, r.limit_state or "-", r.rating_factor, r.result.capacity,
             r.result.factored_dead, r.live_with_impact, r.result.live_factor, r.result.impact,
             r.result.effects.distribution, _unit(r, ratings.units), _where(r))
            for r in ratings.ratings]
    header = rating_header(ratings, "rating factors", notes=False)
    header.append("C: capacity in the sense (phi_c phi_s phi Rn, f_R or the allowable effect); "
                  "factored dead: the sum of the factored permanent terms; LL+IM: the vehicle "
                  "with its allowance plus the lane load, times the distribution factor.")
    return Table(header, columns, rows)


def _governing(ratings: Ratings, vehicle: str, level: str) -> str:
    low = ratings.lowest(vehicle, level)
    return "-" if low is None else f"{low.section} {low.response} {low.sense}"


def postings_table(ratings: Ratings) -> Table:
    """Postings per legal vehicle, the single-unit screening and the emergency-vehicle limits."""
    p = ratings.postings
    rows: list[tuple[Any, ...]] = []
    for v in p.legal:
        q = v.posting
        rows.append((v.vehicle, "legal", q.rating_factor, v.weight_tons, q.rating, q.action,
                     "-" if q.load is None else q.load, _governing(ratings, v.vehicle, p.level)))
    if p.single_unit is not None:
        su = p.single_unit
        rows.append(("NRL", "screening", su.screening_factor, "-", "-",
                     "SU4-SU7 need no posting" if su.screened_out else "rate SU4-SU7", "-",
                     _governing(ratings, "NRL", p.level)))
        for name, q in su.postings:
            rows.append((name, "single unit", q.rating_factor, q.weight, q.rating, q.action,
                         "-" if q.load is None else q.load, _governing(ratings, name, p.level)))
    if p.emergency is not None:
        ev = p.emergency
        text = ("no EV posting" if not ev.posted else
                f"single axle {ev.single_axle_kip:g} kip, tandem {ev.tandem_kip:g} kip, "
                f"gross {ev.gross_kip:g} kip")
        rows.append(("EV2, EV3", "emergency", "-", "-", "-", text, "-", "-"))
    header = rating_header(ratings, f"postings (from the {p.level} level)", notes=False)
    header += [f"Posting law: {data_file(POSTING_FILE)['law']['mark']}.",
               "RT = RF x W; posted load W/0.7 (RF - 0.3) for 0.3 <= RF < 1.0, rounded down to "
               "the sign increment; below 0.3 consider closing. W and loads in tons of 2000 lb; "
               "the factor of each vehicle is its lowest over every section, response, sense "
               "and limit state at the posting level."]
    header += [f"Note: {n}" for n in p.notes]
    return Table(header, ("vehicle", "kind", "RF [-]", "W [ton]", "RT [ton]", "action",
                          "posted load [ton]", "governing"), rows)


def not_rated_table(ratings: Ratings) -> Table:
    """Sections, responses and senses (or checks) without a rating factor, and why."""
    length = labels(ratings.units).length
    rows = [(n.section, "-" if n.chainage is None else n.chainage, n.response, n.side, n.sense,
             n.level or "-", n.limit_state or "-", n.reason) for n in ratings.not_rated]
    return Table(rating_header(ratings, "not rated", notes=False), (
        "section", f"chainage [{length}]", "response", "side", "sense", "level", "limit state",
        "reason"), rows)


def permit_table(check: PermitCheck) -> Table:
    """PASS or FAIL at each rated section, the overall verdict and the restrictions assumed."""
    ratings = check.ratings
    length = labels(ratings.units).length
    governing = check.governing
    header = rating_header(ratings, f"permit check of {check.vehicle} "
                                    f"({check.gross_weight_tons:.4g} tons)")
    header.append(f"Overall: {check.verdict}" + ("" if governing is None else (
        f"; governing section {governing.section}, RF {governing.rating_factor:.4g} "
        f"({governing.governing.response} {governing.governing.sense}, "
        f"{governing.governing.limit_state or check.level}), {_where(governing.governing)}")))
    header += [f"Restriction assumed: {text}" for text in check.restrictions]
    rows = [(v.section, "-" if v.chainage is None else v.chainage, v.rating_factor,
             "PASS" if v.passes else "FAIL", v.governing.response, v.governing.sense,
             v.governing.limit_state or check.level, _where(v.governing),
             v.governing.result.arithmetic()) for v in check.sections]
    return Table(header, ("section", f"chainage [{length}]", "RF [-]", "result", "response",
                          "sense", "limit state", "governing position", "arithmetic"), rows)


def permit_document(check: PermitCheck) -> dict[str, Any]:
    """The permit check as JSON-ready data."""
    ratings = check.ratings
    governing = check.governing
    document = rating_document(ratings)
    document.pop("summary")
    document.pop("postings")
    return {
        "verdict": check.verdict,
        "vehicle": check.vehicle, "gross_weight_tons": check.gross_weight_tons,
        "crossing": {"type": check.crossing.kind, "frequency": check.crossing.frequency,
                     "loading": check.crossing.loading, "crawl": check.crawl},
        "level": check.level,
        "restrictions": list(check.restrictions),
        "governing": None if governing is None else {
            "section": governing.section, "chainage": governing.chainage,
            "rating_factor": governing.rating_factor,
            "response": governing.governing.response, "sense": governing.governing.sense,
            "limit_state": governing.governing.limit_state,
            "placement": placement_fields(governing.governing.live.placement)},
        "sections": [{"section": v.section, "chainage": v.chainage,
                      "rating_factor": v.rating_factor,
                      "result": "PASS" if v.passes else "FAIL",
                      "response": v.governing.response, "sense": v.governing.sense,
                      "limit_state": v.governing.limit_state,
                      "placement": placement_fields(v.governing.live.placement)}
                     for v in check.sections],
        **document,
    }


def rating_report_tables(ratings: Ratings) -> list[tuple[str, Table]]:
    """The rating pages' tables, titled, in page order: the lowest factors, the postings, every
    factor, and what was not rated (content for the report; the report module lays it out)."""
    pages = [("Load rating: lowest factor per vehicle and level", summary_table(ratings)),
             ("Load rating: postings", postings_table(ratings)),
             ("Load rating: every factor", ratings_table(ratings))]
    if ratings.not_rated:
        pages.append(("Load rating: not rated", not_rated_table(ratings)))
    return pages
