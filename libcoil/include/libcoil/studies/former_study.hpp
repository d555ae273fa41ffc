// The former study (`coil former`): from a coil spec to its printable former: the dimensions, the mesh,
// the mesh's own check and the cautions the winding's temperature calls for.
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
    double volume = 0;  // m^3, the material's, in closed form (FormerGeometry::volume)
    std::vector<std::string> cautions;
};

// Dimensions, mesh and check. Throws InputError (fields as former_geometry) for a former that cannot be
// printed, and DomainError should the mesh ever fail its own check.
FormerBuild build_former(const CoilSpec& spec, const FormerOptions& options = {});

}  // namespace libcoil
