#include "libcoil/outputs/analysis_report.hpp"

#include <cmath>
#include <cstdio>
#include <sstream>

#include <nlohmann/json.hpp>

#include "outputs/json_text.hpp"

#include "libcoil/core/constants.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/models/wire_harmonics.hpp"
#include "libcoil/version.hpp"
#include "core/text_format.hpp"

namespace libcoil {

namespace {

std::string len(double m) { return format_quantity(m, Dimension::length); }
std::string henry(double h) { return format_quantity(h, Dimension::inductance); }

using detail::fixed;

std::string signed_percent(double v) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%+.3f %%", v * 100);
    return buf;
}

using detail::pad;

void row(std::ostringstream& o, const std::string& label, const std::string& value, const std::string& note = "") {
    std::string line = "  " + pad(label, 22) + (note.empty() ? value : pad(value, 14) + note);
    o << line << "\n";
}

std::string hz(double f) { return format_quantity(f, Dimension::frequency); }
std::string farad(double c) { return format_quantity(c, Dimension::capacitance); }

std::string shift(double shielded, double unshielded) {
    const double pc = 100 * (shielded / unshielded - 1);
    return std::string(pc >= 0 ? "+" : "") + detail::fixed(pc, 1) + " %";
}

void shield_text(std::ostringstream& o, const Analysis& a) {
    if (!a.shield || !a.spec.shield) return;
    const ShieldSpec& s = *a.spec.shield;
    const ShieldResult& r = a.shield->result;
    o << "\nShield: " << s.material.name << ", inner diameter " << len(s.inner_diameter) << ", length " << len(s.length) << ", wall "
      << len(s.thickness) << (s.end_discs ? ", closed ends" : ", open ends") << "\n";
    o << "  " << pad("", 26) << pad("unshielded", 14) << pad("shielded", 14) << "shift\n";
    for (std::size_t i = 0; i < r.points.size() && i < a.at_frequency.size(); ++i) {
        const ShieldPoint& p = r.points[i];
        const CoilAtFrequency* c = nullptr;
        for (const auto& q : a.at_frequency) {
            if (q.frequency == p.frequency) c = &q;
        }
        if (!c) continue;
        const double l_sh = c->inductance + (p.inductance - r.unshielded_inductance), r_sh = c->resistance + p.added_resistance;
        o << "  " << pad("L at " + hz(p.frequency), 26) << pad(format_quantity(c->inductance, Dimension::inductance), 14)
          << pad(format_quantity(l_sh, Dimension::inductance), 14) << shift(l_sh, c->inductance) << "\n";
        o << "  " << pad("R at " + hz(p.frequency), 26) << pad(format_quantity(c->resistance, Dimension::resistance), 14)
          << pad(format_quantity(r_sh, Dimension::resistance), 14) << shift(r_sh, c->resistance) << "\n";
    }
    o << "  " << pad("L, high-frequency limit", 26) << pad(format_quantity(r.unshielded_inductance, Dimension::inductance), 14)
      << pad(format_quantity(r.perfect_conductor, Dimension::inductance), 14) << shift(r.perfect_conductor, r.unshielded_inductance) << "\n";
    o << "  " << pad(a.shield->by_network ? "SRF (turn network)" : "SRF (lumped estimate)", 26) << pad(hz(a.self_resonance.frequency), 14) << pad(hz(a.shield->self_resonance), 14)
      << shift(a.shield->self_resonance, a.self_resonance.frequency) << "\n";
    row(o, "capacitance to shield", farad(r.capacitance_to_shield),
        farad(a.shield->terminal_capacitance) + " between the terminals (" + mounting_name(a.spec.surroundings.mounting) + ")");
    row(o, "closed form", format_quantity(r.closed_form, Dimension::inductance), "current sheet in a long tube (Fourier-Bessel), high-frequency limit");
    row(o, "long-coil form", format_quantity(r.long_coil_limit, Dimension::inductance), "L0 (1 - a^2/b^2), for a long coil in a long shield");
}

void thermal_text(std::ostringstream& o, const Analysis& a) {
    if (!a.thermal) return;
    const ThermalEstimate& t = *a.thermal;
    const auto kelvin = [](double v) { return format_quantity(v, Dimension::temperature, 4); };
    o << "\nWinding under load (still air, no enclosure)\n";
    row(o, "current", format_quantity(t.current, Dimension::current),
        t.current_frequency && *t.current_frequency > 0 ? "at " + hz(*t.current_frequency) : "DC");
    row(o, "ambient", kelvin(t.ambient));
    if (t.runaway) {
        row(o, "winding", "runaway", "no balance below 500 \u00b0C");
    } else {
        row(o, "winding", kelvin(t.temperature), "rise " + fixed(t.rise, 1) + " K, " + format_quantity(t.power, Dimension::power) + " dissipated");
    }
    row(o, "limit", kelvin(t.limit), t.limit_source + (t.over_limit ? ": EXCEEDED" : ""));
    if (t.sets_wire_temperature) o << "  the losses above are taken at this winding temperature\n";
}

void self_resonance_text(std::ostringstream& o, const Analysis& a) {
    const SelfResonance& sr = a.self_resonance;
    o << "\nSelf-resonance (" << mounting_name(sr.mounting)
      << (sr.mounting == Mounting::floating ? ": both terminals free of ground" : ": one terminal on a ground plane")
      << ")\n";
    o << "  SRF " << hz(a.self_resonance_as_mounted) << (a.shield ? " in the shield" : "") << ", expected between "
      << hz(a.self_resonance_low_as_mounted) << " and " << hz(a.self_resonance_high_as_mounted) << "\n";
    for (const auto& why : sr.band_reasons) o << "    - " << why << "\n";
    if (sr.network_modes.size() > 1) {
        o << "  the turns' next natural frequencies" << (a.shield ? " (without the shield)" : "") << ":";
        for (std::size_t k = 1; k < sr.network_modes.size(); ++k) o << (k > 1 ? "," : "") << " " << hz(sr.network_modes[k]);
        o << (sr.mounting == Mounting::floating ? " (between free ends only the odd ones show at the terminals)" : "") << "\n";
    }
    o << "\n  Model comparison, each with its error measured against NEC2 (free-standing coils, " << mounting_name(sr.mounting) << ")\n";
    o << "  " << pad("model", 44) << pad("SRF", 13) << pad("self-C", 12) << "measured error\n";
    const auto line = [&](const std::string& name, const SelfResonanceMethod& m, const std::string& mark) {
        if (!m.available) return;
        const std::string err = (m.error_low >= 0 ? "+" : "") + fixed(100 * m.error_low, 1) + " .. " + (m.error_high >= 0 ? "+" : "") +
                                fixed(100 * m.error_high, 1) + " %";
        std::string s = "  " + pad(name, 44) + pad(hz(m.frequency), 13) + pad(farad(m.capacitance), 12) + pad(err, 18) + mark;
        while (s.back() == ' ') s.pop_back();
        o << s << "\n";
    };
    const bool by_line = sr.method == "helical_line", by_network = sr.method == "network";
    line("turn network (PEEC)", sr.network, "<- recommended");
    line("helical line (sheath helix)", sr.helical_line, by_line ? "<- recommended" : "");
    line("helical line, Kandoian & Sichak velocity", sr.kandoian_sichak, "");
    line("lumped, Medhurst 1947 C (end grounded)", sr.medhurst, by_line || by_network ? "" : "<- recommended");
    o << "  Medhurst's table is a measurement of coils standing on a grounded plate, wound on polystyrene rods;\n"
         "  the NEC2 set is free-standing coils in air (tests/reference/nec2).\n";
    if (sr.mounting == Mounting::floating) {
        row(o, "wire half-wave", hz(sr.half_wave_wire_frequency), "rule of thumb: SRF lies near it, within about 2x");
    } else {
        row(o, "wire quarter-wave", hz(sr.half_wave_wire_frequency / 2), "rule of thumb: SRF lies near it, within about 2x");
    }
    row(o, "axial phase velocity", fixed(sr.phase_velocity / speed_of_light, 4) + " c", "at the first resonance");
    row(o, "permittivity", fixed(sr.medium.inner, 3) + " inside, " + fixed(sr.medium.outer, 3) + " outside");
    row(o, "C far below SRF", farad(sr.low_frequency_capacitance), "what a low-frequency measurement extrapolates to");
    if (a.spec.former) {
        const FormerSpec& f = *a.spec.former;
        std::string what = f.material.name + " " + former_kind_name(f.kind) + ", wall " + len(f.wall);
        if (f.kind == FormerKind::ribbed) what += ", " + std::to_string(f.ribs) + " ribs of " + len(f.rib_width);
        row(o, "former", what);
    }
    if (!a.impedance.empty()) {
        o << "\n  Impedance between the terminals (helical-line model, with the R and L above"
          << (a.shield ? ", in the shield" : "") << ")\n";
        o << "  " << pad("frequency", 13) << pad("|Z|", 13) << pad("phase", 10) << pad("apparent L", 13) << "apparent Q\n";
        for (const auto& p : a.impedance) {
            o << "  " << pad(hz(p.frequency), 13) << pad(format_quantity(p.magnitude(), Dimension::resistance), 13)
              << pad(fixed(p.phase() * 180 / pi, 2) + "\u00b0", 10) << pad(henry(p.apparent_inductance), 13)
              << (p.frequency > 0 ? fixed(p.q_factor, 1) : "-") << "\n";
        }
    }
}

std::string criterion_label(const CriterionResult& c) {
    if (c.name == "srf_margin") return "SRF >= " + fixed(c.required, 2) + " x ceiling" + (c.defaulted ? " (default)" : "");
    if (c.name == "max_deviation") return "|Z| within " + format_quantity(c.required * 100, Dimension::dimensionless) + " % of wL";
    return "|Z| >= " + format_quantity(c.required, Dimension::resistance);
}

// `lower_edge`: the SRF judged is the lower edge of its band (the band check's own criterion).
std::string criterion_detail(const CriterionResult& c, bool lower_edge = true) {
    if (c.name == "srf_margin") {
        return std::string(lower_edge ? "SRF at least " : "SRF ") + hz(c.worst) + " = " + fixed(c.margin * c.required, 2) + " x ceiling" +
               (c.first_failure ? "; passes only up to a ceiling of " + hz(*c.first_failure) : "");
    }
    if (c.name == "max_deviation") {
        std::string s = "worst " + fixed(c.worst * 100, 2) + " % at " + hz(c.worst_frequency) + ", margin " +
                        fixed(c.margin * 100, 2) + " points";
        if (c.first_failure) s += "; first fails at " + hz(*c.first_failure);
        return s;
    }
    std::string s = "lowest " + format_quantity(c.worst, Dimension::resistance) + " at " + hz(c.worst_frequency) + " (" +
                    fixed(20 * std::log10(c.margin), 1) + " dB)";
    if (c.first_failure) s += "; first fails at " + hz(*c.first_failure);
    return s;
}

void band_text(std::ostringstream& o, const Analysis& a) {
    if (!a.band) return;
    const BandCheck& b = *a.band;
    o << "\nBand check, " << hz(b.low) << " to " << hz(b.ceiling) << ": " << (b.pass ? "PASS" : "FAIL") << "\n";
    for (const auto& c : b.criteria) {
        o << "  " << pad(c.pass ? "pass" : "FAIL", 6) << pad(criterion_label(c), 30) << criterion_detail(c) << "\n";
    }
    if (a.band_srf_by_medhurst) {
        const auto& m = *a.band_srf_by_medhurst;
        o << "  " << pad(m.pass ? "pass" : "fail", 6) << pad("same SRF margin, Medhurst C", 30) << criterion_detail(m, false)
          << "\n";
    }
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
        if (a.loss_method == LossSolver::filaments) {
            o << "  losses by the cross-section filament solver (" << a.subdivision.layers << " layers, grading "
              << fixed(a.subdivision.grading, 2) << ", " << a.subdivision.sectors << " sectors)\n"
              << "  measured against a finite-element reference: " << cross_section_measured_error << "\n";
            if (a.shield) o << "  the wires' own R and L in the shield's field; the wall's loss joins them in the impedance below\n";
        } else if (a.loss_method == LossSolver::harmonics) {
            o << "  losses by the wire-harmonic solver (Bessel harmonics of each wire's current: skin and proximity together)\n"
              << "  measured against a finite-element reference: " << wire_harmonics_measured_error << "\n";
            if (a.shield) o << "  the wires' own R and L in the shield's field; the wall's loss joins them in the impedance below\n";
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
                            (p.numerical && a.loss_method == LossSolver::closed_form ? "  *" : "");
            o << s << "\n";
        }
        o << "  R = R_dc x (skin + proximity); L includes the internal inductance left by the skin effect\n";
        bool starred = false;
        for (const auto& p : a.at_frequency) starred = starred || (p.numerical && a.loss_method == LossSolver::closed_form);
        if (starred) {
            o << "  * from the cross-section filament solver (" << a.subdivision.layers << " layers, "
              << a.subdivision.sectors << " sectors): the closed form is outside its domain there\n";
        }
    } else {
        o << "  (add operating.frequencies to the spec for R, L and Q at frequency)\n";
    }

