"""Load trains and published design live-load models; independent of the influence package."""

from vehicles.errors import VehicleError
from vehicles.loadmodel import LoadCase, LoadModel, Scope
from vehicles.train import Arrangement, Axle, Patch, Train

__all__ = [
    "Arrangement",
    "Axle",
    "LoadCase",
    "LoadModel",
    "Patch",
    "Scope",
    "Train",
    "VehicleError",
]
