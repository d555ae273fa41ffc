// Kelvin functions ber, bei and their derivatives, for the skin and proximity effect in round wire.
//
// Method:  ber x + i bei x = J0(x e^(3 pi i / 4)) and ber' x + i bei' x = -e^(3 pi i / 4) J1(x e^(3 pi i / 4)).
//          For x <= 26 the power series of J0 and J1 is summed in complex long double (it cancels by up
//          to e^(0.29 x), 2000 at x = 26, which the 64-bit mantissa absorbs). Beyond, Hankel's asymptotic
//          expansion (A&S 9.2.5, 9.2.9) is summed to its smallest term; measured against mpmath its error
//          is 1e-12 at x = 20 and 6e-16 at x = 26. The scaled forms carry e^(-x / sqrt 2), so ratios of
//          them never overflow.
// Source:  Abramowitz & Stegun (1964) 9.9 and 9.2; Olver, DLMF 10.61 and 10.17.
// Domain:  x >= 0; the unscaled functions to x = 1000 (they reach 1e305), the scaled ones for any x.
// Accuracy (tests/python/test_skin.py): against scipy.special.ber/bei/berp/beip and mpmath over
//          x = 0 .. 100, relative to the modulus sqrt(ber^2 + bei^2): measured 1.9e-14 against mpmath
//          (enforced 1e-12); scipy's own routines are good to about 5e-10 there (enforced 1e-9).
#pragma once

#include <complex>

namespace libcoil {

struct KelvinValues {
    double ber = 0, bei = 0, ber_prime = 0, bei_prime = 0;
};

// ber, bei, ber', bei' at x (0 <= x <= 1000).
KelvinValues kelvin(double x);

// At z = x e^(3 pi i / 4), both multiplied by e^(-x / sqrt 2), for any x >= 0:
//   j0 = J0(z) = ber x + i bei x,  d = -e^(3 pi i / 4) J1(z) = ber' x + i bei' x.
// d is formed without the rotation where the series is used, so ber' keeps its digits at small x.
struct ScaledBesselPair {
    std::complex<double> j0, d;
};
ScaledBesselPair scaled_kelvin_bessel(double x);

}  // namespace libcoil
