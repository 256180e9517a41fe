"""Fatigue of steel details under vehicle crossings: turning points, rainflow counting, S-N
resistance (AASHTO LRFD, EN 1993-1-9), Miner damage, remaining life and traffic spectra."""

from influence.fatigue.batch_counting import CycleBatch, count_many
from influence.fatigue.counting import Cycle, CycleCount, count_cycles
from influence.fatigue.histories import Histories
from influence.fatigue.reversals import TURNING_POINT_TOLERANCE, turning_points

__all__ = [
    "TURNING_POINT_TOLERANCE",
    "Cycle",
    "CycleBatch",
    "CycleCount",
    "Histories",
    "count_cycles",
    "count_many",
    "turning_points",
]
