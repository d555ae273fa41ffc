#!/usr/bin/python3
"""libcoil against the numpy/scipy chain a user would write, side by side in one run (issue 20).

The reference chain, vectorised over coils (numpy and scipy from Debian):
  L     Nagaoka's coefficient from scipy.special.ellipk/ellipe, less Rosa's round-wire correction
        (A = 5/4 - ln(2p/d); B from the closed-form geometric mean distances, cumulative sums over k);
  R_dc  rho(T) N sqrt((pi D)^2 + p^2) / (pi r^2);
  R     R_dc times the exact skin ratio, Re[(kr/2) J0(kr) / J1(kr)] with scipy.special.jv, kr = x e^(-i pi/4);
  SRF   1 / (2 pi sqrt(L C)), C by Medhurst's empirical formula (0.1126 l/D + 0.08 + 0.27 / sqrt(l/D)) pF/cm.
libcoil.evaluate computes the same chain (chain="light") and its full one (chain="full": the recommended L,
R_ac with proximity effect, the recommended SRF's fast path). The script checks that the light chains agree,
then times each at 1, 1e3 and 1e5 coils (the median of interleaved repeats) and prints the ratios; last, the
design search's candidates per second on one and two threads (dense-grid-requirement.yaml beside it: every
band criterion on), through the whole call, split where its progress callback reports the screen's end: the
screen of the grid (what every candidate costs), then what the call pays once whatever the grid (the ranked
designs confirmed with the turn network until one passes, retargeted, and the chosen one analysed); and the
same on that grid at half its steps (four times the candidates). The screen alone is timed by
benchmarks/bench_design.cpp's BM_DesignScreen on the same grid.

Run:  PYTHONPATH=build/python /usr/bin/python3 benchmarks/side_by_side.py
"""
import os
import pathlib
import platform
import statistics
import time

import numpy as np
import scipy.special as sp

import libcoil

MU0 = libcoil.mu0
CU = libcoil.conductor("copper")


def reference_chain(D, N, p, d, f, T):
    a = D / 2
    length = N * p
    rho_ratio = D / length
    m = rho_ratio**2 / (1 + rho_ratio**2)
    k, kc = np.sqrt(m), np.sqrt(1 - m)
    K, E = sp.ellipk(m), sp.ellipe(m)
    nagaoka = 4 / (3 * np.pi * kc) * ((kc**2 / m) * (K - E) + E - k)
    l_sheet = MU0 * np.pi * a**2 * N**2 * nagaoka / length
    A = 1.25 - np.log(2 * p / d)
    kmax = int(np.ceil(N.max()))
    kk = np.arange(1, kmax + 1, dtype=float)
    xlogx = lambda x: np.where(x > 0, x**2 * np.log(np.where(x > 0, x, 1)), 0.0)
    ln_g = (xlogx(kk + 1) + xlogx(kk - 1) - 2 * xlogx(kk)) / 2 - 1.5
    t = np.log(kk) - ln_g
    s0, s1 = np.concatenate([[0], np.cumsum(t)]), np.concatenate([[0], np.cumsum(kk * t)])
    last = np.ceil(N).astype(int) - 1  # pairs k < N
    B = 2 * s0[last] - 2 * s1[last] / N
    L = l_sheet - MU0 * a * N * (A + B)
    rho = CU.resistivity_20 * (1 + CU.temperature_coefficient * (T - 293.15))
    r = d / 2
    r_dc = rho * N * np.sqrt((np.pi * D) ** 2 + p**2) / (np.pi * r**2)
    x = r * np.sqrt(2 * np.pi * f * MU0 / rho)
    kr = x * np.exp(-1j * np.pi / 4)
    skin = (kr / 2 * sp.jv(0, kr) / sp.jv(1, kr)).real
    h = 0.1126 * length / D + 0.08 + 0.27 / np.sqrt(length / D)
    srf = 1 / (2 * np.pi * np.sqrt(L * h * 1e-10 * D))
    return L, r_dc, r_dc * skin, srf


def coils(n, seed=1):
    # Spaced and close-wound coils, 5-40 mm, 3-40 turns, in Rosa's and Medhurst's domains.
    rng = np.random.default_rng(seed)
    d = rng.uniform(0.3e-3, 1.5e-3, n)
    D = rng.uniform(10e-3, 40e-3, n)
    N = np.round(rng.uniform(3, 40, n) * 4) / 4
    p = d * rng.uniform(1.1, 3, n)
    p = np.minimum(p, 0.39 * D / 2)
    N = np.maximum(N, 0.12 * D / p)  # l / D >= 0.12
    f = np.exp(rng.uniform(np.log(1e5), np.log(3e7), n))
    T = np.full(n, 293.15)
    return D, N, p, d, f, T


