// Internal: a fitted polynomial's feature, scaled to [-1, 1] over the range its fit was sampled on, and its
// powers (the design screen's fits of L's fall and of the SRF bounds, whose generators scale alike).
#pragma once

namespace libcoil::detail {

// x scaled to [-1, 1] over low .. high, and its powers 0 .. Degree into power[0 .. Degree], each the last times
// s; false outside the range (a NaN too), power then unwritten.
template <int Degree>
bool scaled_powers(double x, double low, double high, double* power) {
    if (!(x >= low && x <= high)) return false;
    const double s = (2 * x - low - high) / (high - low);
    power[0] = 1;
    for (int e = 1; e <= Degree; ++e) power[e] = power[e - 1] * s;
    return true;
}

}  // namespace libcoil::detail
