"""`influence check` and `influence line`."""

from __future__ import annotations

import click
import numpy as np

from influence.analysis.lines import analyse_model
from influence.analysis.responses import RESPONSE_KINDS, Response
from influence.cli import main
from influence.cli.options import POSITIONS, POSITIVE_LENGTH
from influence.cli.placement import location_options
from influence.design.input_check import check_model_file
from influence.model.expand import general_form_toml
from influence.model.locations import check_chainage
from influence.model.reader import read_model
from influence.output.line_tables import line_document, line_table, positions
from influence.output.summary import render_summary, summarise
from influence.output.tables import render_csv, render_json, render_table
from vehicles.output.figure_files import check_figure_place


@main.command("check")
@click.argument("model_file", type=click.Path())
@click.option("--format", "fmt", type=click.Choice(["table", "json"]), default="table",
              show_default=True)
@click.option("--plot", "plot_file", type=click.Path(dir_okay=False),
              help="Draw the structure and its path to a PNG, SVG or PDF file.")
@click.option("--expand", is_flag=True,
              help="Print the model in the general form (every node and member, TOML) instead "
                   "of the summary.")
def check_command(model_file: str, fmt: str, plot_file: str | None, expand: bool) -> None:
    """Read and check the whole MODEL_FILE (structure, loads, combinations, live-load and
    section settings, rating and fatigue tables) and summarise it: spans or members, supports,
    hinges, total path length, degree of static indeterminacy, units, and what was checked."""
    if plot_file:
        check_figure_place(plot_file)
    checked = check_model_file(model_file)
    model = checked.read.model
    if expand:
        click.echo(general_form_toml(checked.read), nl=False)
    else:
        summary = summarise(model)
        if fmt == "json":
            click.echo(render_json({**summary.as_dict(), "checked": list(checked.checked)}))
        else:
            click.echo(render_summary(summary) + "\n\nChecked:\n" + "\n".join(
                f"  {line}" for line in checked.checked))
    if plot_file:
        from influence.output.figures import draw_structure, save

        save(draw_structure(model), plot_file)


@main.command("line")
@click.argument("model_file", type=click.Path())
@click.argument("response", type=click.Choice(RESPONSE_KINDS))
@location_options
@click.option("--positions", "position_list", type=POSITIONS,
              help="Exact ordinates at these load chainages.")
@click.option("--step", type=POSITIVE_LENGTH,
              help="Tabulation step along the path (breakpoints added).")
@click.option("--format", "fmt", type=click.Choice(["table", "csv", "json"]), default="table",
              show_default=True)
@click.option("--plot", "plot_file", type=click.Path(dir_okay=False),
              help="Draw the line to a PNG, SVG or PDF file.")
def line_command(model_file: str, response: str, location: str, side: str,
                 component: str | None, position_list: tuple[float, ...] | None,
                 step: float | None,
                 fmt: str, plot_file: str | None) -> None:
    """Exact influence line of RESPONSE (reaction, shear, moment, axial, deflection, rotation)
    at a location of MODEL_FILE."""
    if plot_file:
        check_figure_place(plot_file)
    model = read_model(model_file)
    analysis = analyse_model(model)
    line = analysis.line(Response(response, location, side, component or ""))
    for chainage in position_list or ():
        check_chainage(analysis.path, chainage, "--positions", model.source, "position")
    at = positions(line, step) if position_list is None else np.array(position_list)
    if fmt == "json":
        click.echo(render_json(line_document(line, model.title, at)))
    else:
        table = line_table(line, model.title, at)
        click.echo(render_csv(table) if fmt == "csv" else render_table(table))
    if plot_file:
        from influence.output.figures import draw_line, save

        save(draw_line(line, model), plot_file)
