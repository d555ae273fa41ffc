#!/usr/bin/python3
"""Writes libcoil/src/studies/srf_screen_envelope.hpp: how far above the design screen's SRF the turn network's can lie.

The design search screens its candidates with the sheath helix's SRF (fast) and confirms the designs it keeps
with the turn network's (the recommended one, a thousand times dearer). The screen may reject a candidate only
where the network's SRF is sure to miss the margin too, so it needs a bound: network <= bound x screen. This
script measures the ratio network / screen on random bare coils of the search's domain (no former: a former
only lowers the network's SRF, tests/cpp/test_turn_network.cpp, so the bare network bounds it, and the search
takes the bare screen's SRF for it), for either mounting, and writes three bounds:

- the envelope: the ratio binned by the turns' spacing p / d (bare d, as Solenoid::pitch_to_wire) and the
  winding's length over its diameter l / D; a bin's bound is the largest ratio in it and its neighbours along
  p / d, times 1.05. It holds wherever the screen's SRF is defined, and it is loose: the ratio moves by a
  quarter inside a bin (the enamel, the gap between the turns, the turns' count);
- the fit: log(network / screen) as a cubic polynomial in five features (the enamel over d, log l/D, log D/d,
  1/N, log of the insulated gap over the insulated d), least squares on the sample, each scaled to
  [-1, 1] over the sample's range; plus, per (N, p / d, l / D) bin, the largest residual in it and its
  neighbours along p / d, plus log 1.02. Fitted on the sample's interior (as the mounted fit below: the
  insulated gap 3 % of the insulated d or more, six turns or more, l / D 0.15 or more): fitted on the whole
  domain, it held on 16 000 fresh coils only to 1.034 of its bound, at two corners (4.5 turns at a gap of
  1.1 %; 4 turns at l / D 0.03). It holds inside the interior's range of every feature and where the screen's
  SRF is the sheath helix's (as in every sampled coil); there the search takes the lesser of the two, and the
  envelope alone elsewhere;
- the former's fit: a former lowers the network's SRF less than the sheath helix's (the wires' field between
  neighbours runs mostly outside it): r = (network on the former / bare) / (helix on the former / bare) lies
  0.96 .. 1.29. log r as a cubic in eight features (the five and the former's permittivity, log of its wall over
  D, its fill), with offsets as above but a margin of 1.05, from a second sample of coils on random formers in
  air. (With 1.02 it held on 2994 fresh coils, but four of 32 000 more lay above it, by up to 2.2 %: short
  windings on thin enamel at D/d 90 ... 120 and a permittivity of 3 ... 4.5, and one of 40 turns.) The search
  bounds the network on a former by the bare bound times the lesser of 1 and the helix's own ratio times r's
  bound (the confirmation's first check takes r's bound on the bare network, without the former's charge solve);
- the mounted fit: log(network on the former / helix on the former), the ratio the screen needs on a former,
  as a cubic in the former's eight features with offsets as above, from a third sample of coils on random
  formers in air, kept to the interior of the domain (the insulated gap 3 % of the insulated d or more, six
  turns or more, l / D 0.15 or more), whose corners the cubic follows badly: fitted on the whole domain it
  held on fresh coils only to 1.03 of its bound. The search takes it where it holds, in place of the two bounds
  above and the bare coil's second sheath-helix solve they need: each bound carries its own bins' largest
  residual and margin, and their product sat 9 ... 11 % above the network on the dense grid's designs, where
  the mounted fit sits about 4 % above it (the median over the close-wound coils of the test).

The bounds are measured maxima, not proven ones: the test (tests/python/test_design_screen.py) draws fresh
coils with other seeds and finds none above them (measured on 2026-12-05: on 16 000 fresh bare coils at most
0.994 of the bound, on 55 900 fresh coils on formers at most 0.993 of r's, on 17 780 fresh mounted coils in the
fit's range at most 0.994 of the mounted bound). Larger samples find rare coils above the bare and mounted
bounds: on 24 000 more bare coils (seed 505) two, by 0.3 % and 0.1 % (D/d 4.1 and 4.3, spaced six wire
diameters, l/D 13 and 61); of 17 652 more mounted coils in the fit's range (seed 404) one, by 0.7 % (D/d 7.2,
an insulated gap of 3.2 %, a wall of 0.38 D). A margin of 1.03 for both fits covers them, but it let 13 more
of the dense grid's ranked designs through to the network and made its design call about 10 % slower; it was
not taken. A coil above its bound would make the search pass
over a design the network accepts: a worse design, never a wrong verdict, since every kept design is confirmed. (The same envelope taken with a former on both sides did
not hold on fresh coils: up to 1.16 of its bound on long grounded coils, where the network takes the former's
shift from the sheath helix.)

The domain: wire 0.3 .. 2 mm bare, bare (two in five) or with an enamel of up to 8 % of d each side; mean
diameter 8 .. 58 mm; insulated p / d 1.01 .. 6 (log-uniform); 2 .. 62 turns in quarters (more of them short).
Formers: permittivity 2 .. 5, wall 0.5 .. 5 mm (at most 0.45 of the form's diameter), a tube (three in five) or
ribs filling 0.1 .. 0.6 of the circumference.

Run:  PYTHONPATH=build/python /usr/bin/python3 tools/srf_screen_envelope.py > libcoil/src/studies/srf_screen_envelope.hpp
      (about four and a half minutes on two cores)
      ... tools/srf_screen_envelope.py --sample SEED COUNT [former|mounted]   (prints the rows of COUNT coils as JSON)
"""
import json
import math
import multiprocessing
import pathlib
import random
import re
import sys

