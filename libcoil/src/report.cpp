#include "libcoil/report.hpp"

#include <cmath>
#include <cstdio>
#include <sstream>

#include <nlohmann/json.hpp>

#include "libcoil/constants.hpp"
#include "libcoil/units.hpp"
#include "libcoil/version.hpp"

namespace libcoil {

namespace {

std::string len(double m) { return format_quantity(m, Dimension::length); }
std::string henry(double h) { return format_quantity(h, Dimension::inductance); }

std::string fixed(double v, int decimals) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.*f", decimals, v);
    return buf;
}

std::string signed_percent(double v) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%+.3f %%", v * 100);
    return buf;
}

// Pads to a display width, counting UTF-8 code points rather than bytes ("µH" is two columns).
std::string pad(const std::string& s, std::size_t width) {
    std::size_t cols = 0;
    for (unsigned char c : s) cols += (c & 0xC0) != 0x80;
    return cols >= width ? s + " " : s + std::string(width - cols, ' ');
}

void row(std::ostringstream& o, const std::string& label, const std::string& value, const std::string& note = "") {
    std::string line = "  " + pad(label, 22) + (note.empty() ? value : pad(value, 14) + note);
    o << line << "\n";
}

}  // namespace

std::string text_report(const Analysis& a) {
    const Solenoid& s = a.spec.solenoid;
    const Wire& w = s.wire();
    const auto& ind = a.inductance;
    std::ostringstream o;
    o << "libcoil " << version << " \u2014 single-layer coil analysis\n";
    if (!a.spec.name.empty()) o << a.spec.name << "\n";
    if (!a.spec.description.empty()) o << a.spec.description << "\n";
    o << "\nGeometry\n";
    row(o, "former diameter", len(s.form_diameter()));
    row(o, "mean diameter", len(s.mean_diameter()), "to the wire centre");
    row(o, "outer diameter", len(s.outer_diameter()));
    row(o, "turns", format_quantity(s.turns(), Dimension::dimensionless, 6));
    row(o, "pitch", len(s.pitch()),
        fixed(s.pitch_to_wire(), 3) + " x bare wire, " + fixed(s.pitch() / w.insulated_diameter(), 3) + " x insulated");
    row(o, "winding length", len(s.winding_length()), "current sheet, turns x pitch");
    row(o, "overall length", len(s.overall_length()), "plus one insulated wire diameter");
    row(o, "D / l", fixed(s.diameter_to_length(), 4));
    row(o, "pitch angle", fixed(s.pitch_angle() * 180 / pi, 3) + "\u00b0");
    o << "\nWire\n";
    row(o, "wire", w.label);
    row(o, "bare diameter", len(w.bare_diameter));
    row(o, "insulated diameter", len(w.insulated_diameter()));
    row(o, "conductor", a.spec.conductor.name);
    row(o, "wire length", len(s.wire_length()),
        s.lead_length() > 0 ? "helix " + len(s.helix_length()) + " + leads " + len(s.lead_length()) : "helix, no leads");

    o << "\nInductance (low frequency)\n";
    o << "  " << pad("model", 38) << pad("value", 12) << "vs recommended\n";
    const auto line = [&](const char* name, double v, const std::string& mark = "") {
        std::string s = "  " + pad(name, 38) + pad(henry(v), 12) + pad(signed_percent(v / ind.recommended - 1), 12) + mark;
        while (s.back() == ' ') s.pop_back();
        o << s << "\n";
    };
    line("Wheeler 1928, current sheet", ind.by_method.wheeler);
    line("Nagaoka exact, current sheet", ind.by_method.nagaoka);
    line("Lundin 1985, current sheet", ind.by_method.lundin);
    const bool rosa = ind.method == "rosa";
    line("Nagaoka + Rosa round-wire correction", ind.by_method.rosa, rosa ? "<- recommended" : "outside its domain");
    line("filament sum (Maxwell), round wire", ind.by_method.filament, rosa ? "independent check" : "<- recommended");
    o << "  Nagaoka coefficient K = " << fixed(ind.nagaoka_coefficient, 6) << "\n";
    o << "\n  Inductance: " << henry(ind.recommended) << "\n";

    const Operating& op = a.spec.operating;
    o << "\nResistance and Q\n";
    row(o, "wire temperature", format_quantity(op.temperature, Dimension::temperature, 4));
    row(o, "DC resistance", format_quantity(a.dc_resistance, Dimension::resistance), "whole wire, leads included");
    if (!a.at_frequency.empty()) {
        if (a.loss_method == "filaments") {
            o << "  losses by the cross-section filament solver (" << a.subdivision.layers << " layers, grading "
              << fixed(a.subdivision.grading, 2) << ", " << a.subdivision.sectors << " sectors)\n";
        } else {
            o << "  losses by closed forms: Bessel skin effect + Butterworth proximity\n";
        }
        o << "  " << pad("frequency", 13) << pad("R", 13) << pad("skin", 9) << pad("proximity", 11) << pad("L", 12)
          << "Q\n";
        for (const auto& p : a.at_frequency) {
            std::string s = "  " + pad(format_quantity(p.frequency, Dimension::frequency), 13) +
                            pad(format_quantity(p.resistance, Dimension::resistance), 13) + pad(fixed(p.skin_ratio, 3), 9) +
                            pad(fixed(p.proximity_ratio, 3), 11) + pad(henry(p.inductance), 12) +
                            (p.frequency > 0 ? fixed(p.q_factor, 1) : "-") +
                            (p.numerical && a.loss_method != "filaments" ? "  *" : "");
            o << s << "\n";
        }
        o << "  R = R_dc x (skin + proximity); L includes the internal inductance left by the skin effect\n";
        o << "  Self-capacitance is not modelled yet: L and Q hold only well below the self-resonance\n";
        bool starred = false;
        for (const auto& p : a.at_frequency) starred = starred || (p.numerical && a.loss_method != "filaments");
        if (starred) {
            o << "  * from the cross-section filament solver (" << a.subdivision.layers << " layers, "
              << a.subdivision.sectors << " sectors): the closed form is outside its domain there\n";
        }
    } else {
        o << "  (add operating.frequencies to the spec for R, L and Q at frequency)\n";
    }

    if (!a.warnings.empty()) {
        o << "\nWarnings\n";
        for (const auto& x : a.warnings) o << "  ! " << x << "\n";
    }
    if (!a.notes.empty()) {
        o << "\nAssumptions\n";
        for (const auto& x : a.notes) o << "  - " << x << "\n";
    }
    return o.str();
}

