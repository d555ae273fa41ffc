"""The turn network's self-resonance against NEC2 (Debian's nec2c, a method-of-moments wire solver): the
cached reference set (tests/reference/nec2/srf.json, written by generate.py beside it), one of its decks run
again to prove the cache current, and the sheath-helix model's error on the same set for comparison."""
import json
import pathlib
import shutil
import subprocess
import sys

import numpy as np
import pytest

import libcoil

HERE = pathlib.Path(__file__).resolve().parents[1] / "reference" / "nec2"
CACHE = json.loads((HERE / "srf.json").read_text())
COILS = CACHE["coils"]


def solenoid(c):
    return libcoil.Solenoid(mean_diameter=c["mean_diameter"], turns=c["turns"], pitch=c["pitch"],
                            wire=libcoil.Wire(diameter=c["wire_diameter"]))


def network_srf(c, mounting, capacitance="near-field-corrected"):
    return libcoil.TurnNetwork(solenoid(c), mounting, capacitance=capacitance).resonances(1)[0]


def test_cache_is_current():
    # NEC2 is deterministic: one coil's decks run again give the cached figures.
    if shutil.which("nec2c") is None:
        pytest.fail("nec2c is missing: tools/setup --references installs it")
    index = next(i for i, c in enumerate(COILS) if c["name"] == "medium")
    out = subprocess.run([sys.executable, str(HERE / "generate.py"), "--one", str(index)], capture_output=True, text=True,
                         check=True, timeout=600).stdout
    again = json.loads(out)
    for mounting in ("floating", "grounded-end"):
        for key in ("f16", "f32", "f"):
            assert again[mounting][key] == pytest.approx(COILS[index][mounting][key], rel=1e-9)


@pytest.mark.parametrize("c", COILS, ids=[c["name"] for c in COILS])
def test_nec_reference_has_converged(c):
    # NEC's own convergence: 16 and 32 segments a turn within 2.5 % of each other, the finer lower (its
    # segmentation error falls as h^2; the extrapolation removes most of the rest).
    for mounting in ("floating", "grounded-end"):
        r = c[mounting]
        assert r["f32"] < r["f16"] < 1.025 * r["f32"], (mounting, r)
        assert abs(r["f"] / r["f32"] - 1) < 0.01


def spaced(c):
    return c["pitch"] / c["wire_diameter"] >= 3


# Measured against the extrapolated NEC2 value (docs/models.md), on the coils of p/d >= 3: floating
# -1.28 .. +1.34 %, grounded end -1.76 .. -0.45 %.
@pytest.mark.parametrize("c", [c for c in COILS if spaced(c)], ids=[c["name"] for c in COILS if spaced(c)])
@pytest.mark.parametrize("mounting", ["floating", "grounded-end"])
def test_network_srf_within_2_percent_of_nec2(c, mounting):
    f = network_srf(c, mounting)
    err = f / c[mounting]["f"] - 1
    assert abs(err) <= 0.02, (c["name"], mounting, err)


@pytest.mark.parametrize("c", [c for c in COILS if not spaced(c)], ids=[c["name"] for c in COILS if not spaced(c)])
@pytest.mark.parametrize("mounting", ["floating", "grounded-end"])
def test_at_two_wire_diameters_nec2_is_a_thin_wire_reference(c, mounting):
    # At p/d = 2, NEC2's thin wire (its charge on the wire's axis) misses the crowding of charge towards the
    # neighbours. The network with the same thin-wire capacitances meets NEC2 within 2 % (measured -0.6 ..
    # +1.2 %); the recommended near-field-corrected network sits lower, measured -2.07 .. -1.73 %, by the
    # wire surface's correction, which tests/cpp/test_turn_network.cpp checks against the wire-surface
    # reference (itself checked against two parallel cylinders).
    thin = network_srf(c, mounting, "thin-wire") / c[mounting]["f"] - 1
    corrected = network_srf(c, mounting) / c[mounting]["f"] - 1
    assert abs(thin) <= 0.02, (c["name"], mounting, thin)
    assert -0.025 <= corrected < thin, (c["name"], mounting, corrected, thin)


