"""Indeterminate and hinged beams against sympy's continuum-mechanics beam module.

Reference: sympy.physics.continuum_mechanics.beam.Beam (SymPy Development Team, SymPy 1.12+),
solved by its ordinary `solve_for_reaction_loads` for each load position (not its influence-line
helpers, which have been seen to be wrong for continuous beams). SymPy reports bending moment and
shear with the opposite sign to ours; the first test pins that relation down on a simple span
against the closed forms PL/4 and -a/L, so the later comparisons rest on an outside fact.
"""

from __future__ import annotations

import pytest
from sympy import Rational, Symbol
from sympy.physics.continuum_mechanics.beam import Beam

from tests.beams import beam_line, close

x = Symbol("x")
SYMPY_KIND = {"pinned": "pin", "roller": "roller", "fixed": "fixed"}


def sympy_solution(spans: list[float], supports: list[str], load_at: float,
                   hinges: tuple[float, ...] = ()) -> tuple[Beam, dict[float, float]]:
    """Solve the beam with a unit downward load at ``load_at``; reactions by support chainage."""
    positions = [Rational(0)]
    for span in spans:
        positions.append(positions[-1] + Rational(str(span)))
    beam = Beam(positions[-1], 1, 1)
    unknowns = {}
    for at, kind in zip(positions, supports, strict=True):
        if kind == "free":
            continue
        result = beam.apply_support(at, SYMPY_KIND[kind])
        symbols = result if isinstance(result, tuple) else (result,)
        unknowns[float(at)] = symbols
    for hinge in hinges:
        beam.apply_rotation_hinge(Rational(str(hinge)))
    beam.apply_load(-1, Rational(str(load_at)), -1)
    beam.solve_for_reaction_loads(*[s for group in unknowns.values() for s in group])
    vertical = {at: float(beam.reaction_loads[group[0]]) for at, group in unknowns.items()}
    return beam, vertical


def test_sign_relation_on_a_simple_span() -> None:
    beam, _ = sympy_solution([10.0], ["pinned", "roller"], 5.0)
    assert float(beam.bending_moment().subs(x, 5)) == pytest.approx(-2.5)  # ours: +PL/4
    # ours for a load at 5 beyond a section at 2: (L - a)/L = +0.5; sympy gives the opposite
    assert float(beam.shear_force().subs(x, 2)) == pytest.approx(-0.5)
    beam, _ = sympy_solution([10.0], ["pinned", "roller"], 1.0)
    assert float(beam.shear_force().subs(x, 2)) == pytest.approx(0.1)  # ours: -a/L = -0.1


CASES = [
    # (spans, supports, hinges, load positions, moment sections)
    ([10.0, 14.0], ["pinned", "roller", "roller"], (), [3.0, 10.0, 17.5], [5.0, 10.0, 18.0]),
    ([8.0, 12.0, 10.0], ["fixed", "roller", "roller", "roller"], (), [2.5, 13.0, 26.0],
     [0.0, 8.0, 14.0, 20.0]),
    ([6.0, 9.0, 9.0, 6.0], ["pinned", "roller", "roller", "roller", "roller"], (),
     [1.0, 10.0, 19.5, 28.0], [6.0, 15.0, 24.0]),
    ([10.0, 20.0, 10.0], ["pinned", "roller", "roller", "roller"], (14.0, 26.0),
     [5.0, 12.0, 20.0, 33.0], [10.0, 20.0, 30.0]),
    ([10.0, 10.0, 10.0], ["pinned", "roller", "roller", "roller"], (15.0,),
     [4.0, 15.0, 22.0], [10.0, 20.0, 12.0]),
]


@pytest.mark.parametrize(("spans", "supports", "hinges", "loads", "sections"), CASES)
def test_reactions_and_moments_match_sympy(spans: list[float], supports: list[str],
                                           hinges: tuple[float, ...], loads: list[float],
                                           sections: list[float]) -> None:
    chainages = [0.0]
    for span in spans:
        chainages.append(chainages[-1] + span)
    names = {c: f"S{i + 1}" for i, c in enumerate(chainages)}
    reaction_lines = {c: beam_line(spans, supports, "reaction", names[c], hinges=hinges)
                      for c, kind in zip(chainages, supports, strict=True) if kind != "free"}
    moment_lines = {s: beam_line(spans, supports, "moment", str(s), hinges=hinges)
                    for s in sections}
    total = chainages[-1]
    for load in loads:
        beam, vertical = sympy_solution(spans, supports, load, hinges)
        for at, value in vertical.items():
            assert close(reaction_lines[at].values([load]), [value]), (load, at)
        for section, line in moment_lines.items():
            expected = -float(beam.bending_moment().subs(x, section))
            assert close(line.values([load]), [expected], scale=total), (load, section)
