#include "libcoil/models/medhurst.hpp"

#include <array>
#include <cmath>
#include <vector>

// Boost 1.74's pchip calls isnan unqualified; <math.h> puts it in the global namespace.
#include <math.h>  // NOLINT

#include <boost/math/interpolators/pchip.hpp>

#include "libcoil/core/error.hpp"

namespace libcoil {

namespace {

// Medhurst 1947: l/D and H (pF per cm of diameter). Rows 1, 2, 3, 4, 5 are the published values; the
// others are from memory of the table as handbooks reproduce it.
constexpr std::array<std::array<double, 2>, 33> table{{
    {0.10, 0.96}, {0.15, 0.79}, {0.20, 0.70}, {0.25, 0.64}, {0.30, 0.60}, {0.35, 0.57}, {0.40, 0.54},
    {0.45, 0.52}, {0.50, 0.50}, {0.60, 0.48}, {0.70, 0.47}, {0.80, 0.46}, {0.90, 0.46}, {1.0, 0.46},
    {1.5, 0.47},  {2.0, 0.50},  {2.5, 0.56},  {3.0, 0.61},  {3.5, 0.67},  {4.0, 0.72},  {4.5, 0.77},
    {5.0, 0.81},  {6.0, 0.92},  {7.0, 1.01},  {8.0, 1.12},  {9.0, 1.22},  {10.0, 1.32}, {15.0, 1.86},
    {20.0, 2.36}, {25.0, 2.92}, {30.0, 3.40}, {40.0, 4.62}, {50.0, 5.62},
}};

// Monotone cubic (PCHIP) in ln(l/D): it keeps the flat bottom near l/D = 1 free of overshoot.
const boost::math::interpolators::pchip<std::vector<double>>& interpolant() {
    static const auto p = [] {
        std::vector<double> x, y;
        for (const auto& row : table) {
            x.push_back(std::log(row[0]));
            y.push_back(row[1]);
        }
        return boost::math::interpolators::pchip<std::vector<double>>(std::move(x), std::move(y));
    }();
    return p;
}

void require_in_table(double r) {
    require_positive("length_to_diameter", r);
    if (r < medhurst_min_ratio || r > medhurst_max_ratio) {
        throw DomainError("Medhurst's self-capacitance table covers l/D = 0.1 .. 50; this coil has l/D = " +
                          format_value(r));
    }
}

}  // namespace

double medhurst_h(double length_to_diameter) {
    require_in_table(length_to_diameter);
    for (const auto& row : table) {
        if (row[0] == length_to_diameter) return row[1];  // the published point itself
    }
    return interpolant()(std::log(length_to_diameter));
}

double medhurst_h_formula(double length_to_diameter) {
    require_in_table(length_to_diameter);
    const double r = length_to_diameter;
    return 0.1126 * r + 0.08 + 0.27 / std::sqrt(r);
}

double medhurst_capacitance(double mean_diameter, double winding_length) {
    require_positive("mean_diameter", mean_diameter);
    require_positive("winding_length", winding_length);
    // H is in pF per cm: C [F] = H * 1e-12 * D [cm] = H * 1e-10 * D [m].
    return finite_result("Medhurst", medhurst_h(winding_length / mean_diameter) * 1e-10 * mean_diameter);
}

double medhurst_capacitance_formula(double mean_diameter, double winding_length) {
    require_positive("mean_diameter", mean_diameter);
    require_positive("winding_length", winding_length);
    return finite_result("Medhurst", medhurst_h_formula(winding_length / mean_diameter) * 1e-10 * mean_diameter);  // pF/cm to F
}

}  // namespace libcoil
