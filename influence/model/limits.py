"""How large a request may be: the size of a table, a sweep or a set of sections is estimated
before any of it is built, and a request beyond what this machine can hold in memory and time is
refused with its size and the limit.

Example:
    >>> estimated_sections(path_length=100.0, spans=3, per_span=10)
    30
    >>> MAX_TABLE_ROWS
    1000000
    >>> try:
    ...     check_size(estimated_rows(100.0, 1e-8), MAX_TABLE_ROWS, "table rows", "--step")
    ... except ModelError as error:
    ...     print(error.problem)
    the request needs about 10,000,000,001 table rows, more than 1,000,000
"""

from __future__ import annotations

import math

from influence.errors import ModelError
from vehicles.limits import MAX_TABLE_ROWS as MAX_TABLE_ROWS

MAX_SECTIONS = 20_000
"""The most envelope sections (the envelope's memory grows linearly with them; 10,000 sections
take well under 1 GiB)."""

MAX_PER_SPAN = 10_000
"""The most divisions of one span."""


def estimated_rows(length: float, step: float, extra: int = 0) -> float:
    """Rows of a table of a stretch ``length`` [length] at ``step`` [length], plus ``extra``
    (breakpoints); infinite for a step that is not positive."""
    if not (step > 0 and math.isfinite(step)):
        return math.inf
    return math.floor(length / step) + 1 + extra


def estimated_sections(path_length: float, spans: int, per_span: int | None = None,
                       step: float | None = None) -> int | float:
    """Envelope sections for tenth-point style divisions or a regular step along ``spans``
    spans of total ``path_length`` [length] (supports counted twice)."""
    if step is not None:
        return estimated_rows(path_length, step, 2 * spans)
    return (per_span or 10) * spans


def check_size(count: float, limit: int, what: str, item: str, source: str = "",
               fix: str = "") -> None:
    """Refuse a request whose estimated ``count`` of ``what`` exceeds ``limit``."""
    if count > limit:
        shown = "an unbounded number of" if not math.isfinite(count) else f"about {count:,.0f}"
        raise ModelError(f"the request needs {shown} {what}, more than {limit:,}",
                         source=source, item=item,
                         fix=fix or "ask for fewer: a coarser step or fewer divisions")
