"""Load rating, posting and permit checks on plain numbers (AASHTO MBE: LRFR, LFR, ASR).

This package knows the rating equations, the factor tables (data files keyed by MBE edition,
each value with its clause and confidence mark), the posting rules, the AASHTO LRFD
distribution factors for slab-on-girder bridges and the ``[rating]`` and ``[[capacity]]``
tables of a model file. What it exports takes effects as plain numbers and imports nothing of
the structural model, so any source of effects can feed it. The exact effects are wired to it by
:func:`influence.rating.run.rate` (every section, capacity, vehicle and level of a model file)
and :func:`influence.rating.permit_check.check_permit` (one permit vehicle), imported from their
modules.

Example (an LRFR legal-load rating and the posting it leads to):
    >>> from influence.rating import SectionEffects, legal_live_load_factor, lrfr_rating, posting
    >>> gamma = legal_live_load_factor("MBE 2nd", 3000.0).factor      # 1.375
    >>> effects = SectionEffects("positive", dead_components=900.0, live=600.0)
    >>> result = lrfr_rating(effects, nominal=2000.0, resistance_factor=1.0,
    ...                      dead_components_factor=1.25, dead_wearing_factor=1.5,
    ...                      live_factor=gamma, impact=0.33, level="legal")
    >>> round(result.rating_factor, 4)          # (2000 - 1125) / (1.375 x 600 x 1.33)
    0.7974
    >>> posting(result.rating_factor, 25.0, increment=1.0).load      # Type 3, 25 tons
    17.0
"""

from influence.rating.capacity import Capacity, capacities, capacity_at, check_on_structure
from influence.rating.distribution import (
    DistributionFactors,
    distribution_factors,
    fatigue_distribution,
    permit_distribution,
)
from influence.rating.equations import asr_rating, lfr_rating, lrfr_rating, lrfr_service_rating
from influence.rating.girder_geometry import GirderGeometry, girder_geometry_from_metric
from influence.rating.impact import lfr_impact, lrfr_impact
from influence.rating.live_factors import (
    PermitCrossing,
    legal_live_load_factor,
    permit_live_load_factor,
)
from influence.rating.load_factors import allowable_factors, limit_state_factors, limit_states
from influence.rating.member_factors import combined_member_factor, condition_factor, system_factor
from influence.rating.posting import (
    emergency_vehicle_limits,
    posting,
    rating_tons,
    single_unit_posting,
)
from influence.rating.result import RatingResult, SectionEffects
from influence.rating.section_rating import distribution_for, rate_section
from influence.rating.settings import GirderDistribution, RatingSettings, rating_settings
from influence.rating.tables import known_editions

__all__ = [
    "Capacity",
    "DistributionFactors",
    "GirderDistribution",
    "GirderGeometry",
    "PermitCrossing",
    "RatingResult",
    "RatingSettings",
    "SectionEffects",
    "allowable_factors",
    "asr_rating",
    "capacities",
    "capacity_at",
    "check_on_structure",
    "combined_member_factor",
    "condition_factor",
    "distribution_factors",
    "distribution_for",
    "emergency_vehicle_limits",
    "fatigue_distribution",
    "girder_geometry_from_metric",
    "known_editions",
    "legal_live_load_factor",
    "lfr_impact",
    "lfr_rating",
    "limit_state_factors",
    "limit_states",
    "lrfr_impact",
    "lrfr_rating",
    "lrfr_service_rating",
    "permit_distribution",
    "permit_live_load_factor",
    "posting",
    "rate_section",
    "rating_settings",
    "rating_tons",
    "single_unit_posting",
    "system_factor",
]
