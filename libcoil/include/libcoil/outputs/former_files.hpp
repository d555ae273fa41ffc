// The former study as files: the dimension sheet (SVG), the dimensions (YAML), the STL, and the text and
// JSON summaries. Formatting only: every number comes from the former study (former_study.hpp).
//
// The SVG shows the section through the axis (solid shaded, the bore dashed) with the overall and
// winding lengths, the outer, root and bore diameters and the pitch dimensioned, and a detail of one
// groove with the wire seated in it (depth, clearance). Its elements carry ids and data- attributes
// (section, detail, data-pitch-mm, data-outer-diameter-mm, ...) so that tests and scripts can read it.
#pragma once

#include <string>
#include <vector>

#include "libcoil/outputs/files.hpp"
#include "libcoil/studies/former_study.hpp"

namespace libcoil {

std::string former_sheet_svg(const FormerBuild& b);
std::string former_dimensions_yaml(const FormerBuild& b);
// `files`: what was written, listed in both.
std::string former_text_report(const FormerBuild& b, const std::vector<std::string>& files);
std::string former_json_report(const FormerBuild& b, const std::vector<std::string>& files);

// The paths STEM.former.stl, .svg and .yaml under `dir`, in that order.
std::vector<std::string> former_file_paths(const std::string& dir, const std::string& stem);
// The three files, formatted, for write_file_set (files.hpp).
FileSet former_files(const FormerBuild& b, const std::string& dir, const std::string& stem, bool ascii_stl = false);

}  // namespace libcoil
