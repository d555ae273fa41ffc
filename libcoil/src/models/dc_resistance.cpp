#include "libcoil/models/dc_resistance.hpp"

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"

namespace libcoil {

double dc_resistance_per_length(const Conductor& c, double diameter, double temperature) {
    require_positive("wire.diameter", diameter);
    return finite_result("DC resistance", c.resistivity_at(temperature) / (pi * diameter * diameter / 4));
}

double resistance_per_resistivity(double diameter, double length) {
    require_positive("wire.diameter", diameter);
    require_non_negative("length", length);
    return finite_result("DC resistance", length / (pi * diameter * diameter / 4));
}

double dc_resistance(const Conductor& c, double diameter, double length, double temperature) {
    require_non_negative("length", length);
    return finite_result("DC resistance", dc_resistance_per_length(c, diameter, temperature) * length);
}

}  // namespace libcoil
