"""How long a whole fatigue run takes: a spectrum of real-sized trucks over many details.

Run by hand (not part of the test suite):

    python benchmarks/fatigue_run_benchmark.py [--trucks 100000] [--details 50] [--workers 2]

The structure is an invented two-span continuous steel girder (2 x 120 ft); the details stand at
distinct sections along it (bottom-flange moment details, and every fifth a web shear detail), so
no two details share an influence line. The spectrum is invented: trucks drawn at random in the
axle layouts of common US truck classes (two-axle single units to seven-axle combinations, axle
loads and spacings uniform within plausible ranges), written to a CSV file with a count column
and read back by the library, as a weigh-in-motion file would be.

Printed: the time to read the spectrum, the whole run (histories, counting and damage of every
detail) wall-clock and CPU, the parts of one line (exact histories, counting), and the same
histories found one crossing at a time through the general effect function, scaled from a sample.
Asserts nothing. Times depend on the machine's load (other processes share its cores).
"""

from __future__ import annotations

import argparse
import sys
import tempfile
import time
from pathlib import Path

import numpy as np

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from influence.analysis.lines import analyse_model  # noqa: E402
from influence.analysis.responses import Response  # noqa: E402
from influence.fatigue import count_many  # noqa: E402
from influence.fatigue.crossings import crossing, crossing_histories  # noqa: E402
from influence.fatigue.run import fatigue  # noqa: E402
from influence.fatigue.spectrum import read_spectrum  # noqa: E402
from influence.model.reader import read_model_file  # noqa: E402

SPAN = 120.0  # [ft]
ONE_BY_ONE_SAMPLE = 300

# (share, axle loads as (low, high) [kip] front first, spacings as (low, high) [ft])
CLASSES = (
    (0.15, ((4.0, 12.0), (6.0, 22.0)), ((12.0, 22.0),)),
    (0.08, ((8.0, 14.0), (8.0, 20.0), (8.0, 20.0)), ((14.0, 20.0), (4.0, 4.6))),
    (0.05, ((8.0, 12.0), (8.0, 18.0), (8.0, 18.0), (8.0, 18.0)),
     ((11.0, 18.0), (4.0, 4.6), (25.0, 38.0))),
    (0.55, ((9.0, 12.0), (6.0, 17.0), (6.0, 17.0), (5.0, 17.0), (5.0, 17.0)),
     ((11.0, 20.0), (4.0, 4.6), (25.0, 40.0), (4.0, 4.6))),
    (0.07, ((9.0, 12.0), (6.0, 16.0), (6.0, 16.0), (5.0, 14.0), (5.0, 14.0), (5.0, 14.0)),
     ((11.0, 20.0), (4.0, 4.6), (25.0, 38.0), (4.0, 4.6), (4.0, 4.6))),
    (0.10, ((9.0, 12.0), (6.0, 15.0), (6.0, 15.0), (5.0, 14.0), (5.0, 14.0), (5.0, 14.0),
            (5.0, 14.0)),
     ((11.0, 20.0), (4.0, 4.6), (20.0, 32.0), (4.0, 4.6), (9.0, 12.0), (4.0, 4.6))),
)


def spectrum_csv(path: Path, trucks: int, seed: int = 11) -> None:
    """Write ``trucks`` invented trucks, one a row, each counted once (the (ADTT)SL of the
    model shares the trucks a day among them)."""
    generator = np.random.default_rng(seed)
    widest = max(len(loads) for _, loads, _ in CLASSES)
    shares = np.array([share for share, _, _ in CLASSES])
    kinds = generator.choice(len(CLASSES), size=trucks, p=shares / shares.sum())
    table = np.full((trucks, 2 * widest), np.nan)
    for kind, (_, loads, gaps) in enumerate(CLASSES):
        rows = np.flatnonzero(kinds == kind)
        for j, (low, high) in enumerate(loads):
            table[rows, j] = np.round(generator.uniform(low, high, rows.size), 1)
        for j, (low, high) in enumerate(gaps):
            table[rows, widest + j] = np.round(generator.uniform(low, high, rows.size), 1)
    header = ([f"axle_{k + 1} [kip]" for k in range(widest)]
              + [f"spacing_{k + 1} [ft]" for k in range(widest - 1)] + ["count [-]"])
    lines = [",".join(header)]
    for row in table.tolist():
        cells = ["" if np.isnan(v) else f"{v:g}" for v in row[:2 * widest - 1]]
        lines.append(",".join(cells) + ",1")
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")


def model_toml(path: Path, details: int) -> None:
    """The girder with ``details`` details at distinct sections."""
    text = [f'title = "Benchmark girder, 2 x {SPAN:g} ft"', 'units = "kip-ft"', "[beam]",
            f"spans = [{SPAN}, {SPAN}]", "EI = 4.0e7", 'supports = ["pinned", "roller", "roller"]',
            "[fatigue]", 'standard = "AASHTO"', "adtt = 2000", "lanes = 2", "age_years = 30"]
    for k, at in enumerate(np.linspace(3.0, 2 * SPAN - 3.0, details)):
        shear = k % 5 == 4
        prop = "area = 24.0" if shear else "section_modulus = 1800.0"
        text += ["[[fatigue_detail]]", f'name = "D{k + 1}"', f'location = "{at:.4f}"',
                 f'response = "{"shear" if shear else "moment"}"',
                 f'category = "{"C" if shear else "E"}"', prop]
    path.write_text("\n".join(text) + "\n", encoding="utf-8")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--trucks", type=int, default=100_000)
    parser.add_argument("--details", type=int, default=50)
    parser.add_argument("--workers", type=int, default=None)
    options = parser.parse_args()
    folder = Path(tempfile.mkdtemp())
    csv_path, model_path = folder / "spectrum.csv", folder / "girder.toml"
    spectrum_csv(csv_path, options.trucks)
    model_toml(model_path, options.details)
    print(f"{options.trucks:,} trucks over {options.details} details (distinct sections) of a "
          f"two-span girder")

    started = time.perf_counter()
    read_spectrum(csv_path, "kip-ft")
    print(f"read the spectrum:            {time.perf_counter() - started:7.2f} s")

    wall, cpu = time.perf_counter(), time.process_time()
    results = fatigue(model_path, spectrum=csv_path, workers=options.workers)
    wall, cpu = time.perf_counter() - wall, time.process_time() - cpu
    print(f"whole run (read, histories, counting, damage): {wall:7.2f} s wall, {cpu:7.2f} s CPU")
    worst = max(results.details, key=lambda r: r.life.damage_per_year)
    print(f"  (most damaged: {worst.detail.name}, {worst.life.damage_per_year:.3g} a year)")

    read = read_model_file(model_path)
    line = analyse_model(read.model).line(Response("moment", f"{0.9 * SPAN:.4f}"))
    traffic = results.traffic.fleet
    started = time.perf_counter()
    histories = crossing_histories(line, traffic)
    exact = time.perf_counter() - started
    started = time.perf_counter()
    count_many(histories)
    counting = time.perf_counter() - started
    print(f"one line, exact histories:    {exact:7.2f} s ({histories.lengths.mean():.1f} turning "
          "points a crossing)")
    print(f"one line, rainflow counting:  {counting:7.2f} s")

    sample = min(ONE_BY_ONE_SAMPLE, traffic.count)
    started = time.perf_counter()
    for k in range(sample):
        crossing(line, traffic.train(k))
    general = (time.perf_counter() - started) * traffic.count / sample
    print(f"one line, one crossing at a time through the general effect function (scaled from "
          f"{sample}): {general:7.1f} s, {general / exact:.0f} times the batch")


if __name__ == "__main__":
    main()
