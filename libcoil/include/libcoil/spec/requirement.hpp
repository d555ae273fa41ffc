// The design requirement: what a coil must do, read from YAML at the edge.
//
//   name: ...                        # optional
//   target: {inductance: 12 uH, tolerance: 2 %}
//   band: {low: 150 kHz, ceiling: 30 MHz, srf_margin: 1.5}      # as in a coil spec (band_check.hpp)
//   operating:
//     current: 6 A                   # DC or RMS
//     frequency: 100 kHz             # optional: the current's frequency, for its AC resistance
//     ambient: 30 degC               # 25 degC if not given
//     supply_voltage: 24 V           # optional, for the cautions
//     rf_power: 50 W                 # optional, for the cautions
//   limits:
//     max_outer_diameter: 50 mm
//     max_length: 90 mm              # winding plus former ends
//     former_ends: 5 mm              # allowance at each end (5 mm if not given)
//     max_wire_length: 5 m           # optional
//     enamel_class: 155              # IEC 60317 thermal class in degC (155 if not given)
//   search:
//     wires: [AWG 16, AWG 18, 1.2 mm, AWG 20 grade 2]   # enamel grade 1 unless given
//     form_diameter: {min: 10 mm, max: 45 mm, step: 1 mm}   # or one value
//     pitch_ratio: {min: 1.1, max: 3.0, step: 0.05}        # pitch / insulated wire diameter
//     turns: 18                      # optional: fixed turns (the pitch is then solved)
//     turns_step: 0.25               # practical step the turns snap to (a quarter turn by default)
//     lead_length: 80 mm             # optional, both leads together
//   objective: {loss: 1, size: 0.5, srf: 0.5}   # weights, see design.hpp
//   former: {material: PETG, kind: grooved-tube, wall: 3 mm}
//   shield: {inner_diameter: 50 mm, length: 80 mm, thickness: 0.1 mm, material: copper}   # optional
//   surroundings: {mounting: floating}
//   conductor: copper
//   fixture:                         # optional: the circuit the coil serves (fixture.hpp), as a criterion
//     file: bench-network-fixture.yaml   # beside the requirement; or the fixture's keys inline
//     coil: L1                       # the part the designed coil takes (its spec there, if any, is not read)
//   tolerances:                      # optional, one standard deviation each (defaults: spread.hpp)
//     form_diameter: 0.1 mm
//     pitch: 0.02 mm
//     wire_diameter: 0.5 %
//     turns: 0.1
#pragma once

#include <filesystem>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "libcoil/models/materials.hpp"
#include "libcoil/spec/fixture.hpp"
#include "libcoil/spec/spec.hpp"
#include "libcoil/models/wire.hpp"

namespace libcoil {

struct WireOption {
    WireChoice choice;  // as the user named it, for the design spec written back
    Wire wire;
};

struct SearchRange {
    double min = 0, max = 0, step = 0;  // min == max: one value
    std::vector<double> values() const;
};

struct Objective {
    double loss = 1.0;  // weight of R_ac at the reference frequency
    double size = 0.5;  // weight of the coil's outer volume
    double srf = 0.5;   // weight of ceiling / SRF (or 1 / SRF without a band)
};

struct Requirement;
// The frequency at which the target inductance is met: target.frequency if given, else the band's low
// edge (where a supply network's or filter's inductance is specified; L then falls across the band as the
// current moves to the wires' surfaces), else the fixture's band's low edge, else the current's frequency, else 0 (the low-frequency inductance).
double target_frequency(const Requirement& q);

struct Requirement {
    std::string name, description;
    double inductance = 0;   // H
    double tolerance = 0;    // fraction
    // Where the target must hold (target.frequency): L falls with frequency as the skin and proximity
    // effects push the current to the wires' surfaces. Not given: see target_frequency().
    std::optional<double> inductance_frequency;  // Hz
    std::optional<BandSpec> band;
    double current = 0;      // A, DC or RMS
    std::optional<double> current_frequency;  // Hz
    double ambient = 298.15;                  // K
    double supply_voltage = 0;                // V, 0 when not given
    double rf_power = 0;                      // W, 0 when not given
    double max_outer_diameter = 0;            // m
    double max_length = 0;                    // m, winding plus former ends
    double former_ends = 5e-3;                // m, at each end
    std::optional<double> max_wire_length;    // m
    double enamel_class = 155 + 273.15;       // K
    std::vector<WireOption> wires;
    SearchRange form_diameter, pitch_ratio;
    std::optional<double> turns;  // fixed turns
    double turns_step = 0.25;
    double lead_length = 0;       // m
    Objective objective;
    std::optional<FormerSpec> former;
    // A shield around the coil: the search then meets the target with the shield's high-frequency L.
    std::optional<ShieldSpec> shield;
    Surroundings surroundings;
    Conductor conductor;
    BuildTolerances tolerances;
    bool tolerances_given = false;
    // The circuit the coil serves, with its reference, tolerance and band: the search screens each candidate
    // by the first port's deviation there, and the chosen design must pass the full fixture study.
    std::optional<FixtureSpec> fixture;
    std::string fixture_part;    // the coil part the design takes
    std::string fixture_source;  // the fixture's file, or "inline"
    std::vector<std::string> notes;
};

Requirement parse_requirement(std::string_view yaml_text, std::string_view source = "requirement");
Requirement load_requirement(const std::filesystem::path& path);

}  // namespace libcoil
