// `coil compare`: the prediction beside the measurement, as text, JSON and CSV. Formatting only.
#pragma once

#include <string>

#include "libcoil/studies/comparison.hpp"

namespace libcoil {

std::string comparison_text_report(const Comparison& c);
// At least: extracted, predicted and deviation (fractions), each with inductance_H, resistance_ohm,
// self_resonance_Hz, self_capacitance_F and q_at_resonance (null where the data has none).
std::string comparison_json_report(const Comparison& c);
// Both on the measurement's frequencies: |Z|, phase, R and X of each, and each point's weight.
std::string comparison_csv(const Comparison& c);
// |Z| and phase of both over the measurement's frequencies (those above 0 Hz), the gap between the two |Z|
// curves shaded, the poorly measured ranges greyed.
std::string comparison_svg(const Comparison& c);
// The fitted values as the small YAML a spec's `bench:` line names (records.hpp's BenchCorrections), each
// with its standard error as a comment; `measurement` names the file in the header. InputError naming
// "fit" without a fit.
std::string bench_yaml(const Comparison& c, const std::string& measurement);

}  // namespace libcoil
