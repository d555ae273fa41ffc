// The inductance of a solenoid by every model, and the one the library recommends.
//
// The recommended value is the Rosa-corrected Nagaoka inductance: exact for the current sheet, corrected
// for round wire at its pitch. Where the pitch exceeds 0.4 mean radii, Rosa's correction loses its 0.5 %
// (rosa.hpp) and the recommended value is the filament sum instead, with a warning that says so. The
// filament sum is otherwise the independent check; Wheeler and Lundin are the handbook formulas a
// designer knows.
#pragma once

#include <string>
#include <vector>

#include "libcoil/models/nagaoka.hpp"
#include "libcoil/models/solenoid.hpp"

namespace libcoil {

struct InductanceByMethod {
    double wheeler = 0;   // H, current sheet, Wheeler 1928
    double nagaoka = 0;   // H, current sheet, exact
    double lundin = 0;    // H, current sheet, Lundin 1985
    double rosa = 0;      // H, Nagaoka with Rosa's round-wire correction (recommended)
    double filament = 0;  // H, sum over circular filaments
};

struct InductanceResult {
    double nagaoka_coefficient = 0;
    InductanceByMethod by_method;
    double recommended = 0;              // H
    std::string method = "rosa";         // which model gave `recommended`: "rosa" or "filament"
    std::vector<std::string> warnings;   // models used outside their stated domain
};

InductanceResult inductance(const Solenoid& coil);

// The recommended inductance alone: Rosa inside its domain (without evaluating the filament sum, the
// fast path for design searches), the filament sum outside it.
double recommended_inductance(const Solenoid& coil);
// The same from the bare figures (m): for root finders that vary turns or pitch, without building and
// validating a Solenoid at every step. The caller keeps the geometry valid.
double recommended_inductance(double mean_diameter, double turns, double pitch, double wire_diameter);

// The same with its slopes dL/dN (H per turn) and dL/dp (H/m) where the recommended model is Rosa's form
// (rosa_inductance_gradient); the filament sum gives none (has_slopes false, slopes 0). `sheet`, where
// given, is Nagaoka's coefficient and slope at D / (N p), which a caller evaluating many coils of one
// length computes once.
struct RecommendedInductance {
    double inductance = 0, d_turns = 0, d_pitch = 0;
    bool has_slopes = false;
};
RecommendedInductance recommended_inductance_with_slopes(double mean_diameter, double turns, double pitch,
                                                         double wire_diameter, const NagaokaSlope* sheet = nullptr);

}  // namespace libcoil
