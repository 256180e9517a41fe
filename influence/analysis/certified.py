"""Certified polynomial pieces of an influence function inside a member of varying section.

Why this representation. Inside a haunched member an influence line is no longer a cubic: it is
p(a) + sum q_k(a) F_k(a) with F_k running integrals of 1/EI (see
:mod:`influence.analysis.integral_form`). The tool's exact machinery (the governing search of
load trains, areas, roots, envelopes) works on piecewise polynomials. Two ways were open: teach
that machinery a numerical stationary-point solve for the non-polynomial pieces, or hand it
polynomials that are provably as good as the function. The second keeps one search, unchanged and
exact on what it is given, and moves all the approximation into one place with one number that
says how good it is: each piece here comes with a proven bound on |function - interpolant| over
the piece, and pieces are split until that bound is below ``tolerance`` (1e-12) times the
function's scale. Every extreme, area and effect the search then computes from the pieces differs
from that of the exact function by at most the bound times the total load (times the loaded
length for an area): far below anything printed.

How the bound is proven. On a piece [lo, hi] inside one depth piece, 1/EI = 1/(EI_ref d^n) is
analytic except where the depth polynomial d vanishes or (for non-integer n) is negative real,
which is off the real member. For a Bernstein ellipse E_rho around the piece on which Re d > 0
(found exactly: :meth:`Compliance.weight_bound`), the function g is analytic and bounded by a
computable M(rho) (:meth:`IntegralForm.ellipse_bounds`), and the polynomial p_N interpolating g in
the N + 1 Chebyshev points of the piece obeys (L. N. Trefethen, *Approximation Theory and
Approximation Practice*, SIAM 2013, Theorem 8.2)

    max |g - p_N| <= 4 M(rho) rho^-N / (rho - 1).

The bound is minimised over a grid of rho; the smallest degree that meets the tolerance is used.
That is the truncation part, proven for the interpolant of the exact values. The coefficients are
computed in floating point, so a rounding allowance is reported beside it, from standard a priori
error models: the error estimates of the sampled values (of the running integrals carried to the
piece start: a fixed cubic along the piece, which interpolation reproduces exactly; of the rest:
times the Lebesgue constant of the Chebyshev points, <= 2/pi log(N + 1) + 1, Trefethen
Theorem 15.2), the rounding of the change to monomials in (a - lo) (N + 2 units of rounding on
the sum of the magnitudes of the products) and Horner's rule for evaluating the result (2N units
on the sum of |coefficient| width^k). The allowance is an estimate, not a proof; the tests find
it ten to a hundred times the rounding actually measured. A piece is accepted when its
truncation bound is within ``tolerance`` x scale and its allowance within :data:`ROUNDING_LIMIT`
x scale, otherwise it is halved. The allowance also guards the change of basis: a monomial form
in (a - lo) is well conditioned only when the function's singularities are far from the piece
compared with its width, and a piece whose coefficients would cancel heavily is split.

The allowance is relative to ``scale``: a function that is a small difference of large terms
(the share of one member in a line whose size is set elsewhere) should be certified with the
whole line's scale, which the caller passes.

Example (a haunched member's fixed-end moment at A for a load at a: certified pieces):
    >>> from influence.analysis.haunch import Haunch, haunched_section
    >>> from influence.analysis.variable_member import VariableMemberLaw
    >>> haunch = Haunch("parabolic", 1.0, length_fraction=0.2)
    >>> law = VariableMemberLaw(haunched_section(10.0, 1.0, 1.0, start=haunch, end=haunch))
    >>> form = law.end_forces_from_load(0.0, -1.0)[2]
    >>> pieces = certify(form, 0.0, 10.0)
    >>> bool(pieces.truncation.max() <= 1e-12 * pieces.scale), pieces.breakpoints[[0, -1]].tolist()
    (True, [0.0, 10.0])
    >>> a = np.array([0.0, 1.3, 5.0, 10.0])
    >>> bool(np.all(np.abs(pieces.values(a) - form.values(a)) <= pieces.bound))
    True
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import lru_cache

import numpy as np
from numpy.polynomial import polynomial as P

from influence.analysis.integral_form import IntegralForm
from influence.errors import ModelError

CERTIFIED_TOLERANCE = 1e-12
"""Largest proven truncation error [-] of a piece, as a fraction of the function's scale."""

