"""Drawings checked through their figure objects: true shape, symbols sized in points whatever
the span, hinges at their nodes, labels clear of each other, envelopes in chainage order with
reactions as bars and no factored deflections, legend colours that match the markers, every
sweep drawn in its own style, nil extremes drawn without error, and user text kept plain."""

from __future__ import annotations

import itertools
from pathlib import Path

import numpy as np
import pytest

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.design.envelope import envelope
from influence.design.governing import governing
from influence.design.loading import vehicles_for
from influence.design.sections import envelope_sections
from influence.model.basis import Combination, DesignBasis, LiveLoadSettings
from influence.model.beamform import continuous_beam
from influence.model.reader import read_model, read_model_file
from influence.output.envelope_figures import draw_envelope
from influence.output.figures import draw_line, draw_structure
from influence.output.governing_figures import draw_governing, sweep_styles
from influence.output.symbols import HINGE_SIZE, SYMBOL_SIZE
from tests.cli import invoke
from vehicles.output.tabular import significant
from vehicles.search.sweep import sweep

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"


def markers(ax) -> list:  # type: ignore[no-untyped-def]
    return [line for line in ax.get_lines() if line.get_linestyle() in ("None", "none")]


@pytest.mark.parametrize("span", [4.0, 40.0, 4000.0])
def test_structures_are_drawn_at_true_shape_with_symbols_sized_in_points(span: float) -> None:
    model = continuous_beam([span, span], 1.0e6, ["pinned", "roller", "roller"])
    ax = draw_structure(model)
    assert ax.get_aspect() == 1.0
    sizes = {line.get_markersize() for line in markers(ax)}
    assert SYMBOL_SIZE in sizes and max(sizes) == SYMBOL_SIZE  # the same at any span


def test_the_gerber_hinges_are_drawn_at_their_nodes() -> None:
    model = read_model(EXAMPLES / "gerber-girder.toml")
    ax = draw_structure(model)
    hinges = [line.get_xdata()[0] for line in markers(ax)
              if line.get_marker() == "o" and line.get_markersize() == HINGE_SIZE]
    assert sorted(hinges) == [40.0, 70.0]  # H1 and H2, not beside them


def test_influence_lines_show_the_hinges_in_a_strip_under_the_axis() -> None:
    model = read_model(EXAMPLES / "gerber-girder.toml")
    ax = draw_line(analyse_model(model).line(Response("moment", "P1")), model)
    strip = ax.get_figure().axes[1]
    assert strip.get_position().y1 <= ax.get_position().y0  # outside the ordinate axis
    hinges = [line.get_xdata()[0] for line in markers(strip) if line.get_marker() == "o"]
    assert sorted(hinges) == [40.0, 70.0]


def _overlap(a, b) -> bool:  # type: ignore[no-untyped-def]
    return a.x0 < b.x1 and b.x0 < a.x1 and a.y0 < b.y1 and b.y0 < a.y1


@pytest.mark.parametrize("name", ["truss-rail-bridge", "portal-footbridge", "gerber-girder"])
def test_structure_labels_do_not_overlap(name: str) -> None:
    ax = draw_structure(read_model(EXAMPLES / f"{name}.toml"))
    figure = ax.get_figure()
    renderer = figure._get_renderer()
    boxes = [t.get_window_extent(renderer) for t in ax.texts]
    assert len(boxes) >= 4
    for a, b in itertools.combinations(boxes, 2):
        assert not _overlap(a, b)


@pytest.fixture(scope="module")
def girder_envelope():  # type: ignore[no-untyped-def]
    model = continuous_beam([10.0, 12.0], 2.0e5, ["pinned", "roller", "roller"])
    analysis = analyse_model(model)
    basis = DesignBasis(combinations=(Combination("Strength I", (("LL", 1.75, 1.75),)),),
                        live=LiveLoadSettings(distribution=0.5))
    sections = envelope_sections(model, analysis.path, per_span=4, extra=("3.3",))
    models, _ = vehicles_for(("HL-93", "LM2"), "kN-m")
    return envelope(analysis, models, basis, sections=sections)


def test_envelopes_run_in_chainage_order(girder_envelope) -> None:  # type: ignore[no-untyped-def]
    assert girder_envelope.of("moment")[-1].section.label == "3.3"  # appended last ...
    ax = draw_envelope(girder_envelope, "moment")
    for line in ax.get_lines():
        x = np.asarray(line.get_xdata(), dtype=float)
        if line.get_linestyle() not in ("None", "none") and x.size > 2:
            assert np.all(np.diff(x) >= 0)  # ... but drawn in its place: no doubling back


def test_reactions_are_bars_and_deflections_are_not_factored(girder_envelope) -> None:  # type: ignore[no-untyped-def]
    ax = draw_envelope(girder_envelope, "reaction")
    assert len(ax.patches) >= 2 * len(girder_envelope.of("reaction"))
    joined = [line for line in ax.get_lines() if line.get_linestyle() not in ("None", "none")
              and len(line.get_xdata()) > 2]
    assert joined == []  # no line joining the supports
    ax = draw_envelope(girder_envelope, "deflection")
    labels = ax.get_legend_handles_labels()[1]
    assert not any("factored" in label for label in labels)
    assert ax.yaxis_inverted()  # downward positive, drawn downward