    thermal_text(o, a);
    self_resonance_text(o, a);
    shield_text(o, a);
    band_text(o, a);

    detail::list_section(o, "Cautions", a.cautions, "!");
    detail::list_section(o, "Warnings", a.warnings, "!");
    detail::list_section(o, "Assumptions", a.notes, "-");
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
    j["loss_method"] = choice_name(a.loss_method);
    if (a.loss_method == LossSolver::filaments) {
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
                          {"method", !p.numerical ? "closed-form" : a.loss_method == LossSolver::harmonics ? "harmonics" : "filaments"}});
    }
    j["at_frequency"] = points;

    const SelfResonance& sr = a.self_resonance;
    j["self_capacitance_F"] = sr.capacitance;
    j["self_resonance_Hz"] = sr.frequency;
    j["self_resonance_method"] = sr.method;
    nlohmann::ordered_json cap, srf, err;
    const auto method = [&](const char* name, const SelfResonanceMethod& m) {
        if (!m.available) return;
        cap[name] = m.capacitance;
        srf[name] = m.frequency;
        err[name] = {m.error_low, m.error_high};
    };
    method("network", sr.network);
    method("helical_line", sr.helical_line);
    method("kandoian_sichak", sr.kandoian_sichak);
    method("medhurst", sr.medhurst);
    j["self_capacitance_by_method"] = cap;
    j["self_resonance_by_method"] = srf;
    j["self_resonance_error_by_method"] = err;  // f / f_NEC2 - 1 measured on the NEC2 set, [low, high]
    j["self_resonance_detail"] = {{"mounting", mounting_name(sr.mounting)},
                                  {"low_frequency_capacitance_F", sr.low_frequency_capacitance},
                                  {"phase_velocity_m_per_s", sr.phase_velocity},
                                  {"inner_relative_permittivity", sr.medium.inner},
                                  {"outer_relative_permittivity", sr.medium.outer},
                                  {"half_wave_wire_frequency_Hz", sr.half_wave_wire_frequency}};
    if (a.spec.former) {
        const FormerSpec& f = *a.spec.former;
        j["former"] = {{"material", f.material.name},
                       {"kind", former_kind_name(f.kind)},
                       {"wall_m", f.wall},
                       {"ribs", f.ribs},
                       {"rib_width_m", f.rib_width},
                       {"relative_permittivity", f.material.relative_permittivity},
                       {"loss_tangent", f.material.loss_tangent},
                       {"effective_loss_tangent", a.dielectric_loss_tangent}};
    }
    if (a.spec.bench) {
        const BenchCorrections& b = *a.spec.bench;
        j["bench"] = {{"source", b.source}, {"stray_capacitance_F", b.stray_capacitance}, {"lead_inductance_H", b.lead_inductance},
                      {"resistance_scale", b.resistance_scale}};
        j["bench"]["former_permittivity"] = b.former_permittivity ? nlohmann::ordered_json(*b.former_permittivity) : nlohmann::ordered_json(nullptr);
        j["bench"]["former_loss_tangent"] = b.former_loss_tangent ? nlohmann::ordered_json(*b.former_loss_tangent) : nlohmann::ordered_json(nullptr);
    }
    if (a.shield && a.spec.shield) {
        const ShieldSpec& s = *a.spec.shield;
        const ShieldResult& r = a.shield->result;
        nlohmann::ordered_json pts = nlohmann::ordered_json::array();
        for (const auto& p : r.points) {
            pts.push_back({{"frequency_Hz", p.frequency}, {"skin_depth_m", p.skin_depth},
                           {"inductance_change_H", p.inductance - r.unshielded_inductance}, {"added_resistance_ohm", p.added_resistance}});
        }
        j["shield"] = {{"material", s.material.name}, {"inner_diameter_m", s.inner_diameter}, {"length_m", s.length},
                       {"thickness_m", s.thickness}, {"end_discs", s.end_discs}, {"axial_offset_m", s.axial_offset},
                       {"inductance_high_frequency_H", r.perfect_conductor}, {"closed_form_H", r.closed_form}, {"long_coil_form_H", r.long_coil_limit},
                       {"capacitance_to_shield_F", r.capacitance_to_shield}, {"terminal_capacitance_F", a.shield->terminal_capacitance},
                       {"self_resonance_Hz", a.shield->self_resonance},
                       {"self_resonance_model", a.shield->by_network ? "turn network" : "lumped estimate"}, {"at_frequency", pts}, {"rings", r.rings}};
    }
    nlohmann::ordered_json zs = nlohmann::ordered_json::array();
    for (const auto& p : a.impedance) {
        zs.push_back({{"frequency_Hz", p.frequency},
                      {"resistance_ohm", p.impedance.real()},
                      {"reactance_ohm", p.impedance.imag()},
                      {"magnitude_ohm", p.magnitude()},
                      {"phase_deg", p.phase() * 180 / pi},
                      {"apparent_inductance_H", p.apparent_inductance},
                      {"q_factor", p.q_factor}});
    }
    j["impedance"] = zs;
    if (a.band) {
        const auto criterion = [](const CriterionResult& c) {
            nlohmann::ordered_json r{{"name", c.name},
                                     {"required", c.required},
                                     {"pass", c.pass},
                                     {"margin", c.margin},
                                     {"worst", c.worst},
                                     {"worst_frequency_Hz", c.worst_frequency},
                                     {"first_failure_Hz", nullptr},
                                     {"default", c.defaulted}};
            if (c.first_failure) r["first_failure_Hz"] = *c.first_failure;
            return r;
        };
        nlohmann::ordered_json crit = nlohmann::ordered_json::array();
        std::optional<double> first;
        for (const auto& c : a.band->criteria) {
            crit.push_back(criterion(c));
            if (c.first_failure && (!first || *c.first_failure < *first)) first = *c.first_failure;
        }
        j["band"] = {{"low_Hz", a.band->low}, {"ceiling_Hz", a.band->ceiling}, {"pass", a.band->pass},
                     {"first_failure_Hz", nullptr}, {"criteria", crit}};
        if (first) j["band"]["first_failure_Hz"] = *first;
        if (a.band_srf_by_medhurst) j["band"]["srf_margin_by_medhurst"] = criterion(*a.band_srf_by_medhurst);
    }
    if (a.thermal) {
        const ThermalEstimate& t = *a.thermal;
        j["thermal"] = {{"current_A", t.current},
                        {"current_frequency_Hz", t.current_frequency.value_or(0.0)},
                        {"ambient_K", t.ambient},
                        {"winding_temperature_K", t.runaway ? nlohmann::ordered_json(nullptr) : nlohmann::ordered_json(t.temperature)},
                        {"rise_K", t.rise},
                        {"power_W", t.power},
                        {"limit_K", t.limit},
                        {"limit_source", t.limit_source},
                        {"over_limit", t.over_limit},
                        {"runaway", t.runaway},
                        {"sets_wire_temperature", t.sets_wire_temperature}};
    }
    j["self_resonance_as_mounted_Hz"] = a.self_resonance_as_mounted;
    j["self_resonance_band_as_mounted_Hz"] = {a.self_resonance_low_as_mounted, a.self_resonance_high_as_mounted};
    j["self_resonance_band_reasons"] = a.self_resonance.band_reasons;
    j["self_resonance_modes_Hz"] = a.self_resonance.network_modes;  // the turn network's first three, bare coil
    j["cautions"] = a.cautions;
    j["warnings"] = a.warnings;
    j["notes"] = a.notes;
    return detail::json_text(j, 2);
}

}  // namespace libcoil
