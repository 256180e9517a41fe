"""Checking one vehicle's effect against a reference load model's effect at the same section.

A screening check of common practice for permits and for legal loads: a vehicle whose largest
(and smallest) effects at every section stay within those of the load model a structure was
designed or rated for passes without a rating of its own. A job names the reference load models
(``compare_with = ["HL-93"]``) or takes each structure's own (``compare_with = "model"``: the
vehicles of the model file's ``[live_load]``, its design loading).

The ratio is the vehicle's adverse effect over the reference's adverse effect in the same sense
(the largest positive, or the most negative); an effect that is not adverse in that sense is no
demand.

Example (a vehicle's 800 against a reference's 1000 in the max sense; a relieving effect in the
min sense is no demand):
    >>> check(800.0, 1000.0, "max", scale=1000.0)
    (0.8, 'pass')
    >>> check(5.0, -300.0, "min", scale=1000.0)
    (0.0, 'pass')
    >>> check(-10.0, 0.0, "min", scale=1000.0)
    (inf, 'fail')
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from influence.batch.fields import vehicle_names
from influence.batch.rows import Subject
from influence.design.loading import vehicles_for
from influence.errors import BatchError
from vehicles.loadmodel import LoadModel

MODEL_VEHICLES = "model"
"""``compare_with`` value that takes each model file's own vehicles as the reference."""

NEGLIGIBLE_FRACTION = 1e-9
"""An effect smaller than this fraction of the largest effect of the response at the section
(any vehicle, either sense) counts as zero: rounding, not demand."""


def check(value: float | None, reference: float | None, sense: str,
          scale: float) -> tuple[float, str]:
    """The ratio of the vehicle's adverse effect to the reference's, and "pass" or "fail".

    Args:
        value: the vehicle's effect in ``sense`` [effect unit] (None: no case applies).
        reference: the reference's effect in the same sense [effect unit].
        sense: "max" (positive effects are adverse) or "min" (negative ones are).
        scale: the largest magnitude of the response at the section [effect unit].
    """
    sign = 1.0 if sense == "max" else -1.0
    demand = max(sign * (value or 0.0), 0.0)
    allowed = max(sign * (reference or 0.0), 0.0)
    small = NEGLIGIBLE_FRACTION * scale
    if demand <= small:
        ratio = 0.0
    elif allowed <= small:
        ratio = math.inf
    else:
        ratio = demand / allowed
    return ratio, "pass" if ratio <= 1.0 else "fail"


def magnitude(*values: float | None) -> float:
    """The largest magnitude among the effects given (None counts as 0)."""
    return max((abs(v) for v in values if v is not None), default=0.0)


@dataclass(frozen=True)
class Comparison:
    """What a run's values are checked against.

    Attributes:
        names: reference load models (library names or vehicle files).
        own: take each model file's ``live_load.vehicles`` instead.
    """

    names: tuple[str, ...] = ()
    own: bool = False

    @property
    def wanted(self) -> bool:
        return bool(self.names) or self.own

    def models(self, subject: Subject) -> list[LoadModel]:
        """The reference load models in the structure's units (none when nothing is compared).

        Raises:
            BatchError: when the model file's own vehicles are wanted and it names none.
        """
        live = subject.model_file.basis.live
        names = live.vehicles if self.own else self.names
        if self.own and not names:
            raise BatchError("no vehicles to compare with", source=subject.model_file.source,
                             item="live_load.vehicles",
                             fix="name the design loading in [live_load] vehicles, or the "
                                 "reference in the job's compare_with")
        return vehicles_for(names, subject.units, live.adjust)[0] if names else []


def read_comparison(value: Any, folder: Path, source: str, item: str) -> Comparison:
    """``compare_with``: a list of load models, or "model" for each model file's own."""
    if value == MODEL_VEHICLES:
        return Comparison(own=True)
    if isinstance(value, str):
        raise BatchError(f"compare_with = {value!r}", source=source, item=f"{item}.compare_with",
                         fix=f'write a list such as ["HL-93"], or "{MODEL_VEHICLES}" for each '
                             "model file's own vehicles")
    return Comparison(vehicle_names(value, folder, source, item, "compare_with"))
