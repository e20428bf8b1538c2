"""Hold the BLAS library to one thread while the field engine sums its nodes.

The engine's node sums are thousands of small matrix products. A threaded
BLAS (OpenBLAS by default with numpy) would wake every core for each one; on a
busy machine its threads spin and wait, and a map that takes 25 ms on one
thread can take ten or a hundred times longer. Inside :func:`one_blas_thread`
the BLAS libraries loaded in the process run on one thread, whatever the
machine and whatever the user's environment; on leaving, their previous
settings come back. :mod:`threadpoolctl` finds and sets the libraries; its
controller is built once, on first use, so that importing the package stays
light.

The limit is process-wide while it is held: another Python thread calling
BLAS at the same moment also runs on one thread.
"""

from __future__ import annotations

from contextlib import contextmanager
from functools import cache

__all__ = ["KERNEL", "one_blas_thread"]

KERNEL = (
    "numpy (no compiled kernel): maps in float32, a node table per band of depths on large "
    "broadband grids, phasors stepped between frequencies from a seed mid-band; widths in "
    "float64; BLAS held to 1 thread (threadpoolctl)"
)
"""The path the engine's maps run (reported by the benchmark): pure numpy, no compiled kernel."""


@cache
def _controller():
    from threadpoolctl import ThreadpoolController

    return ThreadpoolController()


@contextmanager
def one_blas_thread():
    """Run the body with every loaded BLAS library limited to one thread."""
    with _controller().limit(limits=1, user_api="blas"):
        yield
