#include "libcoil/models/lundin.hpp"

#include <cmath>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/nagaoka.hpp"

namespace libcoil {

namespace {
double f1(double x) { return (1.0 + 0.383901 * x + 0.017108 * x * x) / (1.0 + 0.258952 * x); }
double f2(double x) { return 0.093842 * x + 0.002029 * x * x - 0.000801 * x * x * x; }
}  // namespace

double lundin_coefficient(double rho) {
    require_positive("diameter_to_length", rho);
    if (rho <= 1.0) {  // l >= D
        return f1(rho * rho) - 4.0 / (3.0 * pi) * rho;
    }
    const double s = 1.0 / rho;  // l / D
    const double x = s * s;
    return finite_result("Lundin's formula", 2.0 / pi * s * ((std::log(4.0) + std::log(rho) - 0.5) * f1(x) + f2(x)));
}

double lundin_inductance(double mean_diameter, double length, double turns) {
    return sheet_inductance(mean_diameter, length, turns, &lundin_coefficient, "Lundin's formula");
}

}  // namespace libcoil
