#include "libcoil/studies/winding_heat.hpp"

#include <functional>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/models/dc_resistance.hpp"
#include "libcoil/models/losses.hpp"
#include "libcoil/models/proximity.hpp"

namespace libcoil {

double ac_ratio_by(LossSolver solver, const Solenoid& s, const Conductor& conductor, double temperature, double frequency) {
    if (!(frequency > 0)) return 1.0;
    const double l = 1e-6;  // the inductance does not enter R
    const auto p = coil_at_frequencies_by(solver, s, conductor, temperature, l, {0.0, frequency}, frequency);
    return p[1].resistance / p[0].resistance;
}

WindingHeat winding_heat(const Solenoid& s, const Conductor& conductor, double current, std::optional<double> current_frequency,
                         double ambient, double limit, std::optional<double> given_ratio) {
    require_non_negative("current", current);
    double ac_ratio = 1;
    if (given_ratio) {
        ac_ratio = *given_ratio;
    } else if (current_frequency && *current_frequency > 0) {
        const auto r = ac_resistance(s, conductor, ambient, *current_frequency);
        ac_ratio = r.resistance / r.dc;
    }
    WindingHeat h;
    h.per_resistivity = current * current * ac_ratio * resistance_per_resistivity(s.wire().bare_diameter, s.wire_length());
    h.conductor = &conductor;
    h.surface = ThermalSurface{s.outer_diameter(), s.overall_length(), 0.85, CoilAxis::horizontal};
    h.ambient = ambient;
    h.limit = limit;
    return h;
}

WindingTemperature settle_winding(const WindingHeat& h, double tolerance, bool settle_above_limit) {
    WindingTemperature out;
    const auto power = [&h](double t) { return h.power(t); };
    const double shed = convected_power(h.surface, h.limit, h.ambient) + radiated_power(h.surface, h.limit, h.ambient);
    if (const double p_limit = h.power(h.limit); !(p_limit <= shed)) {
        out.over_limit = true;
        out.excess = shed > 0 ? p_limit / shed : 10;
        if (!settle_above_limit) return out;
        try {
            const ThermalResult r = winding_temperature(std::cref(power), h.surface, h.ambient, default_max_temperature, tolerance);
            out.temperature = r.temperature;
            out.rise = r.rise;
            out.power = r.power;
        } catch (const DomainError&) {
            out.runaway = true;
        }
        return out;
    }
    try {
        const ThermalResult r = winding_temperature(std::cref(power), h.surface, h.ambient, h.limit, tolerance, shed);
        out.temperature = r.temperature;
        out.rise = r.rise;
        out.power = r.power;
    } catch (const DomainError&) {  // only by rounding at the limit itself
        out.over_limit = true;
        out.excess = 1;
    }
    return out;
}

std::string winding_limit_source(double enamel_class, const std::optional<FormerMaterial>& former) {
    if (former && former->max_service_temperature > 0 && former->max_service_temperature < enamel_class) {
        return former->name + " former, " + format_quantity(former->max_service_temperature, Dimension::temperature);
    }
    return "enamel class " + format_value(enamel_class - zero_celsius) + " \u00b0C";
}

}  // namespace libcoil
