// Internal: the design search's evaluation of one candidate, step by step, and what one thread keeps.
//
// The steps, in order of cost: fit (the shield, the outer diameter, the room for a winding, the groove),
// solve (the turns and pitch that meet the target, with the shield's change of L), figures, wire length,
// thermal (winding_heat.hpp, as `coil analyze` computes it), band (band_check.hpp's screen_band on the
// coil as mounted: with a shield, its high-frequency L, its capacitance and the shielded SRF), and last
// the loss at the reference frequency. A failing step counts the candidate under its reason.
#pragma once

#include <array>
#include <limits>
#include <memory>
#include <cstddef>
#include <cstdint>
#include <functional>
#include <optional>
#include <string>
#include <vector>

#include "libcoil/models/losses.hpp"
#include "libcoil/models/nagaoka.hpp"
#include "libcoil/models/rosa.hpp"
#include "libcoil/models/solenoid.hpp"
#include "libcoil/spec/requirement.hpp"
#include "libcoil/studies/band_check.hpp"
#include "libcoil/studies/design.hpp"
#include "libcoil/studies/fixture_study.hpp"
#include "studies/inductance_fall_screen.hpp"
#include "studies/pareto_archive.hpp"

namespace libcoil::detail {

// Band screening points during the search: the winners are checked in full at 512.
inline constexpr int screen_points = 9;
// Fixture screening points over its reference band (log spaced): the winner is checked by the fixture study.
inline constexpr int fixture_points = 25;

struct Candidate {
    std::size_t wire;
    double form_diameter, ratio;
    // The chunk of the grid it was handed out in (design_grid.cpp): outcomes repeat only within one chunk, so that
    // how the chunks fall to threads cannot change them. None: the candidate stands alone.
    std::size_t chunk = SIZE_MAX;
};

// Why a candidate fails, with the key the report and JSON use and the words of the binding-limit note.
enum class Reason : std::size_t {
    outer_diameter, length, wire_length, thermal, srf_margin, max_deviation, min_impedance,
    inductance_out_of_reach, snapping, groove, shield, model_domain, fixture, count
};
struct ReasonText {
    const char *key, *words;
};
constexpr std::array<ReasonText, static_cast<std::size_t>(Reason::count)> reason_text{{
    {"outer_diameter", "the outer diameter limit"},
    {"length", "the length limit (the target needs more winding than fits)"},
    {"wire_length", "the wire length limit"},
    {"thermal", "the thermal limit (enamel class or former service temperature)"},
    {"srf_margin", "the band's SRF margin"},
    {"max_deviation", "the band's deviation limit"},
    {"min_impedance", "the band's minimum impedance"},
    {"inductance_out_of_reach", "the target inductance (out of reach with these turns)"},
    {"snapping", "snapping the turns to the step"},
    {"groove", "the former's groove (the pitch must exceed the wire by the groove's clearance)"},
    {"shield", "the shield (its inner diameter, or the shielded inductance after the trim)"},
    {"model_domain", "the models' domain"},
    {"fixture", "the fixture's port tolerance"},
}};

// The words of a reason's key ("the length limit ..."), for the binding-limit note.
std::string reason_words(const std::string& key);

// One thread's share of the search: its Pareto archive, counts and closest miss.
struct Tally {
    Archive front;
    std::array<std::size_t, static_cast<std::size_t>(Reason::count)> rejected = {};
    std::optional<Rejection> closest = std::nullopt;
    // The least excess over each criterion's limit among the candidates it stopped (infinity: none).
    std::array<double, static_cast<std::size_t>(Reason::count)> best_excess = [] {
        std::array<double, static_cast<std::size_t>(Reason::count)> a{};
        a.fill(std::numeric_limits<double>::infinity());
        return a;
    }();
    std::size_t feasible = 0;
    double sheet_rho = -1;  // Nagaoka's coefficient at the last longest winding's D / l
    NagaokaSlope sheet{};
    // The last wire and form whose longest winding fell short of the target, and in which model (Rosa's
    // or the filament sum's); see Evaluator::check.
    struct ShortOfTarget {
        std::size_t wire = SIZE_MAX;
        double form_diameter = 0;
        bool rosa = false;
    } short_of_target{};
    // The outcomes of one wire and form's candidates in one chunk, by the turns they snap to. The pitch ratios
    // that snap to the same turns trim to the same pitch whatever grid pitch the trim starts from (L falls as
    // the pitch grows), so they are one coil: the first one's outcome stands for the rest (Evaluator::solve).
    // Where a trim stops short of its target's fixed point (58 of the 12 055 coils of the dense grid of
    // benchmarks/side_by_side.py, where four candidates share each), the first ratio's coil is the one counted.
    struct Outcome {
        double turns;
        bool done = false, feasible = false;
        Reason reason = Reason::count;
        double excess = 0;
        DesignFigures design{};  // where feasible
    };
    struct Repeats {
        std::size_t chunk = SIZE_MAX, wire = SIZE_MAX;
        double form_diameter = 0;
        std::vector<Outcome> outcomes;
        std::size_t recording = SIZE_MAX;  // the outcome the candidate being checked will write
    } repeats{};

