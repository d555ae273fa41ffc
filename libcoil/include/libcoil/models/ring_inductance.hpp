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

}  // namespace libcoil
