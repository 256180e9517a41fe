"""How long an exact live-load envelope takes, against a plain finite-element moving-load run.

Run by hand (not part of the test suite):

    python benchmarks/envelope_benchmark.py            # the full run, several minutes on 2 cores
    python benchmarks/envelope_benchmark.py --quick    # a smaller run, a minute or two

The structure is a five-span continuous girder 30-40-50-40-30 m (pinned at the left end, rollers
elsewhere, constant EI). Moment and shear are enveloped at ``--sections`` sections (the midpoints
of equal cells along the 190 m path) for four load models, both travel directions: AASHTO LRFD
HL-93 in kN and m (truck with its 4.3-9.1 m rear gap, tandem, and the 90 % truck pair with its
15-305 m headway for negative moment), EN 1991-2 Load Model 1, Load Model 71 (80 kN/m kept
0.8 m clear of the axles), and an invented 13-axle quarry permit vehicle whose trailer groups are
3-8 m apart.

Exact: one factorisation, the influence lines of every section (exact piecewise cubics) and
``vehicles.search.govern.govern_many``.

Baseline, written as a general finite-element moving-load program does it: for every position
of a unit load at a ``--step`` spacing the girder (meshed with a node at every section and
support, three degrees of freedom a node) is assembled and solved, and the sections' moment and
shear recovered from the element end forces; then every vehicle is stepped along the sampled
lines at the same spacing (ordinates interpolated linearly between samples), every ranged gap
tried on a grid (``--gap-factor`` times the step; each gap value steps the whole vehicle
again, or with ``--grouped-gaps`` the axles behind a single range are one group whose effect is
shifted along, a shortcut a general program does not take), lanes loaded on the adverse parts
of the line drawn straight between samples, knife-edge loads on the largest sample.

Printed: both times and their ratio, the baseline's largest shortfall against the exact envelope
(relative to the largest magnitude of that response's envelope, with where it occurs), the step
the baseline needs to come within 1e-4 of it (measured at a few steps; finer ones extrapolated
from the observed order of convergence, and said so), a check that every exact value is equal to
or beyond the sampled one, the exact time at several section counts, and the peak resident memory
of a separate process that computes the exact envelope at ``--memory-sections`` sections.

Where a sampled value lies beyond the exact one, the cause is the baseline's own interpolation:
at a jump (shear under its section) the line drawn straight between samples bridges the jump with
a ramp whose adverse part is loaded by the lane, and a chord between samples lies above a convex
stretch of a line. The sampled ordinates themselves agree with the exact lines to rounding. The
HL-93 truck pair acts only between the points of contraflexure, decided for both runs from the
line's net area (exact for the exact run, trapezoidal for the baseline).

The accuracy study measures the baseline at three steps or more (the step halved each time),
fits the order of its shortfall by least squares over all of them, and prints the measured
shortfalls apart from the step and time extrapolated for 1e-4 (only when no measured step
reaches it, and only when the fitted order shows the shortfall falling). The last line,
``ratio_vs_baseline: X``, is for machines: the measured full-size ratio.
"""

from __future__ import annotations

import argparse
import math
import resource
import subprocess
import sys
import time
from dataclasses import dataclass
from pathlib import Path

import numpy as np
from scipy.linalg import solveh_banded

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from influence.analysis.lines import analyse_model  # noqa: E402
from influence.analysis.responses import Response  # noqa: E402
from influence.model.beamform import continuous_beam  # noqa: E402
from vehicles import Axle, LoadCase, LoadModel, Train, get_model  # noqa: E402
from vehicles.search.govern import govern_many  # noqa: E402

SPANS = (30.0, 40.0, 50.0, 40.0, 30.0)  # [m]
EI = 2.0e7  # [kN m2]
EA = 2.0e7  # [kN]
ACCURACY = 1e-4  # relative to the largest magnitude of the response's envelope
KINDS = ("moment", "shear")


