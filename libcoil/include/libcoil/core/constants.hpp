// Physical constants in SI units (CODATA 2018 values).
#pragma once

#include <numbers>

namespace libcoil {

inline constexpr double pi = std::numbers::pi;
// Vacuum permeability. Since the 2019 SI redefinition it is measured, 1.25663706212e-6 H/m (CODATA 2018),
// which differs from 4*pi*1e-7 by 5.5e-10 relative.
inline constexpr double mu0 = 1.25663706212e-6;
inline constexpr double speed_of_light = 299792458.0;  // m/s, exact
inline constexpr double eps0 = 1.0 / (mu0 * speed_of_light * speed_of_light);
inline constexpr double zero_celsius = 273.15;  // K, exact
inline constexpr double inch = 0.0254;          // m, exact

}  // namespace libcoil
