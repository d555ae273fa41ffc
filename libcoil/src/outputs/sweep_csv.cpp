#include "libcoil/outputs/sweep_files.hpp"

#include <sstream>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/version.hpp"
#include "outputs/svg_axes.hpp"

namespace libcoil {

std::vector<std::string> sweep_description(const Sweep& s) {
    std::vector<std::string> d;
    d.push_back("libcoil " + std::string(version) + ": impedance of the coil between its terminals, " + (s.title.empty() ? "unnamed coil" : s.title));
    d.push_back(std::string("model: ") + choice_name(s.model) +
                (s.model == ImpedanceModel::lumped ? std::string(" with the ") + choice_name(s.capacitance) + " self-capacitance" : "") +
                "; mounting: " + choice_name(s.mounting));
    d.push_back("self-resonance " + format_quantity(s.self_resonance, Dimension::frequency) + ", nominal inductance " +
                format_quantity(s.nominal_inductance, Dimension::inductance) + ", wire at " + format_quantity(s.temperature, Dimension::temperature));
    if (s.shield) d.push_back("in its shield (" + *s.shield + "): L(f), wall loss, capacitance and SRF of the shielded coil");
    return d;
}

std::string sweep_csv(const Sweep& sweep) {
    const auto& points = sweep.points;
    std::ostringstream o;
    for (const auto& line : sweep_description(sweep)) o << "# " << line << "\n";
    o << "frequency_Hz,impedance_magnitude_ohm,phase_deg,resistance_ohm,reactance_ohm,apparent_inductance_H,q_factor\n";
    for (const auto& p : points) {
        o << detail::g(p.frequency, 15) << ',' << detail::g(p.magnitude(), 15) << ',' << detail::g(p.phase() * 180 / pi, 15) << ','
          << detail::g(p.impedance.real(), 15) << ',' << detail::g(p.impedance.imag(), 15) << ',' << detail::g(p.apparent_inductance, 15) << ','
          << detail::g(p.q_factor, 15) << '\n';
    }
    return o.str();
}

}  // namespace libcoil