def load_models() -> list[LoadModel]:
    """HL-93 (kN, m), LM1, LM71 and the invented quarry permit vehicle."""
    gaps: list[float | tuple[float, float]] = [3.6, 1.4, 6.0, 1.5, 1.5, 1.5, 1.5, (3.0, 8.0),
                                               1.5, 1.5, 1.5, 1.5]
    loads = [60.0, 110.0, 110.0] + [95.0] * 10
    axles = (Axle(loads[0]),) + tuple(Axle(p, g) for p, g in zip(loads[1:], gaps, strict=True))
    permit = LoadModel("Fenmoor permit", "invented 13-axle quarry permit vehicle", "kN-m", (
        LoadCase("permit, alone in its lane", Train("Fenmoor quarry low-loader", axles),
                 axle_allowance=0.10),))
    return [get_model("HL-93", units="kN-m"), get_model("LM1"), get_model("LM71"), permit]


def section_chainages(count: int) -> np.ndarray:
    """Midpoints of ``count`` equal cells along the path [m]."""
    length = sum(SPANS)
    return (np.arange(count) + 0.5) * length / count


# ---------------------------------------------------------------------------------- exact


def exact_envelope(count: int, models: list[LoadModel]) -> tuple[np.ndarray, np.ndarray, float]:
    """(max, min) of shape (2, count) for moment then shear, and the time taken [s]."""
    start = time.perf_counter()
    model = continuous_beam(list(SPANS), EI, ["pinned"] + ["roller"] * len(SPANS), EA=EA)
    analysis = analyse_model(model)
    chainages = section_chainages(count)
    responses = [Response(kind, repr(float(x))) for kind in KINDS for x in chainages]
    lines = analysis.lines(responses)
    found = govern_many([line.function for line in lines], models,
                        kinds=[line.response.kind for line in lines],
                        interiors=[line.scope_interior for line in lines],
                        sections=[line.section_chainage for line in lines])
    elapsed = time.perf_counter() - start
    highs = np.array([g.max.value if g.max else np.nan for g in found]).reshape(2, count)
    lows = np.array([g.min.value if g.min else np.nan for g in found]).reshape(2, count)
    return highs, lows, elapsed


# --------------------------------------------------------------------- baseline: the solves


@dataclass(frozen=True)
class Mesh:
    """Nodes at every support and section; elements between them; three DOFs a node."""

    nodes: np.ndarray  # [m]
    fixed: np.ndarray  # restrained DOF numbers
    sections: np.ndarray  # node index of each section

    @property
    def lengths(self) -> np.ndarray:
        return np.diff(self.nodes)


def mesh(chainages: np.ndarray) -> Mesh:
    supports = np.concatenate([[0.0], np.cumsum(SPANS)])
    nodes = np.unique(np.concatenate([supports, chainages]))
    at_support = np.searchsorted(nodes, supports)
    fixed = [3 * at_support[0]] + [3 * i + 1 for i in at_support]  # pinned, then rollers
    return Mesh(nodes, np.array(sorted(fixed)), np.searchsorted(nodes, chainages))


def element_matrices(lengths: np.ndarray) -> np.ndarray:
    """Stiffness of horizontal frame members (u, v, theta at each end), local = global."""
    L = lengths
    k = np.zeros((L.size, 6, 6))
    axial = EA / L
    for a, b, s in ((0, 0, 1), (3, 3, 1), (0, 3, -1), (3, 0, -1)):
        k[:, a, b] = s * axial
    bending = {
        (1, 1): 12 / L**3, (1, 2): 6 / L**2, (1, 4): -12 / L**3, (1, 5): 6 / L**2,
        (2, 2): 4 / L, (2, 4): -6 / L**2, (2, 5): 2 / L,
        (4, 4): 12 / L**3, (4, 5): -6 / L**2, (5, 5): 4 / L,
    }
    for (a, b), value in bending.items():
        k[:, a, b] = k[:, b, a] = EI * value
    return k


