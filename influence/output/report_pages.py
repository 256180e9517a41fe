"""The report's typesetting with reportlab's platypus: pages, styles, running header and footer,
"page n of N", the contents list, tables that split across pages with their header repeated,
and places for figures that are filled with the figures' own vector PDF after the build.

Fonts are the DejaVu faces that matplotlib ships, so the text of the pages and of the figures
match and any character of a user's title prints.

Example:
    >>> from vehicles.output.tabular import Table
    >>> flowable = table_flowable(Table([], ("section", "M [kN-m]"), [("P1", -1.5e3)],
    ...                                 formats=("text", "effect")))
    >>> flowable.repeatRows, flowable._cellvalues[1][1].text
    (1, '-1500.0')
"""

from __future__ import annotations

import os
from collections.abc import Callable, Sequence
from dataclasses import dataclass, field
from typing import Any

from reportlab.lib import colors
from reportlab.lib.enums import TA_LEFT, TA_RIGHT
from reportlab.lib.pagesizes import A4, landscape
from reportlab.lib.styles import ParagraphStyle
from reportlab.lib.units import mm
from reportlab.pdfgen import canvas
from reportlab.platypus import (
    BaseDocTemplate,
    Flowable,
    Frame,
    PageTemplate,
    Paragraph,
    Spacer,
    Table,
    TableStyle,
)
from reportlab.platypus.tableofcontents import TableOfContents

from vehicles.output.tabular import Table as DataTable
from vehicles.output.tabular import cell_texts, right_aligned

PAGE = landscape(A4)
"""Page size [pt]: A4 landscape, wide enough for an envelope table with its positions."""
MARGIN = 14 * mm
HEADER = 13 * mm
FOOTER = 9 * mm
FRAME_WIDTH = PAGE[0] - 2 * MARGIN
FRAME_HEIGHT = PAGE[1] - 2 * MARGIN - HEADER - FOOTER
INK = colors.HexColor("#1f2a30")
RULE = colors.HexColor("#9aa5ab")
SHADE = colors.HexColor("#eef1f2")
ACCENT = colors.HexColor("#1f4e5f")

_FONTS = {"Sans": "DejaVuSans.ttf", "Sans-Bold": "DejaVuSans-Bold.ttf",
          "Sans-Oblique": "DejaVuSans-Oblique.ttf", "Mono": "DejaVuSansMono.ttf"}


def register_fonts() -> None:
    """Register matplotlib's DejaVu faces with reportlab (once)."""
    from matplotlib import get_data_path
    from reportlab.lib.fonts import addMapping
    from reportlab.pdfbase import pdfmetrics
    from reportlab.pdfbase.ttfonts import TTFont

    if "Sans" in pdfmetrics.getRegisteredFontNames():
        return
    folder = os.path.join(get_data_path(), "fonts", "ttf")
    for name, file in _FONTS.items():
        pdfmetrics.registerFont(TTFont(name, os.path.join(folder, file)))
    addMapping("Sans", 0, 0, "Sans")
    addMapping("Sans", 1, 0, "Sans-Bold")
    addMapping("Sans", 0, 1, "Sans-Oblique")
    addMapping("Sans", 1, 1, "Sans-Bold")


