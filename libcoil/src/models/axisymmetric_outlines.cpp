// The outlines of the common bodies for the charge solver (axisymmetric_charge.hpp): a tube, a wire's
// circle with its sides refined towards its neighbours, and whether a point lies inside an outline.
#include <algorithm>
#include <cmath>
#include <limits>
#include <string>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/axisymmetric_charge.hpp"

namespace libcoil {

Outline tube_outline(double inner, double outer, double z0, double z1) {
    require_non_negative("inner_radius", inner);
    if (!(outer > inner)) throw InputError("outer_radius", "must exceed the inner radius");
    if (!(z1 > z0)) throw InputError("z1", "must exceed z0");
    // Counter-clockwise: up the outer wall, in along the top, down the inner wall (or the axis), out along
    // the bottom.
    return {{inner, z0}, {outer, z0}, {outer, z1}, {inner, z1}};
}

Outline circle_outline(double cr, double cz, double radius, int sides, const std::vector<std::array<double, 3>>& near) {
    require_positive("radius", radius);
    if (sides < 6) throw InputError("sides", std::to_string(sides) + "; expected 6 or more");
    if (!(cr > radius)) throw InputError("centre_rho", "the circle must clear the axis");
    const double coarse = 2 * pi / sides, fine = coarse / 64;
    std::vector<double> angles{0};
    while (angles.back() < 2 * pi) {
        const double t = angles.back();
        const double x = cr + radius * std::cos(t), y = cz + radius * std::sin(t);
        double gap = std::numeric_limits<double>::infinity();
        for (const auto& c : near) gap = std::min(gap, std::max(0.0, std::hypot(x - c[0], y - c[1]) - c[2]));
        angles.push_back(t + std::clamp(0.5 * gap / radius, fine, coarse));
    }
    const double scale = 2 * pi / angles.back();
    Outline o;
    for (std::size_t i = 0; i + 1 < angles.size(); ++i) {
        const double t = angles[i] * scale;
        o.push_back({cr + radius * std::cos(t), cz + radius * std::sin(t)});
    }
    return o;
}

// Whether (rho, z) lies inside the closed outline (ray casting across the half-plane, the axis closing it).
bool inside(const Outline& o, double rho, double z) {
    bool in = false;
    for (std::size_t i = 0, j = o.size() - 1; i < o.size(); j = i++) {
        const auto& p = o[i];
        const auto& q = o[j];
        if ((p[1] > z) != (q[1] > z) && rho < (q[0] - p[0]) * (z - p[1]) / (q[1] - p[1]) + p[0]) in = !in;
    }
    return in;
}

}  // namespace libcoil
