#include "libcoil/wheeler.hpp"

#include "libcoil/constants.hpp"
#include "libcoil/error.hpp"

namespace libcoil {

double wheeler_coefficient(double rho) {
    require_positive("diameter_to_length", rho);
    return 1.0 / (1.0 + 0.45 * rho);
}

double wheeler_inductance(double mean_diameter, double length, double turns) {
    require_positive("mean_diameter", mean_diameter);
    require_positive("length", length);
    require_positive("turns", turns);
    const double r = mean_diameter / 2;
    return mu0 * pi * r * r * turns * turns / (length + 0.9 * r);
}

bool wheeler_in_domain(double rho) { return rho < 2.5; }  // l > 0.8 r

}  // namespace libcoil
