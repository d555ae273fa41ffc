// The axisymmetric charge solver against closed-form electrostatics.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <string>
#include <utility>

#include <boost/math/special_functions/legendre.hpp>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/axisymmetric_charge.hpp"
#include "models/axisymmetric_panels.hpp"

using namespace libcoil;

namespace {

// A sphere's outline: a half circle from the south pole to the north through the equator, counter-clockwise.
Outline half_circle(double radius, int sides) {
    Outline o;
    for (int i = 0; i <= sides; ++i) {
        const double t = -pi / 2 + pi * i / sides;
        o.push_back({radius * std::cos(t), radius * std::sin(t)});
    }
    o.front()[0] = o.back()[0] = 0;
    return o;
}

}  // namespace

TEST(AxisymmetricCharge, RingOutsideADielectricSphereMatchesTheLegendreSeries) {
    // A unit ring charge (radius b, height d: at distance rs = sqrt(b^2 + d^2), polar angle theta_s) outside a
    // dielectric sphere (radius R, permittivity eps) in vacuum. The sphere's own charge gives, outside it,
    // the potential sum_l B_l r^-(l+1) P_l(cos theta) / 4 pi eps0, B_l = -(eps - 1) l R^(2l+1) P_l(cos
    // theta_s) / ((eps l + l + 1) rs^(l+1)) (matching phi and eps dphi/dr at r = R per l, the ring's
    // expansion by the addition theorem; the method of Jackson, "Classical Electrodynamics", 3rd ed.,
    // sections 3.3 and 4.4, the series derived here). Observers: small rings on the axis at z = +-3 R.
    const double radius = 1, b = 0.3, d = 1.2, eps = 4;
    // Measured: the error falls as the panel length squared (arcs), +1.9 / +0.48 / +0.12 / +0.03 % at 24 /
    // 48 / 96 / 192 panels on the meridian (with chords it falls only as the length: -0.6 .. -0.2 %).
    for (const int sides : {96, 192}) {
        const double tolerance = sides == 96 ? 2e-3 : 5e-4;
        ChargeScene scene;
        scene.dielectrics.push_back({half_circle(radius, sides), eps, std::array<double, 3>{0, 0, radius}});
        scene.min_panel = 1e-4;
        scene.max_panel = 1;
        const std::vector<ChargeRing> rings{{b, d, 0.01}, {1e-4, 3, 1e-5}, {1e-4, -3, 1e-5}};
        int panels = 0;
        const auto reaction = ring_potential_reaction(rings, scene, &panels);
        const double rs = std::hypot(b, d), cs = d / rs;
        for (const int observer : {1, 2}) {
            const double z = observer == 1 ? 3 : -3;
            double series = 0;
            for (int l = 1; l <= 80; ++l) {
                series += -(eps - 1) * l * std::pow(radius, 2 * l + 1) * boost::math::legendre_p(l, cs) /
                          ((eps * l + l + 1) * std::pow(rs, l + 1)) * std::pow(std::fabs(z), -(l + 1)) * (z > 0 || l % 2 == 0 ? 1 : -1);
            }
            const double solved = 4 * pi * eps0 * reaction[static_cast<std::size_t>(observer * 3 + 0)];
            EXPECT_LT(std::fabs(solved / series - 1), tolerance) << "z " << z << ": " << solved << " vs " << series;
        }
        EXPECT_NEAR(reaction[1], reaction[3], 1e-9 * std::fabs(reaction[3]));  // reciprocity (symmetrised)
        EXPECT_GT(panels, 20);
    }
}

TEST(AxisymmetricCharge, RingsInsideADielectricAreRefused) {
    ChargeScene scene;
    scene.dielectrics.push_back({half_circle(1, 24), 4, std::array<double, 3>{0, 0, 1}});
    scene.min_panel = 1e-3;
    scene.max_panel = 0.1;
    EXPECT_THROW(ring_potential_reaction({{0.5, 0, 0.01}}, scene), InputError);
}

TEST(AxisymmetricCharge, NoContrastNoReaction) {
    ChargeScene scene;
    scene.dielectrics.push_back({tube_outline(0, 1, -1, 1), 1.0});
    scene.min_panel = 1e-3;
    scene.max_panel = 0.1;
    const auto reaction = ring_potential_reaction({{1.2, 0, 0.01}}, scene);
    EXPECT_EQ(reaction[0], 0.0);
}

