// Umbrella header: everything public in libcoil, layer by layer (DEVELOPERS.md).
#pragma once

// the foundation: errors, units, constants
#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"

// inputs: the spec and requirement records, their readers and writer, the choices table
#include "libcoil/spec/choices.hpp"
#include "libcoil/spec/records.hpp"
#include "libcoil/spec/requirement.hpp"
#include "libcoil/spec/spec.hpp"

// measurement files in: Touchstone and CSV to a record of frequencies and port matrices
#include "libcoil/inputs/network_file.hpp"

// the physics, one file per model
#include "libcoil/models/coaxial_mutual.hpp"
#include "libcoil/models/coupling.hpp"
#include "libcoil/models/cross_section.hpp"
#include "libcoil/models/wire_harmonics.hpp"
#include "libcoil/models/dc_resistance.hpp"
#include "libcoil/models/filament.hpp"
#include "libcoil/models/former.hpp"
#include "libcoil/models/helical_line.hpp"
#include "libcoil/models/impedance.hpp"
#include "libcoil/models/inductance.hpp"
#include "libcoil/models/kelvin.hpp"
#include "libcoil/models/losses.hpp"
#include "libcoil/models/lundin.hpp"
#include "libcoil/models/materials.hpp"
#include "libcoil/models/medhurst.hpp"
#include "libcoil/models/mesh.hpp"
#include "libcoil/models/nagaoka.hpp"
#include "libcoil/models/proximity.hpp"
#include "libcoil/models/ring_inductance.hpp"
#include "libcoil/models/rosa.hpp"
#include "libcoil/models/self_resonance.hpp"
#include "libcoil/models/shield.hpp"
#include "libcoil/models/skin_effect.hpp"
#include "libcoil/models/solenoid.hpp"
#include "libcoil/models/thermal.hpp"
#include "libcoil/models/turn_network.hpp"
#include "libcoil/models/axisymmetric_charge.hpp"
#include "libcoil/models/wheeler.hpp"
#include "libcoil/models/wire.hpp"

// studies: inputs to one result record each
#include "libcoil/studies/measurement.hpp"
#include "libcoil/studies/measurement_fit.hpp"
#include "libcoil/studies/comparison.hpp"
#include "libcoil/studies/fixture_study.hpp"
#include "libcoil/spec/fixture.hpp"
#include "libcoil/outputs/fixture_report.hpp"
#include "libcoil/studies/analysis.hpp"
#include "libcoil/studies/band_check.hpp"
#include "libcoil/studies/cautions.hpp"
#include "libcoil/studies/coupling_study.hpp"
#include "libcoil/studies/design.hpp"
#include "libcoil/studies/former_study.hpp"
#include "libcoil/studies/spread.hpp"
#include "libcoil/studies/sweep.hpp"
#include "libcoil/studies/winding_heat.hpp"
#include "libcoil/studies/wire_study.hpp"

// outputs: writers that only format a result record
#include "libcoil/outputs/comparison_report.hpp"
#include "libcoil/outputs/analysis_report.hpp"
#include "libcoil/outputs/coupling_report.hpp"
#include "libcoil/outputs/design_report.hpp"
#include "libcoil/outputs/files.hpp"
#include "libcoil/outputs/former_files.hpp"
#include "libcoil/outputs/stl.hpp"
#include "libcoil/outputs/sweep_files.hpp"
#include "libcoil/outputs/wire_report.hpp"

#include "libcoil/version.hpp"
