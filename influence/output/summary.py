"""A model's summary for `influence check`: what the tool understood from the file.

Example:
    >>> from influence.model.beamform import continuous_beam
    >>> summary = summarise(continuous_beam([8.0, 8.0], 1.0, ["pinned", "roller", "roller"]))
    >>> summary.static_indeterminacy, summary.path_length
    (1, 16.0)
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from influence.analysis.lines import analyse_model
from influence.model.structure import Member, Model
from influence.output.conventions import header_lines
from influence.output.tables import Table, render_table
from vehicles.units import labels


@dataclass(frozen=True)
class SupportRow:
    node: str
    x: float
    y: float
    chainage: float | None
    kind: str


PRISMATIC = "prismatic"
"""The section text of a member whose section does not vary."""


@dataclass(frozen=True)
class MemberRow:
    name: str
    start: str
    end: str
    length: float
    EI: float
    EA: float
    releases: str
    on_path: bool
    section: str = PRISMATIC


@dataclass(frozen=True)
class ModelSummary:
    title: str
    units: str
    form: str
    path_length: float
    static_indeterminacy: int
    supports: tuple[SupportRow, ...]
    members: tuple[MemberRow, ...]
    hinges: tuple[tuple[str, float | None], ...]
    path: tuple[str, ...]

    def as_dict(self) -> dict[str, Any]:
        names = labels(self.units)
        return {
            "title": self.title,
            "units": {"force": names.force, "length": names.length, "moment": names.moment},
            "form": self.form,
            "path_length": self.path_length,
            "static_indeterminacy": self.static_indeterminacy,
            "path": list(self.path),
            "supports": [vars(s) for s in self.supports],
            "members": [vars(m) for m in self.members],
            "hinges": [{"node": n, "chainage": c} for n, c in self.hinges],
        }


def summarise(model: Model) -> ModelSummary:
    """Validate the model (it is traced and factorised) and describe it."""
    analysis = analyse_model(model)
    path = analysis.path
    on_path = {leg.member for leg in path.legs}
    supports = tuple(
        SupportRow(n.name, n.x, n.y, path.node_chainage(n.name), n.support.description)
        for n in model.nodes if n.support.is_support
    )
    members = []
    for member in model.members:
        releases = {(False, False): "", (True, False): "start", (False, True): "end",
                    (True, True): "both"}[(member.release_start, member.release_end)]
        if member.sliding_end:
            releases = (releases + ", " if releases else "") + "slides at end"
        length = model.length_of(member.name)
        members.append(MemberRow(member.name, member.start, member.end, length, member.EI,
                                 member.EA, releases, member.name in on_path,
                                 section_text(member, length)))
    hinges = tuple((name, path.node_chainage(name)) for name in model.hinge_nodes)
    return ModelSummary(
        title=model.title, units=model.units, form=model.form, path_length=path.total_length,
        static_indeterminacy=analysis.structure.static_indeterminacy, supports=supports,
        members=tuple(members), hinges=hinges, path=tuple(leg.member for leg in path.legs),
    )


def render_summary(summary: ModelSummary) -> str:
    """The summary as text."""
    names = labels(summary.units)
    lines = header_lines(summary.title, summary.units)
    degree = summary.static_indeterminacy
    lines += [
        "",
        f"Form: {summary.form}; path length {summary.path_length:g} {names.length} along "
        f"{len(summary.path)} member(s): {' -> '.join(summary.path)}",
        f"Degree of static indeterminacy: {degree}"
        + (" (statically determinate)" if degree == 0 else ""),
    ]
    if summary.hinges:
        lines.append("Hinges: " + ", ".join(
            f"{n} at {c:g} {names.length}" if c is not None else n for n, c in summary.hinges))
    lines.append("")
    lines.append(render_table(Table(
        ["Supports:"], ("node", f"x [{names.length}]", f"y [{names.length}]",
                        f"chainage [{names.length}]", "restraint"),
        [(s.node, s.x, s.y, "-" if s.chainage is None else s.chainage, s.kind)
         for s in summary.supports])))
    lines.append("")
    lines.append(render_table(Table(
        ["Members:"], ("member", "start", "end", f"length [{names.length}]",
                       f"EI [{names.force}*{names.length}^2]", f"EA [{names.force}]",
                       "released end", "on path", "section"),
        [(m.name, m.start, m.end, m.length, m.EI, m.EA, m.releases or "-",
          "yes" if m.on_path else "no", m.section) for m in summary.members])))
    return "\n".join(lines)


def section_text(member: Member, length: float) -> str:
    """How a member's section varies, in words ("prismatic" when it does not); its EI and EA
    are then those of the prismatic part (or of the start of a taper).

    Example:
        >>> from influence.model.variation import Haunch, SectionVariation
        >>> m = Member("m", "a", "b", 1.0, 1.0, variation=SectionVariation(
        ...     end=Haunch("parabolic", 1.0, length=3.0)))
        >>> section_text(m, 10.0)
        'haunched: end parabolic over 3, depth x 2, I ~ depth^3'
    """
    variation = member.variation
    if variation is None or not member.varies:
        return PRISMATIC
    exponent = f"I ~ depth^{variation.inertia_exponent:g}"
    if variation.taper is not None:
        return f"tapered: depth x {variation.taper:g} start to end, {exponent}"
    parts = [f"{end} {h.shape} over {h.span(length):g}, depth x {1 + h.depth_ratio:g}"
             for end, h in (("start", variation.start), ("end", variation.end)) if h is not None]
    return "haunched: " + "; ".join(parts) + f", {exponent}"
