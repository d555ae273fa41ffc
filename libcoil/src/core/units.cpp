#include "libcoil/core/units.hpp"

#include <algorithm>
#include <array>
#include <charconv>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <optional>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"

namespace libcoil {

namespace {

struct UnitInfo {
    std::string_view symbol;
    Dimension dimension;
    double scale;           // SI value of one unit
    double offset = 0;      // added after scaling (temperatures)
    bool takes_prefix = true;
};

// Base units. Names longer than a prefix plus a base are listed whole so that "mil" is not milli-"il".
constexpr std::array units{
    UnitInfo{"m", Dimension::length, 1.0},
    UnitInfo{"in", Dimension::length, inch, 0, false},
    UnitInfo{"inch", Dimension::length, inch, 0, false},
    UnitInfo{"\"", Dimension::length, inch, 0, false},
    UnitInfo{"mil", Dimension::length, inch / 1000, 0, false},
    UnitInfo{"thou", Dimension::length, inch / 1000, 0, false},
    UnitInfo{"ft", Dimension::length, 12 * inch, 0, false},
    UnitInfo{"H", Dimension::inductance, 1.0},
    UnitInfo{"F", Dimension::capacitance, 1.0},
    UnitInfo{"Hz", Dimension::frequency, 1.0},
    UnitInfo{"A", Dimension::current, 1.0},
    UnitInfo{"V", Dimension::voltage, 1.0},
    UnitInfo{"ohm", Dimension::resistance, 1.0},
    UnitInfo{"Ohm", Dimension::resistance, 1.0},
    UnitInfo{"\u03a9", Dimension::resistance, 1.0},  // Greek capital omega
    UnitInfo{"\u2126", Dimension::resistance, 1.0},  // Ohm sign
    UnitInfo{"W", Dimension::power, 1.0},
    UnitInfo{"s", Dimension::time, 1.0},
    UnitInfo{"K", Dimension::temperature, 1.0, 0, false},
    UnitInfo{"degC", Dimension::temperature, 1.0, zero_celsius, false},
    UnitInfo{"\u00b0C", Dimension::temperature, 1.0, zero_celsius, false},
    UnitInfo{"C", Dimension::temperature, 1.0, zero_celsius, false},
    UnitInfo{"degF", Dimension::temperature, 5.0 / 9.0, zero_celsius - 32.0 * 5.0 / 9.0, false},
    UnitInfo{"\u00b0F", Dimension::temperature, 5.0 / 9.0, zero_celsius - 32.0 * 5.0 / 9.0, false},
    UnitInfo{"%", Dimension::dimensionless, 1e-2, 0, false},
    UnitInfo{"ppm", Dimension::dimensionless, 1e-6, 0, false},
};

struct Prefix {
    std::string_view symbol;
    double scale;
};

constexpr std::array prefixes{
    Prefix{"f", 1e-15}, Prefix{"p", 1e-12}, Prefix{"n", 1e-9},
    Prefix{"u", 1e-6},  Prefix{"\u00b5", 1e-6}, Prefix{"\u03bc", 1e-6},  // micro sign, Greek mu
    Prefix{"m", 1e-3},  Prefix{"c", 1e-2},  Prefix{"k", 1e3},
    Prefix{"M", 1e6},   Prefix{"G", 1e9},   Prefix{"T", 1e12},
};

std::string_view trim(std::string_view s) {
    const auto is_space = [](char c) { return c == ' ' || c == '\t' || c == '\n' || c == '\r'; };
    while (!s.empty() && is_space(s.front())) s.remove_prefix(1);
    while (!s.empty() && is_space(s.back())) s.remove_suffix(1);
    return s;
}

struct Resolved {
    const UnitInfo* unit;
    double prefix_scale;
};

std::optional<Resolved> resolve(std::string_view symbol) {
    for (const auto& u : units) {
        if (u.symbol == symbol) return Resolved{&u, 1.0};
    }
    for (const auto& p : prefixes) {
        if (symbol.size() > p.symbol.size() && symbol.substr(0, p.symbol.size()) == p.symbol) {
            const auto rest = symbol.substr(p.symbol.size());
            for (const auto& u : units) {
                if (u.takes_prefix && u.symbol == rest) return Resolved{&u, p.scale};
            }
        }
    }
    return std::nullopt;
}

[[noreturn]] void fail(std::string_view field, std::string_view text, const std::string& why, Dimension d) {
    throw InputError(std::string(field), "\"" + std::string(text) + "\": " + why + "; expected " +
                                             std::string(dimension_noun(d)) + " such as \"" +
                                             std::string(dimension_example(d)) + "\"");
}

}  // namespace

namespace {

struct DimensionInfo {
    Dimension dimension;
    std::string_view noun, example, unit;
};

constexpr std::array dimensions{
    DimensionInfo{Dimension::dimensionless, "a plain number", "1.5", ""},
    DimensionInfo{Dimension::length, "a length", "2 mm", "m"},
    DimensionInfo{Dimension::inductance, "an inductance", "1.2 uH", "H"},
    DimensionInfo{Dimension::capacitance, "a capacitance", "2.5 pF", "F"},
    DimensionInfo{Dimension::frequency, "a frequency", "30 MHz", "Hz"},
    DimensionInfo{Dimension::current, "a current", "4 A", "A"},
    DimensionInfo{Dimension::voltage, "a voltage", "230 V", "V"},
    DimensionInfo{Dimension::resistance, "a resistance", "50 ohm", "\u03a9"},
    DimensionInfo{Dimension::power, "a power", "10 W", "W"},
    DimensionInfo{Dimension::temperature, "a temperature", "25 degC", "K"},
    DimensionInfo{Dimension::time, "a time", "1 ms", "s"},
};

const DimensionInfo& info(Dimension d) {
    for (const auto& i : dimensions) {
        if (i.dimension == d) return i;
    }
    return dimensions.front();
}

}  // namespace

std::string_view dimension_noun(Dimension d) { return info(d).noun; }
std::string_view dimension_example(Dimension d) { return info(d).example; }
std::string_view si_unit(Dimension d) { return info(d).unit; }

double parse_quantity(std::string_view text, Dimension d, std::string_view field) {
    const std::string_view s = trim(text);
    if (s.empty()) fail(field, text, "empty value", d);

    // The number: std::from_chars does not take a leading '+', so skip one.
    std::string_view num = s;
    if (num.front() == '+') num.remove_prefix(1);
    double value = 0;
    const auto [end, ec] = std::from_chars(num.data(), num.data() + num.size(), value);
    if (ec == std::errc::result_out_of_range) fail(field, text, "number out of range", d);
    if (ec != std::errc() || end == num.data()) fail(field, text, "does not start with a number", d);
    if (!std::isfinite(value)) fail(field, text, "not a finite number", d);

    const std::string_view symbol = trim(std::string_view(end, num.data() + num.size() - end));
    if (symbol.empty()) return value;  // a bare number is SI

    const auto r = resolve(symbol);
    if (!r) fail(field, text, "unknown unit \"" + std::string(symbol) + "\"", d);
    if (r->unit->dimension != d) {
        std::string noun(dimension_noun(r->unit->dimension));
        fail(field, text, "\"" + std::string(symbol) + "\" is " + noun + ", not " + std::string(dimension_noun(d)), d);
    }
    const double si = value * r->prefix_scale * r->unit->scale + r->unit->offset;
    if (!std::isfinite(si)) fail(field, text, "number out of range", d);
    return si;
}

std::string format_quantity(double value, Dimension d, int digits) {
    if (!std::isfinite(value)) return format_value(value);
    char buf[64];
    if (d == Dimension::temperature) {
        std::snprintf(buf, sizeof buf, "%.*g \u00b0C", digits, value - zero_celsius);
        return buf;
    }
    if (d == Dimension::dimensionless) {
        std::snprintf(buf, sizeof buf, "%.*g", digits, value);
        return buf;
    }
    static constexpr std::array<std::pair<int, std::string_view>, 9> steps{{
        {-15, "f"}, {-12, "p"}, {-9, "n"}, {-6, "\u00b5"}, {-3, "m"}, {0, ""}, {3, "k"}, {6, "M"}, {9, "G"},
    }};
    int exp3 = 0;
    bool carried = false;
    if (value != 0) {
        exp3 = static_cast<int>(std::floor(std::log10(std::fabs(value)) / 3.0)) * 3;
        // Rounding to `digits` may carry into the next power of 1000 (999.96 -> 1000).
        const double mant = value / std::pow(10.0, exp3);
        char probe[64];
        std::snprintf(probe, sizeof probe, "%.*g", digits, std::fabs(mant));
        if (std::atof(probe) >= 1000.0) {
            exp3 += 3;
            carried = true;
        }
    }
    exp3 = std::clamp(exp3, steps.front().first, steps.back().first);
    std::string_view prefix;
    for (const auto& [e, p] : steps) {
        if (e == exp3) prefix = p;
    }
    const double mant = value / std::pow(10.0, exp3);
    // %g with `digits` significant digits but without switching to exponent form.
    const double magnitude = carried ? 1.0 : std::fabs(mant);  // 0.99996 is printed as 1.000
    int decimals = digits - 1 - (mant == 0 ? 0 : static_cast<int>(std::floor(std::log10(magnitude))));
    decimals = std::max(decimals, 0);
    std::snprintf(buf, sizeof buf, "%.*f %.*s%.*s", decimals, mant, static_cast<int>(prefix.size()),
                  prefix.data(), static_cast<int>(si_unit(d).size()), si_unit(d).data());
    return buf;
}

}  // namespace libcoil
