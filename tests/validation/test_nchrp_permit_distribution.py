"""Distribution factors for permit loads.

Reference: NCHRP Project 20-07/Task 285, *Recalibration of the LRFR Load Factors in the AASHTO
Manual for Bridge Evaluation* (Transportation Research Board, project statement). Confirmed
there: "the live load distribution for Special permits is based on the tabulated LRFD one-lane
distribution factors with the built-in multiple presence factor (such as a value of 1.2) divided
out. The live load distribution analysis for routine permits is done using LRFD two-lane
distribution factors".
"""

from __future__ import annotations

import pytest

from influence.errors import ModelError
from influence.rating import GirderGeometry, distribution_factors, permit_distribution
from influence.rating.live_factors import PermitCrossing, permit_live_load_factor

EXACT = 1e-12
GEOMETRY = GirderGeometry(9.0, 80.0, 8.5, 800_000.0, girders=6, edge_distance=1.5)


@pytest.mark.parametrize("girder", ["interior", "exterior"])
@pytest.mark.parametrize("response", ["moment", "shear"])
def test_special_permit_takes_one_lane_without_the_12(girder, response):
    factors = distribution_factors(GEOMETRY, girder, response)
    assert permit_distribution(factors, "special") == pytest.approx(factors.one_lane / 1.2,
                                                                    rel=EXACT)


@pytest.mark.parametrize("girder", ["interior", "exterior"])
def test_routine_permit_takes_the_several_lane_factor(girder):
    factors = distribution_factors(GEOMETRY, girder, "moment")
    assert permit_distribution(factors, "routine") == factors.several_lanes


def test_the_permit_table_names_the_distribution_each_row_goes_with():
    special = PermitCrossing("special", "single trip", "mixed with traffic")
    routine = PermitCrossing("routine", gross_weight_kip=120.0)
    for edition in ("MBE 1st", "MBE 2nd"):
        assert permit_live_load_factor(edition, special, 1000.0).distribution == "one lane"
        assert permit_live_load_factor(edition, routine, 1000.0).distribution == (
            "two or more lanes")


def test_unknown_permit_kind():
    with pytest.raises(ModelError, match="permit type"):
        permit_distribution(distribution_factors(GEOMETRY, "interior", "moment"), "annual-ish")
