// The coupling study (`coil couple`): two coil specs in one enclosure. M and k of the bare coils, k against
// distance, and the crosstalk at frequencies between each coil as mounted: its shield's L(f) and wall loss
// (the analysis study), and M reduced by each shield's magnetic shielding (shield.hpp).
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "libcoil/models/coupling.hpp"
#include "libcoil/spec/spec.hpp"

namespace libcoil {

struct CouplingStudy {
    std::string name_a, name_b;
    Arrangement arrangement = Arrangement::coaxial;
    double distance = 0, axial_offset = 0;  // m
    Coupling at;                            // the bare coils at `distance`: M, their L, k
    double dipole_mutual = 0;               // H, the far-field estimate at `distance`, for comparison
    double source_resistance = 50, load_resistance = 50;  // ohm
    // Each coil as mounted: its nominal L (the shielded high-frequency L in a shield), and the shield in
    // words (empty: none).
    double mounted_inductance_a = 0, mounted_inductance_b = 0;  // H
    std::string shield_a, shield_b;
    struct AtFrequency {
        Crosstalk crosstalk;             // with the shields (when there are any)
        double shielding_db = 0;         // both shields together, as credited (credited_magnetic_shielding_db)
        double theoretical_shielding_db = 0;  // the same without the caps
        double unshielded_db = 0;        // |S21| of the bare coils
        double resistance_a = 0, resistance_b = 0;  // ohm, each coil's series R as mounted
        double inductance_a = 0, inductance_b = 0;  // H, each coil's series L as mounted
    };
    std::vector<AtFrequency> at_frequency;
    struct Point {
        double distance = 0, mutual = 0, coefficient = 0;
        double dipole_coefficient = 0;  // k of the magnetic dipoles at that distance
    };
    std::vector<Point> sweep;               // k against distance, when asked
    std::vector<std::string> notes;
};

// Both shields' credited magnetic shielding between the coils at `frequency` (dB; 0 without shields), as
// the study credits it: M as mounted is the bare coils' M times 10^(-dB / 20).
double credited_pair_shielding_db(const CoilSpec& a, const CoilSpec& b, double distance, double frequency);

// InputError names the arguments: "distance", "axial_offset", "frequencies", "source_resistance", ...
// `frequencies`: where the crosstalk is wanted (empty: the specs' operating frequencies, both together).
// `sweep_distances`: centre distances for the table and the picture (may be empty).
CouplingStudy study_coupling(const CoilSpec& a, const CoilSpec& b, Arrangement arrangement, double distance, double axial_offset,
                             std::vector<double> frequencies, double source_resistance, double load_resistance,
                             const std::vector<double>& sweep_distances);

}  // namespace libcoil