std::string json_report(const Analysis& a) {
    const Solenoid& s = a.spec.solenoid;
    const Wire& w = s.wire();
    const auto& ind = a.inductance;
    nlohmann::ordered_json j;
    j["libcoil_version"] = version;
    j["name"] = a.spec.name;
    j["description"] = a.spec.description;
    j["turns"] = s.turns();
    j["pitch_m"] = s.pitch();
    j["form_diameter_m"] = s.form_diameter();
    j["mean_diameter_m"] = s.mean_diameter();
    j["outer_diameter_m"] = s.outer_diameter();
    j["winding_length_m"] = s.winding_length();
    j["overall_length_m"] = s.overall_length();
    j["pitch_angle_rad"] = s.pitch_angle();
    j["helix_length_m"] = s.helix_length();
    j["lead_length_m"] = s.lead_length();
    j["wire_length_m"] = s.wire_length();
    j["wire"] = {{"label", w.label},
                 {"bare_diameter_m", w.bare_diameter},
                 {"insulation_m", w.insulation},
                 {"insulated_diameter_m", w.insulated_diameter()}};
    j["conductor"] = a.spec.conductor.name;
    j["nagaoka_coefficient"] = ind.nagaoka_coefficient;
    j["inductance_current_sheet_H"] = ind.by_method.nagaoka;
    j["inductance_H"] = ind.recommended;
    j["inductance_by_method"] = {{"wheeler", ind.by_method.wheeler},
                                 {"nagaoka", ind.by_method.nagaoka},
                                 {"lundin", ind.by_method.lundin},
                                 {"rosa", ind.by_method.rosa},
                                 {"filament", ind.by_method.filament}};
    j["inductance_method"] = ind.method;
    j["temperature_K"] = a.spec.operating.temperature;
    j["dc_resistance_ohm"] = a.dc_resistance;
    j["loss_method"] = a.loss_method;
    if (a.loss_method == "filaments") {
        j["subdivision"] = {{"layers", a.subdivision.layers}, {"grading", a.subdivision.grading}, {"sectors", a.subdivision.sectors}};
    }
    nlohmann::ordered_json points = nlohmann::ordered_json::array();
    for (const auto& p : a.at_frequency) {
        points.push_back({{"frequency_Hz", p.frequency},
                          {"resistance_ohm", p.resistance},
                          {"skin_ratio", p.skin_ratio},
                          {"proximity_ratio", p.proximity_ratio},
                          {"inductance_H", p.inductance},
                          {"q_factor", p.q_factor},
                          {"method", p.numerical ? "filaments" : "closed-form"}});
    }
    j["at_frequency"] = points;
    j["warnings"] = a.warnings;
    j["notes"] = a.notes;
    return j.dump(2) + "\n";
}

