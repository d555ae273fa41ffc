// The spec writer, beside its reader (spec.cpp): a coil spec as YAML that the reader takes back unchanged.
#include <sstream>

#include "libcoil/core/constants.hpp"
#include "libcoil/spec/spec.hpp"
#include "core/text_format.hpp"

namespace libcoil {

namespace {

// A YAML double-quoted scalar.
std::string yaml_quoted(const std::string& text) {
    std::string o = "\"";
    for (char ch : text) {
        if (ch == '"' || ch == '\\') o += '\\';
        o += ch == '\n' ? ' ' : ch;
    }
    return o + "\"";
}


}  // namespace

std::string coil_spec_yaml(const CoilSpec& s, const WireChoice& wc) {
    const auto q = [](double v, const char* unit, double scale) { return detail::significant(v * scale, 10) + " " + unit; };
    const auto hz = [&](double f) { return f >= 1e6 ? q(f, "MHz", 1e-6) : f >= 1e3 ? q(f, "kHz", 1e-3) : q(f, "Hz", 1); };
    std::ostringstream o;
    o << "# libcoil design spec: coil analyze, coil sweep and the former generator accept it unchanged.\n";
    o << "name: " << yaml_quoted(s.name) << "\n";
    if (!s.description.empty()) o << "description: " << yaml_quoted(s.description) << "\n";
    const Solenoid& c = s.solenoid;
    o << "coil:\n";
    o << "  form_diameter: " << q(c.form_diameter(), "mm", 1e3) << "\n";
    o << "  turns: " << detail::significant(c.turns(), 12) << "\n";
    o << "  pitch: " << q(c.pitch(), "mm", 1e3) << "\n";
    if (c.lead_length() > 0) o << "  lead_length: " << q(c.lead_length(), "mm", 1e3) << "\n";
    o << "  wire:\n";
    if (wc.gauge) {
        o << "    gauge: AWG " << *wc.gauge << "\n";
    } else {
        o << "    diameter: " << q(c.wire().bare_diameter, "mm", 1e3) << "\n";
    }
    if (wc.enamel_grade) {
        o << "    enamel: grade " << *wc.enamel_grade << "\n";
    } else {
        o << "    insulation: " << q(c.wire().insulation, "mm", 1e3) << "\n";
    }
    o << "  conductor: " << s.conductor.name << "\n";
    // The operating section only where it holds something: "operating:" alone does not read back.
    const Operating& op = s.operating;
    std::ostringstream ops;
    if (!op.frequencies.empty()) {
        ops << "  frequencies: [";
        for (std::size_t i = 0; i < op.frequencies.size(); ++i) ops << (i ? ", " : "") << hz(op.frequencies[i]);
        ops << "]\n";
    }
    const auto celsius = [](double k) { return detail::significant(k - zero_celsius, 10) + " degC"; };
    if (op.temperature_given) ops << "  temperature: " << celsius(op.temperature) << "\n";
    if (op.current > 0) {
        ops << "  current: " << detail::significant(op.current, 10) << " A\n";
        if (op.current_frequency && *op.current_frequency > 0) ops << "  current_frequency: " << hz(*op.current_frequency) << "\n";
        ops << "  ambient: " << celsius(op.ambient) << "\n";
    }
    if (op.supply_voltage > 0) ops << "  supply_voltage: " << detail::significant(op.supply_voltage, 10) << " V\n";
    if (op.rf_power > 0) ops << "  rf_power: " << detail::significant(op.rf_power, 10) << " W\n";
    if (!ops.str().empty()) o << "operating:\n" << ops.str();
    if (s.former) {
        const FormerSpec& f = *s.former;
        o << "former:\n  material: " << f.material.name << "\n  kind: " << former_kind_name(f.kind) << "\n  wall: "
          << q(f.wall, "mm", 1e3) << "\n";
        if (f.kind == FormerKind::ribbed) {
            o << "  ribs: " << f.ribs << "\n  rib_width: " << q(f.rib_width, "mm", 1e3) << "\n  hub_wall: " << q(f.hub_wall, "mm", 1e3)
              << "\n";
        }
        if (f.ends) o << "  ends: " << q(*f.ends, "mm", 1e3) << "\n";
        const GrooveSpec& g = f.groove;
        o << "  groove: {profile: " << choice_name(g.profile);
        if (g.depth) o << ", depth: " << q(*g.depth, "mm", 1e3);
        o << ", clearance: " << q(g.clearance, "mm", 1e3);
        if (g.profile == GrooveProfile::vee) o << ", angle_deg: " << detail::significant(g.angle * 180 / pi, 10);
        o << "}\n";
        if (f.flange) o << "  flange: {diameter: " << q(f.flange->diameter, "mm", 1e3) << ", thickness: " << q(f.flange->thickness, "mm", 1e3) << "}\n";
        o << "  min_wall: " << q(f.min_wall, "mm", 1e3) << "\n";
        if (f.bore_oversize > 0) o << "  bore_oversize: " << q(f.bore_oversize, "mm", 1e3) << "\n";
    }
    if (s.shield) {
        const ShieldSpec& h = *s.shield;
        o << "shield:\n  inner_diameter: " << q(h.inner_diameter, "mm", 1e3) << "\n  length: " << q(h.length, "mm", 1e3) << "\n  thickness: "
          << q(h.thickness, "mm", 1e3) << "\n  material: " << h.material.name << "\n  end_discs: " << (h.end_discs ? "true" : "false") << "\n";
        if (h.axial_offset != 0) o << "  axial_offset: " << q(h.axial_offset, "mm", 1e3) << "\n";
    }
    o << "surroundings:\n  relative_permittivity: " << detail::significant(s.surroundings.relative_permittivity, 10)
      << "\n  mounting: " << mounting_name(s.surroundings.mounting) << "\n";
    if (s.enamel_class != default_enamel_class) {
        o << "limits:\n  enamel_class: " << detail::significant(s.enamel_class - zero_celsius, 10) << "\n";
    }
    if (s.tolerances_given) {
        const BuildTolerances& t = s.tolerances;
        o << "tolerances:\n  form_diameter: " << q(t.form_diameter, "mm", 1e3) << "\n  pitch: " << q(t.pitch, "mm", 1e3)
          << "\n  wire_diameter: " << detail::significant(t.wire_diameter * 100, 10) << " %\n  turns: " << detail::significant(t.turns, 10) << "\n";
    }
    if (s.band) {
        const BandSpec& b = *s.band;
        o << "band:\n  low: " << hz(b.low) << "\n  ceiling: " << hz(b.ceiling) << "\n";
        if (b.srf_margin) o << "  srf_margin: " << detail::significant(*b.srf_margin, 10) << "\n";
        if (b.max_deviation) o << "  max_deviation: " << detail::significant(*b.max_deviation * 100, 10) << " %\n";
        if (b.min_impedance) o << "  min_impedance: " << detail::significant(*b.min_impedance, 10) << " ohm\n";
    }
    return o.str();
}

}  // namespace libcoil
