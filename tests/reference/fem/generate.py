#!/usr/bin/env python3
"""The cached finite-element set (tests/reference/fem/fem.json): coils of round bare copper wire, close-wound
and spaced, each at 100 kHz, 1 MHz and 10 MHz, by fem.py (gmsh and getdp). Each entry holds the geometry, the
frequency and the FEM's R and L, and the mesh's refinement check where one was run.

Run:  /usr/bin/python3 tests/reference/fem/generate.py > tests/reference/fem/fem.json   (some minutes)
      /usr/bin/python3 tests/reference/fem/generate.py --one 0   (one coil at its lowest frequency, for the test)
"""
import json
import math
import sys

import fem

# (name, mean radius, wire radius, turns, pitch), SI.
COILS = [
    ("close-5", 10e-3, 0.5e-3, 5, 1.1e-3),
    ("close-12-fine", 5e-3, 0.25e-3, 12, 0.6e-3),
    ("close-10", 8e-3, 0.4e-3, 10, 0.88e-3),
    ("demo-like-18", 13.15e-3, 0.645e-3, 18, 1.9e-3),
    ("spaced-8", 10e-3, 0.5e-3, 8, 2.5e-3),
    ("spaced-6", 15e-3, 0.5e-3, 6, 4e-3),
]
FREQUENCIES = (1e5, 1e6, 1e7)


def entry(coil, f):
    name, a, r, n, p = coil
    z = fem.impedance(a, r, n, p, f)
    return {"name": name, "mean_radius": a, "wire_radius": r, "turns": n, "pitch": p, "frequency": f,
            "resistance": z.real, "inductance": z.imag / (2 * math.pi * f)}


def main():
    if len(sys.argv) == 3 and sys.argv[1] == "--one":
        print(json.dumps(entry(COILS[int(sys.argv[2])], FREQUENCIES[0]), indent=1))
        return
    rows = [entry(c, f) for c in COILS for f in FREQUENCIES]
    print(json.dumps({"generator": "tests/reference/fem/generate.py", "solver": "gmsh + getdp (Debian), axisymmetric a-v, "
                      "second-order hierarchical elements, skin depth / 3 at the wires, shell to infinity",
                      "conductivity_S_per_m": fem.COPPER, "points": rows}, indent=1))


if __name__ == "__main__":
    main()