ROUNDING_LIMIT = 1e-11
"""Largest floating-point allowance [-] of a piece, as a fraction of the function's scale; the
allowance is an a priori estimate, ten to a hundred times the rounding measured in the tests."""

DEGREES = (3, 5, 8, 11, 14, 18, 22)
"""Chebyshev degrees tried on a piece, lowest first."""

RHOS = np.geomspace(1.02, 1e6, 160)
"""Bernstein ellipse parameters [-] over which the truncation bound is minimised."""

SCALE_SAMPLES = 65
"""Chebyshev points per depth piece at which the function's scale is first estimated."""

SMALLEST_PIECE = 1e-6
"""Narrowest piece [-], as a fraction of the interval, before certification gives up."""

_EPS = float(np.finfo(float).eps)


@dataclass(frozen=True, eq=False)
class CertifiedPieces:
    """A function of the load position as polynomial pieces with a proven error bound.

    Attributes:
        breakpoints: piece ends, ascending [length].
        coefficients: one row per piece, coefficients of (a - piece start)^k, k = 0..degree,
            lowest first (the piecewise carrier's form); rows padded with zeros to one degree.
        truncation: per piece, the proven bound on |function - exact interpolant| [function units].
        rounding: per piece, the floating-point allowance [function units].
        scale: the function's size used for the tolerance [function units].
        tolerance: the fraction of ``scale`` each piece was certified to [-].
    """

    breakpoints: np.ndarray
    coefficients: np.ndarray
    truncation: np.ndarray
    rounding: np.ndarray
    scale: float
    tolerance: float

    @property
    def bounds(self) -> np.ndarray:
        """Per piece, the certified bound on |function - polynomial| [function units]."""
        return self.truncation + self.rounding

    @property
    def bound(self) -> float:
        """The certified bound over all pieces [function units]."""
        return float(self.bounds.max(initial=0.0))

    @property
    def degree(self) -> int:
        return self.coefficients.shape[1] - 1

    def values(self, positions: np.ndarray | list[float]) -> np.ndarray:
        """The polynomial pieces at load positions [length] (a breakpoint takes the piece after
        it; the last end takes the last piece).

        Example (one piece, 1 + 2 (a - 1) on [1, 3]):
            >>> one = CertifiedPieces(np.array([1.0, 3.0]), np.array([[1.0, 2.0]]),
            ...                       np.zeros(1), np.zeros(1), 1.0, 1e-12)
            >>> one.values([1.0, 3.0]).tolist()
            [1.0, 5.0]
        """
        a = np.atleast_1d(np.asarray(positions, dtype=float))
        pieces = np.clip(np.searchsorted(self.breakpoints, a, side="right") - 1,
                         0, len(self.coefficients) - 1)
        local = a - self.breakpoints[pieces]
        return np.asarray(P.polyval(local, self.coefficients[pieces].T, tensor=False))

    def reversed(self) -> CertifiedPieces:
        """The same function in the reversed coordinate a' = lo + hi - a (for a path that runs
        from the member's end to its start); the bounds carry over.

        Example:
            >>> one = CertifiedPieces(np.array([0.0, 2.0]), np.array([[1.0, 2.0]]),
            ...                       np.zeros(1), np.zeros(1), 1.0, 1e-12)
            >>> back = one.reversed()
            >>> back.values([0.0, 2.0]).tolist()
            [5.0, 1.0]
        """
        lo, hi = self.breakpoints[0], self.breakpoints[-1]
        widths = np.diff(self.breakpoints)[::-1]
        rows = [_shifted(row, width) for row, width in zip(self.coefficients[::-1], widths,
                                                            strict=True)]
        return CertifiedPieces(lo + hi - self.breakpoints[::-1], np.array(rows),
                               self.truncation[::-1], self.rounding[::-1], self.scale,
                               self.tolerance)


