"""Routes: structures in the order a vehicle meets them.

A route comes from a route file, which names the structures of each route in travel order::

    [[routes]]
    name = "Quarry haul"
    structures = ["HC-031", "HC-014", "HC-022"]

or, for a route named only in the inventory's ``route`` fields, from the inventory itself, in
inventory order. A route named in the file is exactly the file's list.

Example:
    >>> from influence.batch.inventory import Inventory, Structure
    >>> inventory = Inventory((Structure("A", "a.toml", ("CR 4",)), Structure("B", "b.toml"),
    ...                        Structure("C", "c.toml", ("CR 4",))))
    >>> [(r.name, r.structures) for r in routes_of(inventory)]
    [('CR 4', ('A', 'C'))]
    >>> [(r.name, r.structures) for r in routes_of(inventory, (Route("CR 4", ("C", "A")),))]
    [('CR 4', ('C', 'A'))]
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from pathlib import Path

from influence.batch.fields import read_document, refused, table_list
from influence.batch.inventory import Inventory
from influence.errors import BatchError, ModelError
from influence.model.fields import check_keys


@dataclass(frozen=True)
class Route:
    """A named route and the ids of its structures in travel order."""

    name: str
    structures: tuple[str, ...]


def read_route_file(path: str | Path) -> tuple[Route, ...]:
    """The routes of a route file, each with at least one structure.

    Raises:
        BatchError: when the file is missing or a route lacks its name or structures.
    """
    source = str(path)
    document = read_document(path, {"routes"})
    routes = []
    for item, table in table_list(document, "routes", source,
                                  "write each route as a [[routes]] table with name and "
                                  "structures"):
        try:
            check_keys(table, {"name", "structures"}, item, source)
        except ModelError as error:
            raise refused(error) from None
        name, ids = table.get("name"), table.get("structures")
        if not isinstance(name, str) or not name.strip():
            raise BatchError("the route has no name", source=source, item=item,
                             fix='give it one: name = "..."')
        if (not isinstance(ids, list) or not ids
                or not all(isinstance(i, str) and i.strip() for i in ids)):
            raise BatchError(f"structures = {ids!r} is not a list of ids", source=source,
                             item=item, fix='list the ids in travel order: ["B-1", "B-7"]')
        if len(set(ids)) != len(ids):
            raise BatchError("a structure is named twice", source=source, item=item,
                             fix="name each structure of the route once")
        routes.append(Route(name.strip(), tuple(i.strip() for i in ids)))
    return tuple(routes)


def routes_of(inventory: Inventory, named: Sequence[Route] = ()) -> tuple[Route, ...]:
    """The routes of a run: those ``named`` (from a route file), then those named only in the
    inventory's ``route`` fields.

    Raises:
        BatchError: when a named route lists a structure the inventory lacks.
    """
    known = {s.identifier for s in inventory.structures}
    for route in named:
        missing = [i for i in route.structures if i not in known]
        if missing:
            raise BatchError(f"route {route.name!r} names {missing[0]!r}, which is not in the "
                             "inventory", source=inventory.source,
                             fix="add the structure to the inventory or correct the route")
    found = list(named)
    taken = {route.name for route in named}
    for structure in inventory.structures:
        for name in structure.routes:
            if name not in taken:
                taken.add(name)
                found.append(Route(name, tuple(s.identifier for s in inventory.structures
                                               if name in s.routes)))
    return tuple(found)
