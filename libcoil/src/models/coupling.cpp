#include "libcoil/models/coupling.hpp"

#include <algorithm>
#include <cmath>
#include <complex>
#include <vector>

#include <boost/math/quadrature/gauss_kronrod.hpp>

#include "libcoil/models/coaxial_mutual.hpp"
#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/inductance.hpp"
#include "libcoil/core/units.hpp"
#include "models/turn_filaments.hpp"

namespace libcoil {

namespace {

using detail::TurnFilaments;

}  // namespace

double parallel_filament_mutual_inductance(double a, double b, double d, double h) {
    require_positive("radius_a", a);
    require_positive("radius_b", b);
    require_non_negative("distance", d);
    require_finite("axial_offset", h);
    if (d == 0) return coaxial_mutual_inductance(a, b, h);
    // The integrand (b + d cos phi) / rho^2 M_coax(a, rho, h); M_coax ~ rho^2 near rho = 0, where the
    // quadrature's interior nodes never land exactly.
    const auto f = [&](double phi) {
        const double c = std::cos(phi);
        const double rho2 = b * b + d * d + 2 * b * d * c;
        const double rho = std::sqrt(rho2);
        if (!(rho > 0)) return 0.0;
        return coaxial_mutual_inductance(a, rho, h) * (b + d * c) / rho2;
    };
    const double m = b / pi * boost::math::quadrature::gauss_kronrod<double, 31>::integrate(f, 0.0, pi, 15, 1e-12);
    return finite_result("parallel_filament_mutual_inductance", m);
}

double coil_mutual_inductance(const Solenoid& a, const Solenoid& b, Arrangement arrangement, double distance, double axial_offset) {
    require_positive("distance", distance);  // as the coupling study takes it: centre to centre, b ahead or beside
    require_finite("axial_offset", axial_offset);
    const TurnFilaments fa = detail::turn_filaments(a), fb = detail::turn_filaments(b);
    double sum = 0;
    if (arrangement == Arrangement::coaxial) {
        // Each winding spans its current sheet, N p (its end turns' centres half a pitch inside): end to
        // end the last turns are then a pitch apart, no closer than the wire.
        const double reach = (a.winding_length() + b.winding_length()) / 2;
        if (std::fabs(distance) < reach * (1 - 1e-12)) {
            throw InputError("distance", format_quantity(distance, Dimension::length) + " puts the coaxial windings inside each other; expected at least " +
                                             format_quantity(reach, Dimension::length) + " between centres (half of each winding length)");
        }
        for (double za : fa.z) {
            for (double zb : fb.z) sum += coaxial_mutual_inductance(fa.radius, fb.radius, distance + zb - za);
        }
    } else {
        const double reach = (a.outer_diameter() + b.outer_diameter()) / 2;
        if (distance < reach) {
            throw InputError("distance", format_quantity(distance, Dimension::length) + " puts the side-by-side coils into each other; expected at least " +
                                             format_quantity(reach, Dimension::length) + " between axes (the sum of the outer radii)");
        }
        // The pair integral depends on the axial offset of the two filaments only: with equal spacing
        // most offsets repeat, so each distinct one is integrated once.
        std::vector<std::pair<double, double>> done;  // offset, M
        for (double za : fa.z) {
            for (double zb : fb.z) {
                const double h = axial_offset + zb - za;
                double m = NAN;
                for (const auto& [x, v] : done) {
                    if (std::fabs(x - h) <= 1e-12 * (std::fabs(h) + fa.radius)) m = v;
                }
                if (std::isnan(m)) {
                    m = parallel_filament_mutual_inductance(fa.radius, fb.radius, distance, h);
                    done.emplace_back(h, m);
                }
                sum += m;
            }
        }
    }
    return finite_result("coil_mutual_inductance", sum * fa.weight * fb.weight);
}

double dipole_mutual_inductance(const Solenoid& a, const Solenoid& b, Arrangement arr, double d) {
    require_positive("distance", d);
    const double ma = a.turns() * pi * a.mean_radius() * a.mean_radius(), mb = b.turns() * pi * b.mean_radius() * b.mean_radius();
    return finite_result("dipole_mutual_inductance", (arr == Arrangement::coaxial ? 2.0 : -1.0) * mu0 * ma * mb / (4 * pi * d * d * d));
}

Coupling coupling(const Solenoid& a, const Solenoid& b, Arrangement arrangement, double distance, double axial_offset) {
    Coupling c;
    c.mutual = coil_mutual_inductance(a, b, arrangement, distance, axial_offset);
    c.inductance_a = recommended_inductance(a);
    c.inductance_b = recommended_inductance(b);
    c.coefficient = c.mutual / std::sqrt(c.inductance_a * c.inductance_b);
    return c;
}

Crosstalk crosstalk(const Coupling& c, double f, double ra, double rb, double rs, double rl) {
    require_positive("frequency", f);
    require_non_negative("resistance_a", ra);
    require_non_negative("resistance_b", rb);
    require_positive("source_resistance", rs);
    require_positive("load_resistance", rl);
    const double w = 2 * pi * f;
    using C = std::complex<double>;
    const C za(ra, w * c.inductance_a), zb(rb, w * c.inductance_b), zm(0, w * c.mutual);
    // V_a = Z_a I_a + Z_m I_b, V_b = Z_m I_a + Z_b I_b, with V_a = V_s - R_s I_a and V_b = -R_l I_b.
    const C i_a = 1.0 / (rs + za - zm * zm / (zb + rl));  // per volt of source
    const C v_load = rl * zm * i_a / (zb + rl);
    Crosstalk x;
    x.frequency = f;
    x.transfer_impedance = w * std::fabs(c.mutual);
    const double s21 = 2 * std::abs(v_load) * std::sqrt(rs / rl);
    x.transfer_db = s21 > 0 ? 20 * std::log10(s21) : -400;
    return x;
}

}  // namespace libcoil
