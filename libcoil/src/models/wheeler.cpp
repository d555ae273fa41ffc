#include "libcoil/models/wheeler.hpp"

#include "libcoil/core/error.hpp"
#include "libcoil/models/nagaoka.hpp"

namespace libcoil {

double wheeler_coefficient(double rho) {
    require_positive("diameter_to_length", rho);
    return 1.0 / (1.0 + 0.45 * rho);
}

// mu0 pi r^2 N^2 / (l + 0.9 r), written through its coefficient.
double wheeler_inductance(double mean_diameter, double length, double turns) {
    return sheet_inductance(mean_diameter, length, turns, &wheeler_coefficient, "Wheeler's formula");
}

bool wheeler_in_domain(double rho) { return rho < 2.5; }  // l > 0.8 r

}  // namespace libcoil
