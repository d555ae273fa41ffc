// A rational fit of a sampled frequency response, and its realisation as a circuit of R, L, C and G.
//
// Method:  vector fitting (B. Gustavsen and A. Semlyen, "Rational approximation of frequency domain
//          responses by vector fitting", IEEE Trans. Power Delivery 14 (1999) 1052; quoted from memory):
//          f(s) ~ d + s e + sum_n c_n / (s - a_n) over s = j 2 pi f, the poles relocated by iterating the
//          weighted linear problem with the scaling function sigma(s) = 1 + sum_n ct_n / (s - a_n) (its zeros
//          become the new poles: the eigenvalues of A - b ct^T in real form), unstable poles reflected, then
//          the residues solved with the poles fixed. Real-valued least squares (Eigen's QR), points weighted
//          by 1 / |f| (a relative fit).
// Realisation (an admittance, Foster's second form): d a conductance, e a capacitance, each real pole a
//          series R-L branch (L = 1 / c, R = -a / c), each complex pair a branch of R and L in series with C
//          parallel to G, from matching (2 Re c s - 2 Re(c conj a)) / (s^2 - 2 Re a s + |a|^2) to that
//          branch's admittance (our derivation). A fit whose elements are not all non-negative is not
//          realisable as passive parts, and is reported so (`realisable`).
// Domain:  responses of passive one-ports over a band of a few decades; the order (poles) is the caller's.
#pragma once

#include <complex>
#include <string>
#include <vector>

namespace libcoil {

struct RationalFit {
    std::vector<std::complex<double>> poles, residues;  // complex pairs follow each other (a, conj a)
    double constant = 0, proportional = 0;                // d, e
    double rms_relative_error = 0, max_relative_error = 0;  // over the fitted points
    std::complex<double> operator()(std::complex<double> s) const;
};

// `order` poles (even numbers give complex pairs; an odd order adds one real pole), `iterations` pole
// relocations. InputError naming "frequencies", "values" or "order".
RationalFit vector_fit(const std::vector<double>& frequencies, const std::vector<std::complex<double>>& values, int order,
                       int iterations = 12);

// A fit meant to be realised as passive parts: the complex pole pairs from vector_fit at order 2 x `pairs`,
// the real poles fixed, `per_decade` of them spread logarithmically from a decade below the band to its top;
// then the residues by least squares with the real poles' residues, the constant and the proportional term
// held non-negative (Lawson and Hanson's active set, 1974, quoted from memory), the pairs' free.
RationalFit passive_fit(const std::vector<double>& frequencies, const std::vector<std::complex<double>>& values, int pairs,
                        double per_decade = 2);

// One branch of an admittance's Foster realisation between the two terminals: R + sL in series with (C || G);
// a value of 0 leaves that element out (C = 0 and G = 0: the branch has no capacitor).
struct FosterBranch {
    double resistance = 0, inductance = 0, capacitance = 0, conductance = 0;
};
struct FosterAdmittance {
    double conductance = 0, capacitance = 0;  // across the terminals
    std::vector<FosterBranch> branches;
    bool realisable = true;                   // every element >= 0 (a SPICE netlist takes negative ones too)
    std::string reason;                       // why not
};
FosterAdmittance foster_admittance(const RationalFit& y);

// The least of Re Y(j w) / |Y| over a log grid from `from` to `to` (Hz) and at DC: passive where >= 0.
double least_real_part(const RationalFit& y, double from, double to);

}  // namespace libcoil
