"""Kelvin functions and the skin effect against mpmath and scipy (Debian packages)."""
import math

import mpmath
import numpy as np
import pytest
import scipy.special as sp

import libcoil

mpmath.mp.dps = 30
ROT = mpmath.exp(3j * mpmath.pi / 4)


def kelvin_mpmath(x):
    """ber + i bei = J0(x e^(3 pi i/4)), ber' + i bei' = -e^(3 pi i/4) J1(x e^(3 pi i/4)) (A&S 9.9.1)."""
    z = x * ROT
    j0, d = mpmath.besselj(0, z), -ROT * mpmath.besselj(1, z)
    return complex(j0), complex(d)


def skin_mpmath(x):
    z = x * ROT
    j0, d = mpmath.besselj(0, z), -ROT * mpmath.besselj(1, z)
    ber, bei, berp, beip = j0.real, j0.imag, d.real, d.imag
    den = berp**2 + beip**2
    return float(x / 2 * (ber * beip - bei * berp) / den), float(4 / x * (ber * berp + bei * beip) / den)


XS = np.concatenate([np.linspace(0.0, 100.0, 401), [19.9, 20.1, 25.99, 26.0, 26.01]])


def test_kelvin_against_mpmath():
    worst = 0.0
    for x in XS:
        ours = libcoil.kelvin(x)
        j0, d = kelvin_mpmath(x)
        # Relative to the modulus: ber and bei have zeros, their modulus has none.
        worst = max(worst, abs(complex(ours[0], ours[1]) - j0) / abs(j0))
        if x > 0:
            worst = max(worst, abs(complex(ours[2], ours[3]) - d) / abs(d))
    assert worst <= 1e-12, worst


def test_kelvin_against_scipy():
    # scipy.special.ber/bei/berp/beip (the cephes routines) are themselves good to about 5e-10 of the
    # modulus near x = 10 (measured against mpmath here), so the bound is 1e-9; where scipy is within 1e-12
    # of mpmath the two agree to 1e-10.
    x = XS[XS > 0]
    ref = np.stack([sp.ber(x), sp.bei(x), sp.berp(x), sp.beip(x)], axis=1)
    ours = np.array([libcoil.kelvin(v) for v in x])
    mod0, mod1 = np.hypot(ref[:, 0], ref[:, 1]), np.hypot(ref[:, 2], ref[:, 3])
    err = np.maximum(np.abs(ours[:, :2] - ref[:, :2]).max(1) / mod0, np.abs(ours[:, 2:] - ref[:, 2:]).max(1) / mod1)
    assert err.max() <= 1e-9
    scipy_own = np.array([abs(complex(r[0], r[1]) - kelvin_mpmath(v)[0]) / abs(kelvin_mpmath(v)[0]) for v, r in zip(x, ref)])
    good = scipy_own < 1e-12
    assert good.sum() > 50
    assert err[good].max() <= 1e-10
    # Vectorised forms agree with the tuple form.
    assert np.array_equal(libcoil.ber(x), ours[:, 0]) and np.array_equal(libcoil.beip(x), ours[:, 3])


def test_skin_ratios_against_mpmath():
    worst = 0.0
    for x in XS[XS > 0]:
        r, l = skin_mpmath(x)
        worst = max(worst, abs(libcoil.skin_resistance_ratio(x) / r - 1), abs(libcoil.skin_inductance_ratio(x) / l - 1))
    assert worst <= 1e-12, worst


def g_mpmath(x):
    # The proximity loss function in the closed form (proximity.hpp), at the module's 30 digits.
    u = x * mpmath.exp(-1j * mpmath.pi / 4)
    j0, j1 = mpmath.besselj(0, u), mpmath.besselj(1, u)
    lam = -(mpmath.conj(u) * j1 * mpmath.conj(j0 - j1 / u)).imag / x**2
    return x**2 * lam / abs(j0) ** 2


def test_tables_within_1e15_of_mpmath_to_x_1e4():
    # Issue 20: the tabulated kernels (tools/skin_tables.py) to full double accuracy over x = 0 .. 1e4, on a
    # grid the generator did not measure on (offset points, log spaced above 1). mpmath at 30 digits
    # (independent of the generator's 50); below x = 1e-3 the series 1 + x^4/192, 1 - x^4/384 (its next terms
    # below 1e-17), G = x^4/16 (1 - 11 x^4/384).
    xs = np.concatenate([np.linspace(0.0013, 63.7, 700), np.geomspace(1.037, 1e4, 300), [1e-200, 1e-5, 31.999999, 32.000001]])
    worst = [0.0, 0.0, 0.0]
    with mpmath.workdps(30):
        for x in xs:
            xm = mpmath.mpf(float(x))
            if x < 1e-3:
                r, l, g = 1 + xm**4 / 192, 1 - xm**4 / 384, xm**4 / 16 * (1 - 11 * xm**4 / 384)
            else:
                r, l = (mpmath.mpf(v) for v in skin_mpmath_exact(xm))
                g = g_mpmath(xm)
            ours = (libcoil.skin_resistance_ratio(x), libcoil.skin_inductance_ratio(x), libcoil.proximity_loss_function(x))
            for k, exact in enumerate((r, l, g)):
                if exact > 1e-290:
                    worst[k] = max(worst[k], abs(float(mpmath.mpf(ours[k]) / exact - 1)))
    assert max(worst) <= 1e-15, worst  # measured 2.2e-16, 2.2e-16, 4.4e-16


