"""Piecewise polynomial tables over octaves, shared by the generators of libcoil's tabulated kernels
(tools/ring_field_tables.py, tools/helix_tables.py).

A pair of functions of one variable s > 0 is tabulated on [2^low, 2^high): each octave [2^e, 2^(e+1)) is cut
into `parts` equal parts, and on each part both functions are polynomials of one degree in w in [-1, 1] that
interpolate them at the Chebyshev points (mpmath's chebyfit). The octave, the part and w come straight from
the bits of s in the C++ (ring_field.hpp's octave_place); `place` here does the same. The C++ evaluates a
pair by Estrin's scheme, both polynomials side by side in one SSE2 register (polynomial.hpp's estrin_pair);
`evaluate` repeats that order of operations in double, so that the generators measure what the library
computes.
"""
import math

import mpmath as mp


def fit(f, a, w, degree):
    """f on [a, a + w] as a polynomial in v in [-1, 1], lowest power first."""
    poly = mp.chebyfit(lambda v: f(a + w * (v + 1) / 2), [-1, 1], degree + 1)
    return [float(c) for c in reversed(poly)]


def evaluate(c, w):
    """In double, by Estrin's scheme in the same order as the C++ (polynomial.hpp)."""
    v, x = list(c), w
    while len(v) > 1:
        v = [v[2 * i] + v[2 * i + 1] * x if 2 * i + 1 < len(v) else v[2 * i] for i in range((len(v) + 1) // 2)]
        x = x * x
    return v[0]


def fit_octaves(pair, low, high, parts, degree):
    """[(first coefficients, second coefficients)] for every part of every octave, lowest octave first."""
    memo = {}  # both fits of a part ask for the same points

    def pair_at(x):
        if x not in memo:
            memo[x] = pair(x)
        return memo[x]

    body = []
    for e in range(low, high):
        for p in range(parts):
            a, w = mp.mpf(2) ** e * (1 + mp.mpf(p) / parts), mp.mpf(2) ** e / parts
            body.append(tuple(fit(lambda x, j=j: pair_at(x)[j], a, w, degree) for j in range(2)))
    return body


def place(s, low, parts):
    """(index of the part, w on it) for low <= log2(s), as the C++ finds them from the bits."""
    mantissa, e = math.frexp(s)  # s = mantissa 2^e, mantissa in [0.5, 1)
    e -= 1
    y = mantissa * 2 - 1  # s = 2^e (1 + y), exact
    part = int(y * parts)
    return (e - low) * parts + part, y * (2 * parts) - (2 * part + 1)


def body_value(body, s, low, parts):
    i, w = place(s, low, parts)
    return evaluate(body[i][0], w), evaluate(body[i][1], w)


def pairs_initialiser(first, second):
    """The C++ initialiser of one part, the two functions' coefficients side by side."""
    return "{" + ", ".join("{" + repr(a) + ", " + repr(b) + "}" for a, b in zip(first, second)) + "}"
