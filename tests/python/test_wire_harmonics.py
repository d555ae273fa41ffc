"""The wire-harmonic solver (wire_harmonics.hpp) against libcoil's cross-section filament solver, an
independent method, on a cached grid of 240 close-wound and spaced coils (tests/reference/cross_section:
the generator, its cache grid.json, and here a re-run of one coil to prove the cache current). Issue 17's
acceptance: within 2 % for R and 0.5 % for L(f) at every coil, the worst stated."""
import json
import math
import pathlib
import subprocess
import sys

import pytest

import libcoil

HERE = pathlib.Path(__file__).resolve().parents[1] / "reference" / "cross_section"
GRID = json.loads((HERE / "grid.json").read_text())
COILS = GRID["coils"]
RHO = GRID["resistivity_ohm_m"]


def test_the_grid_covers_the_domain():
    pd = [c["pitch"] / c["wire_diameter"] for c in COILS]
    dd = [c["wire_diameter"] / math.sqrt(RHO / (math.pi * 4e-7 * math.pi * c["frequency"])) for c in COILS]
    ld = [c["turns"] * c["pitch"] / c["mean_diameter"] for c in COILS]
    assert len(COILS) >= 200
    assert min(pd) < 1.03 and max(pd) > 2.3
    assert min(dd) < 0.15 and max(dd) > 15
    assert min(ld) < 0.1 and max(ld) > 15
    assert min(c["turns"] for c in COILS) == 3


def test_cache_is_current():
    env = {"PYTHONPATH": str(pathlib.Path(libcoil.__file__).resolve().parents[1])}
    out = subprocess.run([sys.executable, str(HERE / "generate.py"), "--one", "5"], capture_output=True, text=True, check=True,
                         timeout=300, env=env).stdout
    again = json.loads(out)
    cached = COILS[5]
    for key in ("resistance", "inductance", "dc_resistance", "dc_inductance"):
        assert again[key] == pytest.approx(cached[key], rel=1e-9)


def errors():
    out = []
    for c in COILS:
        s = libcoil.Solenoid(mean_diameter=c["mean_diameter"], turns=c["turns"], pitch=c["pitch"],
                             wire=libcoil.Wire(diameter=c["wire_diameter"]))
        h = libcoil.WireHarmonicSolver(s, RHO)
        z, dc = h.solve(c["frequency"]), h.solve(0)
        out.append({
            "index": c["index"],
            # the solvers' R and L directly
            "r": z["resistance"] / c["resistance"] - 1,
            "l": z["inductance"] / c["inductance"] - 1,
            # as the analysis takes them: R(f) / R(0) on the DC resistance, L_dc + L(f) - L(0)
            "r_ratio": (z["resistance"] / dc["resistance"]) / (c["resistance"] / c["dc_resistance"]) - 1,
            "l_change": (c["dc_inductance"] + z["inductance"] - dc["inductance"]) / c["inductance"] - 1,
        })
    return out


ERRORS = errors()
COIL_OF = {c["index"]: c for c in COILS}


# The solver's domain (wire_harmonics.hpp's min_harmonic_diameter_ratio): mean diameter >= 6 wire diameters.
INSIDE = [e for e in ERRORS if COIL_OF[e["index"]]["mean_diameter"] >= libcoil.min_harmonic_diameter_ratio * COIL_OF[e["index"]]["wire_diameter"]]
OUTSIDE = [e for e in ERRORS if e not in INSIDE]


def test_resistance_within_two_percent_of_the_filament_solver():
    # In the domain (205 coils, d/delta 0.1 .. 92): measured R -0.27 .. +1.41 % (the worst: coil 80, p/d 1.48,
    # d/delta 28, D/d 6.2, 6 turns).
    assert len(INSIDE) >= 200
    r = [e["r"] for e in INSIDE]
    assert max(abs(x) for x in r) < 0.02
    assert min(r) == pytest.approx(-0.0027, abs=0.001) and max(r) == pytest.approx(0.0141, abs=0.001)
    # As the analysis takes it (the ratio to each solver's own DC R): -0.18 .. +1.66 %.
    rr = [e["r_ratio"] for e in INSIDE]
    assert max(abs(x) for x in rr) < 0.02
    assert max(rr) == pytest.approx(0.0166, abs=0.001)
    # Outside (fat wire, D/d 3.4 .. 5.8) the first-order curvature reads R up to 2.4 % high (the ratio
    # 3.0 %): the reason for the limit, so the analysis takes the cross-section solver there.
    assert max(e["r"] for e in OUTSIDE) > 0.02


def test_inductance_change_within_half_a_percent_of_the_filament_solver():
    # L(f) as the analysis forms it (the low-frequency L plus the solver's change with frequency), in the
    # domain: measured -0.16 .. 0.00 %. The solvers' L directly differ by up to -0.43 % there (the
    # curvature's second-order terms in the DC L, which the analysis takes from Rosa's model instead).
    l = [e["l_change"] for e in INSIDE]
    assert max(abs(x) for x in l) < 0.005
    assert min(l) == pytest.approx(-0.0016, abs=0.0005)
    assert min(e["l"] for e in INSIDE) > -0.005


def test_fat_wire_takes_the_cross_section_solver():
    # Under 6 wire diameters of mean diameter the analysis (and its winding heat, and the search's last
    # step: losses.hpp's default_loss_solver) takes the cross-section solver, whose rings keep the curvature
    # exactly; its R is then the solver's, scaled to the helix. 2 mm wire on a 9 mm mean diameter.
    text = ("coil: {mean_diameter: 9 mm, turns: 6, pitch: 2.2 mm, wire: {diameter: 2 mm}, lead_length: 0 m}\n"
            "operating: {frequencies: [1 MHz], temperature: 20 degC}\n")
    a = libcoil.analyze(libcoil.parse_coil_spec(text, "fat"))
    assert a.loss_method == "filaments"
    assert any("fat" in w for w in a.warnings)
    s = libcoil.Solenoid(mean_diameter=9e-3, turns=6, pitch=2.2e-3, wire=libcoil.Wire(diameter=2e-3))
    rho = libcoil.conductor("copper").resistivity_at(293.15)
    sub = libcoil.subdivision_for(1e-3, math.sqrt(rho / (math.pi * 4e-7 * math.pi * 1e6)))
    solver = libcoil.CrossSectionSolver(s, rho, sub)
    ratio = solver.solve(1e6)["resistance"] / solver.solve(0)["resistance"]
    assert a.at_frequency.resistance[0] / a.dc_resistance == pytest.approx(ratio, rel=1e-6)
    # The wire-harmonic solver on the same coil reads R higher: the reason for the rule.
    h = libcoil.WireHarmonicSolver(s, rho)
    assert h.solve(1e6)["resistance"] / h.solve(0)["resistance"] > ratio * 1.005
