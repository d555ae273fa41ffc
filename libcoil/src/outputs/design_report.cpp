// Reports of a design search: text and JSON. Formatting only.
#include <cmath>
#include <sstream>

#include <nlohmann/json.hpp>

#include "outputs/json_text.hpp"

#include "libcoil/outputs/design_report.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/version.hpp"
#include "core/text_format.hpp"

namespace libcoil {

namespace {

using detail::fixed;

using detail::pad;

std::string mm(double m) { return fixed(m * 1e3, 2); }

}  // namespace

std::string design_text_report(const Requirement& q, const DesignResult& r, std::size_t top) {
    std::ostringstream o;
    o << "libcoil " << version << " \u2014 coil design\n";
    if (!q.name.empty()) o << q.name << "\n";
    o << "\nRequirement\n";
    o << "  target " << format_quantity(q.inductance, Dimension::inductance) << " within " << fixed(q.tolerance * 100, 2)
      << " %, " << format_quantity(q.current, Dimension::current) << " at "
      << format_quantity(q.ambient, Dimension::temperature) << " ambient\n";
    if (q.band) {
        o << "  band " << format_quantity(q.band->low, Dimension::frequency) << " to "
          << format_quantity(q.band->ceiling, Dimension::frequency);
        if (q.band->srf_margin) o << ", SRF >= " << fixed(*q.band->srf_margin, 2) << " x ceiling";
        if (q.band->max_deviation) o << ", |Z| within " << fixed(*q.band->max_deviation * 100, 1) << " % of wL";
        if (q.band->min_impedance) o << ", |Z| >= " << format_quantity(*q.band->min_impedance, Dimension::resistance);
        o << "\n";
    }
    o << "  limits: outer diameter " << mm(q.max_outer_diameter) << " mm, length " << mm(q.max_length)
      << " mm with " << mm(q.former_ends) << " mm former ends";
    if (q.max_wire_length) o << ", wire " << fixed(*q.max_wire_length, 2) << " m";
    o << "\n";

    o << "\nSearch: " << r.candidates_evaluated << " candidates, " << r.feasible << " feasible, " << r.front_size
      << " on the Pareto front (loss, size, SRF margin)\n";
    for (const auto& [reason, n] : r.rejected_by_reason) {
        o << "  rejected by " << pad(reason, 24) << pad(std::to_string(n), 10);
        const auto best = r.best_excess_by_reason.find(reason);
        if (r.pareto.empty() && best != r.best_excess_by_reason.end()) {
            o << "the closest misses it by " << (best->second - 1 < 0.0005 ? std::string("less than 0.1 %") : fixed(100 * (best->second - 1), 1) + " %");
        }
        o << "\n";
    }

    if (r.pareto.empty()) {
        o << "\n" << r.binding << "\n";
    } else {
        o << "\nBest designs (turns snapped to " << fixed(q.turns_step, 2) << ", pitch trimmed to meet the target)\n";
        o << "  " << pad("#", 4) << pad("wire", 30) << pad("form mm", 9) << pad("turns", 8) << pad("pitch mm", 10)
          << pad("length mm", 11) << pad("outer mm", 10) << pad("SRF", 12) << pad("R at ref", 12) << pad("winding", 10)
          << "score\n";
        for (std::size_t i = 0; i < std::min(top, r.pareto.size()); ++i) {
            const auto& d = r.pareto[i];
            o << "  " << pad(std::to_string(i + 1) + (r.chosen && *r.chosen == i ? "*" : ""), 4) << pad(d.wire_label, 30)
              << pad(mm(d.form_diameter), 9) << pad(fixed(d.turns, 2), 8) << pad(fixed(d.pitch * 1e3, 3), 10)
              << pad(mm(d.length_with_ends), 11) << pad(mm(d.outer_diameter), 10)
              << pad(format_quantity(d.self_resonance, Dimension::frequency), 12)
              << pad(format_quantity(d.resistance, Dimension::resistance), 12)
              << pad(format_quantity(d.temperature, Dimension::temperature, 3), 10) << fixed(d.score, 3) << "\n";
        }
        const double f = r.pareto.front().reference_frequency;
        o << "  R at ref: at " << (f > 0 ? format_quantity(f, Dimension::frequency) : std::string("DC"))
          << "; length includes the former ends; * chosen\n";
        if (r.chosen) {
            const auto& d = r.pareto[*r.chosen];
            o << "\nChosen: design " << *r.chosen + 1 << ", " << d.wire_label << ", " << fixed(d.turns, 2) << " turns on a "
              << mm(d.form_diameter) << " mm former at " << fixed(d.pitch * 1e3, 4) << " mm pitch\n";
            o << "  why: " << r.why_chosen << "\n";
            o << "  the search solved " << fixed(d.turns_solved, 3) << " turns at " << fixed(d.pitch_before_trim * 1e3, 4)
              << " mm pitch, snapped them to " << fixed(d.turns, 2) << " and trimmed the pitch to " << fixed(d.pitch * 1e3, 4)
              << " mm so that L = " << format_quantity(d.inductance_at_target, Dimension::inductance)
              << (d.target_frequency > 0 ? " at " + format_quantity(d.target_frequency, Dimension::frequency) + " by the wire-harmonic solver (" +
                                               format_quantity(d.inductance, Dimension::inductance) + " at low frequency)"
                                         : std::string(" exactly"))
              << "\n";
            o << "  winding estimated at " << format_quantity(d.temperature, Dimension::temperature) << " (rise "
              << fixed(d.rise, 1) << " K, limit " << format_quantity(d.temperature_limit, Dimension::temperature)
              << ") in still air; an estimate, not a rating\n";
            if (r.chosen_analysis) {
                o << "  full re-analysis: L " << format_quantity(r.chosen_analysis->inductance.recommended, Dimension::inductance);
                if (d.target_frequency > 0) {
                    o << " at low frequency, " << format_quantity(inductance_at_target(*r.chosen_analysis, d.target_frequency), Dimension::inductance)
                      << " at " << format_quantity(d.target_frequency, Dimension::frequency);
                }
                if (r.chosen_analysis->shield) {
                    o << " unshielded, " << format_quantity(r.chosen_analysis->shield->result.perfect_conductor, Dimension::inductance)
                      << " in the shield (its high-frequency limit)";
                }
                o << ", SRF " << format_quantity(r.chosen_analysis->self_resonance_as_mounted, Dimension::frequency);
                if (r.chosen_analysis->band) o << ", band check " << (r.chosen_analysis->band->pass ? "PASS" : "FAIL");
                o << "\n";
            }
            if (r.fixture_check) o << "  fixture check " << (r.fixture_check->verdict->pass ? "PASS" : "FAIL") << ": " << r.fixture_words << "\n";
        } else {
            o << "\nNo design passed the full re-analysis; see the warnings.\n";
        }
    }
    if (r.spread) {
        const Spread& s = *r.spread;
        o << "\nTolerance spread of the chosen design (" << s.samples << " samples, seed " << s.seed << ")\n";
        const auto stat = [&](const char* name, const SpreadStatistics& st, Dimension d) {
            o << "  " << pad(name, 6) << "nominal " << pad(format_quantity(st.nominal, d), 12) << "mean "
              << pad(format_quantity(st.mean, d), 12) << "sd " << pad(fixed(st.standard_deviation / st.nominal * 100, 2) + " %", 9)
              << "95 % in " << format_quantity(st.low, d) << " .. " << format_quantity(st.high, d) << "\n";
        };
        stat("L", s.inductance, Dimension::inductance);
        stat("SRF", s.self_resonance, Dimension::frequency);
        o << "  within the target tolerance: " << fixed(s.within_tolerance * 100, 1) << " % of samples";
        if (s.left_out) o << " (" << s.left_out << " samples left out: outside the models)";
        o << "\n  sensitivities (% per %)   L        SRF\n";
        for (const auto& x : s.sensitivities) {
            o << "    " << pad(x.input, 22) << pad(fixed(x.inductance, 3), 9) << fixed(x.self_resonance, 3) << "\n";
        }
    }
    detail::list_section(o, "Cautions", r.cautions, "!");
    detail::list_section(o, "Warnings", r.warnings, "!");
    detail::list_section(o, "Assumptions", r.notes, "-");
    return o.str();
}

std::string design_json_report(const Requirement& q, const DesignResult& r, std::size_t top) {
    nlohmann::ordered_json j;
    j["libcoil_version"] = version;
    j["name"] = q.name;
    j["target_inductance_H"] = q.inductance;
    j["tolerance"] = q.tolerance;
    j["candidates_evaluated"] = r.candidates_evaluated;
    j["feasible"] = r.feasible;
    j["pareto_size"] = r.front_size;
    j["rejected_by_reason"] = r.rejected_by_reason;
    nlohmann::ordered_json designs = nlohmann::ordered_json::array();
    for (std::size_t i = 0; i < std::min(top, r.pareto.size()); ++i) {
        const auto& d = r.pareto[i];
        designs.push_back({{"rank", i + 1},
                           {"wire", d.wire_label},
                           {"form_diameter_m", d.form_diameter},
                           {"mean_diameter_m", d.mean_diameter},
                           {"outer_diameter_m", d.outer_diameter},
                           {"turns", d.turns},
                           {"turns_solved", d.turns_solved},
                           {"pitch_m", d.pitch},
                           {"pitch_before_trim_m", d.pitch_before_trim},
                           {"pitch_ratio", d.pitch_ratio},
                           {"winding_length_m", d.winding_length},
                           {"length_with_ends_m", d.length_with_ends},
                           {"wire_length_m", d.wire_length},
                           {"inductance_H", d.inductance},
                           {"target_frequency_Hz", d.target_frequency},
                           {"inductance_at_target_H", d.inductance_at_target},
                           {"self_resonance_Hz", d.self_resonance},
                           {"srf_margin", d.srf_margin},
                           {"dc_resistance_ohm", d.dc_resistance},
                           {"reference_frequency_Hz", d.reference_frequency},
                           {"resistance_ohm", d.resistance},
                           {"q_factor", d.q_factor},
                           {"temperature_K", d.temperature},
                           {"temperature_rise_K", d.rise},
                           {"temperature_limit_K", d.temperature_limit},
                           {"volume_m3", d.volume},
                           {"score", d.score},
                           {"spec", i < r.specs.size() ? coil_spec_yaml(r.specs[i], q.wires[d.wire_index].choice) : std::string()}});
    }
    j["designs"] = designs;
    j["chosen"] = r.chosen ? nlohmann::ordered_json(*r.chosen) : nlohmann::ordered_json(nullptr);
    j["why_chosen"] = r.why_chosen;
    j["binding"] = r.binding;
    if (r.closest) j["closest"] = {{"reason", r.closest->reason}, {"excess", r.closest->excess}, {"detail", r.closest->detail}};
    if (!r.best_excess_by_reason.empty()) j["best_excess_by_reason"] = r.best_excess_by_reason;
    if (r.fixture_check) {
        const FixtureVerdict& v = *r.fixture_check->verdict;
        j["fixture_check"] = {{"pass", v.pass},
                              {"tolerance", v.tolerance},
                              {"tolerance_unit", v.in_db ? "dB" : "fraction"},
                              {"band_low_Hz", v.band_low},
                              {"band_high_Hz", v.band_high},
                              {"worst_deviation", v.worst_deviation},
                              {"worst_frequency_Hz", v.worst_frequency},
                              {"first_failure_Hz", v.first_failure ? nlohmann::ordered_json(*v.first_failure) : nlohmann::ordered_json(nullptr)},
                              {"dominant_part", v.dominant_part},
                              {"words", r.fixture_words}};
    }
    if (!r.chosen) j["one_change"] = r.one_change.empty() ? nlohmann::ordered_json(nullptr) : nlohmann::ordered_json(r.one_change);
    if (r.spread) {
        const Spread& s = *r.spread;
        const auto stat = [](const SpreadStatistics& st) {
            return nlohmann::ordered_json{{"nominal", st.nominal}, {"mean", st.mean}, {"standard_deviation", st.standard_deviation},
                                          {"low_2_5_percent", st.low}, {"high_97_5_percent", st.high}};
        };
        nlohmann::ordered_json sens = nlohmann::ordered_json::array();
        for (const auto& x : s.sensitivities) {
            sens.push_back({{"input", x.input}, {"inductance", x.inductance}, {"self_resonance", x.self_resonance}});
        }
        j["spread"] = {{"samples", s.samples},
                       {"left_out", s.left_out},
                       {"seed", s.seed},
                       {"tolerances", {{"form_diameter_m", s.tolerances.form_diameter},
                                       {"pitch_m", s.tolerances.pitch},
                                       {"wire_diameter_fraction", s.tolerances.wire_diameter},
                                       {"turns", s.tolerances.turns}}},
                       {"inductance_H", stat(s.inductance)},
                       {"self_resonance_Hz", stat(s.self_resonance)},
                       {"within_tolerance", s.within_tolerance},
                       {"sensitivities", sens},
                       {"first_order_inductance_sd_H", s.first_order_inductance_deviation}};
    }
    j["cautions"] = r.cautions;
    j["warnings"] = r.warnings;
    j["notes"] = r.notes;
    return detail::json_text(j, 2);
}

}  // namespace libcoil
