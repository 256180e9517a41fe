"""Batch runs over an inventory of structures, on Dask: a local cluster by default, or any
running scheduler.

An inventory (TOML or CSV) lists the structures and their model files; a job (TOML) says what to
run on each (``envelope``, ``govern`` at named sections, and ``rate``, ``permit``, ``fatigue``
where the installation has them) with which vehicles. One task runs one structure under one
vehicle group; the results are one table of rows, a summary per structure and a verdict per
route, written as Parquet or CSV.

Nothing below this package knows it exists: each job kind is a plain function over the library
(:mod:`influence.batch.kinds`).
"""

from influence.batch.engine import batch_client, run_batch
from influence.batch.inventory import Inventory, Structure, read_inventory
from influence.batch.job import Job, Run, read_job
from influence.batch.results import BatchResults, RouteVerdict, StructureSummary
from influence.batch.rows import ResultRow
from influence.batch.tables import write_results

__all__ = ["BatchResults", "Inventory", "Job", "ResultRow", "RouteVerdict", "Run", "Structure",
           "StructureSummary", "batch_client", "read_inventory", "read_job", "run_batch",
           "write_results"]
