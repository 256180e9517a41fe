"""The calculation package: a multi-page PDF, the same figures as PNG, and CSV tables.

Pages: title block with the cautions, conventions and model summary; the structure drawn; the
load models with their sources and drawings; influence lines of the key sections; an envelope
plot per response with the governing model marked; the combination tables; the live-load
deflection check. Everything is written in a temporary folder beside the output folder and moved
into place at the end, so an error leaves nothing half-written.
"""

from __future__ import annotations

import os
import shutil
import tempfile
import textwrap
from collections.abc import Iterator, Sequence
from dataclasses import dataclass
from datetime import date
from pathlib import Path
from typing import Any

from influence.analysis.lines import Analysis
from influence.design.envelope import Envelope, EnvelopeEntry
from influence.output.conventions import CAUTION, SIGN_CONVENTIONS
from influence.output.envelope_tables import deflection_table, envelope_header, envelope_table
from influence.output.figures import PALETTE, draw_line, draw_structure
from influence.output.summary import render_summary, summarise
from influence.output.tables import Table, render_csv, render_table
from vehicles.output.describe import details
from vehicles.output.tables import model_text

PAGE = (11.69, 8.27)  # A4 landscape [in]
ROWS_PER_PAGE = 46
TEXT_LINES_PER_PAGE = 60


@dataclass(frozen=True)
class ReportFiles:
    """What a report run wrote."""

    pdf: Path
    figures: tuple[Path, ...]
    tables: tuple[Path, ...]
    pages: int


def _pyplot() -> Any:
    import matplotlib

    matplotlib.use("Agg", force=False)
    import matplotlib.pyplot as plt

    return plt


def _text_pages(title: str, text: str, size: float = 7.0, wrap: bool = True) -> Iterator[Any]:
    """Figures holding monospaced text, split across pages; long lines wrap unless ``wrap`` is
    off, when the font shrinks to fit the widest line instead."""
    plt = _pyplot()
    lines: list[str] = []
    for line in text.splitlines():
        lines.extend(textwrap.wrap(line, 150, subsequent_indent="    ") or [""] if wrap
                     else [line])
    widest = max((len(line) for line in lines), default=1)
    if not wrap:
        # a monospace character is about 0.6 of the font size wide; 11 in of usable width
        size = min(size, 11.0 * 72 / (0.6 * widest))
    for start in range(0, max(len(lines), 1), TEXT_LINES_PER_PAGE):
        figure = plt.figure(figsize=PAGE)
        figure.text(0.04, 0.96, title, fontsize=12, weight="bold", va="top",
                    color=PALETTE["line"])
        figure.text(0.04, 0.92, "\n".join(lines[start:start + TEXT_LINES_PER_PAGE]),
                    fontsize=size, family="monospace", va="top")
        yield figure


def _table_pages(title: str, table: Table) -> Iterator[Any]:
    for start in range(0, max(len(table.rows), 1), ROWS_PER_PAGE):
        part = Table([], table.columns, table.rows[start:start + ROWS_PER_PAGE])
        suffix = f" ({start // ROWS_PER_PAGE + 1})" if len(table.rows) > ROWS_PER_PAGE else ""
        yield from _text_pages(title + suffix, render_table(part), size=7.0, wrap=False)


def _title_page(analysis: Analysis, envelope: Envelope) -> Iterator[Any]:
    model = analysis.model
    summary = render_summary(summarise(model))
    header = "\n".join([
        f"Prepared {date.today().isoformat()} with influence-lines.",
        "",
        "CAUTION: " + CAUTION,
        "",
        "Sign conventions: " + SIGN_CONVENTIONS,
        "",
        *envelope_header(envelope, model.title)[4:],
        "",
        "Model:",
        *summary.splitlines()[4:],
    ])
    return _text_pages(f"{model.title}: influence lines, envelopes and combinations",
                       header)


def key_sections(envelope: Envelope) -> list[EnvelopeEntry]:
    """The entries whose influence lines the report shows: the largest positive moment of each
    span, the most negative moment over each interior support, the largest reaction."""
    chosen: list[EnvelopeEntry] = []
    moments = [e for e in envelope.of("moment") if e.section.chainage is not None]
    for number in sorted({e.section.span for e in moments}):
        inside = [e for e in moments if e.section.span == number and e.live_max is not None]
        if inside:
            chosen.append(max(inside, key=lambda e: e.live_max or 0.0))
    supports = [e for e in moments if e.section.support]
    if supports:
        chosen.append(min(supports, key=lambda e: e.live_min or 0.0))
    reactions = [e for e in envelope.of("reaction") if e.live_max is not None]
    if reactions:
        chosen.append(max(reactions, key=lambda e: e.live_max or 0.0))
    return chosen[:6]