def test_governing_markers_match_their_legend_colours(girder_envelope) -> None:  # type: ignore[no-untyped-def]
    ax = draw_envelope(girder_envelope, "moment")
    handles, labels = ax.get_legend_handles_labels()
    legend = {label: handle for handle, label in zip(handles, labels, strict=True)}
    governs = [label for label in labels if label.startswith("governs")]
    assert len(governs) >= 2
    for label in governs:
        drawn = [line for line in ax.get_lines() if line.get_label() == label]
        assert len(drawn) == 1  # max and min markers of one model and case: one artist
        assert drawn[0].get_color() == legend[label].get_color()


def test_a_nil_extreme_is_drawn_without_error() -> None:
    code, output = invoke("govern", str(EXAMPLES / "gerber-girder.toml"), "moment", "--at",
                          "P1", "--vehicle", "HL-93", "--plot", "/tmp/nil-extreme.png")
    assert code == 0, output


def test_every_sweep_gets_its_own_style_and_axles_and_lanes_are_labelled() -> None:
    read = read_model_file(EXAMPLES / "overpass.toml")
    analysis = analyse_model(read.model)
    models, _ = vehicles_for(("HL-93",), "kN-m")
    result = governing(analysis, Response("moment", "P1"), models)
    line = result.line
    sweeps = [sweep(line.function, case, way, kind="moment", sense="min")
              for case in models[0].cases for way in ("forward", "reverse")]
    assert len(sweeps) == 6
    placements = [p for p in (result.governing.max, result.governing.min) if p is not None]
    upper = draw_governing(line, placements, sweeps, read.model)
    lower = upper.get_figure().axes[-1]
    curves = [ln for ln in lower.get_lines() if len(ln.get_xdata()) > 2]
    assert len(curves) == 6
    assert len({(ln.get_color(), ln.get_linestyle()) for ln in curves}) == 6
    assert len(set(sweep_styles(24))) == 24
    loads = {significant(p) for pl in placements for p in pl.axle_loads if p}
    assert loads <= {t.get_text() for t in upper.texts}
    assert any(label.startswith("lane") for label in upper.get_legend_handles_labels()[1])
    # the arrows and their labels stay inside the axes, under the title
    renderer = upper.get_figure()._get_renderer()
    title = upper.title.get_window_extent(renderer)
    for text in upper.texts:
        assert text.get_window_extent(renderer).y1 <= title.y0 + 1


def test_user_text_is_never_mathtext(tmp_path: Path) -> None:
    path = tmp_path / "dollars.toml"
    path.write_text('title = "Cost $5 to $x_2^{10}$ and a lone $"\n[beam]\nspans = [10.0]\n'
                    'EI = 1.0e5\nsupports = ["pinned", "roller"]\n')
    model = read_model(path)
    ax = draw_structure(model)
    assert ax.get_title().startswith("Cost $5") and not ax.title.get_parse_math()
    code, output = invoke("check", str(path), "--plot", str(tmp_path / "s.png"))
    assert code == 0, output
    code, output = invoke("report", str(path), "--out", str(tmp_path / "r"), "--vehicle",
                          "LM2", "--per-span", "2", "--quiet")
    assert code == 0, output


def test_figure_labels_carry_no_round_off_and_no_scientific_notation() -> None:
    import re

    model = continuous_beam([10.0], 1.0e6, ["pinned", "roller"])
    analysis = analyse_model(model)
    for response in (Response("moment", "4"), Response("deflection", "5")):
        ax = draw_line(analysis.line(response), model)
        texts = [t.get_text() for t in ax.texts]
        assert texts and not any(re.search(r"\de[+-]?\d", t) for t in texts)
        assert len(texts) == 1 if response.kind == "moment" else True  # the -1e-15 end: no label


def test_reactions_off_the_path_are_drawn_by_support() -> None:
    read = read_model_file(EXAMPLES / "portal-footbridge.toml")
    analysis = analyse_model(read.model)
    models, _ = vehicles_for(("LM2",), "kN-m")
    sections = envelope_sections(read.model, analysis.path, per_span=2)
    result = envelope(analysis, models, read.basis, kinds=("reaction",), sections=sections)
    ax = draw_envelope(result, "reaction")
    labels = [t.get_text() for t in ax.get_xticklabels()]
    assert "W-base" in labels and "E-base" in labels


@pytest.mark.parametrize("name", ["alder-lane-rigid-frame", "portal-footbridge",
                                  "truss-rail-bridge", "tarn-viaduct-haunched"])
def test_structure_labels_stay_inside_the_drawing_at_report_size(name: str) -> None:
    from influence.output.figures import structure_size
    from vehicles.output.figure_files import new_figure

    model = read_model(EXAMPLES / f"{name}.toml")
    width, height = structure_size(model, 9.0)
    ax = draw_structure(model, ax=new_figure(width, min(height, 4.2)).add_subplot())
    figure = ax.get_figure()
    renderer = figure._get_renderer()
    inside = ax.get_window_extent(renderer)
    for text in ax.texts:
        box = text.get_window_extent(renderer)
        assert inside.x0 <= box.x0 and box.x1 <= inside.x1, text.get_text()
        assert inside.y0 <= box.y0 and box.y1 <= inside.y1, text.get_text()
