"""The one reader of model files: the structure, its design basis and the project, from one
TOML file, with every key checked.

A model file holds the structure (the compact ``[beam]`` form, or ``[[nodes]]``, ``[[members]]``
and ``[path]``; see :mod:`influence.model.structure_form`), and optionally the design basis
(``[[loads]]``, ``[[combinations]]``, ``[live_load]``, ``[sections]``; see
:mod:`influence.model.basis`), the title block (``[project]``), and the assessment tables
(``[rating]``, ``[[capacity]]``, ``[fatigue]``, ``[[fatigue_detail]]``) that the rating and
fatigue layers read. A key at the top level that belongs in one of these tables is refused with
the table it belongs in.

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
from influence.model.basis import DesignBasis, design_from_document
from influence.model.fields import check_keys, read_toml
from influence.model.project import ProjectInfo, project_from_document
from influence.model.structure import Model
from influence.model.structure_form import model_from_document

STRUCTURE_KEYS = ("title", "units", "beam", "nodes", "members", "path")
BASIS_KEYS = ("loads", "combinations", "live_load", "sections")
ASSESSMENT_KEYS = ("project", "rating", "capacity", "fatigue", "fatigue_detail")
TOP_KEYS = (*STRUCTURE_KEYS, *BASIS_KEYS, *ASSESSMENT_KEYS)

BELONGS_IN = {
    **{key: "[beam]" for key in ("spans", "EI", "EA", "supports", "names", "hinges")},
    **{key: "[live_load]" for key in ("distribution", "multiple_presence", "vehicles",
                                      "deflection_limit", "deflection_vehicles", "adjust")},
    **{key: "[sections]" for key in ("per_span", "step", "extra")},
    **{key: "[project]" for key in ("job_number", "designed_by", "checked_by", "revision",
                                    "client")},
    **{key: "[rating]" for key in ("method", "edition", "adtt", "condition_factor",
                                   "system_factor", "impact")},
    "factors": "[[combinations]]",
    "uniform": "[[loads]]",
    "point": "[[loads]]",
}
"""Where a key belongs when it is written at the top level by mistake."""


@dataclass(frozen=True)
class ModelFile:
    """Everything a model file says.

    Attributes:
        model: the structure and its travel path.
        basis: dead loads, combinations, live-load and section settings.
        project: the title-block fields.
        document: the parsed TOML, for the rating and fatigue readers.
        source: the file name.
    """

    model: Model
    basis: DesignBasis
    project: ProjectInfo
    document: dict[str, Any]
    source: str


def read_model_file(path: str | Path) -> ModelFile:
    """Read and check a whole model file: structure, design basis and project."""
    source = str(path)
    document = read_toml(path)
    return model_file_from_document(document, source)


def model_file_from_document(document: dict[str, Any], source: str = "") -> ModelFile:
    """:func:`read_model_file` for a document already parsed."""
    for key in document:
        if key not in TOP_KEYS and key in BELONGS_IN:
            raise ModelError(f"{key} is not a top-level key", source=source, item=key,
                             fix=f"move {key} into {BELONGS_IN[key]}")
    check_keys(document, set(TOP_KEYS), "top level", source)
    model = model_from_document(document, source)
    basis = design_from_document(document, model, source)
    return ModelFile(model, basis, project_from_document(document, source), document, source)


def read_model(path: str | Path) -> Model:
    """Read a model file and return its structure (the whole file is checked)."""
    return read_model_file(path).model
