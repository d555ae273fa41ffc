#!/usr/bin/env python3
"""NEC2 reference for the self-resonance of helices inside a conducting can or tube (tests/reference/nec2/shielded.json).

NEC2 (Debian's nec2c, a method-of-moments wire solver) is the outside reference, as in generate.py beside this
file, whose deck runner and resonance search it shares. Each case is a GH helix of round wire inside a shield
modelled as a wire grid, perfectly conducting like every wire here:
- the wall: `m` axial wires round the circle of radius b, joined by rings (polygons of m chords) at every axial
  node; the nodes are as far apart along the axis as round the circle (square cells of side s = 2 pi b / m);
- an end disc: m spokes from the axis to the wall, cut at the radii of rings drawn between them (b / s of them);
- each grid wire of radius s / (2 pi), the equal-area rule for a wire grid standing in for a solid surface
  (Richmond's rule, quoted from memory); the grid's own convergence is measured below, not assumed.
The mountings:
- floating: the helix free inside a free shield, fed at its centre segment; the first rising zero of X is the
  half-wave resonance between the two free ends;
- grounded end: the can stands on NEC's perfect ground (GN 1), which is its lower end disc, and the helix
  stands on it as in generate.py's grounded set, fed at its first segment: one end of the winding on the
  shield, the quarter-wave resonance.
The standard thin-wire kernel throughout (no EK: the grid's junctions are outside the extended kernel's
validity). Convergence: the resonance is found at 16 and 32 helix segments a turn with a grid of 24 wires
round the circle, and at 16 with a grid of 36; the helix's segmentation is Richardson-extrapolated as in
generate.py, and the grid's refinement from 24 to 36 wires applied as a factor:
  f = (4 f(24, 32) - f(24, 16)) / 3 * f(36, 16) / f(24, 16).
Each entry keeps the three runs and f, and the same helix bare (16 and 32 segments a turn, extrapolated), so
that the shield's shift of the SRF is NEC2's too.

Run:  /usr/bin/python3 tests/reference/nec2/generate_shielded.py > tests/reference/nec2/shielded.json   (about 45 minutes on two cores)
      /usr/bin/python3 tests/reference/nec2/generate_shielded.py --one 0   (one case's coarsest run, for the
      test that proves the cache current)
"""
import json
import math
import multiprocessing
import os
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from generate import first_rising_zero, reactance_of_deck  # noqa: E402

# (name, coil (mean diameter, turns, pitch, wire diameter), shield (inner radius b, length, closed, axial offset of
# its centre from the coil's), mountings), SI. b / a from 1.4 to 3; closed cans, an open tube, an offset can.
CASES = [
    ("medium-can", (20e-3, 10, 6e-3, 1e-3), (20e-3, 100e-3, True, 0.0), ("floating", "grounded-end")),
    ("medium-tight-can", (20e-3, 10, 6e-3, 1e-3), (14e-3, 80e-3, True, 0.0), ("floating",)),
    ("medium-open-tube", (20e-3, 10, 6e-3, 1e-3), (20e-3, 100e-3, False, 0.0), ("floating",)),
    ("long-can", (12e-3, 16, 4.5e-3, 1e-3), (12e-3, 100e-3, True, 0.0), ("floating", "grounded-end")),
    ("short-wide-can", (50e-3, 5, 4e-3, 1e-3), (40e-3, 60e-3, True, 0.0), ("floating", "grounded-end")),
    ("thin-wire-offset-can", (24e-3, 12, 3e-3, 0.4e-3), (18e-3, 70e-3, True, 8e-3), ("floating",)),
    ("medium-wide-can", (20e-3, 10, 6e-3, 1e-3), (30e-3, 120e-3, True, 0.0), ("floating", "grounded-end")),
]
GRIDS = (24, 36)
SEGMENTS = (16, 32)


def ring_points(r, z, m):
    return [(r * math.cos(2 * math.pi * k / m), r * math.sin(2 * math.pi * k / m), z) for k in range(m)]


def shield_wires(b, z_low, z_high, closed, m, on_ground):
    """The grid's wires as (end, end, segments, radius). On the ground (grounded end) the wall stands on z = 0,
    its lower disc the ground itself: no lower ring or disc."""
    cell = 2 * math.pi * b / m
    radius = cell / (2 * math.pi)
    axial = max(2, math.ceil((z_high - z_low) / cell))
    wires = []
    for x, y, _ in ring_points(b, 0, m):
        wires.append(((x, y, z_low), (x, y, z_high), axial, radius))
    for j in range(axial + 1):
        if j == 0 and on_ground:
            continue
        p = ring_points(b, z_low + (z_high - z_low) * j / axial, m)
        wires += [(p[k], p[(k + 1) % m], 1, radius) for k in range(m)]
    if closed:
        rings = max(1, round(b / cell))
        for z in ((z_high,) if on_ground else (z_low, z_high)):
            wires += [((0, 0, z), (x, y, z), rings, radius) for x, y, _ in ring_points(b, z, m)]
            for i in range(1, rings):
                p = ring_points(b * i / rings, z, m)
                wires += [(p[k], p[(k + 1) % m], 1, radius) for k in range(m)]
    return wires


