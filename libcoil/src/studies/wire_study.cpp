#include "libcoil/studies/wire_study.hpp"

#include "libcoil/core/error.hpp"

#include "core/text_format.hpp"

namespace libcoil {

WireStudy study_wire(const Wire& w, const Conductor& c, double temperature, double frequency) {
    require_temperature("temperature", temperature);
    require_frequency("frequency", frequency);
    return WireStudy{w, c.name, temperature, frequency, wire_at_frequency(w, c, temperature, frequency)};
}

std::vector<WireStudy> wire_table(const Conductor& c, double temperature, double frequency) {
    require_temperature("temperature", temperature);
    require_frequency("frequency", frequency);
    std::vector<WireStudy> rows;
    for (int g = 10; g <= 40; g += 2) {
        const double d = awg_diameter(g);
        rows.push_back(study_wire(Wire{d, enamel_build(d, 1), awg_label(g)}, c, temperature, frequency));
    }
    for (double d : metric_wire_diameters()) {
        if (d >= 0.1e-3 - 1e-12 && d <= 3.15e-3 + 1e-12) {
            rows.push_back(study_wire(Wire{d, enamel_build(d, 1), detail::fixed(d * 1e3, 3) + " mm"}, c, temperature, frequency));
        }
    }
    return rows;
}

}  // namespace libcoil
