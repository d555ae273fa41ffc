#include "libcoil/coaxial_mutual.hpp"

#include <cmath>

#include "elliptic.hpp"
#include "libcoil/constants.hpp"
#include "libcoil/error.hpp"

namespace libcoil {

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
        double c = 0.25;  // c_1
        double mn = 1.0;  // m^(n-2)
        double sum = 0.0;
        for (int n = 2; n < 200; ++n) {
            const double term = c * (n - 1.0) / n * mn;
            sum += term;
            if (term < 1e-18 * sum) break;
            const double r = (2.0 * n - 1.0) / (2.0 * n);
            c *= r * r;
            mn *= m;
        }
        bracket = pi / 2 * k * m * sum;
    } else {
        const auto [K, kme_m] = detail::elliptic_k_and_k_minus_e_over_m(std::sqrt(mc), m);
        bracket = k * (2.0 * kme_m - K);
    }
    return finite_result("Maxwell's formula", mu0 * std::sqrt(a * b) * bracket);
}

}  // namespace libcoil