def styles() -> dict[str, ParagraphStyle]:
    """The paragraph styles of the report."""
    register_fonts()
    body = ParagraphStyle("body", fontName="Sans", fontSize=8.5, leading=11, textColor=INK)
    return {
        "body": body,
        "small": ParagraphStyle("small", parent=body, fontSize=7.5, leading=9.5),
        "intro": ParagraphStyle("intro", parent=body, fontSize=7.5, leading=9.5,
                                spaceAfter=3),
        "cell": ParagraphStyle("cell", parent=body, fontSize=7, leading=8.6),
        "cell-right": ParagraphStyle("cell-right", parent=body, fontSize=7, leading=8.6,
                                     alignment=TA_RIGHT),
        "head": ParagraphStyle("head", parent=body, fontName="Sans-Bold", fontSize=7,
                               leading=8.6),
        "head-right": ParagraphStyle("head-right", parent=body, fontName="Sans-Bold",
                                     fontSize=7, leading=8.6, alignment=TA_RIGHT),
        "title": ParagraphStyle("title", parent=body, fontName="Sans-Bold", fontSize=17,
                                leading=21, spaceAfter=4, textColor=ACCENT),
        "subtitle": ParagraphStyle("subtitle", parent=body, fontSize=11, leading=14,
                                   spaceAfter=8),
        "h1": ParagraphStyle("h1", parent=body, fontName="Sans-Bold", fontSize=12.5,
                             leading=16, spaceBefore=4, spaceAfter=6, textColor=ACCENT),
        "h2": ParagraphStyle("h2", parent=body, fontName="Sans-Bold", fontSize=9.5,
                             leading=12, spaceBefore=8, spaceAfter=4),
        "caution": ParagraphStyle("caution", parent=body, fontSize=8.5, leading=11,
                                  borderColor=colors.HexColor("#b3432b"), borderWidth=0.8,
                                  borderPadding=5, backColor=colors.HexColor("#fbf1ee"),
                                  spaceBefore=6, spaceAfter=10, alignment=TA_LEFT),
        "toc1": ParagraphStyle("toc1", parent=body, fontSize=9.5, leading=13, leftIndent=6),
        "toc2": ParagraphStyle("toc2", parent=body, fontSize=8.5, leading=11, leftIndent=22),
    }


def escaped(text: str) -> str:
    """User text made safe for a platypus Paragraph (its markup is a small XML)."""
    return text.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;")


def table_flowable(table: DataTable, widths: Sequence[float] | None = None,
                   style: dict[str, ParagraphStyle] | None = None) -> Table:
    """A data table as a platypus table: the header row repeated on every page it runs onto,
    text left-aligned, numbers right-aligned with one number of decimals a column (so the
    decimal points line up), every cell wrapping within its column."""
    style = style or styles()
    right = right_aligned(table)
    head = [Paragraph(escaped(name), style["head-right" if r else "head"])
            for name, r in zip(table.columns, right, strict=True)]
    body = [[Paragraph(escaped(text), style["cell-right" if r else "cell"])
             for text, r in zip(row, right, strict=True)] for row in cell_texts(table)]
    flowable = Table([head, *body], colWidths=list(widths) if widths else None,
                     repeatRows=1, hAlign="LEFT", splitByRow=True)
    flowable.setStyle(TableStyle([
        ("LINEBELOW", (0, 0), (-1, 0), 0.8, INK),
        ("LINEBELOW", (0, 1), (-1, -1), 0.25, RULE),
        ("ROWBACKGROUNDS", (0, 1), (-1, -1), [colors.white, SHADE]),
        ("VALIGN", (0, 0), (-1, -1), "TOP"),
        ("TOPPADDING", (0, 0), (-1, -1), 1.6),
        ("BOTTOMPADDING", (0, 0), (-1, -1), 1.6),
        ("LEFTPADDING", (0, 0), (-1, -1), 3),
        ("RIGHTPADDING", (0, 0), (-1, -1), 3),
    ]))
    return flowable


def field_table(fields: Sequence[tuple[str, str]],
                style: dict[str, ParagraphStyle] | None = None) -> Table:
    """Named fields in two pairs of columns (name, entry), a ruled title block; an empty entry
    prints as '-'."""
    style = style or styles()
    half = (len(fields) + 1) // 2
    rows = []
    for row in range(half):
        cells: list[Any] = []
        for name, entry in fields[row::half][:2]:
            cells += [Paragraph(escaped(name), style["head"]),
                      Paragraph(escaped(entry or "-"), style["cell"])]
        rows.append(cells + [""] * (4 - len(cells)))
    flowable = Table(rows, colWidths=[78, 250, 78, FRAME_WIDTH - 406], hAlign="LEFT")
    flowable.setStyle(TableStyle([
        ("BOX", (0, 0), (-1, -1), 0.9, INK),
        ("INNERGRID", (0, 0), (-1, -1), 0.3, RULE),
        ("BACKGROUND", (0, 0), (0, -1), SHADE),
        ("BACKGROUND", (2, 0), (2, -1), SHADE),
        ("VALIGN", (0, 0), (-1, -1), "MIDDLE"),
        ("TOPPADDING", (0, 0), (-1, -1), 3),
        ("BOTTOMPADDING", (0, 0), (-1, -1), 3),
    ]))
    return flowable


