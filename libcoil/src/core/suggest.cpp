#include "core/suggest.hpp"

#include <algorithm>
#include <cctype>
#include <numeric>

namespace libcoil::detail {

namespace {
char lower(char c) { return static_cast<char>(std::tolower(static_cast<unsigned char>(c))); }

// Levenshtein distance, case-insensitive.
std::size_t edit_distance(std::string_view a, std::string_view b) {
    std::vector<std::size_t> row(b.size() + 1);
    std::iota(row.begin(), row.end(), std::size_t{0});
    for (std::size_t i = 1; i <= a.size(); ++i) {
        std::size_t diag = row[0];
        row[0] = i;
        for (std::size_t j = 1; j <= b.size(); ++j) {
            const std::size_t up = row[j];
            row[j] = std::min({row[j] + 1, row[j - 1] + 1, diag + (lower(a[i - 1]) == lower(b[j - 1]) ? 0 : 1)});
            diag = up;
        }
    }
    return row[b.size()];
}
}  // namespace

bool equal_ignoring_case(std::string_view a, std::string_view b) {
    return a.size() == b.size() && std::equal(a.begin(), a.end(), b.begin(), [](char x, char y) { return lower(x) == lower(y); });
}

std::string did_you_mean(std::string_view word, const std::vector<std::string>& candidates) {
    const std::string* best = nullptr;
    std::size_t best_d = 0;
    for (const auto& c : candidates) {
        const std::size_t d = edit_distance(word, c);
        if (!best || d < best_d) {
            best = &c;
            best_d = d;
        }
    }
    // Close enough: at most a third of the longer word differs (and at least one edit is allowed).
    if (best && best_d <= std::max<std::size_t>(1, std::max(word.size(), best->size()) / 3)) {
        return "; did you mean \"" + *best + "\"?";
    }
    return "";
}

std::string join(const std::vector<std::string>& items, std::string_view sep) {
    std::string out;
    for (const auto& it : items) {
        if (!out.empty()) out += sep;
        out += it;
    }
    return out;
}

}  // namespace libcoil::detail
