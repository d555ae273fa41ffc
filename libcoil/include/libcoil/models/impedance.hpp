// Impedance of the coil between its terminals, over frequency: the lumped and the helical-line forms.
//
// Method:  lumped: (R(f) + j w L(f)) in parallel with C, C the self-capacitance of a chosen model.
//          helical line (recommended; scaled in frequency, v(f) -> s v(f / s), so that it resonates at the
//          recommended SRF, the turn network's): the winding as a uniform line of length l = N p with series
//          impedance (R(f) + j w L(f)) / l and shunt admittance j w C' per metre, C' = 1 / (L' v^2), where
//          v is the sheath-helix phase velocity of the wave at that frequency (helical_line.hpp). Below
//          the first resonance the current pattern keeps the coil's own axial scale, so v is held at its
//          value there (beta never below beta_1); above it the dispersion sets beta. Both ends free:
//          Z = 2 Z0 tanh(gamma l / 2); one end grounded: Z = Z0 tanh(gamma l), gamma = sqrt(z y),
//          Z0 = sqrt(z / y). Lossless, this is the tan-shaped apparent inductance L tan(theta) / theta.
//          R(f) and L(f) are the closed forms of losses.hpp (skin and proximity effect).
//          With a shield (ShieldLoad): the series impedance gains the shield's change of L and its wall
//          loss at each frequency (shield.hpp's ring model, tabulated), the lumped C gains the capacitance
//          to the shield between the terminals, and the line's phase velocity is scaled, v(f) ->
//          s v(f / s) with s = f_shielded / f_bare, so that its first resonance lies at the shielded SRF
//          (shield.hpp's lumped estimate) and the dispersion above it keeps its shape.
//          A former's dielectric loss: its loss tangent on the share of the capacitance it brings, the
//          shunt admittance j w C (1 - j tan d) in both forms (as the turn network takes it).
// Source:  transmission-line theory (any text, e.g. Ramo, Whinnery & Van Duzer); the lumped model is the
//          common practice. The line form's low-frequency limit is R + j w L exactly.
// Domain:  up to about the second resonance; radiation, the leads and nearby metal are not modelled.
// Accuracy: that of R, L (losses.hpp, inductance.hpp) and of the self-resonance (self_resonance.hpp).
#pragma once

#include <complex>
#include <optional>
#include <vector>

#include "libcoil/models/losses.hpp"
#include "libcoil/models/materials.hpp"
#include "libcoil/models/self_resonance.hpp"
#include "libcoil/models/shield.hpp"
#include "libcoil/models/solenoid.hpp"

namespace libcoil {


struct ImpedancePoint {
    double frequency = 0;               // Hz
    std::complex<double> impedance{};   // ohm, between the terminals
    double wire_resistance = 0;         // ohm, the series R(f): the wire's, plus a shield's wall loss
    double wire_inductance = 0;         // H, the series L(f): the winding's, with a shield's change
    double apparent_inductance = 0;     // H, Im Z / w (the low-frequency L at DC); negative above resonance
    double q_factor = 0;                // Im Z / Re Z; negative above resonance (capacitive)

    double magnitude() const { return std::abs(impedance); }
    double phase() const { return std::arg(impedance); }  // rad
};

// The lumped form at angular frequency w (rad/s).
// `loss_tangent` (here and in the line form): the dielectric's, on the capacitance, j w C (1 - j tan d).
std::complex<double> lumped_impedance(double w, double resistance, double inductance, double capacitance, double loss_tangent = 0);
// The line form at w, for a line of `length` with total R and L and axial phase velocity v.
std::complex<double> line_impedance(double w, double resistance, double inductance, double phase_velocity,
                                    double length, Mounting mounting, double loss_tangent = 0);

// A coaxial shield around the coil, as the coil's impedance sees it.
struct ShieldLoad {
    ShieldTable table;                // the change of L and the wall's loss over frequency
    double terminal_capacitance = 0;  // F, the capacitance to the shield between the terminals
    double self_resonance = 0;        // Hz, the shielded SRF
    double inductance = 0;            // H, the shielded L at high frequency: the coil's nominal L in its shield
    bool by_network = false;          // the SRF from the turn network in its shield (else the lumped estimate)
    double radius_ratio = 0;          // the shield's inner radius over the coil's mean radius (shield_band_term)
};

// What a bench fit found outside the winding's models (records.hpp's BenchCorrections): the winding's R(f)
// times `resistance_scale`; a capacitance across the terminals, Y + j w C; the leads' series inductance,
// Z + j w L; and `resonance`, the first resonance as mounted with them (Hz; 0: the model's own).
struct TerminalTerms {
    double stray_capacitance = 0;  // F
    double lead_inductance = 0;    // H
    double resistance_scale = 1;
    double resonance = 0;          // Hz
};

class CoilImpedance {
public:
    // `wire`: the wire-harmonic solver's correction to the closed forms (losses.hpp); empty, the closed
    // forms as they stand.
    CoilImpedance(const Solenoid& coil, const Conductor& conductor, double temperature, double dc_inductance,
                  const SelfResonance& self_resonance, std::optional<ShieldLoad> shield = std::nullopt, WireLossTable wire = {});

    void set_terminal_terms(const TerminalTerms& t);
    // The dielectric's loss on the capacitance: the former's loss tangent times the share of the
    // capacitance it brings (analysis.hpp's dielectric_loss_tangent).
    void set_dielectric_loss(double loss_tangent);

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
    // The L the coil is meant to have where it works: the shielded high-frequency L in a shield, else the
    // low-frequency L. The band check's ideal wL uses it.
    double nominal_inductance() const { return shield_ ? shield_->inductance : dc_inductance_; }
    // The first self-resonance of the coil as mounted (in its shield, if any), Hz.
    double resonance() const { return terms_.resonance > 0 ? terms_.resonance : shield_ ? shield_->self_resonance : sr_.frequency; }
    // The lower edge of its band (self_resonance.hpp's srf_band): in a shield, scaled with the shielded SRF
    // and lowered by the shield's own term (self_resonance.hpp's shield_band_term: the network's error on the
    // shift measured against NEC2 where the shield lies in that reference's range, else half the shift).
    double resonance_low() const;
    const std::optional<ShieldLoad>& shield() const { return shield_; }
    double mean_square_field() const { return field_; }  // (A/m / A)^2, proximity.hpp
    const SelfResonance& self_resonance() const { return sr_; }

private:
    double bare_phase_velocity(double frequency) const;
    double helix_phase_velocity(double frequency) const;

    Solenoid coil_;
    Conductor conductor_;
    double temperature_, dc_inductance_;
    double field_;  // the proximity field sum, computed once
    SelfResonance sr_;
    SheathHelix helix_;
    std::optional<ShieldLoad> shield_;
    WireLossTable wire_;
    TerminalTerms terms_;
    double loss_tangent_ = 0;
};

}  // namespace libcoil
