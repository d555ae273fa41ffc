// Internal: number formatting for reports and messages, printf style.
#pragma once

#include <cstdio>
#include <string>

namespace libcoil::detail {

// %.{digits}g: "1.23", "4.5e+06".
inline std::string significant(double v, int digits) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.*g", digits, v);
    return buf;
}

// %.{decimals}f: "1.230".
inline std::string fixed(double v, int decimals) {
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.*f", decimals, v);
    return buf;
}

}  // namespace libcoil::detail
