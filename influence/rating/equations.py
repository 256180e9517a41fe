"""Rating equations on plain numbers: LRFR strength and service, LFR, ASR.

LRFR (MBE 6A.4.2.1; the form and the phi_c phi_s >= 0.85 limit confirmed by M. A. Khan, *Bridge
and Highway Structure Rehabilitation and Repair*, McGraw-Hill 2010, ch. 5 p. 187)::

    RF = (C - gDC DC - gDW DW -/+ gP P) / (gL (LL + IM))
    strength: C = phi_c phi_s phi Rn, phi_c phi_s >= 0.85;  service: C = f_R

LFR and ASR (MBE 6B.4.1)::

    RF = (C - A1 D) / (A2 L (1 + I))

Every value is taken in the magnitude of the section's sense (see
:mod:`influence.rating.result`), so the permanent terms are subtracted with their own signs:
the adverse sign of +/- gP P follows from P's sign at the section. A permanent effect that
relieves the sense is credited with the same factor unless ``relieving_factor`` is given (the
MBE table gives one factor per load; 1.0 or 0.0 are cautious choices), and the result says so.

Example (the arithmetic of tests/test_rating_equations.py):
    >>> effects = SectionEffects("positive", dead_components=1200.0, dead_wearing=300.0,
    ...                          live=1000.0, lane=400.0, distribution=0.6)
    >>> result = lrfr_rating(effects, nominal=5000.0, resistance_factor=1.0,
    ...                      dead_components_factor=1.25, dead_wearing_factor=1.5,
    ...                      live_factor=1.75, impact=0.33, condition_factor=0.95)
    >>> round(result.rating_factor, 6)    # (4750 - 1500 - 450) / (1.75 x 0.6 x 1730)
    1.541426
    >>> print(result.arithmetic())
    RF = (4750 - 1.25 x 1200 - 1.5 x 300) / (1.75 x (0.6 x (1000 x 1.33 + 400))) = 1.541
    >>> lrfr_rating(SectionEffects("positive", live=-5.0), nominal=10.0, resistance_factor=1.0,
    ...             dead_components_factor=1.25, dead_wearing_factor=1.5, live_factor=1.75,
    ...             impact=0.33).rating_factor      # the vehicle does not load this sense
    inf
"""

from __future__ import annotations

import math

from influence.errors import ModelError
from influence.rating.load_factors import allowable_factors
from influence.rating.member_factors import combined_member_factor
from influence.rating.result import FactoredTerm, RatingResult, SectionEffects


def _capacity_in_sense(effects: SectionEffects, value: float, what: str) -> float:
    magnitude = effects.in_sense(value)
    if not magnitude > 0.0:
        raise ModelError(
            f"{what} {value:g} has the wrong sign for the {effects.sense} sense",
            item="capacity",
            fix="give positive capacities for the positive sense and negative ones for the "
                "negative sense")
    return magnitude


def _positive_factor(value: float, what: str) -> None:
    if not value > 0.0:
        raise ModelError(f"{what} {value!r}", item=what, fix="give a factor greater than 0")


def _dead_terms(effects: SectionEffects, factors: tuple[tuple[str, float, float], ...],
                relieving_factor: float | None) -> tuple[FactoredTerm, ...]:
    terms = []
    for name, factor, value in factors:
        effect = effects.in_sense(value)
        if effect == 0.0:
            continue
        used = relieving_factor if (effect < 0.0 and relieving_factor is not None) else factor
        terms.append(FactoredTerm(name, used, effect))
    return tuple(terms)


def _rating_factor(capacity: float, dead: tuple[FactoredTerm, ...], live_factor: float,
                   impact: float, effects: SectionEffects) -> float:
    live = effects.distribution * (effects.signed_live * (1.0 + impact)
                                   + effects.in_sense(effects.lane))
    if not live > 0.0:
        return math.inf
    return (capacity - math.fsum(t.value for t in dead)) / (live_factor * live)


def _notes(dead: tuple[FactoredTerm, ...], effects: SectionEffects,
           floor_applied: bool, product: float) -> tuple[str, ...]:
    notes = []
    if floor_applied:
        notes.append(f"phi_c phi_s = {product:.4g} raised to the lower limit 0.85")
    notes += [f"{t.name} relieves the {effects.sense} sense (factor {t.factor:g})"
              for t in dead if t.relieving]
    if effects.distribution * (effects.signed_live + effects.in_sense(effects.lane)) <= 0.0:
        notes.append(f"the live load does not act in the {effects.sense} sense: not governing")
    return tuple(notes)


