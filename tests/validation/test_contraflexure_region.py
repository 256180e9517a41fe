"""The region where AASHTO's truck pair applies: between the points of contraflexure.

Source: two equal continuous spans under a uniform load w on both spans (textbook, e.g. AISC
Manual beam diagrams "continuous beam, two equal spans, uniform load", recalled from memory, and
statics with the three-moment equation): M(x) = 3wLx/8 - wx^2/2 in each span from its end
support, so the moment changes sign at x = 3L/4. AASHTO LRFD 3.6.1.3.1 (from memory,
unconfirmed) applies 90 % of two trucks to negative moment between the points of contraflexure
only.
"""

from __future__ import annotations

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.model.beamform import continuous_beam
from vehicles.library.catalog import get_model
from vehicles.search.govern import govern

L = 30.0
ANALYSIS = analyse_model(continuous_beam([L, L], 2.0e6, ["pinned", "roller", "roller"]))


def line_at(x: float):  # type: ignore[no-untyped-def]
    return ANALYSIS.line(Response("moment", repr(x)))


def test_region_starts_at_three_quarters_of_the_span() -> None:
    assert not line_at(0.74 * L).scope_interior
    assert line_at(0.76 * L).scope_interior
    assert line_at(L).scope_interior and line_at(1.25 * L - 0.01 * L).scope_interior
    assert not line_at(1.26 * L).scope_interior


def test_truck_pair_only_inside_the_region() -> None:
    hl93 = get_model("HL-93", units="kN-m")
    outside, inside = line_at(0.5 * L), line_at(L)
    low_out = govern(outside.ppoly, hl93, kind="moment", interior=outside.scope_interior).min
    low_in = govern(inside.ppoly, hl93, kind="moment", interior=inside.scope_interior).min
    assert low_out is not None and low_in is not None
    assert low_out.case != "90% truck pair + lane"
    assert low_in.case == "90% truck pair + lane"
