#include "libcoil/outputs/sweep_files.hpp"

#include <algorithm>
#include <sstream>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "outputs/svg_axes.hpp"

namespace libcoil {

using detail::g;
using detail::LinAxis;
using detail::LogAxis;
using detail::log_ticks;
using detail::px;
using detail::tick_label;

std::string impedance_svg(const Sweep& pic) {
    const auto& all = pic.points;
    std::vector<ImpedancePoint> pts;
    for (const auto& p : all) {
        if (p.frequency > 0) pts.push_back(p);
    }
    if (pts.size() < 2) throw InputError("points", "the picture needs two or more frequencies above 0 Hz");
    const double f_lo = pts.front().frequency, f_hi = pts.back().frequency;
    double z_lo = pts.front().magnitude(), z_hi = z_lo;
    for (const auto& p : pts) {
        z_lo = std::min(z_lo, p.magnitude());
        z_hi = std::max(z_hi, p.magnitude());
        if (pic.nominal_inductance > 0) {
            const double ideal = 2 * pi * p.frequency * pic.nominal_inductance;
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
    o << "<title>" << detail::xml_escape(pic.title) << "</title>\n<desc>";
    for (const auto& line : sweep_description(pic)) o << detail::xml_escape(line) << "\n";
    o << "</desc>\n";
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
    detail::axes_and_grid(o, x, y1, y2, top1, bottom1, top2, bottom2, left, right);

    // Curves.
    if (pic.nominal_inductance > 0) {
        o << "<polyline id=\"ideal\" fill=\"none\" stroke=\"#555555\" stroke-width=\"1.2\" stroke-dasharray=\"6 4\" points=\"";
        for (const auto& p : pts) o << px(x(p.frequency)) << ',' << px(y1(2 * pi * p.frequency * pic.nominal_inductance)) << ' ';
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
      << detail::xml_escape(choice_name(pic.model)) << " model</text>\n";
    if (pic.nominal_inductance > 0) {
        o << "<line x1=\"" << lx << "\" y1=\"" << ly + 18 << "\" x2=\"" << lx + 26 << "\" y2=\"" << ly + 18
          << "\" stroke=\"#555555\" stroke-dasharray=\"6 4\"/><text x=\"" << lx + 32 << "\" y=\"" << ly + 22
          << "\">ideal \u03c9L, L = " << detail::xml_escape(format_quantity(pic.nominal_inductance, Dimension::inductance)) << "</text>\n";
    }
    if (pic.band_low && pic.band_ceiling) {
        o << "<rect x=\"" << lx << "\" y=\"" << ly + 30 << "\" width=\"26\" height=\"10\" fill=\"#d9ecff\"/><text x=\""
          << lx + 32 << "\" y=\"" << ly + 40 << "\">band " << detail::xml_escape(format_quantity(*pic.band_low, Dimension::frequency))
          << " \u2013 " << detail::xml_escape(format_quantity(*pic.band_ceiling, Dimension::frequency)) << "</text>\n";
    }
    if (pic.shield) {
        o << "<text id=\"shield\" x=\"" << lx << "\" y=\"" << ly + 58 << "\">in its shield: " << detail::xml_escape(*pic.shield)
          << "</text>\n";
    }
    o << "</g>\n</svg>\n";
    return o.str();
}

}  // namespace libcoil
