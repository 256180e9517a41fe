"""The README's Python examples run as written (a README that lies is a defect)."""

from __future__ import annotations

import os
import re
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parent.parent
BLOCKS = re.findall(r"```python\n(.*?)```", (ROOT / "README.md").read_text(), flags=re.S)


@pytest.mark.parametrize("code", BLOCKS, ids=[f"block {i + 1}" for i in range(len(BLOCKS))])
def test_readme_python_blocks_run(code: str, capsys: pytest.CaptureFixture[str]) -> None:
    assert BLOCKS, "the README has Python examples"
    here = os.getcwd()
    os.chdir(ROOT)
    try:
        exec(compile(code, "README.md", "exec"), {})
    finally:
        os.chdir(here)
    assert capsys.readouterr().out.strip()
