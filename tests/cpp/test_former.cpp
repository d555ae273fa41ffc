// The printable former: mesh soundness, volume, pitch and root diameter, STL layout, and the errors for
// formers that cannot be printed. References: Boost.Math's Gauss-Kronrod quadrature of the exact
// height field for the volume, and the design values themselves for the pitch and diameters (what the
// mesh must reproduce). admesh, the outside checker, runs in tests/python/test_former.py.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <cstring>
#include <map>
#include <string>

#include <boost/math/quadrature/gauss_kronrod.hpp>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/former.hpp"
#include "libcoil/outputs/former_files.hpp"
#include "libcoil/outputs/stl.hpp"
#include "libcoil/spec/spec.hpp"

using namespace libcoil;

namespace {

std::string coil_yaml(double turns = 10.25, const std::string& pitch = "1.5 mm", const std::string& former = "") {
    return "coil:\n  form_diameter: 20 mm\n  turns: " + std::to_string(turns) + "\n  pitch: " + pitch +
           "\n  wire: {diameter: 1.0 mm, insulation: 0.05 mm}\nformer:\n  material: PETG\n" +
           (former.empty() ? "  kind: grooved-tube\n  wall: 3 mm\n" : former);
}

FormerGeometry geometry(const std::string& yaml, const FormerOptions& o = {}) { return former_geometry(parse_coil_spec(yaml), o); }

constexpr double tol = 0.01e-3;  // the default chord tolerance, m

// The z-integral of (F^2 - R_b^2) / 2 at angle theta, F the exact outer radius: every groove pass present
// at theta, each cut by its neighbours, by adaptive Gauss-Kronrod between the profile's corners.
double section_integral(const FormerGeometry& g, double theta) {
    std::vector<double> zc;
    const double t0 = theta / (2 * pi);
    for (int k = 0; t0 + k <= g.turns + 1e-9; ++k) zc.push_back(g.groove_start + g.pitch * (t0 + k));
    const auto F = [&](double z) {
        double r = g.outer_radius;
        for (double c : zc) r = std::min(r, g.groove_surface(z - c));
        if (z < g.flange_thickness || z > g.length - g.flange_thickness) r = std::max(r, g.flange_radius);
        return r;
    };
    std::vector<double> cuts = {0, g.length, g.flange_thickness, g.length - g.flange_thickness};
    for (double c : zc) {
        for (double u : {-g.half_width, -g.pitch / 2, 0.0, g.pitch / 2, g.half_width}) cuts.push_back(c + u);
    }
    std::sort(cuts.begin(), cuts.end());
    double sum = 0;
    for (std::size_t i = 1; i < cuts.size(); ++i) {
        if (cuts[i] - cuts[i - 1] < 1e-15) continue;
        sum += boost::math::quadrature::gauss_kronrod<double, 31>::integrate(
            [&](double z) { const double r = F(z); return (r * r - g.bore_radius * g.bore_radius) / 2; }, cuts[i - 1], cuts[i], 12, 1e-13);
    }
    return sum;
}

// The grooved tube's volume by quadrature: between the groove's start and end angles the number of
// passes is constant, and so is the z-integral (the sweep keeps volume), so two angles suffice.
double quadrature_volume(const FormerGeometry& g) {
    const double theta_end = 2 * pi * (g.turns - std::floor(g.turns));
    return theta_end * section_integral(g, 0.3 * theta_end) + (2 * pi - theta_end) * section_integral(g, theta_end + 0.3 * (2 * pi - theta_end));
}

}  // namespace

