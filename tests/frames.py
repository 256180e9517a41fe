"""Structures built in Python for the general-form tests: a Pratt truss with stringers, a portal
frame with inclined legs. Geometry comes from the test that uses them."""

from __future__ import annotations

from influence.model.structure import Member, Model, Node, PathLeg, Support

CHORD_EA = 6.3e6
WEB_EA = 2.5e6
STRINGER = {"EI": 3.0e5, "EA": 2.0e6}


def pratt_truss(panels: int, panel: float, depth: float, units: str = "kip-ft") -> Model:
    """A Pratt truss: bottom nodes L0..Ln, top nodes U1..U(n-1), end posts, verticals, diagonals
    sloping down toward midspan, and simply supported stringers on the bottom panel points."""
    nodes = [Node(f"L{k}", k * panel, 0.0,
                  Support.named("pinned") if k == 0 else
                  Support.named("roller") if k == panels else Support())
             for k in range(panels + 1)]
    nodes += [Node(f"U{k}", k * panel, depth) for k in range(1, panels)]

    def bar(name: str, a: str, b: str, EA: float) -> Member:
        return Member(name, a, b, EA=EA, EI=1.0, release_start=True, release_end=True)

    members = [bar(f"L{k}L{k + 1}", f"L{k}", f"L{k + 1}", CHORD_EA) for k in range(panels)]
    members += [bar(f"U{k}U{k + 1}", f"U{k}", f"U{k + 1}", CHORD_EA) for k in range(1, panels - 1)]
    members += [bar("L0U1", "L0", "U1", CHORD_EA),
                bar(f"U{panels - 1}L{panels}", f"U{panels - 1}", f"L{panels}", CHORD_EA)]
    members += [bar(f"U{k}L{k}", f"U{k}", f"L{k}", WEB_EA) for k in range(1, panels)]
    members += [bar(f"U{k}L{k + 1}", f"U{k}", f"L{k + 1}", WEB_EA) for k in range(1, panels // 2)]
    members += [bar(f"U{k}L{k - 1}", f"U{k}", f"L{k - 1}", WEB_EA)
                for k in range(panels // 2 + 1, panels)]
    stringers = [Member(f"ST{k + 1}", f"L{k}", f"L{k + 1}", release_start=True, release_end=True,
                        sliding_end=True, deck=True, **STRINGER) for k in range(panels)]
    return Model("Pratt truss", units, tuple(nodes), tuple(members + stringers),
                 tuple(PathLeg(s.name) for s in stringers))


def portal_frame(base_support: str = "fixed") -> Model:
    """Inclined legs from bases at (0, 0) and (24, 0) to knees at (3, 4) and (21, 4); the deck
    between the knees has a node at midspan; the path runs along the deck."""
    support = Support.named(base_support)
    nodes = (Node("WB", 0.0, 0.0, support), Node("WK", 3.0, 4.0), Node("M", 12.0, 4.0),
             Node("EK", 21.0, 4.0), Node("EB", 24.0, 0.0, support))
    members = (
        Member("WL", "WB", "WK", EA=5.0e6, EI=8.0e5),
        Member("D1", "WK", "M", EA=6.0e6, EI=1.2e6, deck=True),
        Member("D2", "M", "EK", EA=6.0e6, EI=1.2e6, deck=True),
        Member("EL", "EB", "EK", EA=5.0e6, EI=8.0e5),
    )
    return Model("portal", "kN-m", nodes, members, (PathLeg("D1"), PathLeg("D2")))
