#!/usr/bin/python3
"""Writes libcoil/src/studies/inductance_fall_fit.hpp: how far a coil's inductance falls from DC to a frequency.

The design search meets the target inductance at the target frequency. The analysis computes L there with the
wire-harmonic solver: L(f) = L_dc + (the solver's L(f) - its L(0)), where the fall holds the wires' internal
inductance and the shift of the current across every wire towards its neighbours (the proximity effect). The
screen used to estimate the fall by the internal inductance alone (mu0 / 8 pi per metre of wire, times 1 less
the skin effect's ratio), which put it 2 ... 25 times too small (median 5.5 on random coils): the screened
designs sat 2 ... 4 % of L below the target, and the confirmation's retarget added turns to them, lowering
their SRF after the network had passed them.

This script measures the fall on random coils of the solver's domain and fits it, over L_dc, as

    fall / L_dc = (d / D) [(1 - internal inductance ratio(x)) A + P(x) B + P(x)^2 C],

where x = sqrt(2) r / delta is the skin effect's argument, P(x) = Re(-J2(z) / J0(z)) with z = (1 - j) x / sqrt(2)
is the in-phase share of the field a round wire's eddy currents expel from it when the field crosses it (0 at
DC, 1 when they expel it all: the proximity effect's part of the fall), and A, B, C are polynomials of total
degree DEGREE in four features of the geometry, each scaled to [-1, 1] over the sample's range: log of the
gap between the turns over d (p / d - 1, bare d), log D / d, 1 / n and log l / D (l = N p, the winding's
length), with n the turns rounded as the solver rounds them: it takes a ring for each whole turn, so the fall
of a coil of 3.5 turns is the fall of 4 rings, while L_dc is the 3.5 turns' (with N through l / D, the fit's
error fell fourfold). The coefficients are linear least squares, each coil weighted by 1 / its fall (the relative
error). The problem scales: with the conductor's resistivity in delta, the fall over L depends on these
ratios alone, so every coil is drawn with a 1 mm wire.

The domain (the solver's, wire_harmonics.hpp): D / d 6 ... 100, bare p / d 1.01 ... 5, x 0.3 ... 100 (log-
uniform each), 3 ... 60 turns in quarters (more of them short), at most default_max_harmonic_unknowns
unknowns at the frequency. The search takes the fit inside the sample's range of every feature, where the
analysis's loss model is the solver; elsewhere it keeps the internal inductance's estimate. Either way the
confirmation trims each kept design with the solver itself: the fit only aims the screen.

The fit is half the sample, the check the other half; the header states both halves' errors, and
tests/python/test_inductance_fall_fit.py checks them on fresh coils (the coefficients current with the solver).

Run:  PYTHONPATH=build/python /usr/bin/python3 tools/inductance_fall_fit.py > libcoil/src/studies/inductance_fall_fit.hpp
      (about a minute on two cores)
      ... tools/inductance_fall_fit.py --sample SEED COUNT   (prints the rows of COUNT coils as JSON)
"""
import json
import math
import multiprocessing
import pathlib
import random
import sys

import numpy as np
from scipy import special

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent))
import polynomial_fit  # noqa: E402  (tools/, beside this script)

import libcoil

MU0 = libcoil.mu0
RHO = 1.7241e-8  # ohm m; any value does: the fall depends on x, not on the resistivity itself
D_WIRE = 1e-3
DEGREE = 4
FEATURES = ("log gap", "log D/d", "1/n", "log l/D")
SHAPES = ("1 - internal inductance ratio", "P", "P^2")
SAMPLE_SEED, SAMPLE_COUNT = 5, 24000
CHECK_ROWS = 8  # rows whose estimate the header carries, for the C++ test
MAX_UNKNOWNS = 1000  # wire_harmonics.hpp's default_max_harmonic_unknowns


def log_uniform(rng, low, high):
    return math.exp(math.log(low) + rng.random() * (math.log(high) - math.log(low)))


