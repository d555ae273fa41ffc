#!/usr/bin/env python3
"""The cached grid of close-wound coils for the wire-harmonic solver's check against the cross-section
filament solver (tests/reference/cross_section/grid.json; issue 17). The filament solver is libcoil's own,
an independent method (piecewise-constant cells in the wire's cross-section, no harmonics, no multipoles):
slow, so its figures are cached here with this generator beside them and a test that re-runs one coil.

The grid: 220 coils drawn once (seeded) over pitch / wire diameter 1.02 .. 2.5 (log-uniform in the gap),
wire diameter / skin depth 0.1 .. 100 (log-uniform; the solver's subdivision_for holds R within 0.5 % of
the finite-element reference there), mean diameter / wire diameter 5 .. 60 and 3 .. 14 turns, and 20 long
coils of 20 .. 36 turns (l/D up to 11) at d / delta up to 30. Each coil at one frequency; copper at 20 degC.

Run:  PYTHONPATH=build/python /usr/bin/python3 tests/reference/cross_section/generate.py > tests/reference/cross_section/grid.json
      (about an hour on 2 cores)
      ... generate.py --one K   (coil K only, for the test)
"""
import json
import math
import multiprocessing
import random
import sys

import libcoil

RHO = 1.7241e-8  # copper at 20 degC (IEC 60028)
MU0 = 4e-7 * math.pi


def coils():
    rng = random.Random(17)
    out = []
    for k in range(240):
        long = k >= 220
        gap = math.exp(rng.uniform(math.log(0.02), math.log(1.5)))
        dd = math.exp(rng.uniform(math.log(0.1), math.log(30.0 if long else 100.0)))
        d = 1e-3
        big = rng.uniform(3.0, 6.0) if long else math.exp(rng.uniform(math.log(5), math.log(60)))
        n = rng.randint(20, 36) if long else rng.randint(3, 14)
        out.append({"index": k, "wire_diameter": d, "mean_diameter": big * d, "turns": n, "pitch": (1 + gap) * d,
                    "frequency": RHO / (math.pi * MU0 * (d / dd) ** 2)})
    return out


def solve(c):
    s = libcoil.Solenoid(mean_diameter=c["mean_diameter"], turns=c["turns"], pitch=c["pitch"],
                         wire=libcoil.Wire(diameter=c["wire_diameter"]))
    delta = math.sqrt(RHO / (math.pi * MU0 * c["frequency"]))
    solver = libcoil.CrossSectionSolver(s, RHO, libcoil.subdivision_for(c["wire_diameter"] / 2, delta))
    z, dc = solver.solve(c["frequency"]), solver.solve(0)
    return dict(c, resistance=z["resistance"], inductance=z["inductance"], dc_resistance=dc["resistance"],
                dc_inductance=dc["inductance"], unknowns=solver.unknowns)


def main():
    cs = coils()
    if len(sys.argv) == 3 and sys.argv[1] == "--one":
        print(json.dumps(solve(cs[int(sys.argv[2])]), indent=1))
        return
    with multiprocessing.Pool(2) as pool:
        rows = pool.map(solve, cs, chunksize=1)
    print(json.dumps({"generator": "tests/reference/cross_section/generate.py",
                      "solver": "libcoil.CrossSectionSolver with subdivision_for at each coil's skin depth",
                      "resistivity_ohm_m": RHO, "coils": rows}, indent=1))


if __name__ == "__main__":
    main()
