"""`influence govern` and `influence sweep`."""

from __future__ import annotations

from collections.abc import Callable

import click

from influence.analysis.responses import COMPONENTS, RESPONSE_KINDS, SIDES, Response
from influence.cli import main
from influence.cli.options import POSITIVE_LENGTH, TOP
from influence.cli.vehicles import parse_adjustments
from influence.design.from_file import governing_from_file, placement_sweeps, sweeps_from_file
from influence.design.governing import parse_concurrent
from influence.output.governing_tables import (
    case_table,
    governing_document,
    governing_table,
    sweep_document,
    sweep_table,
)
from influence.output.tables import render_csv, render_json, render_table
from vehicles.output.figure_files import check_figure_place

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


PER_LANE_HELP = ("One lane's values: leave out the model file's live_load distribution and "
                 "multiple presence (which the envelope applies).")


@main.command("govern")
@click.argument("model_file", type=click.Path())
@click.argument("response", type=click.Choice(RESPONSE_KINDS))
@location_options
@click.option("--vehicle", "vehicles", multiple=True,
              help="Library load model name or vehicle file; repeat for several (default: the "
                   "file's live_load.vehicles).")
@click.option("--adjust", multiple=True, metavar="NAME=VALUE",
              help="Set a load model's adjustment, such as alpha=1.21 (repeatable).")
@click.option("--top", type=TOP, default=1, show_default=True,
              help="How many distinct governing positions to list for each sense (a placement and "
                   "its mirror image on a symmetric line count once).")
@click.option("--concurrent", "concurrent_text", multiple=True,
              help="Another response under the same loads: RESPONSE@LOCATION[:left|right].")
@click.option("--per-lane", is_flag=True, help=PER_LANE_HELP)
@click.option("--format", "fmt", type=click.Choice(["table", "csv", "json"]), default="table",
              show_default=True)
@click.option("--plot", "plot_file", type=click.Path(dir_okay=False),
              help="Draw the line, the governing trains and the sweeps to PNG, SVG or PDF.")
def govern_command(model_file: str, response: str, location: str, side: str,
                   component: str | None, vehicles: tuple[str, ...], adjust: tuple[str, ...],
                   top: int, concurrent_text: tuple[str, ...], per_lane: bool, fmt: str,
                   plot_file: str | None) -> None:
    """Where the vehicles must stand for the largest and smallest RESPONSE at a location, how
    large it is, and what else happens then (per girder line, as the envelope gives it)."""
    if plot_file:
        check_figure_place(plot_file)
    run = governing_from_file(
        model_file, Response(response, location, side, component or ""), vehicles=vehicles,
        adjust=parse_adjustments(adjust), top=top,
        concurrent_with=[parse_concurrent(t) for t in concurrent_text], per_lane=per_lane)
    result, title = run.result, run.read.model.title
    if fmt == "json":
        click.echo(render_json(governing_document(result, title, run.notes, run.live_note)))
    else:
        render = render_csv if fmt == "csv" else render_table
        blocks = [render(governing_table(result, title, run.notes, run.live_note))]
        if len(run.models) > 1:
            blocks.append(render(case_table(result, title)))
        click.echo("\n\n".join(blocks))
    if plot_file:
        from influence.output.figures import save
        from influence.output.governing_figures import draw_governing

        g = result.governing
        chosen = [p for p in (g.max, g.min) if p is not None]
        save(draw_governing(result.line, chosen, placement_sweeps(run), run.read.model),
             plot_file)


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
@click.option("--per-lane", is_flag=True, help=PER_LANE_HELP)
@click.option("--format", "fmt", type=click.Choice(["table", "csv", "json"]), default="table",
              show_default=True)
@click.option("--plot", "plot_file", type=click.Path(dir_okay=False))
def sweep_command(model_file: str, response: str, location: str, side: str,
                  component: str | None, vehicle: str, adjust: tuple[str, ...],
                  case_name: str | None, direction: str, sense: str, step: float | None,
                  per_lane: bool, fmt: str, plot_file: str | None) -> None:
    """The effect on RESPONSE as the vehicle travels, against its lead position (exact; per
    girder line, as the envelope gives it)."""
    if plot_file:
        check_figure_place(plot_file)
    run = sweeps_from_file(model_file, Response(response, location, side, component or ""),
                           vehicle, case=case_name, direction=direction, sense=sense, step=step,
                           adjust=parse_adjustments(adjust), per_lane=per_lane)
    units, notes = run.read.model.units, [run.live_note, *run.notes]
    click.echo(_render(fmt, sweep_table(run.sweeps, response, units, run.title, notes),
                       sweep_document(run.sweeps, response, units, run.title, run.notes,
                                      run.live_scale, run.live_note)))
    if plot_file:
        from influence.output.figures import save
        from influence.output.governing_figures import draw_governing

        # the trains drawn where the swept cases govern in the swept sense
        placements = [run.placement] if run.placement is not None else []
        save(draw_governing(run.line, placements, list(run.sweeps), run.read.model), plot_file)
