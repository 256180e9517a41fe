"""Quantities with units in model and vehicle files, converted exactly to the file's unit system.

The exact factors are those of the definitions: 1 ft = 0.3048 m and 1 lb = 0.45359237 kg (the
international yard and pound of 1959), standard gravity 9.80665 m/s^2, so 1 lbf =
4.4482216152605 N, 1 kip = 1000 lbf and 1 ksi = 1 kip/in^2 (NIST Special Publication 811, "Guide
for the Use of the International System of Units (SI)", 2008 edition, Appendix B.8 and B.9).
Closed forms below are written with those factors; plain numbers keep meaning the file's units.
"""

from __future__ import annotations

import math
from fractions import Fraction
from pathlib import Path

import pytest

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.errors import ModelError
from influence.model.reader import read_model_file
from tests.cli import refused
from vehicles.errors import VehicleError
from vehicles.library.files import read_load_model
from vehicles.quantities import KEY_DIMENSIONS, quantity

FT = Fraction("0.3048")  # m, exact
KIP = Fraction("4.4482216152605")  # kN, exact
EXACT = 1e-15
"""Relative difference allowed between a converted quantity and its closed form: one rounding."""

PLAIN = """units = "kip-ft"
[beam]
spans = [110.0, 110.0]
EI = 290000.0
supports = ["pinned", "roller", "roller"]
[[loads]]
name = "deck"
load = "DC"
uniform = 1.2
"""

WITH_UNITS = """units = "kip-ft"
[beam]
spans = ["110 ft", "1320 in"]
EI = "29000 ksi * 1440 in^4"
supports = ["pinned", "roller", "roller"]
[[loads]]
name = "deck"
load = "DC"
uniform = "1.2 kip/ft"
"""


def test_quantities_convert_exactly() -> None:
    assert quantity("29000 ksi", "E", "kip-ft") == 29000 * 144  # kip/ft^2
    assert quantity("1440 in^4", "I", "kip-ft") == float(Fraction(1440, 12**4))
    assert quantity("110 ft", "spans", "kN-m") == float(110 * FT)
    assert quantity("1.2 kip/ft", "uniform", "kN-m") == float(Fraction("1.2") * KIP / FT)
    assert quantity("145 kN", "loads", "kip-ft") == float(145 / KIP)
    assert quantity("2.0e5 kN*m^2", "EI", "kip-ft") == float(Fraction(200000) / KIP / FT**2)


def test_e_times_i_of_the_crane_runway_comment() -> None:
    # 29000 ksi x 1440 in^4 = 29000 x 144 kip/ft^2 x 1440 / 20736 ft^4 = 2.9e5 kip-ft^2
    modulus = quantity("29000 ksi", "E", "kip-ft")
    inertia = quantity("1440 in^4", "I", "kip-ft")
    assert modulus * inertia == pytest.approx(2.9e5, rel=EXACT)


def test_a_girder_with_quantities_equals_the_plain_one(tmp_path: Path) -> None:
    plain, united = tmp_path / "plain.toml", tmp_path / "units.toml"
    plain.write_text(PLAIN)
    # one EI: E and I are not separate beam keys, so the EI is given as one quantity
    united.write_text(WITH_UNITS.replace('"29000 ksi * 1440 in^4"', '"41760000 kip*in^2"'))
    a, b = read_model_file(plain), read_model_file(united)
    assert [m.EI for m in a.model.members] == pytest.approx([m.EI for m in b.model.members],
                                                             rel=EXACT)
    assert a.basis.loads[0].uniform == b.basis.loads[0].uniform
    lines = [analyse_model(read.model).line(Response("moment", "S2")) for read in (a, b)]
    assert lines[0].values([55.0, 165.0]) == pytest.approx(lines[1].values([55.0, 165.0]),
                                                           rel=1e-12)


