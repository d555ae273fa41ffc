// Internal: number formatting for reports and messages, printf style.
#pragma once

#include <cstdio>
#include <ostream>
#include <string>
#include <vector>

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

// Pads to a display width, counting UTF-8 code points rather than bytes ("µH" is two columns).
// Text for an XML (SVG) element or attribute.
inline std::string xml_escape(const std::string& s) {
    std::string o;
    for (char c : s) {
        switch (c) {
            case '&': o += "&amp;"; break;
            case '<': o += "&lt;"; break;
            case '>': o += "&gt;"; break;
            case '"': o += "&quot;"; break;
            default: o += c;
        }
    }
    return o;
}

inline std::string pad(const std::string& s, std::size_t width) {
    std::size_t cols = 0;
    for (unsigned char c : s) cols += (c & 0xC0) != 0x80;
    return cols >= width ? s + " " : s + std::string(width - cols, ' ');
}

// A report section of one line per item: "\nTitle\n  ! item" (nothing when empty).
// "Written: PATH" and the other paths below it, aligned; nothing when no file was written.
inline void written_section(std::ostream& o, const std::vector<std::string>& files) {
    if (files.empty()) return;
    o << "\nWritten: ";
    for (std::size_t i = 0; i < files.size(); ++i) o << (i ? "         " : "") << files[i] << "\n";
}

inline void list_section(std::ostream& o, const char* title, const std::vector<std::string>& items, const char* mark) {
    if (items.empty()) return;
    o << "\n" << title << "\n";
    for (const auto& x : items) o << "  " << mark << " " << x << "\n";
}

}  // namespace libcoil::detail
