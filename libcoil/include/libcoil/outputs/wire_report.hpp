// `coil wire`: one wire, and a table of gauges to choose from, as text and JSON. Formatting only.
#pragma once

#include <string>
#include <vector>

#include "libcoil/studies/wire_study.hpp"

namespace libcoil {

std::string wire_text_report(const WireStudy& study);
std::string wire_json_report(const WireStudy& study);
std::string wire_table_text(const std::vector<WireStudy>& rows);

}  // namespace libcoil
