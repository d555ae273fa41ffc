"""The other models against outside references: scipy quadrature, mpmath, and published values."""
import math

import mpmath
import numpy as np
import pytest
from scipy import integrate

import libcoil

MU0 = 1.25663706212e-6  # CODATA 2018


def neumann_scipy(a, b, z):
    """Neumann's double line integral for coaxial circles, reduced by symmetry to one integral
    (M = mu0 a b int_0^pi cos(phi) / R(phi) dphi), by scipy.integrate.quad."""
    # int_0^pi cos = 0, so 1/R(pi/2) is subtracted from 1/R: same integral, far less cancellation for
    # distant loops.
    inv_r = lambda phi: 1 / math.sqrt((a - b) ** 2 + z * z + 4 * a * b * math.sin(phi / 2) ** 2)
    f = lambda phi: math.cos(phi) * (inv_r(phi) - inv_r(math.pi / 2))
    val, _ = integrate.quad(f, 0, math.pi, epsabs=0, epsrel=1e-12, limit=400, points=[1e-3, 1e-2, 0.1])
    return MU0 * a * b * val


def maxwell_mpmath(a, b, z):
    mpmath.mp.dps = 40
    a, b, z = map(mpmath.mpf, (a, b, z))
    m = 4 * a * b / ((a + b) ** 2 + z**2)
    k = mpmath.sqrt(m)
    return float(mpmath.mpf(MU0) * mpmath.sqrt(a * b) * ((2 / k - k) * mpmath.ellipk(m) - 2 / k * mpmath.ellipe(m)))


@pytest.mark.parametrize("a,b,z", [(1, 1, 0.05), (1, 1, 1), (1, 2, 0.3), (0.2, 1, 3), (1, 1, 30), (0.01, 0.012, 0.002)])
def test_maxwell_against_neumann_integral(a, b, z):
    assert libcoil.coaxial_mutual_inductance(a, b, z) == pytest.approx(neumann_scipy(a, b, z), rel=1e-10)


def test_maxwell_against_mpmath_including_extremes():
    cases = [(1, 1, 1e-6), (1, 1, 1e-3), (1, 1, 4.0), (1, 1, 1e3), (1, 1e-4, 0), (1, 3, 0.7)]
    for a, b, z in cases:
        assert libcoil.coaxial_mutual_inductance(a, b, z) == pytest.approx(maxwell_mpmath(a, b, z), rel=1e-13)


def test_maxwell_vectorised_over_distance():
    z = np.linspace(0.1, 2, 7)
    m = libcoil.coaxial_mutual_inductance(1.0, 1.0, z)
    assert m.shape == z.shape and np.all(np.diff(m) < 0)  # mutual falls with distance


def test_lundin_bound():
    # Lundin 1985: 3 ppm over all D/l.
    rho = np.logspace(-3, 3, 3001)
    rel = np.abs(libcoil.lundin_coefficient(rho) / libcoil.nagaoka_coefficient(rho) - 1)
    assert rel.max() <= 3e-6


def test_helix_length_against_arc_length_integral():
    # Arc length of the helix by scipy quadrature of |r'(t)|.
    w = libcoil.Wire(diameter=1e-3, insulation=40e-6)
    s = libcoil.Solenoid(form_diameter=20e-3, turns=10, pitch=1.5e-3, wire=w, lead_length=0.05)
    a, p = s.mean_radius, s.pitch
    speed = lambda t: math.sqrt(a * a + (p / (2 * math.pi)) ** 2)
    ref, _ = integrate.quad(speed, 0, 2 * math.pi * 10)
    assert s.helix_length == pytest.approx(ref, rel=1e-13)
    assert s.wire_length == pytest.approx(ref + 0.05, rel=1e-13)


def test_solenoid_and_inductance_from_python():
    w = libcoil.Wire(gauge="AWG 18", enamel_grade=2)
    assert w.bare_diameter == pytest.approx(0.0403 * 0.0254, rel=2e-3)  # ASTM B258 table: 40.3 mil
    s = libcoil.Solenoid(mean_diameter=25e-3, turns=12, pitch=2e-3, wire=w)
    r = libcoil.inductance(s)
    assert set(r.by_method) == {"wheeler", "nagaoka", "lundin", "rosa", "filament"}
    assert r.recommended == s.inductance() == r.by_method["rosa"]
    assert r.by_method["filament"] == pytest.approx(r.by_method["rosa"], rel=5e-3)


def test_errors_arrive_with_the_same_messages():
    w = libcoil.Wire(diameter=1e-3, insulation=40e-6)
    with pytest.raises(libcoil.InputError, match=r"^pitch: 0\.5 mm is less than the insulated wire diameter 1\.08 mm"):
        libcoil.Solenoid(mean_diameter=20e-3, turns=10, pitch=0.5e-3, wire=w)
    with pytest.raises(libcoil.InputError, match=r'^coil\.pitch: "2 mn": unknown unit "mn"; expected a length such as "2 mm"$'):
        libcoil.parse_quantity("2 mn", "length", "coil.pitch")
    with pytest.raises(libcoil.InputError, match="turns"):
        libcoil.rosa_mutual_correction(np.array([3.0, 0.2]))


def test_units_and_data_from_python():
    assert libcoil.parse_quantity("1.2 µH", "inductance") == pytest.approx(1.2e-6)
    assert libcoil.parse_quantity("25 degC", "temperature") == pytest.approx(298.15)
    assert libcoil.format_quantity(1.2e-6, "inductance") == "1.200 µH"
    assert libcoil.conductor("copper").resistivity_20 == 1.7241e-8  # IEC 60028
    assert libcoil.awg_diameter(np.array([36, -3])) == pytest.approx([0.005 * 0.0254, 0.46 * 0.0254], rel=1e-14)  # ASTM B258
    assert "PETG" in libcoil.former_material_names()
