#include "libcoil/outputs/sweep_output.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <sstream>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "core/text_format.hpp"

namespace libcoil {

namespace {

std::string g(double v, int digits) { return detail::significant(v, digits); }
std::string px(double v) { return detail::fixed(v, 2); }

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
std::vector<double> log_ticks(double lo, double hi, bool minor) {
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
std::string tick_label(double v, Dimension d) {
    std::string s = format_quantity(v, d, 3);
    const auto space = s.find(' ');
    std::string num = s.substr(0, space), unit = space == std::string::npos ? "" : s.substr(space);
    if (num.find('.') != std::string::npos) {
        while (!num.empty() && num.back() == '0') num.pop_back();
        if (!num.empty() && num.back() == '.') num.pop_back();
    }
    return num + unit;
}

// Touchstone files are ASCII: unit symbols are spelled out.
std::string ascii(const std::string& s) {
    std::string o;
    for (std::size_t i = 0; i < s.size();) {
        const auto starts = [&](const char* t) { return s.compare(i, std::char_traits<char>::length(t), t) == 0; };
        if (starts("\u00b5")) { o += "u"; i += 2; }
        else if (starts("\u00b0C")) { o += "degC"; i += 3; }
        else if (starts("\u03a9")) { o += "ohm"; i += 2; }
        else if (starts("\u2014") || starts("\u2013")) { o += "-"; i += 3; }
        else if (static_cast<unsigned char>(s[i]) < 0x80) { o += s[i]; ++i; }
        else { o += '?'; ++i; }
    }
    return o;
}

}  // namespace

std::string sweep_csv(const std::vector<ImpedancePoint>& points) {
    std::ostringstream o;
    o << "frequency_Hz,impedance_magnitude_ohm,phase_deg,resistance_ohm,reactance_ohm,apparent_inductance_H,q_factor\n";
    for (const auto& p : points) {
        o << g(p.frequency, 15) << ',' << g(p.magnitude(), 15) << ',' << g(p.phase() * 180 / pi, 15) << ','
          << g(p.impedance.real(), 15) << ',' << g(p.impedance.imag(), 15) << ',' << g(p.apparent_inductance, 15) << ','
          << g(p.q_factor, 15) << '\n';
    }
    return o.str();
}

std::string touchstone_s1p(const std::vector<ImpedancePoint>& points, const std::vector<std::string>& comments,
                           double r0) {
    require_positive("reference_impedance", r0);
    std::ostringstream o;
    for (const auto& c : comments) o << "! " << ascii(c) << "\n";
    o << "# Hz S RI R " << g(r0, 15) << "\n";
    for (const auto& p : points) {
        const auto s = (p.impedance - r0) / (p.impedance + r0);
        o << g(p.frequency, 17) << ' ' << g(s.real(), 17) << ' ' << g(s.imag(), 17) << '\n';
    }
    return o.str();
}

std::string impedance_svg(const std::vector<ImpedancePoint>& all, const SweepPicture& pic) {
    std::vector<ImpedancePoint> pts;
    for (const auto& p : all) {
        if (p.frequency > 0) pts.push_back(p);
    }
    if (pts.size() < 2) throw InputError("--from", "the picture needs two or more frequencies above 0 Hz");
    const double f_lo = pts.front().frequency, f_hi = pts.back().frequency;
    double z_lo = pts.front().magnitude(), z_hi = z_lo;
    for (const auto& p : pts) {
        z_lo = std::min(z_lo, p.magnitude());
        z_hi = std::max(z_hi, p.magnitude());
        if (pic.inductance > 0) {
            const double ideal = 2 * pi * p.frequency * pic.inductance;
            z_lo = std::min(z_lo, ideal);
            z_hi = std::max(z_hi, ideal);
        }
    }
    z_lo = std::pow(10, std::floor(std::log10(z_lo)));
    z_hi = std::pow(10, std::ceil(std::log10(z_hi)));
    if (z_hi <= z_lo) z_hi = z_lo * 10;

    const double W = 900, left = 80, right = 860;
    const double top1 = 50, bottom1 = 330, top2 = 370, bottom2 = 520, H = 580;
    const LogAxis x{f_lo, f_hi, left, right};
    const LogAxis y1{z_lo, z_hi, bottom1, top1};
    const LinAxis y2{-90, 90, bottom2, top2};

    std::ostringstream o;
    o << "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" << W << "\" height=\"" << H << "\" viewBox=\"0 0 " << W
      << ' ' << H << "\" font-family=\"sans-serif\" font-size=\"12\"";
    o << " data-x-min-hz=\"" << g(f_lo, 17) << "\" data-x-max-hz=\"" << g(f_hi, 17) << "\" data-x-left=\"" << left
      << "\" data-x-right=\"" << right << "\" data-z-min-ohm=\"" << g(z_lo, 17) << "\" data-z-max-ohm=\"" << g(z_hi, 17)
      << "\" data-z-top=\"" << top1 << "\" data-z-bottom=\"" << bottom1 << "\">\n";
    o << "<title>" << detail::xml_escape(pic.title) << "</title>\n";
    o << "<rect width=\"100%\" height=\"100%\" fill=\"white\"/>\n";
    o << "<text x=\"" << left << "\" y=\"28\" font-size=\"15\" font-weight=\"bold\">" << detail::xml_escape(pic.title) << "</text>\n";

    // Band shading in both panels.
    if (pic.band_low && pic.band_ceiling) {
        const double b0 = std::clamp(*pic.band_low, f_lo, f_hi), b1 = std::clamp(*pic.band_ceiling, f_lo, f_hi);
        if (b1 > b0) {
            for (const auto& [t, b] : {std::pair{top1, bottom1}, std::pair{top2, bottom2}}) {
                o << "<rect class=\"band\" x=\"" << px(x(b0)) << "\" y=\"" << t << "\" width=\"" << px(x(b1) - x(b0))
                  << "\" height=\"" << b - t << "\" fill=\"#d9ecff\" data-low-hz=\"" << g(*pic.band_low, 17)
                  << "\" data-ceiling-hz=\"" << g(*pic.band_ceiling, 17) << "\"/>\n";
            }
        }
    }
    // Grid and axes.
    o << "<g stroke=\"#cccccc\" stroke-width=\"0.6\">\n";
    for (double f : log_ticks(f_lo, f_hi, false)) {
        o << "<line x1=\"" << px(x(f)) << "\" y1=\"" << top1 << "\" x2=\"" << px(x(f)) << "\" y2=\"" << bottom1 << "\"/>";
        o << "<line x1=\"" << px(x(f)) << "\" y1=\"" << top2 << "\" x2=\"" << px(x(f)) << "\" y2=\"" << bottom2 << "\"/>\n";
    }
    for (double z : log_ticks(z_lo, z_hi, false)) {
        o << "<line x1=\"" << left << "\" y1=\"" << px(y1(z)) << "\" x2=\"" << right << "\" y2=\"" << px(y1(z)) << "\"/>\n";
    }
    for (double ph : {-90.0, -45.0, 0.0, 45.0, 90.0}) {
        o << "<line x1=\"" << left << "\" y1=\"" << px(y2(ph)) << "\" x2=\"" << right << "\" y2=\"" << px(y2(ph)) << "\"/>\n";
    }
    o << "</g>\n<g fill=\"none\" stroke=\"black\">\n";
    o << "<rect x=\"" << left << "\" y=\"" << top1 << "\" width=\"" << right - left << "\" height=\"" << bottom1 - top1 << "\"/>\n";
    o << "<rect x=\"" << left << "\" y=\"" << top2 << "\" width=\"" << right - left << "\" height=\"" << bottom2 - top2 << "\"/>\n";
    o << "</g>\n<g text-anchor=\"middle\">\n";
    for (double f : log_ticks(f_lo, f_hi, false)) {
        o << "<text x=\"" << px(x(f)) << "\" y=\"" << bottom2 + 16 << "\">" << detail::xml_escape(tick_label(f, Dimension::frequency))
          << "</text>\n";
    }
    o << "<text x=\"" << (left + right) / 2 << "\" y=\"" << bottom2 + 36 << "\">frequency</text>\n</g>\n";
    o << "<g text-anchor=\"end\">\n";
    for (double z : log_ticks(z_lo, z_hi, false)) {
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

    // Curves.
    if (pic.inductance > 0) {
        o << "<polyline id=\"ideal\" fill=\"none\" stroke=\"#555555\" stroke-width=\"1.2\" stroke-dasharray=\"6 4\" points=\"";
        for (const auto& p : pts) o << px(x(p.frequency)) << ',' << px(y1(2 * pi * p.frequency * pic.inductance)) << ' ';
        o << "\"/>\n";
    }
    o << "<polyline id=\"impedance\" fill=\"none\" stroke=\"#0050a0\" stroke-width=\"2\" points=\"";
    for (const auto& p : pts) o << px(x(p.frequency)) << ',' << px(y1(std::clamp(p.magnitude(), z_lo, z_hi))) << ' ';
    o << "\"/>\n";
    o << "<polyline id=\"phase\" fill=\"none\" stroke=\"#a03000\" stroke-width=\"2\" points=\"";
    for (const auto& p : pts) o << px(x(p.frequency)) << ',' << px(y2(p.phase() * 180 / pi)) << ' ';
    o << "\"/>\n";

    if (pic.self_resonance >= f_lo && pic.self_resonance <= f_hi) {
        const double xs = x(pic.self_resonance);
        o << "<g id=\"srf\" data-srf-hz=\"" << g(pic.self_resonance, 17) << "\" stroke=\"#c00000\" stroke-width=\"1.2\">\n";
        o << "<line x1=\"" << px(xs) << "\" y1=\"" << top1 << "\" x2=\"" << px(xs) << "\" y2=\"" << bottom1 << "\"/>";
        o << "<line x1=\"" << px(xs) << "\" y1=\"" << top2 << "\" x2=\"" << px(xs) << "\" y2=\"" << bottom2 << "\"/>\n";
        o << "<text x=\"" << px(xs + 4) << "\" y=\"" << top1 + 14 << "\" stroke=\"none\" fill=\"#c00000\">SRF "
          << detail::xml_escape(format_quantity(pic.self_resonance, Dimension::frequency)) << "</text>\n</g>\n";
    }
    // Legend.
    const double lx = left + 12, ly = top1 + 34;
    o << "<g id=\"legend\">\n";
    o << "<line x1=\"" << lx << "\" y1=\"" << ly << "\" x2=\"" << lx + 26 << "\" y2=\"" << ly
      << "\" stroke=\"#0050a0\" stroke-width=\"2\"/><text x=\"" << lx + 32 << "\" y=\"" << ly + 4 << "\">|Z|, "
      << detail::xml_escape(pic.model) << " model</text>\n";
    if (pic.inductance > 0) {
        o << "<line x1=\"" << lx << "\" y1=\"" << ly + 18 << "\" x2=\"" << lx + 26 << "\" y2=\"" << ly + 18
          << "\" stroke=\"#555555\" stroke-dasharray=\"6 4\"/><text x=\"" << lx + 32 << "\" y=\"" << ly + 22
          << "\">ideal \u03c9L, L = " << detail::xml_escape(format_quantity(pic.inductance, Dimension::inductance)) << "</text>\n";
    }
    if (pic.band_low && pic.band_ceiling) {
        o << "<rect x=\"" << lx << "\" y=\"" << ly + 30 << "\" width=\"26\" height=\"10\" fill=\"#d9ecff\"/><text x=\""
          << lx + 32 << "\" y=\"" << ly + 40 << "\">band " << detail::xml_escape(format_quantity(*pic.band_low, Dimension::frequency))
          << " \u2013 " << detail::xml_escape(format_quantity(*pic.band_ceiling, Dimension::frequency)) << "</text>\n";
    }
    o << "</g>\n</svg>\n";
    return o.str();
}

}  // namespace libcoil
