"""The bench fit end to end (coil compare --fit, libcoil.compare) and fixture de-embedding.

Check values: the synthetic example measurement data/examples/bench-network-coil.measured.s1p is made by
tools/make_bench_example from libcoil's own model with known terms (TRUTH there) and seeded trace noise, so the
fit must give TRUTH back within its standard errors; the fixture checks are exact network algebra (a known
2-port cascaded by scikit-rf, an outside library, and removed again)."""
import importlib.machinery
import importlib.util
import json
import math

import numpy as np
import pytest

import libcoil

skrf = pytest.importorskip("skrf")


def generator(source_dir):
    path = str(source_dir / "tools" / "make_bench_example")
    spec = importlib.util.spec_from_loader("make_bench_example", importlib.machinery.SourceFileLoader("make_bench_example", path))
    module = importlib.util.module_from_spec(spec)
    spec.loader.exec_module(module)
    return module


def test_the_example_measurement_is_current(source_dir, tmp_path, monkeypatch):
    # The cached synthetic file is what its generator writes today (the model or the noise unchanged).
    out = tmp_path / "again.s1p"
    monkeypatch.setattr("sys.argv", ["make_bench_example", str(out)])
    generator(source_dir).main()
    assert out.read_text() == (source_dir / "data/examples/bench-network-coil.measured.s1p").read_text()


def test_the_fit_finds_the_example_terms_back(source_dir):
    truth = generator(source_dir).TRUTH
    spec = libcoil.load_coil_spec(source_dir / "data/examples/bench-network-coil.yaml")
    c = libcoil.compare(spec, str(source_dir / "data/examples/bench-network-coil.measured.s1p"), fit=True)
    for name, value in truth.items():
        p = c.fitted[name]
        assert p["varied"] and p["determined"], (name, p)
        assert abs(p["value"] - value) < 2.5 * p["standard_error"], (name, p, value)
    assert c.residual_rms_after < 0.1 * c.residual_rms_before
    # The predicted SRF is off by the bench terms (about +20 %); the fitted model's meets the measured one.
    assert c.deviation["self_resonance_Hz"] < -0.1
    assert c.fitted_self_resonance_Hz == pytest.approx(c.extracted["self_resonance_Hz"], rel=0.01)
    assert c.fitted_impedance.shape == c.measured.shape
    names = c.correlation["parameters"]
    m = np.array(c.correlation["matrix"])
    assert m.shape == (len(names), len(names)) and np.allclose(np.diag(m), 1) and np.allclose(m, m.T)


def test_the_fitted_yaml_feeds_the_next_analysis(run_coil, source_dir, tmp_path):
    # coil compare --fit --out writes STEM.bench.yaml; a spec naming it (bench: FILE) then predicts the
    # measured SRF, where the plain spec missed it.
    spec = source_dir / "data/examples/bench-network-coil.yaml"
    measured = source_dir / "data/examples/bench-network-coil.measured.s1p"
    out = tmp_path / "out"
    r = run_coil("compare", spec, measured, "--fit", "--out", out, "--json")
    assert r.returncode == 0, r.stderr
    j = json.loads(r.stdout)
    assert set(j["fitted"]) == {"former_permittivity", "former_loss_tangent", "stray_capacitance", "lead_inductance", "resistance_scale"}
    assert all(set(v) >= {"value", "standard_error"} for v in j["fitted"].values())
    assert j["residual_rms_after"] < j["residual_rms_before"]
    fitted = out / "bench-network-coil.bench.yaml"
    lines = fitted.read_text().splitlines()
    assert "bench:" in lines
    keys = {ln.split(":")[0].strip() for ln in lines[lines.index("bench:") + 1:]}
    assert keys == set(j["fitted"])
    benched = tmp_path / "benched.yaml"
    benched.write_text(spec.read_text() + f"bench: {fitted.name}\n")
    (tmp_path / fitted.name).write_text(fitted.read_text())
    r = run_coil("compare", benched, measured, "--json")
    assert r.returncode == 0, r.stderr
    again = json.loads(r.stdout)
    assert abs(again["deviation"]["self_resonance_Hz"]) < 0.01
    assert abs(again["deviation"]["inductance_H"]) < 0.005
    r = run_coil("analyze", benched)
    assert r.returncode == 0 and "bench corrections from" in r.stdout


