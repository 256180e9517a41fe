"""What a rating factor is computed from and what it returns, every term kept for the report.

Sense convention. A section is rated for one response (moment, shear or axial force) in one
sense: "positive" (sagging moment, positive shear, tension) or "negative" (hogging moment,
negative shear, compression), signs as in the README. Effects and capacities are given with
their signs in that convention; the rating works in the magnitude of the sense, i.e. every
value is multiplied by +1 (positive sense) or -1 (negative sense). A negative moment is thus
rated with a negative capacity and the negative dead and live moments: a capacity of -4000 and
a dead moment of -1500 become 4000 and 1500. A dead effect of the other sign relieves the
section and enters as a negative demand (flagged in the result); a live effect of the other
sign means the vehicle does not load the section in this sense (the factor is infinite).

Example:
    >>> effects = SectionEffects("negative", dead_components=-1500.0, live=-800.0)
    >>> effects.in_sense(effects.dead_components), effects.signed_live
    (1500.0, 800.0)
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from influence.errors import ModelError

SENSES = ("positive", "negative")


@dataclass(frozen=True)
class SectionEffects:
    """Unfactored effects at one section for one response and sense, in the model's units.

    Attributes:
        sense: "positive" or "negative".
        dead_components: DC, dead load of structural components and attachments [force or
            force x length], signed.
        dead_wearing: DW, wearing surface and utilities, signed.
        permanent: P, permanent effects other than dead load (secondary prestress, locked-in
            forces), signed.
        live: the vehicle's extreme effect in this sense for one lane, without dynamic
            allowance, signed.
        lane: the lane-load part of the live effect (no dynamic allowance), signed.
        distribution: live-load distribution factor, lanes per girder [-] (1.0 when the
            effects are already those of the girder).
    """

    sense: str
    dead_components: float = 0.0
    dead_wearing: float = 0.0
    permanent: float = 0.0
    live: float = 0.0
    lane: float = 0.0
    distribution: float = 1.0

    def __post_init__(self) -> None:
        if self.sense not in SENSES:
            raise ModelError(f"unknown sense {self.sense!r}", item="sense",
                             fix='use "positive" or "negative"')
        if not self.distribution > 0.0:
            raise ModelError(f"distribution factor {self.distribution!r}", item="distribution",
                             fix="give the lanes carried by the girder, greater than 0")

    @property
    def sign(self) -> float:
        """+1 for the positive sense, -1 for the negative sense."""
        return 1.0 if self.sense == "positive" else -1.0

    def in_sense(self, value: float) -> float:
        """A signed value as a magnitude in this sense (positive when it acts in the sense)."""
        return self.sign * value + 0.0  # + 0.0 turns -0.0 into 0.0

    @property
    def signed_live(self) -> float:
        """The vehicle's effect in the magnitude of the sense."""
        return self.in_sense(self.live)


@dataclass(frozen=True)
class FactoredTerm:
    """A factored load effect in the rating equation, in the magnitude of the sense.

    Attributes:
        name: "DC", "DW", "P" or "D".
        factor: load factor [-].
        effect: unfactored effect in the sense [force or force x length].
    """

    name: str
    factor: float
    effect: float

    @property
    def value(self) -> float:
        """factor x effect."""
        return self.factor * self.effect

    @property
    def relieving(self) -> bool:
        """True when the effect acts against the sense (it reduces the demand)."""
        return self.effect < 0.0


@dataclass(frozen=True)
class RatingResult:
    """A rating factor with every term of its equation.

    Attributes:
        method: "LRFR", "LFR" or "ASR".
        level: rating level ("design inventory", "legal", "operating", ...).
        limit_state: "Strength I", "Service II", ... ("" for LFR and ASR).
        sense: "positive" or "negative".
        capacity: C in the magnitude of the sense.
        nominal: Rn (strength), f_R (service) or the allowable effect (ASR), magnitude.
        resistance_factor: phi (1.0 where none applies).
        condition_factor: phi_c (1.0 where none applies).
        system_factor: phi_s (1.0 where none applies).
        member_factor: phi_c phi_s as used, after the 0.85 floor.
        floor_applied: True when phi_c phi_s was raised to 0.85.
        dead: the factored permanent terms subtracted from C.
        live_factor: gL, or A2 [-].
        impact: IM or I as a fraction [-].
        effects: the section's unfactored effects.
        rating_factor: RF [-]; infinite when the vehicle does not load the section in the sense.
        notes: what the report should say besides the numbers.
    """

    method: str
    level: str
    limit_state: str
    sense: str
    capacity: float
    nominal: float
    resistance_factor: float
    condition_factor: float
    system_factor: float
    member_factor: float
    floor_applied: bool
    dead: tuple[FactoredTerm, ...]
    live_factor: float
    impact: float
    effects: SectionEffects
    rating_factor: float
    notes: tuple[str, ...] = ()

    @property
    def live_with_impact(self) -> float:
        """LL + IM for the girder: g (live (1 + IM) + lane), magnitude in the sense."""
        e = self.effects
        return e.distribution * (e.in_sense(e.live) * (1.0 + self.impact) + e.in_sense(e.lane))

    @property
    def factored_live(self) -> float:
        """gL (LL + IM)."""
        return self.live_factor * self.live_with_impact

    @property
    def factored_dead(self) -> float:
        """The sum of the factored permanent terms."""
        return math.fsum(term.value for term in self.dead)

    def arithmetic(self) -> str:
        """The equation with its numbers, one line, for a calculation package."""
        e = self.effects
        dead = "".join(f" - {t.factor:g} x {t.effect:g}" for t in self.dead)
        lane = f" + {e.in_sense(e.lane):g}" if e.lane else ""
        live = f"{e.in_sense(e.live):g} x {1.0 + self.impact:g}{lane}"
        if e.distribution != 1.0:
            live = f"{e.distribution:g} x ({live})"
        return (f"RF = ({self.capacity:g}{dead}) / ({self.live_factor:g} x ({live})) = "
                f"{self.rating_factor:.4g}")
