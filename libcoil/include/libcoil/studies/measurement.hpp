// A measured coil: its impedance from a network file by the arrangement it was measured in, and the
// figures read straight from that impedance.
//
// Arrangements (the usual VNA fixtures; textbook network algebra, no source needed):
//   reflection      Z = Z0 (1 + S11) / (1 - S11)         (or the file's Z, or 1 / Y)
//   series-through  Z = 2 Z0 (1 - S21) / S21             (the coil between the ports)
//   shunt-through   Z = Z0 S21 / (2 (1 - S21))           (the coil from the line to ground)
// Sensitivity: a trace error dS (absolute) moves Z by dZ / Z = 2 dS / (1 - S11^2), resp. dS21 / (S21 (1 - S21))
// for both through arrangements. With dS = 0.001 (a calibrated analyser's trace noise: common practice, no
// source) the relative error e of each point is formed; its weight is min(1, (0.01 / e)^2), and the ranges
// where e passes 5 % are reported as poorly measured.
//
// Figures: the first self-resonance where Im(Y) of the coil passes zero from below (interpolated linearly
// in f, where Y is smooth), the second where Im(Z) passes zero from below; the low-frequency L and R of the
// model (R + jwL) || C at the lowest well-measured point with C = L / (R^2 + w0^2 L^2), which makes the
// model resonate at the measured SRF (solved by fixed point); |Z| at the SRF (the largest measured |Z|
// around it, refined by a parabola in log |Z| against log f), Q there as |Z| / (w0 L), and Q(f) = X / R.
#pragma once

#include <complex>
#include <optional>
#include <string>
#include <vector>

#include "libcoil/inputs/network_file.hpp"
#include "libcoil/spec/choices.hpp"
#include "libcoil/studies/analysis.hpp"

namespace libcoil {

struct MeasuredImpedance {
    std::vector<double> frequency;                  // Hz
    std::vector<std::complex<double>> impedance;    // ohm
    std::vector<double> relative_error;             // the arrangement's error at each point for dS = 0.001
    std::vector<double> weight;                     // 0 .. 1
    std::vector<std::string> notes;                 // the file's notes and the poorly measured ranges
    // What the instrument measured, for a fit to weigh its noise where it arises: S11 or S21 of the
    // arrangement at `reference` ohm with `trace_error` on each of its parts; nullopt, Z itself (an
    // impedance file, or points given outright) with relative_error (or 1 % over the root of the weight).
    std::optional<MeasurementArrangement> measured_as;
    double reference = 50;                          // ohm
};

// What sits between the analyser's reference plane and the coil, removed from the measurement.
//   network: a 2-port of S parameters, port 1 at the plane and port 2 at the coil (reflection only), at
//            frequencies covering the measurement's (interpolated linearly in real and imaginary parts);
//            the coil's reflection G = (Gm - S11) / (S12 S21 + S22 (Gm - S11)).
//   lumped:  a series inductance from the plane, then a capacitance across the coil's terminals (any
//            arrangement): Z = 1 / (1 / (Zm - j w L) - j w C).
struct Fixture {
    std::optional<NetworkData> network;
    double series_inductance = 0;  // H
    double shunt_capacitance = 0;  // F
};

// Throws InputError naming "arrangement" where the file does not suit it (ports, parameters, references),
// "fixture" where the fixture does not suit the file.
MeasuredImpedance measured_impedance(const NetworkData& data, MeasurementArrangement arrangement, const Fixture& fixture = {});

struct MeasuredFigures {
    double reference_frequency = 0;            // Hz, where L and R were read
    double inductance = 0;                     // H, of (R + jwL) || C
    double resistance = 0;                     // ohm, at the reference frequency
    std::optional<double> self_resonance;      // Hz
    std::optional<double> self_capacitance;    // F, the C of the model
    std::optional<double> impedance_at_resonance;  // ohm, |Z|
    std::optional<double> q_at_resonance;
    std::optional<double> second_resonance;    // Hz
    std::vector<double> q_factor;              // X / R at each frequency
};

MeasuredFigures measured_figures(const MeasuredImpedance& z);

// The trace error taken for every S parameter measured (|dS| on each part): a calibrated analyser's trace
// noise, common practice, no source.
inline constexpr double trace_error = 0.001;

// The quantity the arrangement measures, from the coil's Z: S11 = (Z - Z0) / (Z + Z0), series-through
// S21 = 2 Z0 / (2 Z0 + Z), shunt-through S21 = 2 Z / (2 Z + Z0).
std::complex<double> measured_quantity(MeasurementArrangement arrangement, std::complex<double> z, double reference);

}  // namespace libcoil

