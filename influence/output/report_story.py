"""What the calculation package says, in order: the title block with the cautions and the summary
of governing results first, the contents, the conventions and units, the input echo (structure,
dead loads, combinations, live-load and section settings, load models), the influence lines of
the key sections, the envelopes, the live-load tables with every governing position, the
combination tables (bar forces for a truss) and the deflection check.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from typing import Any

from reportlab.platypus import CondPageBreak, KeepTogether, PageBreak, Paragraph, Preformatted

from influence.analysis.lines import Analysis
from influence.design.envelope import Envelope, EnvelopeEntry, governing_label
from influence.model.project import ProjectInfo
from influence.output.conventions import CAUTION, LIVE_LABEL, SIGN_CONVENTIONS, printed_effect
from influence.output.envelope_figures import bar_entries
from influence.output.report_assessments import (
    Assessments,
    fatigue_section,
    rating_section,
)
from influence.output.report_figures import ReportFigure, place, rendered
from influence.output.report_pages import (
    FRAME_HEIGHT,
    FRAME_WIDTH,
    FigurePlaces,
    HeadingParagraph,
    column_widths,
    contents,
    escaped,
    field_table,
    gap,
    styles,
    table_flowable,
)
from influence.output.report_tables import (
    KINDS_IN_ORDER,
    bar_table,
    combination_factor_table,
    combination_table,
    dead_load_table,
    deflection_check_table,
    live_settings_table,
    live_table,
    load_model_table,
    summary_table,
)
from influence.output.summary import PRISMATIC, summarise
from vehicles.loadmodel import LoadModel
from vehicles.output.describe import details
from vehicles.output.tables import model_text
from vehicles.output.tabular import Table
from vehicles.units import labels

WIDTH_IN = FRAME_WIDTH / 72.0
"""Width of a full-width figure [in]."""
KEY_SECTIONS = 6
"""Most influence lines the report draws."""


@dataclass(frozen=True)
class ReportSource:
    """Where the results come from: the input file, its SHA-256, the title-block fields, the
    tool and the date."""

    path: str
    digest: str
    project: ProjectInfo
    tool: str
    date: str

    @property
    def project_line(self) -> str:
        """The project title of the running header: job number, client, location."""
        parts = [f"Job {self.project.job_number}" if self.project.job_number else "",
                 self.project.client, self.project.location]
        return " | ".join(p for p in parts if p) or "Calculation package"


@dataclass(frozen=True)
class Story:
    """The flowables of the report and the figures drawn for it."""

    flowables: list[Any]
    figures: list[ReportFigure]
    places: FigurePlaces


def _significant(entry: EnvelopeEntry, scale: float) -> bool:
    values = [abs(v) for v in (entry.live_max, entry.live_min) if v is not None]
    return bool(values) and max(values) > 1e-9 * max(scale, 1e-300)


def key_sections(envelope: Envelope) -> list[EnvelopeEntry]:
    """The entries whose influence lines the report draws, none zero, none twice: the largest
    positive moment of each span, the most negative moment over interior supports, the largest
    shear and reaction; for a truss the bars of largest tension and compression."""
    chosen: list[EnvelopeEntry] = []
    seen: set[tuple[str, str, str]] = set()

    def add(entry: EnvelopeEntry | None, scale: float) -> None:
        if entry is None or not _significant(entry, scale):
            return
        key = (entry.kind, entry.response.location, entry.response.side)
        if key not in seen:
            seen.add(key)
            chosen.append(entry)

    def scale_of(entries: Sequence[EnvelopeEntry]) -> float:
        return max((abs(v) for e in entries for v in (e.live_max, e.live_min) if v is not None),
                   default=0.0)

    bars = bar_entries(envelope)
    if bars:
        scale = scale_of(bars)
        ranked = sorted(bars, key=lambda e: -max(abs(e.live_max or 0.0), abs(e.live_min or 0.0)))
        add(max(bars, key=lambda e: e.live_max or 0.0), scale)
        add(min(bars, key=lambda e: e.live_min or 0.0), scale)
        for entry in ranked:
            if len(chosen) >= KEY_SECTIONS:
                break
            add(entry, scale)
        return chosen
    moments = [e for e in envelope.of("moment") if e.section.chainage is not None]
    scale = scale_of(moments)
    for number in sorted({e.section.span for e in moments}):
        inside = [e for e in moments if e.section.span == number and (e.live_max or 0.0) > 0]
        add(max(inside, key=lambda e: e.live_max or 0.0) if inside else None, scale)
    supports = [e for e in moments if e.section.support and (e.live_min or 0.0) < 0]
    add(min(supports, key=lambda e: e.live_min or 0.0) if supports else None, scale)
    shears = [e for e in envelope.of("shear") if e.section.chainage is not None]
    if shears:
        add(max(shears, key=lambda e: max(abs(e.live_max or 0), abs(e.live_min or 0))),
            scale_of(shears))
    reactions = envelope.of("reaction")
    if reactions:
        add(max(reactions, key=lambda e: e.live_max or 0.0), scale_of(reactions))
    return chosen[:KEY_SECTIONS]


def deflection_verdict(envelope: Envelope) -> str:
    """One sentence: the deflection check's result, or that none was asked for."""
    limit = envelope.basis.live.deflection_limit
    if not limit:
        return "No live-load deflection limit is set ([live_load] deflection_limit): no check."
    checks = envelope.deflection_checks
    if not checks:
        return "Live-load deflection limit set, but deflection was not enveloped: no check."
    unit, factor = printed_effect("deflection", envelope.units)
    worst = max(checks, key=lambda c: c.ratio)
    failed = [c for c in checks if not c.passes]
    verdict = (f"FAILS in span(s) {', '.join(str(c.span.number) for c in failed)}" if failed
               else "passes in every span")
    return (f"Live-load deflection check, {LIVE_LABEL} against span/{limit:g}: {verdict}; "
            f"largest ratio {worst.ratio:.3f} in span {worst.span.number} "
            f"({factor * worst.deflection:.1f} {unit} against {factor * worst.limit:.1f} {unit}"
            f" at {worst.at:.2f} {labels(envelope.units).length}; "
            f"{governing_label(worst.placement)}).")


