// The coil at a frequency: resistance, inductance and Q, by the closed forms or the numerical reference.
//
// Method:  closed form: R(f) from ac_resistance (DC at temperature, Bessel skin ratio, Butterworth's
//          proximity ratio). L(f) = L_dc - (mu0 / 8 pi) * helix length * (1 - L_int(f) / L_int(0)): the
//          recommended low-frequency inductance (which holds the internal inductance of a uniform current)
//          less what the skin effect removes from inside the wire. Q = 2 pi f L(f) / R(f).
//          Numerical: the cross-section solver's R(f) and its change of L with frequency, added to the
//          recommended L_dc; the rings' R is scaled from N ring circumferences to the helix length, and
//          the leads get the isolated-wire skin ratio.
// Source:  as the models used: skin_effect.hpp, proximity.hpp, cross_section.hpp, inductance.hpp.
// Domain:  below the self-resonance (the parallel capacitance is not modelled here).
// Accuracy: that of R (proximity.hpp: within 3 % of the solver for p/d >= 2.5) and of L (inductance.hpp).
#pragma once

#include <functional>
#include <utility>
#include <vector>

#include "libcoil/models/cross_section.hpp"
#include "libcoil/models/materials.hpp"
#include "libcoil/models/solenoid.hpp"
#include "libcoil/spec/choices.hpp"
#include "libcoil/spec/records.hpp"

namespace libcoil {

struct CoilAtFrequency {
    double frequency = 0;        // Hz
    double resistance = 0;       // ohm
    double skin_ratio = 1;       // isolated-wire R_ac / R_dc
    double proximity_ratio = 0;  // added by the other turns (closed form); solver: total ratio - skin ratio
    double inductance = 0;       // H, effective, including the internal-inductance change
    double q_factor = 0;         // omega L / R (0 at DC)
    bool resolved = true;        // solver only: the subdivision resolves the skin depth
    bool numerical = false;      // this point came from the cross-section solver
};

// The wire-harmonic solver at each frequency (wire_harmonics.hpp): the rings' R scaled to the helix length,
// the leads by their isolated-wire skin ratio, L = dc_inductance + L_h(f) - L_h(0). With `shield`, the
// wires' own R and L in the field of the shield's wall currents; the wall's own loss and change of L are
// left out here (the shield's ring model adds them where the impedance is formed, impedance.hpp).
// `threads`: the solves' (WireHarmonicSolver::solve; the figures the same to the bit whatever the threads).
std::vector<CoilAtFrequency> coil_at_frequencies_harmonic(const Solenoid& coil, const Conductor& conductor, double temperature,
                                                          double dc_inductance, const std::vector<double>& frequencies,
                                                          const ShieldSpec* shield = nullptr, unsigned threads = 1);

// The wire-harmonic solver's correction to the closed forms for any frequency, for sweeps of many points:
// the ratio R_h / R_closed and the difference L_h - L_closed solved on a log grid of `per_decade` points a
// decade over [low, high] (from where wire diameter / skin depth passes 0.7, below which both are the DC
// values to 1e-4; 3 a decade for big systems; only where wire_harmonics_apply allows the solve) and
// interpolated linearly in log f; beyond the grid the end values hold. With 5 points a
// decade the interpolated R is within 0.2 % of a direct solve between the points (tests/cpp/test_wire_harmonics.cpp).
class WireLossTable {
public:
    WireLossTable() = default;  // no correction: the closed forms as they stand
    // `threads`: the solves' (coil_at_frequencies_harmonic).
    WireLossTable(const Solenoid& coil, const Conductor& conductor, double temperature, double dc_inductance, double low,
                  double high, const ShieldSpec* shield = nullptr, int per_decade = 5, unsigned threads = 1);
    // A correction found elsewhere (the design screen's fitted fall of L): R_h / R_closed and L_h - L_closed (H)
    // at each of the ascending, positive `frequencies`.
    WireLossTable(std::vector<double> frequencies, std::vector<double> resistance_ratio, std::vector<double> inductance_offset);
    bool empty() const { return f_.empty(); }
    double resistance_ratio(double frequency) const;   // R_h / R_closed
    double inductance_offset(double frequency) const;  // H, L_h - L_closed
    // The closed-form points with the correction applied (CoilImpedance::sweep's wire).
    void correct(std::vector<CoilAtFrequency>& points) const;

private:
    std::vector<double> f_, ratio_, offset_;
};

// One wire on its own: what `coil wire` prints.
struct WireAtFrequency {
    double bare_diameter = 0, insulated_diameter = 0;  // m
    double dc_resistance_per_length = 0;              // ohm/m at the temperature
    double frequency = 0, skin_depth = 0;             // Hz, m (skin depth 0 at DC)
    double skin_ratio = 1;                            // isolated-wire R_ac / R_dc at the frequency
    double skin_onset_frequency = 0;                  // Hz where R_ac / R_dc reaches 1.1
};
WireAtFrequency wire_at_frequency(const Wire& wire, const Conductor& conductor, double temperature, double frequency);

// Closed forms at each frequency (f = 0 gives DC). `dc_inductance` is the recommended inductance.
std::vector<CoilAtFrequency> coil_at_frequencies(const Solenoid& coil, const Conductor& conductor, double temperature,
                                                 double dc_inductance, const std::vector<double>& frequencies);
// The same with the coil's mean_square_field_per_ampere (proximity.hpp) given, for callers that ask again
// and again for one coil.
std::vector<CoilAtFrequency> coil_at_frequencies(const Solenoid& coil, const Conductor& conductor, double temperature,
                                                 double dc_inductance, const std::vector<double>& frequencies,
                                                 double mean_square_field);

// The cross-section solver at each frequency. `progress(done, total)` is called after each solve. With
// `shield`, as coil_at_frequencies_harmonic: the wires' own R and L in the wall's field, the wall's share
// left out.
std::vector<CoilAtFrequency> coil_at_frequencies_numerical(
    const Solenoid& coil, const Conductor& conductor, double temperature, double dc_inductance,
    const std::vector<double>& frequencies, const Subdivision& subdivision = {},
    const std::function<void(std::size_t, std::size_t)>& progress = {}, const ShieldSpec* shield = nullptr);

// The loss model libcoil takes by default for a coil whose highest frequency of interest is `highest`
// (one rule for the analysis, its winding heat and the design search's last step): the wire-harmonic
// solver where it applies (wire_harmonics_apply); fat wire (mean diameter under min_harmonic_diameter_ratio
// wire diameters, non-magnetic) the cross-section solver, up to max_fat_wire_cells cells at subdivision_for
// of `highest` (its block form: 20 000 cells, 64 turns at d / delta 30, solve in 4.9 s on one core);
// else the closed forms.
inline constexpr double max_fat_wire_cells = 20000;
LossSolver default_loss_solver(const Solenoid& coil, const Conductor& conductor, double temperature, double highest,
                               std::size_t max_harmonic_unknowns);
// The cells the cross-section solver takes for `coil` with subdivision_for at `frequency`.
double cross_section_cells(const Solenoid& coil, double resistivity, double frequency);
// The coil at `frequencies` by `solver` (filaments: subdivision_for at `highest`); with `shield`, the wires'
// own R and L in its field (the solvers; the closed forms ignore it).
std::vector<CoilAtFrequency> coil_at_frequencies_by(LossSolver solver, const Solenoid& coil, const Conductor& conductor,
                                                    double temperature, double dc_inductance, const std::vector<double>& frequencies,
                                                    double highest, const ShieldSpec* shield = nullptr);

}  // namespace libcoil
