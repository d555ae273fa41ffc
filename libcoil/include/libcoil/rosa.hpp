// Rosa's round-wire correction to the current-sheet inductance.
//
// Method:  L = L_sheet - mu0 * a * N * (A + B), a the mean radius.
//          A = 5/4 - ln(2 p / d) is the self-inductance of a turn of round wire (uniform current, so at
//          low frequency) minus that of a strip of width p; it follows from the geometric mean distances
//          d/2 * e^(-1/4) of the wire and p * e^(-3/2) of the strip.
//          B = (2/N) * sum_{k=1}^{N-1} (N - k) * ln(k p / g_k) is the mutual term: filament pairs at
//          distance k p against strip pairs at their geometric mean distance g_k, where
//          ln(g_k / p) = [(k+1)^2 ln(k+1) + (k-1)^2 ln(k-1) - 2 k^2 ln k] / 2 - 3/2.
//          For large k, ln(k p / g_k) = 1/(12 k^2) + 1/(60 k^4) + 1/(168 k^6) + ..., which the sum uses
//          from k = 3 on, where the closed form starts to cancel. Fractional N weights the pairs by N - k
//          over k < N, which is the same sum for whole N and continuous between.
// Source:  E. B. Rosa, "The self and mutual inductances of linear conductors", Bull. Bureau of Standards 4
//          (1908) 301; E. B. Rosa and F. W. Grover, Bull. BS 8 (1912) 1, formula (153); Grover (1946) ch. 16.
// Domain:  pitch >= wire diameter, mean radius much larger than the wire radius (the geometric mean
//          distances assume flat neighbourhoods). The library warns below 10 wire radii.
// Accuracy (tests/cpp/test_inductance.cpp): within 0.2 % of the filament model for N >= 5 and
//          a >= 10 wire radii (the acceptance bound is 0.5 %); B(N) matches the tabulated values to 1e-4.
#pragma once

namespace libcoil {

// A for pitch over bare wire diameter p/d >= 1.
double rosa_self_correction(double pitch_to_wire);
// B for N >= 1 turns (fractional allowed). B(1) = 0, B(2) = 0.1137, B(inf) = 0.3379.
double rosa_mutual_correction(double turns);
// Round-wire inductance in H: the exact current sheet minus mu0 a N (A + B).
double rosa_inductance(double mean_diameter, double turns, double pitch, double wire_diameter);

}  // namespace libcoil
