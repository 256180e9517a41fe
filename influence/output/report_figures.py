"""Figures of the report: each drawn once by matplotlib to vector PDF, laid on its page after
the typesetting (as a form, so it stays vector and sharp), and rasterised from the same PDF for
the PNG files of the package.

Example:
    >>> from vehicles.output.figure_files import new_figure
    >>> figure = new_figure(2.0, 1.0)
    >>> made = rendered("demo", figure)
    >>> made.width, made.height, made.pdf[:5]
    (144.0, 72.0, b'%PDF-')
"""

from __future__ import annotations

import io
from collections.abc import Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from influence.output.report_pages import FigurePlace, FigurePlaces
from vehicles.output.figure_files import figure_pdf, pdf_to_png


@dataclass(frozen=True)
class ReportFigure:
    """One figure drawn: its file name stem, vector PDF and size [pt]; ``png``: also written
    as a PNG file of the package."""

    key: str
    pdf: bytes
    width: float
    height: float
    png: bool = True


def rendered(key: str, figure: Any, png: bool = True) -> ReportFigure:
    """Draw a matplotlib figure once, to vector PDF."""
    width, height = (float(v) * 72.0 for v in figure.get_size_inches())
    return ReportFigure(key, figure_pdf(figure), width, height, png)


def place(figure: ReportFigure, places: FigurePlaces) -> FigurePlace:
    """The flowable that keeps room for the figure on its page."""
    return FigurePlace(figure.key, figure.width, figure.height, places)


def lay_figures(pdf: Path, figures: Sequence[ReportFigure], places: FigurePlaces) -> None:
    """Lay every figure's PDF page onto the report's pages where its room was kept."""
    from pypdf import PdfReader, PdfWriter, Transformation

    writer = PdfWriter(clone_from=PdfReader(pdf))
    for figure in figures:
        if figure.key not in places.found:
            continue
        page, x, y, _, _ = places.found[figure.key]
        drawn = PdfReader(io.BytesIO(figure.pdf)).pages[0]
        writer.pages[page].merge_transformed_page(drawn, Transformation().translate(x, y))
    writer.compress_identical_objects()
    with open(pdf, "wb") as handle:
        writer.write(handle)


def write_pngs(figures: Sequence[ReportFigure], folder: Path) -> list[Path]:
    """The PNG files of the figures marked for them, from the same PDF drawing."""
    return [pdf_to_png(f.pdf, folder / f"{f.key}.png") for f in figures if f.png]
