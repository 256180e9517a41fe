"""The calculation package: ``report.pdf`` typeset with reportlab, the figures as PNG, the tables
as CSV, and ``SHA256SUMS`` listing every file.

The whole package is written into a temporary folder beside the target and swapped in only when
complete (:func:`vehicles.output.places.written_folder`): on any failure the target folder is
exactly as it was, and a new report replaces an earlier one whole (no stale figure or table is
left). A folder holding anything but an earlier report is refused.

Every figure is drawn once: to vector PDF, laid on its page, and rasterised from the same PDF
for its PNG file.
"""

from __future__ import annotations

import hashlib
from collections.abc import Sequence
from dataclasses import dataclass
from datetime import date
from pathlib import Path

from influence.analysis.lines import Analysis
from influence.design.envelope import Envelope
from influence.design.from_file import Progress
from influence.model.project import ProjectInfo
from influence.model.reader import ModelFile
from influence.output.envelope_tables import deflection_table, envelope_table
from influence.output.report_assessments import Assessments
from influence.output.report_story import ReportSource, report_story
from vehicles.loadmodel import LoadModel
from vehicles.output.places import written_folder
from vehicles.output.tabular import render_csv


@dataclass(frozen=True)
class ReportFiles:
    """What a report run wrote."""

    pdf: Path
    figures: tuple[Path, ...]
    tables: tuple[Path, ...]
    pages: int


def tool_name() -> str:
    """This tool's name and installed version."""
    from importlib.metadata import PackageNotFoundError, version

    try:
        return f"influence-lines {version('influence-lines')}"
    except PackageNotFoundError:
        return "influence-lines"


def report_source(model_file: str | Path, project: ProjectInfo | None = None) -> ReportSource:
    """The input file's name and SHA-256, the ``[project]`` fields, the tool and today's date."""
    path = Path(model_file)
    if project is None:
        from influence.model.reader import read_model_file

        project = read_model_file(path).project
    digest = hashlib.sha256(path.read_bytes()).hexdigest()
    return ReportSource(path.name, digest, project, tool_name(), date.today().isoformat())


def _deflection_models(envelope: Envelope) -> list[LoadModel]:
    live = envelope.basis.live
    if not (live.deflection_limit and live.deflection_vehicles):
        return []
    from influence.design.loading import vehicles_for

    return vehicles_for(live.deflection_vehicles, envelope.units, live.adjust)[0]


def _page_count(pdf: Path) -> int:
    from pypdf import PdfReader

    return len(PdfReader(pdf).pages)


def write_report(analysis: Analysis, envelope: Envelope, out: str | Path, kinds: Sequence[str],
                 source: ReportSource | None = None,
                 deflection_models: Sequence[LoadModel] | None = None,
                 assessments: Assessments | None = None) -> ReportFiles:
    """Write report.pdf, figures/*.png, tables/*.csv and SHA256SUMS into the folder ``out``.

    Args:
        analysis: the factorised model.
        envelope: the envelope run.
        out: the package folder: new, empty, or holding an earlier report (replaced whole).
        kinds: the responses enveloped, in the order the report shows them.
        source: the input file, its digest and the title-block fields (default: the model's
            own source file, without [project] fields).
        deflection_models: load models of the deflection check (default: read from the design
            basis).
        assessments: a load rating and a fatigue run to add as their own sections.
    """
    from influence.output.report_figures import lay_figures, write_pngs
    from influence.output.report_pages import RunningText, build

    model = analysis.model
    if source is None:
        source = (report_source(model.source) if model.source and Path(model.source).is_file()
                  else ReportSource(model.source or "-", "-", ProjectInfo(), tool_name(),
                                    date.today().isoformat()))
    chosen = list(deflection_models) if deflection_models is not None else \
        _deflection_models(envelope)
    story = report_story(analysis, envelope, kinds, source, chosen, assessments)
    running = RunningText(source.project_line, model.title, source.path, source.digest,
                          source.tool, source.date)

    def fill(folder: Path) -> tuple[list[str], list[str], int]:
        (folder / "figures").mkdir()
        (folder / "tables").mkdir()
        pdf = folder / "report.pdf"
        build(str(pdf), story.flowables, running)
        lay_figures(pdf, story.figures, story.places)
        pngs = write_pngs(story.figures, folder / "figures")
        tables = []
        for kind in kinds:
            if envelope.of(kind):
                path = folder / "tables" / f"envelope-{kind}.csv"
                path.write_text(render_csv(envelope_table(envelope, kind, model.title)),
                                encoding="utf-8")
                tables.append(path)
        if envelope.deflection_checks:
            path = folder / "tables" / "deflection-check.csv"
            path.write_text(render_csv(deflection_table(envelope, model.title)),
                            encoding="utf-8")
            tables.append(path)
        relative = [p.relative_to(folder).as_posix() for p in pngs]
        return relative, [p.relative_to(folder).as_posix() for p in tables], _page_count(pdf)

    pngs, tables, pages = written_folder(out, fill)
    target = Path(out)
    return ReportFiles(pdf=target / "report.pdf", figures=tuple(target / p for p in pngs),
                       tables=tuple(target / p for p in tables), pages=pages)