import numpy as np

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parent))
import polynomial_fit  # noqa: E402  (tools/, beside this script)

import libcoil

SPACING_EDGES = (1.1, 1.25, 1.5, 2, 3, 4.5)  # p / d; the last bin is open above
LENGTH_EDGES = (0.3, 1, 3)                  # l / D; the last bin is open above
TURNS_EDGES = (4, 8, 16)                    # N, the fit's offsets only; the last bin is open above
MARGIN = 1.05                               # the envelope's, on its bins' peaks
FIT_MARGIN = 1.02                           # the fits', on their bins' largest residuals (see the docstring)
FORMER_FIT_MARGIN = 1.05                    # the former's fit's (see the docstring)
MIN_NEAR = 100                              # the fewest samples in a bin's neighbourhood for the fit to be taken there
NO_FIT = 9.0                                # the offset of a bin without them: e^9, never below the envelope
DEGREE = 3
MOUNTINGS = ("floating", "grounded-end")
# (Not log p/d as well: with the enamel and the gap it fixes p / d, and the cubic's columns in all six were
# nearly dependent, condition 1e8 and coefficients of 1e4; without it, 3e4 and 25.)
FEATURES = ("enamel/d", "log l/D", "log D/d", "1/N", "log gap")
FORMER_FEATURES = FEATURES + ("permittivity", "log wall/D", "fill")
SAMPLE_SEED, SAMPLE_COUNT = 11, 40000
FORMER_SEED, FORMER_COUNT = 7, 16000
MOUNTED_SEED, MOUNTED_COUNT = 17, 48000  # drawn; the fit takes those of its interior (about 35 000)
MOUNTED_GAP, MOUNTED_TURNS, MOUNTED_LENGTH = 0.03, 6, 0.15  # the interior: gap, N and l / D at least these
CHECK_ROWS = 12  # rows of the sample whose bounds the header carries, for the C++ test


def draw(rng):
    d = 0.3e-3 + 1.7e-3 * rng.random()
    enamel = 0.0 if rng.random() < 0.4 else d * 0.08 * rng.random()
    mean = 8e-3 + 50e-3 * rng.random()
    pitch = (d + 2 * enamel) * math.exp(math.log(1.01) + rng.random() * (math.log(6) - math.log(1.01)))
    turns = max(2.0, round(4 * (2 + 60 * rng.random() * rng.random())) / 4)
    mounting = MOUNTINGS[rng.random() < 0.5]
    return d, enamel, mean, pitch, turns, mounting


def draw_former(rng):
    """A coil and a former under it: (coil, permittivity, wall, fill)."""
    coil = draw(rng)
    return coil, 2 + 3 * rng.random(), (0.5 + 4.5 * rng.random()) * 1e-3, 1.0 if rng.random() < 0.6 else 0.1 + 0.5 * rng.random()


