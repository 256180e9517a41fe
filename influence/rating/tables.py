"""The rating data files: reading them once, choosing an edition, interpolating a table.

The factor tables live in ``influence/rating/data/*.toml`` with the standard, the clause and a
confidence mark beside every value. This module only reads them; what each number means is
said where it is used.

Example:
    >>> known_editions()
    ('MBE 1st', 'MBE 2nd')
    >>> interpolated(((100.0, 1.40), (1000.0, 1.65)), 550.0)
    1.525
    >>> interpolated(((100.0, 1.40), (1000.0, 1.65)), 20.0)   # held beyond the ends
    1.4
"""

from __future__ import annotations

import functools
import tomllib
from collections.abc import Sequence
from importlib import resources
from typing import Any

import numpy as np

from influence.errors import ModelError

FACTORS_FILE = "mbe.toml"
DISTRIBUTION_FILE = "lrfd_distribution.toml"
POSTING_FILE = "posting.toml"


@functools.cache
def data_file(name: str) -> dict[str, Any]:
    """The parsed data file ``influence/rating/data/NAME`` (read once)."""
    text = (resources.files("influence.rating") / "data" / name).read_text(encoding="utf-8")
    return tomllib.loads(text)


def known_editions() -> tuple[str, ...]:
    """The MBE editions the factor tables know, in file order."""
    return tuple(data_file(FACTORS_FILE)["editions"])


def edition_table(edition: str, source: str = "", item: str = "edition") -> dict[str, Any]:
    """The edition's own tables (legal and permit live-load factors).

    Raises:
        ModelError: for an edition the data do not hold, listing the known ones.
    """
    editions = data_file(FACTORS_FILE)["editions"]
    if edition not in editions:
        raise ModelError(f"unknown edition {edition!r}", source=source, item=item,
                         fix="use one of: " + ", ".join(f'"{e}"' for e in editions))
    table: dict[str, Any] = editions[edition]
    return table


def interpolated(points: Sequence[tuple[float, float]], x: float) -> float:
    """Linear interpolation in a table of (x, value) rows sorted by x, held beyond its ends."""
    xs = np.array([p[0] for p in points], dtype=float)
    values = np.array([p[1] for p in points], dtype=float)
    return round(float(np.interp(x, xs, values)), 12)
