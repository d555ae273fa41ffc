#include "libcoil/outputs/coupling_report.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>

#include <nlohmann/json.hpp>

#include "outputs/json_text.hpp"

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/version.hpp"
#include "core/text_format.hpp"

namespace libcoil {

namespace {

using detail::fixed;
using detail::significant;

}  // namespace

std::string coupling_text_report(const CouplingStudy& s, const std::vector<std::string>& files) {
    std::ostringstream o;
    o << "libcoil " << version << " \u2014 coil couple\n";
    o << "A: " << s.name_a << "\nB: " << s.name_b << "\n\n";
    o << "Arrangement: " << arrangement_name(s.arrangement) << ", centres " << format_quantity(s.distance, Dimension::length) << " apart";
    if (s.axial_offset != 0) o << ", B offset " << format_quantity(s.axial_offset, Dimension::length) << " along the axes";
    o << "\n  L_A " << format_quantity(s.at.inductance_a, Dimension::inductance) << ", L_B " << format_quantity(s.at.inductance_b, Dimension::inductance)
      << " (bare)\n  M   " << format_quantity(s.at.mutual, Dimension::inductance) << " (the far-field dipole estimate: "
      << format_quantity(s.dipole_mutual, Dimension::inductance) << ")\n  k   " << significant(s.at.coefficient, 4) << " (bare coils)\n";
    if (!s.shield_a.empty()) o << "  A in its " << s.shield_a << ": L " << format_quantity(s.mounted_inductance_a, Dimension::inductance) << "\n";
    if (!s.shield_b.empty()) o << "  B in its " << s.shield_b << ": L " << format_quantity(s.mounted_inductance_b, Dimension::inductance) << "\n";
    if (!s.at_frequency.empty()) {
        const bool shielded = !s.shield_a.empty() || !s.shield_b.empty();
        o << "\nCrosstalk, A driven from " << significant(s.source_resistance, 4) << " \u03a9, B loaded by " << significant(s.load_resistance, 4)
          << " \u03a9\n  frequency      V_B open / I_A    |S21|" << (shielded ? "      shields    unshielded |S21|" : "") << "\n";
        for (const auto& row : s.at_frequency) {
            const Crosstalk& x = row.crosstalk;
            o << "  " << detail::pad(format_quantity(x.frequency, Dimension::frequency), 15)
              << detail::pad(x.transfer_impedance >= 1e-12 ? format_quantity(x.transfer_impedance, Dimension::resistance)
                                                           : significant(x.transfer_impedance, 3) + " \u03a9", 18)
              << detail::pad(fixed(x.transfer_db, 1) + " dB", 12);
            if (shielded) o << detail::pad(fixed(row.shielding_db, 1) + " dB", 11) << fixed(row.unshielded_db, 1) << " dB";
            o << "\n";
        }
    }
    if (!s.sweep.empty()) {
        o << "\nCoupling against distance\n  distance       M              k\n";
        for (const auto& p : s.sweep) {
            o << "  " << detail::pad(format_quantity(p.distance, Dimension::length), 15) << detail::pad(format_quantity(p.mutual, Dimension::inductance), 15)
              << significant(p.coefficient, 4) << "\n";
        }
    }
    detail::list_section(o, "Notes", s.notes, "-");
    detail::written_section(o, files);
    return o.str();
}

std::string coupling_json_report(const CouplingStudy& s, const std::vector<std::string>& files) {
    nlohmann::ordered_json j;
    j["libcoil_version"] = version;
    j["coil_a"] = s.name_a;
    j["coil_b"] = s.name_b;
    j["arrangement"] = arrangement_name(s.arrangement);
    j["distance_m"] = s.distance;
    j["axial_offset_m"] = s.axial_offset;
    j["inductance_a_H"] = s.at.inductance_a;
    j["inductance_b_H"] = s.at.inductance_b;
    j["mutual_inductance_H"] = s.at.mutual;
    j["dipole_mutual_inductance_H"] = s.dipole_mutual;
    j["coupling_coefficient"] = s.at.coefficient;
    j["source_resistance_ohm"] = s.source_resistance;
    j["load_resistance_ohm"] = s.load_resistance;
    j["shield_a"] = s.shield_a.empty() ? nlohmann::ordered_json(nullptr) : nlohmann::ordered_json(s.shield_a);
    j["shield_b"] = s.shield_b.empty() ? nlohmann::ordered_json(nullptr) : nlohmann::ordered_json(s.shield_b);
    j["mounted_inductance_a_H"] = s.mounted_inductance_a;
    j["mounted_inductance_b_H"] = s.mounted_inductance_b;
    auto xs = nlohmann::ordered_json::array();
    for (const auto& row : s.at_frequency) {
        const Crosstalk& x = row.crosstalk;
        xs.push_back({{"frequency_Hz", x.frequency}, {"transfer_impedance_ohm", x.transfer_impedance}, {"transfer_dB", x.transfer_db},
                      {"shielding_dB", row.shielding_db}, {"theoretical_shielding_dB", row.theoretical_shielding_db},
                      {"unshielded_transfer_dB", row.unshielded_db}, {"resistance_a_ohm", row.resistance_a},
                      {"inductance_a_H", row.inductance_a}, {"resistance_b_ohm", row.resistance_b}, {"inductance_b_H", row.inductance_b}});
    }
    j["crosstalk"] = xs;
    auto sw = nlohmann::ordered_json::array();
    for (const auto& p : s.sweep) sw.push_back({{"distance_m", p.distance}, {"mutual_inductance_H", p.mutual}, {"coupling_coefficient", p.coefficient}});
    j["sweep"] = sw;
    j["files"] = files;
    j["notes"] = s.notes;
    return detail::json_text(j, 2);
}

std::string coupling_svg(const CouplingStudy& s) {
    if (s.sweep.size() < 2) throw InputError("sweep_distance", "the picture needs two or more distances");
    const double W = 720, H = 480, left = 80, right = W - 30, top = 84, bottom = H - 60;
    double d0 = s.sweep.front().distance, d1 = s.sweep.back().distance;
    double k0 = INFINITY, k1 = 0;
    for (const auto& p : s.sweep) {
        k0 = std::min(k0, std::fabs(p.coefficient));
        k1 = std::max(k1, std::fabs(p.coefficient));
    }
    k0 = std::max(k0, 1e-12);
    const double lk0 = std::floor(std::log10(k0)), lk1 = std::ceil(std::log10(k1));
    const auto X = [&](double d) { return left + (right - left) * std::log(d / d0) / std::log(d1 / d0); };
    const auto Y = [&](double k) { return bottom - (bottom - top) * (std::log10(std::max(k, 1e-300)) - lk0) / std::max(1.0, lk1 - lk0); };
    std::ostringstream o;
    o << "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << W << "\" height=\"" << H << "\" viewBox=\"0 0 " << W << " " << H
      << "\" font-family=\"sans-serif\" font-size=\"12\">\n<rect width=\"" << W << "\" height=\"" << H << "\" fill=\"white\"/>\n";
    o << "<text x=\"" << left << "\" y=\"26\" font-size=\"14\" font-weight=\"bold\">A: " << detail::xml_escape(s.name_a)
      << "</text>\n<text x=\"" << left << "\" y=\"44\" font-size=\"14\" font-weight=\"bold\">B: " << detail::xml_escape(s.name_b)
      << "</text>\n<text x=\"" << left << "\" y=\"64\">|k| against centre distance, " << arrangement_name(s.arrangement)
      << "; dashed: the magnetic-dipole far field</text>\n";
    o << "<rect x=\"" << left << "\" y=\"" << top << "\" width=\"" << right - left << "\" height=\"" << bottom - top
      << "\" fill=\"none\" stroke=\"#444\"/>\n";
    for (double e = lk0; e <= lk1; e += 1) {
        o << "<line x1=\"" << left << "\" x2=\"" << right << "\" y1=\"" << fixed(Y(std::pow(10, e)), 2) << "\" y2=\"" << fixed(Y(std::pow(10, e)), 2)
          << "\" stroke=\"#ddd\"/>\n<text x=\"" << left - 8 << "\" y=\"" << fixed(Y(std::pow(10, e)) + 4, 2) << "\" text-anchor=\"end\">1e"
          << static_cast<int>(e) << "</text>\n";
    }
    for (double d : {d0, std::sqrt(d0 * d1), d1}) {
        o << "<text x=\"" << fixed(X(d), 2) << "\" y=\"" << bottom + 18 << "\" text-anchor=\"middle\">"
          << detail::xml_escape(format_quantity(d, Dimension::length, 3)) << "</text>\n";
    }
    o << "<text x=\"" << (left + right) / 2 << "\" y=\"" << H - 18 << "\" text-anchor=\"middle\">centre distance</text>\n";
    o << "<polyline id=\"coupling\" fill=\"none\" stroke=\"#1f5fa8\" stroke-width=\"2\" points=\"";
    for (const auto& p : s.sweep) o << fixed(X(p.distance), 2) << "," << fixed(Y(std::fabs(p.coefficient)), 2) << " ";
    o << "\"/>\n";
    o << "<polyline id=\"dipole\" fill=\"none\" stroke=\"#a33\" stroke-dasharray=\"6 4\" points=\"";
    for (const auto& p : s.sweep) {
        const double k = std::fabs(p.dipole_coefficient);
        if (Y(k) >= top) o << fixed(X(p.distance), 2) << "," << fixed(Y(k), 2) << " ";
    }
    o << "\"/>\n";
    for (const auto& p : s.sweep) {
        o << "<circle r=\"2.5\" fill=\"#1f5fa8\" cx=\"" << fixed(X(p.distance), 2) << "\" cy=\"" << fixed(Y(std::fabs(p.coefficient)), 2)
          << "\" data-distance-m=\"" << significant(p.distance, 9) << "\" data-k=\"" << significant(p.coefficient, 9) << "\"/>\n";
    }
    o << "</svg>\n";
    return o.str();
}

}  // namespace libcoil
