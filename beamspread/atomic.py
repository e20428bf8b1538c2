"""Writing a file whole or not at all: through a temporary file in the same folder."""

from __future__ import annotations

import os
import tempfile
from collections.abc import Callable
from pathlib import Path

__all__ = ["write_atomically"]


def write_atomically(path: str | os.PathLike, write: Callable[[str], object]) -> Path:
    """Call ``write(name)`` on a temporary file beside ``path``, then put it in ``path``'s place.

    The file replaces ``path`` only once ``write`` has returned, with the
    permissions of an ordinary new file; on any failure it is removed, so
    nothing half-written is ever left. Returns ``path`` as a Path.
    """
    target = Path(path)
    fd, temporary = tempfile.mkstemp(dir=target.parent, prefix=f".{target.name}.", suffix=".part")
    os.close(fd)
    try:
        write(temporary)
        mask = os.umask(0)
        os.umask(mask)
        os.chmod(temporary, 0o666 & ~mask)  # as an ordinary new file, not mkstemp's 0600
        os.replace(temporary, target)
    except BaseException:
        Path(temporary).unlink(missing_ok=True)
        raise
    return target
