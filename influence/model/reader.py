"""The one reader of model files: the structure, its design basis and the project, from one
TOML file, with every key checked.

A model file holds the structure (the compact ``[beam]`` or ``[truss]`` form, or ``[[nodes]]``,
``[[members]]`` and ``[path]``; see :mod:`influence.model.structure_form`), and optionally the
design basis (``[[loads]]``, ``[[combinations]]``, ``[live_load]``, ``[sections]``; see
:mod:`influence.model.basis`), the title block (``[project]``), and the assessment tables
(``[rating]``, ``[[capacity]]``, ``[fatigue]``, ``[[fatigue_detail]]``) that the rating and
fatigue layers read, checked here by their own readers and against the structure (capacities and
fatigue details must lie on it). A key at the top level that belongs in one of these tables is
refused with the table it belongs in.

Example:
    >>> import pathlib, tempfile
    >>> path = pathlib.Path(tempfile.mkdtemp()) / "m.toml"
    >>> _ = path.write_text('deflection_limit = 800\\n[beam]\\nspans = [10.0]\\nEI = 1.0\\n'
    ...                     'supports = ["pinned", "roller"]\\n')
    >>> try:
    ...     read_model_file(path)
    ... except ModelError as error:
    ...     print(error.fix)
    move deflection_limit into [live_load]
"""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path
from typing import Any

from influence.errors import ModelError
from influence.fatigue.settings import (
    FatigueDetail,
    FatigueSettings,
    fatigue_details,
    fatigue_settings,
)
from influence.model.basis import DesignBasis, design_from_document
from influence.model.fields import check_keys, read_toml
from influence.model.keys import TABLES, TOP_KEYS, homes
from influence.model.locations import check_location
from influence.model.path import trace
from influence.model.project import ProjectInfo, project_from_document
from influence.model.structure import Model
from influence.model.structure_form import model_from_document
from influence.rating.capacity import Capacity, capacities, check_on_structure
from influence.rating.settings import RatingSettings, rating_settings

BELONGS_IN = {key: homes(key)[0] for keys in TABLES.values() for key in keys
              if key not in TOP_KEYS and homes(key)}
"""Where a key belongs when it is written at the top level by mistake (its first table)."""


@dataclass(frozen=True)
class ModelFile:
    """Everything a model file says.

    Attributes:
        model: the structure and its travel path.
        basis: dead loads, combinations, live-load and section settings.
        project: the title-block fields.
        document: the parsed TOML, for the rating and fatigue readers.
        source: the file name.
        rating: the ``[rating]`` settings, None when the file has none.
        capacities: the ``[[capacity]]`` entries, checked on the structure.
        fatigue: the ``[fatigue]`` settings, None when the file has none.
        fatigue_details: the ``[[fatigue_detail]]`` entries, located on the structure.
    """

    model: Model
    basis: DesignBasis
    project: ProjectInfo
    document: dict[str, Any]
    source: str
    rating: RatingSettings | None = None
    capacities: tuple[Capacity, ...] = ()
    fatigue: FatigueSettings | None = None
    fatigue_details: tuple[FatigueDetail, ...] = ()


def read_model_file(path: str | Path) -> ModelFile:
    """Read and check a whole model file: structure, design basis, project, and the rating and
    fatigue tables when present."""
    source = str(path)
    document = read_toml(path)
    return model_file_from_document(document, source)


def model_file_from_document(document: dict[str, Any], source: str = "") -> ModelFile:
    """:func:`read_model_file` for a document already parsed."""
    for key in document:
        if key not in TOP_KEYS and key in BELONGS_IN:
            raise ModelError(f"{key} is not a top-level key", source=source, item=key,
                             fix=f"move {key} into {' or '.join(homes(key, 'top level'))}")
    check_keys(document, frozenset(TOP_KEYS), "top level", source)
    model = model_from_document(document, source)
    basis = design_from_document(document, model, source)
    project = project_from_document(document, source)
    rating, entries = _rating(document, model, source)
    fatigue, details = _fatigue(document, model, source)
    return ModelFile(model, basis, project, document, source, rating, entries, fatigue, details)


def _rating(document: dict[str, Any], model: Model,
            source: str) -> tuple[RatingSettings | None, tuple[Capacity, ...]]:
    """The rating settings and the capacities, each capacity on the structure."""
    settings = rating_settings(document, model.units, source) if "rating" in document else None
    if "capacity" not in document:
        return settings, ()
    entries = capacities(document, settings.method if settings else "LRFR", source)
    path = trace(model)
    ranges = {leg.member: (leg.start_chainage, leg.end_chainage) for leg in path.legs}
    check_on_structure(entries, path.total_length, ranges, source)
    for entry in entries:
        for section in entry.sections:
            check_location(model, path, section, f"{entry.label}.sections", source)
    return settings, entries


def _fatigue(document: dict[str, Any], model: Model,
             source: str) -> tuple[FatigueSettings | None, tuple[FatigueDetail, ...]]:
    """The fatigue settings and details, each detail's location on the structure."""
    if "fatigue" not in document and "fatigue_detail" not in document:
        return None, ()
    settings = fatigue_settings(document, source, model.units)
    details = fatigue_details(document, settings, source)
    path = trace(model)
    for detail in details:
        check_location(model, path, detail.location, f"fatigue_detail {detail.name!r}.location",
                       source)
    return settings, details


def read_model(path: str | Path) -> Model:
    """Read a model file and return its structure (the whole file is checked)."""
    return read_model_file(path).model
