"""Which table of a model file takes which key: one list, so that a key written in the wrong table
is answered with the table it belongs in.

Example:
    >>> homes("deflection_limit")
    ('[live_load]',)
    >>> homes("panels")
    ('[truss]',)
"""

from __future__ import annotations

from influence.fatigue.settings import DETAIL_KEYS, SETTING_KEYS
from influence.rating.reading import TABLE_KEYS as RATING_TABLES

STRUCTURE_KEYS = ("title", "units", "beam", "truss", "nodes", "members", "path")
BASIS_KEYS = ("loads", "combinations", "live_load", "sections")
ASSESSMENT_KEYS = ("project", "rating", "capacity", "fatigue", "fatigue_detail")
TOP_KEYS = (*STRUCTURE_KEYS, *BASIS_KEYS, *ASSESSMENT_KEYS)

HAUNCH_KEYS = frozenset({"shape", "length", "length_fraction", "depth_ratio", "inertia_ratio"})
BEAM_HAUNCH_KEYS = HAUNCH_KEYS | {"span", "at"}
MEMBER_VARIATION_KEYS = frozenset({"haunch_start", "haunch_end", "taper", "inertia_exponent",
                                   "area_exponent"})
BEAM_KEYS = frozenset({"spans", "EI", "EA", "supports", "names", "hinges", "haunches",
                       "inertia_exponent"})
TRUSS_KEYS = frozenset({"panels", "panel_length", "depth", "type", "deck", "E", "A", "EA",
                        "chord_A", "diagonal_A", "vertical_A", "chord_EA", "diagonal_EA",
                        "vertical_EA", "stringer_EI", "stringer_EA", "supports"})
NODE_KEYS = frozenset({"name", "x", "y", "support"})
MEMBER_KEYS = frozenset({"name", "start", "end", "EI", "EA", "E", "I", "A", "release_start",
                         "release_end", "sliding_end", "bar", "deck"}) | MEMBER_VARIATION_KEYS
PATH_KEYS = frozenset({"members", "start", "end"})
LOAD_KEYS = frozenset({"name", "load", "uniform", "members", "from", "to", "point", "at"})
COMBINATION_KEYS = frozenset({"name", "factors"})
LIVE_KEYS = frozenset({"distribution", "multiple_presence", "vehicles", "deflection_limit",
                       "adjust", "deflection_vehicles"})
SECTION_KEYS = frozenset({"per_span", "step", "extra"})
PROJECT_KEYS = frozenset({"job_number", "designed_by", "checked_by", "revision", "client",
                          "location"})

TABLES: dict[str, frozenset[str]] = {
    "[beam]": BEAM_KEYS,
    "[[beam.haunches]]": BEAM_HAUNCH_KEYS,
    "[truss]": TRUSS_KEYS,
    "[[nodes]]": NODE_KEYS,
    "[[members]]": MEMBER_KEYS,
    "[path]": PATH_KEYS,
    "[[loads]]": LOAD_KEYS,
    "[[combinations]]": COMBINATION_KEYS,
    "[live_load]": LIVE_KEYS,
    "[sections]": SECTION_KEYS,
    "[project]": PROJECT_KEYS,
    **RATING_TABLES,
    "[fatigue]": frozenset(SETTING_KEYS),
    "[[fatigue_detail]]": frozenset(DETAIL_KEYS),
    "top level": frozenset(TOP_KEYS),
}
"""Every table of a model file and the keys it takes."""


def homes(key: str, besides: str = "") -> tuple[str, ...]:
    """The tables that take ``key``, other than ``besides``."""
    return tuple(name for name, keys in TABLES.items() if key in keys and name != besides)