TEST(Former, GroovedTubeMeshIsSoundAndItsVolumeMatches) {
    const FormerGeometry g = geometry(coil_yaml());
    const TriangleMesh m = former_mesh(g, tol);
    const MeshCheck c = check_mesh(m);
    EXPECT_TRUE(c.sound());
    EXPECT_EQ(c.boundary_edges + c.overshared_edges + c.misoriented_edges + c.nonmanifold_vertices + c.degenerate_triangles, 0u);
    EXPECT_EQ(c.unused_vertices, 0u);
    // The closed form against Boost.Math's quadrature of the exact height field (measured 7e-16).
    EXPECT_NEAR(g.volume() / quadrature_volume(g), 1, 1e-10);
    // The mesh, an independent construction, within 0.5 % (the bound; measured -0.022 %).
    EXPECT_NEAR(c.volume / g.volume(), 1, 5e-3);
    EXPECT_NEAR(c.volume / g.volume(), 1, 1e-3);
    // A vee half a wire deep, where the grooves of neighbouring turns merge and the first and last turns
    // keep their outer flanks, and a tube with flanges: the same agreement.
    FormerOptions vee;
    vee.profile = GrooveProfile::vee;
    const FormerGeometry gv = geometry(coil_yaml(7.5), vee);
    ASSERT_GT(gv.half_width, gv.pitch / 2);
    EXPECT_NEAR(gv.volume() / quadrature_volume(gv), 1, 1e-10);
    FormerOptions flange;
    flange.flange = FlangeSpec{30e-3, 2e-3};
    const FormerGeometry gf = geometry(coil_yaml(), flange);
    EXPECT_NEAR(gf.volume() / quadrature_volume(gf), 1, 1e-10);
}

TEST(Former, GroovePitchAndRootFromTheMeshVertices) {
    const FormerGeometry g = geometry(coil_yaml());
    const TriangleMesh m = former_mesh(g, tol);
    // Vertices on the groove's bottom (r = root radius), grouped by angle: consecutive turns are one pitch
    // apart along z, to 1 um (the bound; here to rounding).
    std::map<long, std::vector<double>> bottoms;
    for (const auto& v : m.vertices) {
        if (std::fabs(std::hypot(v[0], v[1]) - g.root_radius) < 1e-12) bottoms[std::lround(std::atan2(v[1], v[0]) * 1e9)].push_back(v[2]);
    }
    ASSERT_GT(bottoms.size(), 50u);
    double worst = 0;
    std::size_t pairs = 0;
    for (auto& [angle, zs] : bottoms) {
        std::sort(zs.begin(), zs.end());
        for (std::size_t i = 1; i < zs.size(); ++i, ++pairs) worst = std::max(worst, std::fabs(zs[i] - zs[i - 1] - g.pitch));
    }
    EXPECT_GT(pairs, 500u);
    EXPECT_LT(worst, 1e-6);
    EXPECT_LT(worst, 1e-12);  // measured 2e-18 m
    // No vertex of the outer surface lies inside the root radius, and the widest angular gap between
    // columns keeps every facet's sag at the root within the chord tolerance.
    std::vector<double> angles;
    double r_min = INFINITY;
    for (const auto& v : m.vertices) {
        const double r = std::hypot(v[0], v[1]);
        if (r > g.bore_radius + 1e-9) {
            r_min = std::min(r_min, r);
            angles.push_back(std::atan2(v[1], v[0]));
        }
    }
    EXPECT_NEAR(r_min, g.root_radius, 1e-12);
    std::sort(angles.begin(), angles.end());
    angles.erase(std::unique(angles.begin(), angles.end(), [](double a, double b) { return b - a < 1e-12; }), angles.end());
    double gap = angles.front() + 2 * pi - angles.back();
    for (std::size_t i = 1; i < angles.size(); ++i) gap = std::max(gap, angles[i] - angles[i - 1]);
    EXPECT_LE(g.root_radius * (1 - std::cos(gap / 2)), tol);
}

