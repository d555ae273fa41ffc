#include "libcoil/outputs/comparison_report.hpp"

#include <algorithm>
#include <cmath>
#include <optional>
#include <sstream>

#include <nlohmann/json.hpp>

#include "outputs/json_text.hpp"

#include "core/text_format.hpp"
#include "outputs/svg_axes.hpp"
#include "libcoil/core/error.hpp"
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

// A fitted parameter's value as a spec takes it ("0.81 pF", "3.42").
std::string as_written(double v, Dimension d) { return d == Dimension::dimensionless ? significant(v, 4) : format_quantity(v, d, 4); }

void fit_text(std::ostringstream& o, const Comparison& c) {
    const MeasurementFit& fit = *c.fit;
    o << "\nBench fit (" << fit.points << " weighted points, " << fit.iterations << " iterations"
      << (fit.converged ? "" : ", not settled") << ")\n";
    o << "  " << pad("", 22) << pad("start", 12) << pad("fitted", 26) << "\n";
    for (const FittedParameter& p : fit.parameters) {
        std::string v = as_written(p.value, p.dimension);
        if (p.varied) v += " \u00b1 " + as_written(p.standard_error, p.dimension);
        o << "  " << pad(p.name, 22) << pad(as_written(p.start, p.dimension), 12) << pad(v, 26) << p.note << "\n";
    }
    o << "  misfit (weighted rms of |Z - Zm| / |Zm|): " << significant(100 * fit.residual_rms_before, 3) << " % before, "
      << significant(100 * fit.residual_rms_after, 3) << " % after\n";
    for (std::size_t a = 0; a < fit.varied.size(); ++a) {
        for (std::size_t b = a + 1; b < fit.varied.size(); ++b) {
            const double r = fit.correlation[a][b];
            if (std::fabs(r) >= 0.9) {
                o << "  " << fit.varied[a] << " and " << fit.varied[b] << " are correlated (" << detail::fixed(r, 2)
                  << "): the data fixes mostly their combination\n";
            }
        }
    }
    o << "  the fitted model's self-resonance: " << format_quantity(fit.self_resonance, Dimension::frequency) << "\n";
    for (const auto& n : fit.notes) o << "  - " << n << "\n";
}

}  // namespace

std::string bench_yaml(const Comparison& c, const std::string& measurement) {
    if (!c.fit) throw InputError("fit", "the comparison holds no fit");
    const MeasurementFit& fit = *c.fit;
    std::ostringstream o;
    o << "# Bench corrections fitted by libcoil " << version << " to " << measurement << " (" << fit.points
      << " points; misfit " << significant(100 * fit.residual_rms_before, 3) << " % before, " << significant(100 * fit.residual_rms_after, 3)
      << " % after).\n# Use them in the coil's spec with a line  bench: <this file>  so that its next analysis takes them.\n"
         "# Each value's standard error follows it; held values are the spec's own.\nbench:\n";
    for (const FittedParameter& p : fit.parameters) {
        if (!c.fit->corrections.former_permittivity && (p.name == "former_permittivity" || p.name == "former_loss_tangent")) continue;
        o << "  " << p.name << ": " << (p.dimension == Dimension::dimensionless ? significant(p.value, 6) : format_quantity(p.value, p.dimension, 6));
        o << "   # " << (p.varied ? "\u00b1 " + as_written(p.standard_error, p.dimension) : std::string("held"))
          << (p.note.empty() ? "" : "; " + p.note) << "\n";
    }
    return o.str();
}

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
    if (c.fit) fit_text(o, c);
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
    if (c.fit) {
        const MeasurementFit& fit = *c.fit;
        for (const FittedParameter& p : fit.parameters) {
            auto& e = j["fitted"][p.name];
            e["value"] = p.value;
            e["standard_error"] = p.varied ? nlohmann::ordered_json(p.standard_error) : nlohmann::ordered_json(nullptr);
            e["start"] = p.start;
            e["varied"] = p.varied;
            e["determined"] = p.determined;
            e["note"] = p.note;
        }
        j["residual_rms_before"] = fit.residual_rms_before;
        j["residual_rms_after"] = fit.residual_rms_after;
        j["fit_points"] = fit.points;
        j["fit_iterations"] = fit.iterations;
        j["fit_converged"] = fit.converged;
        j["correlation"]["parameters"] = fit.varied;
        j["correlation"]["matrix"] = fit.correlation;
        j["fitted_self_resonance_Hz"] = fit.self_resonance;
        for (const Figure& f : figures) j["from_fit"][f.key] = value(f.get(*c.from_fit));
        j["fit_notes"] = fit.notes;
    }
    j["notes"] = c.measured.notes;
    return detail::json_text(j, 1);
}

