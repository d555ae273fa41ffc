"""`coil analyze` with a shield: the shielded and unshielded figures side by side, through the CLI and the
module. The physics checks (long-coil form, low-frequency limit, wall loss) are in tests/cpp/test_shield.cpp."""
import json

import numpy as np

import pytest

import libcoil

SPEC = """\
name: "Shielded coil"
coil:
  form_diameter: 20 mm
  turns: 15
  pitch: 1.6 mm
  wire: {gauge: AWG 18, enamel: grade 1}
operating:
  frequencies: [100 Hz, 1 MHz, 10 MHz]
shield:
  inner_diameter: 40 mm
  length: 60 mm
  thickness: 0.1 mm
  material: copper
"""


def test_analyze_reports_the_shield_side_by_side(tmp_path, run_coil):
    p = tmp_path / "s.yaml"
    p.write_text(SPEC)
    r = run_coil("analyze", p, "--json")
    assert r.returncode == 0, r.stderr
    j = json.loads(r.stdout)
    s = j["shield"]
    assert s["material"] == "copper" and s["inner_diameter_m"] == pytest.approx(0.04)
    pts = s["at_frequency"]
    assert [x["frequency_Hz"] for x in pts] == [100, 1e6, 1e7]
    # 100 Hz: the skin depth (6.6 mm) is 66 walls: the shield barely shows. At 1 and 10 MHz it takes a
    # fifth or so of L off and adds loss (a plausibility range, no source: the physics is checked against
    # its references in tests/cpp/test_shield.cpp).
    assert abs(pts[0]["inductance_change_H"]) < 1e-3 * j["inductance_H"]
    for x in pts[1:]:
        assert -0.4 < x["inductance_change_H"] / j["inductance_H"] < -0.05
        assert x["added_resistance_ohm"] > 0
    assert s["inductance_high_frequency_H"] < j["inductance_H"]
    assert s["terminal_capacitance_F"] == pytest.approx(s["capacitance_to_shield_F"] / 12, rel=1e-12)  # floating
    text = run_coil("analyze", p).stdout
    assert "Shield: copper" in text and "shielded" in text and "SRF (lumped estimate)" in text


def test_module_carries_the_shield():
    a = libcoil.analyze(libcoil.parse_coil_spec(SPEC))
    j = json.loads(libcoil.json_report(a))
    assert j["shield"]["self_resonance_Hz"] > 0


REQUIREMENT = """\
target: {inductance: 5 uH, tolerance: 2 %}
band: {low: 150 kHz, ceiling: 30 MHz, srf_margin: 2}
operating: {current: 3 A, ambient: 25 degC, supply_voltage: 24 V}
limits: {max_outer_diameter: 40 mm, max_length: 80 mm}
search:
  wires: [AWG 16]
  form_diameter: {min: 18 mm, max: 24 mm, step: 2 mm}
  pitch_ratio: {min: 1.2, max: 2.0, step: 0.2}
"""
SHIELD = "shield: {inner_diameter: 50 mm, length: 90 mm, thickness: 0.1 mm, material: copper}\n"


def test_a_shielded_requirement_gets_more_turns_and_meets_the_target_in_the_shield():
    plain = libcoil.design(libcoil.parse_requirement(REQUIREMENT), threads=1, top=50)
    shielded = libcoil.design(libcoil.parse_requirement(REQUIREMENT + SHIELD), threads=1, top=50)
    assert shielded["designs"] and plain["designs"]
    by_grid = {(d["form_diameter_m"], d["pitch_before_trim_m"]): d for d in plain["designs"]}
    compared = 0
    for d in shielded["designs"]:
        # Fed back to the analysis, the shielded coil meets the target in its high-frequency limit.
        a = json.loads(libcoil.json_report(libcoil.analyze(libcoil.parse_coil_spec(d["spec"], "design"))))
        assert a["shield"]["inductance_high_frequency_H"] == pytest.approx(5e-6, rel=0.02)
        assert a["inductance_H"] > 5e-6 * 1.02  # unshielded it is well above: the search compensated
        twin = by_grid.get((d["form_diameter_m"], d["pitch_before_trim_m"]))
        if twin:
            assert d["turns"] > twin["turns"]
            compared += 1
    assert compared >= 3


@pytest.mark.parametrize("a, l, b", [(0.01, 0.01, 0.0125), (0.01, 0.04, 0.02), (0.01, 0.2, 0.03)])
def test_fourier_bessel_closed_form_against_scipy(a, l, b):
    # The same integral by scipy.special (iv, kv; exponentially scaled ive, kve so nothing overflows) and
    # scipy.integrate.quad, an independent implementation:
    # dL = -8 mu0 a^2 N^2 / l^2 int_0^inf sin^2(k l / 2) / k^2 I1(k a)^2 K1(k b) / I1(k b) dk.
    from scipy import integrate, special
    mu0, n = 1.25663706212e-6, 50
    def g(k):
        s = np.sin(k * l / 2) / k
        return s * s * special.ive(1, k * a) ** 2 * special.kve(1, k * b) / special.ive(1, k * b) * np.exp(2 * k * (a - b))
    val = sum(integrate.quad(g, k0, k0 + 2 * np.pi / l, epsabs=0, epsrel=1e-12, limit=200)[0]
              for k0 in np.arange(1e-12, 60 / (b - a), 2 * np.pi / l))
    ref = -8 * mu0 * a * a * n * n / (l * l) * val
    assert libcoil.sheet_in_long_shield_change(a, l, n, b) == pytest.approx(ref, rel=1e-9)


def test_the_search_screens_the_shielded_self_resonance():
    # With a shield the search's SRF is the lumped estimate with the shield's capacitance, the same one
    # coil analyze reports for the chosen spec.
    shielded = libcoil.design(libcoil.parse_requirement(REQUIREMENT + SHIELD), threads=1, top=5)
    for d in shielded["designs"]:
        a = json.loads(libcoil.json_report(libcoil.analyze(libcoil.parse_coil_spec(d["spec"], "design"))))
        assert d["self_resonance_Hz"] == pytest.approx(a["shield"]["self_resonance_Hz"], rel=1e-6)  # measured 3e-8
        assert d["self_resonance_Hz"] < 0.9 * a["self_resonance_Hz"]  # the shield lowers it here by 17 .. 21 %
