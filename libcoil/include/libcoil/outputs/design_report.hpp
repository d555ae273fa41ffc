// The design study as text and JSON. Formatting only: every number comes from the design study
// (design.hpp) and the requirement it answered.
#pragma once

#include <cstddef>
#include <string>

#include "libcoil/spec/requirement.hpp"
#include "libcoil/studies/design.hpp"

namespace libcoil {

// The ranked designs, why the first won, the rejections and the cautions.
std::string design_text_report(const Requirement& q, const DesignResult& r, std::size_t top = 10);
// JSON keys: candidates_evaluated, feasible, rejected_by_reason, designs (ranked, each with its spec and
// figures), chosen (index into designs, or null), why_chosen, binding, cautions, notes, warnings.
std::string design_json_report(const Requirement& q, const DesignResult& r, std::size_t top = 10);

}  // namespace libcoil
