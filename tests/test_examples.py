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

import re
import tomllib
from pathlib import Path

import numpy as np
import pytest

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.model.reader import read_model

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


VEHICLE_FILES = sorted((Path(__file__).resolve().parent.parent / "examples" / "vehicles").glob(
    "*.toml"))


@pytest.mark.parametrize("path", VEHICLE_FILES, ids=lambda p: p.stem)
def test_example_vehicles_read(path: Path) -> None:
    from vehicles.library.catalog import load_model

    model = load_model(path)
    assert model.cases and model.cases[0].train is not None


def test_crane_pair_on_a_simple_span_follows_the_two_load_rule() -> None:
    # AISC Manual, moving loads, "two equal concentrated loads" (case number from memory;
    # confirmed in substance by T. G. Hicks, Civil Engineering Formulas, ch. 2, p. 64, and
    # re-derived: computed): for a spacing a < 0.586 L the largest moment is
    # (P/2L)(L - a/2)^2. Here on a 40 ft simple span, P = 31.5 kip x 1.25 impact, a = 11.5 ft.
    from influence.model.beamform import simple_beam
    from vehicles.library.catalog import load_model
    from vehicles.search.govern import govern

    crane = load_model(by_vehicle("crane-pair"))
    analysis = analyse_model(simple_beam(40.0, units="kip-ft"))
    best = 0.0
    for section in np.linspace(14.0, 20.0, 49):  # every 0.125 ft around the peak
        line = analysis.line(Response("moment", repr(float(section))))
        found = govern(line.ppoly, crane, kind="moment").max
        assert found is not None
        best = max(best, found.value)
    P, a, L = 31.5 * 1.25, 11.5, 40.0
    expected = P / (2 * L) * (L - a / 2) ** 2
    # the absolute maximum sits under a load at (L - a/2)/2 = 17.125 ft, one of the sections
    assert best == pytest.approx(expected, rel=1e-9)


def by_vehicle(name: str) -> Path:
    return next(p for p in VEHICLE_FILES if p.stem == name)


def test_pellow_brook_bridge_rates_on_its_textbook_dead_loads() -> None:
    # Two equal continuous spans under a uniform load w: the moment over the middle support is
    # -w L^2 / 8 (three-moment equation; AISC Manual beam diagrams, continuous beam of two equal
    # spans, case number from memory); a point load standing on the support adds nothing.
    from influence.rating.run import rate

    ratings = rate(by_name("pellow-brook-bridge"), ("Type 3",), ("legal",))
    pier = next(r for r in ratings.ratings if r.section == "P1" and r.response == "moment")
    length = 70.0
    assert dict(pier.rated.dead) == pytest.approx({
        "deck": -1.05 * length**2 / 8, "parapet": -0.16 * length**2 / 8,
        "surfacing": -0.24 * length**2 / 8}, rel=1e-9)
    assert dict(pier.dead_terms) == {"deck": "DC", "parapet": "DC", "surfacing": "DW"}
    assert ratings.lowest("Type 3", "legal").rating_factor > 1.0   # no posting for Type 3
    assert ratings.postings.legal[0].posting.action == "none"


def test_pellow_brook_permit_passes_escorted_only() -> None:
    from influence.rating.permit_check import check_permit

    carrier = by_vehicle("crane-carrier-5-axle")
    assert check_permit(by_name("pellow-brook-bridge"), carrier, escorted=True).verdict == "PASS"
    assert check_permit(by_name("pellow-brook-bridge"), carrier).verdict == "FAIL"


# Stiffness comments: "(E = 29000 ksi, I = 1440 in^4)" beside or above the value they explain.
# Exact unit factors (1 in = 0.0254 m, 1 ft = 12 in; kip and kN never mix within a file).
MODULUS_IN = {"kip-ft": {"ksi": 144.0, "psi": 0.144, "ksf": 1.0},
              "kN-m": {"GPa": 1.0e6, "MPa": 1.0e3, "kPa": 1.0}}
