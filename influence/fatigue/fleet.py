"""The vehicles that cross a structure in a fatigue run, as plain arrays, each with its passages
a year.

A fleet holds one row a vehicle (a spectrum truck, a lorry of a load model, a fatigue truck, or
several vehicles in a row at given headways): its axle loads front first [force] and each axle's
offset behind the front axle [length], padded with zeros to the longest vehicle, with the
passages a year of that row. Rows with the same number of axles are computed together
(:meth:`Fleet.groups`). Loads are static: a dynamic allowance belongs to the stress ranges (see
:func:`influence.fatigue.run.fatigue`).

Example:
    >>> from vehicles.train import Axle, Train
    >>> truck = Train("fatigue truck", (Axle(8.0), Axle(32.0, 14.0), Axle(32.0, 30.0)))
    >>> fleet = Fleet.of_trains([truck], [365.0 * 850], "kip-ft")
    >>> fleet.axle_offsets.tolist(), fleet.labels
    ([[0.0, 14.0, 44.0]], ('fatigue truck',))
    >>> convoy = Fleet.of_trains([platoon([truck, truck], [50.0])], [1.0], "kip-ft")
    >>> convoy.axle_offsets[0].tolist()  # the second truck's front axle 50 behind the first's rear
    [0.0, 14.0, 44.0, 94.0, 108.0, 138.0]
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from influence.errors import InfluenceError, ModelError
from influence.fatigue.spectrum import TrafficSpectrum
from vehicles.train import Axle, Train


@dataclass(frozen=True, eq=False)
class Fleet:
    """Vehicles end to end, validated when built (read-only arrays).

    Attributes:
        axle_loads: (vehicles, most axles) axle loads front first, 0 past a vehicle's last axle
            [force].
        axle_offsets: (vehicles, most axles) distance of each axle behind the front axle, 0
            past the last [length].
        axle_counts: (vehicles,) axles of each vehicle.
        passages_per_year: (vehicles,) passages of each vehicle a year [1/year].
        labels: one name a vehicle ("row 12", "lorry 3").
        units: "kip-ft" or "kN-m".
    """

    axle_loads: np.ndarray
    axle_offsets: np.ndarray
    axle_counts: np.ndarray
    passages_per_year: np.ndarray
    labels: tuple[str, ...]
    units: str

    def __post_init__(self) -> None:
        loads = np.array(self.axle_loads, dtype=float, ndmin=2)
        offsets = np.array(self.axle_offsets, dtype=float, ndmin=2)
        counts = np.array(self.axle_counts, dtype=np.int64).ravel()
        passages = np.array(self.passages_per_year, dtype=float).ravel()
        rows = counts.size
        if not (loads.shape == offsets.shape and loads.shape[0] == rows == passages.size
                == len(self.labels)):
            raise InfluenceError(f"fleet arrays of shapes {loads.shape}, {offsets.shape}, "
                                 f"{counts.shape}, {passages.shape}", item="fleet",
                                 fix="give one row a vehicle")
        used = np.arange(loads.shape[1])[None, :] < counts[:, None]
        if np.any((counts < 1) | (counts > loads.shape[1])) or not (
                np.all(loads[used] > 0) and np.all(np.isfinite(offsets))
                and np.all(np.diff(offsets, axis=1)[used[:, 1:]] >= 0)):
            raise InfluenceError("a vehicle without axles, with a load not above 0 or with "
                                 "axles out of order", item="fleet",
                                 fix="give positive axle loads front first")
        if not np.all(np.isfinite(passages) & (passages >= 0)):
            raise InfluenceError("passages a year must be at least 0", item="fleet",
                                 fix="give finite passages of at least 0")
        for name, array in (("axle_loads", np.where(used, loads, 0.0)),
                            ("axle_offsets", np.where(used, offsets, 0.0)),
                            ("axle_counts", counts), ("passages_per_year", passages)):
            array.setflags(write=False)
            object.__setattr__(self, name, array)
        object.__setattr__(self, "labels", tuple(self.labels))

    @staticmethod
    def of_trains(trains: Sequence[Train], passages_per_year: Sequence[float] | np.ndarray,
                  units: str, labels: Sequence[str] | None = None) -> Fleet:
        """Vehicles given as trains of axles (fixed gaps, no patches).

        Raises:
            ModelError: for a train with a uniform load or a ranged gap.
        """
        rows = [axles_of(train) for train in trains]
        width = max((loads.size for loads, _ in rows), default=1)
        loads = np.zeros((len(rows), width))
        offsets = np.zeros((len(rows), width))
        for k, (row_loads, row_offsets) in enumerate(rows):
            loads[k, :row_loads.size] = row_loads
            offsets[k, :row_offsets.size] = row_offsets
        names = tuple(labels) if labels is not None else tuple(t.name for t in trains)
        return Fleet(loads, offsets, np.array([r[0].size for r in rows]),
                     np.asarray(passages_per_year, dtype=float),
                     names, units)

    @staticmethod
    def of_spectrum(spectrum: TrafficSpectrum, passages_per_year: np.ndarray) -> Fleet:
        """The trucks of a spectrum, each labelled with its row of the file."""
        trucks = spectrum.trucks
        width = max((len(t.axle_loads) for t in trucks), default=1)
        loads = np.zeros((len(trucks), width))
        gaps = np.zeros((len(trucks), width))
        for k, truck in enumerate(trucks):
            loads[k, :len(truck.axle_loads)] = truck.axle_loads
            gaps[k, 1:len(truck.axle_loads)] = truck.axle_gaps
        counts = np.array([len(t.axle_loads) for t in trucks])
        return Fleet(loads, np.cumsum(gaps, axis=1), counts, passages_per_year,
                     tuple(f"row {t.row}" for t in trucks), spectrum.units)

    @property
    def count(self) -> int:
        """Number of vehicles."""
        return int(self.axle_counts.size)

    def groups(self) -> list[tuple[int, np.ndarray]]:
        """(axles, indices of the vehicles with that many axles), fewest axles first."""
        return [(int(n), np.flatnonzero(self.axle_counts == n))
                for n in np.unique(self.axle_counts)]

    def train(self, k: int) -> Train:
        """Vehicle ``k`` as a train of axles."""
        n = int(self.axle_counts[k])
        offsets = self.axle_offsets[k, :n]
        gaps = np.concatenate([[0.0], np.diff(offsets)])
        return Train(self.labels[k], tuple(Axle(float(p), float(g)) for p, g in
                                           zip(self.axle_loads[k, :n], gaps, strict=True)))

    def scaled(self, factor: float) -> Fleet:
        """The same vehicles passing ``factor`` times as often."""
        return Fleet(self.axle_loads, self.axle_offsets, self.axle_counts,
                     self.passages_per_year * factor, self.labels, self.units)


def platoon(trains: Sequence[Train], headways: Sequence[float], name: str | None = None) -> Train:
    """Vehicles in a row: each next one's front axle ``headways[k]`` behind the previous
    one's rear axle (the clear gap) [length].

    Raises:
        ModelError: for a headway count that does not fit, or a negative headway.
    """
    if not trains or len(headways) != len(trains) - 1:
        raise ModelError(f"{len(headways)} headways for {len(trains)} vehicles",
                         item="headway", fix="give one headway fewer than vehicles")
    joined = trains[0]
    for train, headway in zip(trains[1:], headways, strict=True):
        if not (np.isfinite(headway) and headway >= 0):
            raise ModelError(f"headway {headway} is not a distance", item="headway",
                             fix="give a clear gap of at least 0")
        joined = joined.followed_by(train, float(headway))
    return joined if name is None else Train(name, joined.items)


def axles_of(train: Train) -> tuple[np.ndarray, np.ndarray]:
    """(loads [force], offsets behind the front axle [length]) of a train of axles with fixed
    gaps.

    Raises:
        ModelError: for a train with a uniform load or a ranged gap.
    """
    if train.ranged_values:
        raise ModelError(f"{train.name} has a gap or length given as a range",
                         item=train.name, fix="give the vehicle with fixed gaps for fatigue")
    arranged = train.arranged()
    if arranged.patch_intensities.size or arranged.axle_loads.size == 0:
        raise ModelError(f"{train.name} carries a uniform load", item=train.name,
                         fix="fatigue histories take vehicles of axles only")
    return arranged.axle_loads, arranged.axle_offsets - arranged.axle_offsets[0]
