// Tolerance spread: what the build tolerances do to L and the SRF of a coil.
//
// Method:  Monte Carlo. Each sample draws the form diameter, the pitch, the bare wire diameter (the
//          enamel build follows it in proportion) and the turns from independent normal distributions
//          around the design, each tolerance being one standard deviation, and evaluates the recommended
//          inductance and self-resonance. Boost.Random's mt19937_64 and normal_distribution make a seed
//          give the same samples on every platform. The report gives the mean, standard deviation and the
//          2.5 % / 97.5 % quantiles, the share of samples within the target tolerance, and the first-order
//          sensitivities (% change of L and SRF per % change of each input) by central differences.
// Source:  standard Monte Carlo and first-order error propagation (any text on measurement uncertainty,
//          e.g. the GUM, JCGM 100:2008).
// Domain:  as the inductance and self-resonance models; samples outside a model's domain are counted
//          and left out.
// Accuracy: for small tolerances the Monte Carlo standard deviation of L matches the first-order estimate
//          sqrt(sum (S_i sigma_i / x_i)^2) within 3 % at 20000 samples (tests/cpp/test_spread.cpp).
#pragma once

#include <cstdint>
#include <string>
#include <vector>

#include "libcoil/models/self_resonance.hpp"
#include "libcoil/spec/records.hpp"
#include "libcoil/models/solenoid.hpp"

namespace libcoil {

// The build tolerances (BuildTolerances) are an input record: spec/records.hpp.

struct SpreadStatistics {
    double nominal = 0, mean = 0, standard_deviation = 0, low = 0, high = 0;  // low/high: 2.5 % and 97.5 %
};

struct Sensitivity {
    std::string input;  // "form_diameter", "pitch", "wire_diameter", "turns"
    double inductance = 0;      // % change of L per % change of the input
    double self_resonance = 0;  // % change of the SRF per % change of the input
};

struct Spread {
    std::size_t samples = 0, left_out = 0;
    std::uint64_t seed = 0;
    BuildTolerances tolerances;
    SpreadStatistics inductance, self_resonance;
    double within_tolerance = 0;  // share of samples with |L / target - 1| <= tolerance
    std::vector<Sensitivity> sensitivities;
    double first_order_inductance_deviation = 0;  // H, sqrt(sum (S_i sigma_i / x_i)^2) L
};

// `target` and `tolerance` define the yield; `former` and `surroundings` as for self_resonance().
Spread tolerance_spread(const Solenoid& coil, double target, double tolerance, const FormerDielectric& former,
                        const Surroundings& surroundings, const BuildTolerances& tolerances = {},
                        std::size_t samples = 2000, std::uint64_t seed = 1);

}  // namespace libcoil
