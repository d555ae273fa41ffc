// The fixture study: a fixture's port impedance over frequency, with each coil as its full analysis sees it
// (its spec's recommended impedance model, shield, mounting, bench terms), and the verdict against its
// reference.
//
// Method:  nodal analysis: the admittance matrix of the nodes other than ground, each part's admittance
//          1 / Z(f) stamped between its nodes; the port impedance matrix Z_jk = (e_j)^T Y^-1 e_k with e_k the
//          port's unit current (+1 into its first node, -1 out of its second), Eigen's partial-pivot LU; for
//          two ports also S = (Z - Z0)(Z + Z0)^-1 with the ports' real references. Textbook circuit theory.
// Reference: the same fixture with ideal parts and each coil an ideal inductor of its nominal L (a part given
//          by a Touchstone file stays as it is), or a table of the first port's |Z|. Deviation 20 log10 of the
//          magnitude ratio (dB) or the ratio less one (%), judged over the reference's band.
// Blame:   at the worst point, each non-ideal part is made ideal alone and the deviation taken again; the part
//          that removes the most of it is named, with the share it removes.
#pragma once

#include <array>
#include <complex>
#include <string_view>
#include <optional>
#include <string>
#include <vector>

#include "libcoil/spec/fixture.hpp"

namespace libcoil {

struct FixtureRequest {
    std::vector<double> frequencies;  // Hz, > 0, rising; given outright (else from, to, points, log spaced)
    std::optional<double> from, to;   // Hz; the fixture's sweep, else 10 kHz .. 300 MHz or the reference band
    std::optional<int> points;
};

struct FixtureCoil {
    std::string part, source;
    double nominal_inductance = 0;  // H, the ideal reference's
    double self_resonance = 0;      // Hz, as mounted
    std::string model;              // the impedance model its sweep took
};

struct FixtureVerdict {
    bool pass = false;
    double band_low = 0, band_high = 0;    // Hz
    double tolerance = 0;                  // fraction, or dB where in_db
    bool in_db = false;
    double worst_deviation = 0;            // as the tolerance: fraction or dB
    double worst_frequency = 0;            // Hz
    std::optional<double> first_failure;   // Hz
    std::string dominant_part;             // "" when every part is ideal
    double dominant_share = 0;             // of the worst deviation it removes, 0 .. 1 (may pass 1)
};

struct FixtureResult {
    std::string title, description;
    std::vector<double> frequency;                       // Hz
    std::vector<FixturePort> ports;
    // Z matrix at each frequency, ports x ports row-major (one port: its impedance).
    std::vector<std::vector<std::complex<double>>> impedance;
    std::vector<std::complex<double>> reference;         // the first port's reference Z (empty without one)
    std::vector<double> deviation;                       // the first port's, fraction or dB (empty without one)
    std::optional<FixtureVerdict> verdict;
    std::vector<FixtureCoil> coils;
    std::vector<std::string> notes;
    std::vector<std::complex<double>> s_parameters(std::size_t k) const;  // S at frequency k, row-major
};

// The first port's impedance as one coil part's impedance z varies, at each frequency: by the bilinear
// theorem of linear circuits Z_port = (a z + b) / (c z + d), its coefficients the null vector (Eigen's SVD,
// columns scaled) of three solutions of the network at z = jX, 4jX and X (1 + j/4), X = w L_nominal. A
// design search screens a candidate coil with it at no network solution per candidate. The reference is
// the fixture's, with the part an ideal inductor of L_nominal where the reference is the ideal fixture.
struct PortResponse {
    std::vector<double> frequency;                                   // Hz
    std::vector<std::array<std::complex<double>, 4>> coefficients;   // a, b, c, d at each frequency
    std::vector<std::complex<double>> reference;                     // ohm
    FixtureReference criterion;
    std::complex<double> port_impedance(std::size_t k, std::complex<double> z) const;
    double deviation(std::size_t k, std::complex<double> z) const;  // as the verdict's: a fraction, or dB
};
// InputError "reference" when the fixture has none; "coil" when `part` names no coil part.
PortResponse port_response(const FixtureSpec& fixture, std::string_view part, double nominal_inductance,
                           const std::vector<double>& frequencies);

// InputError names "frequencies", the fixture's fields (parts[i].touchstone: out of its range, ...).
FixtureResult fixture_study(const FixtureSpec& fixture, const FixtureRequest& request = {});

}  // namespace libcoil
