"""`influence govern` and `influence sweep`."""

from __future__ import annotations

from collections.abc import Callable

import click

from influence.analysis.lines import analyse_model
from influence.analysis.responses import COMPONENTS, RESPONSE_KINDS, SIDES, Response
from influence.cli import main
from influence.cli.options import POSITIVE_LENGTH, TOP
from influence.cli.vehicles import parse_adjustments
from influence.design.governing import governing, parse_concurrent
from influence.design.loading import vehicles_for
from influence.model.reader import read_model
from influence.output.governing_tables import (
    governing_document,
    governing_table,
    sweep_document,
    sweep_table,
)
from influence.output.tables import render_csv, render_json, render_table
from vehicles.errors import VehicleError
from vehicles.loadmodel import LoadModel
from vehicles.search.govern import govern
from vehicles.search.sweep import sweep

_COMPONENTS = sorted({c for cs in COMPONENTS.values() for c in cs})


def location_options(command: Callable[..., None]) -> Callable[..., None]:
    """--at, --side and --component, as every command about one response takes them."""
    for option in reversed((
        click.option("--at", "location", required=True,
                     help="Chainage, node or support name, or MEMBER@DISTANCE."),
        click.option("--side", type=click.Choice(SIDES), default="right", show_default=True,
                     help="Side of the section where the line jumps or two members meet."),
        click.option("--component", type=click.Choice(_COMPONENTS),
                     help="Reaction: vertical, horizontal or moment; deflection: vertical or "
                          "horizontal."),
    )):
        command = option(command)
    return command


def _render(fmt: str, table, document) -> str:  # type: ignore[no-untyped-def]
    if fmt == "json":
        return render_json(document)
    return render_csv(table) if fmt == "csv" else render_table(table)


@main.command("govern")
@click.argument("model_file", type=click.Path())
@click.argument("response", type=click.Choice(RESPONSE_KINDS))
@location_options
@click.option("--vehicle", "vehicles", multiple=True, required=True,
              help="Library load model name or vehicle file; repeat for several.")
@click.option("--adjust", multiple=True, metavar="NAME=VALUE",
              help="Set a load model's adjustment, such as alpha=1.21 (repeatable).")
@click.option("--top", type=TOP, default=1, show_default=True,
              help="How many distinct governing positions to list for each sense.")
@click.option("--concurrent", "concurrent_text", multiple=True,
              help="Another response under the same loads: RESPONSE@LOCATION[:left|right].")
@click.option("--format", "fmt", type=click.Choice(["table", "csv", "json"]), default="table",
              show_default=True)
@click.option("--plot", "plot_file", type=click.Path(dir_okay=False),
              help="Draw the line, the governing trains and the sweeps to PNG, SVG or PDF.")
def govern_command(model_file: str, response: str, location: str, side: str,
                   component: str | None, vehicles: tuple[str, ...], adjust: tuple[str, ...],
                   top: int,
                   concurrent_text: tuple[str, ...], fmt: str, plot_file: str | None) -> None:
    """Where the vehicles must stand for the largest and smallest RESPONSE at a location, how
    large it is, and what else happens then."""
    model = read_model(model_file)
    models, notes = vehicles_for(vehicles, model.units, parse_adjustments(adjust))
    analysis = analyse_model(model)
    result = governing(analysis, Response(response, location, side, component or ""), models,
                       top=top, concurrent_with=[parse_concurrent(t) for t in concurrent_text])
    click.echo(_render(fmt, governing_table(result, model.title, notes),
                       governing_document(result, model.title, notes)))
    if plot_file:
        from influence.output.figures import save
        from influence.output.governing_figures import draw_governing

        g = result.governing
        chosen = [p for p in (g.max, g.min) if p is not None]
        # two load models may name a case alike: find it by model and case
        cases = {(m.name, c.name): c for m in models for c in m.cases}
        sweeps = [sweep(result.line.function, cases[p.model, p.case], p.direction, kind=response,
                        sense=p.sense,
                        ranged_values=[r.value for r in p.ranged_values if r.value is not None])
                  for p in chosen]
        save(draw_governing(result.line, chosen, sweeps, model), plot_file)


@main.command("sweep")
@click.argument("model_file", type=click.Path())
@click.argument("response", type=click.Choice(RESPONSE_KINDS))
@location_options
@click.option("--vehicle", required=True, help="Library load model name or vehicle file.")
@click.option("--adjust", multiple=True, metavar="NAME=VALUE",
              help="Set a load model's adjustment, such as alpha=1.21 (repeatable).")
@click.option("--case", "case_name", help="One case of the load model (default: every case).")
@click.option("--direction", type=click.Choice(["forward", "reverse", "both"]), default="both",
              show_default=True)
@click.option("--sense", type=click.Choice(["max", "min"]), default="max", show_default=True,
              help="Which extreme the lane and the ranged gaps are set for.")
@click.option("--step", type=POSITIVE_LENGTH,
              help="Step of the lead position (breakpoints added).")
@click.option("--format", "fmt", type=click.Choice(["table", "csv", "json"]), default="table",
              show_default=True)
@click.option("--plot", "plot_file", type=click.Path(dir_okay=False))
def sweep_command(model_file: str, response: str, location: str, side: str,
                  component: str | None, vehicle: str, adjust: tuple[str, ...],
                  case_name: str | None, direction: str,
                  sense: str, step: float | None, fmt: str, plot_file: str | None) -> None:
    """The effect on RESPONSE as the vehicle travels, against its lead position (exact)."""
    model = read_model(model_file)
    models, notes = vehicles_for((vehicle,), model.units, parse_adjustments(adjust))
    line = analyse_model(model).line(Response(response, location, side, component or ""))
    cases = [c for c in models[0].cases if case_name in (None, c.name)]
    if not cases:
        raise VehicleError(f"no case named {case_name!r}", item=models[0].name,
                           fix="cases: " + ", ".join(c.name for c in models[0].cases))
    ways = ("forward", "reverse") if direction == "both" else (direction,)
    sweeps = [sweep(line.function, case, way, kind=response, sense=sense, step=step)
              for case in cases for way in ways
              if case.train is not None or way == "forward"]
    title = f"{model.title}: sweep of {line.response.label}, {models[0].name}"
    click.echo(_render(fmt, sweep_table(sweeps, response, model.units, title, notes),
                       sweep_document(sweeps, response, model.units, title, notes)))
    if plot_file:
        from influence.output.figures import save
        from influence.output.governing_figures import draw_governing

        # the trains drawn where the swept cases govern
        chosen = LoadModel(models[0].name, models[0].title, models[0].units, tuple(cases))
        best = govern(line.function, chosen, kind=response, interior=line.scope_interior,
                      section=line.section_chainage)
        extreme = best.max if sense == "max" else best.min  # the sense the sweeps were set for
        placements = [extreme] if extreme is not None else []
        save(draw_governing(line, placements, sweeps, model), plot_file)