def test_the_sheath_helix_is_far_off_where_the_network_is_not():
    # The reason for the network: the sheath-helix line's floating SRF is 16 .. 47 % above NEC2 on this set
    # (measured; the outside check found 16 .. 42 % on its own).
    errors = []
    for c in COILS:
        s = solenoid(c)
        sh = libcoil.self_resonance(s, s.inductance())["helical_line"]["frequency"]
        errors.append(sh / c["floating"]["f"] - 1)
    assert min(errors) > 0.15 and max(errors) < 0.5


FREE = "coil: {mean_diameter: 20 mm, turns: 10, pitch: 6 mm, wire: {diameter: 1 mm}}\noperating: {frequencies: [1 MHz]}\n"


def test_network_sweep_shows_every_odd_resonance(tmp_path, run_coil):
    # Between the two free ends only the modes with opposite end voltages show: the first and the third
    # natural frequencies of the network (the second is symmetric and stays hidden), each a |Z| peak.
    spec = libcoil.parse_coil_spec(FREE)
    a = libcoil.analyze(spec)
    modes = libcoil.TurnNetwork(spec.solenoid).resonances(3)
    assert a.self_resonance.frequency == pytest.approx(modes[0], rel=1e-12)
    assert np.allclose(a.self_resonance.network_modes, modes, rtol=1e-12)  # what the report and JSON list
    f = np.linspace(50e6, 1000e6, 19001)
    z = np.abs(libcoil.sweep(a, f, model="network").impedance)
    peaks = f[1:-1][(z[1:-1] > z[:-2]) & (z[1:-1] > z[2:])]
    step = f[1] - f[0]
    assert len(peaks) == 2
    assert abs(peaks[0] - modes[0]) <= step and abs(peaks[1] - modes[2]) <= step
    # The command writes the same into its Touchstone file.
    p = tmp_path / "free.yaml"
    p.write_text(FREE)
    r = run_coil("sweep", p, "--model", "network", "--from", "50 MHz", "--to", "1000 MHz", "--points", "9501",
                 "--spacing", "linear", "--out", tmp_path)
    assert r.returncode == 0, r.stderr
    rows = [line.split() for line in (tmp_path / "free.s1p").read_text().splitlines() if line and line[0] not in "!#"]
    s11 = np.array([float(x[1]) + 1j * float(x[2]) for x in rows])
    fz = np.array([float(x[0]) for x in rows])
    zt = np.abs(50 * (1 + s11) / (1 - s11))
    peaks = fz[1:-1][(zt[1:-1] > zt[:-2]) & (zt[1:-1] > zt[2:])]
    assert abs(peaks[0] - modes[0]) <= fz[1] - fz[0] and abs(peaks[1] - modes[2]) <= fz[1] - fz[0]


def test_network_sweep_holds_the_shield(source_dir):
    # In a shield the network holds the wall (a grounded conductor, its currents' change to L): its Z(f) peaks
    # at the analysis's shielded SRF, and far below resonance its apparent L is the shielded coil's.
    a = libcoil.analyze(libcoil.load_coil_spec(str(source_dir / "data/examples/bench-network-coil-in-can.yaml")))
    assert a.shield.by_network
    f = np.linspace(0.8 * a.shield.self_resonance, 1.2 * a.shield.self_resonance, 4001)
    s = libcoil.sweep(a, f, model="network")
    # The peak by the parabola through the grid's three highest points. The lossy |Z| peaks a little above
    # the lossless natural frequency: 1.06e-4 of it here (measured, and the same on a grid ten times finer),
    # about a step of this grid, so a peak read off the grid alone lands a step away or two.
    z = np.abs(s.impedance)
    i = int(np.argmax(z))
    y0, y1, y2 = z[i - 1], z[i], z[i + 1]
    peak = f[i] + 0.5 * (y0 - y2) / (y0 - 2 * y1 + y2) * (f[1] - f[0])
    assert 0 < peak / a.shield.self_resonance - 1 < 2e-4
    low = libcoil.sweep(a, [1e6], model="network")
    assert low.apparent_inductance[0] == pytest.approx(a.shield.inductance, rel=0.03)


