"""One section rated as the ``[rating]`` settings ask: factors looked up, then the equation.

This is the join between the settings, a section's capacity and its effects: it picks the load
factors of the method, level and limit state (MBE tables by edition and ADTT), the dynamic
allowance (the rules, or the settings' override), the condition and system factors, and the
distribution factor for the level (the one-lane factor without the 1.2 for special permits,
the several-lane factor for routine permits, the governing factor otherwise).

Example (steel, legal level, MBE 2nd edition, ADTT 1000: gL = 1.30):
    >>> from influence.rating.capacity import Capacity
    >>> from influence.rating.settings import rating_settings
    >>> settings = rating_settings({"rating": {"material": "steel", "adtt": 1000}}, "kip-ft")
    >>> capacity = Capacity("moment", "positive", 3000.0, 1.0, start=0.0, end=40.0)
    >>> effects = SectionEffects("positive", dead_components=1000.0, live=500.0)
    >>> result = rate_section(settings, capacity, effects, level="legal",
    ...                       limit_state="Strength I", span_length=40.0, units="kip-ft")
    >>> result.live_factor, result.impact, round(result.rating_factor, 4)  # 1750/(1.3 x 665)
    (1.3, 0.33, 2.0243)
    >>> rate_section(settings, capacity, effects, level="legal", limit_state="Service II",
    ...              span_length=40.0, units="kip-ft") is None     # no service capacity given
    True
"""

from __future__ import annotations

from influence.errors import ModelError
from influence.rating.capacity import Capacity
from influence.rating.distribution import permit_distribution
from influence.rating.equations import lfr_rating, lrfr_rating, lrfr_service_rating
from influence.rating.impact import lfr_impact, lrfr_impact
from influence.rating.live_factors import (
    PermitCrossing,
    legal_live_load_factor,
    permit_live_load_factor,
)
from influence.rating.load_factors import (
    LimitStateFactors,
    allowable_factors,
    limit_state_factors,
)
from influence.rating.result import RatingResult, SectionEffects
from influence.rating.settings import RatingSettings


def distribution_for(settings: RatingSettings, response: str, level: str) -> float:
    """Lanes per girder for a response at a rating level (1.0 when none is set).

    Raises:
        ModelError: at the permit level without a permit in the settings.
    """
    value = settings.distribution
    if value is None:
        return 1.0
    if isinstance(value, float):
        return value
    factors = value.factors(response)
    if level == "permit":
        return permit_distribution(factors, _permit(settings).kind)
    return factors.governing


def _permit(settings: RatingSettings) -> PermitCrossing:
    if settings.permit is None:
        raise ModelError("the permit level needs a permit", item="rating.permit",
                         fix="describe it in [rating.permit]")
    return settings.permit


def _factors(settings: RatingSettings, level: str,
             limit_state: str) -> tuple[LimitStateFactors, float]:
    """The limit state's row of the MBE table and its live-load factor."""
    if settings.material is None:
        raise ModelError("LRFR needs the bridge material", item="rating.material",
                         fix="add material to [rating]")
    row = limit_state_factors(settings.material, level, limit_state,
                              overlay_measured=settings.overlay_measured)
    if row.live is not None:
        return row, row.live
    if row.live_table == "legal table":
        return row, legal_live_load_factor(settings.edition, settings.adtt).factor
    return row, permit_live_load_factor(settings.edition, _permit(settings),
                                        settings.adtt).factor


def rate_section(settings: RatingSettings, capacity: Capacity, effects: SectionEffects, *,
                 level: str, span_length: float, units: str,
                 limit_state: str = "") -> RatingResult | None:
    """The rating factor of one section, response and sense at one level and limit state.

    Args:
        settings: the ``[rating]`` settings.
        capacity: the capacity that applies at the section (see ``capacity_at``).
        effects: the section's effects in the capacity's sense, with the distribution factor
            already applied or set in ``effects.distribution``.
        level: rating level of the method.
        span_length: span for the dynamic allowance rules [length of ``units``].
        units: "kip-ft" or "kN-m".
        limit_state: LRFR limit state ("" for LFR and ASR).

    Returns:
        The result, or None when the capacity has no value for this check (a service limit
        state without ``service``, an ASR level without ``allowable``): "not rated".

    Raises:
        ModelError: when the capacity's sense differs from the effects', or a factor cannot be
            found (unknown level or limit state, permit level without a permit).
    """
    if capacity.sense != effects.sense:
        raise ModelError(f"a {capacity.sense} capacity with {effects.sense} effects",
                         item=capacity.label, fix="rate each sense with its own capacity")
    if settings.method == "LRFR":
        return _lrfr(settings, capacity, effects, level, limit_state, span_length, units)
    impact = settings.impact
    if impact is None:
        impact = lfr_impact(span_length, units).fraction
    factors = allowable_factors(settings.method, level)
    value = capacity.allowable_at(level) if settings.method == "ASR" else capacity.factored
    if value is None:
        return None
    return lfr_rating(effects, capacity=value, dead_factor=factors.dead,
                      live_factor=factors.live, impact=impact, level=level,
                      method=settings.method)


def _lrfr(settings: RatingSettings, capacity: Capacity, effects: SectionEffects, level: str,
          limit_state: str, span_length: float, units: str) -> RatingResult | None:
    row, live_factor = _factors(settings, level, limit_state)
    impact = settings.impact
    if impact is None:
        surface = "standard" if level.startswith("design") else settings.surface
        impact = lrfr_impact(level, span_length, units, surface=surface).fraction
    if row.capacity == "service":
        if capacity.service is None:
            return None
        return lrfr_service_rating(
            effects, service_capacity=capacity.service, live_factor=live_factor, impact=impact,
            dead_components_factor=row.dead_components, dead_wearing_factor=row.dead_wearing,
            limit_state=limit_state, level=level)
    if capacity.nominal is None:
        return None
    return lrfr_rating(
        effects, nominal=capacity.nominal, resistance_factor=capacity.resistance_factor,
        dead_components_factor=row.dead_components, dead_wearing_factor=row.dead_wearing,
        live_factor=live_factor, impact=impact, condition_factor=settings.condition_factor,
        system_factor=settings.system_factor_for(capacity.response), limit_state=limit_state,
        level=level)
