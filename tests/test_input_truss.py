"""The compact truss form: the same structure as the general form, checked by the method of
sections, and written back out by ``influence check --expand``.

Method of sections (R. C. Hibbeler, "Structural Analysis", 8th ed., 2012, sec. 3.5, and ch. 6
for influence lines of trusses): with the load reaching the truss at panel points only, a chord
force in a panel of a simply supported truss of depth h is the beam moment at the panel point
opposite the cut chord divided by h (bottom chord in tension, top chord in compression), and a
diagonal carries the panel shear times (diagonal length / h): in tension when it slopes down
toward midspan (Pratt), in compression when it slopes up (Howe).
"""

from __future__ import annotations

import math
from pathlib import Path

import numpy as np
import pytest

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.errors import ModelError
from influence.model.expand import general_form_toml
from influence.model.reader import read_model, read_model_file
from influence.output.summary import summarise
from tests.cli import invoke, refused

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"
SAME = 1e-12
"""Relative agreement of two models of one truss (the same arithmetic in another order)."""

RAIL_BRIDGE = """title = "Wend river rail bridge, Ashcombe: one main truss"
units = "kN-m"
[truss]
panels = 8
panel_length = 6.0
depth = 7.0
type = "Pratt"
deck = "bottom"
E = 2.1e8
chord_A = 0.030
diagonal_A = 0.012
vertical_A = 0.012
stringer_EI = 3.0e5
stringer_EA = 2.0e6
"""

PANELS, PANEL, DEPTH = 8, 6.0, 7.0
SPAN = PANELS * PANEL


def compact(tmp_path: Path, text: str = RAIL_BRIDGE) -> Path:
    path = tmp_path / "truss.toml"
    path.write_text(text)
    return path


JOINT_OPPOSITE = {
    # (type, deck): (bottom chord cut, panel-point number of the top joint moments are about)
    ("Pratt", "bottom"): ("L3L4", 3), ("Howe", "bottom"): ("L3L4", 4),
    ("Warren with verticals", "bottom"): ("L3L4", 3), ("Warren", "bottom"): ("L3L4", 3.5),
    ("Pratt", "top"): ("L3L4", 3), ("Howe", "top"): ("L3L4", 4),
    ("Warren with verticals", "top"): ("L3L4", 4), ("Warren", "top"): ("L4L5", 4),
}
"""Pratt diagonals slope down toward midspan (panel 4 from U3 to L4), Howe diagonals up (L3 to
U4); Warren diagonals alternate from the end post; a Warren truss's other chord has its joints
at mid-panel."""


def beam_moment(x: float, load_at: float) -> float:
    """Moment of a simple span [length per unit load] at x for a unit load at load_at."""
    return (SPAN - load_at) * x / SPAN if x <= load_at else load_at * (SPAN - x) / SPAN


def test_the_compact_rail_bridge_is_the_general_form_example(tmp_path: Path) -> None:
    general = read_model(EXAMPLES / "truss-rail-bridge.toml")
    built = read_model(compact(tmp_path))

    def described(model):  # type: ignore[no-untyped-def]
        return {m.name: (m.start, m.end, m.EA, m.is_bar, m.sliding_end, m.deck,
                         m.EI if not m.is_bar or m.deck else None) for m in model.members}

    assert described(built) == described(general)
    assert {n.name: (n.x, n.y, n.support) for n in built.nodes} == {
        n.name: (n.x, n.y, n.support) for n in general.nodes}
    a, b = analyse_model(general), analyse_model(built)
    at = np.linspace(0.0, SPAN, 193)
    for response in (Response("axial", "L3L4@3.0"), Response("axial", "U3L4@4.0"),
                     Response("axial", "U1L1@3.5"), Response("axial", "L0U1@4.0"),
                     Response("reaction", "L0"), Response("deflection", "L4"),
                     Response("moment", "ST3@3.0"), Response("shear", "20.0")):
        np.testing.assert_allclose(b.line(response).values(at), a.line(response).values(at),
                                   rtol=SAME, atol=SAME)


