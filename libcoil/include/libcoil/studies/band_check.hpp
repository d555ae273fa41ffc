// The band check: does the coil stay a good inductor across the user's band?
//
// Criteria, each optional (with none given, srf_margin = 2 applies, a common-practice figure):
//   srf_margin k      the self-resonance lies at or above k x ceiling;
//   max_deviation x   | |Z| / (w L) - 1 | <= x from the low edge to the ceiling (L the low-frequency L);
//   min_impedance Z   |Z| >= Z across the band (a fixture coil that must dominate a 50 ohm port).
// The impedance is the recommended helical-line form (impedance.hpp). The curves are scanned on 512
// log-spaced points and the first failure is refined by bisection to 1e-9 relative. The margin is
// SRF / (k ceiling) for srf_margin, x - worst |deviation| for max_deviation, and min |Z| / Z for
// min_impedance; a criterion passes when its margin is >= 1 (>= 0 for max_deviation).
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "libcoil/models/impedance.hpp"

namespace libcoil {

struct BandSpec {
    double low = 0;      // Hz, > 0
    double ceiling = 0;  // Hz, > low
    std::optional<double> srf_margin;     // >= 1
    std::optional<double> max_deviation;  // > 0, a fraction (10 % = 0.1)
    std::optional<double> min_impedance;  // ohm, > 0
};

inline constexpr double default_srf_margin = 2.0;

struct CriterionResult {
    std::string name;        // "srf_margin", "max_deviation", "min_impedance"
    double required = 0;     // k, x (fraction) or Z (ohm)
    bool pass = false;
    double margin = 0;       // see above
    double worst = 0;        // SRF (Hz), the worst |deviation|, or min |Z| (ohm)
    double worst_frequency = 0;  // Hz where `worst` occurs (the SRF itself for srf_margin)
    std::optional<double> first_failure;  // Hz, the lowest frequency where the criterion fails
    bool defaulted = false;  // applied because no criterion was given
};

struct BandCheck {
    double low = 0, ceiling = 0;
    std::vector<CriterionResult> criteria;
    bool pass = false;
};

// Validates the band (InputError naming band.low, band.ceiling, band.srf_margin, ...).
void validate_band(const BandSpec& band);
BandCheck check_band(const BandSpec& band, const CoilImpedance& impedance);
// The SRF criterion alone at a given SRF (for cross-checks with another model's SRF).
CriterionResult check_srf_margin(double srf, double ceiling, double margin);

}  // namespace libcoil