def lrfr_rating(effects: SectionEffects, *, nominal: float, resistance_factor: float,
                dead_components_factor: float, dead_wearing_factor: float, live_factor: float,
                impact: float, condition_factor: float = 1.0, system_factor: float = 1.0,
                permanent_factor: float = 1.0, relieving_factor: float | None = None,
                limit_state: str = "Strength I",
                level: str = "design inventory") -> RatingResult:
    """LRFR rating factor at a strength limit state, C = phi_c phi_s phi Rn.

    Args:
        effects: the section's effects and sense.
        nominal: nominal resistance Rn, signed like the sense [force or force x length].
        resistance_factor: phi [-].
        dead_components_factor: gDC [-].
        dead_wearing_factor: gDW [-].
        live_factor: gL [-].
        impact: IM as a fraction of the vehicle effect [-].
        condition_factor: phi_c [-].
        system_factor: phi_s [-].
        permanent_factor: gP [-].
        relieving_factor: load factor on permanent effects that relieve the sense (None: the
            same factors).
        limit_state: name for the result.
        level: rating level for the result.

    Raises:
        ModelError: for a capacity of the wrong sign or a factor that is not positive.
    """
    for value, what in ((resistance_factor, "resistance_factor"),
                        (condition_factor, "condition_factor"), (system_factor, "system_factor"),
                        (live_factor, "live_factor")):
        _positive_factor(value, what)
    rn = _capacity_in_sense(effects, nominal, "nominal resistance")
    member, floor_applied = combined_member_factor(condition_factor, system_factor)
    capacity = member * resistance_factor * rn
    dead = _dead_terms(effects, (("DC", dead_components_factor, effects.dead_components),
                                 ("DW", dead_wearing_factor, effects.dead_wearing),
                                 ("P", permanent_factor, effects.permanent)), relieving_factor)
    return RatingResult(
        "LRFR", level, limit_state, effects.sense, capacity, rn, resistance_factor,
        condition_factor, system_factor, member, floor_applied, dead, live_factor, impact,
        effects, _rating_factor(capacity, dead, live_factor, impact, effects),
        _notes(dead, effects, floor_applied, condition_factor * system_factor))


def lrfr_service_rating(effects: SectionEffects, *, service_capacity: float, live_factor: float,
                        impact: float, dead_components_factor: float = 1.0,
                        dead_wearing_factor: float = 1.0, permanent_factor: float = 1.0,
                        relieving_factor: float | None = None, limit_state: str = "Service II",
                        level: str = "design inventory") -> RatingResult:
    """LRFR rating factor at a service limit state, C = f_R.

    Effects and f_R must be in the same terms: both stresses, or both the effects (moment,
    force) that produce the allowable stress.

    Args:
        effects: the section's effects and sense.
        service_capacity: f_R, signed like the sense [as the effects].
        live_factor: gL [-].
        impact: IM [-].
        dead_components_factor, dead_wearing_factor, permanent_factor: 1.0 at the service
            limit states (MBE Table 6A.4.2.2-1, from memory, unconfirmed).
        relieving_factor: as for :func:`lrfr_rating`.
        limit_state, level: names for the result.

    Raises:
        ModelError: for a capacity of the wrong sign.
    """
    _positive_factor(live_factor, "live_factor")
    capacity = _capacity_in_sense(effects, service_capacity, "service capacity")
    dead = _dead_terms(effects, (("DC", dead_components_factor, effects.dead_components),
                                 ("DW", dead_wearing_factor, effects.dead_wearing),
                                 ("P", permanent_factor, effects.permanent)), relieving_factor)
    return RatingResult(
        "LRFR", level, limit_state, effects.sense, capacity, capacity, 1.0, 1.0, 1.0, 1.0,
        False, dead, live_factor, impact, effects,
        _rating_factor(capacity, dead, live_factor, impact, effects),
        _notes(dead, effects, False, 1.0))


def lfr_rating(effects: SectionEffects, *, capacity: float, dead_factor: float,
               live_factor: float, impact: float, level: str = "inventory",
               method: str = "LFR", relieving_factor: float | None = None) -> RatingResult:
    """LFR (or ASR) rating factor, RF = (C - A1 D) / (A2 L (1 + I)).

    D is DC + DW with A1; permanent effects P enter with factor 1.0 (common practice).

    Args:
        effects: the section's effects and sense.
        capacity: C, signed like the sense: phi Rn for LFR, the allowable effect for ASR.
        dead_factor: A1 [-].
        live_factor: A2 [-].
        impact: I [-].
        level: "inventory" or "operating", for the result.
        method: "LFR" or "ASR", for the result.
        relieving_factor: load factor on dead effects that relieve the sense (None: A1).

    Raises:
        ModelError: for a capacity of the wrong sign.
    """
    _positive_factor(live_factor, "live_factor")
    c = _capacity_in_sense(effects, capacity, "capacity")
    dead = _dead_terms(effects, (("D", dead_factor,
                                  effects.dead_components + effects.dead_wearing),
                                 ("P", 1.0, effects.permanent)), relieving_factor)
    return RatingResult(
        method, level, "", effects.sense, c, c, 1.0, 1.0, 1.0, 1.0, False, dead, live_factor,
        impact, effects, _rating_factor(c, dead, live_factor, impact, effects),
        _notes(dead, effects, False, 1.0))


def asr_rating(effects: SectionEffects, *, allowable: float, impact: float,
               level: str = "inventory") -> RatingResult:
    """ASR rating factor, RF = (C - A1 D) / (A2 L (1 + I)) with A1 = A2 = 1.0.

    C is the effect that produces the allowable stress of the level (MBE Table 6B.6.2.1-1,
    from memory, unconfirmed).

    Args:
        effects: the section's effects and sense.
        allowable: the effect at the level's allowable stress, signed like the sense.
        impact: I [-].
        level: "inventory" or "operating".

    Example:
        >>> effects = SectionEffects("negative", dead_components=-300.0, live=-200.0)
        >>> asr_rating(effects, allowable=-900.0, impact=0.25).rating_factor  # 600/250
        2.4
    """
    factors = allowable_factors("ASR", level)
    return lfr_rating(effects, capacity=allowable, dead_factor=factors.dead,
                      live_factor=factors.live, impact=impact, level=level, method="ASR")
