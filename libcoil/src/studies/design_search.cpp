#include "studies/design_search.hpp"

#include <algorithm>
#include <cmath>
#include <utility>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/models/dc_resistance.hpp"
#include "libcoil/models/impedance.hpp"
#include "libcoil/models/inductance.hpp"
#include "libcoil/models/losses.hpp"
#include "libcoil/models/skin_effect.hpp"
#include "libcoil/models/proximity.hpp"
#include "libcoil/models/shield.hpp"
#include "libcoil/studies/band_check.hpp"
#include "libcoil/studies/sweep.hpp"
#include "libcoil/studies/cautions.hpp"
#include "libcoil/studies/winding_heat.hpp"
#include "models/monotone_root.hpp"
#include "core/text_format.hpp"

namespace libcoil::detail {

namespace {

std::string mm(double m) { return fixed(m * 1e3, 2) + " mm"; }

// Wheeler's formula W = mu0 pi a^2 N^2 / (N p + 0.9 a) (wheeler.hpp), scaled by c = L / W at a point
// (n0, p0) where the recommended L is known, and, where its slopes are known too, tilted by
// (1 + alpha (n - n0) + beta (p - p0)) so that it matches them. Near that point it follows the
// recommended model to about 1e-4 (scaled) or 1e-6 (matched as well), and its closed-form solutions and
// slopes start the root finders close to their roots.
class WheelerGuide {
public:
    WheelerGuide(double a, const Point& at, bool match_slopes)
        : a_(a), sheet_(mu0 * pi * a * a), n0_(at.n), p0_(at.p) {
        c_ = at.l.inductance / wheeler(at.n, at.p);
        if (match_slopes && at.l.has_slopes) {
            const double den = at.n * at.p + 0.9 * a;
            alpha_ = at.l.d_turns / at.l.inductance - (2 / at.n - at.p / den);
            beta_ = at.l.d_pitch / at.l.inductance + at.n / den;
        }
    }
    // N for L at pitch p: a quadratic in N (as the length is N p), untilted.
    double turns_for(double l, double p) const {
        const double w = l / (c_ * sheet_);
        return (w * p + std::sqrt(w * w * p * p + 4 * 0.9 * a_ * w)) / 2;
    }
    // p for L at N: c S N^2 (g + beta p) = L (N p + 0.9 a) is linear in p.
    double pitch_for(double l, double n) const {
        const double csn2 = c_ * sheet_ * n * n, g = 1 + alpha_ * (n - n0_) - beta_ * p0_;
        return (0.9 * a_ * l - csn2 * g) / (csn2 * beta_ - l * n);
    }
    // The untilted guide's slopes, for the first step where the model gives none (the filament sum).
    double slope_turns(double n, double p) const { return c_ * wheeler(n, p) * (2 / n - p / (n * p + 0.9 * a_)); }
    double slope_pitch(double n, double p) const { return -c_ * wheeler(n, p) * n / (n * p + 0.9 * a_); }

private:
    double wheeler(double n, double p) const { return sheet_ * n * n / (n * p + 0.9 * a_); }
    double a_, sheet_, n0_, p0_, c_ = 1, alpha_ = 0, beta_ = 0;
};

}  // namespace

std::string reason_words(const std::string& key) {
    for (const auto& t : reason_text) {
        if (key == t.key) return t.words;
    }
    return "the models' domain";
}

Evaluator::Evaluator(const Requirement& q) : q_(q) {
    // The wires without their labels: every coil built in the search copies its wire, and a long
    // label would cost an allocation each time. Text about a candidate takes the label from q.
    for (const WireOption& wo : q.wires) {
        unlabelled_.push_back(wo.wire);
        unlabelled_.back().label.clear();
    }
    ceiling_ = q.band ? q.band->ceiling : 0;
    reference_ = q.band ? q.band->ceiling : q.current_frequency.value_or(0);
    if (q.fixture) {
        const FixtureReference& r = *q.fixture->reference;
        fixture_ = std::make_shared<const PortResponse>(
            port_response(*q.fixture, q.fixture_part, q.inductance, frequency_grid(r.band_low, r.band_high, fixture_points, Spacing::logarithmic)));
        // Without a band, the fixture's band's top is where the SRF and the loss are weighed.
        if (!q.band) ceiling_ = reference_ = r.band_high;
    }
    fewest_turns_ = std::ceil(1 / q.turns_step - 1e-9) * q.turns_step;  // one turn or more, on the step
    limit_ = q.enamel_class;
    target_frequency_ = target_frequency(q);
    prepare_fall();
    if (q.former) limit_ = std::min(limit_, q.former->material.max_service_temperature);
}

std::string Evaluator::what(const Candidate& c) const {
    return q_.wires[c.wire].wire.label + " on " + mm(c.form_diameter) + " at pitch ratio " + fixed(c.ratio, 2);
}

// With a shield the unshielded models aim at the target less the shield's change of L (its
// high-frequency limit, shield.hpp), taken at the geometry of the moment and settled after the trim.
double Evaluator::shield_change(double mean, std::size_t wire, double turns, double pitch) const {
    return q_.shield ? shield_inductance_change(Solenoid(Solenoid::Params{mean, turns, pitch, unlabelled_[wire], 0}), *q_.shield) : 0.0;
}

void Evaluator::check(const Candidate& c, Tally& t) const {
    Geometry g;
    if (!fit(c, g, t) || !solve(c, g, t)) return;
    const Solenoid s(Solenoid::Params{g.mean, g.n, g.p, unlabelled_[c.wire], q_.lead_length});
    DesignFigures d = figures(c, g, s);
    if (q_.shield || target_frequency_ > 0) {  // the (shielded) L at the target frequency must meet the target
        const FallEstimate fall = g.fall ? *g.fall : screen_fall_estimate(c.wire, g.mean, g.n, g.p);
        d.inductance_at_target = d.inductance + fall.at(g.bare_inductance, q_.inductance);
        const double miss = d.inductance_at_target / q_.inductance - 1;
        if (std::fabs(miss) > q_.tolerance) {
            t.reject(q_.shield ? Reason::shield : Reason::inductance_out_of_reach, 1 + std::fabs(miss), [&] {
                return what(c) + ": the " + (q_.shield ? "shielded " : "") + "inductance misses the target by " + fixed(100 * miss, 2) + " %";
            });
            return;
        }
    }
    if (q_.max_wire_length && d.wire_length > *q_.max_wire_length) {
        t.reject(Reason::wire_length, d.wire_length / *q_.max_wire_length, [&] { return what(c) + ": wire " + fixed(d.wire_length, 2) + " m"; });
        return;
    }
    if (!screen_thermal(c, s, d, t)) return;
    std::optional<double> field;  // the proximity field sum, when the band screen computed it
    if (!screen_band(c, s, g, d, t, field)) return;
    loss_at_reference(s, d, field);
    t.pass(d);
}

// The shield, the outer diameter, the room for a winding.
bool Evaluator::fit(const Candidate& c, Geometry& g, Tally& t) const {
    g.d_ins = q_.wires[c.wire].wire.insulated_diameter();
    g.mean = c.form_diameter + g.d_ins;
    g.outer = g.mean + g.d_ins;
    if (q_.shield && !(g.outer < q_.shield->inner_diameter)) {
        t.reject(Reason::shield, g.outer / q_.shield->inner_diameter, [&] { return what(c) + ": outer diameter " + mm(g.outer) + " does not clear the shield"; });
        return false;
    }
    if (g.outer > q_.max_outer_diameter) {
        t.reject(Reason::outer_diameter, g.outer / q_.max_outer_diameter, [&] { return what(c) + ": outer diameter " + mm(g.outer); });
        return false;
    }
    g.room = q_.max_length - 2 * q_.former_ends - g.d_ins;  // for N * p
    if (!(g.room > 0)) {
        t.reject(Reason::length, (2 * q_.former_ends + g.d_ins) / q_.max_length, [&] { return what(c) + ": no room for a winding"; });
        return false;
    }
    return true;
}

// Pitch in [p_min, room / n] with L(n, p) = target to 1e-10; L falls as p grows. The guide gives the
// first guess; Newton's steps follow with Rosa's slope (the filament sum's secant steps start from
// the guide's). `p` receives the pitch; `last` is the last point `L` evaluated.
template <class F, class Guide>
bool Evaluator::solve_pitch(double n, double p_min, double room, const F& L, const Guide& guide, double target, double& p,
                        const Point& last) const {
    const double p_max = room / n;
    if (p_max < p_min) return false;
    const double g = guide.pitch_for(target, n);
    const double guess = std::isfinite(g) ? std::clamp(g, p_min, p_max) : 0.5 * (p_min + p_max);
    bool first = true;
    const auto pitch_step = [&](double x) {
        const double f = L(n, x) - target;
        const bool was_first = std::exchange(first, false);
        if (last.l.has_slopes) return detail::RootStep{f, f / last.l.d_pitch, true};
        return detail::RootStep{f, was_first ? f / guide.slope_pitch(n, x) : NAN};
    };
    // Curvature bound 4: in Wheeler's shape |p L'' / 2 L'| < 1, and Rosa's correction adds about
    // p / (2 pi a), well below 1 for any pitch the search allows.
    const auto r = detail::bracketed_steps(pitch_step, false, guess, {p_min, p_max}, 34, 4);
    if (r) p = *r;
    return r.has_value();
}

// The turns and pitch that meet the target: solved, snapped to the step, the pitch trimmed.
bool Evaluator::solve(const Candidate& c, Geometry& g, Tally& t) const {
    const double d_ins = g.d_ins, mean = g.mean, room = g.room;
    const double bare = q_.wires[c.wire].wire.bare_diameter;
    // The root finders stop at a point they evaluated: the last one is kept for reuse.
    Point last;
    const auto L = [&](double n, double p, const NagaokaSlope* sheet = nullptr) {
        last = {n, p, recommended_inductance_with_slopes(mean, n, p, bare, sheet)};
        return last.l.inductance;
    };
    const auto at = [&](double n, double p) { return last.n == n && last.p == p ? last.l.inductance : L(n, p); };
    // With a shield the unshielded models aim at the target less the shield's change of L (its
    // high-frequency limit, shield.hpp), taken at the geometry of the moment and settled after the trim.
    const auto shield_change = [&](double turns, double pitch) { return this->shield_change(mean, c.wire, turns, pitch); };
    // L's fall at the target frequency (negative): the solver's for a design being retargeted, else the
    // screen's estimate.
    // The last estimate and where, which the check after the solve takes again where it is (n, p).
    FallEstimate fall_at_last;
    double fall_n = -1, fall_p = -1;
    const auto fall = [&](double turns, double pitch) {
        fall_at_last = screen_fall_estimate(c.wire, mean, turns, pitch);
        fall_n = turns;
        fall_p = pitch;
        return fall_at_last.at(std::nullopt, q_.inductance);
    };
    const auto aim = [&](double turns, double pitch) { return q_.inductance - shield_change(turns, pitch) - fall(turns, pitch); };
    double target = q_.inductance;
    double n = 0, p = c.ratio * d_ins, n_solved = 0;
    const double p_grid = p;
    // A grooved or ribbed former needs the groove's clearance between turns: no pitch below it.
    const double p_min = d_ins + (q_.former ? q_.former->groove.clearance : 0);
    if (p < p_min) {
        t.reject(Reason::groove, p_min / p, [&] { return what(c) + ": pitch " + mm(p) + " below the wire plus the groove's clearance, " + mm(p_min); });
        return false;
    }
    try {
        if (q_.turns) {
            n = n_solved = *q_.turns;
            if (repeated(c, n, n, p, t)) return false;
            target = aim(n, p);
            L(n, p);
            if (!solve_pitch(n, p_min, room, L, WheelerGuide(mean / 2, last, false), target, p, last)) {
                const double l_touch = L(n, p_min);
                if (l_touch < target) {
                    t.reject(Reason::inductance_out_of_reach, target / l_touch, [&] { return what(c) + ": " + format_quantity(l_touch, Dimension::inductance) +
                             " at most with the fixed turns"; });
                } else {
                    t.reject(Reason::length, n * d_ins / room, [&] { return what(c) + ": the fixed turns do not fit the length"; });
                }
                return false;
            }
        } else {
            if (p > room) {  // else room / p >= 1 exactly
                if (const double n_max = room / p; n_max < 1) {
                    t.reject(Reason::length, 1 / n_max, [&] { return what(c) + ": not one turn fits"; });
                    return false;
                }
            }
            // The pitch ratios of one wire and form come in rising order, and within one model the
            // longest winding's inductance falls as the pitch grows: fewer turns over the same length.
            // (For Rosa's form, dL/d(1/p) > 0 holds where pi K D / p > A + B + 1 + N dB/dN; with
            // p <= 0.4 a the left side is at least 5 and the right below 3. The test
            // Design.LongestWindingFallsWithThePitch checks both models on a wide grid.) So once one
            // falls short, the rest in the same model do too, with a larger excess: they count under
            // the length limit unevaluated, and the closest miss cannot be among them. Across the
            // switch from Rosa's form to the filament sum (p = 0.4 a) the inductance can step up by
            // a few per cent, so there the evaluation resumes.
            const bool rosa = rosa_in_domain(p, mean / 2);
            if (!q_.shield && t.short_of_target.wire == c.wire && t.short_of_target.form_diameter == c.form_diameter &&
                t.short_of_target.rosa == rosa) {
                t.count(Reason::length);
                return false;
            }
            // Every pitch ratio of one wire and form gives the longest winding the same length, so
            // Nagaoka's coefficient there is computed once for them all.
            const double n_max = room / p;
            const double rho_room = mean / room;
            if (t.sheet_rho != rho_room) {
                t.sheet_rho = rho_room;
                t.sheet = nagaoka_coefficient_and_slope(rho_room);
            }
            target = aim(n_max, p);
            const double l_max = L(n_max, p, &t.sheet);
            if (l_max < target) {
                t.short_of_target = {c.wire, c.form_diameter, rosa};
                t.reject(Reason::length, target / l_max, [&] { return what(c) + ": " + format_quantity(l_max, Dimension::inductance) +
                         " with the longest winding that fits"; });
                return false;
            }
            // Wheeler, scaled to the recommended model at the longest winding, gives the first guess
            // (good to a few 1e-3). Newton's steps follow with Rosa's slopes; the filament sum's
            // secant steps start from the guide's slope.
            const WheelerGuide from_max(mean / 2, last, false);
            const double guess = from_max.turns_for(target, p);
            bool first = true;
            const auto turns_step = [&](double x) {
                const double f = L(x, p) - target;
                const bool was_first = std::exchange(first, false);
                if (last.l.has_slopes) return detail::RootStep{f, f / last.l.d_turns, true};
                return detail::RootStep{f, was_first ? f / from_max.slope_turns(x, p) : NAN};
            };
            // Curvature bound 2: L(n) has Wheeler's shape n^2 / (n p + b), for which |n L'' / 2 L'| < 1/2.
            const auto solved = detail::bracketed_steps(turns_step, true, guess, {1, n_max, std::nullopt, l_max - target}, 21, 2);
            if (!solved) {
                const double l_one = L(1, p);
                t.reject(Reason::inductance_out_of_reach, l_one / target, [&] { return what(c) + ": one turn already gives " +
                         format_quantity(l_one, Dimension::inductance); });
                return false;
            }
            n_solved = *solved;
            if (q_.shield) {  // the shield's change at the solved length, and the turns again for it
                target = aim(n_solved, p);
                first = true;
                if (const auto again = detail::bracketed_steps(turns_step, true, n_solved, {1, n_max, std::nullopt, std::nullopt}, 21, 2)) {
                    n_solved = *again;
                }
            }
            // Snap to the step; trim the pitch. The nearest step first, then its neighbours. The guide
            // is rescaled (and matched to the slopes) at the solve's last point, beside the solution.
            const double step = q_.turns_step;
            const double nearest = std::max(fewest_turns_, std::round(n_solved / step) * step);
            if (repeated(c, nearest, n_solved, p, t)) return false;
            const WheelerGuide guide(mean / 2, last, true);
            bool done = false;
            for (double offset : {0.0, -1.0, 1.0}) {
                n = nearest + offset * step;
                if (n < 1) continue;
                if (solve_pitch(n, p_min, room, L, guide, target, p, last)) {
                    done = true;
                    break;
                }
            }
            if (!done) {
                t.reject(Reason::snapping, 1.0 + step / n_solved, [&] { return what(c) + ": no pitch meets the target after snapping the turns"; });
                return false;
            }
        }
        // The shield's change and L's fall move with the trimmed pitch and the snapped turns: the target is the
        // fixed point of aim(the pitch trimmed to it), a map of slope a few hundredths (0.07 on the dense
        // grid). A plain step, then secant steps, settle it to 1e-9 of L in two or three trims, where plain
        // steps left 3e-7 ... 2e-8 after four (the check after the figures rejects what still misses).
        if (double next = aim(n, p); q_.shield || next != q_.inductance) {
            double before_target = 0, before_miss = 0;
            for (int k = 0; k < 4; ++k) {
                const double miss = next - target;
                if (std::fabs(miss) <= 1e-9 * q_.inductance) break;
                double to = next;
                if (k > 0 && miss != before_miss) {
                    const double secant = target - miss * (target - before_target) / (miss - before_miss);
                    if (std::isfinite(secant) && std::fabs(secant - next) < std::fabs(miss)) to = secant;
                }
                before_target = target;
                before_miss = miss;
                target = to;
                if (!solve_pitch(n, p_min, room, L, WheelerGuide(mean / 2, last, true), target, p, last)) break;
                next = aim(n, p);
            }
        }
    } catch (const InputError&) {
        t.reject(Reason::model_domain, 10, [&] { return what(c) + ": outside the geometry the models accept"; });
        return false;
    } catch (const DomainError&) {
        t.reject(Reason::model_domain, 10, [&] { return what(c) + ": outside every inductance model's domain"; });
        return false;
    }
    g.n = n;
    g.p = p;
    g.n_solved = n_solved;
    g.p_grid = p_grid;
    g.bare_inductance = at(n, p);
    g.shielded_change = q_.shield ? shield_change(n, p) : 0.0;
    if (fall_n == n && fall_p == p) g.fall = fall_at_last;
    return true;
}

DesignFigures Evaluator::figures(const Candidate& c, const Geometry& g, const Solenoid& s) const {
    DesignFigures d;
    d.wire_index = c.wire;
    d.form_diameter = c.form_diameter;
    d.mean_diameter = g.mean;
    d.outer_diameter = g.outer;
    d.turns = g.n;
    d.turns_solved = g.n_solved;
    d.pitch = g.p;
    d.pitch_ratio = g.p / g.d_ins;
    d.pitch_before_trim = g.p_grid;
    d.winding_length = s.winding_length();
    d.overall_length = s.overall_length();
    d.length_with_ends = d.overall_length + 2 * q_.former_ends;
    d.wire_length = s.wire_length();
    d.inductance = g.bare_inductance + g.shielded_change;  // in the shield: its high-frequency L
    d.target_frequency = target_frequency_;
    d.inductance_at_target = d.inductance;
    d.volume = pi / 4 * g.outer * g.outer * d.length_with_ends;
    return d;
}

// The winding under the current: as `coil analyze` computes it (winding_heat.hpp), solved to the search's
// tolerance.
bool Evaluator::screen_thermal(const Candidate& c, const Solenoid& s, DesignFigures& d, Tally& t) const {
    const WindingHeat heat = winding_heat(s, q_.conductor, q_.current, q_.current_frequency, q_.ambient, limit_, fixed_ac_ratio_);
    d.temperature_limit = limit_;
    const WindingTemperature w = settle_winding(heat, search_tolerance, false);
    if (w.over_limit) {
        t.reject(Reason::thermal, w.excess, [&] {
            const WindingTemperature above = settle_winding(heat, search_tolerance, true);
            if (above.runaway) return what(c) + ": the winding would run away thermally";
            if (above.temperature <= 0) return what(c) + ": the winding settles at its limit";
            return what(c) + ": winding at " + format_quantity(above.temperature, Dimension::temperature) + ", limit " +
                   format_quantity(limit_, Dimension::temperature);
        });
        return false;
    }
    d.temperature = w.temperature;
    d.rise = w.rise;
    d.near_thermal_limit = d.temperature > limit_ - near_thermal_limit;
    d.dc_resistance = dc_resistance(q_.conductor, s.wire().bare_diameter, s.wire_length(), d.temperature);
    return true;
}

// The self-resonance and the band, on the coil as mounted. With a shield the screen takes its
// high-frequency L, no wall loss and the shielded SRF (the full re-analysis of the winners takes the ring
// model's L(f) and loss).
bool Evaluator::screen_band(const Candidate& c, const Solenoid& s, const Geometry& g, DesignFigures& d, Tally& t,
                            std::optional<double>& field) const {
    SelfResonance sr;
    const FormerDielectric fd = q_.former ? q_.former->dielectric(c.form_diameter) : FormerDielectric{};
    try {
        sr = self_resonance(s, g.bare_inductance, fd, q_.surroundings, false);
    } catch (const DomainError&) {
        t.reject(Reason::model_domain, 10, [&] { return what(c) + ": no self-resonance model holds"; });
        return false;
    }
    // In the shield: its capacitance between the terminals joins the coil's own, with the shielded L (the
    // lumped estimate coil analyze reports; shield.hpp).
    const double c_t = q_.shield ? shield_terminal_capacitance(s, *q_.shield, q_.surroundings.mounting == Mounting::grounded_end) : 0;
    const auto as_mounted = [&](double f) { return q_.shield ? shielded_self_resonance(f, g.bare_inductance, d.inductance, c_t) : f; };
    d.self_resonance = as_mounted(sr.frequency);
    std::optional<ShieldLoad> shield;
    if (q_.shield) shield = ShieldLoad{ShieldTable::perfect(g.shielded_change), c_t, d.self_resonance, d.inductance};
    std::optional<BandMiss> miss;
    double network_bound = 0;  // the highest SRF the turn network can have (network_srf_bound), and its band
    SrfBand network{};
    if (q_.band) {
        d.srf_margin = d.self_resonance / q_.band->ceiling;
        // The SRF margin on a bound of what confirm() will judge, the lower edge of the turn network's band,
        // as mounted: a shield lowers the edge further; bounding without that is safe.
        network_bound = network_srf_bound(s, g.bare_inductance, sr, fd);
        network = srf_band(network_bound, "network", q_.surroundings.mounting, s.pitch_to_wire(), fd, 1.0, false);
        miss = screen_srf_margin(*q_.band, as_mounted(network.low));
    }
    // The impedance (and its proximity field sum, which the loss below reuses) only where a criterion needs it.
    const bool band_z = q_.band && (q_.band->max_deviation || q_.band->min_impedance);
    if (!miss && (band_z || fixture_)) {
        const WireLossTable wire = fitted_wire(c.wire, s, d.temperature, g.bare_inductance);  // L(f) with the fitted fall
        if (band_z) {
            // The band's |Z| as confirm() will judge it, with the line resonating at the turn network's SRF,
            // here at the most that can be: |Z|'s rise towards resonance only grows as the SRF falls, so a
            // deviation missed here is missed there too. (The sheath helix's own SRF, above the network's by
            // up to half, let through designs that confirm() then dropped, at milliseconds each.) The least
            // |Z| errs the other way, by (f / SRF)^2 at the band's low end where it binds: less than with the
            // sheath helix's SRF before. In a shield the screen keeps the sheath helix's: the shielded
            // network's SRF is not bounded here.
            SelfResonance judged = sr;
            if (!q_.shield) {
                judged.frequency = network_bound;
                judged.frequency_low = network.low;
                judged.frequency_high = network.high;
            }
            const CoilImpedance z(s, q_.conductor, d.temperature, g.bare_inductance, judged, shield, wire);
            field = z.mean_square_field();
            miss = libcoil::screen_band(*q_.band, z, screen_points);
        }
        if (!miss && fixture_) {
            const CoilImpedance z(s, q_.conductor, d.temperature, g.bare_inductance, sr, std::move(shield), wire);
            field = z.mean_square_field();
            miss = screen_fixture(z);
        }
    }
    if (!miss) return true;
    const std::string key = miss->criterion;
    const Reason reason = key == "srf_margin"      ? Reason::srf_margin
                          : key == "max_deviation" ? Reason::max_deviation
                          : key == "fixture"       ? Reason::fixture
                                                   : Reason::min_impedance;
    t.reject(reason, miss->excess, [&] {
        if (reason == Reason::srf_margin) return what(c) + ": SRF " + format_quantity(miss->value, Dimension::frequency);
        if (reason == Reason::max_deviation) {
            return what(c) + ": |Z| off wL by " + fixed(miss->value * 100, 1) + " % at " + format_quantity(miss->frequency, Dimension::frequency);
        }
        if (reason == Reason::fixture) {
            return what(c) + ": the fixture's port off its reference by " +
                   (fixture_->criterion.in_db ? fixed(miss->value, 2) + " dB" : fixed(miss->value * 100, 1) + " %") + " at " +
                   format_quantity(miss->frequency, Dimension::frequency);
        }
        return what(c) + ": |Z| " + format_quantity(miss->value, Dimension::resistance) + " at " + format_quantity(miss->frequency, Dimension::frequency);
    });
    return false;
}

// Loss and Q at the reference frequency.
void Evaluator::loss_at_reference(const Solenoid& s, DesignFigures& d, const std::optional<double>& field) const {
    d.reference_frequency = reference_;
    if (reference_ > 0) {
        const auto r = field ? ac_resistance(s, q_.conductor, d.temperature, reference_, *field)
                             : ac_resistance(s, q_.conductor, d.temperature, reference_);
        d.resistance = r.resistance;
        d.q_factor = 2 * pi * reference_ * d.inductance / r.resistance;
    } else {
        d.resistance = d.dc_resistance;
    }
}

}  // namespace libcoil::detail