def screen_frequency(r):
    """The screen's SRF: the sheath helix where it holds, else Medhurst's (self_resonance.hpp's fast path)."""
    return (r.helical_line if r.helical_line.available else r.medhurst).frequency


def solenoid(coil):
    d, enamel, mean, pitch, turns, _ = coil
    try:
        return libcoil.Solenoid(mean_diameter=mean, turns=turns, pitch=pitch, wire=libcoil.Wire(diameter=d, insulation=enamel))
    except libcoil.InputError:
        return None


def ratios(coil):
    """(p / d, enamel / d, l / D, D / d, N, mounting, by the helix, network / screen), bare, or None."""
    d, enamel, mean, pitch, turns, mounting = coil
    s = solenoid(coil)
    if s is None:
        return None
    bare = libcoil.self_resonance(s, libcoil.inductance(s).recommended, mounting=mounting)
    if bare.network is None:
        return None
    return (pitch / d, enamel / d, s.winding_length / mean, mean / d, turns, mounting, bool(bare.helical_line.available),
            bare.network.frequency / screen_frequency(bare))


def on_former(job, ratio, bare_too):
    """A former row, (p / d, enamel / d, l / D, D / d, N, mounting, True, ratio, permittivity, wall / D, fill), with
    ratio(bare, on) of the coil's self-resonances without the former (None unless `bare_too`) and with it; None
    where a model it needs is missing."""
    coil, permittivity, wall, fill = job
    d, enamel, mean, pitch, turns, mounting = coil
    s = solenoid(coil)
    if s is None:
        return None
    wall = min(wall, 0.45 * s.form_diameter)
    inductance = libcoil.inductance(s).recommended
    bare = libcoil.self_resonance(s, inductance, mounting=mounting) if bare_too else None
    on = libcoil.self_resonance(s, inductance, former_permittivity=permittivity, former_wall=wall, former_fill=fill, mounting=mounting)
    if any(r.network is None or not r.helical_line.available for r in (bare, on) if r is not None):
        return None
    return (pitch / d, enamel / d, s.winding_length / mean, mean / d, turns, mounting, True, ratio(bare, on), permittivity,
            wall / mean, fill)


def former_ratios(job):
    """As ratios(), with r = (network on the former / bare) / (helix on the former / bare) for the ratio, and
    the former's permittivity, wall / D and fill after it; or None where either model is missing."""
    return on_former(job, lambda bare, on: (on.network.frequency / bare.network.frequency) /
                     (on.helical_line.frequency / bare.helical_line.frequency), True)


def mounted_ratios(job):
    """As former_ratios(), with network / helix on the former for the ratio; or None where either is missing."""
    return on_former(job, lambda bare, on: on.network.frequency / on.helical_line.frequency, False)


def interior(row):
    """Whether a mounted row lies in the mounted fit's interior (MOUNTED_GAP, MOUNTED_TURNS, MOUNTED_LENGTH)."""
    return row[0] / (1 + 2 * row[1]) - 1 >= MOUNTED_GAP and row[4] >= MOUNTED_TURNS and row[2] >= MOUNTED_LENGTH


def bin_of(value, edges):
    return sum(value >= e for e in edges)


def sample(seed, count, processes=1, former=False, mounted=False):
    """The rows of `count` coils (bare, on formers with r, or on formers with network / helix where `mounted`)."""
    rng = random.Random(seed)
    out = []
    pool = multiprocessing.Pool(processes) if processes > 1 else None  # (a test loads this file by path: no pool)
    while len(out) < count:
        jobs = [(draw_former if former or mounted else draw)(rng) for _ in range(count - len(out))]
        work = mounted_ratios if mounted else former_ratios if former else ratios
        out += [r for r in (pool.map(work, jobs, chunksize=32) if pool else map(work, jobs)) if r is not None]
    if pool:
        pool.close()
    return out