def sampled_lines(grid: Mesh, step: float) -> tuple[np.ndarray, np.ndarray, float]:
    """Moment and shear at every section for a unit load at every position of the step.

    Returns (moment, shear) each (sections, positions), and the time [s]. One assembly and one
    banded solve a load position.
    """
    start = time.perf_counter()
    length = float(grid.nodes[-1])
    positions = np.linspace(0.0, length, int(round(length / step)) + 1)
    dofs = 3 * grid.nodes.size
    lengths = grid.lengths
    elements = lengths.size
    k = element_matrices(lengths)
    numbers = 3 * np.arange(elements)[:, None] + np.arange(6)[None, :]  # (E, 6) global DOFs
    rows = np.broadcast_to(numbers[:, :, None], (elements, 6, 6))
    cols = np.broadcast_to(numbers[:, None, :], (elements, 6, 6))
    lower = rows >= cols
    band_rows, band_cols, band_k = rows[lower] - cols[lower], cols[lower], k[lower]
    moment = np.empty((grid.sections.size, positions.size))
    shear = np.empty_like(moment)
    right = grid.sections  # the element to the right of each section node
    for index, a in enumerate(positions):
        band = np.zeros((6, dofs))
        np.add.at(band, (band_rows, band_cols), band_k)  # assemble
        load = np.zeros(dofs)
        e = min(int(np.searchsorted(grid.nodes, a, side="right")) - 1, elements - 1)
        L, x = lengths[e], a - grid.nodes[e]
        r = x / L
        shape = np.array([1 - 3 * r**2 + 2 * r**3, x * (1 - r) ** 2, 3 * r**2 - 2 * r**3,
                          x * r * (r - 1)])
        equivalent = np.zeros(6)
        equivalent[[1, 2, 4, 5]] = -shape  # a unit load downward
        load[numbers[e]] += equivalent
        for s in grid.fixed:  # a restrained DOF keeps only its diagonal
            band[:, s] = 0.0
            for d in range(1, 6):
                if s - d >= 0:
                    band[d, s - d] = 0.0
            band[0, s] = 1.0
            load[s] = 0.0
        u = solveh_banded(band, load, lower=True)
        # recover: end forces of the element to the right of each section node
        ends = np.einsum("eij,ej->ei", k[right], u[numbers[right]])
        ends[right == e] -= equivalent
        shear[:, index] = ends[:, 1]
        moment[:, index] = -ends[:, 2]
    return moment, shear, time.perf_counter() - start


# ---------------------------------------------------------------- baseline: the stepping


def _shifted(padded: np.ndarray, pad: int, first: float, count: int) -> np.ndarray:
    """Ordinates at ``count`` positions one step apart starting ``first`` steps from the
    path's start, interpolated linearly between samples (``padded`` has ``pad`` columns of
    padding at each end)."""
    low = math.floor(first)
    fraction = first - low
    i = low + pad
    if i < 0 or i + count + 1 > padded.shape[1]:
        raise ValueError("padding too narrow")
    here = padded[:, i : i + count]
    if fraction == 0.0:
        return here
    return (1 - fraction) * here + fraction * padded[:, i + 1 : i + 1 + count]


def stepped_envelope(moment: np.ndarray, shear: np.ndarray, step: float,
                     models: list[LoadModel], gap_step: float, grouped: bool = False
                     ) -> tuple[np.ndarray, np.ndarray, float]:
    """(max, min) of shape (2, sections) from the sampled lines, and the time [s]."""
    start = time.perf_counter()
    highs = np.full((2, moment.shape[0]), -np.inf)
    lows = np.full((2, moment.shape[0]), np.inf)
    for kind_index, (kind, sampled) in enumerate(zip(KINDS, (moment, shear), strict=True)):
        # a moment between the points of contraflexure: a uniform load on the whole path hogs
        # there (negative net area of the sampled line), as the exact search decides it
        net = step * (sampled.sum(axis=1) - 0.5 * (sampled[:, 0] + sampled[:, -1]))
        interior = (net < 0) if kind == "moment" else np.zeros(sampled.shape[0], dtype=bool)
        for model in models:
            for case in model.cases:
                for sense in ("max", "min"):
                    for region in (False, True):
                        rows = np.flatnonzero(interior == region)
                        if rows.size == 0 or not case.applies_to(kind, sense, interior=region):
                            continue
                        found = _case_extreme(sampled[rows], step, case, kind, sense, gap_step,
                                              grouped)
                        if sense == "max":
                            highs[kind_index, rows] = np.maximum(highs[kind_index, rows], found)
                        else:
                            lows[kind_index, rows] = np.minimum(lows[kind_index, rows], found)
    return highs, lows, time.perf_counter() - start


