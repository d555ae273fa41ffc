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
// Domain:  pitch >= wire diameter, and both wire radius and pitch small against the mean radius a: the
//          geometric mean distances treat each turn's neighbourhood as flat. Measured against the filament
//          model, the error grows as about 3 % * (p/a)^2, whatever N is, so the library holds Rosa to
//          p <= 0.4 a (rosa_in_domain) and falls back to the filament sum beyond.
// Accuracy (tests/cpp/test_inductance.cpp, against the filament model, N = 1..1000, p/d = 1..8,
//          a = 10..500 wire radii): worst 0.46 % at p = 0.4 a, 0.12 % at p = 0.2 a, 0.03 % at p = 0.1 a;
//          2.5 % at p = a. B(N) matches the tabulated values to 1e-4.
#pragma once

#include "libcoil/models/nagaoka.hpp"

namespace libcoil {

// A for pitch over bare wire diameter p/d >= 1.
double rosa_self_correction(double pitch_to_wire);
// B for N >= 1 turns (fractional allowed). B(1) = 0, B(2) = 0.1137, B(inf) = 0.3379.
double rosa_mutual_correction(double turns);
// True where the correction is trusted to 0.5 %: pitch <= 0.4 * mean radius.
bool rosa_in_domain(double pitch, double mean_radius);
// Round-wire inductance in H: the exact current sheet minus mu0 a N (A + B).
double rosa_inductance(double mean_diameter, double turns, double pitch, double wire_diameter);

// The same with its partial derivatives: dL/dN in H per turn (B is continuous in N, its slope steps at
// each whole N; this is the slope just below the next whole number) and dL/dp in H/m. The current sheet's part comes from nagaoka_coefficient_and_slope, A's
// from dA/dp = -1/p, B's from B = 2 S0 - 2 S1 / N. Newton's steps in the design search use them.
struct InductanceGradient {
    double inductance, d_turns, d_pitch;
};
InductanceGradient rosa_inductance_gradient(double mean_diameter, double turns, double pitch, double wire_diameter);
// The same from the coefficient and slope at D / (N p), for a caller that has them (the design search
// evaluates many coils of one length).
InductanceGradient rosa_inductance_gradient(double mean_diameter, double turns, double pitch, double wire_diameter,
                                            const NagaokaSlope& sheet);

}  // namespace libcoil
