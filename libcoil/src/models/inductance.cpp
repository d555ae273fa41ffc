#include "libcoil/models/inductance.hpp"

#include "libcoil/core/error.hpp"
#include "libcoil/models/filament.hpp"
#include "libcoil/models/lundin.hpp"
#include "libcoil/models/nagaoka.hpp"
#include "libcoil/models/rosa.hpp"
#include "libcoil/models/wheeler.hpp"

namespace libcoil {

double recommended_inductance(double mean_diameter, double turns, double pitch, double wire_diameter) {
    return recommended_inductance_with_slopes(mean_diameter, turns, pitch, wire_diameter).inductance;
}

RecommendedInductance recommended_inductance_with_slopes(double mean_diameter, double turns, double pitch,
                                                         double wire_diameter, const NagaokaSlope* sheet) {
    if (!rosa_in_domain(pitch, mean_diameter / 2)) return {filament_inductance(mean_diameter, turns, pitch, wire_diameter)};
    const InductanceGradient g = sheet ? rosa_inductance_gradient(mean_diameter, turns, pitch, wire_diameter, *sheet)
                                       : rosa_inductance_gradient(mean_diameter, turns, pitch, wire_diameter);
    return {g.inductance, g.d_turns, g.d_pitch, true};
}

double recommended_inductance(const Solenoid& c) {
    return recommended_inductance(c.mean_diameter(), c.turns(), c.pitch(), c.wire().bare_diameter);
}

InductanceResult inductance(const Solenoid& c) {
    InductanceResult r;
    const double D = c.mean_diameter(), l = c.winding_length(), N = c.turns();
    const double rho = c.diameter_to_length();
    r.nagaoka_coefficient = nagaoka_coefficient(rho);
    r.by_method.wheeler = wheeler_inductance(D, l, N);
    r.by_method.nagaoka = current_sheet_inductance(D, l, N);
    r.by_method.lundin = lundin_inductance(D, l, N);
    r.by_method.rosa = rosa_inductance(D, N, c.pitch(), c.wire().bare_diameter);
    r.by_method.filament = filament_inductance(D, N, c.pitch(), c.wire().bare_diameter);
    if (rosa_in_domain(c.pitch(), c.mean_radius())) {
        r.recommended = r.by_method.rosa;
    } else {
        r.recommended = r.by_method.filament;
        r.method = "filament";
        r.warnings.push_back("the pitch is " + format_value(c.pitch() / c.mean_radius()) +
                             " mean radii, beyond the 0.4 where Rosa's round-wire correction holds to 0.5 %; "
                             "the recommended inductance is the filament sum instead");
    }

    if (!wheeler_in_domain(rho)) {
        r.warnings.push_back("Wheeler's formula is outside its stated domain (length " + format_value(l / (D / 2)) +
                             " radii, needs > 0.8); shown for comparison only");
    }
    if (c.mean_radius() < 10 * c.wire().radius()) {
        r.warnings.push_back("the mean radius is only " + format_value(c.mean_radius() / c.wire().radius()) +
                             " wire radii; the round-wire correction and the filament model assume >= 10, so "
                             "expect errors above 0.5 %");
    }
    if (!(r.recommended > 0)) {
        throw DomainError("the round-wire correction exceeds the current-sheet inductance; the wire is too thick "
                          "for this coil's diameter");
    }
    return r;
}

}  // namespace libcoil
