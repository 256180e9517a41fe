"""The factors of a rating with where each came from, in words for the outputs: the
distribution factor and the live-load factor.

Distribution (lanes per girder): the ``[rating]`` number as given; or the AASHTO LRFD 4.6.2.2
factors of the girder geometry, the larger of one lane and two or more for the design and legal
levels; for permits, special permits take the one-lane factor with the 1.2 multiple presence
factor divided out and routine permits the factor for two or more lanes (confirmed, NCHRP
20-07/Task 285 project statement). A number given in ``[rating]`` is used for permits too: it
is the engineer's own.

Example:
    >>> from influence.rating.settings import rating_settings
    >>> settings = rating_settings({"rating": {"material": "steel", "adtt": 1000,
    ...                                        "distribution": 0.62}}, "kip-ft")
    >>> distribution_basis(settings, "moment", permit=False)
    (0.62, '0.62 lanes per girder as [rating] gives it')
    >>> live_factor_basis(settings, "legal", "Strength I").split(":")[0]
    '1.3'
"""

from __future__ import annotations

from influence.rating.distribution import permit_distribution
from influence.rating.live_factors import legal_live_load_factor, permit_live_load_factor
from influence.rating.load_factors import allowable_factors, limit_state_factors
from influence.rating.settings import RatingSettings

NO_DISTRIBUTION = ("1: the effects are those of the girder line modelled (no distribution in "
                   "[rating])")


def distribution_basis(settings: RatingSettings, response: str, permit: bool,
                       live_scale: float = 1.0) -> tuple[float, str]:
    """Lanes per girder for a response, and how they were found.

    Args:
        settings: the ``[rating]`` settings.
        response: "moment", "shear" or "axial" (axial takes the moment factors).
        permit: whether the permit's distribution rule applies (a permit level).
        live_scale: the model file's ``[live_load]`` distribution x multiple presence, used
            when ``[rating]`` gives none [-].
    """
    value = settings.distribution
    if value is None:
        if live_scale == 1.0:
            return 1.0, NO_DISTRIBUTION
        return live_scale, (f"{live_scale:g} lanes per girder: [live_load] distribution x "
                            "multiple presence (no distribution in [rating])")
    if isinstance(value, float):
        return value, f"{value:g} lanes per girder as [rating] gives it"
    factors = value.factors(response)
    formulas = "; ".join(factors.basis)
    several = "-" if factors.several_lanes is None else f"{factors.several_lanes:.4g}"
    if permit and settings.permit is not None:
        g = permit_distribution(factors, settings.permit.kind)
        rule = (f"special permit: one-lane factor {factors.one_lane:.4g} / 1.2 = {g:.4g}, the "
                "multiple presence factor divided out" if settings.permit.kind == "special" else
                f"routine permit: the factor for two or more lanes, {g:.4g}")
        return g, f"{rule} (NCHRP 20-07/Task 285, confirmed); {formulas}"
    g = factors.governing
    return g, (f"LRFD 4.6.2.2 {factors.girder} girder, {factors.response}: one lane "
               f"{factors.one_lane:.4g}, two or more {several}, the larger {g:.4g}; {formulas}")


def live_factor_basis(settings: RatingSettings, level: str, limit_state: str) -> str:
    """The live-load factor (gL, or A2 for LFR and ASR) with its table entry and mark."""
    if settings.method != "LRFR":
        factors = allowable_factors(settings.method, level)
        return (f"{factors.live:g}: A2 at {level}, with A1 = {factors.dead:g} "
                f"({factors.mark})")
    assert settings.material is not None
    row = limit_state_factors(settings.material, level, limit_state,
                              overlay_measured=settings.overlay_measured)
    if row.live is not None:
        return f"{row.live:g}: {limit_state} at {level}, {settings.material} ({row.mark})"
    if row.live_table == "legal table":
        found = legal_live_load_factor(settings.edition, settings.adtt)
    else:
        assert settings.permit is not None
        found = permit_live_load_factor(settings.edition, settings.permit, settings.adtt)
    return f"{found.factor:g}: {found.basis} ({found.mark})"