def features(row):
    """The bare fit's features of a row (FEATURES), and the former's after them where the row has them."""
    spacing, coat, length, diameter, turns = row[:5]
    x = (coat, math.log(length), math.log(diameter), 1 / turns, math.log(spacing / (1 + 2 * coat) - 1))
    return x + (row[8], math.log(row[9]), row[10]) if len(row) > 8 else x


def powers(count):
    return polynomial_fit.powers(count, DEGREE)


def monomials(x, low, high):
    return polynomial_fit.monomials(x, low, high, DEGREE)


def envelope(rows):
    """bound[mounting][spacing bin][length bin]."""
    n_s, n_l = len(SPACING_EDGES) + 1, len(LENGTH_EDGES) + 1
    table = {}
    for m in MOUNTINGS:
        peak = [[0.0] * n_l for _ in range(n_s)]
        for row in rows:
            if row[5] == m:
                i, j = bin_of(row[0], SPACING_EDGES), bin_of(row[2], LENGTH_EDGES)
                peak[i][j] = max(peak[i][j], row[7])
        bound = [[0.0] * n_l for _ in range(n_s)]
        for j in range(n_l):
            column_peak = max(peak[i][j] for i in range(n_s))
            for i in range(n_s):
                near = max(peak[k][j] for k in range(max(0, i - 1), min(n_s, i + 2)))
                # An empty neighbourhood takes the largest of its length class.
                bound[i][j] = round(MARGIN * (near if near > 0 else column_peak), 3)
        table[m] = bound
    return table


def fit(rows, margin=FIT_MARGIN):
    """(low, high, {mounting: (coefficients, offset[turns bin][spacing bin][length bin])}): log ratio <= poly + offset."""
    x = np.array([features(r) for r in rows])
    low, high = x.min(axis=0).tolist(), x.max(axis=0).tolist()
    n_t, n_s, n_l = len(TURNS_EDGES) + 1, len(SPACING_EDGES) + 1, len(LENGTH_EDGES) + 1
    out = {}
    for m in MOUNTINGS:
        mine = [r for r in rows if r[5] == m]
        a = np.array([monomials(features(r), low, high) for r in mine])
        y = np.log([r[7] for r in mine])
        coefficients = np.linalg.lstsq(a, y, rcond=None)[0]
        residual = y - a @ coefficients
        peak = np.full((n_t, n_s, n_l), -np.inf)
        count = np.zeros((n_t, n_s, n_l), dtype=int)
        for r, e in zip(mine, residual):
            k, i, j = bin_of(r[4], TURNS_EDGES), bin_of(r[0], SPACING_EDGES), bin_of(r[2], LENGTH_EDGES)
            peak[k, i, j] = max(peak[k, i, j], e)
            count[k, i, j] += 1
        offset = [[[NO_FIT] * n_l for _ in range(n_s)] for _ in range(n_t)]
        for k in range(n_t):
            for i in range(n_s):
                for j in range(n_l):
                    near = slice(max(0, i - 1), i + 2)
                    if count[k, near, j].sum() >= MIN_NEAR:
                        offset[k][i][j] = round(float(peak[k, near, j].max()) + math.log(margin), 4)
        out[m] = (coefficients.tolist(), offset)
    return low, high, out


def read_header(text):
    """The header's numbers, for the test: {name: list of numbers (flattened)}."""
    out = {}
    for name, body in re.findall(r"double (\w+)(?:\[\w+(?: - 1)?\])+ = \{(.*?)\};", text, re.S):
        out[name] = [float(v) for v in re.findall(r"[-+]?\d[\d.]*(?:e[-+]?\d+)?", body)]
    return out


def fitted(name, kind, row, header):
    """exp(the fit `kind` of mounting `name` at a row, plus its bin's offset), or None outside its range."""
    x = features(row)
    low, high = header[kind + "_low"], header[kind + "_high"]
    if not all(lo <= v <= hi for v, lo, hi in zip(x, low, high)):
        return None
    n_s, n_l = len(SPACING_EDGES) + 1, len(LENGTH_EDGES) + 1
    cell = (bin_of(row[4], TURNS_EDGES) * n_s + bin_of(row[0], SPACING_EDGES)) * n_l + bin_of(row[2], LENGTH_EDGES)
    poly = sum(c * t for c, t in zip(header[f"{name}_{kind}_fit"], monomials(x, low, high)))
    return math.exp(poly + header[f"{name}_{kind}_offset"][cell])