CAPTION_ROOM = 40.0
"""Height [pt] kept below a figure for its caption."""


class _Writer:
    """Collects flowables and figures; a heading and its introduction are held until what they
    introduce, so that they never stand alone at the foot of a page."""

    def __init__(self) -> None:
        self.style = styles()
        self.flowables: list[Any] = []
        self.figures: list[ReportFigure] = []
        self.places = FigurePlaces()
        self.pending: list[Any] = []

    def heading(self, text: str, level: int = 0) -> None:
        self._flush()
        self.flowables.append(CondPageBreak(FRAME_HEIGHT / 3 if level == 0 else 110))
        self.pending.append(HeadingParagraph(text, level,
                                             self.style["h1" if level == 0 else "h2"]))

    def text(self, text: str, style: str = "body") -> None:
        paragraph = Paragraph(escaped(text), self.style[style])
        if style == "intro":
            self.pending.append(paragraph)
        else:
            self._flush()
            self.flowables.append(paragraph)

    def add(self, flowable: Any) -> None:
        self._flush()
        self.flowables.append(flowable)

    def _flush(self) -> None:
        self.flowables += self.pending
        self.pending = []

    def table(self, table: Table, fixed: dict[int, float] | None = None) -> None:
        widths = column_widths(table, fixed=fixed)
        flowable = table_flowable(table, widths, self.style)
        if self.pending:  # the heading goes with the table's first rows, or on a new page
            flowable.wrap(FRAME_WIDTH, FRAME_HEIGHT)
            first = sum(flowable._rowHeights[:3])
            held = sum(p.wrap(FRAME_WIDTH, FRAME_HEIGHT)[1] + 12 for p in self.pending)
            self.flowables.append(CondPageBreak(first + held))
        self._flush()
        self.flowables.append(flowable)
        self.flowables.append(gap(6))

    def figure(self, key: str, figure: Any, caption: str = "", png: bool = True) -> None:
        width, height = figure.get_size_inches() * 72.0
        shrink = min(FRAME_WIDTH / width, (FRAME_HEIGHT - CAPTION_ROOM) / height, 1.0)
        if shrink < 1.0:  # a figure drawn for a larger page is redrawn to fit this one
            figure.set_size_inches(width * shrink / 72.0, height * shrink / 72.0)
        made = rendered(key, figure, png)
        self.figures.append(made)
        items = [*self.pending, place(made, self.places)]
        self.pending = []
        if caption:
            items.append(Paragraph(escaped(caption), self.style["small"]))
        items.append(gap(6))
        self.flowables.append(KeepTogether(items))


