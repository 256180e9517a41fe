"""Tables of the influence package: the shared renderer of :mod:`vehicles.output.tabular`
(one renderer for both packages), named here for the modules that build influence tables.

Example:
    >>> print(render_table(Table(["Demo"], ("x [m]", "y [-]"), [(0.0, 1.0), (2.5, -0.25)])))
    Demo
    x [m]   y [-]
    -----  ------
    0.000   1.000
    2.500  -0.250
"""

from vehicles.output.tabular import Table, render_csv, render_json, render_table, to_jsonable

__all__ = ["Table", "render_csv", "render_json", "render_table", "to_jsonable"]
