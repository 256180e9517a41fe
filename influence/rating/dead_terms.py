"""Which permanent loads of a model file are DC, DW and P in the rating equation.

The ``[[loads]]`` of a model file carry load names (``load = "DC"``). The rating needs three
terms: DC (structural components and attachments), DW (wearing surface and utilities) and P
(permanent effects other than dead load: secondary prestress, locked-in erection forces), as in
the LRFR equation (MBE 6A.4.2.1; the equation confirmed by M. A. Khan, *Bridge and Highway
Structure Rehabilitation and Repair*, McGraw-Hill 2010, ch. 5 p. 187). LFR and ASR add DC and DW
into D.

A load name that is itself a term's name goes to that term: ``DC``, ``DW``, and ``P`` with the
AASHTO LRFD names of locked-in and secondary effects ``PS``, ``EL``, ``CR``, ``SH`` (LRFD 3.3.2,
from memory, unconfirmed). Any other name must be placed in ``[rating.dead_loads]``::

    [rating.dead_loads]
    DC = ["girder", "deck"]       # load names of [[loads]]
    DW = ["surfacing"]
    P = ["prestress secondary"]

A load name in no term is refused rather than guessed: DC and DW have different factors.

Example:
    >>> terms = dead_load_terms({}, ("DC", "DW"))
    >>> terms.term_of("DW")
    'DW'
    >>> terms = dead_load_terms({"DW": ["surfacing"]}, ("DC", "surfacing"))
    >>> terms.split({"DC": 100.0, "surfacing": 20.0})
    (100.0, 20.0, 0.0)
    >>> dead_load_terms({}, ("deck",))
    Traceback (most recent call last):
    ...
    influence.errors.ModelError: rating.dead_loads: load name 'deck' is in none of DC, DW, P \
(add it to [rating.dead_loads], e.g. DC = ["deck"])
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any

from influence.errors import ModelError

TERMS = ("DC", "DW", "P")
DEFAULT_NAMES = {"DC": "DC", "DW": "DW", "P": "P", "PS": "P", "EL": "P", "CR": "P", "SH": "P"}
"""Load names placed in a term without being listed."""


@dataclass(frozen=True)
class DeadLoadTerms:
    """Load name -> rating term.

    Attributes:
        terms: (load name, "DC" | "DW" | "P") for every load name of the model file.
        listed: load names placed by ``[rating.dead_loads]`` (the others by their name).
    """

    terms: tuple[tuple[str, str], ...]
    listed: tuple[str, ...] = ()

    def term_of(self, load: str) -> str:
        """The term a load name belongs to."""
        return dict(self.terms)[load]

    def split(self, effects: Mapping[str, float]) -> tuple[float, float, float]:
        """(DC, DW, P): effects by load name summed by term [as the effects]."""
        sums: dict[str, list[float]] = {term: [] for term in TERMS}
        for load, value in effects.items():
            sums[self.term_of(load)].append(value)
        return (math.fsum(sums["DC"]), math.fsum(sums["DW"]), math.fsum(sums["P"]))


def listed_dead_loads(table: Any, source: str = "") -> tuple[tuple[str, str], ...]:
    """The ``[rating.dead_loads]`` table as (load name, term) pairs, checked for its form.

    Raises:
        ModelError: for a table that is not term = [names], or a name listed twice.
    """
    item = "rating.dead_loads"
    if not isinstance(table, dict):
        raise ModelError(f"dead_loads = {table!r}", source=source, item=item,
                         fix='write [rating.dead_loads] with DC = ["..."], DW = [...], P = [...]')
    placed: dict[str, str] = {}
    for term, names in table.items():
        if term not in TERMS:
            raise ModelError(f"unknown term {term!r}", source=source, item=item,
                             fix="use DC, DW or P")
        if not isinstance(names, list) or not all(isinstance(n, str) for n in names):
            raise ModelError(f"{term} = {names!r}", source=source, item=f"{item}.{term}",
                             fix='give a list of load names, e.g. ["deck"]')
        for name in names:
            if name in placed:
                raise ModelError(f"load name {name!r} is in {placed[name]} and {term}",
                                 source=source, item=item, fix="place each load name once")
            placed[name] = term
    return tuple(placed.items())


def dead_load_terms(listed: Any, load_names: tuple[str, ...],
                    source: str = "") -> DeadLoadTerms:
    """Place every load name of the model file in DC, DW or P.

    Args:
        listed: the ``[rating.dead_loads]`` table, or its (load name, term) pairs.
        load_names: the load names of the model's ``[[loads]]``.
        source: file name for errors.

    Raises:
        ModelError: for a listed name not among the loads, a load name in no term, or a table
            of the wrong form (see :func:`listed_dead_loads`).
    """
    item = "rating.dead_loads"
    pairs = listed_dead_loads(listed, source) if isinstance(listed, dict) else tuple(listed)
    placed = dict(pairs)
    for name, term in pairs:
        if name not in load_names:
            raise ModelError(f"no load named {name!r} in [[loads]]", source=source,
                             item=f"{item}.{term}",
                             fix="use the load names of [[loads]]: " + (
                                 ", ".join(load_names) or "none are given"))
    terms = []
    for name in load_names:
        term = placed.get(name, DEFAULT_NAMES.get(name))
        if term is None:
            raise ModelError(f"load name {name!r} is in none of {', '.join(TERMS)}",
                             source=source, item=item,
                             fix=f'add it to [rating.dead_loads], e.g. DC = ["{name}"]')
        terms.append((name, term))
    return DeadLoadTerms(tuple(terms), tuple(placed))
