#!/usr/bin/env python3
"""NEC2 reference for the self-resonance of free-standing and grounded-end helices (tests/reference/nec2/srf.json).

NEC2 is a general method-of-moments wire solver (Debian's nec2c), used here as the outside reference. Each
coil of the set is a GH helix of round wire in free space:
- floating: the open helix fed at its centre segment; the first zero crossing of X (rising) is the
  natural half-wave resonance, the coil's self-resonance between its two free ends;
- grounded end: the helix standing on a perfect ground plane (GN 1), its first segment touching the plane,
  fed there; the first zero crossing of X is the quarter-wave resonance, the SRF with one end grounded.
The extended thin-wire kernel (EK) is on, as the segments are short. NEC's own convergence is kept: each
resonance is found at 16 and at 32 segments a turn, and the two are Richardson-extrapolated (NEC's
segmentation error falls as the square of the segment length here: measured ratio 3.9 for the first coil),
so each entry holds f16, f32 and the extrapolated f.

Run:  /usr/bin/python3 tests/reference/nec2/generate.py > tests/reference/nec2/srf.json   (about 20 minutes)
      /usr/bin/python3 tests/reference/nec2/generate.py --one 0   (one coil, for the test that proves the cache)
"""
import json
import os
import re
import subprocess
import sys
import tempfile

# The set: (name, mean diameter, turns, pitch, wire diameter), SI. l/D from 0.4 to 15, pitch / wire from 2 to 8.
COILS = [
    ("short-wide", 50e-3, 5, 4e-3, 1e-3),
    ("short", 30e-3, 6, 3e-3, 1e-3),
    ("square", 20e-3, 10, 2e-3, 1e-3),
    ("l-over-d-1-p8", 20e-3, 5, 4e-3, 0.5e-3),
    ("medium", 20e-3, 10, 6e-3, 1e-3),
    ("medium-p3", 16e-3, 16, 3e-3, 1e-3),
    ("long-p5", 12e-3, 20, 5e-3, 1e-3),
    ("long-p2", 10e-3, 30, 2e-3, 1e-3),
    ("long", 10e-3, 25, 4e-3, 0.5e-3),
    ("very-long", 8e-3, 30, 4e-3, 1e-3),
    ("thin-wire", 24e-3, 12, 3e-3, 0.4e-3),
    ("fat-wire", 24e-3, 8, 6e-3, 2e-3),
]
SEGMENTS = (16, 32)


def deck(coil, mounting, segments_per_turn, frequency):
    _, d, n, p, w = coil
    a, segs = d / 2, int(round(n * segments_per_turn))
    geometry = f"GH 1 {segs} {p:.9g} {n * p:.9g} {a:.9g} {a:.9g} {a:.9g} {a:.9g} {w / 2:.9g}\n"
    if mounting == "floating":
        body = geometry + "GE 0\nEK\n" + f"EX 0 1 {segs // 2 + 1} 0 1.0 0.0\n"
    else:
        body = geometry + "GE 1\nGN 1\nEK\n" + "EX 0 1 1 0 1.0 0.0\n"
    return "CM libcoil self-resonance reference\nCE\n" + body + f"PT -1\nFR 0 1 0 0 {frequency / 1e6:.12g} 0\nXQ\nEN\n"


def reactance_of_deck(text):
    """X at the feed (ohm) of one NEC2 deck run by nec2c."""
    with tempfile.TemporaryDirectory() as tmp:
        inp, out = os.path.join(tmp, "c.nec"), os.path.join(tmp, "c.out")
        with open(inp, "w") as fh:
            fh.write(text)
        subprocess.run(["nec2c", "-i", inp, "-o", out], check=True, timeout=3600, capture_output=True)
        text = open(out).read()
    row = re.search(r"ANTENNA INPUT PARAMETERS.*?\n.*?\n.*?\n\s+\d+\s+\d+((?:\s+\S+){8})", text, re.S)
    return float(row.group(1).split()[5])


def reactance(coil, mounting, segments_per_turn, frequency):
    return reactance_of_deck(deck(coil, mounting, segments_per_turn, frequency))


def first_rising_zero(x_of, start, step, what):
    """The first rising zero of X(f) above `start` (where X is still negative, capacitive): a scan up in
    steps of `step` to the first sign change, then regula falsi in that bracket (to 1e-5)."""
    lo, x_lo = start, x_of(start)
    if not x_lo < 0:
        raise RuntimeError(f"{what}: X is not capacitive at the scan's start, {start:.4g} Hz")
    for _ in range(200):
        hi = lo * step
        x_hi = x_of(hi)
        if x_hi >= 0:
            break
        lo, x_lo = hi, x_hi
    for _ in range(40):  # regula falsi (Illinois), kept in the bracket
        f = hi - x_hi * (hi - lo) / (x_hi - x_lo)
        x = x_of(f)
        if x < 0:
            lo, x_lo = f, x
            x_hi /= 2
        else:
            hi, x_hi = f, x
            x_lo /= 2
        if hi - lo < 1e-5 * f:
            break
    return 0.5 * (lo + hi)


def first_resonance(coil, mounting, segments_per_turn, start, step=1.06):
    return first_rising_zero(lambda f: reactance(coil, mounting, segments_per_turn, f), start, step, f"{coil[0]} {mounting}")


def reference(coil, guess_floating):
    out = {"name": coil[0], "mean_diameter": coil[1], "turns": coil[2], "pitch": coil[3], "wire_diameter": coil[4]}
    for mounting, start in (("floating", 0.25 * guess_floating), ("grounded-end", 0.12 * guess_floating)):
        f = {}
        for s in SEGMENTS:
            # The finer segmentation resonates a little lower (NEC converges from above): scan from below.
            f[s] = first_resonance(coil, mounting, s, start if not f else 0.9 * f[SEGMENTS[0]], 1.06 if not f else 1.01)
        # Richardson: error ~ h^2, h = 1 / segments a turn.
        ratio = (SEGMENTS[1] / SEGMENTS[0]) ** 2
        extrapolated = (ratio * f[SEGMENTS[1]] - f[SEGMENTS[0]]) / (ratio - 1)
        out[mounting] = {"f16": f[16], "f32": f[32], "f": extrapolated}
    return out


def guess(coil):
    """A first guess for the floating SRF: the wire's half-wave frequency (within 2x of the SRF)."""
    import math
    _, d, n, p, _ = coil
    wire = n * math.hypot(math.pi * d, p)
    return 299792458.0 / (2 * wire)


def main():
    if len(sys.argv) == 3 and sys.argv[1] == "--one":
        coil = COILS[int(sys.argv[2])]
        print(json.dumps(reference(coil, guess(coil)), indent=1))
        return
    rows = [reference(c, guess(c)) for c in COILS]
    print(json.dumps({"generator": "tests/reference/nec2/generate.py", "solver": "nec2c (Debian), EK, GH helix",
                      "segments_per_turn": list(SEGMENTS), "coils": rows}, indent=1))


if __name__ == "__main__":
    main()
