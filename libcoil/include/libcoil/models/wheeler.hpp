// Wheeler's long-coil formula.
//
// Method:  L = mu0 * pi * r^2 * N^2 / (l + 0.9 r), i.e. a Nagaoka coefficient K = 1 / (1 + 0.45 D / l).
//          Wheeler wrote it in inches and microhenries as L = r^2 N^2 / (9 r + 10 l); that form rounds
//          mu0 * pi and reads 0.27 % lower than this one.
// Source:  H. A. Wheeler, "Simple inductance formulas for radio coils", Proc. IRE 16 (1928) 1398-1400.
// Domain:  current sheet; Wheeler claims 1 % for l > 0.8 r (D / l < 2.5). Defined, but inaccurate, beyond.
// Accuracy (tests/cpp/test_inductance.cpp, against the exact Nagaoka value): worst 0.33 % for
//          D / l <= 2.5; 10.6 % low at D / l = 10.
#pragma once

namespace libcoil {

// Nagaoka-equivalent coefficient of Wheeler's formula.
double wheeler_coefficient(double diameter_to_length);
// Current-sheet inductance in H of N turns of mean diameter D over length l (both in m).
double wheeler_inductance(double mean_diameter, double length, double turns);
// True where Wheeler's stated 1 % accuracy applies (l > 0.8 r).
bool wheeler_in_domain(double diameter_to_length);

}  // namespace libcoil
