#include "libcoil/outputs/wire_report.hpp"

#include <sstream>

#include <nlohmann/json.hpp>

#include "outputs/json_text.hpp"

#include "libcoil/core/units.hpp"
#include "libcoil/version.hpp"
#include "core/text_format.hpp"

namespace libcoil {

namespace {

using detail::fixed;
using detail::pad;

std::string len(double m) { return format_quantity(m, Dimension::length); }

void row(std::ostringstream& o, const std::string& label, const std::string& value, const std::string& note = "") {
    o << "  " + pad(label, 22) + (note.empty() ? value : pad(value, 14) + note) << "\n";
}

}  // namespace

std::string wire_text_report(const WireStudy& study) {
    const Wire& w = study.wire;
    const WireAtFrequency& r = study.at;
    const double temperature = study.temperature, frequency = study.frequency;
    std::ostringstream o;
    o << "libcoil " << version << " \u2014 wire\n\n";
    row(o, "wire", w.label);
    row(o, "conductor", study.conductor);
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

std::string wire_json_report(const WireStudy& study) {
    const Wire& w = study.wire;
    const WireAtFrequency& r = study.at;
    const double temperature = study.temperature, frequency = study.frequency;
    nlohmann::ordered_json j;
    j["libcoil_version"] = version;
    j["label"] = w.label;
    j["conductor"] = study.conductor;
    j["temperature_K"] = temperature;
    j["frequency_Hz"] = frequency;
    j["bare_diameter_m"] = r.bare_diameter;
    j["insulated_diameter_m"] = r.insulated_diameter;
    j["dc_resistance_per_m_ohm"] = r.dc_resistance_per_length;
    j["skin_depth_m"] = r.skin_depth;
    j["skin_ac_dc_ratio"] = r.skin_ratio;
    j["skin_onset_frequency_Hz"] = r.skin_onset_frequency;
    return detail::json_text(j, 2);
}

std::string wire_table_text(const std::vector<WireStudy>& rows) {
    if (rows.empty()) return "";
    const WireStudy& first = rows.front();
    std::ostringstream o;
    o << "libcoil " << version << " \u2014 wire table, " << first.conductor << " at "
      << format_quantity(first.temperature, Dimension::temperature) << ", R_ac/R_dc at "
      << format_quantity(first.frequency, Dimension::frequency) << ", enamel grade 1\n\n";
    o << "  " << pad("wire", 10) << pad("bare", 11) << pad("enamelled", 11) << pad("R_dc / m", 13) << pad("R_ac/R_dc", 11)
      << "+10 % skin at\n";
    bool metric = false;
    for (const WireStudy& row : rows) {
        const bool is_metric = row.wire.label.find("mm") != std::string::npos;
        if (is_metric && !metric) o << "\n";
        metric = is_metric;
        const WireAtFrequency& r = row.at;
        o << "  " << pad(row.wire.label, 10) << pad(len(r.bare_diameter), 11) << pad(len(r.insulated_diameter), 11)
          << pad(format_quantity(r.dc_resistance_per_length, Dimension::resistance), 13) << pad(fixed(r.skin_ratio, 3), 11)
          << format_quantity(r.skin_onset_frequency, Dimension::frequency) << "\n";
    }
    return o.str();
}

}  // namespace libcoil
