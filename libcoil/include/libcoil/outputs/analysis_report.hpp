// The analysis as a readable text page and as one JSON object with SI numbers. Formatting only: every number
// comes from the analysis study (analysis.hpp).
#pragma once

#include <string>

#include "libcoil/studies/analysis.hpp"

namespace libcoil {

std::string text_report(const Analysis& a);
// JSON keys carry their unit: mean_diameter_m, inductance_H, ... (docs/cli.md lists them).
std::string json_report(const Analysis& a);

}  // namespace libcoil