def draw(rng):
    """(x, p / d, D / d, N)."""
    turns = max(3.0, round(4 * (3 + 57 * rng.random() * rng.random())) / 4)
    return log_uniform(rng, 0.3, 100), log_uniform(rng, 1.01, 5), log_uniform(rng, 6, 100), turns


def frequency_of(x):
    """The frequency at which a 1 mm wire of resistivity RHO has sqrt(2) r / delta = x."""
    delta = math.sqrt(2) * (D_WIRE / 2) / x
    return RHO / (math.pi * MU0 * delta * delta)


def measure(coil):
    """A row (x, p / d, D / d, N, l / D, fall over L_dc (positive), internal inductance ratio, the internal
    inductance's estimate of the fall over L_dc), or None."""
    x, spacing, diameter, turns = coil
    try:
        s = libcoil.Solenoid(mean_diameter=diameter * D_WIRE, turns=turns, pitch=spacing * D_WIRE, wire=libcoil.Wire(diameter=D_WIRE))
        f = frequency_of(x)
        solver = libcoil.WireHarmonicSolver(s, RHO)
        if libcoil.wire_harmonic_unknowns(s, RHO, f) > MAX_UNKNOWNS:
            return None
        fall = solver.solve(0.0)["inductance"] - solver.solve(f)["inductance"]
        l_dc = libcoil.inductance(s).recommended
    except (libcoil.InputError, libcoil.DomainError):
        return None
    internal = float(libcoil.skin_inductance_ratio(x))
    before = MU0 / (8 * math.pi) * (1 - internal) * turns * math.pi * s.mean_diameter / l_dc  # the screen's estimate before
    return x, spacing, diameter, turns, s.winding_length / s.mean_diameter, fall / l_dc, internal, before


def sample(seed, count, processes=1):
    rng = random.Random(seed)
    out = []
    pool = multiprocessing.Pool(processes) if processes > 1 else None  # (a test loads this file by path: no pool)
    while len(out) < count:
        jobs = [draw(rng) for _ in range(count - len(out))]
        out += [r for r in (pool.map(measure, jobs, chunksize=16) if pool else map(measure, jobs)) if r is not None]
    if pool:
        pool.close()
    return out


def rings(turns):
    """The solver's rings for `turns`: one a whole turn (cross_section.cpp's coil_ring_centres)."""
    return max(1, math.floor(turns + 0.5))


def features(row):
    x, spacing, diameter, turns = row[:4]
    return math.log(spacing - 1), math.log(diameter), 1 / rings(turns), math.log(turns * spacing / diameter)


def transverse_screening(x):
    """P(x) = Re(-J2(z) / J0(z)), z = (1 - j) x / sqrt(2)."""
    z = (1 - 1j) * x / math.sqrt(2)
    return float((-special.jv(2, z) / special.jv(0, z)).real)


def shapes(row):
    """The shapes of x the polynomials multiply, each over D / d."""
    x, diameter, internal = row[0], row[2], row[6]
    p = transverse_screening(x)
    return [(1 - internal) / diameter, p / diameter, p * p / diameter]


def powers(count):
    return polynomial_fit.powers(count, DEGREE)


def monomials(x, low, high):
    return polynomial_fit.monomials(x, low, high, DEGREE)


def estimate(row, low, high, coefficients):
    """The fitted fall over L_dc, or None outside the range."""
    x = features(row)
    if any(not lo <= v <= hi for v, lo, hi in zip(x, low, high)):
        return None
    m = monomials(x, low, high)
    return sum(s * sum(c * v for c, v in zip(cs, m)) for s, cs in zip(shapes(row), coefficients))


def fit(rows):
    """(low, high, coefficients[shape][term]) from the rows."""
    x = np.array([features(r) for r in rows])
    low, high = x.min(axis=0).tolist(), x.max(axis=0).tolist()
    m = np.array([monomials(features(r), low, high) for r in rows])
    a = np.hstack([m * np.array([shapes(r)[k] for r in rows])[:, None] for k in range(len(SHAPES))])
    weight = 1 / np.array([max(r[5], 1e-4) for r in rows])
    solution = np.linalg.lstsq(a * weight[:, None], np.array([r[5] for r in rows]) * weight, rcond=None)[0]
    return low, high, solution.reshape(len(SHAPES), -1).tolist()


