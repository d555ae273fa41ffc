// The printable winding former: its dimensions from a coil spec, its volume, and its triangle mesh.
//
// Method:  a grooved tube, or a hub with k axial ribs, whose outer surface carries one helical groove at
//          the coil's pitch for its number of turns. The wire rests on the groove's bottom at the form
//          diameter, so its centre lies on the design's mean diameter; the groove is the given clearance
//          wider than the insulated wire (round: an arc of radius (d + c) / 2; vee: flanks at the given
//          angle tangent to a circle of that radius about the wire's centre, with a flat where the wire
//          rests). The outer surface is a height field r(theta, z) over the cylinder: columns at angles a
//          chord tolerance apart, each a chain of points on the exact surface (on every groove instance,
//          rows of the profile sampled to the chord tolerance, so that each row is a helix), zipped to the
//          next column in order of z. Rib walls are columns at one angle joined rung by rung. End caps
//          join the outer chain ends to the bore. The mesh is closed and 2-manifold by construction and
//          checked (mesh.hpp).
// Volume:  the sweep (r, theta, z) -> (r, theta, z + p theta / 2 pi) keeps volume, so a groove of
//          meridional section S removes phi_end * integral(r dA) over S: closed forms for the arc and the
//          vee, with the grooves of neighbouring turns cut at half a pitch where they overlap.
// Domain:  turns >= 1; a round groove no deeper than its radius; every wall at least min_wall.
// Accuracy (tests/cpp/test_former.cpp, tests/python/test_former.py): the closed-form volume against
//          Boost.Math quadrature of the exact height field 7e-16; the mesh's volume -0.007 .. -0.14 % of it,
//          admesh's -0.013 .. -0.094 %; groove pitch from the vertices 2e-18 m (double), 9.5e-7 mm (STL
//          float32); admesh finds no disconnected facets and fixes nothing.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "libcoil/models/mesh.hpp"
#include "libcoil/spec/records.hpp"

namespace libcoil {

// What the command line may change for one print without editing the spec.
struct FormerOptions {
    std::optional<FormerKind> kind;
    std::optional<int> ribs;
    std::optional<double> rib_width;  // m
    std::optional<GrooveProfile> profile;
    std::optional<double> groove_depth;  // m
    std::optional<double> clearance;     // m
    std::optional<FlangeSpec> flange;
    std::optional<double> ends;          // m
    std::optional<double> bore_oversize;  // m, on the diameter
    double chord_tolerance = 0.01e-3;    // m, the largest gap between a facet and the true surface
};

struct FormerGeometry {
    FormerKind kind = FormerKind::grooved_tube;
    GrooveProfile profile = GrooveProfile::round;
    double turns = 0, pitch = 0;  // the coil's
    double wire_diameter = 0;     // m, insulated
    double seat_radius = 0;       // m, the wire's centre: the mean radius
    double root_radius = 0;       // m, the groove's bottom: the form radius
    double outer_radius = 0;      // m, tube (or rib tips) outside the grooves
    double groove_radius = 0;     // m, (d + clearance) / 2: the arc's, or the circle the vee's flanks touch
    double clearance = 0;         // m
    double vee_half_angle = 0;    // rad
    double half_width = 0;        // m, of one groove where it meets the outer surface
    double bore_radius = 0;       // m, as printed (with the oversize); 0: solid
    double bore_oversize = 0;     // m, on the diameter
    double hub_radius = 0;        // m, ribbed: the hub inside the ribs
    int ribs = 0;
    double rib_angle = 0;         // rad, each rib's angular width (its width at the form diameter)
    double flange_radius = 0, flange_thickness = 0;  // m, 0: none
    double ends = 0;              // m, plain former beyond the winding at each end
    double length = 0;            // m, overall
    double groove_start = 0;      // m, z of the groove's centre line at its start (theta = 0)
    double rib_zone_low = 0, rib_zone_high = 0;  // m, ribbed: the ribs run between these z
    double wire_cut_length = 0;   // m, the wire on the former plus the spec's leads
    double min_wall = 0;          // m
    std::vector<std::string> notes;  // defaults taken, and what the reader should know

    double groove_depth() const { return outer_radius - root_radius; }
    // Radius of one groove's surface at axial offset u from its centre line (outer_radius beyond it).
    double groove_surface(double u) const;
    // Material volume, m^3, from the profile in closed form (see the header comment).
    double volume() const;
};

// Dimensions from a coil spec with a former section (or a default grooved tube of PETG when it has
// none), checked for printability. Throws InputError naming the field: a wall below min_wall
// (former.wall, former.hub_wall), a groove deeper than the wall under it or, round, deeper than its
// radius (former.groove.depth), a pitch below the wire plus the clearance (coil.pitch), ribs that leave no
// printable gap (former.ribs), a flange no wider than the tube (former.flange.diameter), ends too short
// for the groove and the flange (former.ends).
FormerGeometry former_geometry(const CoilSpec& spec, const FormerOptions& options = {});

// The former's mesh (m), with the given chord tolerance (m).
TriangleMesh former_mesh(const FormerGeometry& g, double chord_tolerance);

// The outer outline of the section through the axis at angle theta (rad; ribbed: through a rib there),
// as (z, r) points in m from z = 0 to the full length, flanges included: what the mesh's column at that
// angle holds.
struct OutlinePoint {
    double z, r;
};
std::vector<OutlinePoint> former_outline(const FormerGeometry& g, double theta, double chord_tolerance);

}  // namespace libcoil
