// Skin effect in an isolated straight round wire, exact.
//
// Method:  the Bessel solution for a round conductor of radius r carrying a sinusoidal current. With
//          skin depth delta = sqrt(rho / (pi f mu0 mu_r)) and x = sqrt(2) r / delta (= |k r|),
//            R_ac / R_dc        = (x / 2) (ber bei' - bei ber') / (ber'^2 + bei'^2),
//            L_int(f) / L_int(0) = (4 / x) (ber ber' + bei bei') / (ber'^2 + bei'^2),
//          with L_int(0) = mu0 mu_r / (8 pi) per metre. Evaluated from the scaled Kelvin functions
//          (kelvin.hpp), so any x works; below x = 1e-3 the series 1 + x^4/192 (resistance) and
//          1 - x^4/384 (inductance) is used, whose next terms are below 1e-17. That is skin_ratios_series;
//          skin_ratios takes the same expressions tabulated (tools/skin_tables.py: piecewise Chebyshev
//          interpolants of mpmath's values at 50 digits on [0, 32], and in 32 / x beyond), 20 to 100 times
//          faster, within 2.1e-16 of mpmath on x = 0 .. 1e4 (tests/python/test_skin.py).
// Source:  Lord Kelvin (1889); S. Ramo, J. R. Whinnery, T. Van Duzer, "Fields and Waves in Communication
//          Electronics" (1994) sec. 5.5; H. B. Dwight, "Electrical Coils and Conductors" (1945).
// Domain:  straight, isolated round wire; for a coil turn the curvature correction is O((r/a)^2) and
//          the proximity of other turns is a separate model (proximity.hpp).
// Accuracy (tests/python/test_skin.py): against the same expressions in mpmath at 30 digits, x = 0..100,
//          measured 9e-15, enforced 1e-12; scipy.special.jv at complex argument to 1e-10; limits
//          1 + x^4/192 and r/(2 delta) + 1/4 + 3 delta/(32 r).
#pragma once

namespace libcoil {

// Skin depth in m for resistivity rho (ohm*m) at frequency f (Hz); relative permeability mu_r.
double skin_depth(double resistivity, double frequency, double relative_permeability = 1.0);

struct SkinRatios {
    double resistance = 1;           // R_ac / R_dc
    double internal_inductance = 1;  // L_int(f) / L_int(0)
};

// Ratios as functions of x = sqrt(2) r / delta >= 0, from the tables (within 2.1e-16 of mpmath for any x).
SkinRatios skin_ratios(double x);
// The same from the Kelvin functions' series (kelvin.hpp): the reference the tables are tested against.
SkinRatios skin_ratios_series(double x);
// Ratios for a wire of the given radius, resistivity and frequency (f = 0 gives 1, 1).
SkinRatios wire_skin_ratios(double wire_radius, double resistivity, double frequency, double relative_permeability = 1.0);

// Internal inductance of a round wire at DC, H per metre: mu0 mu_r / (8 pi).
double dc_internal_inductance_per_length(double relative_permeability = 1.0);

}  // namespace libcoil