def _case_extreme(sampled: np.ndarray, step: float, case: LoadCase, kind: str, sense: str,
                  gap_step: float, grouped: bool) -> np.ndarray:
    sign = 1.0 if sense == "max" else -1.0
    adverse = np.maximum(sign * sampled, 0.0)
    segments = _adverse_segments(sign * sampled, step)
    areas = segments.sum(axis=1)
    scale = case.factor * (1 + case.lane_allowance)
    constant = scale * case.lane * areas
    knife = case.knife_edge_for(kind)
    if knife > 0:
        constant = constant + scale * knife * adverse.max(axis=1)
    train = case.train
    if train is None:
        return sign * constant
    ranges = train.ranged_values
    grids = [_gap_grid(r.low, min(r.high, sum(SPANS) + 1.0), gap_step) for r in ranges]
    widest = train.arranged([g[-1] for g in grids])
    clear = float(case.lane_clear_of_train or 0.0)
    reach = int(math.ceil((widest.axle_offsets.max() + clear) / step)) + 2
    pad = 2 * reach + 2  # room for a lead at either end with the train ahead or behind
    padded = np.pad(sampled, ((0, 0), (pad, pad)))
    first, count = -reach, sampled.shape[1] + 2 * reach  # lead positions [steps]
    weight = case.factor * (1 + case.axle_allowance)
    cleared = case.lane_clear_of_train is not None and case.lane > 0
    best = np.full(sampled.shape[0], -np.inf)
    for direction in (1.0, -1.0):  # forward: axles behind the lead; reverse: ahead of it

        def axles(offsets: np.ndarray, loads: np.ndarray, direction: float = direction
                  ) -> np.ndarray:
            effect = np.zeros((sampled.shape[0], count))
            for offset, load in zip(offsets, loads, strict=True):
                effect += weight * load * _shifted(padded, pad, first - direction * offset / step,
                                                   count)
            return effect

        if grouped and len(ranges) == 1 and not cleared:
            # one ranged gap: the axles behind it move together; step their effect along
            low, high = train.arranged([ranges[0].low]), widest
            moved = high.axle_offsets - low.axle_offsets > 1e-9
            fixed = sign * axles(low.axle_offsets[~moved], low.axle_loads[~moved])
            moving = np.pad(sign * axles(low.axle_offsets[moved], low.axle_loads[moved]),
                            ((0, 0), (pad, pad)))
            effect = np.empty_like(fixed)
            for value in grids[0]:
                # the moved axles' effect, interpolated between steps, into one buffer
                where = -direction * (value - ranges[0].low) / step
                i = math.floor(where) + pad
                fraction = where - math.floor(where)
                np.subtract(moving[:, i + 1 : i + 1 + count], moving[:, i : i + count],
                            out=effect)
                effect *= fraction
                effect += moving[:, i : i + count]
                effect += fixed
                best = np.maximum(best, effect.max(axis=1) + constant)
            continue
        for values in _product(grids):
            arrangement = train.arranged(values)
            effect = sign * axles(arrangement.axle_offsets, arrangement.axle_loads)
            if cleared:
                effect -= case.factor * (1 + case.lane_allowance) * case.lane * _footprint(
                    segments, step, pad, first, count, arrangement.axle_offsets, clear,
                    direction)
            best = np.maximum(best, effect.max(axis=1) + constant)
    return sign * best