    // A miss known to be no closer than one already counted.
    void count(Reason reason) { ++rejected[static_cast<std::size_t>(reason)]; }

    // The candidate being checked is feasible (see reject() for its misses).
    void pass(const DesignFigures& d) {
        ++feasible;
        front.add(d);
        if (Outcome* o = recording()) {
            o->done = o->feasible = true;
            o->design = d;
            repeats.recording = SIZE_MAX;
        }
    }

    // `detail` is built only when this miss is the closest so far (it is text, and most misses are not).
    template <class Detail>
    void reject(Reason reason, double excess, const Detail& detail) {
        const auto r = static_cast<std::size_t>(reason);
        if (Outcome* o = recording()) {
            o->done = true;
            o->reason = reason;
            o->excess = excess;
            repeats.recording = SIZE_MAX;
        }
        ++rejected[r];
        best_excess[r] = std::min(best_excess[r], excess);
        if (!closest || excess < closest->excess) keep_closest(r, excess, detail);
    }

private:
    Outcome* recording() { return repeats.recording < repeats.outcomes.size() ? &repeats.outcomes[repeats.recording] : nullptr; }
    // Out of line and cold: the text is built rarely, and kept apart it leaves the search's hot code small.
    template <class Detail>
    [[gnu::noinline, gnu::cold]] void keep_closest(std::size_t r, double excess, const Detail& detail) {
        closest = Rejection{reason_text[r].key, excess, detail()};
    }
};

// One evaluation of the recommended inductance: where, what, and its slopes where Rosa's form gives them.
struct Point {
    double n = 0, p = 0;
    RecommendedInductance l;
};

// The screen's fall of L from DC to the target frequency at one geometry (Evaluator::screen_fall_estimate), as a
// function of L_dc: `constant` (H; the closed form's, or the retarget's offset) less `ratio` times L_dc (the fit's).
struct FallEstimate {
    double constant = 0, ratio = 0;
    // H (negative) for L_dc `l_dc`; without it, for the L_dc that meets `target` with this fall.
    double at(std::optional<double> l_dc, double target) const { return constant - ratio * (l_dc ? *l_dc : target / (1 - ratio)); }
};

// What the geometry steps settle for a candidate.
struct Geometry {
    double d_ins = 0, mean = 0, outer = 0, room = 0;  // m; room: for N p
    double n = 0, p = 0, n_solved = 0, p_grid = 0;    // the turns and pitch found, before snapping and trim
    double bare_inductance = 0;                        // H, unshielded, at (n, p)
    double shielded_change = 0;                        // H, the shield's high-frequency change at (n, p)
    std::optional<FallEstimate> fall;                  // the screen's fall at (n, p), where the solve took it there
};

class Evaluator {
public:
    explicit Evaluator(const Requirement& q);

    double ceiling() const { return ceiling_; }