def column_widths(table: DataTable, total: float = FRAME_WIDTH,
                  fixed: dict[int, float] | None = None) -> list[float]:
    """Widths [pt] of a table's columns within ``total``: a number column as wide as its widest
    number (never wrapped), a text column as wide as its text up to a cap, narrowed toward its
    longest word when the table is too wide; ``fixed`` sets some columns' widths."""
    from reportlab.pdfbase.pdfmetrics import stringWidth

    register_fonts()
    fixed = fixed or {}
    texts = cell_texts(table)
    right = right_aligned(table)
    pad = 7.0
    wants, least = [], []
    for i, name in enumerate(table.columns):
        words = max((stringWidth(w, "Sans-Bold", 7) for w in name.split()), default=0.0)
        cells = [stringWidth(row[i], "Sans", 7) for row in texts]
        longest = max(cells, default=0.0)
        if right[i]:
            wants.append(max(words, longest) + pad)
            least.append(wants[-1])
        else:
            cell_words = max((stringWidth(w, "Sans", 7) for row in texts
                              for w in row[i].split()), default=0.0)
            wants.append(min(max(words, longest), 230.0) + pad)
            least.append(max(words, cell_words, 18.0) + pad)
    widths = [fixed.get(i, w) for i, w in enumerate(wants)]
    excess = sum(widths) - total
    if excess > 0:
        slack = [0.0 if i in fixed else max(w - least[i], 0.0) for i, w in enumerate(widths)]
        room = sum(slack)
        if room > 0:
            cut = min(excess / room, 1.0)
            widths = [w - cut * s for w, s in zip(widths, slack, strict=True)]
    return widths


@dataclass(frozen=True)
class Heading:
    """A heading that enters the contents list."""

    text: str
    level: int = 0


class HeadingParagraph(Paragraph):
    """A paragraph that tells the document it is a heading (for the contents and bookmarks)."""

    def __init__(self, text: str, level: int, style: ParagraphStyle) -> None:
        super().__init__(escaped(text), style)
        self.heading = Heading(text, level)


@dataclass
class RunningText:
    """What the running header and footer carry on every page."""

    title: str
    structure: str
    source: str
    digest: str
    tool: str
    date: str


class NumberedCanvas(canvas.Canvas):
    """A canvas that holds its pages back until the end, so that each can say "page n of N"."""

    running: RunningText | None = None

    def __init__(self, *args: Any, **kwargs: Any) -> None:
        super().__init__(*args, **kwargs)
        self._held: list[dict[str, Any]] = []

    def showPage(self) -> None:  # noqa: N802 - reportlab's name
        self._held.append(dict(self.__dict__))
        self._startPage()

    def save(self) -> None:
        total = len(self._held)
        for number, state in enumerate(self._held, start=1):
            self.__dict__.update(state)
            self._running(number, total)
            super().showPage()
        super().save()

    def _running(self, number: int, total: int) -> None:
        text = self.running
        if text is None:
            return
        width, height = PAGE
        top = height - MARGIN
        self.saveState()
        self.setFillColor(INK)
        self.setFont("Sans-Bold", 8)
        self.drawString(MARGIN, top - 8, _fit(text.title, 95))
        self.setFont("Sans", 7)
        self.drawString(MARGIN, top - 17, _fit(text.structure, 120))
        self.drawRightString(width - MARGIN, top - 8, _fit(f"input: {text.source}", 90))
        self.setFont("Mono", 6.2)
        self.drawRightString(width - MARGIN, top - 17, f"SHA-256 {text.digest}")
        self.setStrokeColor(RULE)
        self.setLineWidth(0.6)
        self.line(MARGIN, top - HEADER + 6, width - MARGIN, top - HEADER + 6)
        self.line(MARGIN, MARGIN + FOOTER - 3, width - MARGIN, MARGIN + FOOTER - 3)
        self.setFont("Sans", 7)
        self.drawString(MARGIN, MARGIN + 1, f"{text.tool}, {text.date}. Results need review "
                        "by a qualified engineer; local codes, the owner's rules and "
                        "licensed practice govern.")
        self.setFont("Sans-Bold", 7.5)
        self.drawRightString(width - MARGIN, MARGIN + 1, f"page {number} of {total}")
        self.restoreState()


