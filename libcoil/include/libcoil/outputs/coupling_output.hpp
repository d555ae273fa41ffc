// Two coils in one enclosure: the study `coil couple` prints (M, k, crosstalk at frequencies, and k
// against distance), as text, JSON and an SVG picture. Every number comes from coupling.hpp, shield.hpp
// and losses.hpp.
//
// The SVG plots |k| against the centre distance on log axes, with the magnetic-dipole asymptote dashed.
// Its elements carry ids and data- attributes (coupling, dipole, data-distance-m, data-k) for tests.
#pragma once

#include <string>
#include <vector>

#include "libcoil/models/coupling.hpp"
#include "libcoil/models/shield.hpp"
#include "libcoil/spec/spec.hpp"

namespace libcoil {

struct CouplingStudy {
    std::string name_a, name_b;
    Arrangement arrangement = Arrangement::coaxial;
    double distance = 0, axial_offset = 0;  // m
    Coupling at;                            // at `distance`
    double dipole_mutual = 0;               // H, the far-field estimate at `distance`, for comparison
    double source_resistance = 50, load_resistance = 50;  // ohm
    std::vector<Crosstalk> crosstalk;       // at each frequency, with the shields' effect when there are any
    std::vector<double> shielding_db;       // at each frequency: both shields' magnetic shielding together (0: none),
                                            // as credited_magnetic_shielding_db (shield.hpp)
    std::vector<double> theoretical_shielding_db;  // the same without the cap
    std::vector<double> unshielded_db;      // at each frequency: |S21| without the shields
    struct Point {
        double distance, mutual, coefficient;
    };
    std::vector<Point> sweep;               // k against distance, when asked
    std::vector<std::string> notes;
};

// A spec's `shield:` wraps that coil; at each frequency the mutual inductance is reduced by both walls'
// shielding effectiveness (shield.hpp's magnetic_shielding: for the driven coil with its source at the
// wall's radius, for the victim with the source at the centre distance less its wall's radius).
// `frequencies`: where the crosstalk is wanted (empty: the specs' operating frequencies, both together).
// `sweep_distances`: centre distances for the table and the picture (may be empty).
CouplingStudy study_coupling(const CoilSpec& a, const CoilSpec& b, Arrangement arrangement, double distance, double axial_offset,
                             std::vector<double> frequencies, double source_resistance, double load_resistance,
                             const std::vector<double>& sweep_distances);

const char* arrangement_name(Arrangement a);  // "coaxial", "side-by-side"
std::string coupling_text_report(const CouplingStudy& s, const std::vector<std::string>& files = {});
std::string coupling_json_report(const CouplingStudy& s, const std::vector<std::string>& files = {});
// Needs two or more sweep points.
std::string coupling_svg(const CouplingStudy& s);

}  // namespace libcoil
