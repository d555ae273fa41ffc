#!/usr/bin/python3
"""Writes libcoil/src/models/skin_tables.hpp: the skin ratios and the proximity loss function as tables.

Three functions of x = sqrt(2) r / delta, from the Bessel solution of a round wire, evaluated by mpmath at
50 digits (z = x e^(3 pi i/4), ber + i bei = J0(z), ber' + i bei' = -e^(3 pi i/4) J1(z)):
    F(x)  = R_ac / R_dc        = (x / 2) (ber bei' - bei ber') / (ber'^2 + bei'^2)
    Li(x) = L_int(f) / L_int(0) = (4 / x) (ber ber' + bei bei') / (ber'^2 + bei'^2)
    G(x)  = x^2 lambda(u) / |J0(u)|^2, u = x e^(-i pi/4), lambda = -Im(conj(u) J1(u) conj(J1'(u))) / x^2
(skin_effect.hpp, proximity.hpp). On [0, X_TABLE] each is a polynomial of degree DEGREE in w in [-1, 1] on
SEGMENTS equal parts, interpolating at the Chebyshev points (mpmath's chebyfit); on the first part G / x^4
is tabulated instead (G = x^4 / 16 (1 - ...) at small x, so that its relative accuracy holds to x = 0).
Beyond X_TABLE, in t = X_TABLE / x in (0, 1], the functions times their asymptotic order (F t, Li / t, G t)
are polynomials of degree TAIL_DEGREE on TAIL_SEGMENTS equal parts of t; at t = 0 they take the limits
1 / (2 sqrt 2), 2 sqrt 2 and the same for G, so every x to infinity is covered. The script measures the
tables in double arithmetic against mpmath on 0 .. 1e4 and writes the worst errors into the header.

Run:  /usr/bin/python3 tools/skin_tables.py > libcoil/src/models/skin_tables.hpp   (about a minute)
"""
import mpmath as mp

mp.mp.dps = 50
X_TABLE = 32
SEGMENTS = 64
DEGREE = 14
TAIL_SEGMENTS = 4
TAIL_DEGREE = 16
ROT = mp.exp(3j * mp.pi / 4)


def bessel(x):
    z = x * ROT
    j0 = mp.besselj(0, z)
    d = -ROT * mp.besselj(1, z)
    return j0, d


def skin(x):
    x = mp.mpf(x)
    if x < mp.mpf("1e-6"):  # the series; its next terms are below 1e-40 (and mpmath's Bessel sums lose them there)
        return 1 + x**4 / 192, 1 - x**4 / 384
    j0, d = bessel(x)
    ber, bei, berp, beip = j0.real, j0.imag, d.real, d.imag
    den = berp**2 + beip**2
    return x / 2 * (ber * beip - bei * berp) / den, 4 / x * (ber * berp + bei * beip) / den


def proximity(x):
    x = mp.mpf(x)
    u = x * mp.exp(-1j * mp.pi / 4)
    j0, j1 = mp.besselj(0, u), mp.besselj(1, u)
    j1p = j0 - j1 / u
    lam = -(mp.conj(u) * j1 * mp.conj(j1p)).imag / x**2
    return x**2 * lam / abs(j0) ** 2


def proximity_over_x4(x):
    x = mp.mpf(x)
    if x < mp.mpf("1e-6"):
        return mp.mpf(1) / 16 * (1 - 11 * x**4 / 384)
    return proximity(x) / x**4


def functions():
    # (name, value on the table, value scaled for the tail, in terms of x)
    return [
        ("resistance", lambda x: skin(x)[0], lambda x: skin(x)[0] * X_TABLE / x),
        ("internal_inductance", lambda x: skin(x)[1], lambda x: skin(x)[1] * x / X_TABLE),
        ("proximity", proximity, lambda x: proximity(x) * X_TABLE / x),
    ]


def fit(f, a, w, degree):
    poly = mp.chebyfit(lambda v: f(a + w * (v + 1) / 2), [-1, 1], degree + 1)
    return [float(c) for c in reversed(poly)]  # lowest power first