def _title_block(w: _Writer, envelope: Envelope, source: ReportSource, title: str) -> None:
    project = source.project
    w.add(Paragraph("Calculation package: influence lines, envelopes and combinations",
                    w.style["title"]))
    w.add(Paragraph(escaped(title), w.style["subtitle"]))
    fields = [("job number", project.job_number), ("designed by", project.designed_by),
              ("checked by", project.checked_by), ("revision", project.revision),
              ("client", project.client), ("location", project.location),
              ("input file", source.path), ("input SHA-256", source.digest),
              ("prepared with", source.tool), ("date", source.date)]
    w.add(field_table(fields, w.style))
    w.add(Paragraph("<b>Caution.</b> " + escaped(CAUTION), w.style["caution"]))
    w.heading("Summary of governing results")
    w.text(f"{LIVE_LABEL}: vehicular live load with its dynamic load allowance, for the girder "
           f"line (one lane x {envelope.basis.live.scale:g}: distribution "
           f"{envelope.basis.live.distribution:g} x multiple presence "
           f"{envelope.basis.live.multiple_presence:g}) and for one lane. Positions are "
           "chainages along the travel path; the lead is the train's front axle.", "intro")
    w.table(summary_table(envelope))
    w.text(deflection_verdict(envelope))


def _conventions(w: _Writer, envelope: Envelope) -> None:
    names = labels(envelope.units)
    w.heading("1 Conventions, units and notes")
    w.text(f"Units: force {names.force}, length {names.length}, moment {names.moment}; "
           f"deflections are printed in {printed_effect('deflection', envelope.units)[0]}.")
    w.text("Sign conventions: " + SIGN_CONVENTIONS)
    w.text(f"{LIVE_LABEL} is the vehicular live load (LL) with its dynamic load allowance (IM), "
           "as each load model's cases apply it (axle loads in the tables include it). "
           "Combinations factor the dead loads by load name and the live load as 'LL'; the "
           "largest value takes each dead load at the factor that increases it (the smallest at "
           "the one that decreases it) and the live load's largest (smallest) value.")
    w.text("Numbers: about four significant figures, forces and moments to 0.1 at least, "
           "positions to 0.01; the CSV tables of the package hold every value at full "
           "precision.")
    for note in envelope.notes:
        w.text("Note: " + note)