def _adverse_segments(signed: np.ndarray, step: float) -> np.ndarray:
    """Area of the adverse (positive) part of the line drawn straight between samples, one
    step at a time: a step that changes sign keeps only its positive triangle."""
    a, b = signed[:, :-1], signed[:, 1:]
    whole = 0.5 * step * (np.maximum(a, 0.0) + np.maximum(b, 0.0))
    crossing = (a < 0) != (b < 0)
    with np.errstate(divide="ignore", invalid="ignore"):
        part = 0.5 * step * np.maximum(a, b) ** 2 / (np.abs(a) + np.abs(b))
    return np.where(crossing, part, whole)


def _footprint(segments: np.ndarray, step: float, pad: int, first: int, count: int,
               offsets: np.ndarray, clear: float, direction: float) -> np.ndarray:
    """Sampled adverse area under the train's cleared footprint, for every lead position."""
    cumulative = np.concatenate([np.zeros((segments.shape[0], 1)),
                                 np.cumsum(segments, axis=1)], axis=1)
    padded = np.pad(cumulative, ((0, 0), (pad, pad)), mode="edge")
    front, rear = -clear / step, offsets.max() / step + clear / step
    low, high = sorted((-direction * front, -direction * rear))
    return (_shifted(padded, pad, first + high, count)
            - _shifted(padded, pad, first + low, count))


def _gap_grid(low: float, high: float, step: float) -> np.ndarray:
    if high <= low:
        return np.array([low])
    return np.linspace(low, high, int(math.ceil((high - low) / step)) + 1)


def _product(grids: list[np.ndarray]) -> list[tuple[float, ...]]:
    if not grids:
        return [()]
    points = np.meshgrid(*grids, indexing="ij")
    return [tuple(float(p.flat[i]) for p in points) for i in range(points[0].size)]


def baseline(count: int, step: float, models: list[LoadModel], gap_factor: float,
             grouped: bool = False) -> dict:
    grid = mesh(section_chainages(count))
    moment, shear, solve_time = sampled_lines(grid, step)
    highs, lows, step_time = stepped_envelope(moment, shear, step, models, gap_factor * step,
                                              grouped)
    return {"highs": highs, "lows": lows, "solve": solve_time, "stepping": step_time,
            "total": solve_time + step_time}


# ------------------------------------------------------------------------------ report


@dataclass(frozen=True)
class Comparison:
    shortfall: float  # largest, relative
    where: str
    excess: float  # largest amount a sampled value lies beyond the exact one, relative
    beyond: int  # how many sampled values lie beyond the exact ones (by more than 1e-9)
    beyond_kinds: tuple[str, ...]  # the responses where they do


