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
    // Where the points to refine towards mirror about the circle's middle (a turn between two neighbours) and
    // the sides are even, the lower half mirrors the upper one, vertex for vertex: the panels then mirror too, and a row of such
    // cells is solved as two systems of half the size (periodic_group_capacitance). Else the march goes round.
    const auto mirrored = [&](const std::array<double, 3>& c) {
        const double tol = 1e-12 * (std::fabs(c[0]) + std::fabs(c[1] - cz) + c[2]);
        return std::any_of(near.begin(), near.end(), [&](const std::array<double, 3>& m) {
            return std::fabs(m[0] - c[0]) <= tol && std::fabs((m[1] - cz) + (c[1] - cz)) <= tol && std::fabs(m[2] - c[2]) <= tol;
        });
    };
    const bool symmetric = sides % 2 == 0 && std::all_of(near.begin(), near.end(), mirrored);  // (odd: as many sides as asked)
    const double end = symmetric ? pi : 2 * pi;
    const double coarse = 2 * pi / sides, fine = coarse / 64;
    std::vector<double> angles{0};
    while (angles.back() < end) {
        const double t = angles.back();
        const double x = cr + radius * std::cos(t), y = cz + radius * std::sin(t);
        double gap = std::numeric_limits<double>::infinity();
        for (const auto& c : near) gap = std::min(gap, std::max(0.0, std::hypot(x - c[0], y - c[1]) - c[2]));
        angles.push_back(t + std::clamp(0.5 * gap / radius, fine, coarse));
    }
    const double scale = end / angles.back();
    Outline o;
    for (std::size_t i = 0; i + 1 < angles.size(); ++i) {
        const double t = angles[i] * scale;
        o.push_back({cr + radius * std::cos(t), cz + radius * std::sin(t)});
    }
    if (symmetric) {
        // The far side on the mirror line exactly, then the upper half's vertices mirrored, in reverse.
        const std::size_t upper = o.size();
        o.push_back({cr - radius, cz});
        for (std::size_t i = upper - 1; i >= 1; --i) {
            const double t = angles[i] * scale;
            o.push_back({cr + radius * std::cos(t), cz - radius * std::sin(t)});
        }
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
