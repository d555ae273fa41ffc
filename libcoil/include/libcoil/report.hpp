// Reports of an analysis: a readable text page, and one JSON object with SI numbers.
#pragma once

#include <string>

#include "libcoil/analysis.hpp"

namespace libcoil {

std::string text_report(const Analysis& a);
// JSON keys carry their unit: mean_diameter_m, inductance_H, ... (docs/cli.md lists them).
std::string json_report(const Analysis& a);

}  // namespace libcoil