def bound(row, header):
    """The bound on network / screen the search takes for a bare row (read_header's numbers): the envelope,
    or the lesser of it and the fit's inside the fit's range, where the screen is the sheath helix."""
    name = "grounded" if row[5] == "grounded-end" else "floating"
    b = header[name][bin_of(row[0], SPACING_EDGES) * (len(LENGTH_EDGES) + 1) + bin_of(row[2], LENGTH_EDGES)]
    f = fitted(name, "bare", row, header) if row[6] else None
    return b if f is None else min(b, f)


def former_bound(row, header):
    """The bound on r for a former row, or None outside the former fit's range."""
    return fitted("grounded" if row[5] == "grounded-end" else "floating", "former", row, header)


def mounted_bound(row, header):
    """The bound on network / helix for a mounted row, or None outside the mounted fit's range."""
    return fitted("grounded" if row[5] == "grounded-end" else "floating", "mounted", row, header)


def cxx(values, fmt, indent="     "):
    """A C++ initialiser of nested lists, the innermost on a line each."""
    if not isinstance(values[0], (list, tuple)):
        return "{" + ", ".join(fmt(v) for v in values) + "}"
    return "{" + (",\n" + indent).join(cxx(v, fmt, indent + " ") for v in values) + "}"


def cxx_list(values, fmt, per_line=3):
    """A long C++ list, per_line values a line."""
    return "{" + ",\n     ".join(", ".join(fmt(v) for v in values[i:i + per_line]) for i in range(0, len(values), per_line)) + "}"


def header_text(table, fits):
    g = lambda v: f"{v:.17g}"
    out = ["// Generated by tools/srf_screen_envelope.py; do not edit. The turn network's SRF over the design screen's",
           f"// (the sheath helix's, else Medhurst's), at most: measured on {SAMPLE_COUNT} random bare coils of the search's",
           "// domain. The envelope: a bin's largest ratio and its neighbours' along p / d, times 1.05. The bare fit:",
           "// log(ratio) as a cubic in five scaled features, plus the largest residual in a bin (by N, p / d and l / D) and",
           f"// its neighbours' along p / d, plus log {FIT_MARGIN:g}; fitted on the sample's interior (the insulated gap 3 % of the",
           "// insulated d or more, 6 turns or more, l / D 0.15 or more), taken inside its range where the screen is the helix.",
           f"// The former's fit: the same for r, the former's shift of the network over the helix's ({FORMER_COUNT} coils on",
           f"// random formers), with log {FORMER_FIT_MARGIN:g} for log {FIT_MARGIN:g}. The mounted fit: the same for the network over the",
           f"// helix on the former ({MOUNTED_COUNT} coils on random formers drawn, those of the interior taken). The script",
           "// says how.",
           "#pragma once", "", "namespace libcoil::detail::srf_screen_envelope {", "",
           f"inline constexpr int spacing_bins = {len(SPACING_EDGES) + 1}, length_bins = {len(LENGTH_EDGES) + 1}, turns_bins = {len(TURNS_EDGES) + 1};",
           "inline constexpr double spacing_edges[spacing_bins - 1] = {" + ", ".join(f"{e:g}" for e in SPACING_EDGES) + "};  // p / d",
           "inline constexpr double length_edges[length_bins - 1] = {" + ", ".join(f"{e:g}" for e in LENGTH_EDGES) + "};  // l / D",
           "inline constexpr double turns_edges[turns_bins - 1] = {" + ", ".join(f"{e:g}" for e in TURNS_EDGES) + "};  // N"]
    for m in MOUNTINGS:
        out.append(f"// {m}: [p / d bin][l / D bin]")
        out.append(f"inline constexpr double {m.replace('-end', '')}[spacing_bins][length_bins] = {cxx(table[m], lambda v: f'{v:.3f}')};")
    written = {}  # the powers' table of each feature list, written once
    for kind, names in (("bare", FEATURES), ("former", FORMER_FEATURES), ("mounted", FORMER_FEATURES)):
        low, high, per_mounting = fits[kind]
        terms = powers(len(names))
        out += ["", f"// The {kind} fit's features: {', '.join(names)} (gap: p over the insulated d, less 1);",
                "// each scaled to [-1, 1] over low .. high, the sample's range, outside which the fit is not taken.",
                f"inline constexpr int {kind}_features = {len(names)}, {kind}_terms = {len(terms)};",
                f"inline constexpr double {kind}_low[{kind}_features] = {cxx_list(low, g)};",
                f"inline constexpr double {kind}_high[{kind}_features] = {cxx_list(high, g)};",
                "// The monomials' powers of the scaled features, in the order of the coefficients."]
        if names in written:
            out.append(f"inline constexpr const unsigned char (&{kind}_powers)[{kind}_terms][{kind}_features] = {written[names]}_powers;")
        else:
            written[names] = kind
            out.append(f"inline constexpr unsigned char {kind}_powers[{kind}_terms][{kind}_features] = {cxx_list(terms, lambda t: cxx(t, str), 8)};")
        for m in MOUNTINGS:
            name = m.replace("-end", "")
            coefficients, offset = per_mounting[m]
            out.append(f"// {m}: the coefficients, and the offsets [N bin][p / d bin][l / D bin] added to the polynomial")
            out.append(f"// ({NO_FIT:g}: fewer than {MIN_NEAR} samples near, the fit not taken)")
            out.append(f"inline constexpr double {name}_{kind}_fit[{kind}_terms] = {cxx_list(coefficients, g, 5)};")
            out.append(f"inline constexpr double {name}_{kind}_offset[turns_bins][spacing_bins][length_bins] = {cxx(offset, lambda v: f'{v:.4f}')};")
    return "\n".join(out)


