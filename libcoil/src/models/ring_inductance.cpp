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

namespace {

// The fourth primitive F of ln(x^2 + z^2) / 2 (d^4 F / dx^2 dz^2), less its terms x^4 ln x^2 and z^4 ln z^2,
// which cancel in the rectangles' difference and would cost digits there; even in x and in z.
double log_primitive(double x, double z) {
    x = std::fabs(x);
    z = std::fabs(z);
    if (x == 0 || z == 0) return 0.0;
    const double x2 = x * x, z2 = z * z;
    return x2 * x * z * std::atan(z / x) / 6 + x * z2 * z * std::atan(x / z) / 6 - 25 * x2 * z2 / 48 -
           (x2 * x2 * std::log1p(z2 / x2) - 6 * x2 * z2 * std::log(x2 + z2) + z2 * z2 * std::log1p(x2 / z2)) / 48;
}

}  // namespace

double rectangles_gmd(double x0, double x1, double z0, double z1, double u0, double u1, double w0, double w1) {
    if (!(x1 > x0 && z1 > z0 && u1 > u0 && w1 > w0)) throw InputError("rectangle", "each needs positive width and height");
    // integral over x in [x0, x1], u in [u0, u1] of g(u - x) = G(u1 - x0) + G(u0 - x1) - G(u1 - x1) - G(u0 - x0).
    const double xs[4] = {u1 - x0, u0 - x1, u1 - x1, u0 - x0};
    const double zs[4] = {w1 - z0, w0 - z1, w1 - z1, w0 - z0};
    constexpr double sign[4] = {1, 1, -1, -1};
    double sum = 0;
    for (int i = 0; i < 4; ++i) {
        for (int j = 0; j < 4; ++j) sum += sign[i] * sign[j] * log_primitive(xs[i], zs[j]);
    }
    const double areas = (x1 - x0) * (z1 - z0) * (u1 - u0) * (w1 - w0);
    return finite_result("rectangles GMD", std::exp(sum / areas));
}

}  // namespace libcoil
