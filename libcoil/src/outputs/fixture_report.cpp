#include "libcoil/outputs/fixture_report.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>

#include <nlohmann/json.hpp>

#include "outputs/json_text.hpp"

#include "core/text_format.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/version.hpp"
#include "outputs/svg_axes.hpp"

namespace libcoil {

namespace {

using detail::pad;
using detail::significant;

std::string deviation_words(double d, bool in_db) {
    return in_db ? (d >= 0 ? "+" : "") + detail::fixed(d, 2) + " dB" : (d >= 0 ? "+" : "") + detail::fixed(100 * d, 1) + " %";
}

std::string hz(double f) { return format_quantity(f, Dimension::frequency); }

const char* const matrix_names[] = {"z11", "z12", "z21", "z22"};

}  // namespace

std::string fixture_text_report(const FixtureResult& r) {
    std::ostringstream o;
    o << "libcoil " << version << " \u2014 fixture" << (r.title.empty() ? "" : ": " + r.title) << "\n\n";
    o << "  " << r.frequency.size() << " frequencies, " << hz(r.frequency.front()) << " to " << hz(r.frequency.back()) << "; ports:";
    for (const auto& p : r.ports) o << " " << p.name << " (" << p.from << "\u2013" << p.to << ", " << format_quantity(p.reference, Dimension::resistance) << ")";
    o << "\n";
    for (const auto& c : r.coils) {
        o << "  coil " << c.part << ": nominal " << format_quantity(c.nominal_inductance, Dimension::inductance) << ", self-resonance as mounted "
          << hz(c.self_resonance) << " (" << c.model << " model; " << c.source << ")\n";
    }
    if (r.verdict) {
        const FixtureVerdict& v = *r.verdict;
        o << "\nPort " << r.ports[0].name << " against its reference, " << hz(v.band_low) << " to " << hz(v.band_high) << ": "
          << (v.pass ? "PASS" : "FAIL") << " (tolerance \u00b1" << (v.in_db ? detail::fixed(v.tolerance, 2) + " dB" : significant(100 * v.tolerance, 3) + " %") << ")\n";
        o << "  worst deviation " << deviation_words(v.worst_deviation, v.in_db) << " at " << hz(v.worst_frequency) << "\n";
        if (v.first_failure) o << "  first outside the tolerance at " << hz(*v.first_failure) << "\n";
        if (!v.dominant_part.empty()) {
            o << "  there, making " << v.dominant_part << " ideal alone removes " << significant(100 * v.dominant_share, 3) << " % of the deviation\n";
        }
    }
    o << "\n  " << pad("frequency", 13) << pad("|Z| " + r.ports[0].name, 16) << pad("phase", 10) << (r.verdict ? "deviation" : "") << "\n";
    const std::size_t n = r.frequency.size(), step = std::max<std::size_t>(1, n / 12);
    for (std::size_t k = 0; k < n; k += step) {
        const auto z = r.impedance[k][0];
        o << "  " << pad(hz(r.frequency[k]), 13) << pad(format_quantity(std::abs(z), Dimension::resistance), 16)
          << pad(detail::fixed(std::arg(z) * 180 / M_PI, 1) + "\u00b0", 10) << (r.verdict ? deviation_words(r.deviation[k], r.verdict->in_db) : "") << "\n";
    }
    if (!r.notes.empty()) {
        o << "\nNotes\n";
        for (const auto& s : r.notes) o << "  - " << s << "\n";
    }
    return o.str();
}

std::string fixture_json_report(const FixtureResult& r) {
    nlohmann::ordered_json j;
    j["libcoil_version"] = version;
    j["title"] = r.title;
    j["ports"] = nlohmann::ordered_json::array();
    const std::size_t m = r.ports.size();
    for (std::size_t p = 0; p < m; ++p) {
        nlohmann::ordered_json port{{"name", r.ports[p].name}, {"between", {r.ports[p].from, r.ports[p].to}}, {"reference_ohm", r.ports[p].reference}};
        std::vector<double> re, im;
        for (const auto& z : r.impedance) {
            re.push_back(z[p * m + p].real());
            im.push_back(z[p * m + p].imag());
        }
        port["impedance"] = {{"frequency_Hz", r.frequency}, {"real_ohm", re}, {"imag_ohm", im}};
        j["ports"].push_back(port);
    }
    if (m == 2) {
        for (std::size_t e = 0; e < 4; ++e) {
            std::vector<double> re, im;
            for (const auto& z : r.impedance) {
                re.push_back(z[e].real());
                im.push_back(z[e].imag());
            }
            j["z_matrix"][matrix_names[e]] = {{"real_ohm", re}, {"imag_ohm", im}};
        }
    }
    j["coils"] = nlohmann::ordered_json::array();
    for (const auto& c : r.coils) {
        j["coils"].push_back({{"part", c.part}, {"source", c.source}, {"nominal_inductance_H", c.nominal_inductance},
                              {"self_resonance_Hz", c.self_resonance}, {"model", c.model}});
    }
    if (r.verdict) {
        const FixtureVerdict& v = *r.verdict;
        std::vector<double> re, im;
        for (const auto& z : r.reference) {
            re.push_back(z.real());
            im.push_back(z.imag());
        }
        j["reference"] = {{"real_ohm", re}, {"imag_ohm", im}};
        j["deviation"] = r.deviation;
        j["deviation_unit"] = v.in_db ? "dB" : "fraction";
        j["verdict"] = {{"pass", v.pass}, {"worst_deviation", v.worst_deviation}, {"worst_frequency_Hz", v.worst_frequency},
                        {"first_failure_Hz", v.first_failure ? nlohmann::ordered_json(*v.first_failure) : nlohmann::ordered_json(nullptr)},
                        {"tolerance", v.tolerance}, {"band_Hz", {v.band_low, v.band_high}},
                        {"dominant_part", v.dominant_part}, {"dominant_share", v.dominant_share}};
    }
    j["notes"] = r.notes;
    return detail::json_text(j, 1);
}

std::string fixture_csv(const FixtureResult& r) {
    std::ostringstream o;
    o.precision(10);
    const std::size_t m = r.ports.size();
    o << "frequency [Hz]";
    for (std::size_t e = 0; e < m * m; ++e) {
        const std::string n = m == 1 ? "Z " + r.ports[0].name : matrix_names[e];
        o << "," << n << " real [ohm]," << n << " imag [ohm]";
    }
    if (r.verdict) o << ",reference real [ohm],reference imag [ohm],deviation" << (r.verdict->in_db ? " [dB]" : "");
    o << "\n";
    for (std::size_t k = 0; k < r.frequency.size(); ++k) {
        o << r.frequency[k];
        for (const auto& z : r.impedance[k]) o << ',' << z.real() << ',' << z.imag();
        if (r.verdict) o << ',' << r.reference[k].real() << ',' << r.reference[k].imag() << ',' << r.deviation[k];
        o << "\n";
    }
    return o.str();
}

std::string fixture_touchstone(const FixtureResult& r) {
    std::ostringstream o;
    o.precision(17);
    o << "! libcoil " << version << " fixture" << (r.title.empty() ? "" : ": " + r.title) << "\n";
    const double z0 = r.ports[0].reference;
    if (r.ports.size() == 2 && r.ports[1].reference != z0) {
        throw InputError("ports[1].reference", "a Touchstone 1.x file has one reference for both ports; these differ");
    }
    o << "# Hz S RI R " << z0 << "\n";
    for (std::size_t k = 0; k < r.frequency.size(); ++k) {
        const auto s = r.s_parameters(k);
        o << r.frequency[k];
        // Touchstone 1.x order for two ports: 11 21 12 22.
        const std::size_t order2[] = {0, 2, 1, 3};
        for (std::size_t e = 0; e < s.size(); ++e) {
            const auto v = s[s.size() == 4 ? order2[e] : e];
            o << ' ' << v.real() << ' ' << v.imag();
        }
        o << "\n";
    }
    return o.str();
}

std::string fixture_svg(const FixtureResult& r) {
    using detail::px;
    const auto& f = r.frequency;
    if (f.size() < 2) throw InputError("frequencies", "the picture needs two or more frequencies");
    double lo = INFINITY, hi = 0;
    const double tol_hi = r.verdict ? (r.verdict->in_db ? std::pow(10, r.verdict->tolerance / 20) : 1 + r.verdict->tolerance) : 1;
    for (std::size_t k = 0; k < f.size(); ++k) {
        for (double z : {std::abs(r.impedance[k][0]), r.reference.empty() ? 0.0 : std::abs(r.reference[k]) * tol_hi}) {
            if (z > 0) lo = std::min(lo, z);
            hi = std::max(hi, z);
        }
    }
    lo = std::pow(10, std::floor(std::log10(lo / tol_hi)));
    hi = std::max(std::pow(10, std::ceil(std::log10(hi))), 10 * lo);
    const double W = 900, H = 580, left = 80, right = 860, top1 = 50, bottom1 = 330, top2 = 370, bottom2 = 520;
    const detail::LogAxis x{f.front(), f.back(), left, right};
    const detail::LogAxis y1{lo, hi, bottom1, top1};
    const detail::LinAxis y2{-90, 90, bottom2, top2};
    std::ostringstream o;
    o << "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << W << "\" height=\"" << H << "\" viewBox=\"0 0 " << W << ' ' << H
      << "\" font-family=\"sans-serif\" font-size=\"12\">\n<title>" << detail::xml_escape(r.title) << "</title>\n";
    o << "<rect width=\"100%\" height=\"100%\" fill=\"white\"/>\n";
    o << "<text x=\"" << left << "\" y=\"28\" font-size=\"15\" font-weight=\"bold\">port " << detail::xml_escape(r.ports[0].name)
      << (r.title.empty() ? "" : ": " + detail::xml_escape(r.title)) << "</text>\n";
    if (r.verdict) {
        const double a = x(std::clamp(r.verdict->band_low, f.front(), f.back())), b = x(std::clamp(r.verdict->band_high, f.front(), f.back()));
        o << "<rect class=\"band\" x=\"" << px(a) << "\" y=\"" << top1 << "\" width=\"" << px(b - a) << "\" height=\"" << bottom1 - top1
          << "\" fill=\"#eef5ff\"/>\n";
    }
    detail::axes_and_grid(o, x, y1, y2, top1, bottom1, top2, bottom2, left, right);
    const auto clampz = [&](double z) { return px(y1(std::clamp(z, lo, hi))); };
    if (r.verdict) {
        const double tol_lo = r.verdict->in_db ? std::pow(10, -r.verdict->tolerance / 20) : std::max(1e-3, 1 - r.verdict->tolerance);
        o << "<polygon id=\"tolerance\" fill=\"#c8e6c9\" fill-opacity=\"0.7\" stroke=\"none\" points=\"";
        for (std::size_t k = 0; k < f.size(); ++k) o << px(x(f[k])) << ',' << clampz(std::abs(r.reference[k]) * tol_hi) << ' ';
        for (std::size_t k = f.size(); k-- > 0;) o << px(x(f[k])) << ',' << clampz(std::abs(r.reference[k]) * tol_lo) << ' ';
        o << "\"/>\n<polyline id=\"reference\" fill=\"none\" stroke=\"#2e7d32\" stroke-width=\"1.5\" stroke-dasharray=\"6 4\" points=\"";
        for (std::size_t k = 0; k < f.size(); ++k) o << px(x(f[k])) << ',' << clampz(std::abs(r.reference[k])) << ' ';
        o << "\"/>\n";
    }
    o << "<polyline id=\"impedance\" fill=\"none\" stroke=\"#0050a0\" stroke-width=\"2\" points=\"";
    for (std::size_t k = 0; k < f.size(); ++k) o << px(x(f[k])) << ',' << clampz(std::abs(r.impedance[k][0])) << ' ';
    o << "\"/>\n<polyline id=\"phase\" fill=\"none\" stroke=\"#0050a0\" stroke-width=\"2\" points=\"";
    for (std::size_t k = 0; k < f.size(); ++k) o << px(x(f[k])) << ',' << px(y2(std::arg(r.impedance[k][0]) * 180 / M_PI)) << ' ';
    o << "\"/>\n</svg>\n";
    return o.str();
}

}  // namespace libcoil
