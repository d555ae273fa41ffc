#include "libcoil/ring_inductance.hpp"

#include <cmath>

#include "libcoil/constants.hpp"
#include "libcoil/error.hpp"

namespace libcoil {

double ring_self_inductance(double a, double r) {
    require_positive("ring_radius", a);
    require_positive("wire_radius", r);
    if (!(r < a)) {
        throw InputError("wire_radius", format_value(r) + " m is not smaller than the ring radius " + format_value(a) + " m");
    }
    const double lg = std::log(8.0) + std::log(a) - std::log(r);  // a / r may overflow
    return finite_result("ring self-inductance", mu0 * a * (lg - 1.75 + r * r / (8.0 * a * a) * (lg + 1.0 / 3.0)));
}

}  // namespace libcoil
