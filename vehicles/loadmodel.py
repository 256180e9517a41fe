"""Load models: what a design code calls a live load, as a set of cases whose worst one governs.

A case is a train (or none) with its factors, a lane load applied only on the adverse parts of an
influence line, knife-edge loads placed at the extreme ordinate, and an optional scope that limits
the responses it applies to. Units are those named by ``units`` ("kN-m" or "kip-ft").

Example:
    >>> case = LoadCase("lane only", train=None, lane=9.3)
    >>> case.applies_to("moment", "min", interior=False)
    True
    >>> Scope(("negative moment",)).admits("moment", "max", interior=False)
    False
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from vehicles.errors import VehicleError
from vehicles.traffic import TrafficCategory, TrafficType
from vehicles.train import Axle, Train
from vehicles.units import factors, system

RESPONSE_KINDS = ("reaction", "shear", "moment", "axial", "deflection", "rotation")
SENSES = ("max", "min")

CATEGORIES = ("design", "legal", "specialized hauling", "notional", "emergency", "permit",
              "fatigue", "deflection")
"""What a load model is for: ``LoadModel.category`` is one of these, or "" when unsaid."""

KIP_PER_TON = 2.0
"""A ton of 2000 lb, the ton of US load posting, is 2 kip (1 kip = 1000 lb)."""

SCOPE_TOKENS = {
    # token: (response kind, sense or None for both, interior region only)
    "negative moment": ("moment", "min", False),
    "negative moment between contraflexure points": ("moment", "min", True),
    "positive moment": ("moment", "max", False),
    "interior reaction": ("reaction", None, True),
    **{kind: (kind, None, False) for kind in RESPONSE_KINDS},
}


@dataclass(frozen=True)
class Scope:
    """The responses a case applies to; empty means every response.

    Tokens: "negative moment", "positive moment", "negative moment between contraflexure points"
    (a moment at a section where a uniform load on every span hogs: between the points of
    contraflexure around an interior support), "interior reaction" (a reaction at a support that
    is not at an end of the path), or a response kind: reaction, shear, moment, axial,
    deflection, rotation.
    """

    effects: tuple[str, ...] = ()

    def __post_init__(self) -> None:
        object.__setattr__(self, "effects", tuple(self.effects))
        for token in self.effects:
            if token not in SCOPE_TOKENS:
                raise VehicleError(
                    f"unknown scope '{token}'",
                    item="scope",
                    fix="use one of: " + ", ".join(SCOPE_TOKENS),
                )

    def admits(self, kind: str, sense: str, *, interior: bool) -> bool:
        """Whether a case with this scope counts for the ``sense`` extreme of a ``kind`` response.

        Args:
            kind: a response kind from :data:`RESPONSE_KINDS`.
            sense: "max" or "min".
            interior: for a reaction, whether its support is not at an end of the path; for a
                moment, whether its section lies between the points of contraflexure of a
                uniform load on every span (the caller decides: a negative area of the
                moment's influence line).
        """
        if not self.effects:
            return True
        for token in self.effects:
            token_kind, token_sense, interior_only = SCOPE_TOKENS[token]
            if token_kind != kind or (token_sense and token_sense != sense):
                continue
            if interior_only and not interior:
                continue
            return True
        return False


@dataclass(frozen=True)
class LoadCase:
    """One way of loading a lane.

    Args:
        name: label, such as "design truck + lane".
        train: the moving train, or None for a lane load alone.
        factor: multiplies everything in the case (0.90 for a two-truck case) [-].
        axle_allowance: dynamic load allowance on axles, 0.33 for +33 % [-].
        patch_allowance: dynamic load allowance on the train's own patches [-].
        lane: uniform load on the adverse parts of the influence line [force/length].
        lane_allowance: dynamic load allowance on the lane and knife-edge loads [-].
        lane_clear_of_train: if not None, the lane is not applied within this distance
            [length] ahead of the first axle and behind the last axle, nor between them
            (Load Model 71's uniform load stops 0.8 m from the outer axles).
        knife_edge_moment: concentrated load at the extreme ordinate for moments and every
            response other than shear and reactions [force].
        knife_edge_shear: concentrated load at the extreme ordinate for shear and reactions [force].
        neglect_relieving_axles: each axle acts only on the adverse part of the influence line
            (the positive part for the largest effect, the negative part for the smallest): an
            axle that would reduce the effect is left off (AASHTO LRFD 3.6.1.3.1: axles that do
            not contribute to the extreme force effect are neglected).
        scope: the responses the case applies to.
        note: free text shown with the case (clause, assumptions).
    """

    name: str
    train: Train | None = None
    factor: float = 1.0
    axle_allowance: float = 0.0
    patch_allowance: float = 0.0
    lane: float = 0.0
    lane_allowance: float = 0.0
    lane_clear_of_train: float | None = None
    knife_edge_moment: float = 0.0
    knife_edge_shear: float = 0.0
    neglect_relieving_axles: bool = False
    scope: Scope = field(default_factory=Scope)
    note: str = ""

    def __post_init__(self) -> None:
        for name in ("factor", "axle_allowance", "patch_allowance", "lane", "lane_allowance",
                     "knife_edge_moment", "knife_edge_shear"):
            value = getattr(self, name)
            if not math.isfinite(value) or value < 0:
                raise VehicleError(f"{name} = {value:g} is negative or not finite",
                                   item=self.name, fix=f"give {name} >= 0")
        clear = self.lane_clear_of_train
        if clear is not None and not (math.isfinite(clear) and clear >= 0):
            raise VehicleError(f"lane_clear_of_train = {clear:g} is negative or not finite",
                               item=self.name, fix="give a clear distance >= 0")
        if self.factor == 0:
            raise VehicleError("factor is zero", item=self.name, fix="give a factor > 0")
        if self.is_empty:
            raise VehicleError("the case has nothing to place", item=self.name,
                               fix="give a train, a lane load or a knife-edge load")

    @property
    def is_empty(self) -> bool:
        """Whether the case has no train, no lane load and no knife-edge load."""
        return (self.train is None and self.lane == 0
                and self.knife_edge_moment == 0 and self.knife_edge_shear == 0)

    def knife_edge_for(self, kind: str) -> float:
        """The knife-edge load [force] that acts for a response of this kind."""
        return self.knife_edge_shear if kind in ("shear", "reaction") else self.knife_edge_moment

    def applies_to(self, kind: str, sense: str, *, interior: bool) -> bool:
        """Whether the case counts for the ``sense`` extreme of a ``kind`` response."""
        return self.scope.admits(kind, sense, interior=interior)


SCALED_QUANTITIES = ("axles", "uniform", "lane", "knife_edges")
"""What an adjustment may scale: axle loads, the train's uniform patches, lane, knife-edges."""

SET_QUANTITIES = ("dynamic_allowance", "uniform_dynamic_allowance", "lane_dynamic_allowance")
"""What an adjustment may set: the allowance on axles, on the train's patches, on lane loads."""


MAX_ADJUSTMENT = 1000.0
"""The largest value an adjustment takes: adjustments are factors and fractions [-]."""


@dataclass(frozen=True)
class Adjustment:
    """A named input of a load model that the user may change, such as EN 1991-2's alpha.

    The model's loads are stored as they are at ``value``; see
    :func:`vehicles.library.adjust.adjusted`.

    Args:
        name: the symbol, such as "alpha" or "impact".
        value: its value in the stored model [-]; must be positive when it scales loads.
        scales: quantities proportional to the value, from :data:`SCALED_QUANTITIES`.
        sets: allowances equal to the value, from :data:`SET_QUANTITIES`.
        note: what it is, its clause and its usual values.
    """

    name: str
    value: float
    scales: tuple[str, ...] = ()
    sets: tuple[str, ...] = ()
    note: str = ""

    def __post_init__(self) -> None:
        object.__setattr__(self, "scales", tuple(self.scales))
        object.__setattr__(self, "sets", tuple(self.sets))
        for token in self.scales:
            if token not in SCALED_QUANTITIES:
                raise VehicleError(f"cannot scale '{token}'", item=f"adjustment {self.name}",
                                   fix="scale one of: " + ", ".join(SCALED_QUANTITIES))
        for token in self.sets:
            if token not in SET_QUANTITIES:
                raise VehicleError(f"cannot set '{token}'", item=f"adjustment {self.name}",
                                   fix="set one of: " + ", ".join(SET_QUANTITIES))
        if not self.scales and not self.sets:
            raise VehicleError("the adjustment scales and sets nothing",
                               item=f"adjustment {self.name}", fix="give scales or sets")
        if not math.isfinite(self.value) or self.value < 0 or (
                self.scales and self.value == 0) or self.value > MAX_ADJUSTMENT:
            need = ("> 0" if self.scales else ">= 0") + f" and at most {MAX_ADJUSTMENT:g}"
            raise VehicleError(f"value {self.value:g} is not allowed",
                               item=f"adjustment {self.name}", fix=f"give a value {need}")


@dataclass(frozen=True)
class LoadModel:
    """A named set of cases; the worst case governs each effect.

    Args:
        name: short library name, such as "HL-93".
        title: one-line description.
        units: "kN-m" or "kip-ft".
        cases: the cases.
        standard: the standard and edition ("" for a user's own vehicle).
        clause: the clauses the values come from.
        notes: remarks, including which values were recalled rather than read.
        adjustments: inputs the user may change (see
            :func:`vehicles.library.adjust.adjusted`).
        category: what the model is for, one of :data:`CATEGORIES` ("" when unsaid).
        traffic_types: for a set of lorries (fatigue), each lorry's share of the heavy
            vehicles by traffic type; the shares name cases of the model.
        traffic_categories: heavy vehicles a year on one slow lane by class of road.

    Example:
        >>> truck = Train("Type 3", (Axle(16.0), Axle(17.0, 15.0), Axle(17.0, 4.0)))
        >>> legal = LoadModel("Type 3", "legal truck", "kip-ft", (LoadCase("Type 3", truck),),
        ...                   category="legal")
        >>> legal.gross_weight, legal.gross_weight_tons
        (50.0, 25.0)
        >>> try:
        ...     LoadModel("x", "x", "kip-ft", legal.cases, category="rating")
        ... except VehicleError as error:
        ...     print(error.problem)
        unknown category 'rating'
    """

    name: str
    title: str
    units: str
    cases: tuple[LoadCase, ...]
    standard: str = ""
    clause: str = ""
    notes: tuple[str, ...] = ()
    adjustments: tuple[Adjustment, ...] = ()
    category: str = ""
    traffic_types: tuple[TrafficType, ...] = ()
    traffic_categories: tuple[TrafficCategory, ...] = ()

    def __post_init__(self) -> None:
        for name in ("cases", "notes", "adjustments", "traffic_types", "traffic_categories"):
            object.__setattr__(self, name, tuple(getattr(self, name)))
        if not self.cases:
            raise VehicleError("a load model needs at least one case", item=self.name)
        system(self.units)
        if self.category and self.category not in CATEGORIES:
            raise VehicleError(f"unknown category '{self.category}'", item=self.name,
                               fix="use one of: " + ", ".join(CATEGORIES))
        case_names = [c.name for c in self.cases]
        for kind, names in (("case", case_names),
                            ("adjustment", [a.name for a in self.adjustments]),
                            ("traffic type", [t.name for t in self.traffic_types]),
                            ("traffic category", [t.name for t in self.traffic_categories])):
            repeated = sorted({n for n in names if names.count(n) > 1})
            if repeated:
                raise VehicleError(f"{kind} name '{repeated[0]}' is used twice", item=self.name,
                                   fix=f"give each {kind} its own name")
        for traffic in self.traffic_types:
            for case, _ in traffic.shares:
                if case not in case_names:
                    raise VehicleError(f"no case named '{case}'",
                                       item=f"{self.name}: traffic type {traffic.name}",
                                       fix="name the lorries by their case names")

    @property
    def gross_weight(self) -> float:
        """Total axle load of the first case with a train, as written [force].

        The vehicle's weight W for posting: no case factor and no dynamic allowance.

        Raises:
            VehicleError: when no case has a train, or the train has uniform loads.
        """
        train = next((case.train for case in self.cases if case.train is not None), None)
        if train is None or not all(isinstance(item, Axle) for item in train.items):
            raise VehicleError("no case has a train of axles alone", item=self.name,
                               fix="the gross weight is for vehicles with axles only")
        return train.total_load()

    @property
    def gross_weight_tons(self) -> float:
        """:attr:`gross_weight` in tons of 2000 lb [ton], whatever the model's units."""
        return self.gross_weight * factors(self.units, "kip-ft").force / KIP_PER_TON
