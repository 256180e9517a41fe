"""Option values checked where they are parsed: a step, a count, a list of positions, an output
place. A value that makes no sense is refused as our one-line error (exit status 1) naming the
option and the fix, before any work starts.

Example:
    >>> POSITIVE_LENGTH.convert("0.5", None, None)
    0.5
    >>> try:
    ...     POSITIVE_LENGTH.convert("nan", None, None)
    ... except ModelError as error:
    ...     print(error)
    option: 'nan' is not a number (give a finite number, such as 0.5)
"""

from __future__ import annotations

import math
from typing import Any

import click

from influence.errors import ModelError
from influence.model.limits import MAX_PER_SPAN, MAX_TABLE_ROWS

MAX_TOP = 100
"""The most governing positions ``--top`` lists for each sense."""


def _name(param: click.Parameter | None) -> str:
    return param.opts[0] if param is not None and param.opts else "option"


def _finite(value: Any, option: str) -> float:
    try:
        number = float(value)
    except (TypeError, ValueError):
        number = math.nan
    if not math.isfinite(number):
        raise ModelError(f"{str(value)!r} is not a number", item=option,
                         fix="give a finite number, such as 0.5")
    return number


class PositiveLength(click.ParamType):
    """A finite length greater than zero, such as a tabulation step [length]."""

    name = "length"

    def convert(self, value: Any, param: click.Parameter | None,
                ctx: click.Context | None) -> float:
        option = _name(param)
        number = _finite(value, option)
        if number <= 0:
            raise ModelError(f"{value} is not a positive length", item=option,
                             fix="give a length greater than 0, such as 0.5")
        return number


class Amount(click.ParamType):
    """A finite number from ``minimum`` to ``maximum`` (a zero minimum may be excluded), such
    as trucks a day or a stress step."""

    name = "number"

    def __init__(self, minimum: float, maximum: float, what: str, *,
                 zero_allowed: bool = True) -> None:
        self.minimum, self.maximum, self.what = minimum, maximum, what
        self.zero_allowed = zero_allowed

    def convert(self, value: Any, param: click.Parameter | None,
                ctx: click.Context | None) -> float:
        option = _name(param)
        number = _finite(value, option)
        low = number < self.minimum or (number == self.minimum and not self.zero_allowed)
        if low or number > self.maximum:
            bounds = (f"from {self.minimum:,g} to {self.maximum:,.0f}" if self.zero_allowed
                      else f"greater than {self.minimum:,g} and at most {self.maximum:,.0f}")
            raise ModelError(f"{value} is out of range", item=option,
                             fix=f"give {self.what} {bounds}")
        return number


class Count(click.ParamType):
    """A whole number from ``minimum`` to ``maximum``."""

    name = "integer"

    def __init__(self, minimum: int, maximum: int) -> None:
        self.minimum, self.maximum = minimum, maximum

    def convert(self, value: Any, param: click.Parameter | None,
                ctx: click.Context | None) -> int:
        option = _name(param)
        try:
            number = value if isinstance(value, int) else int(str(value).strip())
        except ValueError:
            raise ModelError(f"{str(value)!r} is not a whole number", item=option,
                             fix=f"give a whole number from {self.minimum} to "
                                 f"{self.maximum:,}") from None
        if not self.minimum <= number <= self.maximum:
            raise ModelError(f"{number} is out of range", item=option,
                             fix=f"give a whole number from {self.minimum} to "
                                 f"{self.maximum:,}")
        return number


class PositionList(click.ParamType):
    """Chainages separated by commas, at least one, each finite [length]."""

    name = "positions"

    def convert(self, value: Any, param: click.Parameter | None,
                ctx: click.Context | None) -> tuple[float, ...]:
        if isinstance(value, tuple):
            return value
        option = _name(param)
        parts = [part.strip() for part in str(value).split(",")]
        if not any(parts):
            raise ModelError("no positions given", item=option,
                             fix="give chainages separated by commas, such as 0,2.5,7")
        if len(parts) > MAX_TABLE_ROWS:
            raise ModelError(f"{len(parts):,} positions are more than {MAX_TABLE_ROWS:,}",
                             item=option, fix="give fewer positions, or a --step")
        if not all(parts):
            raise ModelError(f"an empty entry in {str(value)!r}", item=option,
                             fix="give chainages separated by single commas, such as 0,2.5,7")
        return tuple(_finite(part, option) for part in parts)


def not_empty(ctx: click.Context, param: click.Parameter, value: Any) -> Any:
    """Refuse an empty text value (such as ``--out ""``)."""
    if value is not None and not str(value).strip():
        raise ModelError("is empty", item=_name(param), fix="give a folder or file name")
    return value


POSITIVE_LENGTH = PositiveLength()
MAX_ADTT = 1.0e6
"""The most trucks a day an option accepts: far above the traffic of any road."""
ADTT = Amount(0.0, MAX_ADTT, "trucks a day in one direction")
STRESS_STEP = Amount(0.0, 1.0e6, "a stress step", zero_allowed=False)
PER_SPAN = Count(1, MAX_PER_SPAN)
TOP = Count(1, MAX_TOP)
POSITIONS = PositionList()
