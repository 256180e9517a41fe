"""The one figure saver of both packages, and figures whose text is always plain.

A figure is drawn once: :func:`figure_pdf` renders it to vector PDF (what the report embeds), and
:func:`pdf_to_png` rasterises that same PDF for the PNG files; :func:`save_figure` writes one
file by its extension. Every file is written whole in a checked place
(:mod:`vehicles.output.places`). Matplotlib is imported only when a figure is made.

User text (titles, names) is never read as matplotlib mathtext: figures are drawn under
:func:`plain_text`, so a title holding ``$`` signs prints as typed.

Example:
    >>> with plain_text():
    ...     figure = new_figure(4.0, 2.0)
    ...     title = figure.suptitle("Cost $5 to $9")
    >>> figure_pdf(figure)[:5], title.get_parse_math()
    (b'%PDF-', False)
"""

from __future__ import annotations

import io
from collections.abc import Callable, Iterator
from contextlib import contextmanager
from functools import wraps
from pathlib import Path
from typing import Any, ParamSpec, TypeVar

from vehicles.errors import OutputError
from vehicles.output.places import check_file_place, written_file

SAVE_FORMATS = (".png", ".svg", ".pdf")
"""File types a drawing can be saved to."""
PNG_DPI = 150
"""Resolution of PNG drawings [dots per inch]."""
_STYLE: dict[str, Any] = {"text.parse_math": False, "pdf.fonttype": 3, "svg.fonttype": "path",
          "font.family": "DejaVu Sans"}

P = ParamSpec("P")
R = TypeVar("R")


@contextmanager
def plain_text() -> Iterator[None]:
    """Draw inside this context: text is plain (no mathtext), in the DejaVu face the report uses."""
    import matplotlib

    with matplotlib.rc_context(_STYLE):  # type: ignore[arg-type]
        yield


def drawing(function: Callable[P, R]) -> Callable[P, R]:
    """Decorator: the function draws under :func:`plain_text`."""

    @wraps(function)
    def wrapper(*args: P.args, **kwargs: P.kwargs) -> R:
        with plain_text():
            return function(*args, **kwargs)

    return wrapper


def new_figure(width: float, height: float, layout: Any = "constrained") -> Any:
    """A matplotlib Figure of ``width`` x ``height`` [in], not registered with pyplot (nothing
    to close)."""
    from matplotlib.figure import Figure

    return Figure(figsize=(width, height), layout=layout)


def check_figure_place(path: str | Path, item: str = "--plot") -> Path:
    """Refuse a drawing's place before any work: unknown extension, missing folder, ..."""
    suffix = Path(str(path)).suffix.lower()
    if suffix not in SAVE_FORMATS:
        what = f"a '{suffix}' file" if suffix else "a file without extension"
        raise OutputError(f"cannot draw to {what}",
                          source=str(path), item=item, fix="end the name in .png, .svg or .pdf")
    return check_file_place(path, item)


def save_figure(figure: Any, path: str | Path, item: str = "--plot") -> Path:
    """Write a figure to PNG, SVG or PDF by the path's extension, whole, in a checked place."""
    path = check_figure_place(path, item)
    suffix = path.suffix.lower()[1:]
    with plain_text():
        return written_file(path, lambda name: figure.savefig(name, format=suffix, dpi=PNG_DPI),
                            item)


def figure_pdf(figure: Any) -> bytes:
    """The figure drawn once, as vector PDF bytes."""
    buffer = io.BytesIO()
    with plain_text():
        figure.savefig(buffer, format="pdf")
    return buffer.getvalue()


def pdf_to_png(pdf: bytes, path: str | Path, dpi: float = PNG_DPI) -> Path:
    """Rasterise the first page of a PDF (a figure drawn by :func:`figure_pdf`) to a PNG file,
    written whole."""
    import pypdfium2

    document = pypdfium2.PdfDocument(pdf)
    try:
        image = document[0].render(scale=dpi / 72.0).to_pil()
    finally:
        document.close()
    return written_file(path, lambda name: image.save(name, format="PNG"), "figure")