std::string wire_text_report(const Wire& w, const Conductor& c, double temperature, double frequency) {
    const WireAtFrequency r = wire_at_frequency(w, c, temperature, frequency);
    std::ostringstream o;
    o << "libcoil " << version << " \u2014 wire\n\n";
    row(o, "wire", w.label);
    row(o, "conductor", c.name);
    row(o, "bare diameter", len(r.bare_diameter));
    row(o, "insulated diameter", len(r.insulated_diameter));
    row(o, "temperature", format_quantity(temperature, Dimension::temperature));
    row(o, "DC resistance", format_quantity(r.dc_resistance_per_length, Dimension::resistance) + "/m");
    if (frequency > 0) {
        row(o, "frequency", format_quantity(frequency, Dimension::frequency));
        row(o, "skin depth", len(r.skin_depth), fixed(r.bare_diameter / r.skin_depth, 2) + " per wire diameter");
        row(o, "R_ac / R_dc", fixed(r.skin_ratio, 4), "isolated straight wire (Bessel solution)");
    }
    row(o, "skin effect +10 % at", format_quantity(r.skin_onset_frequency, Dimension::frequency));
    return o.str();
}

std::string wire_json_report(const Wire& w, const Conductor& c, double temperature, double frequency) {
    const WireAtFrequency r = wire_at_frequency(w, c, temperature, frequency);
    nlohmann::ordered_json j;
    j["libcoil_version"] = version;
    j["label"] = w.label;
    j["conductor"] = c.name;
    j["temperature_K"] = temperature;
    j["frequency_Hz"] = frequency;
    j["bare_diameter_m"] = r.bare_diameter;
    j["insulated_diameter_m"] = r.insulated_diameter;
    j["dc_resistance_per_m_ohm"] = r.dc_resistance_per_length;
    j["skin_depth_m"] = r.skin_depth;
    j["skin_ac_dc_ratio"] = r.skin_ratio;
    j["skin_onset_frequency_Hz"] = r.skin_onset_frequency;
    return j.dump(2) + "\n";
}

std::string wire_table_text(const Conductor& c, double temperature, double frequency) {
    std::ostringstream o;
    o << "libcoil " << version << " \u2014 wire table, " << c.name << " at "
      << format_quantity(temperature, Dimension::temperature) << ", R_ac/R_dc at "
      << format_quantity(frequency, Dimension::frequency) << ", enamel grade 1\n\n";
    o << "  " << pad("wire", 10) << pad("bare", 11) << pad("enamelled", 11) << pad("R_dc / m", 13) << pad("R_ac/R_dc", 11)
      << "+10 % skin at\n";
    const auto line = [&](const std::string& label, double d) {
        Wire w{d, enamel_build(d, 1), label};
        const WireAtFrequency r = wire_at_frequency(w, c, temperature, frequency);
        o << "  " << pad(label, 10) << pad(len(d), 11) << pad(len(r.insulated_diameter), 11)
          << pad(format_quantity(r.dc_resistance_per_length, Dimension::resistance), 13) << pad(fixed(r.skin_ratio, 3), 11)
          << format_quantity(r.skin_onset_frequency, Dimension::frequency) << "\n";
    };
    for (int g = 10; g <= 40; g += 2) line(awg_label(g), awg_diameter(g));
    o << "\n";
    for (double d : metric_wire_diameters()) {
        if (d >= 0.1e-3 - 1e-12 && d <= 3.15e-3 + 1e-12) line(fixed(d * 1e3, 3) + " mm", d);
    }
    return o.str();
}

}  // namespace libcoil