def agree():
    D, N, p, d, f, T = coils(20000, 2)
    ref = reference_chain(D, N, p, d, f, T)
    ours = libcoil.evaluate(D, N, p, d, frequency=f, temperature=T, chain="light")
    assert np.all(ours["status"] == 0)
    worst = [float(np.max(np.abs(o / r - 1))) for o, r in zip((ours["inductance"], ours["dc_resistance"], ours["resistance"], ours["self_resonance"]), ref)]
    print("agreement of the light chains on 20000 coils (max relative difference): "
          f"L {worst[0]:.1e}, R_dc {worst[1]:.1e}, R {worst[2]:.1e}, SRF {worst[3]:.1e}")
    return worst


def per_coil(fn, n, repeats):
    times = []
    for _ in range(repeats):
        t = time.perf_counter()
        fn()
        times.append(time.perf_counter() - t)
    return statistics.median(times) / n


def main():
    print(f"machine: {platform.machine()}, {os.cpu_count()} cores, {platform.platform()}; numpy {np.__version__}")
    agree()
    print(f"{'coils':>8} {'numpy/scipy':>13} {'light':>10} {'full':>10} {'light x':>9} {'full x':>8}   (per coil; x: the script's time over libcoil's)")
    for n in (1, 1000, 100000):
        D, N, p, d, f, T = coils(n)
        repeats = {1: 2001, 1000: 201, 100000: 9}[n]
        ref, light, full = [], [], []
        for _ in range(3):  # interleaved, so that the machine's state is shared
            ref.append(per_coil(lambda: reference_chain(D, N, p, d, f, T), n, repeats // 3))
            light.append(per_coil(lambda: libcoil.evaluate(D, N, p, d, frequency=f, temperature=T, chain="light"), n, repeats // 3))
            full.append(per_coil(lambda: libcoil.evaluate(D, N, p, d, frequency=f, temperature=T, chain="full"), n, repeats // 3))
        r, l, u = statistics.median(ref), statistics.median(light), statistics.median(full)
        print(f"{n:>8} {r * 1e6:>10.3f} us {l * 1e6:>7.3f} us {u * 1e6:>7.3f} us {r / l:>8.1f}x {r / u:>7.1f}x")
    # The whole call on the dense grid, and on the same bounds at half the steps (four times the candidates),
    # timed from the call to the screen's end (its progress callback's last report, (total, total)) and from
    # there to the return: the screen's share is what the candidates cost, the rest what the call pays once.
    grids = {"dense": libcoil.parse_requirement(DENSE), "denser": libcoil.parse_requirement(DENSER)}
    for threads in (1, 2):
        for name, req in grids.items():
            screens, wholes = [], []
            for _ in range(5):  # the fastest of each, as the machine's slow spells only add
                marks = {}

                def progress(done, total):
                    if done == total:
                        marks["screened"] = time.perf_counter()

                t = time.perf_counter()
                res = libcoil.design(req, threads=threads, top=1, progress=progress)
                end = time.perf_counter()
                screens.append(marks["screened"] - t)
                wholes.append(end - t)
            n, screen, whole = res.candidates_evaluated, min(screens), min(wholes)
            dropped = next((x for x in res.notes if "best-ranked designs" in x), "").split(" of ")[0] or "0"
            print(f"design search, {name} grid ({n} candidates, {res.feasible} feasible), all band criteria, {threads} thread(s): "
                  f"screen {screen:.3f} s = {n / screen / 1e6:.2f} M candidates/s; then {whole - screen:.3f} s once "
                  f"({dropped} ranked designs dropped by the turn network); whole call {whole:.3f} s = {n / whole / 1e6:.2f} M/s")


DENSE = (pathlib.Path(__file__).resolve().parent / "dense-grid-requirement.yaml").read_text()
DENSER = DENSE.replace("step: 0.1 mm}", "step: 0.05 mm}").replace("step: 0.01}", "step: 0.005}")
assert DENSER.count("0.05 mm}") == 1 and DENSER.count("0.005}") == 1

if __name__ == "__main__":
    main()