TEST(AxisymmetricCharge, TwoWiresOfALargeRingPairMatchParallelCylinders) {
    // Two coaxial rings of wire (radius r) on a large radius a, centres s apart: between them, per unit
    // length, the capacitance of two parallel cylinders, pi eps0 / acosh(s / 2r) (the exact 2-D result;
    // e.g. Smythe, "Static and Dynamic Electricity", quoted from memory), with the ring's curvature a
    // correction of order s / a (1e-3 here).
    const double a = 1, r = 1e-3;
    for (double s_over_d : {1.05, 1.5, 3.0}) {
        const double s = s_over_d * 2 * r;
        ChargeScene scene;
        scene.conductors.push_back({circle_outline(a, 0, r, 48, {{a, s, r}}), true, 0, 0, std::array<double, 3>{a, 0, r}});
        scene.conductors.push_back({circle_outline(a, s, r, 48, {{a, 0, r}}), true, 1, 0, std::array<double, 3>{a, s, r}});
        scene.min_panel = 1e-6;
        scene.max_panel = 1;
        const auto c = group_capacitance(scene, 2);
        const double between = 0.5 * (c[0] - c[1]);  // the ring pair's capacitance, charges +-Q
        const double cylinders = pi * eps0 / std::acosh(s_over_d) * 2 * pi * a;
        EXPECT_LT(std::fabs(between / cylinders - 1), 3e-3) << s_over_d << ": " << between << " vs " << cylinders;
        EXPECT_LT(c[1], 0);
        EXPECT_NEAR(c[0], c[3], 1e-3 * c[0]);
    }
}

TEST(AxisymmetricCharge, EnamelledRingIsItsShellInSeriesWithTheBareTorus) {
    // An isolated thin ring coated with a dielectric shell (wire r, coat to r2, eps): the field round the
    // wire is that of a line charge, so 1 / C = ln(r2 / r) / (2 pi eps0 eps 2 pi a) + 1 / C_bare(r2)
    // (the coaxial shell in series; common practice, derived here). The bare ring of radius r2 from the
    // same solver.
    const double a = 0.2, r = 1e-3, r2 = 1.3e-3, eps = 3.5;
    ChargeScene coated, bare;
    coated.conductors.push_back({circle_outline(a, 0, r, 32), true, 0, eps, std::array<double, 3>{a, 0, r}});
    coated.dielectrics.push_back({circle_outline(a, 0, r2, 32), eps, std::array<double, 3>{a, 0, r2}});
    bare.conductors.push_back({circle_outline(a, 0, r2, 32), true, 0, 0, std::array<double, 3>{a, 0, r2}});
    coated.min_panel = bare.min_panel = 1e-6;
    coated.max_panel = bare.max_panel = 1;
    const double c_coated = group_capacitance(coated, 1)[0], c_bare = group_capacitance(bare, 1)[0];
    const double expected = 1 / (std::log(r2 / r) / (2 * pi * eps0 * eps * 2 * pi * a) + 1 / c_bare);
    EXPECT_LT(std::fabs(c_coated / expected - 1), 2e-3) << c_coated << " vs " << expected;
    // And the bare ring against the thin torus, 4 pi^2 eps0 a / ln(8 a / r) (Smythe, from memory).
    EXPECT_LT(std::fabs(c_bare / (4 * pi * pi * eps0 * a / std::log(8 * a / r2)) - 1), 2e-3);
}

// The periodic tests' enamelled turn at height z, its conductor of group `group`, each circle refined towards
// the next turn up and, where `both_sides`, the one below.
constexpr double row_a = 10e-3, row_r = 0.5e-3, row_coat = 0.53e-3, row_pitch = 1.2e-3, row_eps = 3.5;
void add_enamelled_turn(ChargeScene& s, double z, int group, bool both_sides) {
    std::vector<std::array<double, 3>> near{{row_a, z + row_pitch, row_coat}};
    if (both_sides) near.push_back({row_a, z - row_pitch, row_coat});
    s.conductors.push_back({circle_outline(row_a, z, row_r, 16, near), true, group, row_eps, std::array<double, 3>{row_a, z, row_r}});
    s.dielectrics.push_back({circle_outline(row_a, z, row_coat, 16, near), row_eps, std::array<double, 3>{row_a, z, row_coat}});
}

