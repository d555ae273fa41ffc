#include "libcoil/outputs/sweep_files.hpp"

#include <sstream>

#include "libcoil/core/error.hpp"
#include "outputs/svg_axes.hpp"

namespace libcoil {

namespace {

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

std::string touchstone_s1p(const Sweep& sweep, double r0) {
    const auto& points = sweep.points;
    require_positive("reference_impedance", r0);
    std::ostringstream o;
    for (const auto& c : sweep_description(sweep)) o << "! " << ascii(c) << "\n";
    o << "# Hz S RI R " << detail::g(r0, 15) << "\n";
    for (const auto& p : points) {
        const auto s = (p.impedance - r0) / (p.impedance + r0);
        o << detail::g(p.frequency, 17) << ' ' << detail::g(s.real(), 17) << ' ' << detail::g(s.imag(), 17) << '\n';
    }
    return o.str();
}

}  // namespace libcoil
