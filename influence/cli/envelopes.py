"""`influence envelope` and `influence report`."""

from __future__ import annotations

import sys
from collections.abc import Callable, Iterator
from contextlib import ExitStack, contextmanager
from typing import Any

import click

from influence.cli import main
from influence.cli.options import PER_SPAN, POSITIVE_LENGTH, not_empty
from influence.cli.vehicles import parse_adjustments
from influence.design.bars import default_responses
from influence.design.envelope import ENVELOPE_CHOICES
from influence.design.from_file import EnvelopeRun, envelope_from_file
from influence.output.envelope_tables import deflection_table, envelope_document, envelope_table
from influence.output.tables import render_csv, render_json, render_table
from vehicles.output.figure_files import check_figure_place


class _Bar:
    """A progress callback drawing click's bar on the error stream (never mixed into the
    output), opened at the first report, when the total is known; click stays silent when that
    stream is piped, and ``quiet`` silences it always."""

    def __init__(self, label: str, quiet: bool, stack: ExitStack) -> None:
        self.label, self.quiet, self.stack = label, quiet, stack
        self.bar: Any = None
        self.done = 0

    def __call__(self, done: int, total: int) -> None:
        if self.bar is None:
            self.bar = self.stack.enter_context(click.progressbar(
                length=total, label=self.label, file=sys.stderr, hidden=self.quiet,
                show_eta=True))
        self.bar.update(done - self.done)
        self.done = done


@contextmanager
def progress_bar(label: str, quiet: bool) -> Iterator[Callable[[int, int], None]]:
    """A progress callback for a library run, closed when the run ends."""
    with ExitStack() as stack:
        yield _Bar(label, quiet, stack)


def run_envelope(model_file: str, vehicles: tuple[str, ...], responses: tuple[str, ...],
                 step: float | None, per_span: int | None, quiet: bool,
                 adjust: tuple[str, ...] = ()) -> EnvelopeRun:
    if step is not None and per_span is not None:
        raise click.UsageError("give --step or --per-span, not both")
    with progress_bar("envelopes", quiet) as report:
        return envelope_from_file(model_file, vehicles=vehicles, responses=responses, step=step,
                                  per_span=per_span, adjust=parse_adjustments(adjust),
                                  progress=report)


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
    if plot_file:
        check_figure_place(plot_file)
    run = run_envelope(model_file, vehicles, responses, step, per_span, quiet, adjust)
    model, result = run.analysis.model, run.envelope
    kinds = responses or default_responses(model)
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
        from influence.output.envelope_figures import envelope_figure
        from influence.output.figures import save

        save(envelope_figure(result, kinds, model.title), plot_file)


@main.command("report")
@click.argument("model_file", type=click.Path())
@click.option("--out", "out_dir", required=True, type=click.Path(),
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
    from influence.output.report import report_from_file
    from vehicles.output.places import check_folder_place

    check_folder_place(out_dir, "--out")  # before any work: nothing is written on failure
    with progress_bar("envelopes", quiet) as report:
        files = report_from_file(model_file, out_dir, vehicles=vehicles, responses=responses,
                                 step=step, per_span=per_span, adjust=parse_adjustments(adjust),
                                 progress=report)
    click.echo(f"wrote {files.pdf} ({files.pages} pages), {len(files.figures)} figures and "
               f"{len(files.tables)} tables in {out_dir}")
