#include "libcoil/outputs/circuit_files.hpp"

#include <sstream>

#include "core/text_format.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/version.hpp"

namespace libcoil {

namespace {

std::string hz(double f) { return format_quantity(f, Dimension::frequency); }

std::string resonance_line(const char* what, const std::optional<double>& model, const std::optional<double>& fit) {
    if (!model || !fit) return std::string("  ") + what + ": " + (model ? hz(*model) : "-") + " by the model, " + (fit ? hz(*fit) : "-") + " by the circuit\n";
    return std::string("  ") + what + ": " + hz(*model) + " by the model, " + hz(*fit) + " by the circuit (" +
           detail::fixed(100 * (*fit / *model - 1), 3) + " %)\n";
}

}  // namespace

std::string spice_subcircuit(const CircuitExport& c, const std::string& name) {
    if (name.empty() || name.find_first_of(" \t\r\n.") != std::string::npos) {
        throw InputError("name", "\"" + name + "\"; a subcircuit name is one word without dots");
    }
    std::ostringstream o;
    o.precision(17);
    o << "* " << name << ": the equivalent circuit of the coil \"" << c.name << "\" by libcoil " << version << "\n";
    o << "* fitted to its impedance as mounted from " << hz(c.from) << " to " << hz(c.to) << " (" << c.pairs << " pole pairs):\n";
    o << "* |Z| within " << detail::significant(100 * c.max_magnitude_error, 2) << " %, phase within " << detail::significant(c.max_phase_error, 2)
      << " degrees there; valid inside that range only. Foster form of its admittance (T1 to T2):\n";
    o << "* each branch R + L in series, some with C parallel to R; values may be negative where the whole stays passive.\n";
    o << ".subckt " << name << " T1 T2\n";
    const FosterAdmittance& f = c.circuit;
    if (f.conductance != 0) o << "RG T1 T2 " << 1 / f.conductance << "\n";
    if (f.capacitance != 0) o << "CG T1 T2 " << f.capacitance << "\n";
    for (std::size_t i = 0; i < f.branches.size(); ++i) {
        const FosterBranch& b = f.branches[i];
        const std::string k = std::to_string(i + 1), a = "A" + k, m = "M" + k;
        o << "RB" << k << " T1 " << a << " " << b.resistance << "\n";
        o << "LB" << k << " " << a << " " << (b.capacitance != 0 ? m : "T2") << " " << b.inductance << "\n";
        if (b.capacitance != 0) {
            o << "CB" << k << " " << m << " T2 " << b.capacitance << "\n";
            if (b.conductance != 0) o << "RP" << k << " " << m << " T2 " << 1 / b.conductance << "\n";
        }
    }
    o << ".ends " << name << "\n";
    return o.str();
}

std::string circuit_export_text(const CircuitExport& c) {
    std::ostringstream o;
    o << "libcoil " << version << " \u2014 equivalent circuit" << (c.name.empty() ? "" : ": " + c.name) << "\n\n";
    o << "  fitted from " << hz(c.from) << " to " << hz(c.to) << " with " << c.pairs << " pole pairs and " << c.circuit.branches.size()
      << " branches\n";
    o << "  |Z| within " << detail::significant(100 * c.max_magnitude_error, 2) << " %, phase within " << detail::significant(c.max_phase_error, 2)
      << " degrees; least Re Y / |Y| " << detail::significant(c.least_real_part, 2) << (c.least_real_part >= 0 ? " (passive)" : " (NOT passive)")
      << "\n";
    o << resonance_line("self-resonance", c.model_self_resonance, c.fitted_self_resonance);
    o << resonance_line("second resonance", c.model_second_resonance, c.fitted_second_resonance);
    for (const auto& n : c.notes) o << "  - " << n << "\n";
    return o.str();
}

}  // namespace libcoil
