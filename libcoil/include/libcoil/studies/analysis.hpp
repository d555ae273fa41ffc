// One coil, analysed: the geometry and every model's result, ready for a report.
#pragma once

#include <cstddef>
#include <functional>
#include <string>
#include <vector>

#include <optional>

#include "libcoil/studies/band_check.hpp"
#include "libcoil/models/cross_section.hpp"
#include "libcoil/models/impedance.hpp"
#include "libcoil/models/inductance.hpp"
#include "libcoil/models/losses.hpp"
#include "libcoil/spec/spec.hpp"

namespace libcoil {

enum class LossSolver { closed_form, filaments };

struct AnalysisOptions {
    LossSolver solver = LossSolver::closed_form;
    bool auto_subdivision = true;  // choose it from the highest frequency (subdivision_for)
    // closed_form only: where the closed-form proximity model is outside its 3 % domain (close-wound
    // turns, x > 3), take those points from the solver if it has at most this many unknowns; else warn.
    std::size_t fallback_unknowns = 1200;
    Subdivision subdivision{};     // for LossSolver::filaments when auto_subdivision is false
    std::function<void(std::size_t, std::size_t)> progress;      // (done, total) frequencies, filaments only
};

struct Analysis {
    CoilSpec spec;
    InductanceResult inductance;
    double dc_resistance = 0;                 // ohm, whole wire at the operating temperature
    std::vector<CoilAtFrequency> at_frequency;
    std::string loss_method = "closed-form";  // or "filaments"
    Subdivision subdivision{};                // what the solver used
    SelfResonance self_resonance;
    // Z between the terminals at each operating frequency: the helical-line form with the R and L above.
    std::vector<ImpedancePoint> impedance;
    std::optional<BandCheck> band;
    // The srf_margin criterion judged with Medhurst's SRF instead (when the band asks for it).
    std::optional<CriterionResult> band_srf_by_medhurst;
    std::vector<std::string> warnings;  // everything a reader must see: domains, fall-backs, cautions
    std::vector<std::string> notes;     // assumptions
    // With a shield: the shielded coil beside the unshielded one.
    struct Shielded {
        ShieldResult result;            // L(f) and the added R at the operating frequencies, the limits
        double terminal_capacitance = 0;  // F, the capacitance to the shield as seen between the terminals
        double self_resonance = 0;      // Hz, lumped estimate: L at the high-frequency limit, C + the above
    };
    std::optional<Shielded> shield;
};

Analysis analyze(const CoilSpec& spec, const AnalysisOptions& options = {});

// The impedance evaluator of an analysed coil (closed-form R and L), for sweeps and plots.
CoilImpedance coil_impedance(const Analysis& a);
// Frequencies from `from` to `to` (Hz), `points` >= 2, log (from > 0) or linear spacing.
std::vector<double> frequency_grid(double from, double to, int points, bool logarithmic);

}  // namespace libcoil
