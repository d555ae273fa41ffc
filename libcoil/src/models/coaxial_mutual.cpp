#include "libcoil/models/coaxial_mutual.hpp"

#include <array>
#include <cmath>

#include "models/maxwell_bracket.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"

namespace libcoil {

namespace {

// The series coefficients c_{n-1} (n-1)/n, c_n = ((1/2)_n / n!)^2, for n = 2, 3, ...: computed once, so
// that the sum below takes no division.
constexpr int series_terms = 198;
const std::array<double, series_terms>& series_coefficients() {
    static const std::array<double, series_terms> t = [] {
        std::array<double, series_terms> c{};
        double cn = 0.25;  // c_1
        for (int i = 0; i < series_terms; ++i) {
            const double n = i + 2.0;
            c[i] = cn * (n - 1) / n;
            const double r = (2 * n - 1) / (2 * n);
            cn *= r * r;
        }
        return c;
    }();
    return t;
}

}  // namespace

double coaxial_mutual_inductance(double a, double b, double z) {
    require_positive("radius_a", a);
    require_positive("radius_b", b);
    require_finite("axial_distance", z);
    const double den = (a + b) * (a + b) + z * z;
    const double m = 4.0 * a * b / den;                      // k^2
    const double mc = ((a - b) * (a - b) + z * z) / den;     // k'^2, without cancellation
    if (mc == 0.0) {
        throw InputError("axial_distance", "the two filaments coincide (equal radii, zero distance); "
                                           "their mutual inductance is infinite");
    }
    const double k = std::sqrt(m);
    double bracket;  // (2/k - k) K - (2/k) E
    if (m < 0.2) {
        // (pi/2) sum_{n>=2} c_{n-1} (n-1)/n k^(2n-1), c_n = ((1/2)_n / n!)^2.
        const auto& coefficient = series_coefficients();
        double mn = 1.0;  // m^(n-2)
        double sum = 0.0;
        for (int i = 0; i < series_terms; ++i) {
            const double term = coefficient[i] * mn;
            sum += term;
            if (term < 1e-18 * sum) break;
            mn *= m;
        }
        bracket = pi / 2 * k * m * sum;
    } else {
        bracket = detail::maxwell_bracket(k, detail::elliptic_k_and_k_minus_e_over_m(std::sqrt(mc), m));
    }
    return finite_result("Maxwell's formula", mu0 * std::sqrt(a * b) * bracket);
}

}  // namespace libcoil
