"""``influence vehicles``: list the library of load models, or show and draw one model."""

from __future__ import annotations

from pathlib import Path

import click

from influence.cli import main
from vehicles.library.catalog import library_models, load_model
from vehicles.loadmodel import CATEGORIES
from vehicles.output.describe import details, summary
from vehicles.output.figure_files import check_figure_place
from vehicles.output.tables import as_json, library_table, model_text
from vehicles.units import SYSTEMS


def parse_adjustments(values: tuple[str, ...]) -> dict[str, float]:
    """NAME=VALUE pairs of --adjust as a mapping."""
    parsed = {}
    for value in values:
        name, equals, number = value.partition("=")
        try:
            parsed[name.strip()] = float(number)
        except ValueError:
            equals = ""
        if not equals or not name.strip():
            raise click.BadParameter(f"'{value}' is not NAME=VALUE (for example alpha=1.21)",
                                     param_hint="--adjust")
    return parsed


@main.command("vehicles")
@click.argument("name", required=False, metavar="[NAME|FILE]")
@click.option("--units", type=click.Choice(list(SYSTEMS)), default=None,
              help="Convert to these units (default: the model's own).")
@click.option("--format", "output_format", type=click.Choice(["table", "json"]),
              default="table", show_default=True, help="Output format.")
@click.option("--plot", "plot_path", type=click.Path(dir_okay=False, path_type=Path),
              help="Draw the model's trains to this image file (.png, .svg, .pdf).")
@click.option("--adjust", multiple=True, metavar="NAME=VALUE",
              help="Give a model input a value, such as alpha=1.21 (repeatable).")
@click.option("--category", type=click.Choice(CATEGORIES), default=None,
              help="List only the models of this category.")
def vehicles_command(name: str | None, units: str | None, output_format: str,
                     plot_path: Path | None, adjust: tuple[str, ...],
                     category: str | None) -> None:
    """List the library of load models, or show one by NAME or vehicle FILE."""
    if name is None:
        if plot_path is not None or adjust:
            raise click.UsageError("--plot and --adjust need a NAME or FILE")
        rows = [summary(model) for model in library_models(units)
                if category in (None, model.category)]
        click.echo(library_table(rows) if output_format == "table" else as_json(rows))
        return
    if category is not None:
        raise click.UsageError("--category selects from the list: give no NAME or FILE")
    if plot_path is not None:
        check_figure_place(plot_path)
    model = load_model(name, units, parse_adjustments(adjust))
    if plot_path is not None:
        from vehicles.output.figures import plot_model

        plot_model(model, plot_path)
        click.echo(f"drawing written to {plot_path}", err=True)
    description = details(model)
    click.echo(model_text(description) if output_format == "table" else as_json(description))
