// Internal: the measurement readers' text handling: lines, whitespace-separated words with their line and
// column, numbers parsed whole, and the one error they raise (the file, the line, the column, what was
// expected).
#pragma once

#include <cctype>
#include <charconv>
#include <cmath>
#include <string>
#include <string_view>
#include <vector>

#include "libcoil/core/error.hpp"

namespace libcoil::detail {

struct Field {
    std::string text;
    int line = 0, column = 0;  // 1-based
};

[[noreturn]] inline void fail_at(std::string_view file, int line, int column, const std::string& what) {
    throw InputError(std::string(file) + ":" + std::to_string(line) + ":" + std::to_string(column), what);
}

inline std::string lower(std::string_view s) {
    std::string out(s);
    for (char& c : out) c = static_cast<char>(std::tolower(static_cast<unsigned char>(c)));
    return out;
}

inline std::string_view trim(std::string_view s) {
    while (!s.empty() && std::isspace(static_cast<unsigned char>(s.front()))) s.remove_prefix(1);
    while (!s.empty() && std::isspace(static_cast<unsigned char>(s.back()))) s.remove_suffix(1);
    return s;
}

// The text's lines, without their ends (\n, \r\n or \r).
inline std::vector<std::string_view> lines(std::string_view text) {
    std::vector<std::string_view> out;
    std::size_t start = 0;
    for (std::size_t i = 0; i < text.size(); ++i) {
        if (text[i] == '\n' || text[i] == '\r') {
            out.push_back(text.substr(start, i - start));
            if (text[i] == '\r' && i + 1 < text.size() && text[i + 1] == '\n') ++i;
            start = i + 1;
        }
    }
    if (start < text.size()) out.push_back(text.substr(start));
    return out;
}

// Whitespace-separated words of `line`, its first character at `column`.
inline std::vector<Field> words(std::string_view line, int number, int column) {
    std::vector<Field> out;
    std::size_t i = 0;
    while (i < line.size()) {
        while (i < line.size() && std::isspace(static_cast<unsigned char>(line[i]))) ++i;
        const std::size_t start = i;
        while (i < line.size() && !std::isspace(static_cast<unsigned char>(line[i]))) ++i;
        if (i > start) out.push_back({std::string(line.substr(start, i - start)), number, column + static_cast<int>(start)});
    }
    return out;
}

// The word as a finite number, all of it.
inline double number(std::string_view file, const Field& f) {
    double v = 0;
    const char* first = f.text.data();
    const char* last = first + f.text.size();
    if (first != last && *first == '+') ++first;
    const auto [end, ec] = std::from_chars(first, last, v);
    if (ec != std::errc() || end != last || !std::isfinite(v)) {
        fail_at(file, f.line, f.column, "expected a finite number, found " + libcoil::quoted(f.text));
    }
    return v;
}

}  // namespace libcoil::detail
