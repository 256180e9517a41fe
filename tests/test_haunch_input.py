"""Haunched and tapered members in model files: the beam form's [[beam.haunches]], the general
form's haunch_start, haunch_end and taper keys, their errors, and the general form written back
by check --expand giving the same influence lines.

Outside facts used (common practice): a rectangle's I grows as its depth cubed, so an end eight
times stiffer than the middle is twice as deep (inertia_ratio 8 is depth_ratio 1); the vertical
reaction lines of a girder sum to the unit load; a cantilever's root moment is -a for a unit
load at a, whatever its section; on a frame the deck moment under a uniform load is the
simple-span parabola plus the line between its end moments.
"""

from __future__ import annotations

from pathlib import Path

import numpy as np
import pytest

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.errors import ModelError
from influence.model.expand import general_form_toml
from influence.model.reader import read_model_file
from tests.cli import invoke

EXAMPLE = Path(__file__).resolve().parent.parent / "examples" / "tarn-viaduct-haunched.toml"
BEAM = """
units = "kN-m"
[beam]
spans = [20.0, 20.0]
EI = 1.0e6
supports = ["pinned", "roller", "roller"]
[[beam.haunches]]
span = 1
at = "end"
shape = "straight"
length = "5 m"
inertia_ratio = 8.0
[[beam.haunches]]
span = 2
at = "start"
shape = "straight"
length_fraction = 0.25
depth_ratio = 1.0
"""


def write(tmp_path: Path, text: str) -> Path:
    path = tmp_path / "model.toml"
    path.write_text(text)
    return path


def test_the_beam_form_haunches_its_spans(tmp_path: Path) -> None:
    model = read_model_file(write(tmp_path, BEAM)).model
    first, second = model.members
    assert first.variation is not None and first.variation.start is None
    assert first.variation.end.depth_ratio == pytest.approx(1.0, rel=1e-12)  # 8 = 2^3
    assert second.variation is not None and second.variation.start.span(20.0) == 5.0
    analysis = analyse_model(model)
    x = np.linspace(0.0, 40.0, 401)
    total = sum(analysis.line(Response("reaction", n)).values(x) for n in ("S1", "S2", "S3"))
    assert np.abs(total - 1.0).max() <= 1e-9


def test_expand_writes_the_haunches_and_reads_back_the_same_lines(tmp_path: Path) -> None:
    read = read_model_file(write(tmp_path, BEAM))
    expanded = tmp_path / "general.toml"
    expanded.write_text(general_form_toml(read))
    again = read_model_file(expanded).model
    assert [m.variation is not None for m in again.members] == [True, True]
    x = np.linspace(0.0, 40.0, 161)
    for response in (Response("moment", "S2"), Response("shear", "12")):
        first = analyse_model(read.model).line(response).values(x)
        second = analyse_model(again).line(response).values(x)
        assert second == pytest.approx(first, rel=1e-9, abs=1e-9)


def test_a_tapered_general_member(tmp_path: Path) -> None:
    text = """
units = "kN-m"
[[nodes]]
name = "A"
x = 0.0
y = 0.0
support = "fixed"
[[nodes]]
name = "B"
x = 8.0
y = 0.0
[[members]]
name = "AB"
start = "A"
end = "B"
EI = 4.0e5
EA = 4.0e6
taper = 0.5
deck = true
[path]
members = ["AB"]
"""
    model = read_model_file(write(tmp_path, text)).model
    line = analyse_model(model).line(Response("moment", "A", component=""))
    # a cantilever's root moment is statics alone, whatever the section: -a for a load at a
    x = np.linspace(0.0, 8.0, 9)
    assert line.values(x) == pytest.approx(-x, abs=1e-9)


@pytest.mark.parametrize(("old", "new", "named"), [
    ('shape = "straight"', 'shape = "curved"', "beam.haunches[1].shape"),
    ("inertia_ratio = 8.0", "inertia_ratio = 8.0\ndepth_ratio = 1.0", "beam.haunches[1]"),
    ("span = 2", "span = 3", "beam.haunches[2].span"),
    ('at = "start"', 'at = "middle"', "beam.haunches[2].at"),
    ('length = "5 m"', 'length = "25 m"', "beam.haunches on span1"),  # longer than the span
    ("length_fraction = 0.25", "length_fraction = 0.25\nlength = 3.0",  # 0.25 x 20 is 5
     "beam.haunches on span2"),
    ('length = "5 m"', 'length = "5 kN"', "beam.haunches[1].length"),
    ("depth_ratio = 1.0", "depth_ratio = nan", "beam.haunches[2].depth_ratio"),
    ("depth_ratio = 1.0", "depth_ratio = true", "beam.haunches[2].depth_ratio"),
    ("EI = 1.0e6", "EI = 1.0e6\ninertia_exponent = 0", "beam.inertia_exponent"),
])
def test_bad_haunches_are_one_line_errors_naming_file_and_key(tmp_path: Path, old: str,
                                                              new: str, named: str) -> None:
    path = write(tmp_path, BEAM.replace(old, new, 1))
    with pytest.raises(ModelError):
        read_model_file(path)
    code, output = invoke("check", str(path))
    assert code == 1 and output.count("\n") <= 1 and "Traceback" not in output
    assert "model.toml" in output and named in output, output


def test_a_member_haunch_longer_than_the_member_names_the_member(tmp_path: Path) -> None:
    text = """
units = "kN-m"
nodes = [ { name = "A", x = 0.0, y = 0.0, support = "pinned" },
          { name = "B", x = 6.0, y = 0.0, support = "roller" } ]
[[members]]
name = "AB"
start = "A"
end = "B"
EI = 1.0e5
EA = 1.0e6
haunch_end = { shape = "straight", length = 7.0, depth_ratio = 0.5 }
[path]
members = ["AB"]
"""
    code, output = invoke("check", str(write(tmp_path, text)))
    assert code == 1 and "member AB" in output and "no longer than the member" in output


