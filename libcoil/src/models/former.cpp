#include "libcoil/models/former.hpp"

#include <algorithm>
#include <cmath>
#include <utility>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"

namespace libcoil {

double FormerGeometry::groove_surface(double u) const {
    const double x = std::fabs(u);
    if (x >= half_width) return outer_radius;
    if (profile == GrooveProfile::round) {
        const double centre = root_radius + groove_radius;
        return centre - std::sqrt(std::max(0.0, groove_radius * groove_radius - x * x));
    }
    const double apex = seat_radius - groove_radius / std::sin(vee_half_angle);
    return std::max(root_radius, apex + x / std::tan(vee_half_angle));
}

namespace {

std::string mm(double v) { return format_quantity(v, Dimension::length); }

constexpr double solid_radius_floor = 0.5e-3;  // a bore narrower than this is left solid

// integral from u1 to u2 (0 <= u1 <= u2 <= half width) of (R_o^2 - g(u)^2) / 2 du: the removed share of
// r dr du in one groove's meridional section.
double removed_section(const FormerGeometry& g, double u1, double u2) {
    const double ro2 = g.outer_radius * g.outer_radius;
    if (g.profile == GrooveProfile::round) {
        const double rc = g.root_radius + g.groove_radius, rg = g.groove_radius;
        // (R_o^2 - g^2) / 2 with g = rc - s, s = sqrt(rg^2 - u^2): (R_o^2 - rc^2 - rg^2 + u^2 + 2 rc s) / 2
        const auto F = [&](double u) {
            const double s = std::sqrt(std::max(0.0, rg * rg - u * u));
            return ((ro2 - rc * rc - rg * rg) * u + u * u * u / 3 + rc * (u * s + rg * rg * std::asin(std::min(1.0, u / rg)))) / 2;
        };
        return F(u2) - F(u1);
    }
    const double k = 1 / std::tan(g.vee_half_angle);
    const double apex = g.seat_radius - g.groove_radius / std::sin(g.vee_half_angle);
    const double flat = std::max(0.0, (g.root_radius - apex) / k);  // half width of the flat
    double sum = 0;
    if (u1 < flat) sum += (ro2 - g.root_radius * g.root_radius) / 2 * (std::min(u2, flat) - u1);
    const double a = std::max(u1, flat);
    if (u2 > a) {
        const auto F = [&](double u) { return (ro2 * u - std::pow(apex + k * u, 3) / (3 * k)) / 2; };
        sum += F(u2) - F(a);
    }
    return sum;
}

}  // namespace

double FormerGeometry::volume() const {
    const double two_pi = 2 * pi;
    const double half = std::min(half_width, pitch / 2);
    const double per_turn = 2 * removed_section(*this, 0, half);  // within half a pitch of the centre line
    const double flank = half_width > half ? removed_section(*this, half, half_width) : 0;  // beyond, at the ends
    const double phi_end = two_pi * turns;
    const double ro2 = outer_radius * outer_radius, rb2 = bore_radius * bore_radius;
    const double flanges = 2 * pi * (flange_radius * flange_radius - ro2) * flange_thickness;
    if (kind == FormerKind::grooved_tube) {
        return pi * (ro2 - rb2) * length + (flange_thickness > 0 ? flanges : 0) - per_turn * phi_end - 2 * flank * two_pi;
    }
    // Ribbed: the end rings, the hub, the ribs, less the groove where it crosses the ribs. The number of
    // groove passes at angle theta in [0, 2 pi) is M + 1 up to 2 pi f and M beyond (turns = M + f).
    const double zone = rib_zone_high - rib_zone_low;
    const double rh2 = hub_radius * hub_radius;
    const double m = std::floor(turns), f_end = two_pi * (turns - m);
    double passes = 0;  // integral of the pass count over the ribs' angles
    for (int j = 0; j < ribs; ++j) {
        double a = two_pi * j / ribs - rib_angle / 2, b = a + rib_angle;
        if (a < 0) {  // rib 0 straddles theta = 0: [a + 2 pi, 2 pi) and [0, b)
            passes += m * (-a) + std::max(0.0, f_end - (a + two_pi));
            a = 0;
        }
        passes += m * (b - a) + std::max(0.0, std::min(b, f_end) - a);
    }
    return pi * (ro2 - rb2) * (length - zone) + (flange_thickness > 0 ? flanges : 0) + pi * (rh2 - rb2) * zone +
           ribs * rib_angle / 2 * (ro2 - rh2) * zone - per_turn * passes - 2 * flank * ribs * rib_angle;
}

FormerGeometry former_geometry(const CoilSpec& spec, const FormerOptions& o) {
    FormerGeometry g;
    FormerSpec f;
    if (spec.former) {
        f = *spec.former;
    } else {
        f.material = former_material("PETG");
        g.notes.push_back("the spec has no former section: a PETG grooved tube with a 3 mm wall assumed");
    }
    // The options are named by their own keys (a front end shows its name for each).
    if (o.kind == FormerKind::ribbed && f.kind != FormerKind::ribbed && !(o.ribs && o.rib_width)) {
        throw InputError("kind", "ribbed needs ribs and rib_width when the spec's former is not ribbed");
    }
    if (o.kind) f.kind = *o.kind;
    if (f.kind != FormerKind::ribbed && (o.ribs || o.rib_width)) {
        throw InputError(o.ribs ? "ribs" : "rib_width", "applies to a ribbed former only; this one is a grooved tube (choose the ribbed kind)");
    }
    if (o.ribs && *o.ribs < 3) throw InputError("ribs", std::to_string(*o.ribs) + "; a ribbed former needs 3 ribs or more");
    if (o.ribs) f.ribs = *o.ribs;
    if (o.rib_width) f.rib_width = require_positive("rib_width", *o.rib_width);
    if (o.profile) f.groove.profile = *o.profile;
    if (o.groove_depth) f.groove.depth = require_positive("groove_depth", *o.groove_depth);
    if (o.clearance) f.groove.clearance = require_non_negative("clearance", *o.clearance);
    if (o.flange) {
        require_positive("flange", o.flange->diameter);
        require_positive("flange", o.flange->thickness);
        f.flange = *o.flange;
    }
    if (o.ends) f.ends = require_non_negative("ends", *o.ends);
    if (o.bore_oversize) f.bore_oversize = require_non_negative("bore_oversize", *o.bore_oversize);
    require_positive("chord_tolerance", o.chord_tolerance);

    const Solenoid& s = spec.solenoid;
    g.kind = f.kind;
    g.profile = f.groove.profile;
    g.turns = s.turns();
    g.pitch = s.pitch();
    g.wire_diameter = s.wire().insulated_diameter();
    g.seat_radius = s.mean_radius();
    g.root_radius = s.form_diameter() / 2;
    g.clearance = f.groove.clearance;
    g.groove_radius = (g.wire_diameter + g.clearance) / 2;
    g.min_wall = f.min_wall;
    const double d = g.wire_diameter;

    if (g.pitch < d + g.clearance) {
        throw InputError("coil.pitch", mm(g.pitch) + " is narrower than the insulated wire plus the groove's clearance (" + mm(d) +
                                           " + " + mm(g.clearance) + "); widen the pitch or reduce former.groove.clearance");
    }
    const double depth = f.groove.depth.value_or(d / 2);
    if (!f.groove.depth) g.notes.push_back("no former.groove.depth given: half the insulated wire, " + mm(depth));
    if (g.profile == GrooveProfile::round) {
        if (depth > g.groove_radius) {
            throw InputError("former.groove.depth", mm(depth) + " is deeper than the round groove's radius (" + mm(g.groove_radius) +
                                                        "), which would undercut the wire; use profile: vee for a deeper groove");
        }
        g.outer_radius = g.root_radius + depth;
        const double centre = g.root_radius + g.groove_radius;
        g.half_width = std::sqrt(std::max(0.0, g.groove_radius * g.groove_radius - (centre - g.outer_radius) * (centre - g.outer_radius)));
    } else {
        g.vee_half_angle = f.groove.angle / 2;
        const double apex = g.seat_radius - g.groove_radius / std::sin(g.vee_half_angle);
        g.outer_radius = g.root_radius + depth;
        g.half_width = (g.outer_radius - apex) * std::tan(g.vee_half_angle);
    }
    if (f.wall < g.min_wall) {
        throw InputError("former.wall", mm(f.wall) + " is thinner than the thinnest wall that prints well, former.min_wall = " + mm(g.min_wall));
    }
    if (depth > f.wall) {
        throw InputError("former.groove.depth", mm(depth) + " is deeper than the wall under the winding (former.wall = " + mm(f.wall) +
                                                    "); the ridges would stand taller than the tube is thick");
    }
    if (f.kind == FormerKind::grooved_tube) {
        g.bore_radius = g.root_radius - f.wall;
    } else {
        g.ribs = f.ribs;
        g.hub_radius = g.root_radius - f.wall;
        g.rib_angle = f.rib_width / g.root_radius;
        if (!(g.ribs >= 3)) throw InputError("former.ribs", "a ribbed former needs 3 ribs or more; got " + std::to_string(g.ribs));
        if (f.hub_wall < g.min_wall) {
            throw InputError("former.hub_wall", mm(f.hub_wall) + " is thinner than former.min_wall = " + mm(g.min_wall));
        }
        if (g.hub_radius - f.hub_wall < 0) {
            throw InputError("former.hub_wall", mm(f.hub_wall) + " is more than the hub's radius (" + mm(g.hub_radius) + ")");
        }
        const double gap = g.hub_radius * (2 * pi / g.ribs - g.rib_angle);
        if (gap < g.min_wall) {
            throw InputError("former.ribs", std::to_string(g.ribs) + " ribs of " + mm(f.rib_width) + " leave gaps of " + mm(std::max(0.0, gap)) +
                                                " at the hub; expected at least former.min_wall = " + mm(g.min_wall) + ": fewer or narrower ribs");
        }
        if (g.rib_angle * g.hub_radius < g.min_wall) {
            throw InputError("former.rib_width", mm(f.rib_width) + " narrows to " + mm(g.rib_angle * g.hub_radius) +
                                                     " at the hub, below former.min_wall = " + mm(g.min_wall));
        }
        g.bore_radius = g.hub_radius - f.hub_wall;
    }
    g.bore_oversize = f.bore_oversize;
    if (g.bore_radius >= solid_radius_floor && f.bore_oversize > 0) {
        g.bore_radius += f.bore_oversize / 2;
        const double wall = (f.kind == FormerKind::ribbed ? g.hub_radius : g.root_radius) - g.bore_radius;
        if (wall < g.min_wall) {
            throw InputError("former.bore_oversize", mm(f.bore_oversize) + " thins the wall around the bore to " + mm(wall) +
                                                         ", below former.min_wall = " + mm(g.min_wall));
        }
        g.notes.push_back("the bore is printed " + mm(f.bore_oversize) + " wider than its nominal " +
                          mm(2 * g.bore_radius - f.bore_oversize) + ", for the shrinkage of printed holes");
    }
    if (g.bore_radius < solid_radius_floor) {
        g.bore_radius = 0;
        g.notes.push_back("the bore would be narrower than " + mm(2 * solid_radius_floor) + ": the former is solid");
    }
    if (f.flange) {
        g.flange_radius = f.flange->diameter / 2;
        g.flange_thickness = f.flange->thickness;
        if (!(g.flange_radius > g.outer_radius)) {
            throw InputError("former.flange.diameter", mm(f.flange->diameter) + " is no wider than the former (" + mm(2 * g.outer_radius) + ")");
        }
    }
    g.ends = f.ends.value_or(5e-3);
    if (!f.ends) g.notes.push_back("no former.ends given: 5 mm of plain former at each end");
    g.groove_start = g.ends + d / 2;
    g.length = 2 * g.ends + s.winding_length() + d;
    // Below the groove (and above it) a solid ring of at least min_wall over the flange.
    const double reach = g.kind == FormerKind::ribbed ? std::max(g.half_width, d / 2) + g.min_wall / 2 : g.half_width;
    const double end_ring = g.groove_start - reach - g.flange_thickness;
    if (end_ring < g.min_wall) {
        throw InputError("former.ends", mm(g.ends) + " leaves " + mm(std::max(0.0, end_ring)) + " of solid former beyond the groove" +
                                            (g.flange_thickness > 0 ? " and the flange" : "") + "; expected at least former.min_wall = " + mm(g.min_wall));
    }
    if (g.kind == FormerKind::ribbed) {
        g.rib_zone_low = g.groove_start - reach;
        g.rib_zone_high = g.groove_start + g.pitch * g.turns + reach;
        // The wire runs straight from rib to rib: a polygon of k sides on the seat radius.
        const double side = 2 * g.seat_radius * std::sin(pi / g.ribs);
        g.wire_cut_length = g.turns * std::hypot(g.ribs * side, g.pitch) + s.lead_length();
        const double area_share = g.ribs * std::sin(2 * pi / g.ribs) / (2 * pi);
        if (area_share < 0.995) {
            g.notes.push_back("the wire runs straight between the " + std::to_string(g.ribs) + " ribs: each turn encloses " +
                              format_value(100 * (1 - area_share)) + " % less area than the circle the analysis assumes, so expect "
                              "an inductance lower by up to about that much; more ribs bring it closer");
        }
    } else {
        g.wire_cut_length = s.wire_length();
    }
    return g;
}

namespace {

using Point = OutlinePoint;

// The profile's sample offsets u in [-w, w]: the chord tolerance along the arc (or the vee's corners),
// the centre line, and +-p/2 where the grooves of neighbouring turns meet.
std::vector<double> profile_offsets(const FormerGeometry& g, double tol) {
    std::vector<double> u;
    const double w = g.half_width;
    if (g.profile == GrooveProfile::round) {
        const double rg = g.groove_radius;
        const double psi_w = std::asin(std::min(1.0, w / rg));
        const double step = 2 * std::acos(std::max(-1.0, 1 - tol / rg));
        const int n = std::max(2, 2 * static_cast<int>(std::ceil(psi_w / step)));  // even: u = 0 is a sample
        for (int i = 0; i <= n; ++i) u.push_back(rg * std::sin(-psi_w + 2 * psi_w * i / n));
        u.front() = -w;
        u[n / 2] = 0;  // the groove's bottom, exactly
        u.back() = w;
    } else {
        const double k = 1 / std::tan(g.vee_half_angle);
        const double apex = g.seat_radius - g.groove_radius / std::sin(g.vee_half_angle);
        const double flat = std::max(0.0, (g.root_radius - apex) / k);
        u = {-w, 0.0, w};
        if (flat > 0 && flat < w) {
            u.push_back(-flat);
            u.push_back(flat);
        }
    }
    if (w > g.pitch / 2) {
        u.push_back(-g.pitch / 2);
        u.push_back(g.pitch / 2);
    }
    std::sort(u.begin(), u.end());
    std::vector<double> out;
    for (double x : u) {
        if (out.empty() || x - out.back() > 1e-9 * g.pitch) out.push_back(x);
    }
    return out;
}

// The groove's points on the column at angle theta in [0, 2 pi), in rising z.
std::vector<Point> groove_rows(const FormerGeometry& g, const std::vector<double>& offsets, double theta) {
    std::vector<Point> rows;
    const double t0 = theta / (2 * pi);  // turns of the helix at this angle, first pass
    const double eps = 1e-9;
    const bool merged = g.half_width > g.pitch / 2;
    for (int k = 0; t0 + k <= g.turns + eps; ++k) {
        const double zc = g.groove_start + g.pitch * (t0 + k);
        const bool below = k >= 1, above = t0 + k + 1 <= g.turns + eps;
        for (double u : offsets) {
            if (u <= 0 ? (below && merged && u <= -g.pitch / 2) : (above && merged && u > g.pitch / 2)) continue;
            rows.push_back({zc + u, g.groove_surface(u)});
        }
    }
    return rows;
}

// Bounds on the mesh (common practice, no source): a chord no printer resolves; a size no slicer takes,
// counted as the mesh grows (a 10 000-turn former passes it within seconds, before memory runs short).
inline constexpr double min_chord_tolerance = 1e-6;        // m
inline constexpr double max_mesh_triangles = 5e6;  // a binary STL of 250 MB

class MeshBuilder {
public:
    std::uint32_t at(double theta, double r, double z) { return m_.add_vertex(r * std::cos(theta), r * std::sin(theta), z); }