TEST(AxisymmetricCharge, PeriodicRowIsTheWholeSceneSolvedOnce) {
    // The periodic solve (its blocks by offset; split into its mirror-even and mirror-odd halves where the
    // cell mirrors) against the whole scene built turn by turn with the same panels, and the result against
    // the physics it must keep (an exact identity of the method; the values themselves are checked against
    // parallel cylinders above). Rows of odd and even length, and a cell refined towards one neighbour only,
    // which does not mirror and takes the whole system.
    for (const auto& [cells, both_sides] : {std::pair{5, true}, std::pair{4, true}, std::pair{5, false}}) {
        SCOPED_TRACE(std::to_string(cells) + (both_sides ? " cells, refined to both sides" : " cells, refined to one side"));
        ChargeScene cell, whole;
        cell.min_panel = whole.min_panel = 0.02 * row_r;
        cell.max_panel = whole.max_panel = row_pitch;
        add_enamelled_turn(cell, 0, 0, both_sides);
        for (int k = 0; k < cells; ++k) add_enamelled_turn(whole, k * row_pitch, k, both_sides);
        EXPECT_EQ(detail::mirror_images(detail::panels_of(cell, {})).has_value(), both_sides);
        int p_periodic = 0, p_whole = 0;
        const auto c = periodic_group_capacitance(cell, cells, row_pitch, &p_periodic);
        const auto w = group_capacitance(whole, cells, &p_whole);
        EXPECT_EQ(p_periodic, p_whole);
        for (int i = 0; i < cells * cells; ++i) EXPECT_NEAR(c[i], w[i], 1e-11 * w[0]) << i;
        // Mirror-symmetric along the row (turn i to j as turn n-1-i to n-1-j): to rounding where the panels
        // mirror, else to their asymmetry (measured: up to 4e-3 of the first turn's own capacitance with the
        // refinement to one side; the march round the whole circle left 1.5e-3 with it to both sides, before
        // that case mirrored its upper half). (Reciprocity is no check here: both solvers symmetrise their result.)
        double largest = 0;
        for (int i = 0; i < cells; ++i) {
            for (int j = 0; j < cells; ++j) largest = std::max(largest, std::fabs(c[i * cells + j] - c[(cells - 1 - i) * cells + (cells - 1 - j)]));
        }
        if (both_sides) {
            EXPECT_LE(largest, 1e-12 * c[0]);
        } else {
            EXPECT_GT(largest, 1e-6 * c[0]);  // the one-sided refinement shows
            EXPECT_LE(largest, 1e-2 * c[0]);
        }
    }
    const int cells = 5;
    const double pitch = row_pitch, coat = row_coat;
    ChargeScene cell;
    cell.min_panel = 0.02 * row_r;
    cell.max_panel = pitch;
    add_enamelled_turn(cell, 0, 0, true);
    // The row's rules: free space, one group a cell, at least one cell.
    ChargeScene planted = cell;
    planted.ground_plane = -pitch;
    EXPECT_THROW(periodic_group_capacitance(planted, cells, pitch), InputError);
    ChargeScene two = cell;
    two.conductors[0].group = 1;
    EXPECT_THROW(periodic_group_capacitance(two, cells, pitch), InputError);
    EXPECT_THROW(periodic_group_capacitance(cell, 0, pitch), InputError);
    EXPECT_THROW(periodic_group_capacitance(cell, cells, 0), InputError);
    EXPECT_THROW(periodic_group_capacitance(cell, cells, 1.9 * coat), InputError);  // the copies would overlap
    EXPECT_NO_THROW(periodic_group_capacitance(cell, 2, 2 * coat));                  // they may touch
}

TEST(AxisymmetricCharge, CircleOutlineMirrorsWhereItsNeighboursDo) {
    // Neighbours mirrored about the circle's middle (or none): the lower half's vertices are the upper
    // half's mirror images, exactly, from the outermost point round to the innermost; its sides stay within
    // the coarse and fine steps (2 pi / sides, a 64th of it) and refine towards the neighbours. With one
    // neighbour the march goes round and the outline does not mirror.
    const double a = 10e-3, r = 0.5e-3, pitch = 1.1e-3;
    const std::vector<std::array<double, 3>> both{{a, 2e-3 - pitch, r}, {a, 2e-3 + pitch, r}};
    for (const auto& near : {both, std::vector<std::array<double, 3>>{}}) {
        const Outline o = circle_outline(a, 2e-3, r, 16, near);
        ASSERT_EQ(o.size() % 2, 0u);
        const std::size_t n = o.size();
        EXPECT_EQ(o[0][0], a + r);
        EXPECT_EQ(o[n / 2][0], a - r);
        for (std::size_t i = 1; i < n / 2; ++i) {
            EXPECT_NEAR(o[n - i][0], o[i][0], 1e-18) << i;
            EXPECT_NEAR(o[n - i][1] - 2e-3, -(o[i][1] - 2e-3), 1e-18) << i;
        }
        double shortest = 1, longest = 0;
        for (std::size_t i = 0; i < n; ++i) {
            const double side = std::hypot(o[(i + 1) % n][0] - o[i][0], o[(i + 1) % n][1] - o[i][1]) / r;
            shortest = std::min(shortest, side);
            longest = std::max(longest, side);
        }
        EXPECT_LE(longest, 2 * pi / 16 * 1.01);
        if (near.empty()) {
            EXPECT_GT(shortest, 2 * pi / 16 * 0.99);
        } else {
            EXPECT_LT(shortest, 2 * pi / 16 / 3);  // refined towards the neighbours (half the gap, 0.1 r, there)
        }
    }
    EXPECT_EQ(circle_outline(a, 0, r, 7).size(), 7u);  // odd sides: as many as asked, not mirrored
    const Outline one = circle_outline(a, 0, r, 16, {{a, pitch, r}});
    bool mirrors = one.size() % 2 == 0;
    for (std::size_t i = 1; mirrors && i < one.size() / 2; ++i) mirrors = std::fabs(one[one.size() - i][1] + one[i][1]) < 1e-9 * r;
    EXPECT_FALSE(mirrors);
}

