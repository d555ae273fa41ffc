// The input records: what a spec or a requirement says about the coil, its surroundings and its use, as
// plain SI values. The YAML readers (spec.hpp, requirement.hpp) fill them; models and studies read them. Nothing
// here computes.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "libcoil/models/materials.hpp"
#include "libcoil/models/solenoid.hpp"
#include "libcoil/spec/choices.hpp"

namespace libcoil {

// The most operating frequencies a spec may list: each one runs the loss solver.
inline constexpr std::size_t max_operating_frequencies = 100;

// Where and how the coil runs.
struct Operating {
    std::vector<double> frequencies;  // Hz
    double temperature = 293.15;      // K, of the wire (given, or the thermal estimate's with a current)
    bool temperature_given = false;
    double current = 0;               // A, DC or RMS; 0 when not given
    std::optional<double> current_frequency;  // Hz, the current's, for its AC resistance (DC when not given)
    double ambient = 298.15;          // K, the air around the coil, for the thermal estimate
    double supply_voltage = 0;        // V, 0 when not given: for the safety cautions
    double rf_power = 0;              // W, 0 when not given: for the safety cautions
};

// The medium around the coil and how its terminals meet ground.
struct Surroundings {
    double relative_permittivity = 1;  // of the medium around (and, without a former, inside) the coil
    Mounting mounting = Mounting::floating;
};

// The dielectric under the winding as the capacitance models see it: a shell from the form radius inward.
struct FormerDielectric {
    double relative_permittivity = 1;
    double wall = 0;  // m, radial thickness under the winding (0: no former, the coil is self-supporting)
    double fill = 0;  // share of the circumference that is solid: 1 for a tube, k w / (pi D_form) for k ribs
};

// The groove that holds each turn. The wire rests on its bottom at the form diameter, so that its centre
// lies on the mean diameter; the clearance widens the groove, never deepens it.
struct GrooveSpec {
    GrooveProfile profile = GrooveProfile::round;
    std::optional<double> depth;  // m, below the outer surface; default: half the insulated wire
    double clearance = 0.1e-3;    // m, the groove is this much wider than the insulated wire
    double angle = 1.5707963267948966;  // rad, a vee's included angle (90 degrees)
};

struct FlangeSpec {
    double diameter = 0, thickness = 0;  // m
};

struct FormerSpec {
    FormerMaterial material;
    FormerKind kind = FormerKind::grooved_tube;
    double wall = 3e-3;    // m
    int ribs = 0;          // ribbed only
    double rib_width = 0;  // m, ribbed only
    // For the printable former only:
    std::optional<double> ends;  // m, plain former beyond the winding at each end (default 5 mm)
    GrooveSpec groove;
    std::optional<FlangeSpec> flange;
    double hub_wall = 2e-3;  // m, ribbed only
    double bore_oversize = 0;  // m, on the diameter: printed holes come out small
    double min_wall = 1.2e-3;  // m
    // What the capacitance models see: the solid share of the circumference at the form diameter,
    // 1 for a tube and ribs x rib_width / (pi x form_diameter) for ribs.
    FormerDielectric dielectric(double form_diameter) const {
        const double fill = kind == FormerKind::ribbed ? ribs * rib_width / (3.141592653589793 * form_diameter) : 1.0;
        return FormerDielectric{material.relative_permittivity, wall, fill};
    }
};

// A coaxial conductive shield around the coil.
struct ShieldSpec {
    double inner_diameter = 0;  // m
    double length = 0;          // m
    double thickness = 0;       // m, the wall (and the end discs)
    Conductor material;
    bool end_discs = false;     // closed at both ends
    double axial_offset = 0;    // m, of the shield's centre from the coil's
    double temperature = 293.15;  // K, of the shield
};

// The band the coil must serve, and what it must do there (band_check.hpp).
struct BandSpec {
    double low = 0;      // Hz, > 0
    double ceiling = 0;  // Hz, > low
    std::optional<double> srf_margin;     // >= 1
    std::optional<double> max_deviation;  // > 0, a fraction (10 % = 0.1)
    std::optional<double> min_impedance;  // ohm, > 0
};

// Validates the band (InputError naming band.low, band.ceiling, band.srf_margin, ...).
void validate_band(const BandSpec& band);

// The build's tolerances for the tolerance spread (spread.hpp), standard deviations. The defaults are
// typical printing and winding values, assumptions rather than measurements: a printed groove holds the form
// diameter to about 0.1 mm and the pitch to about 0.02 mm, magnet wire is within about 0.5 % of its nominal
// diameter, and a hand-wound lead-out moves the end by about a tenth of a turn.
struct BuildTolerances {
    double form_diameter = 0.1e-3;  // m
    double pitch = 0.02e-3;         // m
    double wire_diameter = 0.005;   // fraction of the bare diameter
    double turns = 0.1;             // turns
};

// Each deviation finite, not negative and at most a quarter of its nominal; InputError naming the field.
void validate_tolerances(const BuildTolerances& t, const Solenoid& coil);

// The SRF margin applied when a band names no criterion: common practice, no source.
inline constexpr double default_srf_margin = 2.0;

// The thermal limit of an enamel: IEC 60317 thermal class 155 (degC) unless the spec says otherwise.
inline constexpr double default_enamel_class = 155 + 273.15;  // K

// What a bench measurement taught about a built coil (coil compare --fit, measurement_fit.hpp), for the
// next analysis of it: the spec's `bench:` section, inline or a file the fit wrote.
// former_permittivity and former_loss_tangent replace the former material's figures (every model then
// sees them); the terminal terms act where the impedance between the terminals is formed: a capacitance
// across the terminals (in the turn network itself, a lumped shift of the other models' resonance), a
// series inductance outside the winding, and a factor on the winding's R(f).
struct BenchCorrections {
    std::optional<double> former_permittivity;
    std::optional<double> former_loss_tangent;
    double stray_capacitance = 0;   // F, >= 0
    double lead_inductance = 0;     // H, may be negative (the leads shorter than the spec's lead_length)
    double resistance_scale = 1;    // > 0
    std::string source;             // where they came from (the file), for the report
};

// One coil as a spec describes it (spec.hpp reads it from YAML and writes it back).
struct CoilSpec {
    std::string name{};
    std::string description{};
    Solenoid solenoid;
    Conductor conductor{};
    Operating operating{};
    std::optional<FormerSpec> former{};
    Surroundings surroundings{};
    std::optional<BandSpec> band{};
    std::vector<std::string> notes{};  // assumptions the reader made (e.g. bare wire)
    std::optional<ShieldSpec> shield{};
    double enamel_class = default_enamel_class;  // K, limits.enamel_class: the winding's thermal limit
    // The build's tolerances (one standard deviation each): the typical ones unless `tolerances:` gives them.
    BuildTolerances tolerances{};
    bool tolerances_given = false;
    std::optional<BenchCorrections> bench{};
};

}  // namespace libcoil