    // A model that still throws for a candidate (a DomainError from a result out of double range, say)
    // rejects that candidate under the models' domain; it never stops the search or its thread.
    void evaluate(const Candidate& c, Tally& t) const;
    // A kept design with the turn network's SRF (recommended): its figures updated, and the band's first
    // miss, if any, on the coil as mounted; with the build's spread in the SRF's band, as the analysis has it,
    // where `with_build_spread`.
    std::optional<BandMiss> confirm(DesignFigures& d, bool with_build_spread) const;
    // For the screen: the highest SRF the turn network can have for this coil, from the screen's self-resonance
    // `screen` (the sheath helix's, on the former fd).
    double network_srf_bound(const Solenoid& s, double inductance, const SelfResonance& screen, const FormerDielectric& fd) const;
    // The turn network's SRF on the former fd over its bare one, at most, from the sheath helix's on it (`on`)
    // and bare (`bare`); 1 where the former's fit does not hold.
    double former_fall_bound(const Solenoid& s, const FormerDielectric& fd, const SelfResonance& on, const SelfResonance& bare) const;
    // A kept design trimmed (its pitch, the turns kept) so that the wire-harmonic solver's L at the target
    // frequency meets the target; its figures recomputed. False if no pitch of its candidate does.
    bool retarget(DesignFigures& d) const;
    double inductance_at_target(const DesignFigures& d) const;
    // R and Q at the reference frequency by the analysis's loss model, for a design confirmed after its retarget.
    void reference_losses(DesignFigures& d) const;
    double top_frequency() const;
    LossSolver loss_solver(const Solenoid& s) const;
    // The fixture criterion on a candidate's impedance (design_fixture.cpp): the first port's worst deviation
    // on the screen's points, as a miss where it passes the tolerance.
    std::optional<BandMiss> screen_fixture(const CoilImpedance& z) const;

private:
    void check(const Candidate& c, Tally& t) const;
    bool fit(const Candidate& c, Geometry& g, Tally& t) const;
    bool solve(const Candidate& c, Geometry& g, Tally& t) const;
    // Whether a candidate of this chunk, wire and form that snapped to `turns` was checked before: its outcome
    // is then counted again for c, which solved `solved` turns at its grid pitch `grid_pitch`. Else c's own
    // outcome will be recorded.
    bool repeated(const Candidate& c, double turns, double solved, double grid_pitch, Tally& t) const;
    DesignFigures figures(const Candidate& c, const Geometry& g, const Solenoid& s) const;
    bool screen_thermal(const Candidate& c, const Solenoid& s, DesignFigures& d, Tally& t) const;
    bool screen_band(const Candidate& c, const Solenoid& s, const Geometry& g, DesignFigures& d, Tally& t,
                     std::optional<double>& field) const;
    void loss_at_reference(const Solenoid& s, DesignFigures& d, const std::optional<double>& field) const;
    std::string what(const Candidate& c) const;
    double shield_change(double mean, std::size_t wire, double turns, double pitch) const;
    // L at the target frequency less L at DC (H, negative) as the screen estimates it for `turns` of wire
    // option `wire` at `pitch` on the mean diameter `mean`: retarget()'s offset where it set one, else the
    // fitted fall (inductance_fall_screen.hpp) where the analysis takes the wire-harmonic solver and the fit
    // holds, else the closed form's per metre of wire; as a function of L_dc (FallEstimate).
    FallEstimate screen_fall_estimate(std::size_t wire, double mean, double turns, double pitch) const;
    // The screen's impedance of a candidate of L_dc `l_dc` with the fitted fall of L at the band's screen points (the closed
    // forms' L(f) moved onto it; R as the closed forms have it), where screen_fall_estimate takes the fit; else none.
    WireLossTable fitted_wire(std::size_t wire, const Solenoid& s, double temperature, double l_dc) const;
    // Whether the analysis takes the wire-harmonic solver for `turns` of wire option `wire` at `pitch` (losses.hpp's
    // default_loss_solver): at most default_max_harmonic_unknowns at the top frequency (D / d is the fit's).
    bool solver_takes(std::size_t wire, double turns, double pitch) const;
    void prepare_fall();  // the members below, per wire option (design_fall.cpp)
    template <class F, class Guide>
    bool solve_pitch(double n, double p_min, double room, const F& L, const Guide& guide, double target, double& p,
                     const Point& last) const;

    const Requirement& q_;
    std::vector<Wire> unlabelled_;
    double ceiling_ = 0, reference_ = 0, limit_ = 0, fewest_turns_ = 1;
    double target_frequency_ = 0;
    // H: L(target frequency) - L(DC) that the low-frequency models' target makes up (screen_fall_estimate). Per wire
    // option: the closed form's per metre of wire (the internal inductance's change), the fit of the solver's
    // (where no shield is set and the wire is non-magnetic), and d / delta at the analysis's top frequency,
    // which with the turns decides whether the analysis takes the solver.
    std::vector<double> screen_fall_per_length_;
    std::vector<std::optional<InductanceFallFit>> fall_fit_;
    std::vector<double> top_d_over_delta_;
    std::vector<long> solver_takes_any_pitch_;  // the most turns (rounded) the solver takes at any pitch
    std::vector<double> band_points_;                           // Hz, the band screen's (band_check.hpp's screen_band)
    std::vector<std::vector<InductanceFallFit>> band_fall_fit_;  // per wire option, at each band point
    std::optional<double> fixed_offset_;          // H, set for one design by retarget()
    std::optional<double> fixed_ac_ratio_;        // the winding's R_ac / R_dc, set for one design by retarget()
    std::shared_ptr<const PortResponse> fixture_; // the fixture's port as the coil varies, at fixture_points
};

// The grid's candidate count, and the grid through the screen on `threads` threads (design_grid.cpp): one
// tally per thread, which design() merges.
std::size_t grid_size(const Requirement& q);
std::vector<Tally> screen_grid(const Requirement& q, const Evaluator& ev, unsigned threads,
                               const std::function<void(std::size_t, std::size_t)>& progress);

}  // namespace libcoil::detail