def test_a_haunch_on_a_span_split_by_a_hinge_is_refused(tmp_path: Path) -> None:
    supports = 'supports = ["pinned", "roller", "roller"]'
    path = write(tmp_path, BEAM.replace(supports, supports + "\nhinges = [8.0]"))
    with pytest.raises(ModelError, match="haunched and also split"):
        read_model_file(path)


def test_the_haunched_viaduct_example_checks_and_draws(tmp_path: Path) -> None:
    code, output = invoke("check", str(EXAMPLE), "--plot", str(tmp_path / "tarn.png"))
    assert code == 0, output
    assert "haunched: start parabolic over 9, depth x 2" in output
    assert (tmp_path / "tarn.png").is_file()


def test_the_report_echoes_each_members_section(tmp_path: Path) -> None:
    from pypdf import PdfReader

    from influence.output.report import report_from_file

    model = write(tmp_path, 'title = "two spans haunched at the pier"\n' + BEAM + """
[[loads]]
name = "deck"
load = "DC"
uniform = 10.0
[live_load]
vehicles = ["HL-93"]
[sections]
per_span = 2
""")
    files = report_from_file(model, tmp_path / "package")
    echo = " ".join(page.extract_text() for page in PdfReader(files.pdf).pages[2:5])
    assert "haunched: end straight over 5, depth x 2, I ~ depth^3" in echo
    assert "haunched: start straight over 5, depth x 2" in echo
    assert "prismatic part" in echo


def test_tapered_legs_and_a_haunch_are_drawn_below_their_members(tmp_path: Path) -> None:
    from matplotlib.patches import Polygon

    from influence.output.figures import draw_structure

    # two legs leaning out from their bases to the knees, one drawn base to knee and one knee
    # to base: both deepen toward the knee and hang on the frame's inside
    model = read_model_file(write(tmp_path, """
units = "kN-m"
nodes = [ { name = "WB", x = 0.0, y = 0.0, support = "fixed" },
          { name = "WK", x = 3.0, y = 4.0 },
          { name = "EK", x = 21.0, y = 4.0 },
          { name = "EB", x = 24.0, y = 0.0, support = "fixed" } ]
[[members]]
name = "W"
start = "WB"
end = "WK"
EI = 8.0e5
EA = 5.0e6
taper = 2.0
[[members]]
name = "D"
start = "WK"
end = "EK"
EI = 1.2e6
EA = 6.0e6
deck = true
haunch_start = { shape = "straight", length = "3 m", depth_ratio = 1.0 }
[[members]]
name = "E"
start = "EK"
end = "EB"
EI = 8.0e5
EA = 5.0e6
taper = 0.5
[path]
members = ["D"]
""")).model
    ax = draw_structure(model)
    outlines = [p.get_xy() for p in ax.patches if isinstance(p, Polygon)]
    assert len(outlines) == 3
    west, deck, east = sorted(outlines, key=lambda xy: xy[:, 0].mean())
    assert deck[:, 1].max() <= 4.0 + 1e-9  # below the deck
    deepest = deck[np.argmin(deck[:, 1])]
    assert deepest[0] < 3.5  # deepest at the haunched knee
    # the legs hang inside, to the right of the west leg's axis and the left of the east one's
    assert np.all(west[:, 0] >= 0.75 * west[:, 1] - 1e-9)
    assert np.all(east[:, 0] <= 24.0 - 0.75 * east[:, 1] + 1e-9)


def test_the_rigid_frame_example_balances_the_simple_span_moment() -> None:
    # statics of any frame (common practice): the deck's moment under a uniform load is the
    # simple-span parabola plus the line between its end moments, so on a symmetric frame the
    # midspan moment less the knee moment is w L^2 / 8, whatever the haunches and tapers do
    path = EXAMPLE.parent / "alder-lane-rigid-frame.toml"
    model = read_model_file(path).model
    analysis = analyse_model(model)
    knee = analysis.line(Response("moment", "deck@0.001"))
    middle = analysis.line(Response("moment", "8.0"))
    span = 16.0
    assert middle.integral(0.0, span) - knee.integral(0.0, span) == pytest.approx(
        span**2 / 8 - (0.001 * (span - 0.001)) / 2, rel=1e-9)
    assert model.member("deck").varies and model.member("W-leg").varies
    code, output = invoke("check", str(path))
    assert code == 0 and "tapered: depth x 1.5 start to end" in output


def test_the_strip_under_an_influence_line_shows_the_haunch_depths() -> None:
    from matplotlib.collections import PolyCollection

    from influence.model.beamform import continuous_beam
    from influence.output.figures import draw_line

    def depths(model):  # type: ignore[no-untyped-def]
        ax = draw_line(analyse_model(model).line(Response("moment", "10.0")), model)
        strip = ax.get_figure().axes[1]
        return [c for c in strip.collections if isinstance(c, PolyCollection)]

    haunched = read_model_file(EXAMPLE).model
    (outline, *more) = depths(haunched)
    assert len(more) == 2  # one a span
    assert not depths(continuous_beam([20.0, 20.0], 1.0e6, ["pinned", "roller", "roller"]))
    deepest = min(v[1] for c in (outline, *more) for path in c.get_paths() for v in path.vertices)
    assert deepest == pytest.approx(-0.6)  # depth twice the reference at the piers
