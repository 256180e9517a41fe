"""Every bundled example reads, solves and gives a value that an outside fact confirms.

- Gerber girder (statics, common practice): a unit load at the hinge H1 hangs on the 10 m
  cantilever, so the moment over pier P1 is -10 kN m per kN; a load on the suspended span's
  midpoint gives -10 x 1/2 = -5.
- Truss rail bridge (method of sections, e.g. Hibbeler, "Structural Analysis", ch. 6): the bottom
  chord L3L4 carries the simple-span moment about U3 (18 m) divided by the depth 7 m: for a load at
  24 m, 18 x 24 / 48 / 7.
- Every girder and frame (statics): the vertical reaction lines sum to one.
"""

from __future__ import annotations

from pathlib import Path

import numpy as np
import pytest

from influence.lines import analyse_model
from influence.modelfile import read_model
from influence.responses import Response

EXAMPLES = sorted((Path(__file__).resolve().parent.parent / "examples").glob("*.toml"))


def by_name(name: str) -> Path:
    return next(p for p in EXAMPLES if p.stem == name)


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.stem)
def test_vertical_reactions_sum_to_one(path: Path) -> None:
    model = read_model(path)
    analysis = analyse_model(model)
    loads = np.linspace(0.0, analysis.path.total_length, 17)
    total = sum(analysis.line(Response("reaction", n.name)).values(loads)
                for n in model.nodes if n.support.uy != "free")
    assert np.allclose(total, 1.0, atol=1e-9)


def test_gerber_girder_cantilever_moment() -> None:
    analysis = analyse_model(read_model(by_name("gerber-girder")))
    line = analysis.line(Response("moment", "P1"))
    assert line.values([40.0, 55.0]) == pytest.approx([-10.0, -5.0], abs=1e-9)


def test_truss_chord_by_the_method_of_sections() -> None:
    analysis = analyse_model(read_model(by_name("truss-rail-bridge")))
    line = analysis.line(Response("axial", "L3L4@3.0"))
    assert float(line.values([24.0])[0]) == pytest.approx(18 * 24 / 48 / 7, rel=1e-9)