@pytest.mark.parametrize("kind", ["Pratt", "Howe", "Warren", "Warren with verticals"])
@pytest.mark.parametrize("deck", ["bottom", "top"])
def test_every_type_is_a_determinate_truss_that_obeys_statics(
        tmp_path: Path, kind: str, deck: str) -> None:
    model = read_model(compact(tmp_path, RAIL_BRIDGE.replace('"Pratt"', f'"{kind}"').replace(
        'deck = "bottom"', f'deck = "{deck}"')))
    assert summarise(model).static_indeterminacy == 0
    analysis = analyse_model(model)
    loads = np.linspace(0.0, SPAN, 49)
    ends = ("L0", "L8") if deck == "bottom" else ("U0", "U8")
    total = sum(analysis.line(Response("reaction", end)).values(loads) for end in ends)
    np.testing.assert_allclose(total, 1.0, atol=1e-12)
    # the bottom chord of the panel left of midspan; the section's moment is taken about the
    # top-chord joint where the cut diagonal meets the top chord
    chord, about = JOINT_OPPOSITE[kind, deck]
    node_x = about * PANEL
    line = analysis.line(Response("axial", f"{chord}@1.0"))
    for load_at in (2 * PANEL, 4 * PANEL, 6 * PANEL):
        expected = beam_moment(node_x, load_at) / DEPTH
        assert float(line.values([load_at])[0]) == pytest.approx(expected, rel=1e-9)


@pytest.mark.parametrize(("kind", "sign"), [("Pratt", 1.0), ("Howe", -1.0)])
def test_diagonals_of_pratt_and_howe_trusses(tmp_path: Path, kind: str, sign: float) -> None:
    analysis = analyse_model(read_model(compact(tmp_path, RAIL_BRIDGE.replace(
        '"Pratt"', f'"{kind}"'))))
    diagonal = "U1L2" if kind == "Pratt" else "U2L1"
    line = analysis.line(Response("axial", f"{diagonal}@1.0"))
    # a load at midspan: panel 2 shear is the left reaction, 1/2
    expected = sign * 0.5 * math.hypot(PANEL, DEPTH) / DEPTH
    assert float(line.values([SPAN / 2])[0]) == pytest.approx(expected, rel=1e-9)


def test_expand_writes_a_general_form_that_reads_as_the_same_model(tmp_path: Path) -> None:
    path = compact(tmp_path, RAIL_BRIDGE + '[sections]\nextra = ["U3L4@4.0"]\n')
    status, text = invoke("check", str(path), "--expand")
    assert status == 0 and "[[members]]" in text and "[truss]" not in text
    assert text == general_form_toml(read_model_file(path))
    expanded = tmp_path / "expanded.toml"
    expanded.write_text(text)
    again, first = read_model_file(expanded), read_model_file(path)
    assert again.model.form == "general" and again.basis.sections.extra == ("U3L4@4.0",)
    assert {m.name: m for m in again.model.members} == {m.name: m for m in first.model.members}
    assert again.model.path == first.model.path


@pytest.mark.parametrize("name", ["overpass", "gerber-girder", "crane-runway",
                                  "portal-footbridge", "warren-truss-road-bridge"])
def test_every_example_expands_to_the_same_structure(tmp_path: Path, name: str) -> None:
    first = read_model_file(EXAMPLES / f"{name}.toml")
    expanded = tmp_path / "expanded.toml"
    expanded.write_text(general_form_toml(first))
    again = read_model_file(expanded)
    assert {m.name: m for m in again.model.members} == {m.name: m for m in first.model.members}
    assert {n.name: n for n in again.model.nodes} == {n.name: n for n in first.model.nodes}
    assert again.basis == first.basis


@pytest.mark.parametrize(("change", "item", "words"), [
    (("panels = 8", "panels = 7"), "truss.panels", "Pratt truss of 7 panels"),
    (("panels = 8", "panels = 0"), "truss.panels", "whole number of 1 or more"),
    (('"Pratt"', '"Fink"'), "truss.type", "'Fink' is not known"),
    (('deck = "bottom"', 'deck = "middle"'), "truss.deck", "'middle' is not known"),
    (("depth = 7.0", "depth = -7.0"), "truss.depth", "not positive"),
    (("depth = 7.0", 'depth = "7 kN"'), "truss.depth", "not a length"),
    (("chord_A = 0.030\n", ""), "truss", "no axial stiffness for the chord bars"),
    (("stringer_EI = 3.0e5\n", ""), "truss", "missing key 'stringer_EI'"),
    (("E = 2.1e8", "E = 2.1e8\nspans = [1.0]"), "truss", "spans belongs in [beam]"),
])
def test_a_bad_truss_is_refused(tmp_path: Path, change: tuple[str, str], item: str,
                                words: str) -> None:
    path = compact(tmp_path, RAIL_BRIDGE.replace(*change))
    with pytest.raises(ModelError) as caught:
        read_model_file(path)
    assert caught.value.item == item and words in str(caught.value)
    assert words in refused("check", str(path))


def test_a_truss_with_its_own_path_is_refused(tmp_path: Path) -> None:
    path = compact(tmp_path, RAIL_BRIDGE + '[path]\nmembers = ["ST1"]\n')
    assert "makes its own path" in refused("check", str(path))
