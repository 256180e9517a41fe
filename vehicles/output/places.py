"""Output places: checking where a file or a folder of files may be written, and writing a whole
folder at once.

A drawing is written under a temporary name beside its target and renamed (see
:mod:`vehicles.atomic`). A folder of files (a calculation package) is written whole into a
temporary folder beside the target and swapped in only when complete: on any failure the target
is exactly as it was. The folder it replaces must be empty or hold an earlier package, that is
only the files its :data:`MANIFEST` lists; a folder holding anything else is refused, so nothing a
user keeps there is ever deleted, and no stale file of an earlier run is left beside new ones.

Every problem is an :class:`~vehicles.errors.OutputError` naming the place and what to do.

Example:
    >>> import pathlib, tempfile
    >>> root = pathlib.Path(tempfile.mkdtemp())
    >>> def fill(folder):
    ...     (folder / "a.txt").write_text("one")
    ...     return "done"
    >>> written_folder(root / "package", fill)
    'done'
    >>> sorted(p.name for p in (root / "package").iterdir())
    ['SHA256SUMS', 'a.txt']
    >>> try:
    ...     check_file_place(root / "missing" / "plot.png", "--plot")
    ... except OutputError as error:
    ...     print(error.problem)
    the folder ... does not exist
"""

from __future__ import annotations

import contextlib
import hashlib
import os
import shutil
import tempfile
from collections.abc import Callable
from pathlib import Path
from typing import TypeVar

from vehicles.errors import OutputError

MANIFEST = "SHA256SUMS"
"""The file that lists every file of a package with its SHA-256 (``sha256sum -c`` reads it)."""

Result = TypeVar("Result")


def _folder_of(path: Path, item: str) -> Path:
    parent = path.parent
    if not parent.exists():
        raise OutputError(f"the folder {str(parent)!r} does not exist", source=str(path),
                          item=item, fix="create the folder first or give another place")
    if not parent.is_dir():
        raise OutputError(f"{str(parent)!r} is a file, not a folder", source=str(path),
                          item=item, fix="give a place inside a folder")
    return parent


def check_file_place(path: str | Path, item: str) -> Path:
    """Refuse a file place whose folder is missing or is a file, or that is itself a folder."""
    if str(path).strip() == "":
        raise OutputError("no file name given", item=item, fix="give a file name")
    path = Path(path)
    _folder_of(path.absolute(), item)
    if path.is_dir():
        raise OutputError("this is a folder", source=str(path), item=item,
                          fix="give a file name")
    return path


def written_file(path: str | Path, write: Callable[[str], object], item: str) -> Path:
    """Check the place, then write the file whole (``write`` gets a temporary name beside it)."""
    from vehicles.atomic import written_whole

    path = check_file_place(path, item)
    try:
        return written_whole(path, write)
    except OSError as error:
        raise OutputError(f"cannot write here: {error.strerror or error}", source=str(path),
                          item=item, fix="give a place in a folder you can write") from None


def _listed(folder: Path) -> set[str]:
    manifest = folder / MANIFEST
    if not manifest.is_file():
        return set()
    names = set()
    for line in manifest.read_text(encoding="utf-8", errors="replace").splitlines():
        digest, _, name = line.partition("  ")
        if len(digest) == 64 and name:
            names.add(name)
    return names | {MANIFEST}


def _strangers(folder: Path) -> list[str]:
    """Files and folders in ``folder`` that no earlier package of ours lists."""
    listed = _listed(folder)
    found = []
    for path in sorted(folder.rglob("*")):
        name = path.relative_to(folder).as_posix()
        if path.is_dir() and not path.is_symlink():
            if not any(other.startswith(name + "/") for other in listed):
                found.append(name + "/")
        elif name not in listed:
            found.append(name)
    return found


def check_folder_place(path: str | Path, item: str) -> Path:
    """Refuse a package folder that cannot be written or replaced whole; return it absolute."""
    if str(path).strip() == "":
        raise OutputError("no folder given", item=item, fix="give a folder name")
    target = Path(os.path.abspath(path))
    if target == Path(os.path.abspath(os.curdir)) or target.parent == target:
        raise OutputError("the package cannot replace the current or the root folder",
                          source=str(path), item=item, fix="give a new or empty folder")
    _folder_of(target, item)
    if target.exists() and not target.is_dir():
        raise OutputError("this is a file, not a folder", source=str(path), item=item,
                          fix="give a new folder, an empty one or one holding an earlier report")
    if target.is_dir():
        strangers = _strangers(target)
        if strangers:
            shown = ", ".join(strangers[:3]) + (", ..." if len(strangers) > 3 else "")
            raise OutputError(
                f"the folder holds files that are not an earlier report ({shown})",
                source=str(path), item=item,
                fix=f"give a new or empty folder (an earlier report, listed in its {MANIFEST}, "
                    "is replaced whole)")
    return target


def manifest_text(folder: Path) -> str:
    """``sha256sum`` lines of every file under ``folder``, sorted by name."""
    lines = []
    for path in sorted(p for p in folder.rglob("*") if p.is_file()):
        name = path.relative_to(folder).as_posix()
        if name != MANIFEST:
            lines.append(f"{hashlib.sha256(path.read_bytes()).hexdigest()}  {name}")
    return "\n".join(lines) + "\n"


def _spare_name(beside: Path, label: str) -> Path:
    handle = tempfile.mkdtemp(prefix=f".{beside.name}.{label}-", dir=beside.parent)
    os.rmdir(handle)
    return Path(handle)


def written_folder(path: str | Path, fill: Callable[[Path], Result],
                   item: str = "--out") -> Result:
    """Write a package folder whole: ``fill`` writes into a new temporary folder beside the
    target, the manifest is added, and the folder is swapped in; on any failure the target is
    left exactly as it was.

    Returns:
        What ``fill`` returned.
    """
    target = check_folder_place(path, item)
    try:
        work = Path(tempfile.mkdtemp(prefix=f".{target.name}.new-", dir=target.parent))
    except OSError as error:
        raise OutputError(f"cannot write in {str(target.parent)!r}: "
                          f"{error.strerror or error}", source=str(path), item=item,
                          fix="give a place in a folder you can write") from None
    try:
        result = fill(work)
        mask = os.umask(0)
        os.umask(mask)
        os.chmod(work, 0o777 & ~mask)  # a new folder's usual permissions, not mkdtemp's
        (work / MANIFEST).write_text(manifest_text(work), encoding="utf-8")
        _swap(work, target)
    except OSError as error:
        raise OutputError(f"cannot write the package: {error.strerror or error}",
                          source=str(path), item=item,
                          fix="give a place in a folder you can write") from None
    finally:
        if work.exists():
            shutil.rmtree(work, ignore_errors=True)
    return result


def _swap(work: Path, target: Path) -> None:
    """Put ``work`` where ``target`` is, keeping the old target until the new one is in."""
    if not target.exists():
        os.rename(work, target)
        return
    old = _spare_name(target, "old")
    os.rename(target, old)
    try:
        os.rename(work, target)
    except OSError:
        os.rename(old, target)
        raise
    with contextlib.suppress(OSError):
        shutil.rmtree(old)
