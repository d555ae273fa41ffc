"""The finite-element reference (tests/reference/fem: Debian's gmsh and getdp, general solvers used as the
outside reference for issue 17's R and L) checked itself against the exact solution: a large isolated ring
of round wire, whose impedance is 2 pi a Z_i + j w mu0 a (ln(8a/r) - 2) (the round wire's internal
impedance by Bessel functions, Z_i = k J0(kr) / (2 pi sigma r J1(kr)), k = (1 - j) / delta, e.g. Ramo,
Whinnery & Van Duzer, quoted from memory; the thin ring's external inductance, Rosa & Grover, with the
curvature's (r/a)^2 terms at 2.5e-5 here)."""
import json
import math
import pathlib
import sys

import pytest
from scipy import special

import libcoil

sys.path.insert(0, str(pathlib.Path(__file__).resolve().parents[1] / "reference" / "fem"))
import fem  # noqa: E402


def bessel_ring(a, r, f, sigma=fem.COPPER):
    mu0 = 4e-7 * math.pi
    w = 2 * math.pi * f
    k = (1 - 1j) / fem.skin_depth(f, sigma)
    zi = k / (2 * math.pi * sigma * r) * special.jv(0, k * r) / special.jv(1, k * r)
    return 2 * math.pi * a * zi + 1j * w * mu0 * a * (math.log(8 * a / r) - 2)


def test_isolated_ring_matches_the_bessel_solution():
    # a = 200 mm, r = 1 mm at 1 MHz (r / delta = 15): measured R +0.049 %, L -0.042 % (the mesh: delta / 3 at
    # the wire, hmax = a / 10; a / 4 moved L by -0.6 %, which is why the default is a / 10).
    a, r, f = 0.2, 1e-3, 1e6
    z = fem.impedance(a, r, 1, 3e-3, f)
    zb = bessel_ring(a, r, f)
    assert z.real == pytest.approx(zb.real, rel=1e-3)
    assert z.imag == pytest.approx(zb.imag, rel=1e-3)


CACHE = json.loads((pathlib.Path(fem.HERE) / "fem.json").read_text())
# The wire-harmonic solver's enforced bounds against this set (relative): measured figures in docs/models.md.
BARE_R, BARE_L, SHIELD_R, SHIELD_L = 0.01, 0.002, 0.01, 0.004
POINTS = CACHE["points"]


def test_cache_is_current():
    # gmsh and getdp are deterministic on one machine: the first coil at its lowest frequency, run again,
    # gives the cached figures (to 1e-6: the mesher's floating point may differ in the last digits).
    import subprocess
    out = subprocess.run([sys.executable, str(pathlib.Path(fem.HERE) / "generate.py"), "--one", "0"], capture_output=True,
                         text=True, check=True, timeout=900, cwd=fem.HERE).stdout
    again = json.loads(out)
    cached = next(p for p in POINTS if p["name"] == again["name"] and p["frequency"] == again["frequency"])
    assert again["resistance"] == pytest.approx(cached["resistance"], rel=1e-6)
    assert again["inductance"] == pytest.approx(cached["inductance"], rel=1e-6)


def solenoid(p):
    return libcoil.Solenoid(mean_diameter=2 * p["mean_radius"], turns=p["turns"], pitch=p["pitch"],
                            wire=libcoil.Wire(diameter=2 * p["wire_radius"]))


BARE = [p for p in POINTS if p.get("shield") is None]
SHIELDED = [p for p in POINTS if p.get("shield") is not None]


@pytest.mark.parametrize("p", POINTS, ids=[f"{p['name']}-{p['frequency']:.0e}" for p in POINTS])
def test_cross_section_solver_against_the_fem(p):
    # The cross-section filament solver (cross_section.hpp) with its own subdivision rule, against the FEM
    # at every point, bare (100 kHz .. 30 MHz, d/delta up to 83) and in the tubes: measured bare R -0.35 ..
    # +0.30 %, L -0.09 .. -0.01 %; in the tubes R -0.17 .. +0.47 %, L -0.19 .. -0.03 %. Issue 17 asks 0.5 % for R.
    n, pitch = p["turns"], p["pitch"]
    rings = [(p["mean_radius"], (k - (n - 1) / 2) * pitch) for k in range(n)]
    sub = libcoil.subdivision_for(p["wire_radius"], fem.skin_depth(p["frequency"]))
    z = libcoil.CrossSectionSolver(rings, p["wire_radius"], 1 / fem.COPPER, sub, shield=shield_of(p)).solve(p["frequency"])
    assert z["resistance"] == pytest.approx(p["resistance"], rel=0.005)
    assert z["inductance"] == pytest.approx(p["inductance"], rel=0.001 if p.get("shield") is None else 0.003)


