// Self-resonance and self-capacitance of a coil, by each model, with the recommended figure.
//
// Method:  network (recommended): the turn network (turn_network.hpp), the coupled turns' first natural
//          frequency, floating or with one end grounded; a dielectric former by the sheath helix's ratio.
//          helical_line: the sheath helix (helical_line.hpp) resonates first where the winding length
//          holds half an axial wavelength (both ends free: beta l = pi) or a quarter (one end grounded:
//          beta l = pi / 2). kandoian_sichak: the same resonance condition with Kandoian & Sichak's
//          empirical velocity. medhurst: the lumped resonance of L with Medhurst's measured C.
//          Each model's self-capacitance is the C that resonates with the low-frequency L at its SRF,
//          C = 1 / ((2 pi f)^2 L). A measurement far below resonance extrapolates to the smaller
//          low_frequency_capacitance = (pi^2 / 12) C of a line, since a line's apparent inductance rises
//          as L (1 + theta^2 / 3) where a lumped one rises as L (1 + w^2 L C).
// Why the network is recommended: against NEC2 it is within 2 % on free-standing coils where the sheath
//          helix reads 16 .. 47 % high (docs/models.md; each model's measured error is in its record).
//          Over max_network_turns the sheath helix, which long fine-pitch coils suit, gives the SRF;
//          where the sheath helix has no slow wave either (steep pitch over a dense core) Medhurst's value,
//          with a warning; outside all, DomainError. The SRF comes with its band (srf_band).
// Source:  medhurst.hpp, helical_line.hpp. D. W. Knight, "The self-resonance and self-capacitance of
//          solenoid coils" (2016, from memory) for the line view of self-capacitance.
// Domain:  single-layer coils below and near the first resonance. Neither model holds the turn-to-turn
//          capacitance of close-wound enamelled turns, which adds to C; leads and nearby metal add more.
// Accuracy: see docs/models.md and each method's error_low / error_high (measured against NEC2); Kandoian
//          & Sichak 3 .. 15 % below the sheath helix on the test grid; the helical line's grounded-end
//          low-frequency C is 0.39 .. 0.70 of Medhurst's table for l/D 0.4 .. 50.
#pragma once

#include <limits>
#include <optional>
#include <span>
#include <string>
#include <vector>

#include "libcoil/models/helical_line.hpp"
#include "libcoil/models/solenoid.hpp"
#include "libcoil/spec/records.hpp"