TEST(Former, EveryKindAndOptionGivesASoundMesh) {
    struct Case {
        const char* what;
        std::string yaml;
        FormerOptions o;
    };
    FormerOptions flange;
    flange.flange = FlangeSpec{30e-3, 2e-3};
    FormerOptions vee;
    vee.profile = GrooveProfile::vee;  // a 90 degree vee half a wire deep: the grooves of neighbouring turns merge
    FormerOptions ribbed;
    ribbed.kind = FormerKind::ribbed;
    ribbed.ribs = 8;
    ribbed.rib_width = 3e-3;
    FormerOptions ribbed_flange = ribbed;
    ribbed_flange.flange = FlangeSpec{30e-3, 2e-3};
    const std::vector<Case> cases = {
        {"tube", coil_yaml(), {}},
        {"whole turns", coil_yaml(12), {}},
        {"flanges", coil_yaml(), flange},
        {"vee", coil_yaml(7.5), vee},
        {"solid", coil_yaml(6, "1.5 mm", "  kind: grooved-tube\n  wall: 10 mm\n"), {}},
        {"ribbed", coil_yaml(), ribbed},
        {"ribbed with flanges", coil_yaml(9.75), ribbed_flange},
        {"ribbed spec", coil_yaml(5, "1.5 mm", "  kind: ribbed\n  wall: 2 mm\n  ribs: 5\n  rib_width: 4 mm\n"), {}},
    };
    for (const auto& c : cases) {
        SCOPED_TRACE(c.what);
        const FormerGeometry g = geometry(c.yaml, c.o);
        const MeshCheck k = check_mesh(former_mesh(g, tol));
        EXPECT_TRUE(k.sound()) << k.boundary_edges << " " << k.overshared_edges << " " << k.misoriented_edges << " "
                               << k.nonmanifold_vertices << " " << k.degenerate_triangles;
        EXPECT_NEAR(k.volume / g.volume(), 1, 5e-3);  // measured -0.007 % (flanges) to -0.14 % (vee)
    }
    EXPECT_GT(geometry(coil_yaml(7.5), vee).half_width, 1.5e-3 / 2);  // the vee case does merge
    EXPECT_EQ(geometry(coil_yaml(6, "1.5 mm", "  kind: grooved-tube\n  wall: 10 mm\n")).bore_radius, 0);
}

TEST(Former, BoreOversizeWidensOnlyTheBore) {
    FormerOptions o;
    o.bore_oversize = 0.3e-3;
    const FormerGeometry nominal = geometry(coil_yaml()), wide = geometry(coil_yaml(), o);
    EXPECT_DOUBLE_EQ(2 * (wide.bore_radius - nominal.bore_radius), 0.3e-3);
    EXPECT_DOUBLE_EQ(wide.outer_radius, nominal.outer_radius);
    // The volume lost is the annulus pi (r2^2 - r1^2) L, exactly.
    const double annulus = pi * (wide.bore_radius * wide.bore_radius - nominal.bore_radius * nominal.bore_radius) * nominal.length;
    EXPECT_NEAR(nominal.volume() - wide.volume(), annulus, 1e-12 * nominal.volume());
    EXPECT_TRUE(check_mesh(former_mesh(wide, tol)).sound());
}

TEST(Former, RibsAreWhatTheCapacitanceModelSees) {
    const CoilSpec s = parse_coil_spec(coil_yaml(5, "1.5 mm", "  kind: ribbed\n  wall: 2 mm\n  ribs: 5\n  rib_width: 4 mm\n"));
    const FormerGeometry g = former_geometry(s);
    // The solid share of the circumference at the form diameter (self_resonance.hpp's fill).
    EXPECT_NEAR(g.ribs * g.rib_angle / (2 * pi), s.former->dielectric(s.solenoid.form_diameter()).fill, 1e-15);
    EXPECT_NEAR(g.hub_radius, g.root_radius - 2e-3, 1e-15);
}

TEST(Former, TriangleCountGrowsLinearlyInTurns) {
    const auto triangles = [](double turns) { return former_mesh(geometry(coil_yaml(turns)), tol).triangles.size(); };
    const double t50 = static_cast<double>(triangles(50)), t100 = static_cast<double>(triangles(100)), t200 = static_cast<double>(triangles(200));
    EXPECT_NEAR((t200 - t100) / (t100 - t50), 2, 0.02);  // measured 2.000 (80 906, 161 206, 321 806)
    EXPECT_LT(t200, 2.2 * t100);
}

