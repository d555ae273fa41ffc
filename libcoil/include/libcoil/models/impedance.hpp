// Impedance of the coil between its terminals, over frequency: the lumped and the helical-line forms.
//
// Method:  lumped: (R(f) + j w L(f)) in parallel with C, C the self-capacitance of a chosen model.
//          helical line (recommended): the winding as a uniform line of length l = N p with series
//          impedance (R(f) + j w L(f)) / l and shunt admittance j w C' per metre, C' = 1 / (L' v^2), where
//          v is the sheath-helix phase velocity of the wave at that frequency (helical_line.hpp). Below
//          the first resonance the current pattern keeps the coil's own axial scale, so v is held at its
//          value there (beta never below beta_1); above it the dispersion sets beta. Both ends free:
//          Z = 2 Z0 tanh(gamma l / 2); one end grounded: Z = Z0 tanh(gamma l), gamma = sqrt(z y),
//          Z0 = sqrt(z / y). Lossless, this is the tan-shaped apparent inductance L tan(theta) / theta.
//          R(f) and L(f) are the closed forms of losses.hpp (skin and proximity effect).
// Source:  transmission-line theory (any text, e.g. Ramo, Whinnery & Van Duzer); the lumped model is the
//          common practice. The line form's low-frequency limit is R + j w L exactly.
// Domain:  up to about the second resonance; radiation, the leads and nearby metal are not modelled.
// Accuracy: that of R, L (losses.hpp, inductance.hpp) and of the self-resonance (self_resonance.hpp).
#pragma once

#include <complex>
#include <vector>

#include "libcoil/models/materials.hpp"
#include "libcoil/models/self_resonance.hpp"
#include "libcoil/models/solenoid.hpp"

namespace libcoil {

enum class ImpedanceModel { helical_line, lumped };
const char* impedance_model_name(ImpedanceModel m);  // "helical-line", "lumped"

struct ImpedancePoint {
    double frequency = 0;               // Hz
    std::complex<double> impedance{};   // ohm, between the terminals
    double wire_resistance = 0;         // ohm, R(f) of the wire alone
    double wire_inductance = 0;         // H, L(f) of the wire alone
    double apparent_inductance = 0;     // H, Im Z / w (the low-frequency L at DC); negative above resonance
    double q_factor = 0;                // Im Z / Re Z; negative above resonance (capacitive)

    double magnitude() const { return std::abs(impedance); }
    double phase() const { return std::arg(impedance); }  // rad
};

// The lumped form at angular frequency w (rad/s).
std::complex<double> lumped_impedance(double w, double resistance, double inductance, double capacitance);
// The line form at w, for a line of `length` with total R and L and axial phase velocity v.
std::complex<double> line_impedance(double w, double resistance, double inductance, double phase_velocity,
                                    double length, Mounting mounting);

class CoilImpedance {
public:
    CoilImpedance(const Solenoid& coil, const Conductor& conductor, double temperature, double dc_inductance,
                  const SelfResonance& self_resonance);

    // Z at f (Hz, >= 0). For the lumped form `capacitance` (F) picks the self-capacitance; 0 takes the
    // recommended one.
    ImpedancePoint at(double frequency, ImpedanceModel model = ImpedanceModel::helical_line,
                      double capacitance = 0) const;
    std::vector<ImpedancePoint> sweep(const std::vector<double>& frequencies,
                                      ImpedanceModel model = ImpedanceModel::helical_line, double capacitance = 0) const;
    // Z at f from a wire resistance and inductance computed elsewhere (the cross-section solver's, say).
    ImpedancePoint with_wire(double frequency, double resistance, double inductance,
                             ImpedanceModel model = ImpedanceModel::helical_line, double capacitance = 0) const;

    // Axial phase velocity the line form uses at f (m/s).
    double phase_velocity(double frequency) const;
    double dc_inductance() const { return dc_inductance_; }
    double mean_square_field() const { return field_; }  // (A/m / A)^2, proximity.hpp
    const SelfResonance& self_resonance() const { return sr_; }

private:
    Solenoid coil_;
    Conductor conductor_;
    double temperature_, dc_inductance_;
    double field_;  // the proximity field sum, computed once
    SelfResonance sr_;
    SheathHelix helix_;
};

}  // namespace libcoil