def report_from_file(path: str | Path, out: str | Path, *, vehicles: Sequence[str] = (),
                     responses: Sequence[str] = (), step: float | None = None,
                     per_span: int | None = None, adjust: dict[str, float] | None = None,
                     progress: Progress | None = None) -> ReportFiles:
    """The calculation package of a model file (what ``influence report`` writes): the envelope
    with its dead loads, combinations and deflection check, and the load rating and the fatigue
    of the file's details when it asks for them (``[rating]``, ``[[fatigue_detail]]``).

    Args:
        path: the model file.
        out: the package folder (see :func:`write_report`).
        vehicles, responses, step, per_span, adjust, progress: as for
            :func:`influence.design.from_file.envelope_from_file`.
    """
    from influence.design.bars import default_responses
    from influence.design.from_file import envelope_from_file

    run = envelope_from_file(path, vehicles=vehicles, responses=responses, step=step,
                             per_span=per_span, adjust=adjust, progress=progress)
    kinds = tuple(responses) or default_responses(run.analysis.model)
    return write_report(run.analysis, run.envelope, out, kinds, source=report_source(path),
                        assessments=assessments_of(run.read))


def assessments_of(read: ModelFile) -> Assessments:
    """The load rating and fatigue a model file asks for; an assessment that cannot run leaves
    a sentence saying why instead of its pages."""
    from influence.fatigue.settings import fatigue_settings
    from vehicles.errors import ToolError

    ratings = fatigue = None
    notes: list[str] = []
    if "rating" in read.document:
        from influence.rating.run import rate

        try:
            ratings = rate(read)
        except ToolError as error:
            notes.append(f"Load rating left out: {error}")
    if read.document.get("fatigue_detail"):
        from influence.fatigue.run import fatigue as run_fatigue

        settings = fatigue_settings(read.document, read.source, read.model.units)
        standard = settings.standard if settings is not None else "AASHTO"
        vehicle = FATIGUE_LOADING.get(standard, "HL-93 fatigue")
        try:
            fatigue = run_fatigue(read, vehicle=vehicle)
        except ToolError as error:
            notes.append(f"Fatigue left out: {error} (run influence fatigue with the traffic "
                         "to use)")
    return Assessments(ratings, fatigue, tuple(notes))


FATIGUE_LOADING = {"AASHTO": "HL-93 fatigue", "EN": "FLM3"}
"""The fatigue load the report runs each standard's details under (AASHTO LRFD 3.6.1.4: the
fatigue truck; EN 1991-2 4.6.4: FLM3, which needs a traffic category)."""
