"""Runs on a model file (influence.design.from_file) and the results telling one story.

The facts checked are the library's own consistency and statics:
- the governing search at a section and the envelope there give the same value, both per girder
  line (one lane's effect x distribution x multiple presence of the file's [live_load]), and
  ``per_lane`` gives the envelope's value divided by that scale;
- a sweep's largest value is the governing value of the case that governs (the search and the
  tabulation of one exact effect function);
- a zero extreme is none: the moment at a pinned end support is zero for any load (statics,
  common practice), and a cantilever root never sags;
- no two listed positions are mirror images of one placement;
- each load model's own extremes are listed, the same as a search of that model alone.
"""

from __future__ import annotations

import json
from pathlib import Path

import numpy as np
import pytest

from influence.analysis.responses import Response
from influence.design.envelope import envelope
from influence.design.from_file import (
    envelope_from_file,
    governing_from_file,
    placement_sweeps,
    sweeps_from_file,
)
from influence.design.loading import vehicles_for
from influence.errors import ModelError
from influence.model.reader import read_model_file
from tests.cli import invoke
from vehicles.library.catalog import load_model
from vehicles.search.govern import govern
from vehicles.search.placement import is_mirror

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"
OVERPASS = EXAMPLES / "overpass.toml"
GERBER = EXAMPLES / "gerber-girder.toml"
SCALE = 0.62  # examples/overpass.toml: distribution 0.62 x multiple presence 1.0
SAME = 1e-12  # one computation, read two ways


@pytest.fixture(scope="module")
def overpass_envelope():  # type: ignore[no-untyped-def]
    return envelope_from_file(OVERPASS, responses=("moment", "shear"))


def test_envelope_from_file_is_the_envelope_of_the_file(overpass_envelope) -> None:  # type: ignore[no-untyped-def]
    read = read_model_file(OVERPASS)
    models, _ = vehicles_for(read.basis.live.vehicles, "kN-m")
    direct = envelope(overpass_envelope.analysis, models, read.basis, kinds=("moment", "shear"))
    assert len(direct.entries) == len(overpass_envelope.envelope.entries)
    for mine, theirs in zip(overpass_envelope.envelope.entries, direct.entries, strict=True):
        assert (mine.live_max, mine.live_min) == (theirs.live_max, theirs.live_min)
    assert overpass_envelope.read.model.title.startswith("Millbrook")


def test_envelope_progress_counts_up_to_the_total() -> None:
    seen: list[tuple[int, int]] = []
    run = envelope_from_file(OVERPASS, responses=("reaction",),
                             progress=lambda done, total: seen.append((done, total)))
    assert seen and seen[-1][0] == seen[-1][1] == len(run.envelope.entries)
    assert [d for d, _ in seen] == sorted(d for d, _ in seen)


def test_envelope_from_file_refuses_step_and_divisions_together() -> None:
    with pytest.raises(ModelError, match="not both"):
        envelope_from_file(OVERPASS, step=1.0, per_span=4)


@pytest.mark.parametrize(("kind", "location", "side"), [
    ("moment", "40", "right"), ("moment", "P1", "right"), ("shear", "P1", "left"),
    ("shear", "12", "right")])
def test_govern_and_envelope_give_the_same_value(overpass_envelope, kind, location, side) -> None:  # type: ignore[no-untyped-def]
    found = governing_from_file(OVERPASS, Response(kind, location, side))
    entry = next(e for e in overpass_envelope.envelope.of(kind)
                 if e.response.location == location and e.response.side == side
                 or (e.section.chainage == float(location.replace("P1", "24"))
                     and e.response.side == side))
    g = found.result.governing
    assert g.max is not None and g.min is not None
    assert g.max.value == pytest.approx(entry.live_max, rel=SAME)
    assert g.min.value == pytest.approx(entry.live_min, rel=SAME)
    assert found.live_scale == SCALE and "0.62" in found.live_note
    one_lane = governing_from_file(OVERPASS, Response(kind, location, side), per_lane=True)
    assert one_lane.result.governing.max.value == pytest.approx(entry.live_max / SCALE,
                                                                rel=SAME)
    assert "ONE LANE" in one_lane.live_note and "0.62" in one_lane.live_note


def test_concurrent_effects_are_scaled_like_the_value() -> None:
    at = Response("moment", "40")
    other = [Response("reaction", "P1")]
    girder = governing_from_file(OVERPASS, at, concurrent_with=other).result
    lane = governing_from_file(OVERPASS, at, concurrent_with=other, per_lane=True).result
    assert girder.concurrent_max[0].value == pytest.approx(SCALE * lane.concurrent_max[0].value,
                                                           rel=SAME)


def test_a_zero_extreme_is_none() -> None:
    # statics: a pinned end support carries no moment; the cantilever root over P1 never sags
    for path, response in ((OVERPASS, Response("moment", "A1")),
                           (GERBER, Response("moment", "P1"))):
        found = governing_from_file(path, response, vehicles=("HL-93",), top=3).result
        assert found.governing.max is None and found.governing.top_max == ()
    gerber = governing_from_file(GERBER, Response("moment", "P1"), vehicles=("HL-93",)).result
    assert gerber.governing.min is not None and gerber.governing.min.value < 0


