// STL files of a triangle mesh (mesh.hpp), in millimetres as slicers expect. Formatting only.
#pragma once

#include <string>

#include "libcoil/models/mesh.hpp"

namespace libcoil {

// Binary STL: an 80-byte header (the text given, cut or padded), the triangle count, and per triangle the
// unit normal from the winding order, three vertices and a zero attribute word.
std::string stl_binary(const TriangleMesh& mesh, const std::string& header);
// ASCII STL, `solid NAME` ... `endsolid NAME`.
std::string stl_ascii(const TriangleMesh& mesh, const std::string& name);

}  // namespace libcoil
