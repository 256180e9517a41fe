"""The one table of tolerances for exact piecewise polynomials, each with one meaning.

Every tolerance is relative: to the function's extent for positions, to its largest magnitude
for values, to the largest coefficient of a piece for degrees. They exist because the
coefficients come out of floating-point solves and sums; none is a sampling step.
"""

NOISE = 1e-14
"""A term of a piece smaller than this fraction [-] of the function's largest term is round-off
of the computation that produced it (a reaction line that should end at exactly zero, say) and
is set to zero when a function is cleaned."""

POSITION = 1e-11
"""Positions closer than this fraction [-] of the function's extent (at least 1 length unit)
are one position: a load standing within it of a breakpoint stands on it, and breakpoints
within it of each other are merged."""

VALUE = 1e-9
"""Values closer than this fraction [-] of the function's largest magnitude are equal: one-sided
limits that differ by less are no jump, neighbouring peaks that differ by less are one plateau,
and a gain below it does not move a choice."""

DEGREE = 1e-11
"""A coefficient of a piece (in the piece's normalised variable, 0 to 1) below this fraction [-]
of the piece's largest one does not count toward its degree when roots are sought."""

ROOT_MARGIN = 1e-6
"""Roots found within this distance [-] outside the normalised piece (0 to 1) by a closed form
are taken as lying on its end (before polishing); roots further out are not in the piece."""