def _input_echo(w: _Writer, analysis: Analysis, envelope: Envelope,
                deflection_models: Sequence[LoadModel], kinds: Sequence[str]) -> None:
    from influence.output.figures import draw_structure, structure_size

    model = analysis.model
    names = labels(model.units)
    w.heading("2 Input echo")
    w.heading("2.1 Structure", 1)
    summary = summarise(model)
    width, height = structure_size(model, WIDTH_IN)
    ax = draw_structure(model, ax=_axes(width, min(height, 4.2)))
    w.figure("02-structure", ax.get_figure(),
             f"{summary.form} form; path {summary.path_length:g} {names.length} along "
             f"{len(summary.path)} member(s); degree of static indeterminacy "
             f"{summary.static_indeterminacy}.")
    w.table(Table([], ("support", f"x [{names.length}]", f"y [{names.length}]",
                       f"chainage [{names.length}]", "restraint"),
                  [(s.node, s.x, s.y, "-" if s.chainage is None else s.chainage, s.kind)
                   for s in summary.supports],
                  formats=("text", "position", "position", "position", "text")))
    # the section column only where a member varies: EI and EA are then its prismatic part's
    varies = any(m.section != PRISMATIC for m in summary.members)
    columns = ["member", "start", "end", f"length [{names.length}]",
               f"EI [{names.force}-{names.length}2]", f"EA [{names.force}]", "released end",
               "on path"]
    formats = ["text", "text", "text", "position", "number", "number", "text", "text"]
    rows = [[m.name, m.start, m.end, m.length, m.EI, m.EA, m.releases or "-",
             "yes" if m.on_path else "no"] for m in summary.members]
    if varies:
        columns.append("section")
        formats.append("text")
        for row, member in zip(rows, summary.members, strict=True):
            row.append(member.section)
    w.table(Table([], tuple(columns), [tuple(row) for row in rows], formats=tuple(formats)))
    if varies:
        w.text("EI and EA of a haunched member are those of its prismatic part (of the start "
               "of a taper); its influence lines come from the exact flexibility integrals of "
               "1/EI(x), held as polynomial pieces with a proven truncation below 1e-12 of the "
               "line's largest ordinate (round-off estimated below 1e-9 of it).")
    basis = envelope.basis
    w.heading("2.2 Dead loads", 1)
    if basis.loads:
        w.table(dead_load_table(basis.loads, model.units))
    else:
        w.text("None given.")
    w.heading("2.3 Combinations", 1)
    if basis.combinations:
        w.table(combination_factor_table(basis))
    else:
        w.text("None given: only the unfactored effects are reported.")
    w.heading("2.4 Live-load and section settings", 1)
    settings = basis.sections
    w.table(live_settings_table(basis, envelope.models, deflection_models, kinds,
                                settings.per_span, settings.step),
            fixed={0: 200, 1: 200})
    w.heading("2.5 Load models", 1)
    w.table(load_model_table(envelope.models, deflection_models), fixed={3: 190, 4: 360})
    for number, load_model in enumerate((*envelope.models, *deflection_models), start=1):
        w.add(CondPageBreak(FRAME_HEIGHT / 2))
        w.add(Preformatted(model_text(details(load_model)), _mono(w), maxLineLength=185,
                           newLineChars="      "))
        w.add(gap(4))
        if any(c.train is not None for c in load_model.cases):
            from vehicles.output.figures import plot_model

            count = len(load_model.cases)
            axes = plot_model(load_model, size=(WIDTH_IN, min(1.75 * count + 0.3, 6.0)))
            w.figure(f"03-load-model-{number}", axes[0].get_figure(),
                     f"{load_model.name}: the trains, front on the left, ranged gaps at their "
                     "least.")


def _mono(w: _Writer) -> Any:
    from reportlab.lib.styles import ParagraphStyle

    return ParagraphStyle("mono", parent=w.style["body"], fontName="Mono", fontSize=6.6,
                          leading=8.2)


def _axes(width: float, height: float) -> Any:
    from vehicles.output.figure_files import new_figure

    return new_figure(width, height).add_subplot()


def _influence_lines(w: _Writer, analysis: Analysis, envelope: Envelope) -> None:
    from influence.output.figures import draw_line, line_axes
    from influence.output.governing_figures import draw_placement, make_room
    from vehicles.output.figure_files import new_figure, plain_text

    keys = key_sections(envelope)
    w.heading("3 Influence lines of the key sections")
    if not keys:
        w.text("No section has a live-load effect: no influence line drawn.")
        return
    w.text("The governing trains are drawn on each line: arrows are axles (loads incl. IM, to "
           "scale), bands the loaded lane.", "intro")
    for number, entry in enumerate(keys, start=1):
        line = analysis.line(entry.response)
        with plain_text():
            figure = new_figure(WIDTH_IN, 2.75)
            ax, strip = line_axes(figure)[0]
            draw_line(line, analysis.model, ax=ax, strip=strip)
            colours = ("#b3432b", "#2e8b57")
            reach = 0.0
            for placement, colour in zip((entry.live.max, entry.live.min), colours,
                                         strict=True):
                if placement is not None and placement.value != 0:
                    reach = max(reach, draw_placement(ax, line, placement, colour))
            make_room(ax, reach)
            ax.legend(loc="upper left", bbox_to_anchor=(1.01, 1.0), fontsize=7, frameon=False)
        unit, factor = printed_effect(entry.kind, envelope.units)
        parts = []
        for sense, placement in (("max", entry.live.max), ("min", entry.live.min)):
            value = getattr(entry, f"live_{sense}")
            if placement is not None and value is not None:
                parts.append(f"{sense} {factor * value:.1f} {unit} ({governing_label(placement)}"
                             f", lead at {placement.lead_position:.2f})")
        w.figure(f"04-influence-line-{number}", figure,
                 f"{line.response.label}: {LIVE_LABEL} girder line " + "; ".join(parts))


