"""The polynomials the fitted screens share (tools/srf_screen_envelope.py, tools/inductance_fall_fit.py): every
monomial of total degree <= `degree` in a list of features, each feature scaled to [-1, 1] over its sample's range,
in the order the generated headers list their coefficients."""
import itertools
import math


def powers(count, degree):
    """The monomials of total degree <= `degree` in `count` features, as exponent tuples (the headers' order)."""
    out = []
    for k in range(degree + 1):
        for combo in itertools.combinations_with_replacement(range(count), k):
            out.append(tuple(combo.count(f) for f in range(count)))
    return out


def monomials(x, low, high, degree):
    """The monomials' values at the features `x`, each scaled to [-1, 1] over low .. high."""
    scaled = [(2 * v - lo - hi) / (hi - lo) for v, lo, hi in zip(x, low, high)]
    return [math.prod(s**e for s, e in zip(scaled, p)) for p in powers(len(x), degree)]