    // Joins two chains (A at the smaller angle) from the bottom cap to the top, in order of z and, among
    // points at one z, of their place in the chain. Triangles that share vertices collapse and are dropped.
    void zip(const std::vector<std::uint32_t>& a, const std::vector<std::uint32_t>& b) {
        const auto ka = keys(a), kb = keys(b);
        std::size_t i = 0, j = 0;
        while (i + 1 < a.size() || j + 1 < b.size()) {
            const bool advance_a = j + 1 == b.size() || (i + 1 < a.size() && ka[i + 1] <= kb[j + 1]);
            if (advance_a) {
                m_.add_triangle(a[i], b[j], a[i + 1]);
                ++i;
            } else {
                m_.add_triangle(a[i], b[j], b[j + 1]);
                ++j;
            }
        }
        if (static_cast<double>(m_.triangles.size()) > max_mesh_triangles) {
            throw InputError("chord_tolerance", "the mesh passes 5 million triangles; give a coarser tolerance (or wind fewer turns)");
        }
    }

    TriangleMesh& mesh() { return m_; }

private:
    std::vector<std::pair<double, int>> keys(const std::vector<std::uint32_t>& c) const {
        std::vector<std::pair<double, int>> k(c.size());
        for (std::size_t i = 0; i < c.size(); ++i) {
            const double z = m_.vertices[c[i]][2];
            k[i] = {z, i > 0 && k[i - 1].first == z ? k[i - 1].second + 1 : 0};
        }
        return k;
    }

