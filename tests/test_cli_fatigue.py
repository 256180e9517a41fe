"""`influence fatigue`: what it prints in each format, the drawing, and one-line errors naming
the file, the row and the column for bad input."""

from __future__ import annotations

import csv
import io
import json
from pathlib import Path

import pytest

from tests.cli import invoke
from tests.fatigue_files import girder_file, spectrum_file

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"
MODEL = str(EXAMPLES / "wrenfield-girder.toml")
SPECTRUM = str(EXAMPLES / "wrenfield-wim.csv")
DETAIL_KEYS = {"name", "location", "category", "stress_ranges", "damage_per_year", "life_years",
               "equivalent_range", "infinite_life", "governing_range"}


def test_table_carries_conventions_units_caution_and_the_counting_method():
    code, output = invoke("fatigue", MODEL, "--spectrum", SPECTRUM)
    assert code == 0, output
    for words in ("Units: force kip", "Sign conventions:", "Caution:", "stresses in ksi",
                  "ASTM E1049-85 5.4.4", "G3 bottom flange, cover plate end",
                  "Table 6.6.1.2.5-2", "Fatigue I"):
        assert words in output


def test_json_gives_every_detail_with_its_ranges_and_life():
    code, output = invoke("fatigue", MODEL, "--vehicle", "HL-93 fatigue", "--format", "json")
    assert code == 0, output
    document = json.loads(output)
    assert document["cycle_counting"].startswith("ASTM E1049-85 5.4.4")
    assert any("qualified engineer" in line for line in document["conventions"])
    assert len(document["details"]) == 4
    for detail in document["details"]:
        assert set(detail) >= DETAIL_KEYS
        assert isinstance(detail["infinite_life"], bool)
        assert all(len(pair) == 2 and pair[0] > 0 for pair in detail["stress_ranges"])
        assert detail["governing_range"] == detail["stress_ranges"][0][0]


def test_csv_tables_have_commented_headers_and_unit_columns():
    code, output = invoke("fatigue", MODEL, "--spectrum", SPECTRUM, "--format", "csv")
    assert code == 0, output
    first = output.split("\n\n")[0]
    rows = list(csv.reader(io.StringIO("\n".join(
        line for line in first.splitlines() if not line.startswith("#")))))
    assert rows[0][0] == "detail" and "largest range [ksi]" in rows[0]
    assert len(rows) == 5
    assert "stress range [ksi]" in output


def test_plot_draws_one_crossing_and_the_ranges(tmp_path):
    target = tmp_path / "splice.png"
    code, output = invoke("fatigue", MODEL, "--spectrum", SPECTRUM, "--plot", str(target),
                          "--detail", "G3 top flange splice near P1")
    assert code == 0, output
    assert target.stat().st_size > 10_000


def test_spectrum_or_vehicle_exactly_one():
    assert invoke("fatigue", MODEL)[0] == 2
    assert invoke("fatigue", MODEL, "--spectrum", SPECTRUM, "--vehicle", "FLM3")[0] == 2


def _one_line_error(*args: str) -> str:
    code, output = invoke(*args)
    assert code == 1, output
    assert "Traceback" not in output
    lines = output.strip().splitlines()
    assert len(lines) == 1 and lines[0].startswith("error: ")
    return lines[0]


def _model(tmp_path: Path, **detail: object) -> Path:
    fields = {"name": "flange", "location": "30.0", "response": "moment", "category": "C",
              "section_modulus": 900.0, **detail}
    return girder_file(tmp_path, [60.0], [fields], {"standard": "AASHTO", "adtt": 500,
                                                    "lanes": 1})


HEADER = ["axle_1 [kip]", "axle_2 [kip]", "spacing_1 [ft]", "count [-]"]


@pytest.mark.parametrize(("header", "rows", "where"), [
    (HEADER, [[20, 30, 14, 5], [None, None, None, 3]], "row 3, column 'axle_1 [kip]'"),
    (HEADER, [[20, 30, 14, 5], [10, 12, 15, -2]], "row 3, column 'count [-]'"),
    (["axle_1 [kip]", "axle_2 [kN]", "spacing_1 [ft]", "count [-]"], [[20, 30, 14, 5]],
     "axle_2"),
    (["axle_1 [kip]", "axle_2 [kip]", "spacing_1 [m]", "count [-]"], [[20, 30, 4, 5]],
     "header"),
    (HEADER, [[20, 1e300, 14, 5]], "row 2, column 'axle_2 [kip]'"),
    (HEADER, [[20, 30, 14, "nan"]], "row 2, column 'count [-]'"),
], ids=["row without axles", "negative count", "mixed force units", "kip with metres",
        "axle out of range", "count not a number"])
