// Self-inductance of a circular ring of round wire at low frequency (uniform current).
//
// Method:  L = mu0 a [ ln(8 a / r) - 7/4 + (r^2 / (8 a^2)) (ln(8 a / r) + 1/3) ], the thin-ring expansion
//          to second order in r / a; the 7/4 holds the internal inductance mu0 a / 4 of a uniform current.
// Source:  Rosa and Grover, Bull. BS 8 (1912), formula (70); Grover (1946) ch. 14 (quoted from memory).
// Domain:  r < a; the second-order term keeps it within 0.1 % of the exact ring for a >= 2 r (Grover).
// Accuracy (tests/cpp/test_mutual.cpp): the ring in the limit r << a matches the mutual inductance of two
//          filaments at the wire's geometric mean distance r e^(-1/4) to 1e-6.
#pragma once

namespace libcoil {

double ring_self_inductance(double ring_radius, double wire_radius);

// Geometric mean distance of an a x b rectangle from itself (Rosa; Grover 1946 ch. 2):
//   ln g = ln d - (a^2/12b^2) ln(1 + b^2/a^2) - (b^2/12a^2) ln(1 + a^2/b^2)
//          + (2a/3b) atan(b/a) + (2b/3a) atan(a/b) - 25/12,  d^2 = a^2 + b^2.
// A square gives 0.44705 a, a thin strip a e^(-3/2). Used for the cells of the cross-section solver.
double rectangle_gmd(double a, double b);

// Geometric mean distance between two axis-aligned rectangles [x0, x1] x [z0, z1] and [u0, u1] x [w0, w1]
// (they may touch or overlap): ln g = (1 / A1 A2) * integral of ln|p - q| over both, in closed form as the
// 16-term difference of the fourth primitive of ln(x^2 + z^2) / 2,
//   F(x, z) = x^3 z atan(z/x) / 6 + x z^3 atan(x/z) / 6 - 25 x^2 z^2 / 48 - (x^4 - 6 x^2 z^2 + z^4) ln(x^2 + z^2) / 48,
// (terms of the form f(x) + g(x) z + h(z) + k(z) x cancel in the difference, which keeps thin rectangles
// accurate). Derived for this project; the same rectangle twice gives rectangle_gmd.
double rectangles_gmd(double x0, double x1, double z0, double z1, double u0, double u1, double w0, double w1);

}  // namespace libcoil