SPACED = [p for p in BARE if p["pitch"] / (2 * p["wire_radius"]) >= 2.5 and p["frequency"] <= 1e7]


@pytest.mark.parametrize("p", SPACED, ids=[f"{p['name']}-{p['frequency']:.0e}" for p in SPACED])
def test_closed_form_resistance_of_spaced_turns_against_the_fem(p):
    # The closed form (skin effect exact, Butterworth's proximity) holds for spaced turns: measured -0.26 ..
    # +0.83 % at p/d 2.5 and 4, 100 kHz .. 30 MHz. For close-wound turns it reads R up to 28 % low and L up to
    # 6.1 % high against the same FEM (docs/models.md): the reason the analysis takes the wire-harmonic solver.
    s = solenoid(p)
    c = libcoil.coil_at_frequencies(s, libcoil.conductor("copper"), 293.15, [p["frequency"]])
    assert c["resistance"][0] == pytest.approx(p["resistance"], rel=0.01)


def ident(p):
    return f"{p['name']}-{p['frequency']:.0e}"


def shield_of(p):
    t = p.get("shield")
    return None if t is None else {"inner_diameter": 2 * t["bore_radius"], "length": t["length"], "thickness": t["wall"],
                                   "material": "copper"}


@pytest.mark.parametrize("p", POINTS, ids=[ident(p) for p in POINTS])
def test_wire_harmonic_solver_against_the_fem(p):
    # The wire-harmonic solver (wire_harmonics.hpp) on the FEM's own rings, bare (100 kHz .. 30 MHz) and in
    # copper tubes (100 kHz .. 10 MHz). Measured: bare R -0.04 .. +0.61 %, L -0.11 .. -0.08 %; in the tubes
    # R -0.04 .. +0.54 %, L -0.26 .. -0.10 %.
    n, pitch = p["turns"], p["pitch"]
    rings = [(p["mean_radius"], (k - (n - 1) / 2) * pitch) for k in range(n)]
    z = libcoil.WireHarmonicSolver(rings, p["wire_radius"], 1 / fem.COPPER, shield=shield_of(p)).solve(p["frequency"])
    if p.get("shield") is None:
        assert z["resistance"] == pytest.approx(p["resistance"], rel=BARE_R)
        assert z["inductance"] == pytest.approx(p["inductance"], rel=BARE_L)
    else:
        assert z["resistance"] == pytest.approx(p["resistance"], rel=SHIELD_R)
        assert z["inductance"] == pytest.approx(p["inductance"], rel=SHIELD_L)


def analysed(p):
    """R and L(f) as the default `coil analyze` gives them for the FEM's coil: the helix of its rings' size
    and pitch, no leads, copper at 20 degC, in its tube where it has one (the impedance rows' wire R and L:
    the wires' own, plus the wall's loss and change of L)."""
    text = (f"coil: {{mean_diameter: {2 * p['mean_radius']} m, turns: {p['turns']}, pitch: {p['pitch']} m, "
            f"wire: {{diameter: {2 * p['wire_radius']} m}}, lead_length: 0 m}}\n"
            f"operating: {{frequencies: [{p['frequency']} Hz], temperature: 20 degC}}\n")
    t = p.get("shield")
    if t is not None:
        text += (f"shield: {{inner_diameter: {2 * t['bore_radius']} m, length: {t['length']} m, thickness: {t['wall']} m, "
                 f"material: copper}}\n")
    a = libcoil.analyze(libcoil.parse_coil_spec(text, "fem"))
    assert a.loss_method == "harmonics"
    row = a.impedance
    return row.wire_resistance[0], row.wire_inductance[0]


@pytest.mark.parametrize("p", POINTS, ids=[ident(p) for p in POINTS])
def test_default_analysis_against_the_fem(p):
    # Issue 17's acceptance: the default analysis within 2 % for R and 1 % for L(f) at every point, bare and
    # shielded, close-wound and spaced. Measured: bare R +0.06 .. +0.72 %, L +0.03 .. +0.17 %; in the tubes
    # R +0.05 .. +0.55 %, L -0.04 .. +0.03 % (the cache's points: bare to 30 MHz, in tubes to 10 MHz).
    r, l = analysed(p)
    assert r == pytest.approx(p["resistance"], rel=0.02)
    assert l == pytest.approx(p["inductance"], rel=0.01)
