// Maxwell's mutual inductance of two coaxial circular filaments.
//
// Method:  M = mu0 sqrt(a b) [ (2/k - k) K(k) - (2/k) E(k) ], k^2 = 4 a b / ((a + b)^2 + z^2).
//          K and (K - E) / k^2 come together from the arithmetic-geometric mean (DLMF 19.8) with k'^2
//          formed directly from the geometry, ((a - b)^2 + z^2) / ((a + b)^2 + z^2), so nearby loops keep
//          their digits. For distant
//          loops (k^2 < 0.2) the bracket cancels, and the hypergeometric series
//          (pi/2) sum_{n>=2} c_{n-1} (n-1)/n k^(2n-1), c_n = ((1/2)_n / n!)^2, is summed instead.
// Source:  J. C. Maxwell, "A Treatise on Electricity and Magnetism" (1873) art. 701; Grover (1946) ch. 13.
// Domain:  a, b > 0, any z; the filaments must not coincide (a = b and z = 0 is infinite).
// Accuracy: enforced 1e-11 relative against Neumann's integral by Boost.Math Gauss-Kronrod
//          (tests/cpp/test_mutual.cpp), 1e-13 against mpmath (tests/python/test_models.py; measured 2.8e-15).
#pragma once

namespace libcoil {

double coaxial_mutual_inductance(double radius_a, double radius_b, double axial_distance);

}  // namespace libcoil
