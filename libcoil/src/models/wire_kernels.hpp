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

// A polynomial by Estrin's scheme (lowest power first): pairs c[2i] + c[2i+1] w, then pairs of those with
// w^2, and so on; a dependency chain of about log2(N) steps instead of Horner's N (the generator measures
// the tables with this same order of operations).
template <int N>
inline double estrin(const double (&c)[N], double w) {  // NOLINT(misc-no-recursion): depth log2(N)
    if constexpr (N == 1) {
        return c[0];
    } else {
        // One level: the pairs, then the same on them with w^2 (unrolled by the compiler: N is a constant).
        constexpr int M = (N + 1) / 2;
        double v[M];
        for (int i = 0; i < N / 2; ++i) v[i] = c[2 * i] + c[2 * i + 1] * w;
        if constexpr (N % 2 == 1) v[M - 1] = c[N - 1];
        return estrin(v, w * w);
    }
}

// x = sqrt(2) r / delta >= 0 (not checked: the callers check their inputs).
inline WireKernels wire_kernels(double x) {
    namespace t = skin_tables;
    if (x < t::x_table) {
        const double s = x * (t::segments / t::x_table);
        int i = static_cast<int>(s);
        if (i >= t::segments) i = t::segments - 1;
        const double w = 2 * (s - i) - 1;
        double g = estrin(t::proximity[i], w);
        if (i == 0) g *= (x * x) * (x * x);
        return {estrin(t::resistance[i], w), estrin(t::internal_inductance[i], w), g};
    }
    const double tt = t::x_table / x, s = tt * t::tail_segments;
    int j = static_cast<int>(s);
    if (j >= t::tail_segments) j = t::tail_segments - 1;
    const double w = 2 * (s - j) - 1, up = x / t::x_table;
    return {estrin(t::resistance_tail[j], w) * up, estrin(t::internal_inductance_tail[j], w) * tt, estrin(t::proximity_tail[j], w) * up};
}

// R_ac / R_dc alone (one polynomial instead of three).
inline double wire_skin_resistance(double x) {
    namespace t = skin_tables;
    if (x < t::x_table) {
        const double s = x * (t::segments / t::x_table);
        int i = static_cast<int>(s);
        if (i >= t::segments) i = t::segments - 1;
        return estrin(t::resistance[i], 2 * (s - i) - 1);
    }
    const double tt = t::x_table / x, s = tt * t::tail_segments;
    int j = static_cast<int>(s);
    if (j >= t::tail_segments) j = t::tail_segments - 1;
    return estrin(t::resistance_tail[j], 2 * (s - j) - 1) * (x / t::x_table);
}

}  // namespace libcoil::detail
