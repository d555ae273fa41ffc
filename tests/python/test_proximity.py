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
