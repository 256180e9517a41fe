"""Load trains and published design live-load models; independent of the influence package.

Example:
    >>> import vehicles
    >>> model = vehicles.get_model("HL-93", units="kN-m")
    >>> [case.name for case in model.cases]
    ['design truck + lane', 'design tandem + lane', '90% truck pair + lane']
    >>> truck = model.cases[0].train
    >>> truck.arranged([9.0]).axle_offsets.round(4).tolist()  # rear gap 9 m
    [0.0, 4.2672, 13.2672]
"""

from vehicles.conversion import model_in
from vehicles.errors import VehicleError
from vehicles.library.adjust import adjusted
from vehicles.library.catalog import get_model, library_names, load_model
from vehicles.library.files import read_load_model
from vehicles.library.writer import write_model
from vehicles.loadmodel import Adjustment, LoadCase, LoadModel, Scope
from vehicles.search.govern import Governing, govern, govern_many
from vehicles.search.placement import Placement
from vehicles.search.sweep import sweep
from vehicles.traffic import TrafficCategory, TrafficType
from vehicles.train import Arrangement, Axle, Patch, Train

__all__ = [
    "Adjustment",
    "Arrangement",
    "Axle",
    "Governing",
    "LoadCase",
    "LoadModel",
    "Patch",
    "Placement",
    "Scope",
    "TrafficCategory",
    "TrafficType",
    "Train",
    "VehicleError",
    "adjusted",
    "get_model",
    "govern",
    "govern_many",
    "library_names",
    "load_model",
    "model_in",
    "read_load_model",
    "sweep",
    "write_model",
]
