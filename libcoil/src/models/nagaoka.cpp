#include "libcoil/models/nagaoka.hpp"

#include <algorithm>
#include <cmath>

#include "models/elliptic.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "models/nagaoka_table.hpp"

namespace libcoil {

namespace {

// The bracket B = (k'^2/k^2)(K - E) + E - k for short coils, from the series of K and E about k = 1
// (A&S 17.3.26, 17.3.36) in q = k'^2 with L = ln(4 / k'):
//   K = sum_n a_n q^n (L - d_n),        a_n = ((1/2)_n / n!)^2, d_n = 2 sum_{j<=n} 1/((2j-1) 2j)
//   E = 1 + sum_{n>=1} c_n q^n (L - e_n), c_n = a_n 2n/(2n-1),  e_n = d_n - 1/((2n-1) 2n)
//   k = sqrt(1 - q) = 1 - sum_{n>=1} s_n q^n
// so that E - k = sum_{n>=1} q^n [c_n (L - e_n) + s_n] has its leading 1 cancelled exactly.
double short_coil_bracket(double q) {
    const double L = std::log(4.0) - 0.5 * std::log(q);
    double k_minus_e = L - 1.0;  // n = 0 term of K - E
    double e_minus_k = 0.0;
    double a = 1.0, d = 0.0, t = 1.0, qn = 1.0;  // t: signed binomial coefficient of sqrt(1 - q)
    for (int n = 1; n < 200; ++n) {
        const double two_n = 2.0 * n;
        a *= ((two_n - 1) / two_n) * ((two_n - 1) / two_n);
        d += 2.0 / ((two_n - 1) * two_n);
        t *= (n - 1.5) / n;
        qn *= q;
        const double c = a * two_n / (two_n - 1);
        const double e = d - 1.0 / ((two_n - 1) * two_n);
        const double dk = qn * (a * (L - d) - c * (L - e));
        const double de = qn * (c * (L - e) - t);
        k_minus_e += dk;
        e_minus_k += de;
        if (std::fabs(dk) < 1e-18 * k_minus_e && std::fabs(de) < 1e-18 * e_minus_k) break;
    }
    return q / (1.0 - q) * k_minus_e + e_minus_k;
}

// The coefficient from q = k'^2 = l^2 / (l^2 + D^2) (formed without cancellation) and, for coils not
// short, the elliptic pair at k' = sqrt(q).
double coefficient_from(double rho, double q, double kc, const detail::EllipticPair& e) {
    if (q < 0.1) return 4.0 / (3.0 * pi * kc) * short_coil_bracket(q);
    const double k = rho * kc;  // sqrt(1 - q)
    const double E = e.k - rho * rho * q * e.k_minus_e_over_m;  // k^2 = rho^2 q
    return 4.0 / (3.0 * pi * kc) * (q * e.k_minus_e_over_m + E - k);
}

double checked_q(double rho) {
    require_positive("diameter_to_length", rho);
    const double q = 1.0 / (1.0 + rho * rho);
    if (q == 0.0) throw InputError("diameter_to_length", format_value(rho) + " is too large to evaluate");
    return q;
}

// The table's part and the position u in [-1, 1] within it for t = 1 / (1 + rho), t >= t_min.
struct TableSpot {
    const detail::nagaoka_table::Part* part;
    double u;
};
TableSpot table_spot(double t) {
    using namespace detail::nagaoka_table;
    const double s = (t - t_min) * (segments / (1 - t_min));
    const int i = std::min(segments - 1, static_cast<int>(s));
    return {&parts[i], 2 * (s - i) - 1};
}

// A polynomial of degree 12 by Estrin's scheme: four levels of independent multiply-adds, where Horner's
// rule would chain twelve.
double estrin12(const double* c, double u) {
    static_assert(detail::nagaoka_table::degree == 12, "estrin12 evaluates degree 12");
    const double u2 = u * u, u4 = u2 * u2, u8 = u4 * u4;
    const double p01 = c[0] + c[1] * u, p23 = c[2] + c[3] * u, p45 = c[4] + c[5] * u;
    const double p67 = c[6] + c[7] * u, p89 = c[8] + c[9] * u, p1011 = c[10] + c[11] * u;
    const double p03 = p01 + p23 * u2, p47 = p45 + p67 * u2, p811 = p89 + p1011 * u2;
    return (p03 + p47 * u4) + (p811 + c[12] * u4) * u8;
}

// Below t_min (D / l above 9, short coils) the elliptic integrals themselves.
NagaokaSlope by_elliptic_integrals(double rho, bool with_slope) {
    const double q = checked_q(rho), kc = std::sqrt(q);
    if (!with_slope) {
        const detail::EllipticPair e = q < 0.1 ? detail::EllipticPair{} : detail::elliptic_k_and_k_minus_e_over_m(kc, rho * rho * q);
        return {coefficient_from(rho, q, kc, e), NAN};
    }
    const detail::EllipticPair e = detail::elliptic_k_and_k_minus_e_over_m(kc, rho * rho * q);
    // dK/drho = (4 / (3 pi)) [ (s / rho) (E - 2 q (K - E) / k^2) - 1 ], s = sqrt(1 + rho^2) = 1 / k', from
    // K = (4 / (3 pi)) [ s ((K - E) / rho^2 + E) - rho ] with d(K - E)/dk = k E / k'^2, dE/dk = (E - K) / k
    // (DLMF 19.4.1) and dk/drho = k'^3. The bracket cancels to O(rho) for long coils and to
    // O(ln rho / rho^2) for short ones, which costs the slope a few digits at the ends of the domain.
    const double E = e.k - rho * rho * q * e.k_minus_e_over_m;
    return {coefficient_from(rho, q, kc, e), 4.0 / (3.0 * pi) * ((E - 2 * q * e.k_minus_e_over_m) / (rho * kc) - 1)};
}

}  // namespace

NagaokaSlope detail::nagaoka_by_elliptic_integrals(double rho) { return by_elliptic_integrals(rho, true); }

double nagaoka_coefficient(double rho) {
    require_positive("diameter_to_length", rho);
    if (const double t = 1 / (1 + rho); t >= detail::nagaoka_table::t_min) {
        const TableSpot at = table_spot(t);
        return estrin12(at.part->value, at.u);
    }
    return by_elliptic_integrals(rho, false).value;
}

NagaokaSlope nagaoka_coefficient_and_slope(double rho) {
    require_positive("diameter_to_length", rho);
    if (const double t = 1 / (1 + rho); t >= detail::nagaoka_table::t_min) {
        const TableSpot at = table_spot(t);
        return {estrin12(at.part->value, at.u), estrin12(at.part->slope, at.u)};
    }
    return by_elliptic_integrals(rho, true);
}

double sheet_inductance(double mean_diameter, double length, double turns, double (*coefficient)(double),
                        const char* model) {
    require_positive("mean_diameter", mean_diameter);
    require_positive("length", length);
    require_positive("turns", turns);
    const double r = mean_diameter / 2;
    return finite_result(model, mu0 * pi * r * r * turns * turns / length * coefficient(mean_diameter / length));
}

double current_sheet_inductance(double mean_diameter, double length, double turns) {
    return sheet_inductance(mean_diameter, length, turns, &nagaoka_coefficient, "current-sheet inductance");
}

}  // namespace libcoil
