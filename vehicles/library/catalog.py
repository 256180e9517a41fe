"""The library of published design load models, kept as model files in ``vehicles/data``.

Names are matched without regard to case, spaces or punctuation ("hl93" finds "HL-93"). A model
is returned in its own units unless others are asked for; conversion is exact.

Example:
    >>> "HL-93" in library_names()
    True
    >>> model = get_model("hl-93", units="kN-m")
    >>> model.units, round(model.cases[0].lane, 3)
    ('kN-m', 9.34)
    >>> try:
    ...     get_model("LM 17")
    ... except VehicleError as error:
    ...     print(error.fix)
    did you mean: LM1, LM71, LM2?
"""

from __future__ import annotations

import difflib
import functools
from collections.abc import Mapping
from importlib import resources
from pathlib import Path

from vehicles.conversion import model_in
from vehicles.errors import VehicleError
from vehicles.library.adjust import adjusted
from vehicles.library.files import parse_load_model, read_load_model
from vehicles.loadmodel import LoadModel


def _key(name: str) -> str:
    return "".join(char for char in name.casefold() if char.isalnum() or char == "/")


@functools.cache
def _library() -> dict[str, LoadModel]:
    models: dict[str, LoadModel] = {}
    folder = resources.files("vehicles") / "data"
    for entry in sorted(folder.iterdir(), key=lambda e: e.name):
        if entry.name.endswith(".toml"):
            model = parse_load_model(entry.read_text(encoding="utf-8"),
                                     f"vehicles/data/{entry.name}")
            models[model.name] = model
    return models


def library_names() -> tuple[str, ...]:
    """The names of the library's load models, in file order."""
    return tuple(_library())


def library_models(units: str | None = None) -> tuple[LoadModel, ...]:
    """Every library model, in its own units or converted to ``units`` ("kN-m" or "kip-ft")."""
    return tuple(get_model(name, units) for name in library_names())


def get_model(name: str, units: str | None = None) -> LoadModel:
    """The library model called ``name`` (case, spaces and hyphens ignored).

    Args:
        name: a library name, such as "HL-93" or "lm71".
        units: "kN-m" or "kip-ft" to convert; None keeps the model's own units.

    Raises:
        VehicleError: for an unknown name, listing close matches.
    """
    by_key = {_key(known): model for known, model in _library().items()}
    model = by_key.get(_key(name))
    if model is None:
        names = {_key(known): known for known in library_names()}
        close = [names[key] for key in difflib.get_close_matches(_key(name), names, n=3,
                                                                  cutoff=0.4)]
        hint = "did you mean: " + ", ".join(close) + "?" if close else (
            "known: " + ", ".join(names.values()))
        raise VehicleError(f"no load model named '{name}'", source="library", fix=hint)
    return model if units is None else model_in(model, units)


def load_model(name_or_path: str | Path, units: str | None = None,
               adjust: Mapping[str, float] | None = None) -> LoadModel:
    """A load model from a library name or from a vehicle or model file, ready for use.

    A ``Path``, an existing path (a folder is refused as one) or a name ending in ``.toml`` is
    read as a file; anything else is looked up in the library.

    Args:
        name_or_path: library name or file path.
        units: "kN-m" or "kip-ft" to convert; None keeps the model's own units.
        adjust: new values of the model's adjustments by name, such as {"alpha": 1.21} [-].

    Example:
        >>> model = load_model("LM71", units="kip-ft", adjust={"alpha": 1.1})
        >>> round(model.cases[0].train.items[0].load, 3)  # 1.1 x 250 kN in kip
        61.822
    """
    text = str(name_or_path)
    if isinstance(name_or_path, Path) or text.lower().endswith(".toml") or Path(text).exists():
        model = read_load_model(text)
    else:
        model = get_model(text)
    if adjust:
        model = adjusted(model, adjust)
    return model if units is None else model_in(model, units)
