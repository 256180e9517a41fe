"""Traffic spectrum files: reading, exact unit conversion, and each bad input as one line.

Trucks are invented rows of a weigh-in-motion file for the demo town's river crossing.
"""

from __future__ import annotations

import math

import pytest

from influence.errors import ModelError
from influence.fatigue import read_spectrum
from influence.fatigue.spectrum import SpectrumTruck, parse_spectrum

EXACT = 1e-12
HEADER = "axle_1 [kip],axle_2 [kip],axle_3 [kip],spacing_1 [ft],spacing_2 [ft],per_day [-]\n"
GOOD = HEADER + "8,32,32,14,30,120\n12,34,,16,,40.5\n\n"


def test_reads_trucks_in_file_order():
    spectrum = parse_spectrum(GOOD, "wim.csv")
    assert spectrum.units == "kip-ft" and spectrum.frequency == "per_day"
    assert spectrum.trucks == (SpectrumTruck((8.0, 32.0, 32.0), (14.0, 30.0), 120.0, 2),
                               SpectrumTruck((12.0, 34.0), (16.0,), 40.5, 3))
    assert spectrum.daily_passages().tolist() == [120.0, 40.5]


def test_converts_units_exactly():
    """1 kip = 4.4482216152605 kN, 1 ft = 0.3048 m (exact by definition)."""
    truck = parse_spectrum(GOOD, "wim.csv", units="kN-m").trucks[0]
    assert math.isclose(truck.axle_loads[1], 32.0 * 4.4482216152605, rel_tol=EXACT)
    assert math.isclose(truck.axle_gaps[1], 30.0 * 0.3048, rel_tol=EXACT)


def test_reads_a_file(tmp_path):
    path = tmp_path / "wim.csv"
    path.write_text(GOOD, encoding="utf-8")
    assert len(read_spectrum(path).trucks) == 2


def test_zeros_stand_for_missing_axles():
    text = HEADER + "12,34,0,16,0,40\n"
    assert parse_spectrum(text).trucks[0].axle_loads == (12.0, 34.0)


def test_counts_are_shares_of_the_daily_trucks():
    text = "axle_1 [kN],axle_2 [kN],spacing_1 [m],count [-]\n50,80,4,30\n60,90,5,10\n"
    spectrum = parse_spectrum(text, "wim.csv")
    assert spectrum.daily_passages(adtt_sl=800.0).tolist() == [600.0, 200.0]
    with pytest.raises(ModelError, match="wim.csv: count: the spectrum gives counts"):
        spectrum.daily_passages()


@pytest.mark.parametrize(("text", "message"), [
    (HEADER + ",,,,,10\n", "wim.csv: row 2, column 'axle_1 [kip]': a row without axles"),
    (HEADER + "8,32,,14,,-3\n", "wim.csv: row 2, column 'per_day [-]': negative per_day"),
    (HEADER + "8,32,,14,,5\n8,3x2,,14,,5\n",
     "wim.csv: row 3, column 'axle_2 [kip]': '3x2' is not a number"),
    (HEADER + "8,32,,14,,nan\n", "wim.csv: row 2, column 'per_day [-]': 'nan' is not a finite"),
    ("axle_1 [kip],axle_2,spacing_1 [ft],per_day [-]\n8,32,14,5\n",
     "wim.csv: column 2: column 'axle_2' has no unit in brackets"),
    ("axle_1 [kip],axle_2 [kN],spacing_1 [ft],per_day [-]\n8,32,14,5\n",
     "wim.csv: axle_2: axle_2 in [kN] but axle_1 in [kip]"),
    ("axle_1 [kip],axle_2 [kip],spacing_1 [m],per_day [-]\n8,32,14,5\n",
     "wim.csv: header: axles in kip with spacings in m"),
    ("axle_1 [ton],per_day [-]\n8,5\n", "wim.csv: axle_1: unknown unit [ton]"),
    (HEADER + "8,32,,,,5\n", "row 2, column 'spacing_1 [ft]': axle_2 without a positive spacing_1"),
    (HEADER + "8,,32,,30,5\n", "row 2, column 'axle_3 [kip]': axle_3 given after an empty"),
    (HEADER + "8,32,,14,30,5\n", "row 2, column 'spacing_2 [ft]': spacing_2 given but there is"),
    (HEADER + "8,32,32,14,30\n", "wim.csv: row 2: 5 cells for 6 columns"),
    (HEADER, "wim.csv: no trucks below the header"),
    ("", "wim.csv: the file is empty"),
    ("axle_1 [kip],axle_3 [kip],spacing_1 [ft],per_day [-]\n8,32,14,5\n",
     "axle columns numbered [1, 3]"),
    ("axle_1 [kip],per_day [-],count [-]\n8,5,5\n", "both per_day and count"),
    ("axle_1 [kip]\n8\n", "no frequency column"),
    ("axle_1 [kip],weight [kip],per_day [-]\n8,5,5\n", "unknown column 'weight [kip]'"),
])
def test_bad_files_say_file_row_and_column(text, message):
    with pytest.raises(ModelError) as caught:
        parse_spectrum(text, "wim.csv")
    assert message in str(caught.value)
    assert "\n" not in str(caught.value)


def test_unknown_target_units():
    with pytest.raises(ModelError, match="unknown unit system 'lb-in'"):
        parse_spectrum(GOOD, "wim.csv", units="lb-in")


def test_missing_file(tmp_path):
    with pytest.raises(ModelError, match="file not found"):
        read_spectrum(tmp_path / "none.csv")
