// Design synthesis: from a requirement to ranked, buildable coils.
//
// The search walks every (wire, form diameter, pitch ratio) of the requirement's grid. For each it solves
// the turns that hit the target inductance on the recommended model (Newton's steps on Rosa's slopes
// from a guess by Wheeler's formula, bracketed, with TOMS 748 from Boost.Math as the fallback), snaps
// them to the practical step, and trims the pitch the same way so that the target holds exactly after
// snapping. It then
// checks, in order of cost: the outer diameter, the length, the wire length, the thermal estimate
// against the enamel class and the former's service temperature, the self-resonance against the band's
// srf_margin, and the band's max_deviation and min_impedance on 9 log-spaced points. A candidate that
// fails is counted under its reason; one that passes joins the Pareto set over loss, size and SRF
// margin, which the search keeps instead of every candidate (memory stays bounded).
//
// The objective (lower is better) is  w_loss R / R_best + w_size V / V_best + w_srf s / s_best: each
// figure relative to the best feasible value of that figure, weighted:
//   loss  R_ac at the reference frequency (the band ceiling; else the current's frequency; else DC),
//   size  the outer volume pi/4 D_out^2 (overall length + former ends),
//   srf   ceiling / SRF (with no band: 1 MHz / SRF).
// A weighted sum with positive weights is minimised on the Pareto set, so ranking the set ranks all.
// The winner is re-analysed in full (analysis.hpp: the band check at 512 points, the shield's ring model,
// the thermal estimate) and, with a fixture criterion, in its fixture by the fixture study; if it fails
// there, the next one is taken and the report says so. The fixture criterion screens each candidate by
// the port's deviation at 25 log-spaced points of the fixture's band (fixture_study.hpp's PortResponse). The steps of
// one candidate's evaluation are in src/studies/design_search.hpp.
#pragma once

#include <cstddef>
#include <functional>
#include <map>
#include <optional>
#include <string>
#include <vector>

#include "libcoil/studies/analysis.hpp"
#include "libcoil/studies/fixture_study.hpp"
#include "libcoil/spec/requirement.hpp"
#include "libcoil/spec/spec.hpp"
#include "libcoil/studies/spread.hpp"

namespace libcoil {

struct DesignFigures {
    std::size_t wire_index = 0;
    std::string wire_label;
    double form_diameter = 0, mean_diameter = 0, outer_diameter = 0;  // m
    double turns = 0, pitch = 0, pitch_ratio = 0;  // pitch_ratio: pitch / insulated diameter, after the trim
    double turns_solved = 0;      // before snapping
    double pitch_before_trim = 0; // the grid's pitch
    double winding_length = 0, overall_length = 0, length_with_ends = 0, wire_length = 0;  // m
    double inductance = 0;        // H, recommended model (low frequency; in a shield its high-frequency L)
    double target_frequency = 0;  // Hz, where the target holds (target_frequency(requirement))
    double inductance_at_target = 0;  // H, there, by the wire-harmonic solver (the shield's change included)
    double self_resonance = 0;    // Hz
    double srf_margin = 0;        // SRF / ceiling (0 without a band)
    double dc_resistance = 0;     // ohm at the winding temperature
    double reference_frequency = 0, resistance = 0, q_factor = 0;  // R and Q at the reference frequency
    double temperature = 0, rise = 0, temperature_limit = 0;       // K
    double volume = 0;            // m^3
    double score = 0;             // the objective (lower is better)
    bool near_thermal_limit = false;
    // The three figures the Pareto set is built on, all to be minimised.
    double loss_metric() const { return resistance; }
    double srf_metric(double ceiling) const { return (ceiling > 0 ? ceiling : 1e6) / self_resonance; }
};

struct Rejection {
    std::string reason;   // "outer_diameter", "length", ...
    double excess = 0;    // how far over its limit, as a ratio (1.05: 5 % over); thermal: the power over
                          // what the winding sheds at its limit temperature
    std::string detail;   // the candidate and the figure, in words
};

struct DesignOptions {
    unsigned threads = 0;         // 0: all hardware threads
    std::size_t top = 10;         // designs to rank and report
    std::function<void(std::size_t, std::size_t)> progress;  // (done, total) candidates, from the calling thread
    bool spread = false;          // run the tolerance spread on the chosen design
    std::size_t samples = 2000;
    std::uint64_t seed = 1;
    bool seek_one_change = true;  // when nothing is feasible, search again with each limit relaxed alone
};

struct DesignResult {
    std::size_t candidates_evaluated = 0;
    std::size_t feasible = 0;
    std::map<std::string, std::size_t> rejected_by_reason;
    std::size_t front_size = 0;         // the non-dominated feasible designs the search kept
    std::vector<DesignFigures> pareto;  // the best `top` of them, ranked by score, confirmed with the turn
                                        // network's SRF (DesignSearch::confirm)
    std::optional<std::size_t> chosen;  // index into pareto
    std::string why_chosen;
    std::optional<Rejection> closest;   // when nothing is feasible: the attempt that came closest
    std::string binding;                // when nothing is feasible: which constraint binds, in words
    // When nothing is feasible: per criterion, the least excess over its limit that any candidate it stopped
    // reached (as Rejection::excess), and the one change of a limit found to make a design feasible, checked by
    // searching again with it ("" when no single change of a limit does).
    std::map<std::string, double> best_excess_by_reason;
    std::string one_change;
    std::vector<std::string> cautions;  // safety cautions the inputs call for
    std::vector<std::string> notes;     // assumptions
    std::vector<std::string> warnings;
    std::vector<CoilSpec> specs;              // the coil spec of each ranked design, for the first `top`
    std::optional<Analysis> chosen_analysis;  // the full re-analysis of the chosen design
    std::optional<Spread> spread;             // with DesignOptions::spread and a chosen design
    // With a fixture criterion: the chosen design in the fixture, by the full fixture study (its coil by the
    // full analysis and sweep), and in words why it passes where a coil-only margin would not.
    std::optional<FixtureResult> fixture_check;
    std::string fixture_words;
};

DesignResult design(const Requirement& requirement, const DesignOptions& options = {});

// The coil spec of a design, which `coil analyze`, `coil sweep` and the former generator accept.
CoilSpec design_spec(const Requirement& requirement, const DesignFigures& figures);
// The analysed coil's inductance at `frequency` (0: its nominal one), in its shield if it has one: what
// the design must meet the target with.
double inductance_at_target(const Analysis& analysis, double frequency);


}  // namespace libcoil
