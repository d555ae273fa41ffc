// Internal: the bracket of Maxwell's mutual inductance of coaxial circles from the elliptic pair.
//
// M = mu0 sqrt(a b) [ (2/k - k) K - (2/k) E ] (coaxial_mutual.hpp), and with (K - E)/k^2 known without
// cancellation the bracket is k (2 (K - E)/k^2 - K). coaxial_mutual_inductance takes it for k^2 >= 0.2
// (below, its series); the filament sum takes it for its near offsets, eight at a time.
#pragma once

#include "models/elliptic.hpp"

namespace libcoil::detail {

inline double maxwell_bracket(double k, const EllipticPair& e) { return k * (2.0 * e.k_minus_e_over_m - e.k); }

}  // namespace libcoil::detail