def evaluate(c, w):  # in double, by Estrin's scheme in the same order as the C++ (wire_kernels.hpp)
    v, x = list(c), w
    while len(v) > 1:
        v = [v[2 * i] + v[2 * i + 1] * x if 2 * i + 1 < len(v) else v[2 * i] for i in range((len(v) + 1) // 2)]
        x = x * x
    return v[0]


def tables():
    out = {}
    w = mp.mpf(X_TABLE) / SEGMENTS
    tw = mp.mpf(1) / TAIL_SEGMENTS
    for name, f, scaled in functions():
        body = []
        for i in range(SEGMENTS):
            g = proximity_over_x4 if (name == "proximity" and i == 0) else f
            body.append(fit(g, i * w, w, DEGREE))
        # The tail in t = X_TABLE / x: t = 0 is x = infinity, where the scaled function tends to its limit.
        limit = {"resistance": X_TABLE / (2 * mp.sqrt(2)), "internal_inductance": 2 * mp.sqrt(2) / X_TABLE,
                 "proximity": None}[name]

        if name == "proximity":  # G t tends to a limit too: taken far out (its next term is O(t))
            limit = proximity(mp.mpf(10) ** 40) * X_TABLE / mp.mpf(10) ** 40

        def in_t(t, scaled=scaled, limit=limit):
            if t == 0:
                return limit
            return scaled(X_TABLE / t)
        tail = [fit(in_t, j * tw, tw, TAIL_DEGREE) for j in range(TAIL_SEGMENTS)]
        out[name] = (body, tail)
    return out


def table_value(t, name, x):
    body, tail = t[name]
    if x < X_TABLE:
        i = min(int(x * SEGMENTS / X_TABLE), SEGMENTS - 1)
        a = i * X_TABLE / SEGMENTS
        v = evaluate(body[i], 2 * (x - a) * SEGMENTS / X_TABLE - 1)
        return v * x**4 if (name == "proximity" and i == 0) else v
    s = X_TABLE / x
    j = min(int(s * TAIL_SEGMENTS), TAIL_SEGMENTS - 1)
    v = evaluate(tail[j], 2 * (s * TAIL_SEGMENTS - j) - 1)
    return v * x / X_TABLE if name != "internal_inductance" else v * X_TABLE / x


def measure(t):
    xs = [k / 64 for k in range(0, 64 * 40)] + [float(mp.mpf(10) ** (mp.mpf(k) / 50)) for k in range(0, 201)]
    xs += [1e-300, 1e-8, 1e-3, 0.05, X_TABLE * (1 - 1e-12), float(X_TABLE), X_TABLE * (1 + 1e-12)]
    worst = {}
    for name, f, _ in functions():
        e = 0.0
        for x in xs:
            exact = proximity_over_x4(x) * mp.mpf(x) ** 4 if name == "proximity" and x < 1 else f(x)
            if exact < mp.mpf("1e-290"):  # not a double: the table's 0 is right
                continue
            e = max(e, abs(table_value(t, name, x) / exact - 1))
        worst[name] = float(e)
    return worst, len(xs)


def main():
    t = tables()
    worst, points = measure(t)
    o = []
    o.append("// Generated by tools/skin_tables.py; do not edit. The skin ratios R_ac / R_dc and L_int(f) / L_int(0) and the")
    o.append("// proximity loss function G of a round wire (skin_effect.hpp, proximity.hpp) as functions of x = sqrt(2) r / delta:")
    o.append(f"// on [0, {X_TABLE}] polynomials of degree {DEGREE} in w in [-1, 1] on {SEGMENTS} equal parts (on the first, G / x^4),")
    o.append(f"// beyond it F t, Li / t and G t in t = {X_TABLE} / x on {TAIL_SEGMENTS} equal parts of (0, 1], degree {TAIL_DEGREE};")
    o.append("// interpolating mpmath's Bessel values at 50 digits at the Chebyshev points of each part.")
    o.append(f"// Measured in double against mpmath, x = 0 .. 1e4 ({points} points): R ratio within "
             f"{worst['resistance']:.1e}, L ratio within {worst['internal_inductance']:.1e}, G within {worst['proximity']:.1e} (relative).")
    o.append("#pragma once")
    o.append("")
    o.append("namespace libcoil::detail::skin_tables {")
    o.append("")
    o.append(f"inline constexpr int segments = {SEGMENTS}, degree = {DEGREE}, tail_segments = {TAIL_SEGMENTS}, tail_degree = {TAIL_DEGREE};")
    o.append(f"inline constexpr double x_table = {X_TABLE!r};")
    for name in ("resistance", "internal_inductance", "proximity"):
        body, tail = t[name]
        o.append(f"inline constexpr double {name}[segments][degree + 1] = {{  // lowest power of w first")
        for c in body:
            o.append("    {" + ", ".join(repr(x) for x in c) + "},")
        o.append("};")
        o.append(f"inline constexpr double {name}_tail[tail_segments][tail_degree + 1] = {{")
        for c in tail:
            o.append("    {" + ", ".join(repr(x) for x in c) + "},")
        o.append("};")
    o.append("")
    o.append("}  // namespace libcoil::detail::skin_tables")
    print("\n".join(o))


if __name__ == "__main__":
    main()