TEST(Former, BinarySTLLayoutAndNormals) {
    const FormerBuild b = build_former(parse_coil_spec(coil_yaml()));
    const std::string stl = stl_binary(b.mesh, "libcoil test");
    ASSERT_EQ(stl.size(), 84 + 50 * b.mesh.triangles.size());
    EXPECT_EQ(stl.compare(0, 12, "libcoil test"), 0);
    std::uint32_t count = 0;
    std::memcpy(&count, stl.data() + 80, 4);
    EXPECT_EQ(count, b.mesh.triangles.size());
    double worst = 1;
    for (std::uint32_t i = 0; i < count; ++i) {
        float f[12];
        std::memcpy(f, stl.data() + 84 + 50 * i, 48);
        const double a[3] = {f[6] - f[3], f[7] - f[4], f[8] - f[5]}, c[3] = {f[9] - f[3], f[10] - f[4], f[11] - f[5]};
        const double n[3] = {a[1] * c[2] - a[2] * c[1], a[2] * c[0] - a[0] * c[2], a[0] * c[1] - a[1] * c[0]};
        const double l = std::sqrt(n[0] * n[0] + n[1] * n[1] + n[2] * n[2]);
        worst = std::min(worst, (n[0] * f[0] + n[1] * f[1] + n[2] * f[2]) / l);
    }
    EXPECT_GT(worst, 0.99);  // measured 0.99999997: every stored normal agrees with the right-hand rule on its winding
    // In millimetres: the outer radius of a vertex on the land.
    float first[3];
    std::memcpy(first, stl.data() + 84 + 12, 12);
    EXPECT_LT(std::hypot(first[0], first[1]), 1e3 * b.geometry.outer_radius + 1e-3);
    EXPECT_GT(std::hypot(first[0], first[1]), 1e3 * b.geometry.bore_radius - 1e-3);
}

TEST(Former, UnprintableGeometryNamesTheField) {
    const auto field_of = [](const std::string& yaml, const FormerOptions& o = {}) {
        try {
            geometry(yaml, o);
        } catch (const InputError& e) {
            return e.field();
        }
        return std::string("no error");
    };
    EXPECT_EQ(field_of(coil_yaml(10, "1.5 mm", "  kind: grooved-tube\n  wall: 0.8 mm\n")), "former.wall");
    EXPECT_EQ(field_of(coil_yaml(10, "1.5 mm", "  kind: grooved-tube\n  wall: 1.5 mm\n  groove: {profile: vee, depth: 2 mm}\n")),
              "former.groove.depth");  // deeper than the wall
    EXPECT_EQ(field_of(coil_yaml(10, "1.5 mm", "  kind: grooved-tube\n  wall: 3 mm\n  groove: {depth: 0.7 mm}\n")),
              "former.groove.depth");  // a round groove deeper than its radius, 0.6 mm
    EXPECT_EQ(field_of(coil_yaml(10, "1.15 mm")), "coil.pitch");  // below 1.1 mm wire + 0.1 mm clearance
    EXPECT_EQ(field_of(coil_yaml(10, "1.5 mm", "  kind: ribbed\n  wall: 3 mm\n  ribs: 12\n  rib_width: 4.5 mm\n")), "former.ribs");
    EXPECT_EQ(field_of(coil_yaml(10, "1.5 mm", "  kind: ribbed\n  wall: 3 mm\n  ribs: 6\n  rib_width: 3 mm\n  hub_wall: 0.5 mm\n")),
              "former.hub_wall");
    EXPECT_EQ(field_of(coil_yaml(10, "1.5 mm", "  kind: grooved-tube\n  wall: 3 mm\n  flange: {diameter: 21 mm, thickness: 2 mm}\n")),
              "former.flange.diameter");
    EXPECT_EQ(field_of(coil_yaml(10, "1.5 mm", "  kind: grooved-tube\n  wall: 3 mm\n  ends: 1 mm\n  flange: {diameter: 30 mm, thickness: 1 mm}\n")),
              "former.ends");
    FormerOptions thin;
    thin.bore_oversize = 3.8e-3;  // the 3 mm wall less 1.9 mm
    EXPECT_EQ(field_of(coil_yaml(), thin), "former.bore_oversize");
    EXPECT_EQ(field_of(coil_yaml()), "no error");
    try {
        geometry(coil_yaml(10, "1.15 mm"));
    } catch (const InputError& e) {
        EXPECT_NE(std::string(e.what()).find("1.150 mm"), std::string::npos) << e.what();  // the value, quoted
    }
}