def _shifted(row: np.ndarray, width: float) -> np.ndarray:
    """Coefficients in t' of p(width - t')."""
    result = np.zeros(len(row))
    linear = np.array([width, -1.0])
    power = np.array([1.0])
    for coefficient in row:
        result[: len(power)] += coefficient * power
        power = P.polymul(power, linear)
    return result


@lru_cache(maxsize=64)
def _shifted_chebyshev(degree: int) -> np.ndarray:
    """Exact coefficients S[k, i] of s^i in T_k(2 s - 1), in integers then floats."""
    rows: list[list[int]] = [[1], [-1, 2]]
    for _ in range(2, degree + 1):
        previous, current = rows[-2], rows[-1]
        # T_(k+1) = 2 (2 s - 1) T_k - T_(k-1)
        following = [0] * (len(current) + 1)
        for i, c in enumerate(current):
            following[i] -= 2 * c
            following[i + 1] += 4 * c
        for i, c in enumerate(previous):
            following[i] -= c
        rows.append(following)
    table = np.zeros((degree + 1, degree + 1))
    for k in range(degree + 1):
        table[k, : len(rows[k])] = [float(c) for c in rows[k]]
    return table


@dataclass(frozen=True)
class PieceCertificate:
    """One certified piece: monomial coefficients in (a - lo) and its bound parts."""

    coefficients: np.ndarray
    truncation: float
    rounding: float
    rho: float


def truncation_bounds(form: IntegralForm, piece: int, lo: float, hi: float,
                      degrees: tuple[int, ...] = DEGREES) -> dict[int, tuple[float, float]]:
    """For each degree N of :data:`DEGREES`, the smallest proven bound 4 M rho^-N / (rho - 1)
    over :data:`RHOS` and the rho that gives it, for the stretch [lo, hi] of depth piece
    ``piece`` [function units]."""
    centre, half = (lo + hi) / 2, (hi - lo) / 2
    M = form.ellipse_bounds(piece, centre, half, RHOS, lo)
    out = {}
    with np.errstate(over="ignore", invalid="ignore"):
        for N in degrees:
            bounds = 4 * M * RHOS ** (-float(N)) / (RHOS - 1)
            bounds = np.where(np.isfinite(bounds), bounds, np.inf)
            best = int(np.argmin(bounds))
            out[N] = (float(bounds[best]), float(RHOS[best]))
    return out


def certify_piece(form: IntegralForm, piece: int, lo: float, hi: float, degree: int,
                  truncation: float, rho: float) -> PieceCertificate:
    """Interpolate ``form`` in degree + 1 Chebyshev points of [lo, hi] and change to monomials in
    (a - lo); add the rounding allowance to the given proven ``truncation`` bound."""
    N = degree
    angles = np.pi * np.arange(N + 1) / N
    nodes = (lo + hi) / 2 + (hi - lo) / 2 * np.cos(angles)
    values, errors, carried = form.values_and_errors(nodes)
    # Chebyshev coefficients of the interpolant (the DCT-I of the values)
    weights = np.ones(N + 1)
    weights[[0, N]] = 0.5
    cosines = np.cos(np.outer(np.arange(N + 1), angles))
    cheb = (2.0 / N) * cosines @ (weights * values)
    cheb[[0, N]] /= 2
    # u = (2a - lo - hi)/(hi - lo) = 2 s - 1 with s = (a - lo)/(hi - lo)
    table = _shifted_chebyshev(N)
    in_s = cheb @ table
    width = hi - lo
    coefficients = in_s / width ** np.arange(N + 1)
    lebesgue = 2 / np.pi * math.log(N + 1) + 1
    change = (N + 2) * _EPS * float((np.abs(cheb) @ np.abs(table)).sum())
    horner = 2 * N * _EPS * float(np.abs(in_s).sum())
    dct = 2 * (N + 1) * _EPS * float(np.abs(values).max())
    # the carried error is one polynomial of degree <= 3 along the piece, which interpolation
    # reproduces exactly; its largest size on the piece is at an end, which is a node
    rounding = float(carried.max()) + lebesgue * (float(errors.max()) + dct) + change + horner
    return PieceCertificate(coefficients, truncation, rounding, rho)


