"""The batch engine on Dask: one task per structure and run, on a local cluster or any scheduler.

Without a client, :func:`run_batch` starts a ``distributed.LocalCluster`` on this machine (worker
processes, one thread each) and closes it at the end; given a client, it submits to that client's
cluster (``batch_client("tcp://host:8786")`` connects to a running scheduler). Each task reads
one structure's model file, factorises it once and runs one vehicle group on it
(:func:`influence.batch.task.run_task`): seconds of work, not milliseconds.

Faults are contained: a structure whose model is bad, or whose task raises, comes back as an
``error`` row and the others go on; a task whose worker is lost is run again by Dask (the
scheduler reschedules it, and ``retries`` more times if it still fails); a task Dask gives up on
becomes an ``error`` row. With a parts folder, each finished task is written whole at once
(:mod:`influence.batch.parts`), and ``resume`` takes finished parts instead of computing them.

Example (two structures, one with no model file; a cluster of one worker):
    >>> import pathlib, tempfile
    >>> from influence.model.beamform import continuous_beam
    >>> folder = pathlib.Path(tempfile.mkdtemp())
    >>> _ = (folder / "b1.toml").write_text('[beam]\\nspans = [12.0]\\nEI = 1.0e6\\n'
    ...                                     'supports = ["pinned", "roller"]\\n')
    >>> _ = (folder / "county.csv").write_text("id,model\\nB-1,b1.toml\\nB-2,b2.toml\\n")
    >>> _ = (folder / "job.toml").write_text('[[run]]\\nkind = "govern"\\n'
    ...     'vehicles = ["Type 3"]\\nat = ["moment@0.5 of span 1"]\\n')
    >>> with batch_client(workers=1) as client:
    ...     results = run_batch(folder / "county.csv", folder / "job.toml", client)
    >>> [(s.structure, s.status) for s in results.structures]
    [('B-1', 'ok'), ('B-2', 'error')]
"""

from __future__ import annotations

import logging
import os
from collections.abc import Callable, Iterator
from contextlib import contextmanager
from pathlib import Path
from typing import Any

from influence.batch.inventory import Inventory, Structure, read_inventory
from influence.batch.job import Job, read_job
from influence.batch.parts import part_name, read_part, write_part
from influence.batch.results import BatchResults, route_verdicts, summaries
from influence.batch.routes import Route, routes_of
from influence.batch.rows import ResultRow, error_row
from influence.batch.task import one_line, run_task
from influence.errors import BatchError

TASK_RETRIES = 2
"""Times Dask runs a failed task again (a worker lost is rescheduled besides)."""
CONNECT_TIMEOUT = 10.0
"""Seconds to wait for a scheduler to answer."""

Progress = Callable[[int], None]


@contextmanager
def batch_client(scheduler: str | None = None, workers: int | None = None, *,
                 timeout: float | None = None) -> Iterator[Any]:
    """A Dask client: connected to ``scheduler`` if given, else to a local cluster of
    ``workers`` processes (default: one per core) started here and closed on leaving.

    Args:
        scheduler: a running scheduler's address, such as tcp://host:8786.
        workers: worker processes of the local cluster.
        timeout: seconds to wait for the scheduler (default :data:`CONNECT_TIMEOUT`).

    Raises:
        BatchError: when the address is malformed or the scheduler cannot be reached.
    """
    from distributed import Client, LocalCluster

    if scheduler:
        _check_address(scheduler)
        try:
            client = Client(scheduler, timeout=timeout or CONNECT_TIMEOUT, set_as_default=False)
        except (OSError, TimeoutError) as error:
            raise BatchError(f"cannot reach the scheduler at {scheduler} ({_first_line(error)})",
                             item="--scheduler",
                             fix="start one with `dask scheduler` and give its tcp://host:port"
                             ) from None
        with client:
            yield client
        return
    count = workers or os.cpu_count() or 1
    with LocalCluster(n_workers=count, threads_per_worker=1, processes=True,
                      dashboard_address=":0", silence_logs=logging.ERROR) as cluster, \
            Client(cluster, set_as_default=False) as client:
        yield client


def _check_address(address: str) -> None:
    """Refuse a malformed address before a client is built on it (a client that fails on one
    hangs when it is collected)."""
    from distributed.comm.addressing import get_address_host_port, normalize_address

    try:
        get_address_host_port(normalize_address(address))
    except ValueError as error:
        raise BatchError(f"{address!r} is not a scheduler address ({_first_line(error)})",
                         item="--scheduler", fix="write it as tcp://host:port") from None


