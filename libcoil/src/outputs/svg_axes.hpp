// Internal: the pieces every SVG picture shares (axes, ticks, number formats). Formatting only.
#pragma once

#include <cmath>
#include <string>
#include <vector>

#include "libcoil/core/units.hpp"
#include "core/text_format.hpp"

namespace libcoil::detail {

inline std::string g(double v, int digits) { return significant(v, digits); }
inline std::string px(double v) { return fixed(v, 2); }

// A log axis from lo to hi mapped onto [p0, p1] pixels.
struct LogAxis {
    double lo, hi, p0, p1;
    double operator()(double v) const { return p0 + (p1 - p0) * std::log(v / lo) / std::log(hi / lo); }
};
struct LinAxis {
    double lo, hi, p0, p1;
    double operator()(double v) const { return p0 + (p1 - p0) * (v - lo) / (hi - lo); }
};

// Nice decade ticks 1, 2, 5 x 10^n within [lo, hi]; only decades when the span is wide.
inline std::vector<double> log_ticks(double lo, double hi, bool minor) {
    std::vector<double> t;
    for (double d = std::pow(10, std::floor(std::log10(lo))); d <= hi * 1.0000001; d *= 10) {
        for (double m : minor ? std::vector<double>{1, 2, 5} : std::vector<double>{1}) {
            const double v = d * m;
            if (v >= lo * 0.9999999 && v <= hi * 1.0000001) t.push_back(v);
        }
    }
    return t;
}

// A tick label without trailing zeros: "100 kHz", "1 MΩ", "2.5 MHz".
inline std::string tick_label(double v, Dimension d) {
    std::string s = format_quantity(v, d, 3);
    const auto space = s.find(' ');
    std::string num = s.substr(0, space), unit = space == std::string::npos ? "" : s.substr(space);
    if (num.find('.') != std::string::npos) {
        while (!num.empty() && num.back() == '0') num.pop_back();
        if (!num.empty() && num.back() == '.') num.pop_back();
    }
    return num + unit;
}

}  // namespace libcoil::detail
