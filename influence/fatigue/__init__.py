"""Fatigue of steel details under vehicle crossings: turning points, rainflow counting, S-N
resistance (AASHTO LRFD, EN 1993-1-9), Miner damage, remaining life and traffic spectra.

The names below depend on numpy, the ``rainflow`` library and :mod:`influence.errors` only. The
exact histories of crossings (:mod:`influence.fatigue.crossings`), the vehicles and their passages
(:mod:`~influence.fatigue.fleet`, :mod:`~influence.fatigue.passages`) and a whole run over a model
file's details (:func:`influence.fatigue.run.fatigue`) use the analysis and the vehicles, and are
imported from their modules.
"""

from influence.fatigue.aashto import aashto_curve, aashto_resistance
from influence.fatigue.assessment import assess_counted, assess_detail, assess_histories
from influence.fatigue.batch_counting import CycleBatch, count_many
from influence.fatigue.counting import Cycle, CycleCount, count_cycles
from influence.fatigue.damage import FatigueLife, assess_spectrum, miner_sum
from influence.fatigue.eurocode import en_curve, en_resistance
from influence.fatigue.histories import Histories
from influence.fatigue.reversals import TURNING_POINT_TOLERANCE, turning_points
from influence.fatigue.settings import (
    FatigueDetail,
    FatigueSettings,
    detail_resistance,
    fatigue_details,
    fatigue_settings,
)
from influence.fatigue.sn_curve import Resistance, SNCurve
from influence.fatigue.spectrum import SpectrumTruck, TrafficSpectrum, read_spectrum

__all__ = [
    "TURNING_POINT_TOLERANCE",
    "Cycle",
    "CycleBatch",
    "CycleCount",
    "FatigueDetail",
    "FatigueLife",
    "FatigueSettings",
    "Histories",
    "Resistance",
    "SNCurve",
    "SpectrumTruck",
    "TrafficSpectrum",
    "aashto_curve",
    "aashto_resistance",
    "assess_counted",
    "assess_detail",
    "assess_histories",
    "assess_spectrum",
    "count_cycles",
    "count_many",
    "detail_resistance",
    "en_curve",
    "en_resistance",
    "fatigue_details",
    "fatigue_settings",
    "miner_sum",
    "read_spectrum",
    "turning_points",
]
