// Internal: the skin ratios and the proximity loss function of a round wire at table speed, from the tables
// tools/skin_tables.py generates from mpmath (skin_tables.hpp: within 5e-16 of mpmath for every x, measured
// there). One segment lookup serves all three. The Kelvin-function series (kelvin.hpp) stays as the
// reference the tests compare with (skin_ratios_series, proximity_loss_function_series).
#pragma once

#include "models/polynomial.hpp"
#include "models/skin_tables.hpp"

namespace libcoil::detail {

struct WireKernels {
    double resistance = 1;           // R_ac / R_dc of the isolated wire
    double internal_inductance = 1;  // L_int(f) / L_int(0)
    double proximity = 0;            // G(x), proximity.hpp
};

// Where x falls: a part of the table and w in [-1, 1] on it, or a part of the tail (t = x_table / x).
struct TablePlace {
    bool tail = false;
    int part = 0;
    double w = 0;
};
inline TablePlace table_place(double x) {
    namespace t = skin_tables;
    const bool tail = x >= t::x_table;
    const double s = tail ? t::x_table / x * t::tail_segments : x * (t::segments / t::x_table);
    const int last = tail ? t::tail_segments - 1 : t::segments - 1;
    int i = static_cast<int>(s);
    if (i > last) i = last;
    return {tail, i, 2 * (s - i) - 1};
}

// The resistance ratio and G side by side, for estrin_pair (one SSE2 instruction does a step of both): built
// at compile time from the generated tables.
template <int parts, int terms>
struct InterleavedPairs {
    double c[parts][terms][2];
};
template <int parts, int terms>
constexpr InterleavedPairs<parts, terms> interleave(const double (&a)[parts][terms], const double (&b)[parts][terms]) {
    InterleavedPairs<parts, terms> out{};
    for (int i = 0; i < parts; ++i) {
        for (int j = 0; j < terms; ++j) {
            out.c[i][j][0] = a[i][j];
            out.c[i][j][1] = b[i][j];
        }
    }
    return out;
}
inline constexpr auto resistance_and_proximity = interleave(skin_tables::resistance, skin_tables::proximity);
inline constexpr auto resistance_and_proximity_tail = interleave(skin_tables::resistance_tail, skin_tables::proximity_tail);

// x = sqrt(2) r / delta >= 0 (not checked: the callers check their inputs).
inline WireKernels wire_kernels(double x) {
    namespace t = skin_tables;
    const TablePlace p = table_place(x);
    if (!p.tail) {
        const PolynomialPair rg = estrin_pair(resistance_and_proximity.c[p.part], p.w);
        const double g = p.part == 0 ? rg.second * ((x * x) * (x * x)) : rg.second;
        return {rg.first, estrin(t::internal_inductance[p.part], p.w), g};
    }
    const double up = x / t::x_table;
    const PolynomialPair rg = estrin_pair(resistance_and_proximity_tail.c[p.part], p.w);
    return {rg.first * up, estrin(t::internal_inductance_tail[p.part], p.w) / up, rg.second * up};
}

// R_ac / R_dc alone (one polynomial instead of three).
inline double wire_skin_resistance(double x) {
    namespace t = skin_tables;
    const TablePlace p = table_place(x);
    return p.tail ? estrin(t::resistance_tail[p.part], p.w) * (x / t::x_table) : estrin(t::resistance[p.part], p.w);
}

}  // namespace libcoil::detail