def compare(highs: np.ndarray, lows: np.ndarray, sampled: dict, count: int,
            step: float = 0.0, models: list[LoadModel] | None = None) -> Comparison:
    """Shortfall of the sampled envelope against the exact one, and where sampled values lie
    beyond exact ones (the baseline draws each line straight between samples, which the lane
    then loads: near a jump or a kink that over-estimates by an amount that falls with the
    step)."""
    del step, models
    chainages = section_chainages(count)
    worst, where, excess, beyond, kinds = -np.inf, "", 0.0, 0, set()
    for kind_index, kind in enumerate(KINDS):
        high, low = highs[kind_index], lows[kind_index]
        scale = max(np.nanmax(np.abs(high)), np.nanmax(np.abs(low)))
        for sense, short in (("max", (high - sampled["highs"][kind_index]) / scale),
                             ("min", (sampled["lows"][kind_index] - low) / scale)):
            i = int(np.nanargmax(short))
            if short[i] > worst:
                worst, where = float(short[i]), f"{sense} {kind} at {chainages[i]:g} m"
            excess = max(excess, float(np.nanmax(-short)))
            over = int((short < -1e-9).sum())
            beyond += over
            if over:
                kinds.add(kind)
    return Comparison(worst, where, excess, beyond, tuple(sorted(kinds)))


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--sections", type=int, default=1000)
    parser.add_argument("--step", type=float, default=0.05, help="baseline step [m]")
    parser.add_argument("--refine", type=int, default=2,
                        help="how many times to halve the step for the accuracy study "
                             "(at least 2: the order is fitted to three steps or more)")
    parser.add_argument("--gap-factor", type=float, default=10.0,
                        help="baseline gap grid spacing as a multiple of the step")
    parser.add_argument("--growth", type=int, nargs="*", default=[250, 500, 1000, 2000])
    parser.add_argument("--memory-sections", type=int, default=10_000)
    parser.add_argument("--quick", action="store_true",
                        help="200 sections, accuracy at 50, growth 100-800, memory at 2000")
    parser.add_argument("--accuracy-sections", type=int, default=200,
                        help="sections of the accuracy study (steps halved --refine times)")
    parser.add_argument("--grouped-gaps", action="store_true",
                        help="baseline shortcut: shift the axles behind a single range as a group")
    parser.add_argument("--memory-only", type=int, default=0, help=argparse.SUPPRESS)
    args = parser.parse_args()
    models = load_models()
    if args.memory_only:
        exact_envelope(args.memory_only, models)
        print(resource.getrusage(resource.RUSAGE_SELF).ru_maxrss)  # [KiB] on Linux
        return
    if args.quick:
        args.sections, args.growth, args.memory_sections = 200, [100, 200, 400, 800], 2000
        args.accuracy_sections = 50
    args.refine = max(args.refine, 2)
    print(f"five-span girder {'-'.join(f'{s:g}' for s in SPANS)} m, {args.sections} sections, "
          f"moment and shear, {', '.join(m.name for m in models)}, both directions")
    exact_envelope(20, models)  # imports and first-call set-up, timed by neither run
    highs, lows, exact_time = exact_envelope(args.sections, models)
    print(f"exact envelope: {exact_time:.2f} s "
          f"({1e3 * exact_time / (2 * args.sections):.2f} ms a line)")
    mode = "grouped gaps" if args.grouped_gaps else "every gap re-stepped"
    run = baseline(args.sections, args.step, models, args.gap_factor, args.grouped_gaps)
    _print_run(run, compare(highs, lows, run, args.sections, args.step, models), args.step,
               args.gap_factor, mode)
    ratio = run["total"] / exact_time
    print(f"  exact is {ratio:.1f} times faster than the baseline at {args.step:g} m, "
          "measured side by side in this run")

    count = args.accuracy_sections
    print(f"accuracy study at {count} sections (every step measured):")
    sub_highs, sub_lows, _ = exact_envelope(count, models)
    runs: dict[float, dict] = {}
    step = args.step
    for _ in range(args.refine + 1):
        runs[step] = baseline(count, step, models, args.gap_factor, args.grouped_gaps)
        _print_run(runs[step], compare(sub_highs, sub_lows, runs[step], count, step, models),
                   step, args.gap_factor, mode)
        step /= 2
    _equal_accuracy(runs, sub_highs, sub_lows, count, run["total"], exact_time)

    print("exact time against sections (linear growth: the time a section stays flat):")
    for count in args.growth:
        _, _, seconds = exact_envelope(count, models)
        print(f"  {count:6d} sections: {seconds:7.2f} s, {1e3 * seconds / count:.2f} ms a "
              f"section")

    start = time.perf_counter()
    output = subprocess.run([sys.executable, __file__, "--memory-only",
                             str(args.memory_sections)], capture_output=True, text=True,
                            check=True).stdout
    peak = int(output.split()[-1]) / 1024
    print(f"exact envelope at {args.memory_sections} sections in a process of its own: "
          f"{time.perf_counter() - start:.1f} s, peak resident memory {peak:.0f} MiB "
          f"(target < 1024 MiB)")
    print(f"ratio_vs_baseline: {ratio:.1f}")


