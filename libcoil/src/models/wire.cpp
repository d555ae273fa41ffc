#include "libcoil/models/wire.hpp"

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdio>
#include <string>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "models/data_tables.hpp"

namespace libcoil {

int parse_awg(std::string_view text, std::string_view field) {
    std::string s;
    for (char c : text) {
        if (!std::isspace(static_cast<unsigned char>(c))) s += static_cast<char>(std::toupper(static_cast<unsigned char>(c)));
    }
    const auto bad = [&](const std::string& why) {
        return InputError(std::string(field), "\"" + std::string(text) + "\": " + why +
                                                  "; expected a gauge such as \"AWG 18\" or \"AWG 4/0\"");
    };
    if (s.rfind("AWG", 0) == 0) {
        s.erase(0, 3);
    } else if (s.size() > 3 && s.compare(s.size() - 3, 3, "AWG") == 0) {
        s.erase(s.size() - 3);
    } else {
        throw bad("not an AWG gauge");
    }
    if (s.empty()) throw bad("gauge number missing");
    int gauge = 0;
    if (s.find_first_not_of('0') == std::string::npos && s.size() >= 2) {
        gauge = 1 - static_cast<int>(s.size());  // "00" is -1, "0000" is -3
    } else if (s.size() == 3 && s[1] == '/' && s[2] == '0' && s[0] >= '1' && s[0] <= '4') {
        gauge = 1 - (s[0] - '0');  // "2/0" is -1, "4/0" is -3
    } else if (std::all_of(s.begin(), s.end(), [](char c) { return std::isdigit(static_cast<unsigned char>(c)); })) {
        if (s.size() > 3) throw bad("gauge outside AWG 4/0 .. AWG 56");  // (and beyond what an int holds)
        gauge = std::stoi(s);
    } else {
        throw bad("gauge number not understood");
    }
    if (gauge < -3 || gauge > 56) throw bad("gauge outside AWG 4/0 .. AWG 56");
    return gauge;
}

int parse_enamel_grade(std::string_view text, std::string_view field) {
    std::string s;
    for (char c : text) s += static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    if (s.rfind("grade", 0) == 0) s.erase(0, 5);
    while (!s.empty() && s.front() == ' ') s.erase(0, 1);
    if (s == "1" || s == "2" || s == "3") return s[0] - '0';
    throw InputError(std::string(field), "\"" + std::string(text) +
                                             "\": expected an enamel grade such as \"grade 2\" (1, 2 or 3, IEC 60317)");
}

Wire make_wire(const WireChoice& c, std::string_view prefix) {
    const auto field = [&](const char* name) { return std::string(prefix) + name; };
    if (c.gauge.has_value() == c.diameter.has_value()) {
        throw InputError(field("diameter"), c.gauge ? "give either diameter or gauge, not both" : "missing; give diameter or gauge");
    }
    if (c.insulation && c.enamel_grade) throw InputError(field("insulation"), "give either insulation or enamel, not both");
    Wire w;
    if (c.gauge) {
        w.bare_diameter = awg_diameter(*c.gauge);
        w.label = awg_label(*c.gauge);
    } else {
        w.bare_diameter = require_positive(field("diameter"), *c.diameter);
        // AWG 4/0 is 11.7 mm; past 20 mm a conductor is a rod or a tube, not a wire one winds.
        if (w.bare_diameter > 20e-3) throw InputError(field("diameter"), format_value(w.bare_diameter * 1e3) + " mm is beyond 20 mm; expected a winding wire");
        char buf[32];
        std::snprintf(buf, sizeof buf, "%.4g mm wire", w.bare_diameter * 1e3);
        w.label = buf;
    }
    if (c.insulation) {
        w.insulation = require_non_negative(field("insulation"), *c.insulation);
    } else if (c.enamel_grade) {
        w.insulation = enamel_build(w.bare_diameter, *c.enamel_grade, field("enamel"));
        w.label += ", enamel grade " + std::to_string(*c.enamel_grade);
    }
    return w;
}

double awg_diameter(int gauge) {
    if (gauge < -3 || gauge > 56) {
        throw InputError("gauge", std::to_string(gauge) + " is outside -3 (AWG 4/0) .. 56");
    }
    // ASTM B258: d = 0.005 in * 92^((36 - n) / 39).
    return 0.005 * inch * std::pow(92.0, (36.0 - gauge) / 39.0);
}

std::string awg_label(int gauge) {
    if (gauge <= 0) return "AWG " + std::to_string(1 - gauge) + "/0";
    return "AWG " + std::to_string(gauge);
}

double enamel_build(double bare_diameter, int grade, std::string_view field) {
    require_positive("wire.diameter", bare_diameter);
    const auto& rows = detail::tables().enamel;
    if (grade < 1 || grade > 3) {
        throw InputError(std::string(field), "grade " + std::to_string(grade) + " is not 1, 2 or 3 (IEC 60317)");
    }
    if (rows.empty()) throw InputError(std::string(field), "the enamel table in data/wires.yaml is empty");
    if (bare_diameter < rows.front().bare_diameter * (1 - 1e-9) ||
        bare_diameter > rows.back().bare_diameter * (1 + 1e-9)) {
        throw InputError(std::string(field), "no IEC 60317 grade data for a bare diameter of " +
                                                 format_value(bare_diameter * 1e3) + " mm (table spans " +
                                                 format_value(rows.front().bare_diameter * 1e3) + " to " +
                                                 format_value(rows.back().bare_diameter * 1e3) +
                                                 " mm); give wire.insulation instead");
    }
    // Interpolate the radial build linearly in log(bare diameter) between table rows.
    auto hi = std::lower_bound(rows.begin(), rows.end(), bare_diameter,
                               [](const detail::EnamelRow& r, double d) { return r.bare_diameter < d; });
    if (hi == rows.begin()) return rows.front().build[grade - 1];
    if (hi == rows.end()) return rows.back().build[grade - 1];
    const auto lo = hi - 1;
    const double t = std::log(bare_diameter / lo->bare_diameter) / std::log(hi->bare_diameter / lo->bare_diameter);
    return lo->build[grade - 1] + t * (hi->build[grade - 1] - lo->build[grade - 1]);
}

const std::vector<double>& metric_wire_diameters() { return detail::tables().metric_diameters; }

}  // namespace libcoil
