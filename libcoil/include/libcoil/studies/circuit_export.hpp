// The coil's model for the user's own circuit simulator: a wideband equivalent circuit fitted to the coil's
// recommended impedance model as mounted (sweep_study's default) over a stated range.
//
// Method: the coil's admittance at `points` log-spaced frequencies, fitted by passive_fit (rational_fit.hpp:
// vector fitting's pole pairs, fixed real poles with non-negative residues) and realised in Foster's second
// form. The order (pole pairs) is the caller's, or by default the least from 2 to 10 whose fit is within
// 1 % in |Z| and 1 degree in phase at every fitted point and passive (Re Y >= 0 from a thousandth of the
// range's bottom to a hundred times its top). Branch elements may be negative where the whole stays passive;
// a SPICE netlist takes them.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "libcoil/models/rational_fit.hpp"
#include "libcoil/studies/analysis.hpp"

namespace libcoil {

struct CircuitExportRequest {
    std::optional<double> from, to;  // Hz; by default 1 / 1000 of the SRF as mounted to 2.5 times it
    std::optional<int> order;        // pole pairs, 1 .. 30; by default the least that meets the goals
    int points = 300;
};

struct CircuitExport {
    std::string name;                 // the spec's
    double from = 0, to = 0;          // Hz
    int pairs = 0;
    RationalFit fit;
    FosterAdmittance circuit;
    double max_magnitude_error = 0;   // fraction, |Z| at the fitted points
    double max_phase_error = 0;       // degrees
    double least_real_part = 0;       // Re Y / |Y| at its least (passive where >= 0)
    bool meets_goals = false;         // 1 %, 1 degree, passive
    std::optional<double> model_self_resonance, fitted_self_resonance;       // Hz
    std::optional<double> model_second_resonance, fitted_second_resonance;   // Hz
    std::vector<std::string> notes;
};

// InputError naming "from", "to", "order" or "points".
CircuitExport circuit_export(const Analysis& analysis, const CircuitExportRequest& request = {});

}  // namespace libcoil
