#!/usr/bin/env python3
"""The cached finite-element set (tests/reference/fem/fem.json): coils of round bare copper wire, close-wound
and spaced, bare and inside a coaxial copper tube (an open shield), each at 100 kHz, 1, 10 and 30 MHz, by
fem.py (gmsh and getdp). Each entry holds the geometry, the shield (or null), the frequency and the FEM's R
and L (the rings in series, closed; a shield's eddy loss is part of R).

Run:  /usr/bin/python3 tests/reference/fem/generate.py > tests/reference/fem/fem.json   (hours on 2 cores)
      /usr/bin/python3 tests/reference/fem/generate.py --keep tests/reference/fem/fem.json [--below F]
          [--only NAME@F,...] > new.json
          (reuses the points already in a cache; the others, up to F Hz or just those listed, are computed)
      /usr/bin/python3 tests/reference/fem/generate.py --one 0   (one coil at its lowest frequency, for the test)
Each point is also appended to fem.partial.jsonl as it finishes, and a point getdp fails on is left out
with a message on stderr (Debian's getdp 3.5 died with SIGSEGV on close-10 at 30 MHz, after two hours of
the set's run, once: the reason to keep what is done).
"""
import json
import math
import multiprocessing
import sys

import fem

# (name, mean radius, wire radius, turns, pitch, shield), SI; shield = (bore radius, wall, length) of copper.
COILS = [
    ("close-5", 10e-3, 0.5e-3, 5, 1.1e-3, None),
    ("close-12-fine", 5e-3, 0.25e-3, 12, 0.6e-3, None),
    ("close-10", 8e-3, 0.4e-3, 10, 0.88e-3, None),
    ("demo-like-18", 13.15e-3, 0.645e-3, 18, 1.9e-3, None),
    ("spaced-8", 10e-3, 0.5e-3, 8, 2.5e-3, None),
    ("spaced-6", 15e-3, 0.5e-3, 6, 4e-3, None),
    ("close-5-in-tube", 10e-3, 0.5e-3, 5, 1.1e-3, (16e-3, 0.2e-3, 40e-3)),
    ("close-10-in-tube", 8e-3, 0.4e-3, 10, 0.88e-3, (16e-3, 0.5e-3, 36e-3)),
    ("demo-like-18-in-foil", 13.15e-3, 0.645e-3, 18, 1.9e-3, (20e-3, 0.035e-3, 60e-3)),
]
FREQUENCIES = (1e5, 1e6, 1e7, 3e7)


def entry(job, wall=3, timeout=5400):
    coil, f = job
    name, a, r, n, p, tube = coil
    z = fem.impedance(a, r, n, p, f, tube=tube, wall=wall, timeout=timeout)
    shield = None if tube is None else {"bore_radius": tube[0], "wall": tube[1], "length": tube[2], "conductivity_S_per_m": fem.COPPER}
    return {"name": name, "mean_radius": a, "wire_radius": r, "turns": n, "pitch": p, "shield": shield, "frequency": f,
            "resistance": z.real, "inductance": z.imag / (2 * math.pi * f), "mesh_per_skin_depth": wall}


def attempt(job):
    # Debian's getdp 3.5 dies with SIGSEGV on the biggest meshes (close-10, spaced-8 and demo-like-18 at
    # 30 MHz with skin depth / 3 at the wires); those are retried at skin depth / 2, which on close-5 at
    # 30 MHz moved R by +0.008 % and L by +0.0002 % (the entry records the mesh). On close-5-in-tube at 10 MHz
    # getdp's direct solve at skin depth / 3 (1.74 M unknowns) did not finish in 33 CPU-minutes, where skin
    # depth / 2 (1.37 M) took 100 s: the finer mesh gets half an hour before the retry.
    failure = ""
    for wall, timeout in ((3, 1800), (2, 5400)):
        try:
            return job, entry(job, wall, timeout)
        except Exception as e:  # noqa: BLE001 - a getdp crash leaves this point out, not the set
            failure = str(e)
    return job, failure


def main():
    if len(sys.argv) == 3 and sys.argv[1] == "--one":
        print(json.dumps(entry((COILS[int(sys.argv[2])], FREQUENCIES[0])), indent=1))
        return
    kept = {}
    below = float("inf")
    args = sys.argv[1:]
    if "--below" in args:
        below = float(args[args.index("--below") + 1])
    if "--keep" in args:
        for p in json.load(open(args[args.index("--keep") + 1]))["points"]:
            kept[(p["name"], p["frequency"])] = p
    jobs = [(c, f) for c in COILS for f in FREQUENCIES]
    todo = [j for j in jobs if (j[0][0], j[1]) not in kept and j[1] <= below]
    if "--only" in args:  # name@frequency,...: just these points
        wanted = {(w.split("@")[0], float(w.split("@")[1])) for w in args[args.index("--only") + 1].split(",")}
        todo = [j for j in todo if (j[0][0], j[1]) in wanted]
    done = {}
    with multiprocessing.Pool(2) as pool, open("fem.partial.jsonl", "a") as partial:
        for (c, f), result in pool.imap_unordered(attempt, todo, chunksize=1):
            if isinstance(result, str):
                print(f"{c[0]} at {f:g} Hz failed: {result}", file=sys.stderr)
                continue
            done[(c[0], f)] = result
            partial.write(json.dumps(result) + "\n")
            partial.flush()
    rows = []
    for c, f in jobs:
        row = kept.get((c[0], f)) or done.get((c[0], f))
        if row is None:
            continue
        row.setdefault("shield", None)
        row.setdefault("mesh_per_skin_depth", 3)
        rows.append({k: row[k] for k in ("name", "mean_radius", "wire_radius", "turns", "pitch", "shield", "frequency",
                                         "resistance", "inductance", "mesh_per_skin_depth")})
    print(json.dumps({"generator": "tests/reference/fem/generate.py", "solver": "gmsh + getdp (Debian), axisymmetric a-v, "
                      "second-order hierarchical elements, skin depth / 3 at the conductors, shell to infinity",
                      "conductivity_S_per_m": fem.COPPER, "points": rows}, indent=1))


if __name__ == "__main__":
    main()
