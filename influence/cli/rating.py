"""`influence rate` and `influence permit`: parse, call one library function, print."""

from __future__ import annotations

import click

from influence.cli import main
from influence.cli.options import ADTT
from influence.output.rating_tables import (
    not_rated_table,
    permit_document,
    permit_table,
    postings_table,
    rating_document,
    ratings_table,
    summary_table,
)
from influence.output.tables import render_csv, render_json, render_table
from influence.rating.permit_check import check_permit
from influence.rating.run import rate

LEVELS = ("inventory", "operating", "legal", "permit")
FORMATS = ("table", "csv", "json")


@main.command("rate")
@click.argument("model_file", type=click.Path(dir_okay=False))
@click.option("--vehicle", "vehicles", multiple=True, metavar="NAME|FILE",
              help="Library load model or vehicle file to rate (repeatable); default: the "
                   "rating vehicles of each level.")
@click.option("--level", "levels", multiple=True, type=click.Choice(LEVELS),
              help="Rating level (repeatable); default: the levels of [rating]. For LRFR, "
                   "inventory and operating are the design levels.")
@click.option("--adtt", type=ADTT, help="Trucks a day in one direction, instead of [rating].")
@click.option("--concurrent-moment", is_flag=True,
              help="Report, with every shear rating, the moment under the same loads.")
@click.option("--format", "fmt", type=click.Choice(FORMATS), default="table",
              show_default=True)
def rate_command(model_file: str, vehicles: tuple[str, ...], levels: tuple[str, ...],
                 adtt: float | None, concurrent_moment: bool, fmt: str) -> None:
    """Rating factors of every section of MODEL_FILE that has a capacity, for each vehicle and
    level, with the lowest per vehicle and the postings (AASHTO MBE: LRFR, LFR or ASR as the
    file's [rating] says)."""
    ratings = rate(model_file, vehicles, levels, concurrent_moment=concurrent_moment,
                   adtt=adtt)
    if fmt == "json":
        click.echo(render_json(rating_document(ratings)))
        return
    render = render_csv if fmt == "csv" else render_table
    tables = [summary_table(ratings), postings_table(ratings), ratings_table(ratings)]
    if ratings.not_rated:
        tables.append(not_rated_table(ratings))
    click.echo("\n\n".join(render(t) for t in tables))


@main.command("permit")
@click.argument("model_file", type=click.Path(dir_okay=False))
@click.option("--vehicle", required=True, metavar="FILE",
              help="The permit vehicle: a vehicle file with its axles (or a library name).")
@click.option("--escorted", is_flag=True,
              help="Escorted, no other vehicles on the bridge (a special permit).")
@click.option("--crawl", is_flag=True,
              help="Escorted crossing at 10 mph or less: no dynamic allowance.")
@click.option("--trips", type=click.Choice(["single", "multiple"]),
              help="Special permit for one trip or several; default: [rating.permit], else a "
                   "routine permit.")
@click.option("--adtt", type=ADTT, help="Trucks a day in one direction, instead of [rating].")
@click.option("--format", "fmt", type=click.Choice(FORMATS), default="table",
              show_default=True)
def permit_command(model_file: str, vehicle: str, escorted: bool, crawl: bool,
                   trips: str | None, adtt: float | None, fmt: str) -> None:
    """Check one permit vehicle over MODEL_FILE, both directions, every rated section: PASS or
    FAIL per section and overall, the governing section, position and factor, and the
    restrictions assumed."""
    check = check_permit(model_file, vehicle, escorted=escorted, crawl=crawl, trips=trips,
                         adtt=adtt)
    if fmt == "json":
        click.echo(render_json(permit_document(check)))
        return
    render = render_csv if fmt == "csv" else render_table
    tables = [permit_table(check)]
    if check.not_rated:
        tables.append(not_rated_table(check.ratings))
    click.echo("\n\n".join(render(t) for t in tables))
