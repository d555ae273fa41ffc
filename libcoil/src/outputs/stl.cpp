#include "libcoil/outputs/stl.hpp"

#include <algorithm>
#include <cstring>
#include <iomanip>
#include <sstream>

namespace libcoil {

std::string stl_binary(const TriangleMesh& m, const std::string& header) {
    constexpr double mm = 1e3;
    std::string out(84 + 50 * m.triangles.size(), '\0');
    std::memcpy(out.data(), header.data(), std::min<std::size_t>(80, header.size()));
    const auto count = static_cast<std::uint32_t>(m.triangles.size());
    char* p = out.data() + 80;
    // STL is little-endian; so are the machines libcoil builds on (x86-64, aarch64).
    static_assert(sizeof(float) == 4, "STL stores 32-bit floats");
    std::memcpy(p, &count, 4);
    p += 4;
    for (std::size_t i = 0; i < m.triangles.size(); ++i) {
        const auto& t = m.triangles[i];
        const auto n = m.normal(i);
        float f[12];
        for (int k = 0; k < 3; ++k) f[k] = static_cast<float>(n[k]);
        for (int v = 0; v < 3; ++v) {
            for (int k = 0; k < 3; ++k) f[3 + 3 * v + k] = static_cast<float>(m.vertices[t[v]][k] * mm);
        }
        std::memcpy(p, f, 48);
        p += 50;  // the attribute word stays zero
    }
    return out;
}

std::string stl_ascii(const TriangleMesh& m, const std::string& name) {
    constexpr double mm = 1e3;
    std::ostringstream o;
    o << std::setprecision(9);
    o << "solid " << name << "\n";
    for (std::size_t i = 0; i < m.triangles.size(); ++i) {
        const auto& t = m.triangles[i];
        const auto n = m.normal(i);
        o << "  facet normal " << n[0] << " " << n[1] << " " << n[2] << "\n    outer loop\n";
        for (auto v : t) {
            const auto& x = m.vertices[v];
            o << "      vertex " << x[0] * mm << " " << x[1] * mm << " " << x[2] * mm << "\n";
        }
        o << "    endloop\n  endfacet\n";
    }
    o << "endsolid " << name << "\n";
    return o.str();
}

}  // namespace libcoil