def main():
    if len(sys.argv) in (4, 5) and sys.argv[1] == "--sample":
        kind = sys.argv[4] if len(sys.argv) == 5 else ""
        print(json.dumps(sample(int(sys.argv[2]), int(sys.argv[3]), former=kind == "former", mounted=kind == "mounted")))
        return
    rows = sample(SAMPLE_SEED, SAMPLE_COUNT, processes=2)
    former_rows = sample(FORMER_SEED, FORMER_COUNT, processes=2, former=True)
    mounted_rows = [r for r in sample(MOUNTED_SEED, MOUNTED_COUNT, processes=2, mounted=True) if interior(r)]
    bare_interior = [r for r in rows if interior(r)]
    text = header_text(envelope(rows), {"bare": fit(bare_interior), "former": fit(former_rows, FORMER_FIT_MARGIN), "mounted": fit(mounted_rows)})
    # A few rows' bounds as this script computes them from the numbers above, for the C++ test to reproduce.
    header = read_header(text)
    g = lambda v: f"{v:.17g}"
    checks = [[*r[:5], float(r[5] == "grounded-end"), float(r[6]), bound(r, header)] for r in rows[:CHECK_ROWS]]
    former_checks = [[*r[:5], float(r[5] == "grounded-end"), *r[8:], former_bound(r, header) or 0.0] for r in former_rows[:CHECK_ROWS]]
    mounted_checks = [[*r[:5], float(r[5] == "grounded-end"), *r[8:], mounted_bound(r, header) or 0.0] for r in mounted_rows[:CHECK_ROWS]]
    print(text)
    print("\n// Checks: p / d, enamel / d, l / D, D / d, N, grounded, by the helix, and the bound this script computes;")
    print("// for the former: p / d, enamel / d, l / D, D / d, N, grounded, permittivity, wall / D, fill, and r's bound (0: none);")
    print("// mounted: the same, and the bound on network / helix on the former.")
    print(f"inline constexpr int check_rows = {CHECK_ROWS};")
    print(f"inline constexpr double checks[check_rows][8] = {cxx(checks, g)};")
    print(f"inline constexpr double former_checks[check_rows][10] = {cxx(former_checks, g)};")
    print(f"inline constexpr double mounted_checks[check_rows][10] = {cxx(mounted_checks, g)};")
    print("\n}  // namespace libcoil::detail::srf_screen_envelope")


if __name__ == "__main__":
    main()
