// The sweep study: the impedance of an analysed coil over frequency, as mounted (its shield, its mounting),
// with everything the CSV, Touchstone and SVG writers show. The writers only format this record.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "libcoil/spec/choices.hpp"
#include "libcoil/studies/analysis.hpp"

namespace libcoil {

struct SweepRequest {
    std::vector<double> frequencies;  // Hz, >= 0, ascending: given outright (from, to, points and spacing unused)
    std::optional<double> from, to;  // Hz; by default the analysis's span (default_span)
    int points = 401;
    Spacing spacing = Spacing::logarithmic;
    // None: the recommended SRF's model, the turn network where it gives it (in the shield too) and the coil
    // has at most max_default_network_turns turns; else the helical line.
    std::optional<ImpedanceModel> model;
    CapacitanceSource capacitance = CapacitanceSource::helical_line;  // the lumped model's C
};
inline constexpr double max_default_network_turns = 150;  // 401 points in about 2 s

struct Sweep {
    std::string title;                 // the spec's name
    ImpedanceModel model = ImpedanceModel::helical_line;
    CapacitanceSource capacitance = CapacitanceSource::helical_line;
    Mounting mounting = Mounting::floating;
    double from = 0, to = 0;           // Hz
    Spacing spacing = Spacing::logarithmic;
    double nominal_inductance = 0;     // H, the ideal wL's L: the shielded high-frequency L in a shield
    double self_resonance = 0;         // Hz, the model's first resonance, as mounted
    double temperature = 0;            // K, of the wire
    std::optional<double> band_low, band_ceiling;  // Hz
    std::optional<std::string> shield; // the shield in words, when the coil is in one
    std::vector<ImpedancePoint> points;
};

// Frequencies from `from` to `to` (Hz), `points` >= 2, log (from > 0) or linear spacing; InputError naming
// "from", "to" or "points".
std::vector<double> frequency_grid(double from, double to, int points, Spacing spacing);

// InputError names the request's fields: "frequencies", "from", "to", "points", "capacitance".
Sweep sweep_study(const Analysis& a, const SweepRequest& request);

}  // namespace libcoil
