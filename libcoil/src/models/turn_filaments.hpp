// Internal: a coil's turns as circular filaments on its mean radius, for the models that couple a coil to
// other rings (coupling.cpp, shield.cpp): one filament per turn at the turn's centre; a fractional N gives
// ceil(N) filaments of weight N / ceil(N) spread evenly over the winding length, so that the ampere-turns
// and the length stay the coil's.
#pragma once

#include <cmath>
#include <vector>

#include "libcoil/models/solenoid.hpp"

namespace libcoil::detail {

struct TurnFilaments {
    std::vector<double> z;  // m, from the coil's centre
    double weight = 1;      // turns per filament
    double radius = 0;      // m
};

inline TurnFilaments turn_filaments(const Solenoid& s) {
    TurnFilaments f;
    const int n = static_cast<int>(std::ceil(s.turns() - 1e-9));
    const double length = s.winding_length();
    f.weight = s.turns() / n;
    f.radius = s.mean_radius();
    for (int k = 0; k < n; ++k) f.z.push_back(-length / 2 + (k + 0.5) * length / n);
    return f;
}

}  // namespace libcoil::detail