def _fit(text: str, limit: int) -> str:
    return text if len(text) <= limit else text[: limit - 3] + "..."


@dataclass
class FigurePlaces:
    """Where each figure place landed: key -> (page index, x, y, width, height) [pt]."""

    found: dict[str, tuple[int, float, float, float, float]] = field(default_factory=dict)


class FigurePlace(Flowable):  # type: ignore[misc]
    """Room for a figure of ``width`` x ``height`` [pt]; the figure's vector PDF is laid there
    after the build (see :mod:`influence.output.report_figures`)."""

    def __init__(self, key: str, width: float, height: float, places: FigurePlaces) -> None:
        super().__init__()
        self.key, self.width, self.height, self.places = key, width, height, places

    def wrap(self, available_width: float, available_height: float) -> tuple[float, float]:
        return self.width, self.height

    def draw(self) -> None:
        x, y = self.canv.absolutePosition(0, 0)
        self.places.found[self.key] = (self.canv.getPageNumber() - 1, x, y, self.width,
                                       self.height)


class ReportDocument(BaseDocTemplate):  # type: ignore[misc]
    """A4 landscape pages with the running header and footer; headings fill the contents."""

    def __init__(self, target: Any, running: RunningText, **kwargs: Any) -> None:
        super().__init__(target, pagesize=PAGE, leftMargin=MARGIN, rightMargin=MARGIN,
                         topMargin=MARGIN + HEADER, bottomMargin=MARGIN + FOOTER, **kwargs)
        frame = Frame(MARGIN, MARGIN + FOOTER, FRAME_WIDTH, FRAME_HEIGHT, id="body",
                      leftPadding=0, rightPadding=0, topPadding=0, bottomPadding=0)
        self.addPageTemplates([PageTemplate(id="page", frames=[frame])])
        self.running = running
        self._headings = 0

    def afterFlowable(self, flowable: Any) -> None:  # noqa: N802 - reportlab's name
        heading = getattr(flowable, "heading", None)
        if heading is None:
            return
        self._headings += 1
        key = f"h{self._headings}"
        self.canv.bookmarkPage(key)
        self.canv.addOutlineEntry(heading.text, key, level=heading.level)
        self.notify("TOCEntry", (heading.level, escaped(heading.text), self.page, key))

    def handle_documentBegin(self) -> None:  # noqa: N802 - reportlab's name
        self._headings = 0
        super().handle_documentBegin()


def contents(style: dict[str, ParagraphStyle]) -> TableOfContents:
    """The contents list (filled by the headings during the build)."""
    toc = TableOfContents()
    toc.levelStyles = [style["toc1"], style["toc2"]]
    toc.dotsMinLevel = 0
    return toc


def build(path: str, story: list[Any], running: RunningText,
          after: Callable[[], None] | None = None) -> None:
    """Typeset the story into ``path`` (passes repeat until the contents settle)."""
    register_fonts()
    document = ReportDocument(path, running, title=running.structure, author=running.tool,
                              subject="Influence lines, envelopes and combinations")

    def maker(*args: Any, **kwargs: Any) -> NumberedCanvas:
        made = NumberedCanvas(*args, **kwargs)
        made.running = running
        return made

    document.multiBuild(story, canvasmaker=maker)
    if after is not None:
        after()


def gap(height: float = 4.0) -> Spacer:
    """Vertical space [pt]."""
    return Spacer(1, height)
