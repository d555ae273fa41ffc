// Geometry of a single-layer solenoid of round wire.
//
// Conventions (docs/models.md): the mean diameter D is measured to the wire centre, so
// D = form diameter + bare diameter + 2 * insulation. The current-sheet length is l = N * p, one pitch
// per turn. The wire follows a helix of N turns; its length is N * sqrt((pi D)^2 + p^2) plus the leads.
#pragma once

#include "libcoil/models/wire.hpp"

namespace libcoil {

class Solenoid {
public:
    struct Params {
        double mean_diameter = 0;  // m, to the wire centre
        double turns = 0;          // may be fractional, >= 1
        double pitch = 0;          // m, axial advance per turn
        Wire wire;
        double lead_length = 0;    // m, both leads together
    };

    // Validates and throws InputError naming the field ("pitch", "wire.diameter", ...): non-finite or
    // non-positive values, turns < 1, overlapping turns (pitch < insulated diameter), a mean diameter
    // no larger than the insulated wire, and a length-to-diameter ratio outside 1e-3 .. 1e3.
    explicit Solenoid(const Params& p);

    // The same coil, specified by the diameter of the former the wire is wound on.
    static Solenoid on_form(double form_diameter, double turns, double pitch, const Wire& wire,
                            double lead_length = 0);

    double mean_diameter() const { return p_.mean_diameter; }
    double mean_radius() const { return p_.mean_diameter / 2; }
    double turns() const { return p_.turns; }
    double pitch() const { return p_.pitch; }
    const Wire& wire() const { return p_.wire; }
    double lead_length() const { return p_.lead_length; }

    double form_diameter() const { return p_.mean_diameter - p_.wire.insulated_diameter(); }
    double outer_diameter() const { return p_.mean_diameter + p_.wire.insulated_diameter(); }
    double winding_length() const { return p_.turns * p_.pitch; }  // current-sheet length
    // Axial extent of the copper and enamel: the helix advance plus one insulated diameter.
    double overall_length() const { return winding_length() + p_.wire.insulated_diameter(); }
    double diameter_to_length() const { return p_.mean_diameter / winding_length(); }
    double pitch_to_wire() const { return p_.pitch / p_.wire.bare_diameter; }
    double pitch_angle() const;   // rad, atan(p / (pi D))
    double pitch_tangent() const; // p / (pi D), tan of the pitch angle
    double helix_length() const;  // m, N * sqrt((pi D)^2 + p^2)
    double wire_length() const { return helix_length() + p_.lead_length; }

    static constexpr double min_length_to_diameter = 1e-3;
    static constexpr double max_length_to_diameter = 1e3;

private:
    Params p_;
};

}  // namespace libcoil