def deck(case, mounting, segments_per_turn, grid, frequency):
    """The case's deck; `grid` None: the helix alone, bare (on the ground where its end is grounded)."""
    _, (d, n, p, w), (b, length, closed, offset), _ = case
    grounded = mounting == "grounded-end"
    segs = int(round(n * segments_per_turn))
    lines = ["CM libcoil self-resonance reference in a shield\nCE\n",
             f"GH 1 {segs} {p:.9g} {n * p:.9g} {d / 2:.9g} {d / 2:.9g} {d / 2:.9g} {d / 2:.9g} {w / 2:.9g}\n"]
    centre = n * p / 2 + offset
    z_low, z_high = (0.0, length) if grounded else (centre - length / 2, centre + length / 2)
    for tag, (a, e, ns, r) in enumerate(shield_wires(b, z_low, z_high, closed, grid, grounded) if grid else [], start=2):
        lines.append(f"GW {tag} {ns} {a[0]:.9g} {a[1]:.9g} {a[2]:.9g} {e[0]:.9g} {e[1]:.9g} {e[2]:.9g} {r:.9g}\n")
    if grounded:
        lines.append("GE 1\nGN 1\nEX 0 1 1 0 1.0 0.0\n")
    else:
        lines.append(f"GE 0\nEX 0 1 {segs // 2 + 1} 0 1.0 0.0\n")
    return "".join(lines) + f"PT -1\nFR 0 1 0 0 {frequency / 1e6:.12g} 0\nXQ\nEN\n"


def resonance(case, mounting, segments_per_turn, grid, start, step):
    return first_rising_zero(lambda f: reactance_of_deck(deck(case, mounting, segments_per_turn, grid, f)), start, step,
                             f"{case[0]} {mounting}")


def first_start(case, mounting):
    """Where the coarsest run's scan starts: a quarter (floating) or an eighth (grounded end) of the wire's
    half-wave frequency, below any shielded SRF of the set."""
    _, (d, n, p, _), _, _ = case
    half_wave = 299792458.0 / (2 * n * math.hypot(math.pi * d, p))
    return (0.25 if mounting == "floating" else 0.12) * half_wave


def coarsest(case, mounting):
    return resonance(case, mounting, SEGMENTS[0], GRIDS[0], first_start(case, mounting), 1.06)


def reference(case):
    name, (d, n, p, w), (b, length, closed, offset), mountings = case
    out = {"name": name, "mean_diameter": d, "turns": n, "pitch": p, "wire_diameter": w,
           "shield": {"inner_diameter": 2 * b, "length": length, "end_discs": closed, "axial_offset": offset}}
    for mounting in mountings:
        coarse = coarsest(case, mounting)
        # The finer runs resonate a little lower (NEC converges from above): scan from just below.
        fine = resonance(case, mounting, SEGMENTS[1], GRIDS[0], 0.97 * coarse, 1.01)
        grid = resonance(case, mounting, SEGMENTS[0], GRIDS[1], 0.97 * coarse, 1.01)
        ratio = (SEGMENTS[1] / SEGMENTS[0]) ** 2
        f = (ratio * fine - coarse) / (ratio - 1) * grid / coarse
        # The same helix bare, by the same kernel and extrapolation: the shield's shift as NEC2 has it.
        bare16 = resonance(case, mounting, SEGMENTS[0], None, 0.7 * coarse, 1.02)
        bare32 = resonance(case, mounting, SEGMENTS[1], None, 0.97 * bare16, 1.01)
        out[mounting] = {"f_24_16": coarse, "f_24_32": fine, "f_36_16": grid, "f": f,
                         "bare": {"f16": bare16, "f32": bare32, "f": (ratio * bare32 - bare16) / (ratio - 1)}}
    return out


def main():
    if len(sys.argv) == 3 and sys.argv[1] == "--one":
        case = CASES[int(sys.argv[2])]
        print(json.dumps({"name": case[0], **{m: {"f_24_16": coarsest(case, m)} for m in case[3]}}, indent=1))
        return
    with multiprocessing.Pool(os.cpu_count()) as pool:  # a case a process; rows in the order of CASES
        rows = pool.map(reference, CASES, chunksize=1)
    print(json.dumps({"generator": "tests/reference/nec2/generate_shielded.py",
                      "solver": "nec2c (Debian), thin-wire kernel, GH helix in a wire-grid shield",
                      "grids": list(GRIDS), "segments_per_turn": list(SEGMENTS), "cases": rows}, indent=1))


if __name__ == "__main__":
    main()