namespace libcoil {

struct SelfResonanceMethod {
    bool available = false;
    double frequency = 0;    // Hz, first self-resonance
    double capacitance = 0;  // F, equivalent parallel C with the low-frequency L
    // The model's error f / f_NEC2 - 1 measured on the NEC2 set (tests/reference/nec2) in this mounting:
    // free-standing coils in air, l/D 0.4 .. 15, p/d 2 .. 8 (tests/python/test_turn_network.py checks it).
    double error_low = 0, error_high = 0;
};

struct SelfResonance {
    double frequency = 0;    // Hz, recommended
    // The interval the first resonance is expected in (srf_band below): the recommended model's measured
    // error, widened for what is not yet validated. The band check judges the lower edge.
    double frequency_low = 0, frequency_high = 0;  // Hz
    std::vector<std::string> band_reasons;         // what widened it, in words
    // The turn network's first natural frequencies with the terminals open (up to three, Hz, the bare coil);
    // between free ends the even ones (symmetric) do not show at the terminals.
    std::vector<double> network_modes;
    double capacitance = 0;  // F, recommended
    std::string method = "helical_line";  // "network", "helical_line" or "medhurst"
    SelfResonanceMethod network, helical_line, kandoian_sichak, medhurst;
    double low_frequency_capacitance = 0;  // F, (pi^2 / 12) of the helical line's C (see above)
    double inductance = 0;                 // H, the low-frequency L used
    double winding_length = 0;             // m
    double resonance_wavenumber = 0;       // rad/m, axial beta at the first resonance
    double phase_velocity = 0;             // m/s, axial, at the first resonance (0 without a helical line)
    double pitch_angle = 0;                // rad
    double radius = 0;                     // m, sheath radius (mean radius)
    HelixMedium medium;                    // effective permittivities inside and outside
    Mounting mounting = Mounting::floating;
    double half_wave_wire_frequency = 0;   // Hz, where the wire (helix, no leads) is half a wavelength
    std::vector<std::string> warnings;
    std::vector<std::string> notes;
};

// The helical line's first resonance alone, with the former's fixed point, and no cross-checks or text:
// the fast path for searches (self_resonance() below builds on it). Throws DomainError where the sheath
// helix has no slow wave, InputError for bad permittivities or fill.
struct HelicalLineResonance {
    double frequency = 0;       // Hz
    double phase_velocity = 0;  // m/s, axial
    HelixMedium medium;         // the effective permittivities found
};
// `tolerance`: relative, on the wavenumber and on the former's fixed point.
HelicalLineResonance helical_line_resonance(const Solenoid& coil, const FormerDielectric& former = {},
                                            const Surroundings& surroundings = {}, double tolerance = 1e-12);
// Its frequency for bare coils floating in free air, several at once (their solves run side by side):
// helical_line_resonance's figure, to the bit, where the tabulated dispersion holds, NaN where it does not
// and for a null coil (the caller asks helical_line_resonance for those).
void bare_helical_line_frequencies(std::span<const Solenoid* const> coils, double tolerance, std::span<double> frequency);

// The turn network's first resonance (turn_network.hpp) for the coil in its surroundings: free space or
// one end grounded, a uniform medium, the former's polarisation charge (a tube, or a rod where its wall
// reaches the axis; ribs as a tube of their averaged permittivity, an equivalent), the turns' capacitance
// near-field corrected; in a shield where one is given (one end grounded is then one end to the shield).
// Nothing over max_network_turns turns. Over max_former_charge_turns the former enters by the sheath
// helix's ratio instead of its charge (former_ratio says by how much, and the band widens by half of it).
inline constexpr int max_network_turns = 600;  // the network's O(N^3) solve: 0.6 s at 600 turns
inline constexpr double max_former_charge_turns = 200;  // the former's charge solve: 0.12 s at 100 turns, 0.9 s at 300
struct NetworkResonance {
    double frequency = 0;    // Hz
    double former_ratio = 1; // the shift of an equivalent (ribs as a tube; a long coil's former by the sheath
                             // helix's ratio): the SRF with the former over without; 1 where solved as charge
    std::vector<double> modes;  // the first three natural frequencies, Hz (modes[0] = frequency)
};
std::optional<NetworkResonance> network_resonance(const Solenoid& coil, const FormerDielectric& former,
                                                  const Surroundings& surroundings, const ShieldSpec* shield = nullptr);

// The sheath helix's shift of the SRF by a former: its SRF on the former over its SRF without (at most 1),
// the equivalent that long coils and the fallback models take the former by.
double sheath_helix_former_ratio(const Solenoid& coil, const FormerDielectric& former, const Surroundings& surroundings);

// The interval around a recommended SRF `f` by `method` ("network", "helical_line", "medhurst") where the
// first resonance is expected:
//  - the model's measured error against NEC2 on its coils of pitch 3 wire diameters and more
//    (tests/reference/nec2, docs/models.md), widened by 0.5 % for NEC's own residual: the network floating
//    -1.28 .. +1.34 %, grounded end -1.76 .. -0.45 %; the sheath helix floating +16 .. +47 %, grounded end
//    -12 .. +18 %; Medhurst's table +-25 % (an assumption: his arrangement, not ours);
//  - turns closer than 3 wire diameters, where NEC2's thin wire no longer holds: the network's near-field
//    correction against the wire-surface reference, -2.7 .. +0.4 % (measured, tests/cpp/test_turn_network.cpp);
//  - a former: a tube's polarisation charge +-0.3 % (its discretisation, measured); ribs, taken as a tube of
//    their averaged permittivity (`former_ratio` the shift it makes), half that shift on each side.
struct SrfBand {
    double low = 0, high = 0;  // Hz
    std::vector<std::string> reasons;
};
// `with_reasons` false leaves `reasons` empty (the searches' fast path: the words cost more than the numbers).
SrfBand srf_band(double f, const std::string& method, Mounting mounting, double pitch_to_wire, const FormerDielectric& former,
                 double former_ratio, bool with_reasons = true);

// The turn network's error on a shield's shift of the SRF, (f_shield / f_bare) by the network over the same by
// NEC2, less 1: measured on helices in wire-grid cans and an open tube (tests/reference/nec2/shielded.json,
// docs/models.md), floating and with one end on the shield, over the range of the shield's inner radius to
// the coil's mean radius that set spans; enforced by tests/python/test_shielded_resonance.py. NEC2's grid
// (24 against 36 wires round the wall) moved the shielded SRF by 0.1 % at most: `nec_grid`.
struct ShieldShiftError {
    double low, high, nec_grid, radius_ratio_low, radius_ratio_high;
};
inline constexpr ShieldShiftError network_shield_shift_error{-0.0133, 0.0033, 0.001, 1.4, 3.0};

// The shield's term of the SRF's band, as factors on the SRF in the shield `shielded` (Hz) beside the bare
// coil's `bare`: where the network gives it (`by_network`) and the shield's inner radius over the coil's mean
// radius, `radius_ratio`, lies in the reference's range, its measured error on the shift (`measured`); else
// half the shift either side (the network) or half of a fall more below (the lumped estimate), unchecked.
struct ShieldBandTerm {
    double low = 1, high = 1;
    bool measured = false;
};
ShieldBandTerm shield_band_term(double shielded, double bare, bool by_network, double radius_ratio);

// The SRF's spread from the build (one standard deviation, relative): first order, each tolerance in turn
// moved by one standard deviation (form diameter, pitch, bare wire diameter at a fixed form, turns) and the
// turn network (the sheath helix over max_spread_network_turns) solved again, the shifts added in
// quadrature. A shield where given. `largest` receives the largest contributor's name. With `stop_above`, the
// sum stops at the first tolerance that takes it above that (a caller that only asks whether the spread
// exceeds it: the partial spread returned does, and the whole one would too).
inline constexpr double max_spread_network_turns = 150;
double srf_build_spread(const Solenoid& coil, const FormerDielectric& former, const Surroundings& surroundings,
                        const BuildTolerances& tolerances, const ShieldSpec* shield = nullptr, std::string* largest = nullptr,
                        double stop_above = std::numeric_limits<double>::infinity());

// `inductance` is the low-frequency inductance (inductance().recommended).
// What the fast paths for searches solve to (relative): a search's figures are shown to four digits and
// its decisions do not move at this level; its winners are re-analysed in full, to 1e-12.
inline constexpr double search_tolerance = 1e-7;

// `cross_checks` false is the fast path for searches, which need only the recommended SRF: it leaves out
// Kandoian & Sichak, and Medhurst except as the fallback, writes no notes and no band reasons, and solves to
// search_tolerance.
SelfResonance self_resonance(const Solenoid& coil, double inductance, const FormerDielectric& former = {},
                             const Surroundings& surroundings = {}, bool cross_checks = true);


}  // namespace libcoil