def test_a_member_takes_e_and_i_as_quantities(tmp_path: Path) -> None:
    path = tmp_path / "frame.toml"
    path.write_text('units = "kip-ft"\n[[nodes]]\nname = "A"\nx = 0.0\ny = 0.0\n'
                    'support = "pinned"\n[[nodes]]\nname = "B"\nx = "40 ft"\ny = "0 ft"\n'
                    'support = "roller"\n[[members]]\nname = "AB"\nstart = "A"\nend = "B"\n'
                    'E = "29000 ksi"\nI = "1440 in^4"\nA = "30 in^2"\ndeck = true\n'
                    '[path]\nmembers = ["AB"]\n')
    member = read_model_file(path).model.member("AB")
    assert math.isclose(member.EI, 2.9e5, rel_tol=EXACT)
    assert math.isclose(member.EA, 29000 * 30, rel_tol=EXACT)  # kip


@pytest.mark.parametrize(("change", "item", "expected"), [
    (('spans = ["110 ft"', 'spans = ["110 kip"'), "beam.spans[1]", "is a force, not a length"),
    (('uniform = "1.2 kip/ft"', 'uniform = "1.2 kip"'), "load 'deck'.uniform",
     "not a force per length"),
    (('spans = ["110 ft"', 'spans = ["110 furlongz"'), "beam.spans[1]", "unknown unit"),
    (('spans = ["110 ft"', 'spans = ["ft 110"'), "beam.spans[1]", "not a number with a unit"),
    (('spans = ["110 ft"', 'spans = ["1e999 ft"'), "beam.spans[1]", "out of range"),
    (('spans = ["110 ft"', 'spans = ["2 m**9999999"'), "beam.spans[1]",
     "not a number with a unit"),
])
def test_a_wrong_quantity_names_the_key_and_the_dimension(
        tmp_path: Path, change: tuple[str, str], item: str, expected: str) -> None:
    path = tmp_path / "bad.toml"
    path.write_text(WITH_UNITS.replace('"29000 ksi * 1440 in^4"', "2.9e5").replace(*change))
    with pytest.raises(ModelError) as caught:
        read_model_file(path)
    assert caught.value.item == item and expected in caught.value.problem
    assert expected in refused("check", str(path))


def test_a_vehicle_file_takes_quantities(tmp_path: Path) -> None:
    plain, united = tmp_path / "plain.toml", tmp_path / "units.toml"
    plain.write_text('[vehicle]\nname = "t"\nunits = "kN-m"\nloads = [35.0, 145.0]\n'
                     'spacings = [4.3]\nlane = 9.3\n')
    united.write_text('[vehicle]\nname = "t"\nunits = "kN-m"\nloads = ["8 kip", "145 kN"]\n'
                      'spacings = ["14 ft"]\nlane = "0.64 kip/ft"\n')
    a, b = read_load_model(plain).cases[0], read_load_model(united).cases[0]
    assert b.train is not None and a.train is not None
    assert b.train.items[0].load == float(8 * KIP)
    assert b.train.items[1].gap == float(14 * FT)
    assert b.lane == float(Fraction("0.64") * KIP / FT)


def test_a_vehicle_quantity_of_the_wrong_dimension_is_refused(tmp_path: Path) -> None:
    path = tmp_path / "v.toml"
    path.write_text('[vehicle]\nname = "t"\nunits = "kN-m"\nloads = ["8 ft"]\n')
    with pytest.raises(VehicleError, match="is a length, not a force"):
        read_load_model(path)


def test_model_and_vehicle_keys_of_one_meaning_share_a_dimension() -> None:
    assert KEY_DIMENSIONS["uniform"] is KEY_DIMENSIONS["intensity"] is KEY_DIMENSIONS["lane"]
    assert KEY_DIMENSIONS["spans"] is KEY_DIMENSIONS["gap"] is KEY_DIMENSIONS["at"]
    assert KEY_DIMENSIONS["point"] is KEY_DIMENSIONS["axle"] is KEY_DIMENSIONS["loads"]
