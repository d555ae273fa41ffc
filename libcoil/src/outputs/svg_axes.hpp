// Internal: the pieces every SVG picture shares (axes, ticks, number formats). Formatting only.
#pragma once

#include <cmath>
#include <ostream>
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

// The two panels' grid, frames, tick labels and axis titles: |Z| on a log axis above, the phase of Z from
// -90 to 90 degrees below, frequency on a log axis under both.
inline void axes_and_grid(std::ostream& o, const LogAxis& x, const LogAxis& y1, const LinAxis& y2, double top1, double bottom1,
                          double top2, double bottom2, double left, double right) {
    o << "<g stroke=\"#cccccc\" stroke-width=\"0.6\">\n";
    for (double f : log_ticks(x.lo, x.hi, false)) {
        o << "<line x1=\"" << px(x(f)) << "\" y1=\"" << top1 << "\" x2=\"" << px(x(f)) << "\" y2=\"" << bottom1 << "\"/>";
        o << "<line x1=\"" << px(x(f)) << "\" y1=\"" << top2 << "\" x2=\"" << px(x(f)) << "\" y2=\"" << bottom2 << "\"/>\n";
    }
    for (double z : log_ticks(y1.lo, y1.hi, false)) {
        o << "<line x1=\"" << left << "\" y1=\"" << px(y1(z)) << "\" x2=\"" << right << "\" y2=\"" << px(y1(z)) << "\"/>\n";
    }
    for (double ph : {-90.0, -45.0, 0.0, 45.0, 90.0}) {
        o << "<line x1=\"" << left << "\" y1=\"" << px(y2(ph)) << "\" x2=\"" << right << "\" y2=\"" << px(y2(ph)) << "\"/>\n";
    }
    o << "</g>\n<g fill=\"none\" stroke=\"black\">\n";
    o << "<rect x=\"" << left << "\" y=\"" << top1 << "\" width=\"" << right - left << "\" height=\"" << bottom1 - top1 << "\"/>\n";
    o << "<rect x=\"" << left << "\" y=\"" << top2 << "\" width=\"" << right - left << "\" height=\"" << bottom2 - top2 << "\"/>\n";
    o << "</g>\n<g text-anchor=\"middle\">\n";
    for (double f : log_ticks(x.lo, x.hi, false)) {
        o << "<text x=\"" << px(x(f)) << "\" y=\"" << bottom2 + 16 << "\">" << detail::xml_escape(tick_label(f, Dimension::frequency))
          << "</text>\n";
    }
    o << "<text x=\"" << (left + right) / 2 << "\" y=\"" << bottom2 + 36 << "\">frequency</text>\n</g>\n";
    o << "<g text-anchor=\"end\">\n";
    for (double z : log_ticks(y1.lo, y1.hi, false)) {
        o << "<text x=\"" << left - 6 << "\" y=\"" << px(y1(z) + 4) << "\">" << detail::xml_escape(tick_label(z, Dimension::resistance))
          << "</text>\n";
    }
    for (double ph : {-90.0, -45.0, 0.0, 45.0, 90.0}) {
        o << "<text x=\"" << left - 6 << "\" y=\"" << px(y2(ph) + 4) << "\">" << g(ph, 3) << "\u00b0</text>\n";
    }
    o << "</g>\n";
    o << "<text x=\"18\" y=\"" << (top1 + bottom1) / 2 << "\" transform=\"rotate(-90 18 " << (top1 + bottom1) / 2
      << ")\" text-anchor=\"middle\">|Z|</text>\n";
    o << "<text x=\"18\" y=\"" << (top2 + bottom2) / 2 << "\" transform=\"rotate(-90 18 " << (top2 + bottom2) / 2
      << ")\" text-anchor=\"middle\">phase of Z</text>\n";
}

}  // namespace libcoil::detail
