"""One table renderer for both packages, printing numbers as engineers do: fixed point, about
four significant figures of a column's largest value, forces to 0.1, positions to 0.01, the
decimal points aligned, round-off of the table's scale printed as 0 (common practice for
calculation packages)."""

from __future__ import annotations

import re

import influence.output.tables as influence_tables
import vehicles.output.tables as vehicle_tables
from vehicles.output import tabular
from vehicles.output.tabular import Table, cell_texts, fixed, render_csv, render_table


def test_both_packages_share_one_renderer() -> None:
    assert influence_tables.render_table is tabular.render_table
    assert influence_tables.Table is tabular.Table
    assert vehicle_tables.render_columns is tabular.render_columns


def test_numbers_are_fixed_point_and_aligned_on_the_decimal() -> None:
    table = Table([], ("M [kN-m]", "x [m]", "w [m]"),
                  [(2746.36, 0.0, 1.5e-7), (-3.2e-13, 37.18349, 2.5e-5), (12345678.9, 80.0, 0.0)],
                  formats=("effect", "position", "number"))
    text = render_table(table)
    assert not re.search(r"\de[+-]?\d", text)  # no scientific notation
    cells = cell_texts(table)
    assert [row[0] for row in cells] == ["2746.4", "0.0", "12345678.9"]  # -3.2e-13 is round-off
    assert [row[1] for row in cells] == ["0.00", "37.18", "80.00"]
    assert [row[2] for row in cells] == ["0.00000015", "0.00002500", "0.00000000"]
    lines = text.splitlines()[2:]
    points = {line.index(".") for line in lines}  # first column: one decimal position
    assert len(points) == 1


def test_text_is_left_aligned_and_csv_keeps_full_precision() -> None:
    table = Table(["head"], ("name", "v [kN]"), [("a", 1.0 / 3.0), ("long name", 2.0)])
    lines = render_table(table).splitlines()
    assert lines[3].startswith("a ") and lines[4].startswith("long name")
    assert "0.3333333333333333" in render_csv(table)


def test_fixed_never_prints_minus_zero() -> None:
    assert fixed(-0.00004, 3) == "0.000" and fixed(-1.25, 1) in ("-1.2", "-1.3")


def test_infinite_values_print_as_inf_and_leave_the_column_format_alone() -> None:
    """A fatigue life of infinite years sits in a column of finite lives: the finite ones keep
    their digits and the infinite one reads inf."""
    table = Table(["lives"], ("life [years]",), [(float("inf"),), (123.456,), (7.0,)])
    assert cell_texts(table) == [["inf"], ["123.5"], ["7.0"]]
