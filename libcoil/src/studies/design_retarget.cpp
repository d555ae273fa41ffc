// The design search's last step for a kept design: the target met at the target frequency by the
// analysis's loss model (the wire-harmonic solver, or for fat wire the cross-section solver;
// design_search.hpp's Evaluator::retarget).
#include <algorithm>
#include <cmath>

#include "libcoil/core/constants.hpp"

#include "libcoil/models/losses.hpp"
#include "libcoil/models/shield.hpp"
#include "libcoil/models/wire_harmonics.hpp"
#include "libcoil/studies/winding_heat.hpp"
#include "studies/design_search.hpp"

namespace libcoil::detail {

// L at the target frequency as the analysis computes it: the wires' own L(f) by its loss model (in the
// shield's field, if any), plus the shield ring model's change
// of L at that frequency.
double Evaluator::inductance_at_target(const DesignFigures& d) const {
    const Solenoid s(Solenoid::Params{d.mean_diameter, d.turns, d.pitch, unlabelled_[d.wire_index], q_.lead_length});
    const double bare = d.inductance - (q_.shield ? shield_change(d.mean_diameter, d.wire_index, d.turns, d.pitch) : 0.0);
    const double temperature = d.temperature > 0 ? d.temperature : q_.ambient;
    const ShieldSpec* shield = q_.shield ? &*q_.shield : nullptr;
    double l = coil_at_frequencies_by(loss_solver(s), s, q_.conductor, temperature, bare, {target_frequency_}, top_frequency(), shield)
                   .front()
                   .inductance;
    if (shield) l += shielded_coil(s, bare, *shield, {target_frequency_}).points.front().inductance - bare;
    return l;
}

// The highest frequency the analysis of the design's spec asks for (the band's edges, the target's, the current's).
double Evaluator::top_frequency() const {
    double top = std::max(target_frequency_, q_.current_frequency.value_or(0.0));
    if (q_.band) top = std::max(top, q_.band->ceiling);
    return top;
}

// As the analysis of the design's spec decides (losses.hpp's default_loss_solver).
LossSolver Evaluator::loss_solver(const Solenoid& s) const {
    return default_loss_solver(s, q_.conductor, q_.ambient, top_frequency(), default_max_harmonic_unknowns);
}

bool Evaluator::retarget(DesignFigures& d) const {
    if (target_frequency_ <= 0) return true;
    Evaluator e = *this;
    const double d_ins = q_.wires[d.wire_index].wire.insulated_diameter();
    const Candidate c{d.wire_index, d.form_diameter, d.pitch_before_trim / d_ins};
    DesignFigures cur = d;
    const bool heated = q_.current > 0 && q_.current_frequency && *q_.current_frequency > 0 &&
                        loss_solver(Solenoid(Solenoid::Params{d.mean_diameter, d.turns, d.pitch, unlabelled_[d.wire_index], q_.lead_length})) !=
                            LossSolver::closed_form;
    // The solver's L at the target frequency and R_ac / R_dc of `cur`, kept while they are cur's (`fresh`):
    // where the loop settles, the coil returned is the one they were computed for.
    double at_target = 0;
    std::optional<double> ratio;
    bool fresh = false;
    // The offset each round's coil was trimmed with (the screen's estimate for d), its residual (the solver's
    // fall there less it), and the turns, for the secant step and to see the snapped turns flip back.
    double offset = d.inductance_at_target - d.inductance;
    std::optional<std::pair<double, double>> before;  // the previous round's offset and residual, on the same turns
    std::vector<double> turns_tried{cur.turns};
    for (int k = 0; k < 8; ++k) {
        at_target = inductance_at_target(cur);
        const double fall = at_target - cur.inductance;  // against the (shielded) nominal L
        // The winding heats with the solver's R_ac / R_dc too, as the analysis heats it.
        ratio.reset();
        if (heated) {
            const Solenoid s(Solenoid::Params{cur.mean_diameter, cur.turns, cur.pitch, unlabelled_[cur.wire_index], q_.lead_length});
            ratio = ac_ratio_by(loss_solver(s), s, q_.conductor, q_.ambient, *q_.current_frequency);
        }
        fresh = true;
        // Settled where the trim's offset is the fall to 1e-7 of L (the figures show four digits; the tests ask
        // 1e-6): with the screen's fitted fall that is the third round, where 1e-8 took a fourth to confirm.
        const bool settled = e.fixed_offset_ && std::fabs(*e.fixed_offset_ - fall) <= 1e-7 * q_.inductance &&
                             (!heated || std::fabs(*e.fixed_ac_ratio_ / *ratio - 1) <= 1e-10);
        if (settled) break;
        // The snapped turns back at a count an earlier round left: the trim sits where the turns flip, and the
        // rounds would alternate (until the eighth, at ten milliseconds each). This coil, its L fresh, is kept;
        // the check below judges whether it meets the target.
        if (std::count(turns_tried.begin(), turns_tried.end() - 1, cur.turns) > 0 && turns_tried.end()[-2] != cur.turns) break;
        // The next offset: the fall found (a fixed point's step, which shrinks the residual by the fall's slope
        // in the offset, a few hundredths), or on the same turns the secant through the last two rounds'
        // residuals, which reaches the settled offset in one or two rounds fewer.
        const double residual = fall - offset;
        double next = fall;
        if (before && before->second != residual) {
            const double secant = offset - residual * (offset - before->first) / (residual - before->second);
            if (std::isfinite(secant) && std::fabs(secant - fall) < 0.5 * std::fabs(residual)) next = secant;
        }
        before = std::pair{offset, residual};
        offset = next;
        e.fixed_offset_ = next;
        e.fixed_ac_ratio_ = ratio;
        Tally t;
        e.check(c, t);
        if (t.front.designs().size() != 1) return false;
        if (t.front.designs().front().turns != cur.turns) before.reset();
        cur = t.front.designs().front();
        turns_tried.push_back(cur.turns);
        fresh = false;
    }
    // The figures at the coil returned (the trim may end between two snapped turn counts): the solver's
    // L there, and the winding heated with the solver's R_ac / R_dc of this coil.
    cur.inductance_at_target = fresh ? at_target : inductance_at_target(cur);
    if (heated) {
        const Solenoid s(Solenoid::Params{cur.mean_diameter, cur.turns, cur.pitch, unlabelled_[cur.wire_index], q_.lead_length});
        e.fixed_ac_ratio_ = fresh ? ratio : ac_ratio_by(loss_solver(s), s, q_.conductor, q_.ambient, *q_.current_frequency);
        Tally t;
        if (!e.screen_thermal(c, s, cur, t)) return false;
        e.loss_at_reference(s, cur, std::nullopt);
    }
    if (std::fabs(cur.inductance_at_target / q_.inductance - 1) > q_.tolerance) return false;
    cur.score = d.score;
    cur.wire_label = d.wire_label;
    d = cur;
    return true;
}

// R and Q at the reference frequency by the analysis's loss model (the screen ranked with the closed forms'),
// for a design that passed its confirmation after the retarget: those dropped there never needed them (on the
// dense grid, 10 of 11 retargeted designs, a solve at the top frequency each).
void Evaluator::reference_losses(DesignFigures& d) const {
    if (reference_ <= 0) return;
    const Solenoid s(Solenoid::Params{d.mean_diameter, d.turns, d.pitch, unlabelled_[d.wire_index], q_.lead_length});
    const LossSolver solver = loss_solver(s);
    if (solver == LossSolver::closed_form) return;
    const double bare = d.inductance - (q_.shield ? shield_change(d.mean_diameter, d.wire_index, d.turns, d.pitch) : 0.0);
    d.resistance = coil_at_frequencies_by(solver, s, q_.conductor, d.temperature, bare, {reference_}, top_frequency()).front().resistance;
    d.q_factor = 2 * pi * reference_ * d.inductance / d.resistance;
}

}  // namespace libcoil::detail
