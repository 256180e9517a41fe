"""Batch throughput: structures per second on a local Dask cluster of one worker and of two.

An invented inventory of girders is generated into a temporary folder: one to three continuous
spans of 20 to 120 ft, stiffness growing with the span, girder spacing 6 to 12 ft (the live-load
distribution follows it), each designed for HL-93 or HS20-44. The job envelopes moment and shear
at the supports and tenth points under the three AASHTO legal loads (Type 3, Type 3S2, Type 3-3)
and checks every value against the structure's own design loading: one task per structure.

Each cluster is started first and warmed (every worker imports the library and computes one
structure) so that the time measured is the batch itself; cluster start-up is printed apart, and
so are the cores, the load average before each run and the CPU time the workers got: two
workers can only be twice as fast where two cores are free for them. Nothing is asserted: the
figures depend on the machine and on what else it runs.

Run:
    python benchmarks/batch_benchmark.py [--structures 200] [--seed 7]
"""

from __future__ import annotations

import argparse
import os
import tempfile
import time
from pathlib import Path

import numpy as np

from influence.batch import batch_client, read_inventory, read_job, run_batch
from influence.batch.inventory import Inventory
from influence.batch.job import Job

LEGAL = ("Type 3", "Type 3S2", "Type 3-3")
DESIGN_LOADS = ("HL-93", "HS20-44")
SPAN_RANGE = (20.0, 120.0)  # [ft]
SPACING_RANGE = (6.0, 12.0)  # girder spacing [ft]
EI_PER_SPAN_CUBED = 30.0
"""Girder stiffness [kip ft^2] per ft^3 of span: deeper girders for longer spans (invented)."""


def girder(rng: np.random.Generator, number: int) -> str:
    """The model file of one generated girder."""
    count = int(rng.integers(1, 4))
    spans = np.round(rng.uniform(*SPAN_RANGE, size=count), 1)
    EI = [float(f"{EI_PER_SPAN_CUBED * s**3:.4g}") for s in spans]
    spacing = float(np.round(rng.uniform(*SPACING_RANGE), 1))
    # lanes per girder from the spacing, S / 11 for a two-lane deck (invented rule of thumb)
    distribution = round(spacing / 11.0, 3)
    supports = ", ".join(['"pinned"'] + ['"roller"'] * count)
    design = DESIGN_LOADS[int(rng.integers(0, len(DESIGN_LOADS)))]
    return (f'title = "generated girder {number}, spacing {spacing} ft"\nunits = "kip-ft"\n'
            f"[beam]\nspans = {spans.tolist()}\nEI = {EI}\nsupports = [{supports}]\n"
            f'[[loads]]\nname = "deck"\nload = "DC"\nuniform = {0.1 * spacing:.3f}\n'
            f'[live_load]\ndistribution = {distribution}\nvehicles = ["{design}"]\n')


def generate(folder: Path, count: int, seed: int) -> tuple[Path, Path]:
    """The inventory and the job, written into ``folder``."""
    rng = np.random.default_rng(seed)
    (folder / "models").mkdir()
    rows = ["id,model,route"]
    for number in range(1, count + 1):
        name = f"G-{number:03d}"
        (folder / "models" / f"{name}.toml").write_text(girder(rng, number))
        rows.append(f"{name},models/{name}.toml,R{1 + number % 5}")
    inventory = folder / "inventory.csv"
    inventory.write_text("\n".join(rows) + "\n")
    job = folder / "job.toml"
    names = ", ".join(f'"{v}"' for v in LEGAL)
    job.write_text(f'title = "benchmark"\n[[run]]\nkind = "envelope"\nvehicles = [{names}]\n'
                   'responses = ["moment", "shear"]\ncompare_with = "model"\n')
    return inventory, job


def measure(inventory: Inventory, job: Job, workers: int) -> tuple[float, float, float]:
    """(seconds to start and warm the cluster, seconds for the batch, CPU seconds the workers
    spent on it)."""
    start = time.perf_counter()
    with batch_client(workers=workers) as client:
        warm = Inventory(inventory.structures[:workers])
        run_batch(warm, job, client)  # every worker imports the library and runs one task
        before = client.run(time.process_time)
        ready = time.perf_counter()
        results = run_batch(inventory, job, client)
        done = time.perf_counter()
        after = client.run(time.process_time)
    failed = results.count("error")
    if failed:
        print(f"  ({failed} structures in error)")
    return ready - start, done - ready, sum(after[w] - before[w] for w in after)


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--structures", type=int, default=200)
    parser.add_argument("--seed", type=int, default=7)
    options = parser.parse_args()
    with tempfile.TemporaryDirectory() as temporary:
        inventory_file, job_file = generate(Path(temporary), options.structures, options.seed)
        inventory, job = read_inventory(inventory_file), read_job(job_file)
        print(f"{len(inventory.structures)} generated girders x {', '.join(LEGAL)}, "
              "envelopes of moment and shear at tenth points, checked against each girder's "
              "design loading; one task per structure")
        rates = {}
        for workers in (1, 2):
            load = os.getloadavg()[0]
            startup, seconds, cpu = measure(inventory, job, workers)
            rates[workers] = len(inventory.structures) / seconds
            print(f"{workers} worker{'s' * (workers > 1)}: {seconds:.1f} s, "
                  f"{rates[workers]:.2f} structures/s; the workers had "
                  f"{cpu / seconds:.2f} cores' worth of CPU ({cpu / len(inventory.structures):.2f}"
                  f" CPU s a structure); cluster start and warm-up {startup:.1f} s; "
                  f"{os.cpu_count()} cores, load average {load:.1f} before")
        print(f"scaling ratio, two workers over one: {rates[2] / rates[1]:.2f}")


if __name__ == "__main__":
    main()
