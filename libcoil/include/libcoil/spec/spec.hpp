// The coil spec: a YAML document describing one coil, read at the edge and turned into SI geometry.
//
//   name: ...                    # optional
//   coil:
//     form_diameter: 20 mm       # or mean_diameter: (to the wire centre)
//     turns: 10                  # may be fractional
//     pitch: 1.5 mm              # or winding_length: (= turns * pitch)
//     leads: 2 x 30 mm           # optional: lead_length: 60 mm (both leads together)
//     wire:
//       diameter: 1.0 mm         # bare conductor; or gauge: AWG 18
//       insulation: 0.04 mm      # radial build; or enamel: grade 2; neither means bare wire
//     conductor: copper
//   operating:                   # optional
//     frequencies: [1 MHz, 10 MHz]   # or one value
//     temperature: 40 degC       # of the wire; without it: the thermal estimate for the current, or 20 degC
//     current: 4 A               # RMS or DC: the winding's temperature and the thermal cautions
//     current_frequency: 100 kHz # optional: the current's frequency, for its AC resistance (DC if not given)
//     ambient: 25 degC           # the air around the coil (25 degC if not given)
//     supply_voltage: 230 V      # optional, for the safety cautions
//     rf_power: 50 W             # optional, for the safety cautions
//   limits:                      # optional
//     enamel_class: 155          # IEC 60317 thermal class in degC (155 if not given)
//   tolerances:                  # optional: the build's, one standard deviation each (these if not given);
//     form_diameter: 0.1 mm      # they widen the SRF's band by two standard deviations either side
//     pitch: 0.02 mm
//     wire_diameter: 0.5 %
//     turns: 0.1
//   former:                      # optional: what the wire is wound on (none: self-supporting in air)
//     material: PETG             # data/former_materials.yaml
//     kind: grooved-tube         # or ribbed
//     wall: 3 mm                 # radial thickness of solid under the winding (3 mm if not given)
//     ribs: 6                    # ribbed only: number of axial ribs
//     rib_width: 3 mm            # ribbed only: width of each rib where the wire rests
//     # The rest matters only to the printable former (former.hpp); each has a default:
//     ends: 5 mm                 # plain former beyond the winding at each end
//     groove: {profile: round, depth: 0.6 mm, clearance: 0.1 mm}   # or profile: vee, angle_deg: 90
//     flange: {diameter: 40 mm, thickness: 2 mm}                   # optional, at both ends
//     hub_wall: 2 mm             # ribbed only: the hub tube inside the ribs
//     bore_oversize: 0.2 mm      # the bore printed this much wider (diameter), as printed holes shrink
//     min_wall: 1.2 mm           # the thinnest wall the printer makes well
//   surroundings:                # optional
//     relative_permittivity: 1   # of the medium around the coil
//     mounting: floating         # or grounded-end (one terminal on a ground plane)
//   shield:                      # optional: a coaxial conductive shield (shield.hpp)
//     inner_diameter: 40 mm
//     length: 80 mm
//     thickness: 0.1 mm          # foil or tape 0.035 .. 0.1 mm; a can 0.5 mm or more
//     material: copper           # or aluminium (data/conductors.yaml)
//     end_discs: false           # true: closed at both ends
//     axial_offset: 0 mm         # of the shield's centre from the coil's
//   band:                        # optional: the band check (band_check.hpp)
//     low: 150 kHz
//     ceiling: 30 MHz
//     srf_margin: 2              # SRF >= 2 x ceiling
//     max_deviation: 10 %        # | |Z| / (w L) - 1 | <= 10 % up to the ceiling
//     min_impedance: 250 ohm     # |Z| >= 250 ohm across the band
//
// Errors name the YAML path: `coil.pitch: "2 mn": unknown unit "mn"; expected a length such as "2 mm"`.
// Unknown keys are errors with a "did you mean" hint.
#pragma once

#include <filesystem>
#include <string>
#include <string_view>
#include <vector>

#include <optional>

#include "libcoil/models/materials.hpp"
#include "libcoil/spec/records.hpp"
#include "libcoil/models/solenoid.hpp"
#include "libcoil/models/wire.hpp"

namespace libcoil {

// Parses a spec from YAML text; `source` names it in messages (a file name).
CoilSpec parse_coil_spec(std::string_view yaml_text, std::string_view source = "spec");
// Reads and parses a spec file. A missing or unreadable file is an InputError naming the path.
CoilSpec load_coil_spec(const std::filesystem::path& path);

// A coil spec as YAML text that parse_coil_spec reads back to the same spec: SI values written with
// units, enough digits to reproduce the inductance; `wire` says how the wire is named (a gauge or a
// diameter, an enamel grade or an insulation). spec_writer.cpp.
std::string coil_spec_yaml(const CoilSpec& spec, const WireChoice& wire);

}  // namespace libcoil
