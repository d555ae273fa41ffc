// Internal: complete elliptic integrals from the complementary parameter, via Carlson's forms.
//
// Every caller here knows m' = k'^2 = 1 - k^2 more accurately than k itself (it comes straight from the
// geometry), so the functions take m'. K(k) = R_F(0, m', 1) and K(k) - E(k) = (k^2 / 3) R_D(0, m', 1)
// (DLMF 19.25.1), the latter without the cancellation of subtracting E from K.
#pragma once

#include <boost/math/special_functions/ellint_rd.hpp>
#include <boost/math/special_functions/ellint_rf.hpp>

namespace libcoil::detail {

// Carlson's duplication is accurate in double; Boost's default promotion to long double only costs time.
using elliptic_policy = boost::math::policies::policy<boost::math::policies::promote_double<false>>;

inline double elliptic_k(double mc) { return boost::math::ellint_rf(0.0, mc, 1.0, elliptic_policy()); }

// (K(k) - E(k)) / k^2.
inline double elliptic_k_minus_e_over_m(double mc) {
    return boost::math::ellint_rd(0.0, mc, 1.0, elliptic_policy()) / 3.0;
}

}  // namespace libcoil::detail
