#include "libcoil/filament.hpp"

#include <cmath>

#include "libcoil/coaxial_mutual.hpp"
#include "libcoil/error.hpp"
#include "libcoil/ring_inductance.hpp"

namespace libcoil {

double filament_inductance(double mean_diameter, double turns, double pitch, double wire_diameter) {
    require_positive("mean_diameter", mean_diameter);
    require_positive("pitch", pitch);
    require_positive("wire_diameter", wire_diameter);
    require_at_least("turns", turns, 1.0, "a coil needs at least one turn");
    if (turns > 1e8) throw InputError("turns", format_value(turns) + " is too many turns for the filament sum");
    const double a = mean_diameter / 2;
    const double self = ring_self_inductance(a, wire_diameter / 2);
    const auto offsets = static_cast<long>(std::ceil(turns)) - 1;
    // Sum the small far terms first for accuracy.
    double mutual = 0.0;
    for (long k = offsets; k >= 1; --k) {
        mutual += (turns - static_cast<double>(k)) * coaxial_mutual_inductance(a, a, static_cast<double>(k) * pitch);
    }
    return finite_result("filament sum", turns * self + 2.0 * mutual);
}

}  // namespace libcoil
