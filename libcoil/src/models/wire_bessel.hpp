// Internal: the skin and proximity ratios of a round wire from one evaluation of the scaled Kelvin
// functions, for callers that need both at the same x (ac_resistance). The public skin_ratios and
// proximity_loss_function evaluate them alike.
#pragma once

#include "libcoil/models/kelvin.hpp"
#include "libcoil/models/skin_effect.hpp"

namespace libcoil::detail {

// x > 0; the scaled pair at x.
SkinRatios skin_ratios_from(const ScaledBesselPair& s, double x);
double proximity_loss_from(const ScaledBesselPair& s, double x);

}  // namespace libcoil::detail
