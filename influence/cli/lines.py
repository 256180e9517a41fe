"""`influence check` and `influence line`."""

from __future__ import annotations

import click
import numpy as np

from influence.analysis.lines import analyse_model
from influence.analysis.responses import RESPONSE_KINDS, Response
from influence.cli import main
from influence.cli.placement import location_options
from influence.model.reader import read_model
from influence.output.line_tables import line_document, line_table, positions
from influence.output.summary import render_summary, summarise
from influence.output.tables import render_csv, render_json, render_table
from vehicles.output.figure_files import check_figure_place


def _position_list(text: str | None) -> np.ndarray | None:
    if text is None:
        return None
    try:
        return np.array([float(part) for part in text.split(",") if part.strip()])
    except ValueError:
        raise click.BadParameter("give chainages separated by commas, such as 0,2.5,7",
                                 param_hint="--positions") from None


@main.command("check")
@click.argument("model_file", type=click.Path(dir_okay=False))
@click.option("--format", "fmt", type=click.Choice(["table", "json"]), default="table",
              show_default=True)
@click.option("--plot", "plot_file", type=click.Path(dir_okay=False),
              help="Draw the structure and its path to a PNG, SVG or PDF file.")
def check_command(model_file: str, fmt: str, plot_file: str | None) -> None:
    """Validate MODEL_FILE and summarise it: spans or members, supports, hinges, total path
    length, degree of static indeterminacy and units."""
    if plot_file:
        check_figure_place(plot_file)
    model = read_model(model_file)
    summary = summarise(model)
    click.echo(render_json(summary.as_dict()) if fmt == "json" else render_summary(summary))
    if plot_file:
        from influence.output.figures import draw_structure, save

        save(draw_structure(model), plot_file)


@main.command("line")
@click.argument("model_file", type=click.Path(dir_okay=False))
@click.argument("response", type=click.Choice(RESPONSE_KINDS))
@location_options
@click.option("--positions", "position_text", help="Exact ordinates at these load chainages.")
@click.option("--step", type=float, help="Tabulation step along the path (breakpoints added).")
@click.option("--format", "fmt", type=click.Choice(["table", "csv", "json"]), default="table",
              show_default=True)
@click.option("--plot", "plot_file", type=click.Path(dir_okay=False),
              help="Draw the line to a PNG, SVG or PDF file.")
def line_command(model_file: str, response: str, location: str, side: str,
                 component: str | None, position_text: str | None, step: float | None,
                 fmt: str, plot_file: str | None) -> None:
    """Exact influence line of RESPONSE (reaction, shear, moment, axial, deflection, rotation)
    at a location of MODEL_FILE."""
    if plot_file:
        check_figure_place(plot_file)
    model = read_model(model_file)
    line = analyse_model(model).line(Response(response, location, side, component or ""))
    at = _position_list(position_text)
    at = positions(line, step) if at is None else at
    if fmt == "json":
        click.echo(render_json(line_document(line, model.title, at)))
    else:
        table = line_table(line, model.title, at)
        click.echo(render_csv(table) if fmt == "csv" else render_table(table))
    if plot_file:
        from influence.output.figures import draw_line, save

        save(draw_line(line, model), plot_file)
