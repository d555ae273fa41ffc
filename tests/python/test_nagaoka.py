"""Nagaoka's coefficient against outside references: scipy.special and mpmath (Debian packages)."""
import mpmath
import numpy as np
import pytest
import scipy.special as sp

import libcoil

mpmath.mp.dps = 40


def nagaoka_mpmath(rho):
    """The closed form at 40 digits, where its cancellation costs nothing."""
    rho = mpmath.mpf(rho)
    m = rho**2 / (1 + rho**2)
    k, kc = mpmath.sqrt(m), mpmath.sqrt(1 - m)
    K, E = mpmath.ellipk(m), mpmath.ellipe(m)
    return 4 / (3 * mpmath.pi * kc) * ((kc**2 / k**2) * (K - E) + E - k)


def nagaoka_scipy(rho):
    """The same closed form in double precision with scipy. K - E is taken from Carlson's R_D
    (scipy.special.elliprd) so that long coils keep their digits; E - k still cancels for short coils."""
    rho = np.asarray(rho, dtype=float)
    m = rho**2 / (1 + rho**2)
    mc = 1 / (1 + rho**2)
    k, kc = np.sqrt(m), np.sqrt(mc)
    k_minus_e_over_m = sp.elliprd(0, mc, 1) / 3
    E = sp.ellipe(m)
    return 4 / (3 * np.pi * kc) * (mc * k_minus_e_over_m + E - k)


def test_against_mpmath_whole_range():
    # Measured: 4.4e-16 within the table (D/l <= 9), 5.6e-16 beyond it (the elliptic integrals).
    rho = np.logspace(-3, 3, 1201)
    ours = libcoil.nagaoka_coefficient(rho)
    ref = np.array([float(nagaoka_mpmath(r)) for r in rho])
    rel = np.abs(ours / ref - 1)
    assert rel.max() <= 2e-15, (rel.max(), rho[rel.argmax()])


def test_table_against_mpmath_at_random_points():
    # Points that fall anywhere within the table's parts (not on a grid its generator saw).
    rng = np.random.default_rng(2026)
    rho = np.exp(rng.uniform(np.log(1e-4), np.log(9), 400))
    rel_value = np.abs(libcoil.nagaoka_coefficient(rho) / np.array([float(nagaoka_mpmath(r)) for r in rho]) - 1)
    assert rel_value.max() <= 2e-15, rel_value.max()
    ref_slope = np.array([float(mpmath.diff(nagaoka_mpmath, mpmath.mpf(r))) for r in rho[:100]])
    rel_slope = np.abs(libcoil.nagaoka_slope(rho[:100]) / ref_slope - 1)
    assert rel_slope.max() <= 2e-15, rel_slope.max()


def test_against_scipy_where_double_precision_resolves_1e12():
    # In double precision E - k loses digits as 1/k'^2 for short coils: the scipy reference itself is good
    # to 1e-12 only up to D/l of about 100; mpmath (above) carries the check to 1e3.
    rho = np.logspace(-3, 2, 1001)
    rel = np.abs(libcoil.nagaoka_coefficient(rho) / nagaoka_scipy(rho) - 1)
    assert rel.max() <= 1e-12, (rel.max(), rho[rel.argmax()])


def test_textbook_scipy_closed_form_in_the_middle():
    # scipy.special.ellipk/ellipe straight into the textbook formula, where it is well conditioned.
    rho = np.logspace(-1, 1, 201)
    m = rho**2 / (1 + rho**2)
    k, kc = np.sqrt(m), np.sqrt(1 - m)
    K, E = sp.ellipk(m), sp.ellipe(m)
    ref = 4 / (3 * np.pi * kc) * ((kc**2 / k**2) * (K - E) + E - k)
    assert np.max(np.abs(libcoil.nagaoka_coefficient(rho) / ref - 1)) <= 1e-12


def test_published_table():
    # Nagaoka 1909 / Grover 1946 table, quoted from memory, +-1 in the last digit.
    table = {0.1: 0.9588, 0.2: 0.9201, 0.5: 0.8181, 1: 0.6884, 2: 0.5255, 5: 0.3198, 10: 0.2033}
    for rho, k in table.items():
        assert libcoil.nagaoka_coefficient(rho) == pytest.approx(k, abs=1e-4)


def test_vectorised_shapes_and_errors():
    a = np.array([[0.1, 1.0], [10.0, 100.0]])
    out = libcoil.nagaoka_coefficient(a)
    assert isinstance(out, np.ndarray) and out.shape == (2, 2)
    assert out[0, 1] == pytest.approx(0.6884, abs=1e-4)
    assert isinstance(libcoil.nagaoka_coefficient(1.0), float)
    with pytest.raises(libcoil.InputError, match="diameter_to_length: -1 must be greater than zero"):
        libcoil.nagaoka_coefficient(np.array([1.0, -1.0]))
    with pytest.raises(ValueError):  # InputError is a ValueError
        libcoil.nagaoka_coefficient(float("nan"))


def test_slope_against_mpmath_derivative():
    # mpmath.diff differentiates the 40-digit closed form numerically (its default step is far below
    # double precision), so the reference is good to ~1e-30; beyond the table ours loses digits to the
    # bracket's cancellation for short coils.
    rho = np.logspace(-3, 3, 241)
    ours = libcoil.nagaoka_slope(rho)
    ref = np.array([float(mpmath.diff(nagaoka_mpmath, mpmath.mpf(r))) for r in rho])
    rel = np.abs(ours / ref - 1)
    # Measured: 4.4e-16 for D/l = 1e-3 .. 9, where the table holds; beyond it the elliptic slope, 2.2e-14
    # up to D/l = 10 and 1.35e-10 at D/l = 944, where the short coil's bracket has cancelled to
    # O(ln rho / rho^2).
    assert rel[rho <= 9].max() <= 2e-15, rel[rho <= 9].max()
    assert rel[rho <= 10].max() <= 1e-12, rel[rho <= 10].max()
    assert rel.max() <= 3e-10, (rel.max(), rho[rel.argmax()])
    # The long-coil series K = 1 - 4 rho / (3 pi) + rho^2 / 8 - ... (Grover 1946, from memory) gives the
    # slope's limit: -4 / (3 pi) + rho / 4.
    assert libcoil.nagaoka_slope(1e-4) == pytest.approx(-4 / (3 * np.pi) + 1e-4 / 4, rel=1e-9)


def test_the_generated_table_is_what_its_generator_writes(source_dir):
    # The table in libcoil/src/models/nagaoka_table.hpp is generated; running its generator again must give the
    # same file byte for byte, so that no hand edit or stale table goes unnoticed.
    import subprocess
    import sys
    out = subprocess.run([sys.executable, str(source_dir / "tools" / "nagaoka_table.py")],
                         capture_output=True, text=True, check=True, timeout=120).stdout
    assert out == (source_dir / "libcoil" / "src" / "models" / "nagaoka_table.hpp").read_text()