TEST(AxisymmetricCharge, BadInputNamesTheField) {
    ChargeScene scene;
    EXPECT_THROW(ring_potential_reaction({{1, 0, 0.01}}, scene), InputError);  // no panel sizes
    scene.min_panel = 1e-3;
    scene.max_panel = 0.1;
    scene.conductors.push_back({tube_outline(0, 1, 0, 1), true, 0});
    EXPECT_THROW(ring_potential_reaction({{1.2, 0, 0.01}}, scene), InputError);  // a floating conductor
    EXPECT_THROW(group_capacitance(scene, 2), InputError);  // group 1 has no conductor
    EXPECT_THROW(tube_outline(1, 0.5, 0, 1), InputError);
    EXPECT_THROW(circle_outline(0.5, 0, 1, 12), InputError);
}

TEST(AxisymmetricCharge, FarRulesAreGaussLegendreWithinTheirRemainder) {
    // The panels' quadrature rules (axisymmetric_panels.hpp): each n-point rule's nodes are the roots of the
    // Legendre polynomial P_n (Boost.Math's legendre_p as the reference), and it integrates x^k over [-1, 1]
    // exactly for k <= 2n - 1 and not for k = 2n (the Gauss-Legendre rule's defining degree; Abramowitz &
    // Stegun 25.4.29, from memory).
    struct Rule {
        int n;
        const double *x, *w;
    };
    const Rule rules[] = {{8, detail::gauss_x, detail::gauss_w},
                          {4, detail::far_x + detail::far_first(4), detail::far_w + detail::far_first(4)},
                          {3, detail::far_x + detail::far_first(3), detail::far_w + detail::far_first(3)},
                          {2, detail::far_x + detail::far_first(2), detail::far_w + detail::far_first(2)}};
    for (const Rule& r : rules) {
        for (int g = 0; g < r.n; ++g) EXPECT_NEAR(boost::math::legendre_p(r.n, r.x[g]), 0.0, 1e-15) << r.n << " points";
        for (int k = 0; k <= 2 * r.n; ++k) {
            double sum = 0;
            for (int g = 0; g < r.n; ++g) sum += r.w[g] * std::pow(r.x[g], k);
            const double exact = k % 2 ? 0.0 : 2.0 / (k + 1);
            if (k < 2 * r.n) EXPECT_NEAR(sum, exact, 1e-15) << r.n << " points, x^" << k;
            else EXPECT_GT(std::fabs(sum - exact), 1e-8) << r.n << " points, x^" << k;
        }
    }
    // far_points: each rule from where its remainder bound on a 1 / d kernel, (L / d)^2n (n!)^4 / ((2n + 1)
    // ((2n)!)^2), falls within the four-point rule's at three lengths, and not far past it (the fewest points
    // that hold it); the normal field's kernel, a factor 2n + 1 more, within nine times that (the four-point
    // rule's own factor there).
    const auto remainder = [](int n, double ratio) {
        const double f = std::tgamma(n + 1.0), f2 = std::tgamma(2 * n + 1.0);
        return std::pow(ratio, -2 * n) * std::pow(f, 4) / ((2 * n + 1) * f2 * f2);
    };
    const double budget = remainder(4, 3);
    EXPECT_NEAR(budget, 3.46e-9, 0.01e-9);
    for (const auto& [n, from] : {std::pair{3, 6.86}, std::pair{2, 35.7}}) {
        EXPECT_LE(remainder(n, from), budget) << n << " points";
        EXPECT_GT(remainder(n, 0.995 * from), budget) << n << " points";
        EXPECT_LE((2 * n + 1) * remainder(n, from), 9 * budget) << n << " points";
        EXPECT_EQ(detail::far_points(from * 1.0001), n);
        EXPECT_EQ(detail::far_points(from * 0.9999), n + 1);
    }
    EXPECT_EQ(detail::far_points(3.01), 4);
    EXPECT_EQ(detail::far_points(1e4), 2);
}
