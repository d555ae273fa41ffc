// Mutual inductance and coupling between two single-layer coils, coaxial or side by side.
//
// Method:  each coil becomes n coaxial circular filaments on its mean radius, one per turn (for a
//          fractional N, n = ceil(N) filaments of weight N / n spread evenly over the winding length), and
//          M = sum over pairs of the filaments' mutual inductance times their weights.
//          Coaxial: Maxwell's formula per pair (coaxial_mutual.hpp).
//          Parallel axes at centre distance d (side by side), axial offset h: the flux of filament A
//          through filament B is the line integral of A's vector potential around B. With A's potential
//          A_phi(rho, h) = M_coax(a, rho, h) / (2 pi rho) (Maxwell's formula through a coaxial circle of
//          radius rho), and along B (radius b, centre at d) rho^2 = b^2 + d^2 + 2 b d cos(phi),
//          e_phi . t_B = (b + d cos(phi)) / rho:
//            M = (b / pi) integral_0^pi M_coax(a, rho, h) (b + d cos(phi)) / rho^2 dphi,
//          a single integral by Boost.Math's adaptive Gauss-Kronrod quadrature.
// Source:  Maxwell (1873) art. 701 for the filaments; the vector-potential line integral is Neumann's
//          formula reduced by one integration (as in Grover 1946, ch. 13, for parallel axes).
// Domain:  the coils must not overlap: coaxial, centres at least half of each winding length (N p) apart,
//          so that the end turns are a pitch apart; side by side, d at least the sum of the outer radii. The filament model ignores the wire's cross-section and
//          the helix's pitch angle, both second order for coils apart.
// Accuracy (tests/cpp/test_coupling.cpp, tests/python/test_coupling.py): the parallel-axis integral
//          against Neumann's double integral 1e-9 (Boost) and 1e-8 (scipy); two halves of a coil against the
//          filament model 1.6e-15; at 20 diameters within 1.1e-4 of the magnetic dipoles.
#pragma once

#include <string>

#include "libcoil/models/solenoid.hpp"
#include "libcoil/spec/choices.hpp"

namespace libcoil {


// M in H between coil a and coil b, the centre of b at `distance` from a's: along the common axis
// (coaxial) or across, parallel axes (side by side, with an optional axial offset of b's centre). The
// sign follows both windings turning the same way: positive coaxial, negative side by side in the far
// field. Throws InputError("distance", ...) where the coils would overlap.
double coil_mutual_inductance(const Solenoid& a, const Solenoid& b, Arrangement arrangement, double distance,
                              double axial_offset = 0);

// Mutual inductance of two circular filaments with parallel axes: radii a and b, centres `distance` apart
// across the axes and `axial_offset` along them. At distance 0 it is Maxwell's formula.
double parallel_filament_mutual_inductance(double radius_a, double radius_b, double distance, double axial_offset);

// The far field: both coils as magnetic dipoles m = N pi a^2, on the axis mu0 m1 m2 / (2 pi d^3), across it
// -mu0 m1 m2 / (4 pi d^3) (textbook magnetostatics). H.
double dipole_mutual_inductance(const Solenoid& a, const Solenoid& b, Arrangement arrangement, double distance);

struct Coupling {
    double mutual = 0;          // H
    double inductance_a = 0;    // H, each coil's recommended inductance
    double inductance_b = 0;
    double coefficient = 0;     // k = M / sqrt(L_a L_b)
};
Coupling coupling(const Solenoid& a, const Solenoid& b, Arrangement arrangement, double distance, double axial_offset = 0);

// What the coupling means at a frequency: coil a driven from a source of resistance R_s, coil b loaded by
// R_l, each coil R + j w L with its resistance at that frequency (below the self-resonance).
struct Crosstalk {
    double frequency = 0;            // Hz
    double transfer_impedance = 0;   // ohm, |V_b open circuit / I_a| = w |M|
    double transfer_db = 0;          // dB, 20 log10 |2 V_load / V_source| sqrt(R_s / R_l): the |S21| of the pair
};
Crosstalk crosstalk(const Coupling& c, double frequency, double resistance_a, double resistance_b, double source_resistance,
                    double load_resistance);

}  // namespace libcoil
