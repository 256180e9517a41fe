"""`influence batch`: a job over an inventory of structures, on a Dask cluster."""

from __future__ import annotations

import sys
from pathlib import Path

import click

from influence.batch.engine import batch_client, planned, run_batch
from influence.batch.inventory import read_inventory
from influence.batch.job import read_job
from influence.batch.parts import PARTS_FOLDER
from influence.batch.results import summary_lines
from influence.batch.tables import FORMATS, check_results_place, write_results
from influence.cli import main


@main.command("batch")
@click.argument("inventory", type=click.Path(dir_okay=False))
@click.option("--job", "job_file", required=True, type=click.Path(dir_okay=False),
              help="The job file: what to run on each structure, with which vehicles.")
@click.option("--out", "out_dir", required=True, type=click.Path(),
              help="Folder for rows, structures and routes tables and the finished parts.")
@click.option("--scheduler", help="Address of a running Dask scheduler (tcp://host:8786); "
                                  "default: a local cluster on this machine.")
@click.option("--workers", type=click.IntRange(min=1),
              help="Worker processes of the local cluster (default: one per core).")
@click.option("--format", "fmt", type=click.Choice(FORMATS), default="parquet",
              show_default=True)
@click.option("--resume", is_flag=True, help="Keep the finished parts of an earlier run.")
@click.option("--quiet", is_flag=True, help="No progress bar and no dashboard address.")
def batch_command(inventory: str, job_file: str, out_dir: str, scheduler: str | None,
                  workers: int | None, fmt: str, resume: bool, quiet: bool) -> None:
    """Run the job of JOB on every structure of INVENTORY (TOML or CSV), one task per structure
    and vehicle group, and write the results to OUT."""
    if scheduler and workers:
        raise click.UsageError("--workers sizes the local cluster; a scheduler has its own")
    check_results_place(out_dir)
    structures = read_inventory(inventory)
    job = read_job(job_file)
    chosen, _ = planned(structures, job)  # a bad route fails before a cluster starts
    with batch_client(scheduler, workers) as client:
        if not quiet:
            click.echo(f"Dask dashboard: {client.dashboard_link}", err=True)
        hidden = quiet or not sys.stderr.isatty()
        with click.progressbar(length=len(chosen), label="structures", file=sys.stderr,
                               hidden=hidden, show_pos=True) as bar:
            results = run_batch(structures, job, client, parts=Path(out_dir) / PARTS_FOLDER,
                                resume=resume, progress=bar.update)
    files = write_results(results, out_dir, fmt)
    click.echo("\n".join([*summary_lines(results),
                          "wrote " + ", ".join(str(f) for f in files)]))
