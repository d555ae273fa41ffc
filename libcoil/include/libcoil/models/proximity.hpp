// Proximity effect in a single-layer solenoid, in closed form: the method of Butterworth.
//
// Method:  R_ac = R_dc (F(x) + P), Butterworth's additive split. F is the isolated-wire skin ratio
//          (skin_effect.hpp). P is the eddy loss each turn suffers in the transverse field H_i that the
//          other turns set up at its centre, taken as uniform over the wire:
//            per metre of wire  P' = (2 pi / sigma) |H|^2 G(x),   G(x) = x^2 lambda(u) / |J0(u)|^2,
//            lambda(u) = int_0^1 |J1(u s)|^2 s ds = -Im(u* J1(u) conj(J1'(u))) / x^2,  u = x e^(-i pi/4),
//          the exact Bessel solution for a round wire in a uniform transverse field (derived in
//          docs/models.md; low-frequency limit pi omega^2 sigma mu0^2 H^2 a^4 / 8). With peak current I,
//            P = 4 pi^2 r^2 G(x) <|H_i / I|^2>,
//          where the mean over the turns of the squared field per ampere comes from the exact field of
//          coaxial rings (elliptic integrals), summed in O(N) with prefix sums. Each turn also sees its own
//          ring's curvature field, taken as (1 / (4 pi a)) (ln(8 a / r) - c) axially: averaging the exact
//          ring field over the wire gives c = 0, but the uniform-field loss then reads 5-13 % high for
//          spaced turns, so c = 1.75 is fitted to the cross-section solver (a fit, not a published value).
// Source:  S. Butterworth, "On the alternating current resistance of solenoidal coils", Proc. Roy. Soc.
//          A 107 (1925) 693, and Experimental Wireless 3 (1926); the uniform-field solution as in
//          J. Lammeraner and M. Stafl, "Eddy Currents" (1966).
// Domain:  whole turns (N rounded), round non-magnetic wire, p >= d. The uniform-field assumption holds
//          best for spaced turns; close-wound turns see a field that varies across the wire.
// Accuracy: against the cross-section solver (cross_section.hpp) over pitch ratio 1.1 .. 4, l/D 0.3 .. 5,
//          x = 1 .. 30: see docs/models.md and tests/cpp/test_proximity.cpp.
#pragma once

#include "libcoil/models/materials.hpp"
#include "libcoil/models/solenoid.hpp"

namespace libcoil {

// The domain where the closed form holds to 3 % of the solver (docs/models.md): pitch at least 2.5 bare
// wire diameters, or x = sqrt(2) r / delta at most 3 (where proximity loss is still small). Closer turns
// at higher x spread from -22 % to +12 %, and a caller should take the solver there.
inline constexpr double proximity_pitch_in_domain = 2.5;  // pitch / bare wire diameter
inline constexpr double proximity_x_in_domain = 3.0;
inline bool closed_form_proximity_holds(double pitch_to_wire, double x) {
    return pitch_to_wire >= proximity_pitch_in_domain || x <= proximity_x_in_domain;
}

// G(x) for a round wire in a uniform transverse field, x = sqrt(2) r / delta.
// G = (x^4 / 16)(1 - 11 x^4 / 384 + O(x^8)) at low x.
// From the tables (tools/skin_tables.py, within 4.9e-16 of mpmath for any x); proximity_loss_function_series
// is the Kelvin-function form (proximity.cpp), the tables' reference in the tests.
double proximity_loss_function(double x);
double proximity_loss_function_series(double x);

// (1/N) sum_i |H_i / I|^2 over the whole turns: the squared transverse field per ampere, (A/m / A)^2,
// at each turn's centre from all the other turns and the turn's own curvature term.
double mean_square_field_per_ampere(const Solenoid& coil);

struct AcResistance {
    double frequency = 0;        // Hz
    double dc = 0;               // ohm, the whole wire (helix and leads) at temperature
    double skin_ratio = 1;       // F: isolated-wire R_ac / R_dc
    double proximity_ratio = 0;  // P: added by the field of the other turns (helix only)
    double resistance = 0;       // ohm: R_dc,helix (F + P) + R_dc,leads F
    double internal_inductance_ratio = 1;  // L_int(f) / L_int(0) from the skin solution
};

// The closed-form chain: DC resistance at `temperature` K, skin ratio and proximity ratio at `frequency`.
AcResistance ac_resistance(const Solenoid& coil, const Conductor& conductor, double temperature, double frequency);
// The same with the coil's mean_square_field_per_ampere given: for many frequencies of one coil, the
// O(N) field sum is computed once.
AcResistance ac_resistance(const Solenoid& coil, const Conductor& conductor, double temperature, double frequency,
                           double mean_square_field);

}  // namespace libcoil
