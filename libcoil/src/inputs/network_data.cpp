#include <algorithm>

#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/inputs/network_file.hpp"

namespace libcoil {

std::vector<std::complex<double>> matrix_at(const NetworkData& d, double f, const std::string& field) {
    const auto& g = d.frequency;
    if (g.empty()) throw InputError(field, "the file has no points");
    if (f < g.front() * (1 - 1e-9) || f > g.back() * (1 + 1e-9)) {
        throw InputError(field, "its file covers " + format_quantity(g.front(), Dimension::frequency) + " to " +
                                    format_quantity(g.back(), Dimension::frequency) + ", not " + format_quantity(f, Dimension::frequency));
    }
    std::size_t k = 0;
    while (k + 2 < g.size() && g[k + 1] < f) ++k;
    const std::size_t j = g.size() < 2 ? k : k + 1;
    const double t = j == k ? 0.0 : std::clamp((f - g[k]) / (g[j] - g[k]), 0.0, 1.0);
    std::vector<std::complex<double>> out;
    for (int r = 0; r < d.ports; ++r) {
        for (int c = 0; c < d.ports; ++c) out.push_back(d.at(k, r, c) + t * (d.at(j, r, c) - d.at(k, r, c)));
    }
    return out;
}

}  // namespace libcoil
