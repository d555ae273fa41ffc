// Round magnet wire: gauges, enamel build and the wire record used by the geometry.
//
// AWG diameters follow the ASTM B258 defining formula: d(n) = 0.005 in * 92^((36 - n) / 39), so that
// AWG 36 is 0.005 in and AWG 0000 (n = -3) is 0.46 in exactly. Enamel build grades 1 to 3 after
// IEC 60317-0-1 come from data/wires.yaml (values from memory, marked so there), interpolated in the
// bare diameter.
#pragma once

#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace libcoil {

struct Wire {
    double bare_diameter = 0;  // m, the conductor
    double insulation = 0;     // m, radial build of the enamel (half the increase in diameter)
    std::string label;         // how the user named it: "AWG 18", "1 mm"

    double insulated_diameter() const { return bare_diameter + 2 * insulation; }
    double radius() const { return bare_diameter / 2; }
};

// How a user names a wire: a gauge or a bare diameter, and an insulation build or an enamel grade
// (neither means bare). make_wire checks the choice and names fields as `prefix` + "gauge", ...
struct WireChoice {
    std::optional<int> gauge;          // AWG number
    std::optional<double> diameter;    // m, bare
    std::optional<double> insulation;  // m, radial build
    std::optional<int> enamel_grade;   // IEC 60317 grade 1..3
};
Wire make_wire(const WireChoice& choice, std::string_view prefix = "wire.");

// IEC 60317 enamel grade from text: "grade 2", "Grade 2" or "2". InputError names `field` otherwise.
int parse_enamel_grade(std::string_view text, std::string_view field);

// AWG gauge number from text: "AWG 18", "18 AWG", "AWG 4/0", "AWG 0000", "awg18". AWG 4/0 is -3.
int parse_awg(std::string_view text, std::string_view field);
// Bare diameter in m of AWG gauge n, -3 (0000) <= n <= 56 (ASTM B258).
double awg_diameter(int gauge);
// "AWG 18", "AWG 4/0".
std::string awg_label(int gauge);

// Radial enamel build in m for an IEC 60317 grade (1, 2 or 3) on a wire of the given bare diameter.
// The table spans 0.02 mm to 5 mm bare; outside it InputError names `field`.
double enamel_build(double bare_diameter, int grade, std::string_view field = "wire.enamel");

// Nominal bare diameters in m of the common metric magnet wires (IEC 60317 R20 preferred sizes).
const std::vector<double>& metric_wire_diameters();

}  // namespace libcoil
