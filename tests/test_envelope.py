"""Envelopes: each value equals the governing search at that section; combinations reproduce the
hand arithmetic of their definition; the design basis reads and rejects bad input."""

from __future__ import annotations

from pathlib import Path

import pytest

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.design.envelope import envelope
from influence.errors import ModelError
from influence.model.basis import Combination, DeadLoad, DesignBasis, LiveLoadSettings
from influence.model.beamform import continuous_beam
from influence.model.reader import read_model_file
from vehicles.loadmodel import LoadCase, LoadModel
from vehicles.search.govern import govern
from vehicles.train import Axle, Train

TRUCK = LoadModel("test truck", "two axles and a lane", "kN-m", (
    LoadCase("truck", Train("truck", (Axle(100.0), Axle(150.0, (4.0, 8.0)))),
             axle_allowance=0.25, lane=9.0),
))
BASIS = DesignBasis(
    loads=(DeadLoad("deck", "DC", uniform=20.0), DeadLoad("surfacing", "DW", uniform=4.0)),
    combinations=(Combination("strength", (("DC", 1.25, 0.9), ("DW", 1.5, 0.65),
                                           ("LL", 1.75, 1.75))),),
    live=LiveLoadSettings(distribution=0.5, multiple_presence=1.2, deflection_limit=800),
)
MODEL = continuous_beam([16.0, 20.0], 8.0e5, ["pinned", "roller", "roller"],
                        names=["A", "B", "C"])
ANALYSIS = analyse_model(MODEL)
RESULT = envelope(ANALYSIS, [TRUCK], BASIS)


def test_sections_are_supports_both_sides_and_tenth_points() -> None:
    labels = [e.section.label for e in RESULT.of("shear")]
    assert labels[:3] == ["A", "1.6", "3.2"]
    assert "B left" in labels and "B right" in labels and labels[-1] == "C"
    assert len(RESULT.of("moment")) == 10 + 10 + 1  # tenth points; moment does not jump at B
    assert [e.section.label for e in RESULT.of("reaction")] == ["A", "B", "C"]


def test_every_value_equals_the_governing_search_there() -> None:
    for entry in RESULT.entries[::3]:
        line = ANALYSIS.line(entry.response)
        expected = govern(line.ppoly, TRUCK, kind=entry.kind, interior=line.scope_interior)
        if expected.max is None:  # a zero extreme (a support's deflection) is none
            assert entry.live.max is None and entry.live_max is None
            continue
        assert entry.live.max is not None
        assert entry.live.max.value == pytest.approx(expected.max.value, rel=1e-12, abs=1e-12)
        assert entry.live_max == pytest.approx(expected.max.value * 0.6, rel=1e-12, abs=1e-12)


def test_combination_is_the_hand_arithmetic() -> None:
    entry = next(e for e in RESULT.of("moment") if e.section.label == "B")
    dc, dw = entry.dead_effect("DC"), entry.dead_effect("DW")
    assert dc < 0 and dw < 0  # hogging over the pier
    live_max, live_min = entry.live_max, entry.live_min
    assert live_min is not None
    # the truck never makes the pier moment sag: no largest live moment there (none, not zero)
    assert live_max is None
    high, low = entry.combined(BASIS.combinations[0])
    # largest: the smaller factor on a hogging dead load, no live load
    assert high == pytest.approx(0.9 * dc + 0.65 * dw)
    assert low == pytest.approx(1.25 * dc + 1.5 * dw + 1.75 * min(live_min, 0.0))


def test_deflection_check_per_span() -> None:
    checks = RESULT.deflection_checks
    assert [c.span.number for c in checks] == [1, 2]
    for check in checks:
        assert check.limit == pytest.approx(check.span.length / 800)
        grid = max(e.live_max or 0.0 for e in RESULT.of("deflection")
                   if e.section.span == check.span.number)
        assert check.deflection >= grid * (1 - 1e-12)  # refined between sections, never less


def test_design_basis_reads_the_bundled_example() -> None:
    basis = read_model_file(Path(__file__).resolve().parent.parent / "examples" /
                            "overpass.toml").basis
    assert basis.load_names == ("DC", "DW")
    assert basis.combinations[0].factor("DC") == (1.25, 0.90)
    assert basis.live.vehicles == ("HL-93",) and basis.live.deflection_limit == 800


@pytest.mark.parametrize(("extra", "message"), [
    ('[[loads]]\nname = "x"\nload = "DC"\nuniform = -3.0\n', "not positive"),
    ('[[loads]]\nname = "x"\nload = "DC"\npoint = 3.0\n', "needs its chainage"),
    ('[[loads]]\nname = "x"\nload = "DC"\nuniform = 3.0\nmembers = ["nope"]\n', "not on the path"),
    ('[[combinations]]\nname = "c"\nfactors = { QQ = 1.0 }\n', "unknown load 'QQ'"),
    ('[[combinations]]\nname = "c"\nfactors = { LL = [0.5, 1.0] }\n', "min above max"),
    ('[live_load]\nspeed = 3\n', "unknown key 'speed'"),
])
def test_design_basis_errors(tmp_path: Path, extra: str, message: str) -> None:
    path = tmp_path / "m.toml"
    path.write_text('[beam]\nspans = [10.0]\nEI = 1.0e5\nsupports = ["pinned", "roller"]\n'
                    + extra)
    with pytest.raises(ModelError, match=message):
        read_model_file(path)


def test_frame_supports_off_the_path_envelope_every_reaction_component() -> None:
    from tests.frames import portal_frame

    analysis = analyse_model(portal_frame("fixed"))
    result = envelope(analysis, [TRUCK], DesignBasis(), kinds=("reaction", "moment"))
    labels = [e.section.label for e in result.of("reaction")]
    assert labels == ["WB", "WB horizontal", "WB moment [kN-m]", "EB", "EB horizontal",
                      "EB moment [kN-m]"]
    vertical = analysis.line(Response("reaction", "WB"))
    expected = govern(vertical.ppoly, TRUCK, kind="reaction").max
    assert expected is not None
    assert result.of("reaction")[0].live.max == expected
    # no moment entries at the bases: they are off the path
    assert all(e.section.chainage is not None for e in result.of("moment"))
