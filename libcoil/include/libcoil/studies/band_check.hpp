// The band check: does the coil stay a good inductor across the user's band?
//
// Criteria, each optional (with none given, srf_margin = 2 applies, a common-practice figure):
//   srf_margin k      the self-resonance lies at or above k x ceiling: the lower edge of its band
//                     (self_resonance.hpp's srf_band), so that the verdict holds with the model's error;
//   max_deviation x   | |Z| / (w L) - 1 | <= x from the low edge to the ceiling (L the low-frequency L);
//   min_impedance Z   |Z| >= Z across the band (a fixture coil that must dominate a 50 ohm port).
// The impedance is the recommended helical-line form of the coil as mounted (impedance.hpp): with a
// shield, the shielded L(f), wall loss and SRF, and wL is the shielded nominal L. The curves are scanned on 512
// log-spaced points and the first failure is refined by bisection to 1e-9 relative. The margin is
// SRF / (k ceiling) for srf_margin, x - worst |deviation| for max_deviation, and min |Z| / Z for
// min_impedance; a criterion passes when its margin is >= 1 (>= 0 for max_deviation).
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "libcoil/models/impedance.hpp"
#include "libcoil/spec/records.hpp"

namespace libcoil {

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

BandCheck check_band(const BandSpec& band, const CoilImpedance& impedance);
// The SRF criterion alone at a given SRF (for cross-checks with another model's SRF).
CriterionResult check_srf_margin(double srf, double ceiling, double margin);

// The SRF factor a band asks for: its srf_margin, the default when it names no criterion, else 0 (none).
double required_srf_margin(const BandSpec& band);
// The two impedance criteria at one frequency, as check_band judges them.
double impedance_deviation(const ImpedancePoint& point, double nominal_inductance);  // |Z| / (w L) - 1

// The band's criteria on `points` log-spaced frequencies only: the screen a search runs on each candidate
// (its winners are then checked in full by check_band). The first criterion that fails, with how far.
struct BandMiss {
    const char* criterion = "";  // "srf_margin", "max_deviation", "min_impedance"
    double excess = 1;           // > 1: how far past the limit, as a ratio
    double frequency = 0;        // Hz where it failed (the SRF for srf_margin)
    double value = 0;            // the SRF (Hz), the |deviation| or |Z| (ohm) there
};
std::optional<BandMiss> screen_band(const BandSpec& band, const CoilImpedance& impedance, int points);
// The SRF margin alone, for a search that has the SRF before it builds the impedance.
std::optional<BandMiss> screen_srf_margin(const BandSpec& band, double self_resonance);

}  // namespace libcoil
