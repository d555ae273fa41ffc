"""The proximity loss function of a round wire in a uniform transverse field, against mpmath quadrature.

G(x) = x^2 lambda / |J0(u)|^2 with lambda = int_0^1 |J1(u s)|^2 s ds and u = x e^(-i pi/4) (docs/models.md).
The library evaluates lambda through Lommel's integral in closed form; here mpmath integrates it directly at
40 digits, which checks the derivation as well as the numbers."""
import mpmath
import numpy as np
import pytest

import libcoil

mpmath.mp.dps = 40


def g_exact(x):
    x = mpmath.mpf(x)
    u = x * mpmath.exp(-1j * mpmath.pi / 4)
    lam = mpmath.quad(lambda s: abs(mpmath.besselj(1, u * s)) ** 2 * s, [0, 0.5, 1])
    return x**2 * lam / abs(mpmath.besselj(0, u)) ** 2


def g_mpmath(x):
    return float(g_exact(x))


@pytest.mark.parametrize("x", [1e-3, 0.01, 0.049, 0.051, 0.3, 1.0, 3.0, 10.0, 25.9, 26.1, 40.0])
def test_loss_function_against_quadrature(x):
    assert libcoil.proximity_loss_function(x) == pytest.approx(g_mpmath(x), rel=1e-12)


def test_low_frequency_series_coefficients():
    # G = (x^4/16)(1 - 11 x^4/384 + c x^8): the x^4 coefficient as a fraction, read off the quadrature.
    x = mpmath.mpf("0.001")
    coeff = (g_exact(x) / (x**4 / 16) - 1) / x**4  # at 40 digits
    assert float(coeff) == pytest.approx(-11 / 384, rel=1e-6)


def test_vectorised():
    x = np.array([0.5, 2.0, 8.0])
    assert np.array_equal(libcoil.proximity_loss_function(x), [libcoil.proximity_loss_function(v) for v in x])


def field_sum_mpmath(mean_diameter, turns, pitch, wire_diameter):
    """<|H_i / I|^2> over the turns, summed directly at 30 digits: the ring field of every other turn
    (Smythe, "Static and Dynamic Electricity" (1950) 7.10, with mpmath's ellipk and ellipe) plus the own-turn
    term (ln(8 b / r) - 1.75) / (4 pi b) that proximity.hpp documents (its constant a fit, stated there)."""
    with mpmath.workdps(30):
        b, p, r = mpmath.mpf(mean_diameter) / 2, mpmath.mpf(pitch), mpmath.mpf(wire_diameter) / 2
        n = int(round(turns))

        def ring(z):
            m = 4 * b**2 / (4 * b**2 + z**2)
            K, E, root = mpmath.ellipk(m), mpmath.ellipe(m), mpmath.sqrt(4 * b**2 + z**2)
            return (K - E) / (2 * mpmath.pi * root), z / (2 * mpmath.pi * b * root) * (-K + (2 * b**2 + z**2) / z**2 * E)

        fields = [ring(k * p) for k in range(1, n)]
        own = (mpmath.log(8 * b / r) - mpmath.mpf("1.75")) / (4 * mpmath.pi * b)
        total = 0
        for i in range(n):
            hz, hr = own, 0
            for j in range(n):
                if j != i:
                    fz, fr = fields[abs(i - j) - 1]
                    hz += fz
                    hr += fr if j < i else -fr  # the turns below push outwards at turn i, those above inwards
            total += hz**2 + hr**2
        return float(total / n)


@pytest.mark.parametrize("coil", [(20e-3, 12, 1.5e-3, 0.8e-3), (10e-3, 3, 0.4e-3, 0.3e-3), (40e-3, 60, 2.5e-3, 1e-3),
                                  (0.5, 25, 0.3e-3, 0.2e-3), (4e-3, 300, 2e-3, 0.5e-3)])
def test_field_sum_against_a_direct_sum(coil):
    # The library sums the ring fields from tables (tools/ring_field_tables.py) with prefix sums; the direct
    # double sum here takes the elliptic integrals themselves. The last two coils reach below the tables
    # (turns 0.6 thousandths of the radius apart, which the library takes from the elliptic integrals) and
    # into their far-field tail (s = z / 2b up to 150).
    D, n, p, d = coil
    s = libcoil.Solenoid(mean_diameter=D, turns=n, pitch=p, wire=libcoil.Wire(diameter=d))
    assert libcoil.mean_square_field_per_ampere(s) == pytest.approx(field_sum_mpmath(D, n, p, d), rel=5e-15)  # measured 1.3e-15


def test_the_ring_field_generator_is_current(source_dir):
    # libcoil/src/models/ring_field_tables.hpp is generated; running tools/ring_field_tables.py again must give it back.
    import subprocess
    import sys
    out = subprocess.run([sys.executable, str(source_dir / "tools" / "ring_field_tables.py")], capture_output=True, text=True,
                         check=True).stdout
    assert out == (source_dir / "libcoil" / "src" / "models" / "ring_field_tables.hpp").read_text()
