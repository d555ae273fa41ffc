// The impedance sweep as files: CSV, a Touchstone v1.1 one-port, and an SVG picture. Formatting only: every
// number comes from the sweep study (sweep.hpp), which holds the coil as mounted.
//
// CSV: "# " lines saying what was swept (the model, the SRF, the mounting, a shield), then the columns (SI)
// frequency_Hz, impedance_magnitude_ohm, phase_deg, resistance_ohm, reactance_ohm, apparent_inductance_H,
// q_factor at 15 significant digits. Touchstone: "! " lines saying the same, "# Hz S RI R 50", S11 =
// (Z - R0) / (Z + R0) in real and imaginary parts at 17 significant digits, so that Z reads back to about
// 1e-15 away from resonance. The SVG has two panels on a log frequency axis: |Z| (log) with the ideal w L
// dashed, and the phase; the band is shaded and the self-resonance marked. Its elements carry ids and
// data- attributes (impedance, ideal, phase, band, srf, data-srf-hz, data-x-*) so that tests and scripts can
// read it.
#pragma once

#include <string>
#include <vector>

#include "libcoil/studies/sweep.hpp"

namespace libcoil {

// What the sweep describes, one line each: the header of every file.
std::vector<std::string> sweep_description(const Sweep& sweep);

std::string sweep_csv(const Sweep& sweep);
std::string touchstone_s1p(const Sweep& sweep, double reference_impedance = 50);
// Points at f <= 0 are left out of the picture (log axis). Needs two or more points above 0 Hz.
std::string impedance_svg(const Sweep& sweep);

}  // namespace libcoil
