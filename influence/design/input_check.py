"""Checking a whole model file, as ``influence check`` does: everything the file says is read,
typed and placed on the structure, the structure is solved once (a mechanism is found here), the
envelope sections are laid out and every load model named is found; the result says what was
checked.

Example:
    >>> import pathlib, tempfile
    >>> path = pathlib.Path(tempfile.mkdtemp()) / "g.toml"
    >>> _ = path.write_text('units = "kip-ft"\\n[beam]\\nspans = ["40 ft", "12.5 m"]\\n'
    ...     'EI = 2.0e6\\nsupports = ["pinned", "roller", "roller"]\\n[[loads]]\\n'
    ...     'name = "deck"\\nload = "DC"\\nuniform = "1.2 kip/ft"\\n[live_load]\\n'
    ...     'vehicles = ["HL-93"]\\n')
    >>> report = check_model_file(path)
    >>> report.checked[1], report.checked[3][:20]
    ('dead loads: 1 (DC)', 'live load: HL-93 fou')
"""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path

from influence.analysis.lines import Analysis, analyse_model
from influence.design.loading import vehicles_for
from influence.design.sections import envelope_sections
from influence.model.reader import ModelFile, read_model_file
from vehicles.units import labels


@dataclass(frozen=True)
class InputCheck:
    """A model file read and checked whole.

    Attributes:
        read: everything the file says.
        analysis: the structure solved once.
        checked: one line per part of the file: what was checked and found.
    """

    read: ModelFile
    analysis: Analysis
    checked: tuple[str, ...]


def check_model_file(path: str | Path) -> InputCheck:
    """Read, solve and check a whole model file.

    Raises:
        InfluenceError, VehicleError: the first problem, in one line naming file, item and fix.
    """
    read = read_model_file(path)
    model, basis = read.model, read.basis
    analysis = analyse_model(model)
    lines = [_structure_line(read, analysis)]
    load_names = basis.load_names
    lines.append(f"dead loads: {len(basis.loads)}" + (
        f" ({', '.join(load_names)})" if load_names else ""))
    lines.append(f"combinations: {len(basis.combinations)}" + (
        " (" + ", ".join(c.name for c in basis.combinations) + ")" if basis.combinations else ""))
    live = basis.live
    found, _ = vehicles_for(live.vehicles, model.units, live.adjust) if live.vehicles else ([], [])
    deflection, _ = (vehicles_for(live.deflection_vehicles, model.units, live.adjust)
                     if live.deflection_vehicles else ([], []))
    lines.append(
        "live load: " + (", ".join(m.name for m in found) + " found" if found else
                         "no load models named in [live_load]")
        + f"; distribution {live.distribution:g}, multiple presence {live.multiple_presence:g}"
        + (f"; deflection limit span/{live.deflection_limit:g}" if live.deflection_limit else "")
        + (" with " + ", ".join(m.name for m in deflection) if deflection else ""))
    sections = envelope_sections(model, analysis.path, per_span=basis.sections.per_span,
                                 step=basis.sections.step, extra=basis.sections.extra)
    spacing = (f"step {basis.sections.step:g}" if basis.sections.step else
               f"{basis.sections.per_span} per span")
    lines.append(f"sections: {len(sections)} ({spacing}, {len(basis.sections.extra)} extra)")
    if read.rating is not None or read.capacities:
        method = read.rating.method if read.rating else "no [rating] table"
        lines.append(f"rating: {method}; {len(read.capacities)} capacities on the structure")
    if read.fatigue is not None:
        lines.append(f"fatigue: {read.fatigue.standard}; {len(read.fatigue_details)} details "
                     "located on the structure")
    filled = [value for value in vars(read.project).values() if value]
    if filled:
        lines.append(f"project: {len(filled)} title-block fields")
    return InputCheck(read, analysis, tuple(lines))


def _structure_line(read: ModelFile, analysis: Analysis) -> str:
    model = read.model
    supports = sum(1 for node in model.nodes if node.support.is_support)
    length = labels(model.units).length
    return (f"structure: {model.form} form, {len(model.nodes)} nodes, {len(model.members)} "
            f"members, {supports} supports, path {analysis.path.total_length:g} {length} along "
            f"{len(model.path)} members, solved (no mechanism)")
