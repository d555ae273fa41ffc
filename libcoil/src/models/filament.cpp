#include "libcoil/models/filament.hpp"

#include <algorithm>
#include <cmath>

#include "models/maxwell_bracket.hpp"
#include "libcoil/models/coaxial_mutual.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/ring_inductance.hpp"

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
    // Sum the small far terms first for accuracy. Those with k^2 >= 0.2 (z <= 4 a), where
    // coaxial_mutual_inductance takes the elliptic integrals, come eight at a time through the same
    // integrals in lanes (elliptic.hpp) and the same bracket (maxwell_bracket.hpp): for equal radii,
    // M = mu0 a bracket, k^2 = 4 a^2 / (4 a^2 + z^2).
    const auto near = std::min(offsets, static_cast<long>(std::floor(4 * a / pitch)));
    double mutual = 0.0;
    for (long k = offsets; k > near; --k) {
        mutual += (turns - static_cast<double>(k)) * coaxial_mutual_inductance(a, a, static_cast<double>(k) * pitch);
    }
    constexpr long lanes = 8;
    double near_sum = 0.0;
    for (long k0 = 1; k0 <= near; k0 += lanes) {
        double kc[lanes], m[lanes], inv_m[lanes], weight[lanes], root[lanes];
        for (long j = 0; j < lanes; ++j) {
            const long k = std::min(k0 + j, near);
            const double z = static_cast<double>(k) * pitch, den = 4 * a * a + z * z;
            root[j] = std::sqrt(den);
            kc[j] = z / root[j];
            m[j] = 4 * a * a / den;
            inv_m[j] = den / (4 * a * a);
            weight[j] = k0 + j <= near ? turns - static_cast<double>(k) : 0.0;
        }
        detail::EllipticPair e[lanes];
        detail::elliptic_pairs<lanes>(kc, m, e, inv_m);
        for (long j = 0; j < lanes; ++j) {
            const double k = 2 * a / root[j];
            near_sum += weight[j] * mu0 * a * detail::maxwell_bracket(k, e[j]);
        }
    }
    mutual += near_sum;
    return finite_result("filament sum", turns * self + 2.0 * mutual);
}

}  // namespace libcoil
