"""`influence fatigue`."""

from __future__ import annotations

import click

from influence.cli import main
from influence.cli.options import ADTT, STRESS_STEP
from influence.fatigue.run import DIRECTION_CHOICES, fatigue
from influence.output.fatigue_tables import (
    TEXT_RANGE_ROWS,
    checks_table,
    fatigue_document,
    fatigue_table,
    method_table,
    range_table,
    stepped_pairs,
)
from influence.output.tables import render_csv, render_json, render_table


@main.command("fatigue")
@click.argument("model_file", type=click.Path(dir_okay=False))
@click.option("--spectrum", type=click.Path(dir_okay=False),
              help="Spectrum CSV of real trucks: one truck a row, units in the header.")
@click.option("--vehicle", help="Or a fatigue load model: HL-93 fatigue, FLM3, FLM4 or a file.")
@click.option("--adtt", type=ADTT,
              help="Trucks a day, one direction, all lanes (instead of [fatigue] adtt).")
@click.option("--traffic-category", help="EN 1991-2 traffic category, such as 'category 2'.")
@click.option("--traffic-type", help="Traffic type sharing a set of lorries, such as "
                                     "'long distance'.")
@click.option("--direction", type=click.Choice(DIRECTION_CHOICES), default="forward",
              show_default=True, help="Direction of travel; both: half the passages each way.")
@click.option("--format", "fmt", type=click.Choice(["table", "csv", "json"]), default="table",
              show_default=True)
@click.option("--range-step", type=STRESS_STEP,
              help="Group the printed stress ranges into steps of this width [ksi or MPa], "
                   "each at its upper end.")
@click.option("--plot", "plot_file", type=click.Path(dir_okay=False),
              help="Draw one crossing's history, its cycles and the ranges a year (PNG, SVG, "
                   "PDF).")
@click.option("--detail", "plot_detail", help="The detail to draw (default the first).")
def fatigue_command(model_file: str, spectrum: str | None, vehicle: str | None,
                    adtt: float | None, traffic_category: str | None,
                    traffic_type: str | None, direction: str, fmt: str,
                    range_step: float | None, plot_file: str | None,
                    plot_detail: str | None) -> None:
    """Stress ranges, cycles, damage a year and life of every [[fatigue_detail]] of MODEL_FILE
    under a spectrum of trucks or a fatigue vehicle."""
    if (spectrum is None) == (vehicle is None):
        raise click.UsageError("give --spectrum FILE or --vehicle NAME, one of them")
    results = fatigue(model_file, spectrum=spectrum, vehicle=vehicle, adtt=adtt,
                      traffic_category=traffic_category, traffic_type=traffic_type,
                      direction=direction)
    if plot_detail is not None:
        results.detail(plot_detail)  # an unknown name fails before anything is printed
    stepped_pairs([], range_step)  # so does a bad step
    if fmt == "json":
        click.echo(render_json(fatigue_document(results, range_step)))
    else:
        render = render_csv if fmt == "csv" else render_table
        blocks = [render(fatigue_table(results)), render(method_table(results)),
                  render(checks_table(results))]
        ranges = range_table(results, range_step)
        if fmt == "csv" or len(ranges.rows) <= TEXT_RANGE_ROWS:
            blocks.append(render(ranges))
        else:
            blocks.append(f"{len(ranges.rows)} stress ranges: see --format csv or json.")
        click.echo("\n\n".join(blocks))
    if plot_file:
        from influence.output.fatigue_figures import fatigue_figure
        from influence.output.figures import save

        save(fatigue_figure(results, plot_detail), plot_file)
