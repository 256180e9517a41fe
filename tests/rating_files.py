"""Shared test helpers: small model files with [rating] and [[capacity]], and vehicle files."""

from __future__ import annotations

import copy
from pathlib import Path
from typing import Any

from influence.model.reader import ModelFile, model_file_from_document


def simple_span(span: float, *, rating: dict[str, Any] | None = None,
                capacities: list[dict[str, Any]] | None = None,
                loads: list[dict[str, Any]] | None = None,
                extra: tuple[str, ...] = (), spans: list[float] | None = None) -> dict[str, Any]:
    """A girder in kip-ft (one span, or ``spans``) with DC 1.0 klf, DW 0.2 klf, an LRFR steel
    rating at ADTT 1000 (MBE 2nd) with 0.5 lanes per girder, and a sagging capacity of
    1000 kip-ft over the whole length, unless told otherwise."""
    lengths = spans or [span]
    total = sum(lengths)
    document: dict[str, Any] = {
        "title": "test girder",
        "units": "kip-ft",
        "beam": {"spans": lengths, "EI": 1.0e6,
                 "supports": ["pinned"] + ["roller"] * len(lengths)},
        "loads": loads if loads is not None else [
            {"name": "girder", "load": "DC", "uniform": 1.0},
            {"name": "surfacing", "load": "DW", "uniform": 0.2}],
        "rating": rating if rating is not None else {
            "method": "LRFR", "edition": "MBE 2nd", "adtt": 1000, "material": "steel",
            "distribution": 0.5, "limit_states": ["Strength I"]},
        "capacity": capacities if capacities is not None else [
            {"response": "moment", "sense": "positive", "from": 0.0, "to": total,
             "nominal": 1000.0}],
    }
    if extra:
        document["sections"] = {"extra": list(extra)}
    return document


def model_file(document: dict[str, Any]) -> ModelFile:
    """The document read as a model file (a copy, so the test may change its own)."""
    return model_file_from_document(copy.deepcopy(document), "test.toml")


def write_toml(path: Path, document: dict[str, Any]) -> Path:
    """Write a document of tables, lists, strings and numbers as TOML (enough for tests)."""
    lines: list[str] = []

    def value(v: Any) -> str:
        if isinstance(v, bool):
            return "true" if v else "false"
        if isinstance(v, str):
            return '"' + v.replace('"', '\\"') + '"'
        if isinstance(v, list):
            return "[" + ", ".join(value(x) for x in v) + "]"
        if isinstance(v, dict):
            return "{ " + ", ".join(f'"{k}" = {value(x)}' for k, x in v.items()) + " }"
        return repr(v)

    def table(prefix: str, items: dict[str, Any]) -> None:
        for k, v in items.items():
            if not isinstance(v, dict) and not (isinstance(v, list) and v
                                                and all(isinstance(x, dict) for x in v)):
                lines.append(f'"{k}" = {value(v)}')
        for k, v in items.items():
            name = f"{prefix}.{k}" if prefix else k
            if isinstance(v, dict):
                lines.append(f"[{name}]")
                table(name, v)
            elif isinstance(v, list) and v and all(isinstance(x, dict) for x in v):
                for entry in v:
                    lines.append(f"[[{name}]]")
                    table(name, entry)

    table("", document)
    path.write_text("\n".join(lines) + "\n")
    return path


def vehicle_file(folder: Path, name: str, loads: list[float], spacings: list[float],
                 category: str = "legal", **more: Any) -> Path:
    """A vehicle file of axles in kip and ft."""
    return write_toml(folder / f"{name.replace(' ', '-')}.toml", {"vehicle": {
        "name": name, "category": category, "units": "kip-ft", "loads": loads,
        "spacings": spacings, **more}})
