"""Property tests (hypothesis): for any input, a public function returns a finite number or raises
libcoil.InputError / libcoil.DomainError. No NaN or infinity escapes."""
import math

from hypothesis import given, settings, strategies as st

import libcoil

ERRORS = (libcoil.InputError, libcoil.DomainError)
anything = st.floats(allow_nan=True, allow_infinity=True)
positive = st.floats(min_value=1e-300, max_value=1e300)


def finite_or_error(f, *args):
    try:
        v = f(*args)
    except ERRORS:
        return
    assert math.isfinite(v), (f.__name__, args, v)


@settings(max_examples=300, deadline=None)
@given(anything)
def test_coefficients(x):
    for f in (libcoil.nagaoka, libcoil.lundin_coefficient, libcoil.wheeler_coefficient,
              libcoil.rosa_self_correction, libcoil.rosa_mutual_correction):
        finite_or_error(f, x)


@settings(max_examples=300, deadline=None)
@given(anything, anything, anything)
def test_sheet_formulas(d, l, n):
    for f in (libcoil.current_sheet_inductance, libcoil.wheeler_inductance, libcoil.lundin_inductance):
        finite_or_error(f, d, l, n)


@settings(max_examples=300, deadline=None)
@given(positive, st.floats(min_value=-1e3, max_value=1e9), positive, positive)
def test_round_wire_models(d, n, p, w):
    finite_or_error(libcoil.rosa_inductance, d, n, p, w)
    if n < 1e5:  # the filament sum is O(N)
        finite_or_error(libcoil.filament_inductance, d, n, p, w)


@settings(max_examples=300, deadline=None)
@given(anything, anything, anything)
def test_maxwell(a, b, z):
    finite_or_error(libcoil.coaxial_mutual_inductance, a, b, z)
    finite_or_error(libcoil.ring_self_inductance, a, b)


@settings(max_examples=200, deadline=None)
@given(st.text(max_size=20))
def test_quantity_parser_never_returns_non_finite(text):
    for dim in ("length", "inductance", "temperature", "dimensionless"):
        finite_or_error(libcoil.parse_quantity, text, dim, "f")