"""Modulus units in each file's force per length squared (kip/ft^2, kN/m^2)."""
LENGTH_IN = {"kip-ft": {"in": 1 / 12, "ft": 1.0}, "kN-m": {"mm": 1e-3, "cm": 1e-2, "m": 1.0}}
"""Length units in each file's length unit (ft, m)."""
STATED_ROUNDING = 1e-3  # comments state three or four significant figures
_NUMBER = r"([0-9][0-9.]*(?:e[+-]?[0-9]+)?)"
_PAIR = re.compile(rf"\(E = {_NUMBER} (\w+), ([IA]) = {_NUMBER} (\w+)\^([24])\)")
_MODULUS = re.compile(rf"\bE = {_NUMBER} (\w+)\b")


def stated_stiffnesses(text: str, units: str) -> dict[str, list[float]]:
    """EI and EA products, and moduli E, stated in the file's comments, in the file's units."""
    stated: dict[str, list[float]] = {"EI": [], "EA": [], "E": []}
    for comment in (line.partition("#")[2] for line in text.splitlines()):
        for modulus, unit, what, size, length, power in _PAIR.findall(comment):
            assert (what, power) in (("I", "4"), ("A", "2")), comment
            product = (float(modulus) * MODULUS_IN[units][unit]
                       * float(size) * LENGTH_IN[units][length] ** int(power))
            stated["E" + what].append(product)
        stated["E"] += [float(m) * MODULUS_IN[units][u] for m, u in _MODULUS.findall(comment)]
    return stated


def stiffness_values(node: object, key: str = "",
                     found: dict[str, list[float]] | None = None) -> dict[str, list[float]]:
    """Every EI, EA and E value of a model document (a per-range EI [from, to, EI] gives EI)."""
    found = {"EI": [], "EA": [], "E": []} if found is None else found
    if isinstance(node, dict):
        for name, value in node.items():
            stiffness_values(value, name, found)
    elif isinstance(node, list):
        for value in node:
            ranged = key == "EI" and isinstance(value, list)
            stiffness_values(value[-1] if ranged else value, key, found)
    elif key in found and isinstance(node, int | float) and not isinstance(node, bool):
        found[key].append(float(node))
    return found


def test_the_comment_parser_reads_the_crane_runway_comment() -> None:
    # 29000 ksi x 1440 in^4 = 29000 x 144 kip/ft^2 x 1440/20736 ft^4 = 2.9e5 kip ft^2 (computed)
    stated = stated_stiffnesses("EI = 1  # kip ft^2 (E = 29000 ksi, I = 1440 in^4)", "kip-ft")
    assert stated["EI"] == [pytest.approx(2.9e5, rel=1e-12)]
    stated = stated_stiffnesses("# (E = 200 GPa, A = 0.15 m^2) and E = 210 GPa", "kN-m")
    assert stated["EA"] == [pytest.approx(3.0e7)] and 2.1e8 in stated["E"]


@pytest.mark.parametrize("path", EXAMPLES, ids=lambda p: p.stem)
def test_every_stiffness_matches_the_comment_that_explains_it(path: Path) -> None:
    text = path.read_text(encoding="utf-8")
    document = tomllib.loads(text)
    stated = stated_stiffnesses(text, document["units"])
    values = stiffness_values(document)
    if not any(values.values()):
        # stiffness given as quantities with their units ("29000 ksi"): it explains itself
        assert '= "' in text and "ksi" in text or "GPa" in text, "an example without stiffness"
        return
    for key, numbers in values.items():
        for value in numbers:
            assert any(value == pytest.approx(s, rel=STATED_ROUNDING) for s in stated[key]), (
                f"{path.name}: {key} = {value:g} is not what its comments state: {stated[key]}")
    # a value written beside its own explanation must be that explanation
    for line in text.splitlines():
        code, _, comment = line.partition("#")
        own = stated_stiffnesses("#" + comment, document["units"])["EI"]
        written = re.match(r"\s*EI\s*=\s*" + _NUMBER + r"\s*$", code)
        if own and written:
            assert float(written.group(1)) == pytest.approx(own[0], rel=STATED_ROUNDING), line
