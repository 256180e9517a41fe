"""`influence envelope` and `influence report`."""

from __future__ import annotations

import sys
from collections.abc import Callable, Iterator
from contextlib import contextmanager

import click

from influence.analysis.lines import Analysis, analyse_model
from influence.cli import main
from influence.cli.options import PER_SPAN, POSITIVE_LENGTH, not_empty
from influence.cli.vehicles import parse_adjustments
from influence.design.envelope import (
    ENVELOPE_CHOICES,
    ENVELOPE_RESPONSES,
    Envelope,
    envelope,
    section_responses,
)
from influence.design.loading import vehicles_for
from influence.design.sections import envelope_sections
from influence.errors import ModelError
from influence.model.basis import DesignBasis, SectionSettings
from influence.model.reader import read_model_file
from influence.model.structure import Model
from influence.output.envelope_tables import deflection_table, envelope_document, envelope_table
from influence.output.tables import render_csv, render_json, render_table
from vehicles.loadmodel import LoadModel


def resolve_vehicles(names: tuple[str, ...], model: Model, basis: DesignBasis,
                     adjust: dict[str, float]) -> tuple[list[LoadModel], list[str]]:
    """Load models named on the command line, else in the model file, in the model's units,
    with notes on those converted."""
    chosen = names or basis.live.vehicles
    if not chosen:
        raise ModelError("no vehicles given", source=model.source, item="live load",
                         fix="give --vehicle NAME or FILE, or live_load.vehicles in the file")
    return vehicles_for(chosen, model.units, {**basis.live.adjust, **adjust})


@contextmanager
def progress_bar(total: int, label: str, quiet: bool) -> Iterator[click.termui.ProgressBar]:  # type: ignore[type-arg]
    """click's progress bar on the terminal's error stream (never mixed into the output); click
    stays silent when that stream is piped, and ``quiet`` silences it always."""
    with click.progressbar(length=total, label=label, file=sys.stderr, hidden=quiet,
                           show_eta=True) as bar:
        yield bar


def run_envelope(model_file: str, vehicles: tuple[str, ...], responses: tuple[str, ...],
                 step: float | None, per_span: int | None, quiet: bool,
                 adjust: tuple[str, ...] = ()) -> tuple[Analysis, Envelope]:
    read = read_model_file(model_file)
    model, basis = read.model, read.basis
    models, notes = resolve_vehicles(vehicles, model, basis, parse_adjustments(adjust))
    deflection_models: list[LoadModel] = []
    if basis.live.deflection_vehicles:
        deflection_models, more = vehicles_for(basis.live.deflection_vehicles, model.units,
                                               basis.live.adjust)
        notes += more + ["Deflection check with " + ", ".join(
            m.name for m in deflection_models) + "."]
    analysis = analyse_model(model)
    settings = basis.sections
    if step is not None or per_span is not None:
        settings = SectionSettings(per_span=per_span or settings.per_span, step=step,
                                   extra=settings.extra)
    sections = envelope_sections(model, analysis.path, per_span=settings.per_span,
                                 step=settings.step, extra=settings.extra)
    kinds = responses or ENVELOPE_RESPONSES
    total = len(section_responses(sections, kinds, model))
    with progress_bar(total, "envelopes", quiet) as bar:
        result = envelope(analysis, models, basis, kinds=kinds, sections=sections,
                          progress=bar.update, notes=notes,
                          deflection_models=deflection_models)
    return analysis, result


def envelope_options(command: Callable[..., None]) -> Callable[..., None]:
    """The vehicles, adjustments, responses and sections of an envelope run."""
    for option in reversed((
        click.option("--vehicle", "vehicles", multiple=True,
                     help="Library load model name or vehicle file; repeat for several."),
        click.option("--adjust", multiple=True, metavar="NAME=VALUE",
                     help="Set a load model's adjustment, such as alpha=1.21 (repeatable)."),
        click.option("--responses", "responses", multiple=True,
                     type=click.Choice(ENVELOPE_CHOICES),
                     help="Responses to envelope (repeatable)."),
        click.option("--step", type=POSITIVE_LENGTH,
                     help="Section spacing along each span [length]."),
        click.option("--per-span", type=PER_SPAN,
                     help="Divisions of each span (default 10: tenth points)."),
    )):
        command = option(command)
    return command


@main.command("envelope")
@click.argument("model_file", type=click.Path())
@envelope_options
@click.option("--format", "fmt", type=click.Choice(["table", "csv", "json"]), default="table",
              show_default=True)
@click.option("--plot", "plot_file", type=click.Path(dir_okay=False),
              help="Draw the envelopes to a PNG, SVG or PDF file.")
@click.option("--quiet", is_flag=True, help="No progress bar.")
def envelope_command(model_file: str, vehicles: tuple[str, ...], adjust: tuple[str, ...],
                     responses: tuple[str, ...],
                     step: float | None, per_span: int | None, fmt: str, plot_file: str | None,
                     quiet: bool) -> None:
    """Envelopes of the largest and smallest live-load effects at every section of MODEL_FILE,
    with the dead loads and factored combinations of the file."""
    if step is not None and per_span is not None:
        raise click.UsageError("give --step or --per-span, not both")
    analysis, result = run_envelope(model_file, vehicles, responses, step, per_span, quiet,
                                    adjust)
    model = analysis.model
    kinds = responses or ENVELOPE_RESPONSES
    if fmt == "json":
        click.echo(render_json(envelope_document(result, model.title)))
    else:
        render = render_csv if fmt == "csv" else render_table
        blocks = [render(envelope_table(result, kind, model.title)) for kind in kinds
                  if result.of(kind)]
        if result.deflection_checks:
            blocks.append(render(deflection_table(result, model.title)))
        click.echo("\n\n".join(blocks))
    if plot_file:
        from influence.output.figures import save
        from influence.output.report import envelope_figure

        save(envelope_figure(result, kinds, model.title), plot_file)


@main.command("report")
@click.argument("model_file", type=click.Path())
@click.option("--out", "out_dir", required=True, type=click.Path(file_okay=False),
              callback=not_empty,
              help="Folder for report.pdf, figures/ and tables/.")
@envelope_options
@click.option("--quiet", is_flag=True, help="No progress bar.")
def report_command(model_file: str, vehicles: tuple[str, ...], adjust: tuple[str, ...],
                   out_dir: str,
                   responses: tuple[str, ...], step: float | None, per_span: int | None,
                   quiet: bool) -> None:
    """Write the calculation package for MODEL_FILE: a PDF report, its figures as PNG and the
    envelope and combination tables as CSV."""
    if step is not None and per_span is not None:
        raise click.UsageError("give --step or --per-span, not both")
    analysis, result = run_envelope(model_file, vehicles, responses, step, per_span, quiet,
                                    adjust)
    from influence.output.report import write_report

    files = write_report(analysis, result, out_dir, responses or ENVELOPE_RESPONSES)
    click.echo(f"wrote {files.pdf} ({files.pages} pages), {len(files.figures)} figures and "
               f"{len(files.tables)} tables in {out_dir}")