def _envelopes(w: _Writer, envelope: Envelope, kinds: Sequence[str], title: str) -> None:
    from influence.output.envelope_figures import draw_envelope

    w.heading("4 Envelopes")
    for kind in kinds:
        if not envelope.of(kind):
            continue
        height = 4.9 if kind != "axial" else min(0.16 * len(bar_entries(envelope)) + 1.2, 5.6)
        ax = draw_envelope(envelope, kind, ax=_axes(WIDTH_IN, height),
                           title=f"{title}: envelope of {kind}")
        w.figure(f"05-envelope-{kind}", ax.get_figure())


def _tables(w: _Writer, envelope: Envelope, kinds: Sequence[str]) -> None:
    ordered = [k for k in KINDS_IN_ORDER if k in kinds and envelope.of(k)]
    w.heading(f"5 {LIVE_LABEL} at every section, with the governing positions")
    w.text("One row per section and sense: the value for one lane and for the girder line, the "
           "load model and case, the direction of travel, the lead axle's chainage, every "
           "axle's chainage (front to rear) and load as placed, and where the lane load acts. "
           "Each value can be redone from the influence line and these positions.", "intro")
    for kind in ordered:
        if kind == "axial":
            continue
        w.heading(f"5.{ordered.index(kind) + 1} {kind}", 1)
        w.table(live_table(envelope, kind))
    w.heading("6 Dead loads and combinations")
    for kind in ordered:
        w.heading(f"6.{ordered.index(kind) + 1} {kind}", 1)
        if kind == "axial":
            w.table(bar_table(envelope, bar_entries(envelope)))
        else:
            w.table(combination_table(envelope, kind))


def report_story(analysis: Analysis, envelope: Envelope, kinds: Sequence[str],
                 source: ReportSource,
                 deflection_models: Sequence[LoadModel] = (),
                 assessments: Assessments | None = None) -> Story:
    """Everything the report prints, with its figures drawn once each; the load rating and
    fatigue pages when ``assessments`` holds them."""
    w = _Writer()
    title = analysis.model.title
    assessments = assessments or Assessments()
    _title_block(w, envelope, source, title)
    for line in assessment_summary(assessments):
        w.text(line)
    w.add(PageBreak())
    w.add(Paragraph("Contents", w.style["h1"]))
    w.add(contents(w.style))
    w.add(PageBreak())
    _conventions(w, envelope)
    _input_echo(w, analysis, envelope, deflection_models, kinds)
    _influence_lines(w, analysis, envelope)
    _envelopes(w, envelope, kinds, title)
    _tables(w, envelope, kinds)
    number = 7
    if envelope.deflection_checks:
        w.heading("7 Live-load deflection check")
        w.text(deflection_verdict(envelope))
        w.table(deflection_check_table(envelope))
        number += 1

    def figure(key: str, drawn: Any, caption: str) -> None:
        w.figure(key, drawn if hasattr(drawn, "savefig") else drawn.figure, caption)

    if assessments.ratings is not None:
        rating_section(w.heading, w.text, w.table, figure, number, assessments.ratings,
                       analysis.model)
        number += 1
    if assessments.fatigue is not None:
        fatigue_section(w.heading, w.text, w.table, figure, number, assessments.fatigue)
    w.add(gap(0))  # the last heading held, if any
    return Story(w.flowables, w.figures, w.places)


def assessment_summary(assessments: Assessments) -> list[str]:
    """Sentences for the first page: the lowest rating factor, the shortest fatigue life, and
    any assessment asked for that could not run."""
    lines = []
    ratings = assessments.ratings
    if ratings is not None and ratings.ratings:
        low = min(ratings.ratings, key=lambda r: r.rating_factor)
        lines.append(f"Load rating ({ratings.settings.method}): lowest factor "
                     f"{low.rating_factor:.3f}, {low.vehicle} at the {low.level} level "
                     f"({low.limit_state or 'rating'}), {low.response} {low.sense} at "
                     f"{low.section}; postings and every factor in the load-rating section.")
    results = assessments.fatigue
    if results is not None and results.details:
        short = min(results.details, key=lambda d: d.life.life_years)
        life = short.life
        verdict = ("infinite life" if life.infinite_life else
                   f"shortest life {life.life_years:.4g} years against a design life of "
                   f"{life.design_life_years:g}")
        lines.append(f"Fatigue ({results.traffic.description}): {verdict} "
                     f"({short.detail.name}); every detail in the fatigue section.")
    lines.extend(assessments.notes)
    return lines
