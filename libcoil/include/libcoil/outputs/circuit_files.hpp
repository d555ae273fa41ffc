// `coil export-circuit`: the equivalent circuit as a SPICE subcircuit (the de facto netlist interchange
// format; the names inside are ours) and a short text summary. Formatting only.
#pragma once

#include <string>

#include "libcoil/studies/circuit_export.hpp"

namespace libcoil {

// A .subckt named `subcircuit` with the terminals T1 and T2; full precision values in SI units.
std::string spice_subcircuit(const CircuitExport& c, const std::string& subcircuit);
std::string circuit_export_text(const CircuitExport& c);

}  // namespace libcoil
