// The charge solver's panels (axisymmetric_panels.hpp): the scene's outlines cut and graded.
#include "models/axisymmetric_panels.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <optional>
#include <string>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"

namespace libcoil::detail {

namespace {

double distance_to_rings(double rho, double z, const std::vector<ChargeRing>& rings) {
    double d = std::numeric_limits<double>::infinity();
    for (const ChargeRing& r : rings) d = std::min(d, std::max(0.0, std::hypot(rho - r.radius, z - r.z) - r.wire_radius));
    return d;
}

void add_outline(std::vector<Panel>& out, const Outline& o, const std::optional<std::array<double, 3>>& circle, bool closed,
                 bool dielectric, double lambda, int group, double charge_scale, const ChargeScene& scene,
                 const std::vector<ChargeRing>& rings) {
    const std::size_t pieces = closed ? o.size() : o.size() - 1;
    for (std::size_t i = 0; i < pieces; ++i) {
        const auto& a = o[i];
        const auto& b = o[(i + 1) % o.size()];
        if (a[0] <= 0 && b[0] <= 0) continue;  // along the axis: no surface
        // On the ground plane a dielectric's face meets its own image: inside the pair, no face.
        if (scene.ground_plane && a[1] == *scene.ground_plane && b[1] == *scene.ground_plane) continue;
        Panel whole;
        if (circle) {
            const auto [cr, cz, radius] = *circle;
            whole.arc = true;
            whole.cr = cr;
            whole.cz = cz;
            whole.radius = radius;
            whole.t0 = std::atan2(a[1] - cz, a[0] - cr);
            whole.t1 = std::atan2(b[1] - cz, b[0] - cr);
            while (whole.t1 <= whole.t0) whole.t1 += 2 * pi;  // counter-clockwise
            whole.length = radius * (whole.t1 - whole.t0);
        } else {
            whole.r0 = a[0];
            whole.z0 = a[1];
            whole.r1 = b[0];
            whole.z1 = b[1];
            whole.length = std::hypot(b[0] - a[0], b[1] - a[1]);
        }
        const double length = whole.length;
        if (!(length > 0)) continue;
        std::vector<double> cuts{0};
        while (cuts.back() < length) {
            const auto x = whole.at(cuts.back() / length);
            // A circle's own vertices set its panels (circle_outline refines them); other bodies are graded.
            const double h = circle ? scene.max_panel : std::clamp(0.5 * distance_to_rings(x[0], x[1], rings), scene.min_panel, scene.max_panel);
            cuts.push_back(std::min(length, cuts.back() + h));
        }
        if (cuts.size() > 2 && cuts[cuts.size() - 1] - cuts[cuts.size() - 2] < 0.3 * (cuts[cuts.size() - 2] - cuts[cuts.size() - 3])) {
            cuts.erase(cuts.end() - 2);  // no sliver at the end
        }
        for (std::size_t c = 0; c + 1 < cuts.size(); ++c) {
            Panel p = whole;
            const double u0 = cuts[c] / length, u1 = cuts[c + 1] / length;
            const auto e0 = whole.at(u0), e1 = whole.at(u1), mid = whole.at(0.5 * (u0 + u1));
            p.r0 = e0[0];
            p.z0 = e0[1];
            p.r1 = e1[0];
            p.z1 = e1[1];
            if (p.arc) {
                p.t0 = whole.t0 + u0 * (whole.t1 - whole.t0);
                p.t1 = whole.t0 + u1 * (whole.t1 - whole.t0);
                p.length = p.radius * (p.t1 - p.t0);
                const double t = 0.5 * (p.t0 + p.t1);
                p.nr = std::cos(t);
                p.nz = std::sin(t);
            } else {
                p.length = std::hypot(p.r1 - p.r0, p.z1 - p.z0);
                p.nr = (p.z1 - p.z0) / p.length;
                p.nz = -(p.r1 - p.r0) / p.length;
            }
            p.rc = mid[0];
            p.zc = mid[1];
            p.dielectric = dielectric;
            p.lambda = lambda;
            p.group = group;
            p.charge_scale = charge_scale;
            for (std::size_t g = 0; g < 8; ++g) {
                const auto x = p.at(0.5 * (1 + gauss_x[g]));
                p.gauss_r[g] = x[0];
                p.gauss_z[g] = x[1];
            }
            for (std::size_t g = 0; g < p.far_r.size(); ++g) {
                const auto x = p.at(0.5 * (1 + far_x[g]));
                p.far_r[g] = x[0];
                p.far_z[g] = x[1];
            }
            out.push_back(p);
        }
    }
}

}  // namespace

std::optional<std::vector<std::size_t>> mirror_images(const std::vector<Panel>& panels) {
    double extent = 0;
    for (const Panel& q : panels) extent = std::max({extent, std::fabs(q.rc), std::fabs(q.zc), q.length});
    const double tol = 1e-9 * extent;
    const auto images = [&](const Panel& m, const Panel& q) {
        return m.arc == q.arc && m.dielectric == q.dielectric && m.group == q.group && m.lambda == q.lambda && m.charge_scale == q.charge_scale &&
               std::fabs(m.rc - q.rc) <= tol && std::fabs(m.zc + q.zc) <= tol && std::fabs(m.length - q.length) <= tol &&
               std::fabs(m.nr - q.nr) <= 1e-9 && std::fabs(m.nz + q.nz) <= 1e-9 && std::fabs(m.radius - q.radius) <= tol &&
               std::fabs(m.cr - q.cr) <= tol && std::fabs(m.cz + q.cz) <= tol;
    };
    std::vector<std::size_t> image(panels.size(), panels.size());
    for (std::size_t i = 0; i < panels.size(); ++i) {
        for (std::size_t j = 0; j < panels.size() && image[i] == panels.size(); ++j) {
            if (j != i && images(panels[j], panels[i])) image[i] = j;
        }
        if (image[i] == panels.size()) return std::nullopt;
    }
    for (std::size_t i = 0; i < panels.size(); ++i) {
        if (image[image[i]] != i) return std::nullopt;
    }
    return image;
}

std::vector<Panel> panels_of(const ChargeScene& scene, const std::vector<ChargeRing>& rings) {
    require_positive("min_panel", scene.min_panel);
    require_positive("max_panel", scene.max_panel);
    require_at_least("background_permittivity", scene.background_permittivity, 1.0, "a relative permittivity");
    const double eb = scene.background_permittivity;
    // Grading: towards the thin rings, and towards the wires of circular section among the conductors.
    std::vector<ChargeRing> near = rings;
    for (const ConductorBody& c : scene.conductors) {
        if (c.circle) near.push_back({(*c.circle)[0], (*c.circle)[1], (*c.circle)[2]});
    }
    std::vector<Panel> panels;
    for (const DielectricBody& d : scene.dielectrics) {
        require_at_least("relative_permittivity", d.relative_permittivity, 1.0, "a relative permittivity");
        const double lambda = (d.relative_permittivity - eb) / (d.relative_permittivity + eb);
        if (lambda != 0) add_outline(panels, d.outline, d.circle, true, true, lambda, -1, 1, scene, near);
    }
    for (const ConductorBody& c : scene.conductors) {
        const double embed = c.embedding_permittivity > 0 ? c.embedding_permittivity : eb;
        add_outline(panels, c.outline, c.circle, c.closed, false, 0, c.group, embed, scene, near);
    }
    if (panels.size() > 20000) throw InputError("panels", std::to_string(panels.size()) + "; the charge solver takes at most 20000");
    return panels;
}

}  // namespace libcoil::detail
