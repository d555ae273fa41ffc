// The analysis study: one coil spec in, one record out, holding every number any output of `coil analyze`
// shows. It applies everything the spec asks for: the operating current (the winding's temperature, which
// then sets every loss figure), the former, the surroundings and mounting, and the shield. The band check,
// the impedance rows and the sweeps built on it (sweep.hpp) all see the coil as mounted: in its shield,
// with the shield's L(f), wall loss, capacitance and shifted SRF.
#pragma once

#include <cstddef>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "libcoil/models/cross_section.hpp"
#include "libcoil/models/impedance.hpp"
#include "libcoil/models/inductance.hpp"
#include "libcoil/models/losses.hpp"
#include "libcoil/models/wire_harmonics.hpp"
#include "libcoil/spec/spec.hpp"
#include "libcoil/studies/band_check.hpp"

namespace libcoil {

struct AnalysisOptions {
    LossSolver solver = LossSolver::harmonics;
    bool auto_subdivision = true;  // choose it from the highest frequency (subdivision_for)
    // closed_form only: where the closed-form proximity model is outside its domain (proximity.hpp),
    // take those points from the solver if it has at most this many unknowns; else warn.
    std::size_t fallback_unknowns = 1200;
    // harmonics: coils whose solve at the highest frequency takes more unknowns take the closed forms, with
    // a warning (the solve grows as their cube: 1000 take about 0.5 s a frequency).
    std::size_t max_harmonic_unknowns = default_max_harmonic_unknowns;
    Subdivision subdivision{};     // for LossSolver::filaments when auto_subdivision is false; sectors 0:
                                   // twice the layers
    std::function<void(std::size_t, std::size_t)> progress;      // (done, total) frequencies, filaments only
    // The wire-harmonic solver's loss table (its frequencies) on this many threads, 0: the hardware's. The
    // figures are the same to the bit whatever the threads.
    unsigned threads = 1;
};

// The winding under its operating current (winding_heat.hpp), when the spec gives one.
struct ThermalEstimate {
    double current = 0;                       // A
    std::optional<double> current_frequency;  // Hz
    double ambient = 0;                       // K
    double temperature = 0;                   // K, the balance (0 when it runs away)
    double rise = 0;                          // K
    double power = 0;                         // W
    double limit = 0;                         // K
    std::string limit_source;                 // "enamel class 155 °C", "PETG former, 65 °C"
    bool over_limit = false, runaway = false;
    bool sets_wire_temperature = false;       // the losses are taken at this temperature
};

struct Analysis {
    CoilSpec spec;  // as given, with operating.temperature set to the thermal estimate where that applies
    InductanceResult inductance{};
    double dc_resistance = 0;                 // ohm, whole wire at the operating temperature
    // The winding's own R and L: with a shield and the harmonics solver, the wires' in the shield's field
    // (the wall's loss and change of L are added where the impedance is formed).
    std::vector<CoilAtFrequency> at_frequency{};
    LossSolver loss_method = LossSolver::harmonics;
    WireLossTable wire_table{};               // harmonics: the closed forms' correction over the span (sweeps)
    Subdivision subdivision{};                // what the solver used
    SelfResonance self_resonance{};             // every model, for the bare coil
    std::optional<ThermalEstimate> thermal{};
    // With a shield: the shielded coil beside the unshielded one.
    struct Shielded {
        ShieldResult result;              // L(f) and the added R at the operating frequencies, the limits
        double terminal_capacitance = 0;  // F, the capacitance to the shield as seen between the terminals
        double self_resonance = 0;        // Hz: the turn network in the shield where the network gives the SRF,
                                          // else the lumped estimate (L at the high-frequency limit, C + the above)
        bool by_network = false;
        ShieldTable table{};                // the shield over the analysis's frequency span, for the impedance
    };
    std::optional<Shielded> shield{};
    // The former's loss tangent on the share of the capacitance it brings, 1 - (f_former / f_air)^2 by the
    // sheath helix (0 without a former): the dielectric loss of the impedance rows and the band check.
    double dielectric_loss_tangent = 0;
    // The first self-resonance of the coil as mounted: the shielded one in a shield, else the recommended.
    double self_resonance_as_mounted = 0;
    // The band it is expected in, as mounted (self_resonance.hpp's srf_band, and a shield's widening): the
    // band check judges the lower edge.
    double self_resonance_low_as_mounted = 0, self_resonance_high_as_mounted = 0;
    // Z between the terminals at each operating frequency, of the coil as mounted (helical-line form, with
    // the R and L of at_frequency and the shield's change).
    std::vector<ImpedancePoint> impedance{};
    std::optional<BandCheck> band{};
    // The srf_margin criterion judged with Medhurst's SRF instead (as mounted), when the band asks for it.
    std::optional<CriterionResult> band_srf_by_medhurst{};
    std::vector<std::string> cautions{};  // safety, as the inputs call for them (cautions.hpp)
    std::vector<std::string> warnings{};  // everything a reader must see: domains, fall-backs
    std::vector<std::string> notes{};     // assumptions
};

Analysis analyze(const CoilSpec& spec, const AnalysisOptions& options = {});

// The impedance of the analysed coil as mounted (closed-form R and L at each frequency, the shield's
// table), for sweeps and plots. A shield's table covers the analysis's span; where a sweep reaches
// further, give its span and the table is extended to cover it.
CoilImpedance coil_impedance(const Analysis& a);
CoilImpedance coil_impedance(const Analysis& a, double low, double high);

// The frequency span the analysis tabulates a shield over, and a sweep defaults to: from half the band's
// low edge (or SRF / 1000) to 3 x SRF (or twice the ceiling if higher), widened to the operating frequencies.
struct FrequencySpan {
    double low = 0, high = 0;  // Hz
};
FrequencySpan default_span(const Analysis& a);

// A shield in words, for the studies' records: "copper shield, inner diameter 60.00 mm, length 80.00 mm,
// wall 300.0 µm, open ends".
std::string shield_words(const ShieldSpec& shield);

}  // namespace libcoil
