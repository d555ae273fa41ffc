// DC resistance of a wire at a temperature.
//
// Method:  R = rho20 (1 + alpha20 (T - 20 degC)) * length / (pi d^2 / 4), the linear resistivity law.
// Source:  IEC 60028 (copper: rho20 = 1/58 ohm mm^2/m, alpha20 = 0.00393 /K); conductor data in
//          data/conductors.yaml.
// Domain:  the linear law holds to within about 1 % from -50 to 200 degC for copper (handbook practice,
//          no single source); the library refuses temperatures where it would give rho <= 0.
// Accuracy: exact for the law; tests check IEC 60028's 20 degC value and the alpha scaling.
#pragma once

#include "libcoil/models/materials.hpp"

namespace libcoil {

// Resistance in ohm of `length` m of round wire of bare diameter `diameter` m at `temperature` K.
double dc_resistance(const Conductor& c, double diameter, double length, double temperature);
// Per metre.
double dc_resistance_per_length(const Conductor& c, double diameter, double temperature);
// The geometric factor length / (pi d^2 / 4), in 1/m: R = rho(T) times it. For a caller that evaluates
// one wire at many temperatures (the thermal balance).
double resistance_per_resistivity(double diameter, double length);

}  // namespace libcoil