def skin_mpmath_exact(x):
    z = x * ROT
    j0, d = mpmath.besselj(0, z), -ROT * mpmath.besselj(1, z)
    ber, bei, berp, beip = j0.real, j0.imag, d.real, d.imag
    den = berp**2 + beip**2
    return x / 2 * (ber * beip - bei * berp) / den, 4 / x * (ber * berp + bei * beip) / den


def test_tables_agree_with_the_series_they_replace():
    # The Kelvin-function series (kelvin.hpp, measured 9e-15 against mpmath) stays as the reference.
    worst = 0.0
    for x in XS:
        r, l = libcoil.skin_ratios_series(x)
        worst = max(worst, abs(libcoil.skin_resistance_ratio(x) / r - 1), abs(libcoil.skin_inductance_ratio(x) / l - 1),
                    abs(libcoil.proximity_loss_function(x) / libcoil.proximity_loss_function_series(x) - 1) if x > 0 else 0)
    assert worst <= 1e-12, worst


def test_the_table_generator_is_current(source_dir):
    # libcoil/src/models/skin_tables.hpp is generated; running tools/skin_tables.py again (mpmath) must give it back.
    import subprocess
    import sys
    out = subprocess.run([sys.executable, str(source_dir / "tools" / "skin_tables.py")], capture_output=True, text=True, check=True).stdout
    assert out == (source_dir / "libcoil" / "src" / "models" / "skin_tables.hpp").read_text()


def test_skin_ratios_against_scipy_complex_bessel():
    # The same ratio from scipy.special.jv at complex argument: Z_int / R_dc = (k r / 2) J0(k r) / J1(k r)
    # with k r = (1 - j) r / delta = x e^(-i pi/4) (Ramo, Whinnery & Van Duzer sec. 5.5).
    x = np.linspace(0.5, 100, 200)
    kr = x * np.exp(-1j * np.pi / 4)
    z = kr / 2 * sp.jv(0, kr) / sp.jv(1, kr)
    assert np.max(np.abs(libcoil.skin_resistance_ratio(x) / z.real - 1)) <= 1e-10
    # Internal reactance: X_int = omega L_int, so L_int / L_int(0) = Im(z) / (x^2 / 8) ... with
    # R_dc = 1 / (sigma pi r^2) and omega L_int(0) = R_dc x^2 / 8.
    assert np.max(np.abs(libcoil.skin_inductance_ratio(x) / (z.imag / (x**2 / 8)) - 1)) <= 1e-10


def test_asymptotic_limits():
    # Low frequency: R_ac/R_dc = 1 + x^4/192 + O(x^8), L ratio 1 - x^4/384 + O(x^8) (Ramo et al.; Dwight 1945).
    for x in (1e-4, 1e-3, 0.01, 0.05):
        assert libcoil.skin_resistance_ratio(x) == pytest.approx(1 + x**4 / 192, abs=1e-12)
        assert libcoil.skin_inductance_ratio(x) == pytest.approx(1 - x**4 / 384, abs=1e-12)
    # High frequency: r/(2 delta) + 1/4 + 3 delta/(32 r) + O(delta^2), with r/delta = x/sqrt 2.
    for x in (200.0, 1e3, 1e5):
        s = x / math.sqrt(2)
        assert libcoil.skin_resistance_ratio(x) == pytest.approx(s / 2 + 0.25 + 3 / (32 * s), rel=1e-7)
    assert libcoil.skin_inductance_ratio(1e4) == pytest.approx(2 * math.sqrt(2) / 1e4, rel=1e-3)


def test_copper_skin_depth_at_1_mhz():
    # Handbook figure: about 66 um for copper at 1 MHz and 20 degC (Reference Data for Radio Engineers
    # gives 66.1 um, quoted from memory). From IEC 60028 resistivity: 66.09 um.
    rho = libcoil.conductor("copper").resistivity_20
    assert libcoil.skin_depth(rho, 1e6) == pytest.approx(66.1e-6, abs=0.1e-6)
    # delta scales as 1/sqrt(f)
    assert libcoil.skin_depth(rho, 4e6) == pytest.approx(libcoil.skin_depth(rho, 1e6) / 2, rel=1e-15)


def test_bad_inputs():
    with pytest.raises(libcoil.InputError, match="frequency"):
        libcoil.skin_depth(1.7e-8, -1.0)
    with pytest.raises(libcoil.InputError, match="x"):
        libcoil.skin_resistance_ratio(float("nan"))
    with pytest.raises(libcoil.InputError, match="above 1000"):
        libcoil.kelvin(2000.0)