def test_each_models_stated_error_is_what_the_nec2_set_measures():
    # The report's comparison block states each model's error against NEC2 (self_resonance.cpp's table);
    # measured again here from the cache, they agree to the 0.05 % the table is rounded to.
    measured = {}
    stated = {}
    for c in COILS:
        s = solenoid(c)
        for mounting in ("floating", "grounded-end"):
            r = libcoil.self_resonance(s, s.inductance(), mounting=mounting)
            for model in ("helical_line", "kandoian_sichak", "medhurst"):
                m = r[model]
                if not m["available"]:
                    continue
                measured.setdefault((model, mounting), []).append(m["frequency"] / c[mounting]["f"] - 1)
                stated[(model, mounting)] = (m["error_low"], m["error_high"])
            if spaced(c):  # the network's stated error is over the coils NEC2's thin wire holds for
                f = network_srf(c, mounting)
                measured.setdefault(("network", mounting), []).append(f / c[mounting]["f"] - 1)
                stated[("network", mounting)] = (r["network"]["error_low"], r["network"]["error_high"])
    assert len(measured) == 8
    for key, values in measured.items():
        low, high = stated[key]
        assert min(values) == pytest.approx(low, abs=5e-4), key
        assert max(values) == pytest.approx(high, abs=5e-4), key


@pytest.mark.parametrize("c", COILS, ids=[c["name"] for c in COILS])
@pytest.mark.parametrize("mounting", ["floating", "grounded-end"])
def test_the_srf_band_holds_the_nec2_value(c, mounting):
    # The recommended SRF's band (self_resonance.hpp's srf_band: the measured errors, NEC's residual, the
    # near-field correction's error below p/d 3) holds NEC2's extrapolated value for every coil of the set,
    # p/d 2 included; and it is not a blanket: no wider than 8 % in all (measured at most 7.0 %, at p/d 2).
    s = solenoid(c)
    r = libcoil.self_resonance(s, s.inductance(), mounting=mounting)
    assert r["method"] == "network"
    nec = c[mounting]["f"]
    assert r["frequency_low"] <= nec <= r["frequency_high"], (c["name"], mounting, r["frequency_low"], nec, r["frequency_high"])
    assert r["frequency_high"] / r["frequency_low"] < 1.08


def test_the_specs_tolerances_widen_the_band(run_coil, tmp_path):
    # tolerances: in a coil spec (one standard deviation each) widen the SRF's band by two standard deviations
    # of the SRF either side (srf_build_spread); the report says so; a bad key is refused by name.
    base = "coil: {form_diameter: 20 mm, turns: 10, pitch: 2.5 mm, wire: {diameter: 1 mm}}\n"
    tight = libcoil.analyze(libcoil.parse_coil_spec(base + "tolerances: {form_diameter: 0 mm, pitch: 0 mm, wire_diameter: 0 %, turns: 0}\n"))
    loose = libcoil.analyze(libcoil.parse_coil_spec(base + "tolerances: {pitch: 0.1 mm, turns: 0.3}\n"))
    typical = libcoil.analyze(libcoil.parse_coil_spec(base))
    for a in (tight, loose, typical):
        assert a.self_resonance.frequency == pytest.approx(tight.self_resonance.frequency, rel=1e-12)
    width = lambda a: a.self_resonance.frequency_high / a.self_resonance.frequency_low
    assert width(tight) < width(typical) < width(loose)
    assert not any("tolerances" in r for r in tight.self_resonance.band_reasons)
    assert any(r.startswith("the build's tolerances (the spec's") for r in loose.self_resonance.band_reasons)
    assert any(r.startswith("the build's tolerances (typical") for r in typical.self_resonance.band_reasons)
    bad = tmp_path / "bad.yaml"
    bad.write_text(base + "tolerances: {pitch: 0.1 mm, spin: 2}\n")
    r = run_coil("analyze", bad)
    assert r.returncode == 2 and r.stderr.startswith("coil: tolerances.spin: unknown key") and r.stdout == ""