def test_fit_points_given_outright():
    # A read_measurement-like record: relative noise of 1 %, the fit weighs each point by it.
    spec = libcoil.parse_coil_spec("""
coil: {form_diameter: 12 mm, turns: 8, pitch: 1.2 mm, wire: {diameter: 0.8 mm, enamel: grade 1}}
former: {material: PETG, wall: 2 mm}
""")
    a = libcoil.analyze(spec)
    f = np.geomspace(2e6, 3 * a.self_resonance_as_mounted, 121)
    z = libcoil.sweep(a, list(f)).impedance

    class Points:
        frequency, impedance, weight = f, z, np.ones_like(f)

    c = libcoil.compare(spec, Points(), fit=True)
    assert c.fitted["former_permittivity"]["value"] == pytest.approx(libcoil.former_material("PETG").relative_permittivity, rel=1e-6)
    assert c.fitted["stray_capacitance"]["value"] == pytest.approx(0, abs=1e-18)
    assert c.residual_rms_after < 1e-8
    assert libcoil.compare(spec, Points()).fitted is None


def test_a_fixture_is_removed(tmp_path):
    # The coil behind a known 2-port (10 nH in series, then 2 pF across the coil: its S from the ABCD matrix,
    # written by scikit-rf), measured by reflection: with the fixture's file the coil comes back to 1e-7; the
    # lumped fixture does the same.
    f = skrf.Frequency(1, 200, 401, "MHz", sweep_type="log")
    w = 2 * math.pi * f.f
    zc = 1 / (1 / (0.5 + 1j * w * 1e-6) + 1j * w * 10e-12)
    zs, yp, z0 = 1j * w * 10e-9, 1j * w * 2e-12, 50.0
    a, b, c, d = 1 + zs * yp, zs, yp, np.ones_like(zs)  # [[1, Zs], [0, 1]] x [[1, 0], [Y, 1]]
    den = a + b / z0 + c * z0 + d
    s = np.empty((len(w), 2, 2), complex)
    s[:, 0, 0] = (a + b / z0 - c * z0 - d) / den
    s[:, 0, 1] = 2 * (a * d - b * c) / den
    s[:, 1, 0] = 2 / den
    s[:, 1, 1] = (-a + b / z0 - c * z0 + d) / den
    skrf.Network(frequency=f, s=s, z0=z0).write_touchstone(str(tmp_path / "fixture"), form="ri")
    g = (zc - z0) / (zc + z0)
    gm = s[:, 0, 0] + s[:, 0, 1] * s[:, 1, 0] * g / (1 - s[:, 1, 1] * g)
    skrf.Network(frequency=f, s=gm.reshape(-1, 1, 1), z0=z0).write_touchstone(str(tmp_path / "measured"), form="ri")
    spec = libcoil.parse_coil_spec("coil: {form_diameter: 12 mm, turns: 8, pitch: 1.2 mm, wire: {diameter: 0.8 mm}}")
    for kw in ({"fixture": str(tmp_path / "fixture.s2p")}, {"fixture_inductance": 10e-9, "fixture_capacitance": 2e-12}):
        got = libcoil.compare(spec, str(tmp_path / "measured.s1p"), **kw)
        assert np.allclose(got.measured, zc, rtol=1e-7), kw
    plain = libcoil.compare(spec, str(tmp_path / "measured.s1p"))
    assert not np.allclose(plain.measured, zc, rtol=1e-2)


def test_fixture_errors(run_coil, source_dir, tmp_path):
    spec = source_dir / "data/examples/bench-network-coil.yaml"
    measured = source_dir / "data/examples/bench-network-coil.measured.s1p"
    out = tmp_path / "out"
    r = run_coil("compare", spec, measured, "--fixture", measured, "--out", out)  # a 1-port file as the fixture
    assert r.returncode == 2 and "fixture" in r.stderr and not out.exists(), r.stderr
    r = run_coil("compare", spec, measured, "--fixture-capacitance", "-1 pF", "--out", out)
    assert r.returncode == 2 and not out.exists(), r.stderr
