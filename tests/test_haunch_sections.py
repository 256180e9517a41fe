"""Section variation of haunched and tapered members: validation and the depth laws."""

from __future__ import annotations

import numpy as np
import pytest

from influence.analysis.haunch import (
    DepthProfile,
    Haunch,
    depth_ratio_for_inertia,
    haunched_section,
    tapered_section,
)
from influence.errors import ModelError

TOLERANCE = 1e-14


@pytest.mark.parametrize("shape", ["straight", "parabolic"])
def test_depth_is_continuous_and_reaches_one_plus_r(shape: str) -> None:
    r, L = 1.5, 12.0
    section = haunched_section(L, 1.0, 1.0, start=Haunch(shape, r, length_fraction=0.25),
                               end=Haunch(shape, 0.5, length=2.0))
    depth = section.profile.values
    assert depth(0.0) == pytest.approx(1 + r, rel=TOLERANCE)
    assert depth(L) == pytest.approx(1.5, rel=TOLERANCE)
    for join in (3.0, 10.0):
        below, above = depth(join - 1e-12), depth(join)
        assert below == pytest.approx(above, abs=1e-9)
    assert np.all(depth(np.linspace(3.0, 10.0, 11)) == 1.0)


def test_parabolic_haunch_has_its_vertex_at_the_prismatic_part() -> None:
    section = haunched_section(10.0, 1.0, 1.0, start=Haunch("parabolic", 1.0, length=4.0))
    # depth 1 + r (1 - x/c)^2 (common practice: vertex where the haunch meets the middle)
    x = np.linspace(0.0, 4.0, 9)
    assert np.allclose(section.profile.values(x), 1 + (1 - x / 4) ** 2, rtol=TOLERANCE)


def test_inertia_follows_the_exponent() -> None:
    haunch = Haunch("straight", 1.0, length_fraction=0.5)
    cube = haunched_section(2.0, 5.0, 7.0, start=haunch)
    square = haunched_section(2.0, 5.0, 7.0, start=haunch, inertia_exponent=2.0,
                              area_exponent=0.0 + 1.0)
    assert cube.EI(0.0) == pytest.approx(40.0) and square.EI(0.0) == pytest.approx(20.0)
    assert cube.EA(0.0) == pytest.approx(14.0)
    assert cube.bending_compliance(0.0) == pytest.approx(1 / 40.0)


def test_inertias_at_the_ends_and_the_middle() -> None:
    r = depth_ratio_for_inertia(8.0, 3.0)
    section = haunched_section(10.0, 2.0, 1.0, start=Haunch("straight", r, length_fraction=0.2))
    assert section.EI(0.0) == pytest.approx(16.0, rel=TOLERANCE)
    assert depth_ratio_for_inertia(4.0, 2.0) == pytest.approx(1.0)


def test_taper_is_linear_end_to_end() -> None:
    section = tapered_section(6.0, 1.0, 1.0, 0.5)
    assert section.profile.values(3.0) == pytest.approx(0.75)
    assert section.EI(6.0) == pytest.approx(0.125)


@pytest.mark.parametrize("build", [
    lambda: Haunch("curved", 1.0, length_fraction=0.2),
    lambda: Haunch("straight", -0.5, length_fraction=0.2),
    lambda: Haunch("straight", 1.0),
    lambda: Haunch("straight", 1.0, length_fraction=1.5),
    lambda: haunched_section(10.0, 1.0, 1.0, start=Haunch("straight", 1.0, length=6.0),
                             end=Haunch("straight", 1.0, length=6.0)),
    lambda: haunched_section(10.0, 1.0, 1.0,
                             start=Haunch("straight", 1.0, length_fraction=0.2, length=3.0)),
    lambda: haunched_section(10.0, -1.0, 1.0),
    lambda: tapered_section(10.0, 1.0, 1.0, 0.0),
    lambda: DepthProfile((0.0, 1.0), ((1.0, -2.0, 0.0),)),
    lambda: depth_ratio_for_inertia(0.5),
])
def test_bad_input_is_a_model_error(build) -> None:  # type: ignore[no-untyped-def]
    with pytest.raises(ModelError):
        build()