def certify(form: IntegralForm, lo: float, hi: float, *,
            tolerance: float = CERTIFIED_TOLERANCE, scale: float | None = None,
            degrees: tuple[int, ...] = DEGREES) -> CertifiedPieces:
    """Certified polynomial pieces of a function of the load position on [lo, hi].

    Args:
        form: the function, e.g. a fixed-end force of
            :meth:`VariableMemberLaw.end_forces_from_load`, a field's ``behind``/``ahead`` term,
            or ``combine(...)`` of them into a whole influence line inside the member.
        lo: start of the load positions [length from the member start], >= 0.
        hi: end [length], <= the member length; a section inside the member is a cut the
            caller makes (certify [0, s] with ``behind`` and [s, L] with ``ahead``).
        tolerance: the certified bound per piece as a fraction of ``scale`` [-].
        scale: the size the tolerance is relative to [function units]; by default the largest
            |function| sampled on [lo, hi]. Give the whole influence line's scale when the
            function is one member's share of it.
        degrees: the Chebyshev degrees a piece may use, lowest first (a piece is split when
            none meets the tolerance): fewer, lower degrees give more pieces of lower degree.

    Returns:
        Pieces whose every bound is at most tolerance x scale.

    Raises:
        ModelError: when a piece would have to be narrower than :data:`SMALLEST_PIECE` of the
            interval (a section variation too abrupt for the tolerance).
    """
    profile = form.compliance.section.profile
    cuts = [lo] + [b for b in profile.breakpoints if lo < b < hi] + [hi]
    stretches = list(zip(cuts[:-1], cuts[1:], strict=True))
    if scale is None:
        samples = np.concatenate([
            (a + b) / 2 + (b - a) / 2 * np.cos(np.pi * np.arange(SCALE_SAMPLES)
                                                / (SCALE_SAMPLES - 1))
            for a, b in stretches])
        scale = float(np.abs(form.values(samples)).max())
    if not np.any(form.terms) or scale == 0.0:
        return CertifiedPieces(np.array([lo, hi]), np.zeros((1, 1)), np.zeros(1), np.zeros(1),
                               scale, tolerance)
    allowed = tolerance * scale
    done: list[tuple[float, float, PieceCertificate]] = []
    queue = stretches[::-1]
    while queue:
        a, b = queue.pop()
        piece = int(profile.piece_of(np.array([(a + b) / 2]))[0])
        certificate = None
        for N, (bound, rho) in truncation_bounds(form, piece, a, b, degrees).items():
            if bound <= allowed:
                candidate = certify_piece(form, piece, a, b, N, bound, rho)
                if candidate.rounding <= ROUNDING_LIMIT * scale:
                    certificate = candidate
                break
        if certificate is not None:
            done.append((a, b, certificate))
            continue
        if b - a < SMALLEST_PIECE * (hi - lo):
            raise ModelError(f"cannot certify the influence function to {tolerance} of its "
                             f"scale {scale} near {a}", source="haunched member",
                             item=f"load positions {lo} to {hi}",
                             fix="check the section variation, or ask a looser tolerance")
        middle = (a + b) / 2
        queue.extend([(middle, b), (a, middle)])
    done.sort(key=lambda item: item[0])
    degree = max(len(c.coefficients) for _, _, c in done) - 1
    rows = np.zeros((len(done), degree + 1))
    for i, (_, _, c) in enumerate(done):
        rows[i, : len(c.coefficients)] = c.coefficients
    return CertifiedPieces(
        breakpoints=np.array([a for a, _, _ in done] + [done[-1][1]]),
        coefficients=rows,
        truncation=np.array([c.truncation for _, _, c in done]),
        rounding=np.array([c.rounding for _, _, c in done]),
        scale=scale,
        tolerance=tolerance,
    )
