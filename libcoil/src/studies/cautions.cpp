#include "libcoil/studies/cautions.hpp"

#include "libcoil/core/units.hpp"
#include "core/text_format.hpp"

namespace libcoil {

std::vector<std::string> safety_cautions(double supply_voltage, double rf_power, double temperature, double limit) {
    std::vector<std::string> c;
    if (supply_voltage > 50) {
        c.push_back("The supply (" + format_quantity(supply_voltage, Dimension::voltage) +
                    ") is above extra-low voltage (50 V AC, 120 V ripple-free DC; IEC 61140). Build in an earthed "
                    "enclosure with wire, former and terminals rated for it, with the creepage and clearance your "
                    "standard asks for, and have a qualified person check it. Local codes and licensed practice come first.");
    }
    if (rf_power > 0) {
        c.push_back("RF power (" + format_quantity(rf_power, Dimension::power) +
                    ") is given: a coil near resonance can carry high voltage and its field burns deep and painlessly. "
                    "Never touch it energised; rate nearby parts and the former for the voltage.");
    }
    if (temperature > 0 && limit > 0 && temperature > limit - near_thermal_limit) {
        const std::string where = temperature > limit ? "above its limit"
                                                      : "within " + detail::fixed(near_thermal_limit, 0) + " K of its limit";
        c.push_back("The winding is estimated at " + format_quantity(temperature, Dimension::temperature) + ", " + where + " (" +
                    format_quantity(limit, Dimension::temperature) +
                    "). The estimate is for still air with no enclosure; measure the real part under load.");
    }
    return c;
}

}  // namespace libcoil
