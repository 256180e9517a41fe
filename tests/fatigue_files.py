"""Shared test helpers: write small girder model files with fatigue details, spectrum files and
one-vehicle files, for runs through the library and the command."""

from __future__ import annotations

from collections.abc import Sequence
from pathlib import Path
from typing import Any


def _value(value: Any) -> str:
    if isinstance(value, str):
        return f'"{value}"'
    if isinstance(value, list | tuple):
        return "[" + ", ".join(_value(v) for v in value) + "]"
    return repr(value)


def girder_file(folder: Path, spans: Sequence[float], details: Sequence[dict[str, Any]],
                fatigue: dict[str, Any], units: str = "kip-ft", name: str = "girder.toml",
                supports: Sequence[str] | None = None) -> Path:
    """A continuous girder (pinned, then rollers) with a [fatigue] table and details."""
    kinds = list(supports) if supports else ["pinned"] + ["roller"] * len(spans)
    lines = ['title = "test girder"', f'units = "{units}"', "[beam]",
             f"spans = {_value([float(s) for s in spans])}", "EI = 1.0e6",
             f"supports = {_value(kinds)}", "[fatigue]"]
    lines += [f"{key} = {_value(value)}" for key, value in fatigue.items()]
    for detail in details:
        lines.append("[[fatigue_detail]]")
        lines += [f"{key} = {_value(value)}" for key, value in detail.items()]
    path = folder / name
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


def spectrum_file(folder: Path, header: Sequence[str], rows: Sequence[Sequence[Any]],
                  name: str = "spectrum.csv") -> Path:
    """A spectrum CSV: the header cells, then the rows (None for an empty cell)."""
    text = [",".join(header)]
    text += [",".join("" if cell is None else str(cell) for cell in row) for row in rows]
    path = folder / name
    path.write_text("\n".join(text) + "\n", encoding="utf-8")
    return path


def vehicle_file(folder: Path, loads: Sequence[float], spacings: Sequence[float],
                 units: str = "kip-ft", name: str = "vehicle.toml") -> Path:
    """A vehicle file of axles alone, no dynamic allowance."""
    path = folder / name
    path.write_text(f'[vehicle]\nname = "test vehicle"\nunits = "{units}"\n'
                    f"loads = {_value([float(p) for p in loads])}\n"
                    f"spacings = {_value([float(s) for s in spacings])}\n", encoding="utf-8")
    return path