def report_figures(analysis: Analysis, envelope: Envelope,
                   kinds: Sequence[str]) -> Iterator[tuple[str, Any]]:
    """(name, figure) of every page, in order, made one at a time so that each can be saved
    and closed before the next is drawn."""
    plt = _pyplot()
    model = analysis.model
    for index, figure in enumerate(_title_page(analysis, envelope)):
        yield f"01-title-{index + 1}", figure

    figure, ax = plt.subplots(figsize=PAGE, layout="constrained")
    draw_structure(model, ax=ax)
    yield "02-structure", figure

    from vehicles.output.figures import plot_train

    for number, load_model in enumerate(envelope.models, start=1):
        text = model_text(details(load_model))
        for index, page in enumerate(_text_pages(f"Load model: {load_model.name}", text)):
            yield f"03-load-model-{number}-{index + 1}", page
        trains = [case for case in load_model.cases if case.train is not None]
        if trains:
            figure, axes = plt.subplots(len(trains), 1, figsize=PAGE, layout="constrained",
                                        squeeze=False)
            for ax, case in zip(axes[:, 0], trains, strict=True):
                assert case.train is not None
                plot_train(case.train, units=load_model.units, ax=ax)
                ax.set_title(f"{load_model.name}: {case.name}", fontsize=9)
            yield f"03-load-model-{number}-trains", figure

    keys = key_sections(envelope)
    for start in range(0, len(keys), 2):
        figure, axes = plt.subplots(2, 1, figsize=PAGE, layout="constrained", squeeze=False)
        for ax, entry in zip(axes[:, 0], keys[start:start + 2], strict=False):
            line = analysis.line(entry.response)
            draw_line(line, model, ax=ax)
            for placement in (entry.live.max, entry.live.min):
                if placement is not None and placement.axle_positions:
                    ax.plot(placement.axle_positions, [0.0] * len(placement.axle_positions),
                            "v", color=PALETTE["section"], markersize=5)
            ax.set_title(f"Influence line: {line.response.label} (axles of the governing "
                         "placements marked)", fontsize=9)
        for ax in axes[len(keys[start:start + 2]):, 0]:
            ax.axis("off")
        yield f"04-influence-lines-{start // 2 + 1}", figure

    from influence.output.envelope_figures import draw_envelope

    for kind in kinds:
        if envelope.of(kind):
            figure, ax = plt.subplots(figsize=PAGE, layout="constrained")
            draw_envelope(envelope, kind, ax=ax, title=f"{model.title}: envelope of {kind}")
            yield f"05-envelope-{kind}", figure
    for kind in kinds:
        if envelope.of(kind):
            table = envelope_table(envelope, kind, model.title, compact=True)
            for index, page in enumerate(_table_pages(
                    f"Envelope and combinations: {kind}", table)):
                yield f"06-table-{kind}-{index + 1}", page
    if envelope.deflection_checks:
        limit = envelope.basis.live.deflection_limit
        table = deflection_table(envelope, model.title)
        for index, page in enumerate(_table_pages(
                f"Live-load deflection check (limit span/{limit:g})", table)):
            yield f"07-deflection-{index + 1}", page


def envelope_figure(envelope: Envelope, kinds: Sequence[str], title: str) -> Any:
    """All envelope plots of a run stacked on one figure; returns its first axes."""
    plt = _pyplot()
    from influence.output.envelope_figures import draw_envelope

    present = [k for k in kinds if envelope.of(k)]
    figure, axes = plt.subplots(len(present), 1, figsize=(10, 3.4 * len(present)),
                                layout="constrained", squeeze=False)
    for ax, kind in zip(axes[:, 0], present, strict=True):
        draw_envelope(envelope, kind, ax=ax, title=f"{title}: envelope of {kind}")
    return axes[0, 0]


def write_report(analysis: Analysis, envelope: Envelope, out: str | Path,
                 kinds: Sequence[str]) -> ReportFiles:
    """Write report.pdf, figures/*.png and tables/*.csv into ``out``."""
    from matplotlib.backends.backend_pdf import PdfPages

    plt = _pyplot()
    target = Path(out)
    target.mkdir(parents=True, exist_ok=True)
    work = Path(tempfile.mkdtemp(prefix=".report-", dir=target))
    try:
        (work / "figures").mkdir()
        (work / "tables").mkdir()
        pages = 0
        with PdfPages(work / "report.pdf") as pdf:
            info = pdf.infodict()
            info["Title"] = analysis.model.title
            info["Subject"] = "Influence lines and envelopes. " + CAUTION
            for name, figure in report_figures(analysis, envelope, kinds):
                pages += 1
                pdf.savefig(figure)
                if not name.startswith(("01-", "03-load-model", "06-", "07-")) or \
                        name.endswith("trains"):
                    figure.savefig(work / "figures" / f"{name}.png", dpi=120)
                plt.close(figure)
        title = analysis.model.title
        for kind in kinds:
            if envelope.of(kind):
                (work / "tables" / f"envelope-{kind}.csv").write_text(
                    render_csv(envelope_table(envelope, kind, title)), encoding="utf-8")
        if envelope.deflection_checks:
            (work / "tables" / "deflection-check.csv").write_text(
                render_csv(deflection_table(envelope, title)), encoding="utf-8")
        moved = []
        for path in sorted(work.rglob("*")):
            if path.is_file():
                destination = target / path.relative_to(work)
                destination.parent.mkdir(parents=True, exist_ok=True)
                os.replace(path, destination)
                moved.append(destination)
    finally:
        shutil.rmtree(work, ignore_errors=True)
    return ReportFiles(
        pdf=target / "report.pdf",
        figures=tuple(p for p in moved if p.suffix == ".png"),
        tables=tuple(p for p in moved if p.suffix == ".csv"),
        pages=pages,
    )
