// The coupling study as text, JSON and an SVG picture. Formatting only: every number comes from the
// coupling study (coupling_study.hpp).
//
// The SVG plots |k| against the centre distance on log axes, with the magnetic-dipole asymptote dashed.
// Its elements carry ids and data- attributes (coupling, dipole, data-distance-m, data-k) for tests.
#pragma once

#include <string>
#include <vector>

#include "libcoil/studies/coupling_study.hpp"

namespace libcoil {

// `files`: what was written, listed in both.
std::string coupling_text_report(const CouplingStudy& s, const std::vector<std::string>& files = {});
std::string coupling_json_report(const CouplingStudy& s, const std::vector<std::string>& files = {});
// Needs two or more sweep points.
std::string coupling_svg(const CouplingStudy& s);

}  // namespace libcoil
