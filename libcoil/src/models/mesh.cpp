#include "libcoil/models/mesh.hpp"

#include <algorithm>
#include <cmath>
#include <cstring>
#include <iomanip>
#include <sstream>
#include <unordered_map>

#include "libcoil/core/error.hpp"

namespace libcoil {

namespace {

using Vec = std::array<double, 3>;

Vec sub(const Vec& a, const Vec& b) { return {a[0] - b[0], a[1] - b[1], a[2] - b[2]}; }
Vec cross(const Vec& a, const Vec& b) {
    return {a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]};
}
double dot(const Vec& a, const Vec& b) { return a[0] * b[0] + a[1] * b[1] + a[2] * b[2]; }
double norm(const Vec& a) { return std::sqrt(dot(a, a)); }

std::uint64_t edge_key(std::uint32_t a, std::uint32_t b) { return (std::uint64_t{a} << 32) | b; }

// The normal of a triangle from its winding, as a unit vector (zero for a degenerate one).
Vec unit_normal(const TriangleMesh& m, const std::array<std::uint32_t, 3>& t) {
    const Vec& a = m.vertices[t[0]];
    const Vec n = cross(sub(m.vertices[t[1]], a), sub(m.vertices[t[2]], a));
    const double l = norm(n);
    return l > 0 ? Vec{n[0] / l, n[1] / l, n[2] / l} : Vec{0, 0, 0};
}

}  // namespace

std::uint32_t TriangleMesh::add_vertex(double x, double y, double z) {
    require_finite("vertex.x", x);
    require_finite("vertex.y", y);
    require_finite("vertex.z", z);
    vertices.push_back({x, y, z});
    return static_cast<std::uint32_t>(vertices.size() - 1);
}

bool TriangleMesh::add_triangle(std::uint32_t a, std::uint32_t b, std::uint32_t c) {
    if (a == b || b == c || a == c) return false;
    triangles.push_back({a, b, c});
    return true;
}

bool MeshCheck::sound() const {
    return triangles > 0 && boundary_edges == 0 && overshared_edges == 0 && misoriented_edges == 0 &&
           nonmanifold_vertices == 0 && degenerate_triangles == 0 && volume > 0;
}

MeshCheck check_mesh(const TriangleMesh& m, double min_area) {
    MeshCheck c;
    c.triangles = m.triangles.size();
    c.min_area = INFINITY;
    // Directed edges: a closed, consistently oriented 2-manifold uses each directed edge once and its
    // reverse once.
    std::unordered_map<std::uint64_t, int> directed;
    directed.reserve(3 * m.triangles.size());
    std::vector<std::uint32_t> uses(m.vertices.size(), 0);
    for (const auto& t : m.triangles) {
        const Vec& a = m.vertices[t[0]];
        const Vec n = cross(sub(m.vertices[t[1]], a), sub(m.vertices[t[2]], a));
        const double area = 0.5 * norm(n);
        c.area += area;
        c.min_area = std::min(c.min_area, area);
        if (t[0] == t[1] || t[1] == t[2] || t[0] == t[2] || !(area >= min_area)) ++c.degenerate_triangles;
        c.volume += dot(a, cross(m.vertices[t[1]], m.vertices[t[2]])) / 6;
        for (int k = 0; k < 3; ++k) {
            ++directed[edge_key(t[k], t[(k + 1) % 3])];
            ++uses[t[k]];
        }
    }
    for (const auto& [key, n] : directed) {
        const auto a = static_cast<std::uint32_t>(key >> 32), b = static_cast<std::uint32_t>(key);
        if (n > 1) c.misoriented_edges += 1;
        const auto back = directed.find(edge_key(b, a));
        const int reverse = back == directed.end() ? 0 : back->second;
        if (a < b || reverse == 0) {  // each undirected edge once
            const int total = n + reverse;
            if (total == 1) ++c.boundary_edges;
            if (total > 2) ++c.overshared_edges;
        }
    }
    // Around a manifold vertex the triangles form one fan: following "the next triangle across the edge
    // leaving this vertex" from any one of them visits them all.
    std::vector<std::vector<std::uint32_t>> around(m.vertices.size());
    for (std::uint32_t i = 0; i < m.triangles.size(); ++i) {
        for (auto v : m.triangles[i]) around[v].push_back(i);
    }
    for (std::size_t v = 0; v < m.vertices.size(); ++v) {
        const auto& fan = around[v];
        if (fan.empty()) {
            ++c.unused_vertices;
            continue;
        }
        // For each triangle at v, the vertex after v in its winding, and the one before.
        std::unordered_map<std::uint32_t, std::uint32_t> next_of;  // "before" vertex -> triangle
        for (auto ti : fan) {
            const auto& t = m.triangles[ti];
            const int k = t[0] == v ? 0 : t[1] == v ? 1 : 2;
            next_of[t[(k + 2) % 3]] = ti;
        }
        std::size_t visited = 0;
        std::uint32_t ti = fan.front();
        do {
            const auto& t = m.triangles[ti];
            const int k = t[0] == v ? 0 : t[1] == v ? 1 : 2;
            const auto it = next_of.find(t[(k + 1) % 3]);
            if (it == next_of.end()) break;
            ti = it->second;
            ++visited;
        } while (ti != fan.front() && visited <= fan.size());
        if (visited != fan.size() || ti != fan.front()) ++c.nonmanifold_vertices;
    }
    if (m.triangles.empty()) c.min_area = 0;
    return c;
}

std::array<double, 3> TriangleMesh::normal(std::size_t i) const { return unit_normal(*this, triangles[i]); }

}  // namespace libcoil
