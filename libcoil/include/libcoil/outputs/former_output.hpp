// The printable former, from a coil spec to its files: the build (dimensions, mesh, mesh check,
// cautions), a dimension sheet (SVG), the dimensions as YAML, and the text and JSON summaries.
// Formatting only: every number comes from former.hpp and mesh.hpp.
//
// The SVG shows the section through the axis (solid shaded, the bore dashed) with the overall and
// winding lengths, the outer, root and bore diameters and the pitch dimensioned, and a detail of one
// groove with the wire seated in it (depth, clearance). Its elements carry ids and data- attributes
// (section, detail, data-pitch-mm, data-outer-diameter-mm, ...) so that tests and scripts can read it.
#pragma once

#include <string>
#include <vector>

#include "libcoil/models/former.hpp"
#include "libcoil/models/mesh.hpp"
#include "libcoil/spec/spec.hpp"

namespace libcoil {

struct FormerBuild {
    std::string name;      // the spec's
    std::string material;  // the former material's name
    FormerGeometry geometry;
    double chord_tolerance = 0;  // m
    TriangleMesh mesh;
    MeshCheck check;
    std::vector<std::string> cautions;
};

// Dimensions, mesh and check. Throws InputError (fields as former_geometry) for a former that cannot be
// printed, and DomainError should the mesh ever fail its own check.
FormerBuild build_former(const CoilSpec& spec, const FormerOptions& options = {});

std::string former_sheet_svg(const FormerBuild& b);
std::string former_dimensions_yaml(const FormerBuild& b);
// `files`: what was written, listed in both.
std::string former_text_report(const FormerBuild& b, const std::vector<std::string>& files);
std::string former_json_report(const FormerBuild& b, const std::vector<std::string>& files);

// The paths STEM.former.stl, .svg and .yaml under `dir`, in that order.
std::vector<std::string> former_file_paths(const std::string& dir, const std::string& stem);
// Formats all three files, then writes each atomically (write_file_atomically); returns their paths.
std::vector<std::string> write_former_files(const FormerBuild& b, const std::string& dir, const std::string& stem, bool ascii_stl = false);

}  // namespace libcoil
