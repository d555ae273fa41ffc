// Medhurst's self-capacitance of a single-layer solenoid: C = H(l/D) * D.
//
// Method:  Medhurst measured the self-capacitance of single-layer coils by resonating each with external
//          capacitors well below its self-resonance and extrapolating to zero added capacitance. His table
//          gives H in pF per cm of diameter against the length-to-diameter ratio; his empirical formula
//          H = 0.1126 (l/D) + 0.08 + 0.27 / sqrt(l/D) fits it. D is taken to the wire centre and l is the
//          current-sheet length N * p.
// Source:  R. G. Medhurst, "H.F. resistance and self-capacitance of single-layer solenoids", Wireless
//          Engineer 24, pp. 35-43 and 80-92 (1947). The points at l/D = 1, 2, 3, 4, 5 (0.46, 0.50, 0.61,
//          0.72, 0.81) are the published values; the other table points are reproduced from memory of the
//          table as handbooks print it (medhurst.cpp).
// Domain:  0.1 <= l/D <= 50, the table's range. Medhurst's coils stood upright with the lower end on a
//          grounded plate, so the figure describes a coil with one end grounded; it includes the strays of
//          that arrangement, and neither the pitch (he found little dependence) nor a former's permittivity.
// Accuracy: interpolation (monotone cubic in ln(l/D)) reproduces every table point exactly; the formula
//          lies within -7.7 % .. +3.6 % of the table over the domain (tests/cpp/test_self_capacitance.cpp).
#pragma once

namespace libcoil {

inline constexpr double medhurst_min_ratio = 0.1;   // l / D
inline constexpr double medhurst_max_ratio = 50.0;

// H in pF per cm of diameter, interpolated in the published table. Throws DomainError outside it.
double medhurst_h(double length_to_diameter);
// H from Medhurst's empirical formula (pF/cm). Throws DomainError outside the table's range.
double medhurst_h_formula(double length_to_diameter);
// Self-capacitance in F of a coil of mean diameter D and winding length l (both m), from the table.
double medhurst_capacitance(double mean_diameter, double winding_length);
// The same from the empirical formula (medhurst_h_formula).
double medhurst_capacitance_formula(double mean_diameter, double winding_length);

}  // namespace libcoil
