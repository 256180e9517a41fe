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
            "print('matplotlib' in sys.modules)")
    result = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True,
                            cwd=ROOT, check=True)
    assert result.stdout.strip() == "False"


def test_vehicles_never_imports_influence() -> None:
    offenders = [str(path.relative_to(ROOT)) for path in (ROOT / "vehicles").rglob("*.py")
                 if "import influence" in path.read_text() or "from influence" in path.read_text()]
    assert offenders == []
