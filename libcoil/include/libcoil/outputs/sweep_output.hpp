// Files of an impedance sweep: CSV, a Touchstone v1.1 one-port, and an SVG picture. Formatting only.
//
// CSV columns (SI): frequency_Hz, impedance_magnitude_ohm, phase_deg, resistance_ohm, reactance_ohm,
// apparent_inductance_H, q_factor. Touchstone: "# Hz S RI R 50", S11 = (Z - R0) / (Z + R0) in real and
// imaginary parts at 17 significant digits, so that Z reads back to about 1e-15 away from resonance.
// The SVG has two panels on a log frequency axis: |Z| (log) with the ideal w L dashed, and the phase;
// the band is shaded and the self-resonance marked. Its elements carry ids and data- attributes
// (impedance, ideal, phase, band, srf, data-srf-hz, data-x-*) so that tests and scripts can read it.
#pragma once

#include <optional>
#include <string>
#include <vector>

#include "libcoil/models/impedance.hpp"

namespace libcoil {

std::string sweep_csv(const std::vector<ImpedancePoint>& points);
// `comments` are written as "! ..." lines before the option line.
std::string touchstone_s1p(const std::vector<ImpedancePoint>& points, const std::vector<std::string>& comments,
                           double reference_impedance = 50);

struct SweepPicture {
    std::string title;
    double inductance = 0;          // H, for the ideal w L line
    double self_resonance = 0;      // Hz, marked when inside the sweep
    std::optional<double> band_low, band_ceiling;  // Hz, shaded when given
    std::string model;              // "helical-line" or "lumped", for the legend
};
// Points at f <= 0 are left out of the picture (log axis). Needs two or more points above 0 Hz.
std::string impedance_svg(const std::vector<ImpedancePoint>& points, const SweepPicture& picture);

}  // namespace libcoil
