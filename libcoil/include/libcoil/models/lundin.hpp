// Lundin's handbook approximation to Nagaoka's coefficient.
//
// Method:  with x = (D/l)^2 for l >= D, and x = (l/D)^2 for l < D,
//          f1(x) = (1 + 0.383901 x + 0.017108 x^2) / (1 + 0.258952 x),
//          f2(x) = 0.093842 x + 0.002029 x^2 - 0.000801 x^3,
//          long coil:  K = f1((D/l)^2) - 4 D / (3 pi l),
//          short coil: K = (2 l / (pi D)) * [ (ln(4 D / l) - 1/2) f1((l/D)^2) + f2((l/D)^2) ].
// Source:  R. Lundin, "A handbook formula for the inductance of a single-layer circular coil",
//          Proc. IEEE 73 (1985) 1428-1429 (coefficients quoted from memory); Lundin states 3 ppm.
// Domain:  all D / l.
// Accuracy (tests/cpp/test_inductance.cpp, against the exact Nagaoka value): worst 2.5 ppm (near D / l = 0.9) over
//          D / l = 1e-3 .. 1e3.
#pragma once

namespace libcoil {

double lundin_coefficient(double diameter_to_length);
double lundin_inductance(double mean_diameter, double length, double turns);

}  // namespace libcoil
