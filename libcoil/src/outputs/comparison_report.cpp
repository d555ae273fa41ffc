#include "libcoil/outputs/comparison_report.hpp"

#include <cmath>
#include <optional>
#include <sstream>

#include <nlohmann/json.hpp>

#include "core/text_format.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/version.hpp"

namespace libcoil {

namespace {

using detail::pad;
using detail::significant;

struct Figure {
    const char* label;
    const char* key;
    Dimension dimension;
    std::optional<double> (*get)(const MeasuredFigures&);
};

const Figure figures[] = {
    {"inductance", "inductance_H", Dimension::inductance, [](const MeasuredFigures& f) -> std::optional<double> { return f.inductance; }},
    {"resistance", "resistance_ohm", Dimension::resistance, [](const MeasuredFigures& f) -> std::optional<double> { return f.resistance; }},
    {"self-resonance", "self_resonance_Hz", Dimension::frequency, [](const MeasuredFigures& f) { return f.self_resonance; }},
    {"self-capacitance", "self_capacitance_F", Dimension::capacitance, [](const MeasuredFigures& f) { return f.self_capacitance; }},
    {"Q at resonance", "q_at_resonance", Dimension::dimensionless, [](const MeasuredFigures& f) { return f.q_at_resonance; }},
    {"|Z| at resonance", "impedance_at_resonance_ohm", Dimension::resistance, [](const MeasuredFigures& f) { return f.impedance_at_resonance; }},
    {"second resonance", "second_resonance_Hz", Dimension::frequency, [](const MeasuredFigures& f) { return f.second_resonance; }},
};

std::string shown(const std::optional<double>& v, Dimension d) {
    if (!v) return "-";
    return d == Dimension::dimensionless ? significant(*v, 4) : format_quantity(*v, d);
}

std::optional<double> deviation(const std::optional<double>& measured, const std::optional<double>& predicted) {
    if (!measured || !predicted || *predicted == 0) return std::nullopt;
    return *measured / *predicted - 1;
}

}  // namespace

std::string comparison_text_report(const Comparison& c) {
    std::ostringstream o;
    o << "libcoil " << version << " \u2014 measurement against prediction" << (c.title.empty() ? "" : ": " + c.title) << "\n\n";
    o << "  " << c.measured.frequency.size() << " points, " << format_quantity(c.measured.frequency.front(), Dimension::frequency) << " to "
      << format_quantity(c.measured.frequency.back(), Dimension::frequency) << "; prediction by the " << choice_name(c.model)
      << " model, as mounted\n";
    o << "  L and R read at " << format_quantity(c.extracted.reference_frequency, Dimension::frequency)
      << " as (R + jwL) || C, C resonating at the SRF; both sides read the same way\n\n";
    o << "  " << pad("", 20) << pad("measured", 14) << pad("predicted", 14) << "deviation\n";
    for (const Figure& f : figures) {
        const auto m = f.get(c.extracted), p = f.get(c.from_prediction);
        const auto d = deviation(m, p);
        o << "  " << pad(f.label, 20) << pad(shown(m, f.dimension), 14) << pad(shown(p, f.dimension), 14)
          << (d ? (*d >= 0 ? "+" : "") + detail::fixed(100 * *d, 2) + " %" : "-") << "\n";
    }
    if (!c.measured.notes.empty()) {
        o << "\nNotes\n";
        for (const auto& n : c.measured.notes) o << "  - " << n << "\n";
    }
    return o.str();
}

std::string comparison_json_report(const Comparison& c) {
    nlohmann::ordered_json j;
    j["libcoil_version"] = version;
    j["title"] = c.title;
    j["model"] = choice_name(c.model);
    j["reference_frequency_Hz"] = c.extracted.reference_frequency;
    const auto value = [](const std::optional<double>& v) { return v ? nlohmann::ordered_json(*v) : nlohmann::ordered_json(nullptr); };
    for (const Figure& f : figures) {
        j["extracted"][f.key] = value(f.get(c.extracted));
        j["predicted"][f.key] = value(f.get(c.from_prediction));
        j["deviation"][f.key] = value(deviation(f.get(c.extracted), f.get(c.from_prediction)));
    }
    j["notes"] = c.measured.notes;
    return j.dump(1) + "\n";
}

std::string comparison_csv(const Comparison& c) {
    std::ostringstream o;
    o << "frequency [Hz],measured |Z| [ohm],measured phase [deg],predicted |Z| [ohm],predicted phase [deg],"
         "measured R [ohm],measured X [ohm],predicted R [ohm],predicted X [ohm],weight\n";
    o.precision(10);
    for (std::size_t k = 0; k < c.measured.frequency.size(); ++k) {
        const auto& m = c.measured.impedance[k];
        const auto& p = c.predicted[k];
        o << c.measured.frequency[k] << ',' << std::abs(m) << ',' << std::arg(m) * 180 / M_PI << ',' << std::abs(p) << ','
          << std::arg(p) * 180 / M_PI << ',' << m.real() << ',' << m.imag() << ',' << p.real() << ',' << p.imag() << ','
          << c.measured.weight[k] << "\n";
    }
    return o.str();
}

}  // namespace libcoil
