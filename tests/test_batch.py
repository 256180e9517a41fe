"""govern_many gives, line by line, exactly what govern gives (values, placements, ranged values).

An invariant of the code, not an outside reference: the batched search must not change any
result. The lines are those of a three-span girder built by the influence package (moment and
shear at many sections, shear lines jumping at their section, interior and end reactions) plus
closed-form simple-span lines (tests/influence_forms.py); the load models cover axles, ranged
gaps (one range: the exact pairing; two ranges: the numeric search), lanes on adverse parts,
knife-edge loads, a lane kept clear of the train, train patches, factors and scopes.
"""

from __future__ import annotations

import numpy as np
import pytest

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.model.beamform import continuous_beam
from tests.influence_forms import simple_moment, simple_shear
from vehicles import LoadCase, LoadModel, Scope, VehicleError, get_model
from vehicles.search.govern import govern, govern_many
from vehicles.train import Axle, Patch, Train

SPANS = (12.0, 16.0, 12.0)  # [m]


def _girder_lines() -> list:
    analysis = analyse_model(continuous_beam(list(SPANS), 1.0e5, ["pinned"] + ["roller"] * 3))
    chainages = np.linspace(0.0, sum(SPANS), 7)
    responses = [Response(kind, repr(float(x)), side)
                 for kind in ("moment", "shear") for x in chainages for side in ("left", "right")
                 if kind == "shear" or side == "right"]
    responses += [Response("reaction", name) for name in ("S1", "S2", "S3")]
    return analysis.lines(responses)


def _models() -> list[LoadModel]:
    two_ranges = Train("two ranges", (Axle(60.0), Axle(90.0, (2.0, 5.0)), Axle(90.0, 1.5),
                                      Axle(70.0, (3.0, 7.0))))
    wagon = Train("wagon", (Axle(100.0), Axle(100.0, 1.8), Patch(30.0, (6.0, 12.0), 2.0)))
    own = LoadModel("own", "invented trains", "kN-m", (
        LoadCase("two ranges", two_ranges, axle_allowance=0.2, lane=5.0),
        LoadCase("wagon + knife", wagon, factor=0.9, lane=4.0, knife_edge_moment=50.0,
                 knife_edge_shear=70.0, patch_allowance=0.1),
        LoadCase("lane only", None, lane=8.0, knife_edge_shear=40.0,
                 scope=Scope(("shear", "interior reaction"))),
    ))
    return [get_model("HL-93", units="kN-m"), get_model("LM1"), get_model("LM71"), own]


@pytest.fixture(scope="module")
def lines() -> list:
    return _girder_lines()


@pytest.mark.parametrize("top", [1, 3])
def test_batch_equals_line_by_line(lines: list, top: int) -> None:
    models = _models()
    chosen = lines if top == 1 else lines[::4]
    batched = govern_many([line.ppoly for line in chosen], models,
                          kinds=[line.response.kind for line in chosen],
                          interiors=[line.interior_support for line in chosen],
                          sections=[line.section_chainage for line in chosen], top=top)
    for line, result in zip(chosen, batched, strict=True):
        alone = govern(line.ppoly, models, kind=line.response.kind,
                       interior=line.interior_support, section=line.section_chainage, top=top)
        assert result == alone, line.response.label


def test_batch_of_closed_forms_in_one_direction() -> None:
    span = 20.0  # [m]
    forms = [simple_moment(span, c) for c in (5.0, 10.0)] + [simple_shear(span, 7.0)]
    kinds = ["moment", "moment", "shear"]
    model = get_model("HL-93", units="kN-m")
    batched = govern_many(forms, model, kinds=kinds, directions=("reverse",))
    for form, kind, result in zip(forms, kinds, batched, strict=True):
        assert result == govern(form, model, kind=kind, directions=("reverse",))


def test_batch_checks_its_lists() -> None:
    form = simple_moment(10.0, 5.0)
    with pytest.raises(VehicleError, match="one of each a line"):
        govern_many([form, form], get_model("LM1"), kinds=["moment"])