def test_bad_spectrum_rows_name_the_file_row_and_column(tmp_path, header, rows, where):
    trucks = spectrum_file(tmp_path, header, rows)
    message = _one_line_error("fatigue", str(_model(tmp_path)), "--spectrum", str(trucks))
    assert str(trucks) in message and where in message


def test_an_unknown_category_names_the_file_and_the_detail(tmp_path):
    model = _model(tmp_path, category="F")
    message = _one_line_error("fatigue", str(model), "--vehicle", "HL-93 fatigue")
    assert str(model) in message and "fatigue_detail 'flange'.category" in message
    assert "E'" in message  # the fix lists the categories


@pytest.mark.parametrize("location", ["75.0", "-3", "G9@2.0", "S7"])
def test_a_detail_off_the_structure_names_the_file_and_the_detail(tmp_path, location):
    model = _model(tmp_path, location=location)
    message = _one_line_error("fatigue", str(model), "--vehicle", "HL-93 fatigue")
    assert str(model) in message and "fatigue_detail 'flange'.location" in message


def test_a_set_of_lorries_needs_its_traffic_type(tmp_path):
    model = girder_file(tmp_path, [30.0], [{
        "name": "flange", "location": "15.0", "response": "moment", "category": "71",
        "section_modulus": 8.0e6}], {"standard": "EN", "gamma_Mf": 1.35}, units="kN-m")
    message = _one_line_error("fatigue", str(model), "--vehicle", "FLM4", "--traffic-category",
                              "category 2")
    assert "long distance" in message
    code, output = invoke("fatigue", str(model), "--vehicle", "FLM4", "--traffic-category",
                          "category 2", "--traffic-type", "long distance", "--format", "json")
    assert code == 0, output
    assert json.loads(output)["passages_per_year"] == pytest.approx(0.5e6, rel=1e-12)


def test_an_unknown_detail_to_draw_is_one_line(tmp_path):
    message = _one_line_error("fatigue", MODEL, "--spectrum", SPECTRUM, "--plot",
                              str(tmp_path / "x.png"), "--detail", "G9")
    assert "G3 bottom flange" in message


def test_report_content_gives_the_tables_and_a_figure_a_detail():
    from influence.fatigue.run import fatigue
    from influence.output.fatigue_figures import fatigue_figures
    from influence.output.fatigue_tables import fatigue_tables
    from influence.output.tables import Table

    results = fatigue(MODEL, vehicle="HL-93 fatigue")
    tables = fatigue_tables(results)
    assert all(isinstance(t, Table) for t in tables) and len(tables) == 4
    assert [row[0] for row in tables[0].rows] == [r.detail.name for r in results.details]
    figures = fatigue_figures(results)
    assert len(figures) == len(results.details)
    assert all(ax.get_xlabel() == "lead axle position [ft]" for ax in figures)


def test_range_steps_group_the_printed_ranges_on_the_safe_side():
    exact = json.loads(invoke("fatigue", MODEL, "--spectrum", SPECTRUM, "--format", "json")[1])
    code, output = invoke("fatigue", MODEL, "--spectrum", SPECTRUM, "--format", "json",
                          "--range-step", "0.5")
    assert code == 0, output
    for fine, coarse in zip(exact["details"], json.loads(output)["details"], strict=True):
        pairs = coarse["stress_ranges"]
        assert all(size / 0.5 == round(size / 0.5) for size, _ in pairs)
        assert sum(n for _, n in pairs) == pytest.approx(sum(n for _, n in fine["stress_ranges"]))
        assert pairs[0][0] >= fine["stress_ranges"][0][0]
        assert coarse["damage_per_year"] == fine["damage_per_year"]  # from the exact ranges
    assert _one_line_error("fatigue", MODEL, "--spectrum", SPECTRUM, "--range-step", "-1")
