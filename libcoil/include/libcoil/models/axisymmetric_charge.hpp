// Electrostatics of bodies of revolution about one axis, by the boundary-element (charge) method: the
// surface charge on conductors and the polarisation charge on the faces of dielectrics, of which the turn
// network takes its capacitances wherever there is more than the bare wire in free space.
//
// Method:  every surface is a body's outline in the (rho, z) half-plane, cut into straight panels; rotated
//          about the axis each panel is a band holding a uniform surface charge sigma (the total of free and
//          bound charge, in vacuum). The potential of a charged ring (radius a, height z') at (rho, z) is
//          (1 / 4 pi eps0) (2 / pi) K(m) / s, s^2 = (a + rho)^2 + (z - z')^2, m = 4 a rho / s^2, and its field
//          E_z = (1 / 4 pi eps0) (2 / pi) (z - z') E(m) / (d^2 s), E_rho = (1 / 4 pi eps0) [K - (a^2 - rho^2 +
//          (z - z')^2) E / d^2] / (pi rho s), d^2 = (a - rho)^2 + (z - z')^2 (the gradient of the potential,
//          derived here). Collocation at each panel's middle:
//            conductor panel:  the potential is the conductor's (0 where grounded);
//            dielectric face:  sigma = 2 eps0 lambda E_n, lambda = (eps_in - eps_out) / (eps_in + eps_out),
//                              E_n the principal value of the normal field of every charge (continuity of
//                              the normal D across the face).
//          A panel is a straight piece, or an arc where the outline traces a circle (the charge on the true
//          face: with chords the normal field converges only as the panel length). Panel integrals by
//          Gauss-Legendre (8 points; 4 x 8 where the collocation point is within 1.5
//          panel lengths); on its own panel the potential's logarithm, -2 ln|t| per unit sigma, is
//          subtracted and integrated exactly. Panels are graded: half the distance to the nearest thin
//          ring, between a least and a largest length. A grounded plane z = z_g is an image of every
//          charge (reversed). Dense LU (Eigen).
// Source:  the ring's potential as Smythe, "Static and Dynamic Electricity" (quoted from memory); the
//          integral equation of the dielectric face as in the boundary-element literature on capacitance
//          (e.g. Harrington, "Field Computation by Moment Methods", 1968, from memory); its axisymmetric form
//          and the grading are ours.
// Domain:  bodies of revolution coaxial with the rings; outlines that do not cross; charge on the axis
//          itself held only through the panels that end there.
// Accuracy: tests/cpp/test_axisymmetric_charge.cpp: a ring in a dielectric sphere against the Legendre
//          series of the exact solution (Jackson, "Classical Electrodynamics", section 4.4, method); two
//          wires of a large ring pair against the two parallel cylinders' pi eps0 / acosh(s / d); an
//          enamelled ring against its coaxial shell in series with the bare torus.
#pragma once

#include <array>
#include <optional>
#include <vector>

namespace libcoil {

// A thin ring of charge: the turn network's turn (its wire radius only grades the panels near it).
struct ChargeRing {
    double radius = 0;  // m
    double z = 0;       // m
    double wire_radius = 0;
    bool operator==(const ChargeRing&) const = default;
};

// A closed outline traced counter-clockwise in the (rho, z) half-plane (rho across, z up), so that the
// outward normal lies to the right of travel. Pieces along the axis (rho = 0 at both ends) are no surface
// and are skipped.
using Outline = std::vector<std::array<double, 2>>;

// Where an outline traces a circle (centre rho, centre z, radius), the panels are its arcs.
using Circle = std::optional<std::array<double, 3>>;

struct DielectricBody {
    Outline outline;
    double relative_permittivity = 1;  // inside; outside is the scene's background
    Circle circle{};
    bool operator==(const DielectricBody&) const = default;
};

struct ConductorBody {
    Outline outline;
    bool closed = true;   // false: an open sheet (a thin shield's wall), its two faces' charge together
    int group = -1;       // conductors of one group share a potential; -1: grounded
    double embedding_permittivity = 0;  // the dielectric touching its surface (0: the background)
    Circle circle{};
    bool operator==(const ConductorBody&) const = default;
};

struct ChargeScene {
    std::vector<DielectricBody> dielectrics;
    std::vector<ConductorBody> conductors;
    std::optional<double> ground_plane;  // m, the height of a grounded plane under everything; a body may
                                         // stand on it (its face on the plane is then no face)
    double background_permittivity = 1;
    double min_panel = 0;  // m; > 0 required
    double max_panel = 0;  // m; > 0 required
    bool operator==(const ChargeScene&) const = default;
};

// What bodies do to thin rings (which must lie outside every dielectric: a ring inside one would need its
// own bound charge): entry (i, j) (row-major, n x n) is the potential at ring i's centre from the
// charge the scene's bodies take up when ring j holds 1 C (its own field, and its image in the ground plane,
// not included), V/C. Added to the rings' free-space potential coefficients it gives theirs among the bodies.
// `panels`, where given, receives the number of panels used.
std::vector<double> ring_potential_reaction(const std::vector<ChargeRing>& rings, const ChargeScene& scene,
                                            int* panels = nullptr);

// The Maxwell capacitance matrix of the scene's conductor groups 0 .. groups - 1 (row-major, F): the free
// charge on each group with 1 V on one group and 0 on the others (and on every grounded conductor).
std::vector<double> group_capacitance(const ChargeScene& scene, int groups, int* panels = nullptr);

// The same for a row of `cells` equal cells in free space: the cell's bodies (its conductors all of group
// 0) repeated `period` apart along the axis, cell k's conductors group k. A block of the system depends only
// on the offset between its two cells, so 2 cells - 1 blocks are integrated instead of cells^2 (the turn
// network's near-field section: 13 of 49). Where the cell's panels mirror about z = 0 (circles refined
// towards neighbours on both sides), the row mirrors too: `cells` blocks, and the system solved as its
// mirror-even and mirror-odd halves, two systems of half the size (a quarter of the factoring).
std::vector<double> periodic_group_capacitance(const ChargeScene& cell, int cells, double period, int* panels = nullptr);

// Outlines for the common bodies, counter-clockwise. A tube from z0 to z1 between the radii (inner 0: a
// solid rod), and a circle (a wire's cross-section) of `sides` straight sides, finer where `refine_near`
// points (other wires' centres with their radii) come close: from the outermost point round, and where the
// points mirror about the circle's middle (or there are none) and `sides` is even, the lower half the upper
// half's mirror image.
Outline tube_outline(double inner_radius, double outer_radius, double z0, double z1);
Outline circle_outline(double centre_rho, double centre_z, double radius, int sides,
                       const std::vector<std::array<double, 3>>& refine_near = {});
// Whether (rho, z) lies inside the closed outline (ray casting across the half-plane, the axis closing it).
bool inside(const Outline& outline, double rho, double z);

}  // namespace libcoil
