// Triangle meshes: the checks a slicer relies on (the STL writer is outputs/stl.hpp).
//
// A mesh is a list of vertices (m, SI like every other value in the library) and of triangles as
// vertex indices, wound counter-clockwise seen from outside (the right-hand rule gives the outward
// normal). STL files are written in millimetres, as slicers expect.
#pragma once

#include <array>
#include <cstddef>
#include <cstdint>
#include <string>
#include <vector>

namespace libcoil {

struct TriangleMesh {
    std::vector<std::array<double, 3>> vertices;         // m
    std::vector<std::array<std::uint32_t, 3>> triangles;  // indices into vertices, outward winding

    std::uint32_t add_vertex(double x, double y, double z);
    // Appends a triangle unless two of its indices coincide (the zipper of two chains that share
    // vertices produces such empty triangles); returns whether it was added.
    bool add_triangle(std::uint32_t a, std::uint32_t b, std::uint32_t c);
    // Triangle i's unit normal by the right-hand rule on its winding (0 for a degenerate one).
    std::array<double, 3> normal(std::size_t i) const;
};

// What a slicer needs of a mesh, counted.
struct MeshCheck {
    std::size_t triangles = 0;
    std::size_t boundary_edges = 0;       // edges used by one triangle only (the mesh is not closed)
    std::size_t overshared_edges = 0;     // edges used by more than two triangles (not 2-manifold)
    std::size_t misoriented_edges = 0;    // edges two triangles run in the same direction
    std::size_t nonmanifold_vertices = 0; // vertices whose triangles do not form one fan
    std::size_t degenerate_triangles = 0; // repeated indices, or an area below `min_area`
    std::size_t unused_vertices = 0;
    double min_area = 0;                  // m^2, smallest triangle area found
    double volume = 0;                    // m^3, signed (divergence theorem); > 0 for outward winding
    double area = 0;                      // m^2
    // Closed, 2-manifold, consistently and outward oriented, with no degenerate triangle.
    bool sound() const;
};

// `min_area`: triangles smaller than this (m^2) count as degenerate.
MeshCheck check_mesh(const TriangleMesh& mesh, double min_area = 1e-18);

}  // namespace libcoil
