"""Certified polynomial pieces: the bound holds against dense evaluation of the exact function,
and the check fails when a piece is too coarse.

The bound is Trefethen's: L. N. Trefethen, "Approximation Theory and Approximation Practice",
SIAM, 2013, Theorem 8.2 (Chebyshev interpolation of a function analytic in a Bernstein ellipse).
"""

from __future__ import annotations

import numpy as np
import pytest

from influence.analysis.certified import (
    CERTIFIED_TOLERANCE,
    ROUNDING_LIMIT,
    certify,
    certify_piece,
    truncation_bounds,
)
from influence.analysis.element import FIELDS
from influence.analysis.haunch import Haunch, haunched_section, tapered_section
from influence.analysis.integral_form import IntegralForm, combine
from influence.analysis.variable_member import VariableMemberLaw

DENSE = 4001
"""Load positions at which the exact function is compared with its pieces."""

LINE_BOUND = 2e-11
"""Largest bound [-] expected for a whole line, as a fraction of its scale (truncation 1e-12 plus
the rounding allowance)."""

CUBIC_AGREEMENT = 1e-13

SECTIONS = {
    "parabolic both ends": haunched_section(
        10.0, 1.0, 1.0, start=Haunch("parabolic", 1.0, length_fraction=0.2),
        end=Haunch("parabolic", 1.0, length_fraction=0.2)),
    "straight one end": haunched_section(30.0, 2e5, 1e6,
                                         start=Haunch("straight", 2.0, length_fraction=0.3)),
    "non-integer exponent": haunched_section(
        30.0, 2e5, 1e6, start=Haunch("parabolic", 2.0, length_fraction=0.4),
        end=Haunch("straight", 0.6, length_fraction=0.1), inertia_exponent=2.5),
    "taper": tapered_section(12.0, 1e4, 1e5, 3.0),
}


def deviation(form: IntegralForm, lo: float, hi: float, pieces) -> float:  # type: ignore[no-untyped-def]
    a = np.linspace(lo, hi, DENSE)
    return float(np.abs(pieces.values(a) - form.values(a)).max())


@pytest.mark.parametrize("name", SECTIONS)
def test_fixed_end_forces_within_their_bound(name: str) -> None:
    section = SECTIONS[name]
    L = section.length
    for form in VariableMemberLaw(section).end_forces_from_load(0.6, -0.8):
        pieces = certify(form, 0.0, L)
        assert pieces.truncation.max() <= CERTIFIED_TOLERANCE * pieces.scale
        assert pieces.rounding.max() <= ROUNDING_LIMIT * pieces.scale
        assert deviation(form, 0.0, L, pieces) <= pieces.bound
        assert np.all(np.isin(section.profile.breakpoints, pieces.breakpoints))


def test_a_whole_line_inside_a_member() -> None:
    """lambda . f_e(a) + R0(a) for a moment section inside the member, certified on both sides
    of the section with the line's own scale."""
    section = SECTIONS["parabolic both ends"]
    law = VariableMemberLaw(section, release_end=True)
    s = 3.7
    weights = np.array([0.1, -0.4, 0.25, 0.0, 0.3, 0.0])
    rule = law.field("moment", s, 0.0, -1.0)
    forces = list(law.end_forces_from_load(0.0, -1.0))
    behind = combine([*forces, rule.behind], [*weights, 1.0])
    ahead = combine([*forces, rule.ahead], [*weights, 1.0])
    a = np.linspace(0.0, section.length, 501)
    scale = float(np.abs(np.where(a < s, behind.values(a), ahead.values(a))).max())
    for form, lo, hi in ((behind, 0.0, s), (ahead, s, section.length)):
        pieces = certify(form, lo, hi, scale=scale)
        assert deviation(form, lo, hi, pieces) <= pieces.bound <= LINE_BOUND * scale


@pytest.mark.parametrize("quantity", FIELDS)
def test_fields_within_their_bound(quantity: str) -> None:
    section = SECTIONS["straight one end"]
    law = VariableMemberLaw(section)
    s = 0.37 * section.length
    rule = law.field(quantity, s, 0.6, -0.8)
    for form, lo, hi in ((rule.behind, 0.0, s), (rule.ahead, s, section.length)):
        pieces = certify(form, lo, hi)
        assert deviation(form, lo, hi, pieces) <= pieces.bound


def test_a_too_coarse_piece_fails_the_check() -> None:
    """One low-degree piece over a whole haunch: its proven bound exceeds the tolerance, and the
    actual error measured densely does too; so the acceptance test is not vacuous."""
    section = SECTIONS["parabolic both ends"]
    form = VariableMemberLaw(section).end_forces_from_load(0.0, -1.0)[2]
    scale = certify(form, 0.0, 10.0).scale
    bound, rho = truncation_bounds(form, 0, 0.0, 2.0)[5]
    coarse = certify_piece(form, 0, 0.0, 2.0, 5, bound, rho)
    a = np.linspace(0.0, 2.0, DENSE)
    polynomial = np.polynomial.polynomial.polyval(a, coarse.coefficients)
    error = float(np.abs(polynomial - form.values(a)).max())
    assert bound > CERTIFIED_TOLERANCE * scale
    assert error > CERTIFIED_TOLERANCE * scale
    assert error <= bound  # the bound still holds, it is just too large to accept


def test_reversed_pieces_read_the_member_backwards() -> None:
    section = SECTIONS["taper"]
    form = VariableMemberLaw(section).end_forces_from_load(0.0, -1.0)[1]
    pieces = certify(form, 0.0, 12.0)
    back = pieces.reversed()
    a = np.linspace(0.0, 12.0, 301)
    assert np.allclose(back.values(12.0 - a), form.values(a), rtol=0, atol=pieces.bound * 4)
    assert back.bound == pieces.bound


def test_prismatic_pieces_are_cubics() -> None:
    """A prismatic member needs one piece, and it is the textbook cubic (the bound cannot prove
    a degree-3 interpolant exact, so degree 5 is used with vanishing higher terms)."""
    form = VariableMemberLaw(haunched_section(8.0, 1.0, 1.0)).end_forces_from_load(0.0, -1.0)[2]
    pieces = certify(form, 0.0, 8.0)
    assert len(pieces.coefficients) == 1
    # fixed-end moment P a b^2 / L^2 as a cubic: 8^-2 (64 a - 16 a^2 + a^3)
    cubic = np.zeros(pieces.degree + 1)
    cubic[:4] = [0.0, 1.0, -0.25, 1 / 64]
    assert np.allclose(pieces.coefficients[0], cubic, rtol=0, atol=CUBIC_AGREEMENT)
