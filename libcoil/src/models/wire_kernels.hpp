// Internal: the skin ratios and the proximity loss function of a round wire at table speed, from the tables
// tools/skin_tables.py generates from mpmath (skin_tables.hpp: within 5e-16 of mpmath for every x, measured
// there). One segment lookup serves all three. The Kelvin-function series (kelvin.hpp) stays as the
// reference the tests compare with (skin_ratios_series, proximity_loss_function_series).
#pragma once

#include "models/skin_tables.hpp"

namespace libcoil::detail {

struct WireKernels {
    double resistance = 1;           // R_ac / R_dc of the isolated wire
    double internal_inductance = 1;  // L_int(f) / L_int(0)
    double proximity = 0;            // G(x), proximity.hpp
};

template <int N>
inline double horner(const double (&c)[N], double w) {
    double s = c[N - 1];
    for (int k = N - 2; k >= 0; --k) s = s * w + c[k];
    return s;
}

// x = sqrt(2) r / delta >= 0 (not checked: the callers check their inputs).
inline WireKernels wire_kernels(double x) {
    namespace t = skin_tables;
    if (x < t::x_table) {
        const double s = x * (t::segments / t::x_table);
        int i = static_cast<int>(s);
        if (i >= t::segments) i = t::segments - 1;
        const double w = 2 * (s - i) - 1;
        double g = horner(t::proximity[i], w);
        if (i == 0) g *= (x * x) * (x * x);
        return {horner(t::resistance[i], w), horner(t::internal_inductance[i], w), g};
    }
    const double tt = t::x_table / x, s = tt * t::tail_segments;
    int j = static_cast<int>(s);
    if (j >= t::tail_segments) j = t::tail_segments - 1;
    const double w = 2 * (s - j) - 1, up = x / t::x_table;
    return {horner(t::resistance_tail[j], w) * up, horner(t::internal_inductance_tail[j], w) * tt, horner(t::proximity_tail[j], w) * up};
}

// R_ac / R_dc alone (one polynomial instead of three).
inline double wire_skin_resistance(double x) {
    namespace t = skin_tables;
    if (x < t::x_table) {
        const double s = x * (t::segments / t::x_table);
        int i = static_cast<int>(s);
        if (i >= t::segments) i = t::segments - 1;
        return horner(t::resistance[i], 2 * (s - i) - 1);
    }
    const double tt = t::x_table / x, s = tt * t::tail_segments;
    int j = static_cast<int>(s);
    if (j >= t::tail_segments) j = t::tail_segments - 1;
    return horner(t::resistance_tail[j], 2 * (s - j) - 1) * (x / t::x_table);
}

}  // namespace libcoil::detail