    TriangleMesh m_;
};

enum class ColumnKind { tube, tip, hub_edge, gap };
struct Column {
    double theta;
    ColumnKind kind;
};

// Angles from a to b (a < b) at most `step` apart, a included, b not.
void subdivide(std::vector<Column>& out, double a, double b, double step, ColumnKind kind) {
    const int n = std::max(1, static_cast<int>(std::ceil((b - a) / step)));
    for (int i = 0; i < n; ++i) out.push_back({a + (b - a) * i / n, kind});
}

}  // namespace

TriangleMesh former_mesh(const FormerGeometry& g, double tol) {
    require_positive("chord_tolerance", tol);
    if (tol < min_chord_tolerance) {
        throw InputError("chord_tolerance", format_value(tol * 1e3) + " mm is finer than any printer resolves; expected at least 0.001 mm");
    }
    const double two_pi = 2 * pi;
    const double r_max = std::max(g.outer_radius, g.flange_radius);
    const double step = std::min(two_pi / 12, 2 * std::acos(std::max(-1.0, 1 - tol / r_max)));
    const double theta_end = two_pi * (g.turns - std::floor(g.turns));
    std::vector<Column> cols;
    if (g.kind == FormerKind::grooved_tube) {
        subdivide(cols, 0, two_pi, step, ColumnKind::tube);
    } else {
        for (int j = 0; j < g.ribs; ++j) {
            const double a = two_pi * j / g.ribs - g.rib_angle / 2, b = a + g.rib_angle;
            const double next = a + two_pi / g.ribs;
            cols.push_back({a, ColumnKind::hub_edge});
            subdivide(cols, a, b, step, ColumnKind::tip);
            cols.push_back({b, ColumnKind::tip});
            cols.push_back({b, ColumnKind::hub_edge});
            std::vector<Column> gap;
            subdivide(gap, b, next, step, ColumnKind::gap);
            cols.insert(cols.end(), gap.begin() + 1, gap.end());
        }
    }
    // The groove's start (theta = 0) and end are columns of their own, where they cross the surface.
    for (double extra : {0.0, theta_end}) {
        for (std::size_t i = 0; i < cols.size(); ++i) {
            const Column& c = cols[i];
            const std::size_t n = i + 1 < cols.size() ? i + 1 : 0;
            const double next = n == 0 ? cols[0].theta + two_pi : cols[n].theta;
            const double x = extra < c.theta ? extra + two_pi : extra;
            if (std::fabs(x - c.theta) < 1e-12 || std::fabs(x - next) < 1e-12) break;
            if (x > c.theta && x < next && (c.kind == ColumnKind::tube || (c.kind == ColumnKind::tip && cols[n].kind == ColumnKind::tip))) {
                cols.insert(cols.begin() + static_cast<std::ptrdiff_t>(i) + 1, Column{x, c.kind});
                break;
            }
        }
    }

    MeshBuilder mb;
    const auto offsets = profile_offsets(g, tol);
    const double ro = g.outer_radius, rf = g.flange_radius, tf = g.flange_thickness, len = g.length;
    std::vector<std::vector<std::uint32_t>> chains;
    std::vector<double> ring_theta;                      // one per distinct angle
    std::vector<std::uint32_t> ring_bottom, ring_top;    // the outer chains' ends at those angles
    std::vector<std::uint32_t> bottom_land, top_land, tip_rows;
    std::uint32_t p_low = 0, q_high = 0;
    double tip_theta = NAN;
    std::vector<double> tip_z;  // the z of the last tip column's groove rows, for its hub edge
    for (std::size_t i = 0; i < cols.size(); ++i) {
        const Column& c = cols[i];
        const double th = c.theta, th01 = std::fmod(th + two_pi, two_pi);
        const bool same_angle = !ring_theta.empty() && ring_theta.back() == th;
        if (!same_angle) {
            bottom_land.clear();
            top_land.clear();
            if (tf > 0) {
                bottom_land = {mb.at(th, rf, 0), mb.at(th, rf, tf), mb.at(th, ro, tf)};
                top_land = {mb.at(th, ro, len - tf), mb.at(th, rf, len - tf), mb.at(th, rf, len)};
            } else {
                bottom_land = {mb.at(th, ro, 0)};
                top_land = {mb.at(th, ro, len)};
            }
            ring_theta.push_back(th);
            ring_bottom.push_back(bottom_land.front());
            ring_top.push_back(top_land.back());
            if (g.kind == FormerKind::ribbed) {
                p_low = mb.at(th, ro, g.rib_zone_low);
                q_high = mb.at(th, ro, g.rib_zone_high);
            }
        }
        std::vector<std::uint32_t> chain = bottom_land;
        if (c.kind == ColumnKind::tube || c.kind == ColumnKind::tip) {
            if (c.kind == ColumnKind::tip) chain.push_back(p_low);
            tip_z.clear();
            for (const Point& pt : groove_rows(g, offsets, th01)) {
                chain.push_back(mb.at(th, pt.r, pt.z));
                tip_z.push_back(pt.z);
            }
            tip_theta = th;
            if (c.kind == ColumnKind::tip) chain.push_back(q_high);
        } else {
            // Hub: at a rib's edge, rung by rung with the tip chain at the same angle (built just before
            // or just after); in a gap, the hub's two ends only.
            chain.push_back(p_low);
            chain.push_back(mb.at(th, g.hub_radius, g.rib_zone_low));
            if (c.kind == ColumnKind::hub_edge) {
                std::vector<double> zs = tip_z;
                if (tip_theta != th) {  // the tip comes next: its rows are the same at this angle
                    zs.clear();
                    for (const Point& pt : groove_rows(g, offsets, th01)) zs.push_back(pt.z);
                }
                for (double z : zs) chain.push_back(mb.at(th, g.hub_radius, z));
            }
            chain.push_back(mb.at(th, g.hub_radius, g.rib_zone_high));
            chain.push_back(q_high);
        }
        chain.insert(chain.end(), top_land.begin(), top_land.end());
        chains.push_back(std::move(chain));
    }
    for (std::size_t i = 0; i < chains.size(); ++i) mb.zip(chains[i], chains[(i + 1) % chains.size()]);

    // End caps and the bore.
    TriangleMesh& m = mb.mesh();
    const std::size_t n = ring_theta.size();
    if (g.bore_radius > 0) {
        std::vector<std::uint32_t> b0(n), b1(n);
        for (std::size_t i = 0; i < n; ++i) {
            b0[i] = mb.at(ring_theta[i], g.bore_radius, 0);
            b1[i] = mb.at(ring_theta[i], g.bore_radius, len);
        }
        for (std::size_t i = 0; i < n; ++i) {
            const std::size_t k = (i + 1) % n;
            m.add_triangle(ring_bottom[i], b0[i], ring_bottom[k]);
            m.add_triangle(ring_bottom[k], b0[i], b0[k]);
            m.add_triangle(ring_top[i], ring_top[k], b1[i]);
            m.add_triangle(ring_top[k], b1[k], b1[i]);
            m.add_triangle(b0[i], b1[i], b0[k]);
            m.add_triangle(b0[k], b1[i], b1[k]);
        }
    } else {
        const std::uint32_t c0 = m.add_vertex(0, 0, 0), c1 = m.add_vertex(0, 0, len);
        for (std::size_t i = 0; i < n; ++i) {
            const std::size_t k = (i + 1) % n;
            m.add_triangle(ring_bottom[i], c0, ring_bottom[k]);
            m.add_triangle(ring_top[i], ring_top[k], c1);
        }
    }
    return std::move(m);
}

std::vector<OutlinePoint> former_outline(const FormerGeometry& g, double theta, double tol) {
    require_positive("chord_tolerance", tol);
    require_finite("theta", theta);
    const double th = std::fmod(std::fmod(theta, 2 * pi) + 2 * pi, 2 * pi);
    std::vector<OutlinePoint> out;
    const double ro = g.outer_radius, rf = g.flange_radius, tf = g.flange_thickness;
    if (tf > 0) out = {{0, rf}, {tf, rf}, {tf, ro}};
    else out = {{0, ro}};
    for (const Point& p : groove_rows(g, profile_offsets(g, tol), th)) out.push_back(p);
    if (tf > 0) {
        out.push_back({g.length - tf, ro});
        out.push_back({g.length - tf, rf});
        out.push_back({g.length, rf});
    } else {
        out.push_back({g.length, ro});
    }
    return out;
}

}  // namespace libcoil
