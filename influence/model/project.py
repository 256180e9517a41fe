"""The optional ``[project]`` table of a model file: what the title block of a calculation
package carries.

Example:
    >>> info = project_from_document({"project": {"job_number": "MR-114", "revision": "B"}})
    >>> info.job_number, info.revision, info.checked_by
    ('MR-114', 'B', '')
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from influence.errors import ModelError
from influence.model.fields import check_keys
from influence.model.keys import PROJECT_KEYS


@dataclass(frozen=True)
class ProjectInfo:
    """Title-block fields of the calculation package ("" where the file says nothing)."""

    job_number: str = ""
    designed_by: str = ""
    checked_by: str = ""
    revision: str = ""
    client: str = ""
    location: str = ""


def project_from_document(document: dict[str, Any], source: str = "") -> ProjectInfo:
    """The ``[project]`` table, every value a string."""
    table = document.get("project", {})
    if not isinstance(table, dict):
        raise ModelError("project must be a table", source=source, item="project",
                         fix="write it as [project] with job_number, designed_by, ...")
    check_keys(table, PROJECT_KEYS, "project", source)
    values = {}
    for key, value in table.items():
        if not isinstance(value, str):
            raise ModelError(f"{key} = {value!r} is not text", source=source,
                             item=f"project.{key}", fix=f'write it in quotes: {key} = "..."')
        values[key] = value
    return ProjectInfo(**values)