def _first_line(error: BaseException) -> str:
    return (str(error).strip().splitlines() or [type(error).__name__])[0]


def planned(inventory: Inventory, job: Job) -> tuple[tuple[Structure, ...], tuple[Route, ...]]:
    """The structures a job runs on, in order, and the routes it gives verdicts for.

    Raises:
        BatchError: when the job's route names a structure the inventory lacks, or the job
            restricts the run to a route that neither the route file nor the inventory names.
    """
    routes = routes_of(inventory, job.routes)
    if not job.route:
        return inventory.structures, routes
    chosen = next((r for r in routes if r.name == job.route), None)
    if chosen is None:
        raise BatchError(f"no route named {job.route!r}", source=job.source, item="route",
                         fix="routes: " + (", ".join(r.name for r in routes) or "none"))
    return tuple(inventory.structure(i) for i in chosen.structures), (chosen,)


def run_batch(inventory: Inventory | str | Path, job: Job | str | Path, client: Any = None, *,
              parts: str | Path | None = None, resume: bool = False,
              progress: Progress | None = None, retries: int = TASK_RETRIES) -> BatchResults:
    """Run a job on every structure of an inventory.

    Args:
        inventory: the inventory, or its file.
        job: the job, or its file.
        client: a ``distributed.Client``; None starts a local cluster for this run.
        parts: a folder for finished parts (None: nothing is written).
        resume: take finished parts from ``parts`` instead of computing them again.
        progress: called with the number of structures just finished.
        retries: times Dask runs a failed task again.

    Returns:
        The rows, the summaries and the route verdicts; ``computed`` and ``resumed`` count
        the tasks computed now and taken from finished parts.
    """
    inventory = inventory if isinstance(inventory, Inventory) else read_inventory(inventory)
    job = job if isinstance(job, Job) else read_job(job)
    structures, routes = planned(inventory, job)
    if client is None:
        with batch_client() as own:
            return run_batch(inventory, job, own, parts=parts, resume=resume,
                             progress=progress, retries=retries)
    from distributed import as_completed

    folder = Path(parts) if parts is not None else None
    found: dict[tuple[int, int], tuple[ResultRow, ...]] = {}
    waiting = {i: len(job.runs) for i in range(len(structures))}

    def done(i: int, j: int, rows: tuple[ResultRow, ...]) -> None:
        found[i, j] = rows
        waiting[i] -= 1
        if progress and waiting[i] == 0:
            progress(1)

    pending: dict[Any, tuple[int, int, str]] = {}
    resumed = 0
    for i, structure in enumerate(structures):
        for j, run in enumerate(job.runs):
            name = part_name(structure, run)
            if resume and folder is not None and (folder / name).is_file():
                done(i, j, read_part(folder / name))
                resumed += 1
                continue
            future = client.submit(run_task, structure, run, key=f"batch-{name[:-8]}",
                                   pure=False, retries=retries)
            pending[future] = (i, j, name)
    try:
        for future in as_completed(list(pending), loop=client.loop):
            i, j, name = pending.pop(future)
            rows = _outcome(future, structures[i], job.runs[j].name, job.runs[j].kind.name)
            if folder is not None and not any(row.status == "error" for row in rows):
                write_part(folder, name, rows)
            done(i, j, rows)
    finally:
        client.cancel(list(pending))  # interrupted: finished parts stay, the rest is dropped
    rows = tuple(row for key in sorted(found) for row in found[key])
    structure_summaries = summaries(structures, rows)
    return BatchResults(rows, structure_summaries, route_verdicts(routes, structure_summaries),
                        job.title or inventory.title, len(found) - resumed, resumed)


def _outcome(future: Any, structure: Structure, run: str, kind: str) -> tuple[ResultRow, ...]:
    """The rows of a finished task, or an ``error`` row for a task Dask gave up on."""
    if future.status == "finished":
        rows: tuple[ResultRow, ...] = future.result()
        future.release()
        return rows
    reason = "cancelled" if future.status == "cancelled" else one_line(future.exception())
    future.release()
    return (error_row(structure, run, kind, f"the engine gave up on this task: {reason}"),)
