// Reports of an analysis: a readable text page, and one JSON object with SI numbers.
#pragma once

#include <string>

#include "libcoil/studies/analysis.hpp"
#include "libcoil/studies/design.hpp"
#include "libcoil/models/losses.hpp"
#include "libcoil/models/wire.hpp"

namespace libcoil {

std::string text_report(const Analysis& a);
// JSON keys carry their unit: mean_diameter_m, inductance_H, ... (docs/cli.md lists them).
std::string json_report(const Analysis& a);

// `coil wire`: one wire, and a table of gauges to choose from.
std::string wire_text_report(const Wire& w, const Conductor& c, double temperature, double frequency);
std::string wire_json_report(const Wire& w, const Conductor& c, double temperature, double frequency);
// AWG 10 .. 40 and the metric sizes 0.1 .. 3.15 mm, enamel grade 1, at the temperature and frequency.
std::string wire_table_text(const Conductor& c, double temperature, double frequency);

// `coil design`: the ranked designs, why the first won, the rejections and the cautions.
std::string design_text_report(const Requirement& q, const DesignResult& r, std::size_t top = 10);
// JSON keys: candidates_evaluated, feasible, rejected_by_reason, designs (ranked, each with its spec and
// figures), chosen (index into designs, or null), why_chosen, binding, cautions, notes, warnings.
std::string design_json_report(const Requirement& q, const DesignResult& r, std::size_t top = 10);

}  // namespace libcoil