def errors(rows, low, high, coefficients):
    """|estimate - fall| over L_dc of each row inside the range."""
    return np.array([abs(e - r[5]) for r in rows if (e := estimate(r, low, high, coefficients)) is not None])


def cxx_list(values, fmt, per_line=5):
    return "{" + ",\n     ".join(", ".join(fmt(v) for v in values[i:i + per_line]) for i in range(0, len(values), per_line)) + "}"


def main():
    if len(sys.argv) == 4 and sys.argv[1] == "--sample":
        print(json.dumps(sample(int(sys.argv[2]), int(sys.argv[3]))))
        return
    rows = sample(SAMPLE_SEED, SAMPLE_COUNT, processes=2)
    half = len(rows) // 2
    low, high, coefficients = fit(rows[:half])
    fitted, held = errors(rows[:half], low, high, coefficients), errors(rows[half:], low, high, coefficients)
    before = np.array([abs(r[7] - r[5]) for r in rows[half:]])
    terms = powers(len(FEATURES))
    g = lambda v: f"{v:.17g}"
    pct = lambda e: ", ".join(f"{q} {np.percentile(e, p) * 100:.3f} %" for q, p in (("median", 50), ("p90", 90), ("p99", 99))) + f", max {e.max() * 100:.2f} %"
    out = ["// Generated by tools/inductance_fall_fit.py; do not edit. The fall of a coil's inductance from DC to a frequency,",
           "// over L_dc, as the wire-harmonic solver computes it: (d / D) [(1 - the internal inductance ratio) A + P B + P^2 C],",
           f"// A, B, C polynomials of degree {DEGREE} in four scaled features; fitted on {half} of {len(rows)} random coils of the",
           "// solver's domain. |estimate - fall| / L_dc,",
           f"// on the coils fitted: {pct(fitted)};",
           f"// on the {len(held)} others: {pct(held)}",
           f"// (the internal inductance alone, the screen's estimate before: {pct(before)}).",
           "#pragma once", "", "namespace libcoil::detail::inductance_fall_fit {", "",
           f"// The features: {', '.join(FEATURES)} (gap: p / d - 1, bare d; n: the turns rounded, the solver's rings; l = N p);",
           "// each scaled to [-1, 1] over low .. high, the sample's range, outside which the fit is not taken; and the",
           "// range of x = sqrt(2) r / delta sampled.",
           f"inline constexpr int features = {len(FEATURES)}, terms = {len(terms)}, degree = {DEGREE}, shapes = {len(SHAPES)};",
           f"inline constexpr double low[features] = {cxx_list(low, g)};",
           f"inline constexpr double high[features] = {cxx_list(high, g)};",
           f"inline constexpr double x_low = {g(min(r[0] for r in rows))}, x_high = {g(max(r[0] for r in rows))};",
           "// The monomials' powers of the scaled features, in the order of the coefficients.",
           f"inline constexpr unsigned char powers[terms][features] = {cxx_list(['{' + ', '.join(map(str, t)) + '}' for t in terms], str, 10)};",
           f"// The coefficients of A, B and C ({', '.join(SHAPES)}).",
           "inline constexpr double coefficients[shapes][terms] = {" + ",\n    ".join(cxx_list(c, g) for c in coefficients) + "};",
           "",
           "// Checks: x, p / d, D / d, N, the internal inductance ratio, and the estimate this script computes.",
           f"inline constexpr int check_rows = {CHECK_ROWS};",
           "inline constexpr double checks[check_rows][6] = {" + ",\n    ".join(
               "{" + ", ".join(g(v) for v in (*r[:4], r[6], estimate(r, low, high, coefficients) or 0.0)) + "}" for r in rows[half:half + CHECK_ROWS]) + "};",
           "", "}  // namespace libcoil::detail::inductance_fall_fit"]
    print("\n".join(out))


if __name__ == "__main__":
    main()
