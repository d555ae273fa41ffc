// The safety cautions a study's inputs call for, in one place: `coil analyze`, `coil design` and the
// former print the same words for the same inputs.
#pragma once

#include <string>
#include <vector>

namespace libcoil {

// A winding estimated this close to its thermal limit, or closer, gets a caution (K): common practice.
inline constexpr double near_thermal_limit = 10.0;

// `supply_voltage` (V) and `rf_power` (W): 0 when not given. `temperature` and `limit` (K): the winding's
// estimate and its limit, 0 when unknown.
std::vector<std::string> safety_cautions(double supply_voltage, double rf_power, double temperature, double limit);

}  // namespace libcoil