def _print_run(run: dict, c: Comparison, step: float, gap_factor: float, mode: str) -> None:
    print(f"baseline at {step:g} m (gaps every {gap_factor * step:g} m, {mode}): "
          f"{run['total']:.1f} s (solves {run['solve']:.1f} s, stepping {run['stepping']:.1f} s);"
          f" largest shortfall {c.shortfall:.2e} ({c.where}); sampled beyond exact at "
          f"{c.beyond} values, by at most {c.excess:.1e}")
    if c.beyond:
        print(f"  the values beyond exact are {', '.join(c.beyond_kinds)} values: the baseline's "
              "straight lines between samples, loaded by the lane, over-estimate near jumps "
              "and kinks; see the trend of this excess with the step below")


def _fitted_order(steps: list[float], values: list[float]) -> tuple[float, float]:
    """Least-squares slope of log(value) against log(step), and the largest deviation of a
    measured point from the fitted line (in decades)."""
    x, y = np.log10(steps), np.log10(values)
    slope, intercept = np.polyfit(x, y, 1)
    return float(slope), float(np.abs(y - (slope * x + intercept)).max())


def _equal_accuracy(runs: dict[float, dict], highs: np.ndarray, lows: np.ndarray, count: int,
                    full_time: float, exact_time: float) -> None:
    """The step and time the baseline needs for ACCURACY. Measured where a step of the study
    reaches it; otherwise extrapolated (and said so) from the error order fitted to every
    measured step, and from the order between the two finest steps where the two differ. The
    time at full size scales the full run's time by the fitted growth of the study's time with
    the step."""
    steps = sorted(runs, reverse=True)
    compared = [compare(highs, lows, runs[s], count) for s in steps]
    errors = [max(c.shortfall, 1e-300) for c in compared]
    times = [runs[s]["total"] for s in steps]
    order, spread = _fitted_order(steps, errors)
    growth, _ = _fitted_order(steps, times)
    last = math.log(errors[-2] / errors[-1]) / math.log(steps[-2] / steps[-1])
    print(f"  measured: shortfalls {', '.join(f'{e:.2e}' for e in errors)} at steps "
          f"{', '.join(f'{s:g}' for s in steps)} m; fitted error order {order:.2f} (points "
          f"within {spread:.2f} decades of the fit), {last:.2f} between the two finest steps; "
          f"time grows as step^{growth:.2f}")
    excess = [c.excess for c in compared]
    if any(excess):
        print(f"  measured: sampled values beyond exact by at most "
              f"{', '.join(f'{e:.1e}' for e in excess)} at the same steps (the baseline's "
              "interpolation: it falls with the step; the exact search is checked against dense "
              "sampling of the exact effect functions in "
              "tests/validation/test_brute_force_continuous.py)")
    reached = [s for s, e in zip(steps, errors, strict=True) if e <= ACCURACY]
    if reached:
        needed = reached[0]
        seconds = full_time * (steps[0] / needed) ** -growth
        print(f"  measured: within {ACCURACY:g} of the exact envelope at a {needed:g} m step; "
              f"at full size about {seconds:.0f} s, {seconds / exact_time:.0f} times the exact "
              "time (the full-size time scaled by the measured growth)")
        return
    for label, p in (("fitted", order), ("finest-pair", last)):
        if p <= 0.05:
            print(f"  extrapolated: none from the {label} order {p:.2f}: the shortfall does "
                  "not fall with the step there")
            continue
        needed = steps[-1] * (ACCURACY / errors[-1]) ** (1.0 / p)
        seconds = full_time * (steps[0] / needed) ** -growth
        print(f"  extrapolated (not run), {label} order {p:.2f}: within {ACCURACY:g} at about a "
              f"{needed:.2g} m step; at full size about {seconds:.3g} s, "
              f"{seconds / exact_time:.3g} times the exact time")
        if abs(last - order) < 0.2:
            break


if __name__ == "__main__":
    main()
