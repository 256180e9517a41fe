"""The fatigue data files of the published standards, read once, and edition lookup.

The files live in ``influence/fatigue/data``; each value there carries its clause and a
confidence mark. Editions are keyed by the first year they apply from: an edition year picks the
latest key not after it.

Example:
    >>> table("aashto_lrfd")["standard"]["name"]
    'AASHTO'
    >>> edition_key(table("aashto_lrfd"), 2017), edition_key(table("aashto_lrfd"), 2012)
    ('2014', '1994')
"""

from __future__ import annotations

import tomllib
from functools import cache
from importlib import resources
from typing import Any

from influence.errors import ModelError


@cache
def table(name: str) -> dict[str, Any]:
    """The parsed data file ``name``.toml (read once; do not change it)."""
    text = (resources.files("influence.fatigue") / "data" / f"{name}.toml").read_text("utf-8")
    return tomllib.loads(text)


def edition_key(data: dict[str, Any], edition: int | None) -> str:
    """The key of the edition in force in year ``edition`` (the latest one when None).

    Raises:
        ModelError: for a year before the first edition.
    """
    years = sorted(int(key) for key in data["editions"])
    if edition is None:
        return str(years[-1])
    earlier = [year for year in years if year <= edition]
    if not earlier:
        raise ModelError(f"no {data['standard']['name']} edition before {edition}",
                         item="edition", fix=f"give a year from {years[0]} on")
    return str(earlier[-1])
