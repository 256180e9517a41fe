"""Writing a :class:`LoadModel` as a model file that
:func:`vehicles.library.files.read_load_model` reads.

The writer emits the ``[model]`` form: each case carries its own ``[case.train]`` table, written as
``loads`` and ``spacings`` (with a leading or trailing uniform load where there is one) or, when
uniform loads sit among the axles, as ``items``. Numbers are written with Python's shortest
round-trip form, so reading the file gives an equal model.

Example:
    >>> from vehicles.loadmodel import LoadCase, LoadModel
    >>> from vehicles.train import Axle, Train
    >>> truck = Train("truck", (Axle(8.0), Axle(32.0, 14.0), Axle(32.0, (14.0, 30.0))))
    >>> model = LoadModel("demo", "demo", "kip-ft", (LoadCase("truck", truck, lane=0.64),))
    >>> print(model_to_toml(model))  # doctest: +ELLIPSIS
    [model]
    name = "demo"
    ...
    [case.train]
    name = "truck"
    loads = [8.0, 32.0, 32.0]
    spacings = [14.0, [14.0, 30.0]]
    <BLANKLINE>
"""

from __future__ import annotations

import math
from pathlib import Path

from vehicles.atomic import written_whole
from vehicles.errors import VehicleError
from vehicles.loadmodel import Adjustment, LoadCase, LoadModel
from vehicles.traffic import TrafficCategory, TrafficType
from vehicles.train import Axle, Patch, Span, Train

_CASE_DEFAULTS = (
    # file key, LoadCase field, default
    ("factor", "factor", 1.0),
    ("dynamic_allowance", "axle_allowance", 0.0),
    ("uniform_dynamic_allowance", "patch_allowance", 0.0),
    ("lane", "lane", 0.0),
    ("lane_dynamic_allowance", "lane_allowance", 0.0),
    ("lane_clear_of_axles", "lane_clear_of_train", None),
    ("knife_edge_for_moment", "knife_edge_moment", 0.0),
    ("knife_edge_for_shear", "knife_edge_shear", 0.0),
)


def _text(value: str) -> str:
    escaped = []
    for char in value:
        if char in '"\\':
            escaped.append("\\" + char)
        elif ord(char) < 0x20 or ord(char) == 0x7F:
            escaped.append(f"\\u{ord(char):04X}")
        else:
            escaped.append(char)
    return '"' + "".join(escaped) + '"'


def _number(value: float) -> str:
    number = float(value)
    if math.isinf(number):
        return "inf" if number > 0 else "-inf"
    return repr(number)


def _span(value: Span | None) -> str:
    if value is None:
        return _text("unlimited")
    if isinstance(value, tuple):
        return f"[{_number(value[0])}, {_number(value[1])}]"
    return _number(value)


def _texts(values: tuple[str, ...]) -> str:
    return "[" + ", ".join(_text(v) for v in values) + "]"


def _given(**values: str | tuple[str, ...]) -> list[str]:
    """``key = value`` lines for the text and lists of text that are not empty."""
    return [f"{key} = {_texts(value) if isinstance(value, tuple) else _text(value)}"
            for key, value in values.items() if value]


def _uniform(key: str, patch: Patch, gap: Span) -> list[str]:
    return ["", f"[{key}]", f"intensity = {_number(patch.intensity)}",
            f"length = {_span(patch.length)}", f"gap = {_span(gap)}"]


def _train_lines(train: Train, table: str) -> list[str]:
    items = list(train.items)
    lead = items[0] if len(items) > 1 and isinstance(items[0], Patch) else None
    items = items[1:] if lead is not None else items
    trail = items[-1] if len(items) > 1 and isinstance(items[-1], Patch) else None
    items = items[:-1] if trail is not None else items
    lines = [f"[{table}]", f"name = {_text(train.name)}"]
    axles = [item for item in items if isinstance(item, Axle)]
    if len(axles) == len(items):
        lines.append("loads = [" + ", ".join(_number(a.load) for a in axles) + "]")
        lines.append("spacings = [" + ", ".join(_span(a.gap) for a in axles[1:]) + "]")
        if lead is not None:
            lines += _uniform(f"{table}.leading_uniform", lead, axles[0].gap)
        if trail is not None:
            lines += _uniform(f"{table}.trailing_uniform", trail, trail.gap)
        return lines
    lines.append("items = [")
    for index, item in enumerate(train.items):
        gap = "" if index == 0 else f", gap = {_span(item.gap)}"
        if isinstance(item, Axle):
            lines.append(f"    {{ axle = {_number(item.load)}{gap} }},")
        else:
            length = _span(item.length)
            lines.append(f"    {{ uniform = {_number(item.intensity)}, length = {length}{gap} }},")
    lines.append("]")
    return lines


def _case_lines(case: LoadCase) -> list[str]:
    lines = ["", "[[case]]", f"name = {_text(case.name)}"]
    for key, field, default in _CASE_DEFAULTS:
        value = getattr(case, field)
        if value != default:
            lines.append(f"{key} = {_number(value)}")
    if case.neglect_relieving_axles:
        lines.append("neglect_relieving_axles = true")
    lines += _given(scope=case.scope.effects, note=case.note)
    if case.train is not None:
        lines += ["", *_train_lines(case.train, "case.train")]
    return lines


def _adjustment_lines(adjustment: Adjustment) -> list[str]:
    lines = ["", "[[adjustment]]", f"name = {_text(adjustment.name)}",
             f"value = {_number(adjustment.value)}"]
    return lines + _given(scales=adjustment.scales, sets=adjustment.sets, note=adjustment.note)


def _traffic_lines(traffic: TrafficType | TrafficCategory) -> list[str]:
    if isinstance(traffic, TrafficType):
        shares = ", ".join(f"{_text(case)} = {_number(share)}" for case, share in traffic.shares)
        lines = ["", "[[traffic_type]]", f"name = {_text(traffic.name)}",
                 f"shares = {{ {shares} }}"]
    else:
        lines = ["", "[[traffic_category]]", f"name = {_text(traffic.name)}",
                 f"heavy_vehicles_per_year = {_number(traffic.heavy_vehicles_per_year)}"]
    return lines + _given(note=traffic.note)


def model_to_toml(model: LoadModel) -> str:
    """The model as the text of a model file (units as the model's own)."""
    lines = ["[model]", f"name = {_text(model.name)}", f"title = {_text(model.title)}",
             f"units = {_text(model.units)}"]
    lines += _given(standard=model.standard, clause=model.clause, category=model.category)
    if model.notes:
        lines.append("notes = [")
        lines += [f"    {_text(note)}," for note in model.notes]
        lines.append("]")
    for adjustment in model.adjustments:
        lines += _adjustment_lines(adjustment)
    for case in model.cases:
        lines += _case_lines(case)
    traffic: tuple[TrafficType | TrafficCategory, ...] = (*model.traffic_types,
                                                          *model.traffic_categories)
    for item in traffic:
        lines += _traffic_lines(item)
    return "\n".join(lines) + "\n"


def write_model(model: LoadModel, path: str | Path) -> Path:
    """Write the model as a model file; the file appears whole or not at all.

    Args:
        model: the load model.
        path: the target file (conventionally ``*.toml``).

    Returns:
        The path written.
    """
    text = model_to_toml(model)
    try:
        return written_whole(path, lambda name: Path(name).write_text(text, encoding="utf-8"))
    except OSError as error:
        raise VehicleError(f"cannot write the file: {error.strerror}", source=str(path),
                           fix="give a path in a writable folder") from None
