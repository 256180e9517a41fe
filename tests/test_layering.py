"""The project's layering rules (DESIGN.md): computation never imports matplotlib, and the vehicles
package never imports the influence package."""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent


def test_computation_does_not_import_matplotlib() -> None:
    code = ("import sys\n"
            "import influence.design.envelope, influence.design.governing, influence.cli\n"
            "import vehicles.search.govern\n"
            "import vehicles.library.catalog, vehicles.search.sweep\n"
            "import vehicles.search.concurrent, piecewise\n"
            "print([m for m in ('matplotlib', 'reportlab', 'pypdf', 'pypdfium2', "
            "'scipy.optimize', 'scipy.interpolate') if m in sys.modules])")
    result = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True,
                            cwd=ROOT, check=True)
    assert result.stdout.strip() == "[]"  # drawing, typesetting and slow imports stay lazy


def test_vehicles_never_imports_influence() -> None:
    offenders = [str(path.relative_to(ROOT)) for path in (ROOT / "vehicles").rglob("*.py")
                 if "import influence" in path.read_text() or "from influence" in path.read_text()]
    assert offenders == []


def _imports(path: Path) -> set[str]:
    """The project modules a file imports at its top (not inside functions)."""
    import ast

    names = set()
    for node in ast.parse(path.read_text()).body:
        if isinstance(node, ast.ImportFrom) and node.module:
            names.add(node.module)
        elif isinstance(node, ast.Import):
            names.update(alias.name for alias in node.names)
    return {n for n in names if n.split(".")[0] in PACKAGES}


PACKAGES = ("influence", "vehicles", "piecewise")


def test_no_import_circles() -> None:
    """Module dependencies form no cycle (DESIGN.md: dependencies run one way)."""
    import networkx as nx

    graph = nx.DiGraph()
    for package in PACKAGES:
        for path in (ROOT / package).rglob("*.py"):
            module = ".".join(path.relative_to(ROOT).with_suffix("").parts)
            module = module.removesuffix(".__init__")
            for target in _imports(path):
                if target != module and not module.startswith(target + "."):
                    graph.add_edge(module, target)
    cycles = list(nx.simple_cycles(graph))
    assert cycles == []


def test_piecewise_imports_neither_package() -> None:
    offenders = [str(path.relative_to(ROOT)) for path in (ROOT / "piecewise").rglob("*.py")
                 if any(word in path.read_text() for word in
                        ("import influence", "from influence", "import vehicles",
                         "from vehicles"))]
    assert offenders == []
