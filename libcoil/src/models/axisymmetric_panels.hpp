// Internal: the charge solver's panels (axisymmetric_charge.hpp): each outline of a scene cut into straight
// panels or circular arcs, graded towards thin rings and wires, with the Gauss-Legendre points their
// integrals take kept on each. The integrals and the system are axisymmetric_charge.cpp's.
#pragma once

#include <array>
#include <cmath>
#include <cstddef>
#include <optional>
#include <vector>

#include "libcoil/models/axisymmetric_charge.hpp"

namespace libcoil::detail {

// A panel: a straight piece of an outline, or an arc of a circle (centre (cr, cz), radius R, angles t0 .. t1)
// where the outline traces one: the charge lies on the true surface, so that a smooth face's curvature is
// not lost between panels (with chords, the normal field converges only as the panel length).
struct Panel {
    double r0, z0, r1, z1;  // ends (straight)
    bool arc = false;
    double cr = 0, cz = 0, radius = 0, t0 = 0, t1 = 0;
    double length, rc, zc, nr, nz;  // length; the middle and the outward normal there
    bool dielectric;
    double lambda;   // dielectric faces
    int group;       // conductors
    double charge_scale;  // conductors: free charge per total charge (the permittivity touching it)
    std::array<double, 8> gauss_r{}, gauss_z{};  // the whole panel's Gauss-Legendre points (piece_integral's)
    std::array<double, 9> far_r{}, far_z{};      // and far_integral's: its three rules' (far_first)

    // The point at u in [0, 1] along the panel.
    std::array<double, 2> at(double u) const {
        if (arc) {
            const double t = t0 + u * (t1 - t0);
            return {cr + radius * std::cos(t), cz + radius * std::sin(t)};
        }
        return {r0 + u * (r1 - r0), z0 + u * (z1 - z0)};
    }
};

// The eight-point Gauss-Legendre rule on [-1, 1] (piece_integral), and far_integral's four-, three- and
// two-point rules one after another (the n-point rule's first point at far_first(n)).
inline constexpr double gauss_x[] = {-0.9602898564975363, -0.7966664774136267, -0.5255324099163290, -0.1834346424956498,
                                     0.1834346424956498,  0.5255324099163290,  0.7966664774136267,  0.9602898564975363};
inline constexpr double gauss_w[] = {0.1012285362903763, 0.2223810344533745, 0.3137066458778873, 0.3626837833783620,
                                     0.3626837833783620, 0.3137066458778873, 0.2223810344533745, 0.1012285362903763};
inline constexpr double far_x[] = {-0.8611363115940526, -0.3399810435848563, 0.3399810435848563, 0.8611363115940526,
                                   -0.7745966692414834, 0.0, 0.7745966692414834,
                                   -0.5773502691896258, 0.5773502691896258};
inline constexpr double far_w[] = {0.3478548451374538, 0.6521451548625461, 0.6521451548625461, 0.3478548451374538,
                                   5.0 / 9, 8.0 / 9, 5.0 / 9,
                                   1.0, 1.0};
constexpr int far_first(int n) { return n == 4 ? 0 : n == 3 ? 4 : 7; }

// The points far_integral (axisymmetric_charge.cpp) takes for a whole panel seen from `ratio` panel lengths
// away (beyond three): the fewest whose Gauss-Legendre remainder on a 1 / d kernel, (L / d)^2n (n!)^4 /
// ((2n + 1) ((2n)!)^2) of the integral, stays within the four-point rule's at three lengths, 3.5e-9: four
// points from 3 lengths, three from 6.86, two from 35.7 (6.850 and 35.607 rounded up). The normal field's
// kernel (1 / d^2) takes a factor 2n + 1 more in each, which would let the smaller rules in sooner (6.6 and
// 30.7 lengths): the thresholds hold for both (tests/cpp/test_axisymmetric_charge.cpp). On the dense design
// grid's charge solves (2026-12-05) 14 % of the far pairs took four points, 60 % three, 26 % two: 28 %
// fewer far points than four each, 18 % fewer ring-field evaluations in all (callgrind).
constexpr int far_points(double ratio) { return ratio > 35.7 ? 2 : ratio > 6.86 ? 3 : 4; }
// Beyond this many panel lengths from its middle a whole panel takes far_integral.
inline constexpr double far_lengths = 3;

// The panels of a scene, its dielectrics' faces first, then its conductors'; grading towards `rings` and the
// conductors' wire circles. InputError beyond 20000 panels.
std::vector<Panel> panels_of(const ChargeScene& scene, const std::vector<ChargeRing>& rings);

// Each panel's mirror image in the plane z = 0 (its index), where every panel has one other than itself and
// the images pair off (a cell of bodies symmetric about z = 0, their outlines' vertices mirror images:
// circle_outline's symmetric case); else none. Matched to 1e-9 of the panels' extent.
std::optional<std::vector<std::size_t>> mirror_images(const std::vector<Panel>& panels);

// The panel moved by dz along the axis.
inline Panel shifted(Panel p, double dz) {
    p.z0 += dz;
    p.z1 += dz;
    p.cz += dz;
    p.zc += dz;
    for (double& z : p.gauss_z) z += dz;
    for (double& z : p.far_z) z += dz;
    return p;
}

}  // namespace libcoil::detail
