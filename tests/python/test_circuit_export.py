"""coil export-circuit: the equivalent circuit run by an outside circuit simulator (Debian's ngspice, batch AC
analysis of the exported subcircuit driven by 1 A) against libcoil's own Z(f) of the coil as mounted, which the
circuit was fitted to. Issue 19 asks 1 % in |Z| and 1 degree in phase over the fitted range, and the first two
resonances within 0.5 %."""
import shutil
import subprocess

import numpy as np
import pytest

import libcoil

CLOSE_WOUND = """
name: close-wound check coil
coil: {form_diameter: 16 mm, turns: 15, pitch: 1.1 mm, wire: {diameter: 1.0 mm, enamel: grade 1}}
former: {material: PTFE, wall: 2 mm}
"""
SPACED = """
name: spaced check coil
coil: {form_diameter: 30 mm, turns: 8, pitch: 4 mm, wire: {diameter: 1.5 mm}}
"""


def coils(source_dir):
    ex = source_dir / "data/examples"
    return {"demo": ex / "bench-network-coil.yaml", "demo-in-can": ex / "bench-network-coil-in-can.yaml",
            "close-wound": CLOSE_WOUND, "spaced": SPACED}


@pytest.mark.parametrize("which", ["demo", "demo-in-can", "close-wound", "spaced"])
def test_ngspice_runs_the_circuit_as_libcoil_computes_the_coil(run_coil, source_dir, tmp_path, which):
    assert shutil.which("ngspice"), "ngspice is installed by tools/setup --references"
    spec = coils(source_dir)[which]
    if isinstance(spec, str):
        path = tmp_path / f"{which}.yaml"
        path.write_text(spec)
        spec = path
    r = run_coil("export-circuit", spec, "--out", tmp_path, "--name", "DUT")
    assert r.returncode == 0, r.stderr
    assert "(passive)" in r.stdout
    cir = (tmp_path / f"{spec.stem}.cir").read_text()
    a = libcoil.analyze(libcoil.load_coil_spec(spec))
    lo, hi = a.self_resonance_as_mounted / 1000, 2.5 * a.self_resonance_as_mounted
    deck = tmp_path / "run.cir"
    out = tmp_path / "z.txt"
    deck.write_text(f"* export check\n{cir}I1 0 n1 AC 1\nX1 n1 0 DUT\n.control\nset wr_singlescale\nset wr_vecnames\noption numdgt=12\n"
                    f"ac dec 200 {lo!r} {hi!r}\nwrdata {out} v(n1)\n.endc\n.end\n")
    run = subprocess.run(["ngspice", "-b", str(deck)], capture_output=True, text=True, timeout=300)
    assert out.exists(), run.stdout + run.stderr
    data = np.loadtxt(out, skiprows=1)
    f, z = data[:, 0], data[:, 1] + 1j * data[:, 2]
    inside = (f >= lo) & (f <= hi)
    f, z = f[inside], z[inside]
    want = libcoil.sweep(a, list(f)).impedance
    assert np.max(np.abs(np.abs(z) / np.abs(want) - 1)) < 0.01
    assert np.max(np.abs(np.angle(z / want, deg=True))) < 1.0
    # The first two resonances of the simulated circuit against the model's, read the same way.
    fine = np.geomspace(lo, hi, 4000)
    model = libcoil.measured_figures(list(fine), list(libcoil.sweep(a, list(fine)).impedance))
    sim = libcoil.measured_figures(list(f), list(z))
    assert sim.self_resonance == pytest.approx(model.self_resonance, rel=0.005)
    if model.second_resonance is not None:
        assert sim.second_resonance == pytest.approx(model.second_resonance, rel=0.005)


def test_export_circuit_errors(run_coil, source_dir, tmp_path):
    spec = source_dir / "data/examples/bench-network-coil.yaml"
    for args, field in ((["--order", "0"], "--order"), (["--from", "10 MHz", "--to", "1 MHz"], "to"), (["--name", "a.b"], "name")):
        r = run_coil("export-circuit", spec, "--out", tmp_path / "out", *args)
        assert r.returncode == 2 and field in r.stderr and not (tmp_path / "out").exists(), (args, r.stderr)


def test_export_circuit_from_python(source_dir):
    spec = libcoil.load_coil_spec(source_dir / "data/examples/bench-network-coil.yaml")
    c = libcoil.export_circuit(spec, name="L1")
    assert c.meets_goals and c.max_magnitude_error < 0.01 and c.max_phase_error < 1
    assert ".subckt L1 T1 T2" in c.spice and c.spice.rstrip().endswith(".ends L1")
    assert c.fitted_self_resonance == pytest.approx(c.model_self_resonance, rel=0.005)