std::string comparison_csv(const Comparison& c) {
    std::ostringstream o;
    o << "frequency [Hz],measured |Z| [ohm],measured phase [deg],predicted |Z| [ohm],predicted phase [deg],"
         "measured R [ohm],measured X [ohm],predicted R [ohm],predicted X [ohm],weight"
      << (c.fit ? ",fitted R [ohm],fitted X [ohm]" : "") << "\n";
    o.precision(10);
    for (std::size_t k = 0; k < c.measured.frequency.size(); ++k) {
        const auto& m = c.measured.impedance[k];
        const auto& p = c.predicted[k];
        o << c.measured.frequency[k] << ',' << std::abs(m) << ',' << std::arg(m) * 180 / M_PI << ',' << std::abs(p) << ','
          << std::arg(p) * 180 / M_PI << ',' << m.real() << ',' << m.imag() << ',' << p.real() << ',' << p.imag() << ','
          << c.measured.weight[k];
        if (c.fit) o << ',' << c.fit->impedance[k].real() << ',' << c.fit->impedance[k].imag();
        o << "\n";
    }
    return o.str();
}

std::string comparison_svg(const Comparison& c) {
    using detail::px;
    std::vector<std::size_t> k;
    for (std::size_t i = 0; i < c.measured.frequency.size(); ++i) {
        if (c.measured.frequency[i] > 0) k.push_back(i);
    }
    if (k.size() < 2) throw InputError("measurement", "the picture needs two or more frequencies above 0 Hz");
    const auto& f = c.measured.frequency;
    double z_lo = INFINITY, z_hi = 0;
    for (std::size_t i : k) {
        for (double z : {std::abs(c.measured.impedance[i]), std::abs(c.predicted[i])}) {
            if (z > 0) z_lo = std::min(z_lo, z);
            z_hi = std::max(z_hi, z);
        }
    }
    if (!(z_hi > 0)) throw InputError("measurement", "|Z| is 0 throughout");
    z_lo = std::pow(10, std::floor(std::log10(z_lo)));
    z_hi = std::max(std::pow(10, std::ceil(std::log10(z_hi))), 10 * z_lo);
    const double W = 900, H = 580, left = 80, right = 860, top1 = 50, bottom1 = 330, top2 = 370, bottom2 = 520;
    const detail::LogAxis x{f[k.front()], f[k.back()], left, right};
    const detail::LogAxis y1{z_lo, z_hi, bottom1, top1};
    const detail::LinAxis y2{-90, 90, bottom2, top2};
    const auto zy = [&](std::complex<double> z) { return px(y1(std::clamp(std::abs(z), z_lo, z_hi))); };
    const auto ph = [&](std::complex<double> z) { return px(y2(std::arg(z) * 180 / M_PI)); };
    std::ostringstream o;
    o << "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << W << "\" height=\"" << H << "\" viewBox=\"0 0 " << W << ' ' << H
      << "\" font-family=\"sans-serif\" font-size=\"12\">\n<title>" << detail::xml_escape(c.title) << "</title>\n";
    o << "<rect width=\"100%\" height=\"100%\" fill=\"white\"/>\n";
    o << "<text x=\"" << left << "\" y=\"28\" font-size=\"15\" font-weight=\"bold\">measured against predicted"
      << (c.title.empty() ? "" : ": " + detail::xml_escape(c.title)) << "</text>\n";
    // The poorly measured points, greyed in both panels.
    for (std::size_t j = 0; j < k.size(); ++j) {
        if (c.measured.weight[k[j]] >= 0.5) continue;
        const double a = x(f[k[j > 0 ? j - 1 : j]]), b = x(f[k[j + 1 < k.size() ? j + 1 : j]]);
        for (const auto& [t, bt] : {std::pair{top1, bottom1}, std::pair{top2, bottom2}}) {
            o << "<rect class=\"poor\" x=\"" << px((a + x(f[k[j]])) / 2) << "\" y=\"" << t << "\" width=\"" << px((b - a) / 2)
              << "\" height=\"" << bt - t << "\" fill=\"#eeeeee\"/>\n";
        }
    }
    detail::axes_and_grid(o, x, y1, y2, top1, bottom1, top2, bottom2, left, right);
    // The gap between the curves, shaded.
    o << "<polygon id=\"deviation\" fill=\"#f4b183\" fill-opacity=\"0.6\" stroke=\"none\" points=\"";
    for (std::size_t i : k) o << px(x(f[i])) << ',' << zy(c.measured.impedance[i]) << ' ';
    for (auto it = k.rbegin(); it != k.rend(); ++it) o << px(x(f[*it])) << ',' << zy(c.predicted[*it]) << ' ';
    o << "\"/>\n";
    const auto curve = [&](const char* id, const char* colour, const char* dash, const std::vector<std::complex<double>>& z, bool phase) {
        o << "<polyline id=\"" << id << "\" fill=\"none\" stroke=\"" << colour << "\" stroke-width=\"2\"" << dash << " points=\"";
        for (std::size_t i : k) o << px(x(f[i])) << ',' << (phase ? ph(z[i]) : zy(z[i])) << ' ';
        o << "\"/>\n";
    };
    curve("measured", "#000000", "", c.measured.impedance, false);
    curve("predicted", "#0050a0", " stroke-dasharray=\"6 4\"", c.predicted, false);
    curve("measured-phase", "#000000", "", c.measured.impedance, true);
    curve("predicted-phase", "#0050a0", " stroke-dasharray=\"6 4\"", c.predicted, true);
    if (c.fit) {
        curve("fitted", "#2e8b57", " stroke-dasharray=\"2 3\"", c.fit->impedance, false);
        curve("fitted-phase", "#2e8b57", " stroke-dasharray=\"2 3\"", c.fit->impedance, true);
    }
    const double lx = left + 12, ly = top1 + 34;
    o << "<g id=\"legend\">\n<line x1=\"" << lx << "\" y1=\"" << ly << "\" x2=\"" << lx + 26 << "\" y2=\"" << ly
      << "\" stroke=\"#000000\" stroke-width=\"2\"/><text x=\"" << lx + 32 << "\" y=\"" << ly + 4 << "\">measured</text>\n";
    o << "<line x1=\"" << lx << "\" y1=\"" << ly + 18 << "\" x2=\"" << lx + 26 << "\" y2=\"" << ly + 18
      << "\" stroke=\"#0050a0\" stroke-width=\"2\" stroke-dasharray=\"6 4\"/><text x=\"" << lx + 32 << "\" y=\"" << ly + 22
      << "\">predicted, " << detail::xml_escape(choice_name(c.model)) << " model</text>\n";
    o << "<rect x=\"" << lx << "\" y=\"" << ly + 30 << "\" width=\"26\" height=\"10\" fill=\"#eeeeee\"/><text x=\"" << lx + 32
      << "\" y=\"" << ly + 40 << "\">poorly measured in this arrangement</text>\n";
    if (c.fit) {
        o << "<line x1=\"" << lx << "\" y1=\"" << ly + 54 << "\" x2=\"" << lx + 26 << "\" y2=\"" << ly + 54
          << "\" stroke=\"#2e8b57\" stroke-width=\"2\" stroke-dasharray=\"2 3\"/><text x=\"" << lx + 32 << "\" y=\"" << ly + 58
          << "\">fitted (bench terms)</text>\n";
    }
    o << "</g>\n</svg>\n";
    return o.str();
}

}  // namespace libcoil

