"""Trusses: structures whose bars (members pinned at both ends) stand off the travel path, so the
traffic reaches them only through the deck. Their envelopes are of axial force, taken once per
bar (axial force is constant along a bar without loads of its own), with the reactions and the
deflection along the path.

Example:
    >>> from influence.model.structure import Member, Model, Node, PathLeg, Support
    >>> nodes = (Node("A", 0, 0, Support.named("pinned")), Node("B", 8, 0, Support.named("roller")),
    ...          Node("C", 4, 3))
    >>> members = (Member("AB", "A", "B", 1.0, 1.0), Member("AC", "A", "C", 1.0, 1.0, True, True),
    ...            Member("CB", "C", "B", 1.0, 1.0, True, True))
    >>> model = Model("truss", "kN-m", nodes, members, (PathLeg("AB"),))
    >>> truss_bars(model), default_responses(model)
    (('AC', 'CB'), ('axial', 'reaction', 'deflection'))
    >>> [s.location for s in bar_sections(model)]
    ['AC@2.5', 'CB@2.5']
"""

from __future__ import annotations

from collections.abc import Sequence

from influence.analysis.lines import Analysis
from influence.design.envelope import (
    ENVELOPE_RESPONSES,
    Envelope,
    Progress,
    envelope,
    section_responses,
)
from influence.design.sections import Section
from influence.model.basis import DesignBasis
from influence.model.structure import Model
from vehicles.loadmodel import LoadModel

TRUSS_RESPONSES = ("axial", "reaction", "deflection")
"""Responses enveloped by default for a truss."""


def truss_bars(model: Model) -> tuple[str, ...]:
    """Bars off the travel path, in model order (empty: the structure is not a truss)."""
    on_path = {leg.member for leg in model.path}
    return tuple(m.name for m in model.members if m.is_bar and m.name not in on_path)


def default_responses(model: Model) -> tuple[str, ...]:
    """What an envelope of this structure takes when the user names nothing: axial force,
    reactions and deflection for a truss, else moment, shear, reaction and deflection."""
    return TRUSS_RESPONSES if truss_bars(model) else ENVELOPE_RESPONSES


def bar_sections(model: Model) -> list[Section]:
    """One section at the middle of every truss bar, labelled with the bar's name."""
    found = []
    for name in truss_bars(model):
        middle = model.length_of(name) / 2.0
        found.append(Section(name, f"{name}@{middle:.10g}", "right", None, 0))
    return found


def _on_a_bar(section: Section, bars: set[str]) -> bool:
    return section.chainage is None and section.location.partition("@")[0] in bars


def split_sections(model: Model, sections: Sequence[Section],
                   kinds: Sequence[str]) -> list[tuple[list[Section], list[str]]]:
    """The (sections, responses) runs of an envelope: for a truss, axial force at the bars
    apart from the other responses along the path (sections given on bars are left to the bar
    run, so no bar appears twice); otherwise one run."""
    bars = set(truss_bars(model))
    if not bars or "axial" not in kinds:
        return [(list(sections), list(kinds))]
    runs = [(bar_sections(model), ["axial"])]
    others = [k for k in kinds if k != "axial"]
    if others:
        runs.append(([s for s in sections if not _on_a_bar(s, bars)], others))
    return runs


def count_entries(model: Model, sections: Sequence[Section], kinds: Sequence[str]) -> int:
    """How many (section, response) pairs the envelope will compute (for progress bars)."""
    return sum(len(section_responses(s, k, model)) for s, k in split_sections(model, sections,
                                                                              kinds))


def structure_envelope(analysis: Analysis, models: Sequence[LoadModel], basis: DesignBasis, *,
                       kinds: Sequence[str], sections: Sequence[Section],
                       progress: Progress | None = None, notes: Sequence[str] = (),
                       deflection_models: Sequence[LoadModel] = ()) -> Envelope:
    """:func:`influence.design.envelope.envelope` with a truss's axial force taken at its bars.

    The runs share the load models and the design basis; the entries come in the order of
    ``kinds``, the deflection check from the run along the path.
    """
    runs = split_sections(analysis.model, sections, kinds)
    results = [envelope(analysis, models, basis, kinds=run_kinds, sections=run_sections,
                        progress=progress, notes=notes, deflection_models=deflection_models)
               for run_sections, run_kinds in runs]
    entries = [e for kind in kinds for r in results for e in r.entries if e.kind == kind]
    checks = tuple(c for r in results for c in r.deflection_checks)
    return Envelope(tuple(entries), tuple(models), basis, analysis.model.units, checks,
                    tuple(notes))
