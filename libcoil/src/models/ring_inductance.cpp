#include "libcoil/models/ring_inductance.hpp"

#include <cmath>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"

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

double rectangle_gmd(double a, double b) {
    require_positive("a", a);
    require_positive("b", b);
    const double a2 = a * a, b2 = b * b;
    const double lg = 0.5 * std::log(a2 + b2) - a2 / (12 * b2) * std::log1p(b2 / a2) - b2 / (12 * a2) * std::log1p(a2 / b2) +
                      2 * a / (3 * b) * std::atan(b / a) + 2 * b / (3 * a) * std::atan(a / b) - 25.0 / 12;
    return finite_result("rectangle GMD", std::exp(lg));
}

}  // namespace libcoil
