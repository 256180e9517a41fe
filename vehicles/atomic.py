"""Writing an output file under a temporary name in its folder, then renaming it into place.

A reader never sees half a file, and a failed write leaves the old file (if any) untouched.

Example:
    >>> import pathlib, tempfile
    >>> folder = pathlib.Path(tempfile.mkdtemp())
    >>> def write(name): pathlib.Path(name).write_text("hi")
    >>> target = written_whole(folder / "note.txt", write)
    >>> target.read_text(), sorted(p.name for p in folder.iterdir())
    ('hi', ['note.txt'])
"""

from __future__ import annotations

import contextlib
import os
import tempfile
from collections.abc import Callable
from pathlib import Path


def written_whole(path: str | Path, write: Callable[[str], object]) -> Path:
    """Call ``write`` with a temporary file name beside ``path``, then rename it to ``path``.

    The temporary name keeps the suffix of ``path`` (plotting picks the format from it) and the
    file gets the permissions a new file would get.

    Raises:
        OSError: when the folder is not writable; the temporary file is removed.
    """
    path = Path(path)
    handle, temporary = tempfile.mkstemp(prefix=f".{path.stem}.", suffix=path.suffix,
                                         dir=path.parent)
    os.close(handle)
    try:
        write(temporary)
        mask = os.umask(0)
        os.umask(mask)
        os.chmod(temporary, 0o666 & ~mask)
        os.replace(temporary, path)
    except BaseException:
        with contextlib.suppress(OSError):
            os.remove(temporary)
        raise
    return path