def test_the_top_positions_hold_no_mirror_images() -> None:
    found = governing_from_file(OVERPASS, Response("moment", "40"), top=6).result.governing
    for listed in (found.top_max, found.top_min):
        assert listed
        for i, first in enumerate(listed):
            for second in listed[i + 1:]:
                assert not is_mirror(first, second, 1e-6)
    # the forward truck at 44.27 m and its reverse at 35.73 m are one placement mirrored about
    # the symmetric girder's middle: the reverse is not listed
    directions = [(p.case, p.direction) for p in found.top_max]
    assert ("design truck + lane", "reverse") not in directions


def test_each_load_model_keeps_its_own_row() -> None:
    found = governing_from_file(OVERPASS, Response("moment", "40"),
                                vehicles=("HL-93", "LM1", "Type 3")).result
    rows = {(r.model, r.case): r for r in found.by_case}
    assert len(rows) == 3 + 1 + 1  # HL-93's three cases, LM1's and Type 3's one each
    type3 = rows["Type 3", "Type 3"]
    alone = govern(found.line.function, load_model("Type 3", units="kN-m"), kind="moment",
                   interior=found.line.scope_interior)
    assert type3.max.value == pytest.approx(SCALE * alone.max.value, rel=SAME)
    assert found.governing.max.model == "LM1"  # the envelope's winner hides Type 3 ...
    assert type3.max.value < found.governing.max.value  # ... but its row is there


def test_a_sweep_reaches_the_governing_value() -> None:
    girder = sweeps_from_file(OVERPASS, Response("moment", "40"), "HL-93",
                              case="design truck + lane", step=0.5)
    best = governing_from_file(OVERPASS, Response("moment", "40")).result.governing.max
    assert max(float(np.max(s.values)) for s in girder.sweeps) == pytest.approx(best.value,
                                                                                 rel=1e-9)
    assert girder.placement is not None and girder.placement.value == pytest.approx(best.value)
    lane = sweeps_from_file(OVERPASS, Response("moment", "40"), "HL-93",
                            case="design truck + lane", step=0.5, per_lane=True)
    assert np.allclose(girder.sweeps[0].values, SCALE * lane.sweeps[0].values, rtol=SAME)


def test_placement_sweeps_follow_the_governing_cases() -> None:
    run = governing_from_file(OVERPASS, Response("moment", "40"))
    sweeps = placement_sweeps(run)
    g = run.result.governing
    assert [(s.case, s.direction) for s in sweeps] == [(g.max.case, g.max.direction),
                                                       (g.min.case, g.min.direction)]
    assert float(np.max(sweeps[0].values)) == pytest.approx(g.max.value, rel=1e-9)


# ------------------------------------------------------------------ through the command line

def test_govern_says_per_girder_line_and_matches_the_envelope() -> None:
    code, output = invoke("govern", str(OVERPASS), "moment", "--at", "40")
    assert code == 0, output
    assert "Live load per girder line" in output and "0.62" in output and "1702.7" in output
    code, output = invoke("envelope", str(OVERPASS), "--responses", "moment", "--quiet")
    assert code == 0 and "1702.7" in output
    code, output = invoke("govern", str(OVERPASS), "moment", "--at", "40", "--per-lane",
                          "--format", "json")
    document = json.loads(output)
    assert document["live_load"]["scale"] == 1.0 and "ONE LANE" in document["live_load"][
        "statement"]
    assert document["max"]["value"] == pytest.approx(2746.35, abs=0.005)


def test_govern_without_live_load_says_one_lane() -> None:
    code, output = invoke("govern", str(GERBER), "shear", "--at", "P1", "--vehicle", "HL-93",
                          "--format", "json")
    assert code == 0, output
    document = json.loads(output)
    assert document["live_load"]["scale"] == 1.0
    assert document["live_load"]["statement"].startswith("Live load of one lane")


def test_govern_reports_a_zero_extreme_as_none_and_still_draws(tmp_path: Path) -> None:
    plot = tmp_path / "g.png"
    code, output = invoke("govern", str(GERBER), "moment", "--at", "P1", "--vehicle", "HL-93",
                          "--plot", str(plot))
    assert code == 0, output
    assert "none: no position gives an effect of this sign" in output and plot.exists()
    code, output = invoke("govern", str(GERBER), "moment", "--at", "P1", "--vehicle", "HL-93",
                          "--format", "json")
    document = json.loads(output)
    assert document["max"] is None and document["top"]["max"] == []


def test_govern_lists_every_load_model_and_case() -> None:
    code, output = invoke("govern", str(OVERPASS), "moment", "--at", "40", "--vehicle", "HL-93",
                          "--vehicle", "Type 3")
    assert code == 0, output
    assert "each load model and case alone" in output
    summary = output.split("each load model and case alone")[1]
    assert "Type 3" in summary and "design tandem + lane" in summary
    code, output = invoke("govern", str(OVERPASS), "moment", "--at", "40", "--vehicle", "HL-93",
                          "--vehicle", "Type 3", "--format", "json")
    rows = json.loads(output)["by_load_model"]
    assert {r["vehicle"] for r in rows} == {"HL-93", "Type 3"} and len(rows) == 4
    assert next(r for r in rows if r["vehicle"] == "Type 3")["max"]["value"] > 0


def test_sweep_says_per_girder_line() -> None:
    code, output = invoke("sweep", str(OVERPASS), "moment", "--at", "40", "--vehicle", "HL-93",
                          "--case", "design truck + lane", "--format", "json")
    assert code == 0, output
    document = json.loads(output)
    assert document["live_load"]["scale"] == SCALE
    assert max(max(s["values"]) for s in document["sweeps"]) == pytest.approx(1702.74, abs=0.01)
