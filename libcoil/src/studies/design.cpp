#include "libcoil/studies/design.hpp"

#include <algorithm>
#include <array>
#include <atomic>
#include <chrono>
#include <cmath>
#include <cstdint>
#include <functional>
#include <sstream>
#include <thread>
#include <tuple>
#include <utility>

#include "libcoil/core/constants.hpp"
#include "libcoil/models/dc_resistance.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/impedance.hpp"
#include "libcoil/models/inductance.hpp"
#include "libcoil/models/proximity.hpp"
#include "libcoil/models/rosa.hpp"
#include "libcoil/models/thermal.hpp"
#include "libcoil/core/units.hpp"
#include "models/monotone_root.hpp"
#include "core/text_format.hpp"

namespace libcoil {

namespace {

constexpr double near_limit = 10.0;  // K: a winding this close to a thermal limit gets a warning
constexpr int screen_points = 9;     // band screening points during the search

std::string mm(double m) { return detail::fixed(m * 1e3, 2) + " mm"; }

struct Candidate {
    std::size_t wire;
    double form_diameter, ratio;
};

// The Pareto set is kept as an epsilon-Pareto archive (Laumanns, Thiele, Deb & Zitzler, Evolutionary
// Computation 10 (2002) 263): each figure is binned on a log scale of ratio 1 + epsilon, a design whose
// box is dominated by an archived box is dropped, and one box holds one design. Designs within 0.5 %
// on all three figures count as one, which keeps the set small and the insertion cheap.
constexpr double archive_epsilon = 0.005;

struct Box {
    int loss, size, srf;
    bool operator==(const Box&) const = default;
    bool at_or_below(const Box& o) const { return loss <= o.loss && size <= o.size && srf <= o.srf; }
};

bool dominates(const DesignFigures& a, const DesignFigures& b, double ceiling) {
    const double la = a.loss_metric(), lb = b.loss_metric(), va = a.volume, vb = b.volume;
    const double sa = a.srf_metric(ceiling), sb = b.srf_metric(ceiling);
    return la <= lb && va <= vb && sa <= sb && (la < lb || va < vb || sa < sb);
}

const double box_step = std::log1p(archive_epsilon);

// The archive stores box coordinates as 16-bit integers (half the work of its scans). A coordinate of
// 32767 bins is a figure of e^163, or 1e71 of its unit: clamping there touches no real design.
int bin(double figure) { return static_cast<int>(std::clamp(std::floor(std::log(figure) / box_step), -32767.0, 32767.0)); }

Box box_of(const DesignFigures& d, double ceiling) {
    return {bin(d.loss_metric()), bin(d.volume), bin(d.srf_metric(ceiling))};
}

// Distance of a design from its box's lower corner, in bins: the tie-break within one box.
double corner_distance(const DesignFigures& d, const Box& b, double ceiling) {
    const double x = std::log(d.loss_metric()) / box_step - b.loss;
    const double y = std::log(d.volume) / box_step - b.size;
    const double z = std::log(d.srf_metric(ceiling)) / box_step - b.srf;
    return x * x + y * y + z * z;
}

// The boxes, one array per figure, and their designs beside them: the dominance scan reads only the
// small integer arrays, in blocks the compiler vectorises.
class Archive {
public:
    explicit Archive(double ceiling = 0) : ceiling_(ceiling) {}

    void add(const DesignFigures& d) {
        const Box b = box_of(d, ceiling_);
        if (const std::size_t i = first_at_or_below(b); i < designs_.size()) {
            if (box(i) == b) {  // one design per box: the dominating one, else the nearer to the corner
                DesignFigures& f = designs_[i];
                if (dominates(f, d, ceiling_)) return;
                if (dominates(d, f, ceiling_) || corner_distance(d, b, ceiling_) < corner_distance(f, b, ceiling_)) f = d;
                return;
            }
            // Dominated. Neighbouring candidates tend to fall to the same box: move it forward, so that
            // the next scan usually stops early. The archive's content does not depend on its order.
            if (i > 0) swap(i, i / 2);
            return;
        }
        // A new box: it drops the boxes it dominates (none equals it, or the scan would have found it).
        // Most new boxes dominate none, which the vectorised scan says before any is touched.
        if (any_at_or_above(b)) {
            for (std::size_t i = designs_.size(); i-- > 0;) {
                if (b.at_or_below(box(i))) {
                    swap(i, designs_.size() - 1);
                    loss_.pop_back();
                    size_.pop_back();
                    srf_.pop_back();
                    designs_.pop_back();
                }
            }
        }
        loss_.push_back(static_cast<std::int16_t>(b.loss));
        size_.push_back(static_cast<std::int16_t>(b.size));
        srf_.push_back(static_cast<std::int16_t>(b.srf));
        designs_.push_back(d);
    }

    const std::vector<DesignFigures>& designs() const { return designs_; }
    std::vector<DesignFigures> take() { return std::move(designs_); }

private:
    Box box(std::size_t i) const { return {loss_[i], size_[i], srf_[i]}; }

    // The box in the stored width, so that the scans compare 16-bit integers (bin() keeps it in range).
    struct Narrow {
        std::int16_t loss, size, srf;
        explicit Narrow(const Box& b)
            : loss(static_cast<std::int16_t>(b.loss)), size(static_cast<std::int16_t>(b.size)), srf(static_cast<std::int16_t>(b.srf)) {}
    };
    static constexpr std::size_t block = 16;  // scanned with a fixed count and no branch: vector instructions

    // The first box at or below b in every figure, or size() if none.
    std::size_t first_at_or_below(const Box& box_b) const {
        const Narrow b(box_b);
        const std::size_t n = designs_.size();
        std::size_t start = 0;
        for (; start + block <= n; start += block) {
            std::int16_t any = 0;
            for (std::size_t j = 0; j < block; ++j) {
                const std::size_t i = start + j;
                any |= static_cast<std::int16_t>((loss_[i] <= b.loss) & (size_[i] <= b.size) & (srf_[i] <= b.srf));
            }
            if (!any) continue;
            for (std::size_t i = start; i < start + block; ++i) {
                if (box(i).at_or_below(box_b)) return i;
            }
        }
        for (std::size_t i = start; i < n; ++i) {
            if (box(i).at_or_below(box_b)) return i;
        }
        return n;
    }

    // Whether any box is at or above b in every figure.
    bool any_at_or_above(const Box& box_b) const {
        const Narrow b(box_b);
        const auto above = [&](std::size_t i) {
            return static_cast<std::int16_t>((loss_[i] >= b.loss) & (size_[i] >= b.size) & (srf_[i] >= b.srf));
        };
        const std::size_t n = designs_.size();
        std::int16_t any = 0;
        std::size_t start = 0;
        for (; start + block <= n; start += block) {
            for (std::size_t j = 0; j < block; ++j) any |= above(start + j);
        }
        for (std::size_t i = start; i < n; ++i) any |= above(i);
        return any != 0;
    }

    void swap(std::size_t i, std::size_t j) {
        std::swap(loss_[i], loss_[j]);
        std::swap(size_[i], size_[j]);
        std::swap(srf_[i], srf_[j]);
        std::swap(designs_[i], designs_[j]);
    }

    double ceiling_;
    std::vector<std::int16_t> loss_, size_, srf_;
    std::vector<DesignFigures> designs_;
};

// Why a candidate fails, with the key the report and JSON use and the words of the binding-limit note.
enum class Reason : std::size_t {
    outer_diameter, length, wire_length, thermal, srf_margin, max_deviation, min_impedance,
    inductance_out_of_reach, snapping, groove, shield, model_domain, count
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
}};

// One thread's share of the search: its Pareto archive, counts and closest miss.
struct Tally {
    Archive front;
    std::array<std::size_t, static_cast<std::size_t>(Reason::count)> rejected = {};
    std::optional<Rejection> closest = std::nullopt;
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

    // A miss known to be no closer than one already counted.
    void count(Reason reason) { ++rejected[static_cast<std::size_t>(reason)]; }

    // `detail` is built only when this miss is the closest so far (it is text, and most misses are not).
    template <class Detail>
    void reject(Reason reason, double excess, const Detail& detail) {
        const auto r = static_cast<std::size_t>(reason);
        ++rejected[r];
        if (!closest || excess < closest->excess) keep_closest(r, excess, detail);
    }

private:
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

class Evaluator {
public:
    explicit Evaluator(const Requirement& q) : q_(q) {
        // The wires without their labels: every coil built in the search copies its wire, and a long
        // label would cost an allocation each time. Text about a candidate takes the label from q.
        for (const WireOption& wo : q.wires) {
            unlabelled_.push_back(wo.wire);
            unlabelled_.back().label.clear();
        }
        ceiling_ = q.band ? q.band->ceiling : 0;
        reference_ = q.band ? q.band->ceiling : q.current_frequency.value_or(0);
        fewest_turns_ = std::ceil(1 / q.turns_step - 1e-9) * q.turns_step;  // one turn or more, on the step
        limit_ = q.enamel_class;
        if (q.former) limit_ = std::min(limit_, q.former->material.max_service_temperature);
    }

    double ceiling() const { return ceiling_; }

    // A model that still throws for a candidate (a DomainError from a result out of double range, say)
    // rejects that candidate under the models' domain; it never stops the search or its thread.
    void evaluate(const Candidate& c, Tally& t) const {
        try {
            check(c, t);
        } catch (const std::exception& e) {  // InputError, DomainError
            const std::string why = e.what();
            t.reject(Reason::model_domain, 10, [&] {
                return q_.wires[c.wire].wire.label + " on " + mm(c.form_diameter) + ": " + why;
            });
        }
    }

private:
    void check(const Candidate& c, Tally& t) const {
        const WireOption& wo = q_.wires[c.wire];
        const Wire& w = wo.wire;
        const double d_ins = w.insulated_diameter();
        const double mean = c.form_diameter + d_ins;
        const auto what = [&] { return w.label + " on " + mm(c.form_diameter) + " at pitch ratio " + detail::fixed(c.ratio, 2); };
        const double outer = mean + d_ins;
        if (q_.shield && !(outer < q_.shield->inner_diameter)) {
            t.reject(Reason::shield, outer / q_.shield->inner_diameter, [&] { return what() + ": outer diameter " + mm(outer) + " does not clear the shield"; });
            return;
        }
        if (outer > q_.max_outer_diameter) {
            t.reject(Reason::outer_diameter, outer / q_.max_outer_diameter, [&] { return what() + ": outer diameter " + mm(outer); });
            return;
        }
        const double room = q_.max_length - 2 * q_.former_ends - d_ins;  // for N * p
        if (!(room > 0)) {
            t.reject(Reason::length, (2 * q_.former_ends + d_ins) / q_.max_length, [&] { return what() + ": no room for a winding"; });
            return;
        }
        const double bare = w.bare_diameter;
        // The root finders stop at a point they evaluated: the last one is kept for reuse.
        Point last;
        const auto L = [&](double n, double p, const NagaokaSlope* sheet = nullptr) {
            last = {n, p, recommended_inductance_with_slopes(mean, n, p, bare, sheet)};
            return last.l.inductance;
        };
        const auto at = [&](double n, double p) { return last.n == n && last.p == p ? last.l.inductance : L(n, p); };
        // With a shield the unshielded models aim at the target less the shield's change of L (its
        // high-frequency limit, shield.hpp), taken at the geometry of the moment and settled after the trim.
        double target = q_.inductance;
        const auto shield_change = [&](double turns, double pitch) {
            return q_.shield ? shield_inductance_change(Solenoid(Solenoid::Params{mean, turns, pitch, unlabelled_[c.wire], 0}), *q_.shield) : 0.0;
        };
        double n = 0, p = c.ratio * d_ins, n_solved = 0;
        const double p_grid = p;
        // A grooved or ribbed former needs the groove's clearance between turns: no pitch below it.
        const double p_min = d_ins + (q_.former ? q_.former->groove.clearance : 0);
        if (p < p_min) {
            t.reject(Reason::groove, p_min / p, [&] { return what() + ": pitch " + mm(p) + " below the wire plus the groove's clearance, " + mm(p_min); });
            return;
        }
        try {
            if (q_.turns) {
                n = n_solved = *q_.turns;
                target = q_.inductance - shield_change(n, p);
                L(n, p);
                if (!solve_pitch(n, p_min, room, L, WheelerGuide(mean / 2, last, false), target, p, last)) {
                    const double l_touch = L(n, p_min);
                    if (l_touch < target) {
                        t.reject(Reason::inductance_out_of_reach, target / l_touch, [&] { return what() + ": " + format_quantity(l_touch, Dimension::inductance) +
                                 " at most with the fixed turns"; });
                    } else {
                        t.reject(Reason::length, n * d_ins / room, [&] { return what() + ": the fixed turns do not fit the length"; });
                    }
                    return;
                }
            } else {
                if (p > room) {  // else room / p >= 1 exactly
                    if (const double n_max = room / p; n_max < 1) {
                        t.reject(Reason::length, 1 / n_max, [&] { return what() + ": not one turn fits"; });
                        return;
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
                    return;
                }
                // Every pitch ratio of one wire and form gives the longest winding the same length, so
                // Nagaoka's coefficient there is computed once for them all.
                const double n_max = room / p;
                const double rho_room = mean / room;
                if (t.sheet_rho != rho_room) {
                    t.sheet_rho = rho_room;
                    t.sheet = nagaoka_coefficient_and_slope(rho_room);
                }
                target = q_.inductance - shield_change(n_max, p);
                const double l_max = L(n_max, p, &t.sheet);
                if (l_max < target) {
                    t.short_of_target = {c.wire, c.form_diameter, rosa};
                    t.reject(Reason::length, target / l_max, [&] { return what() + ": " + format_quantity(l_max, Dimension::inductance) +
                             " with the longest winding that fits"; });
                    return;
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
                    t.reject(Reason::inductance_out_of_reach, l_one / target, [&] { return what() + ": one turn already gives " +
                             format_quantity(l_one, Dimension::inductance); });
                    return;
                }
                n_solved = *solved;
                if (q_.shield) {  // the shield's change at the solved length, and the turns again for it
                    target = q_.inductance - shield_change(n_solved, p);
                    first = true;
                    if (const auto again = detail::bracketed_steps(turns_step, true, n_solved, {1, n_max, std::nullopt, std::nullopt}, 21, 2)) {
                        n_solved = *again;
                    }
                }
                // Snap to the step; trim the pitch. The nearest step first, then its neighbours. The guide
                // is rescaled (and matched to the slopes) at the solve's last point, beside the solution.
                const double step = q_.turns_step;
                const double nearest = std::max(fewest_turns_, std::round(n_solved / step) * step);
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
                    t.reject(Reason::snapping, 1.0 + step / n_solved, [&] { return what() + ": no pitch meets the target after snapping the turns"; });
                    return;
                }
            }
            if (q_.shield) {
                // The shield's change moves with the trimmed pitch: trim again until it settles (twice or
                // three times; the check after the figures rejects what still misses).
                for (int k = 0; k < 4; ++k) {
                    const double next = q_.inductance - shield_change(n, p);
                    if (std::fabs(next - target) <= 1e-9 * q_.inductance) break;
                    target = next;
                    if (!solve_pitch(n, p_min, room, L, WheelerGuide(mean / 2, last, true), target, p, last)) break;
                }
            }
        } catch (const InputError&) {
            t.reject(Reason::model_domain, 10, [&] { return what() + ": outside the geometry the models accept"; });
            return;
        } catch (const DomainError&) {
            t.reject(Reason::model_domain, 10, [&] { return what() + ": outside every inductance model's domain"; });
            return;
        }

        const Solenoid s(Solenoid::Params{mean, n, p, unlabelled_[c.wire], q_.lead_length});
        DesignFigures d;
        d.wire_index = c.wire;
        d.form_diameter = c.form_diameter;
        d.mean_diameter = mean;
        d.outer_diameter = outer;
        d.turns = n;
        d.turns_solved = n_solved;
        d.pitch = p;
        d.pitch_ratio = p / d_ins;
        d.pitch_before_trim = p_grid;
        d.winding_length = s.winding_length();
        d.overall_length = s.overall_length();
        d.length_with_ends = d.overall_length + 2 * q_.former_ends;
        d.wire_length = s.wire_length();
        d.inductance = at(n, p);
        const double l_bare = d.inductance;
        if (q_.shield) {
            // The shield's change at the final geometry: the shielded L must meet the target.
            d.inductance += shield_change(n, p);
            const double miss = d.inductance / q_.inductance - 1;
            if (std::fabs(miss) > q_.tolerance) {
                t.reject(Reason::shield, 1 + std::fabs(miss), [&] { return what() + ": the shielded inductance misses the target by " + detail::fixed(100 * miss, 2) + " %"; });
                return;
            }
        }
        d.volume = pi / 4 * outer * outer * d.length_with_ends;
        if (q_.max_wire_length && d.wire_length > *q_.max_wire_length) {
            t.reject(Reason::wire_length, d.wire_length / *q_.max_wire_length, [&] { return what() + ": wire " + detail::fixed(d.wire_length, 2) + " m"; });
            return;
        }

        // Thermal: I^2 R(T), with the AC/DC ratio of the current's frequency taken at ambient.
        double ac_ratio = 1;
        if (q_.current_frequency && *q_.current_frequency > 0) {
            const auto r = ac_resistance(s, q_.conductor, q_.ambient, *q_.current_frequency);
            ac_ratio = r.resistance / r.dc;
        }
        const double wire_len = s.wire_length();
        // I^2 (R_ac / R_dc) R_dc(T), the factors that do not depend on T taken once.
        const double per_resistivity = q_.current * q_.current * ac_ratio * resistance_per_resistivity(bare, wire_len);
        const auto power = [&](double temp) { return per_resistivity * q_.conductor.resistivity_at(temp); };
        const ThermalSurface surface{outer, d.overall_length, 0.85, CoilAxis::horizontal};
        d.temperature_limit = limit_;
        // At the limit first: a winding that still dissipates more than it sheds there settles above it
        // (one evaluation decides; the excess is that power ratio).
        const double shed = convected_power(surface, limit_, q_.ambient) + radiated_power(surface, limit_, q_.ambient);
        if (const double p_limit = power(limit_); !(p_limit <= shed)) {
            t.reject(Reason::thermal, shed > 0 ? p_limit / shed : 10, [&] {
                try {
                    const double temp = winding_temperature(std::cref(power), surface, q_.ambient).temperature;
                    return what() + ": winding at " + format_quantity(temp, Dimension::temperature) + ", limit " +
                           format_quantity(limit_, Dimension::temperature);
                } catch (const DomainError&) {
                    return what() + ": the winding would run away thermally";
                }
            });
            return;
        }
        // The balance lies in [ambient, limit]; solved to search_tolerance (self_resonance.hpp), as the
        // search's self-resonance.
        try {
            const auto th = winding_temperature(std::cref(power), surface, q_.ambient, limit_, search_tolerance, shed);
            d.temperature = th.temperature;
            d.rise = th.rise;
        } catch (const DomainError&) {  // only by rounding at the limit itself
            t.reject(Reason::thermal, 1, [&] { return what() + ": the winding settles at its limit"; });
            return;
        }
        d.near_thermal_limit = d.temperature > limit_ - near_limit;
        d.dc_resistance = dc_resistance(q_.conductor, bare, wire_len, d.temperature);

        // Self-resonance and the band. The band screen's impedance holds the coil's proximity field sum,
        // which R_ac below then reuses.
        std::optional<double> field;
        SelfResonance sr;
        try {
            const FormerDielectric fd = q_.former ? q_.former->dielectric(c.form_diameter) : FormerDielectric{};
            sr = self_resonance(s, d.inductance, fd, q_.surroundings, false);
        } catch (const DomainError&) {
            t.reject(Reason::model_domain, 10, [&] { return what() + ": no self-resonance model holds"; });
            return;
        }
        d.self_resonance = sr.frequency;
        if (q_.shield) {
            // In the shield: its capacitance between the terminals joins the coil's own, with the shielded L
            // (the lumped estimate coil analyze reports; shield.hpp).
            const double c_t = shield_terminal_capacitance(shield_capacitance(s, *q_.shield), q_.surroundings.mounting == Mounting::grounded_end);
            d.self_resonance = shielded_self_resonance(sr.frequency, l_bare, d.inductance, c_t);
        }
        if (q_.band) {
            const BandSpec& b = *q_.band;
            const double srf = d.self_resonance;
            d.srf_margin = srf / b.ceiling;
            const bool none = !b.srf_margin && !b.max_deviation && !b.min_impedance;
            const double k = b.srf_margin.value_or(none ? default_srf_margin : 0);
            if (k > 0 && srf < k * b.ceiling) {
                t.reject(Reason::srf_margin, k * b.ceiling / srf, [&] { return what() + ": SRF " + format_quantity(srf, Dimension::frequency); });
                return;
            }
            if (b.max_deviation || b.min_impedance) {
                const CoilImpedance z(s, q_.conductor, d.temperature, d.inductance, sr);
                field = z.mean_square_field();
                std::vector<double> f(screen_points);
                for (int i = 0; i < screen_points; ++i) f[i] = b.low * std::pow(b.ceiling / b.low, i / (screen_points - 1.0));
                for (const auto& pt : z.sweep(f)) {
                    const double mag = pt.magnitude();
                    const double dev = std::fabs(mag / (2 * pi * pt.frequency * d.inductance) - 1);
                    if (b.max_deviation && dev > *b.max_deviation) {
                        t.reject(Reason::max_deviation, dev / *b.max_deviation, [&] { return what() + ": |Z| off wL by " + detail::fixed(dev * 100, 1) +
                                 " % at " + format_quantity(pt.frequency, Dimension::frequency); });
                        return;
                    }
                    if (b.min_impedance && mag < *b.min_impedance) {
                        t.reject(Reason::min_impedance, *b.min_impedance / mag, [&] { return what() + ": |Z| " +
                                 format_quantity(mag, Dimension::resistance) + " at " + format_quantity(pt.frequency, Dimension::frequency); });
                        return;
                    }
                }
            }
        }
        // Loss and Q at the reference frequency.
        d.reference_frequency = reference_;
        if (reference_ > 0) {
            const auto r = field ? ac_resistance(s, q_.conductor, d.temperature, reference_, *field)
                                 : ac_resistance(s, q_.conductor, d.temperature, reference_);
            d.resistance = r.resistance;
            d.q_factor = 2 * pi * reference_ * d.inductance / r.resistance;
        } else {
            d.resistance = d.dc_resistance;
        }
        ++t.feasible;
        t.front.add(d);
    }

    // Pitch in [p_min, room / n] with L(n, p) = target to 1e-10; L falls as p grows. The guide gives the
    // first guess; Newton's steps follow with Rosa's slope (the filament sum's secant steps start from
    // the guide's). `p` receives the pitch; `last` is the last point `L` evaluated.
    template <class F>
    bool solve_pitch(double n, double p_min, double room, const F& L, const WheelerGuide& guide, double target, double& p,
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

    const Requirement& q_;
    std::vector<Wire> unlabelled_;
    double ceiling_ = 0, reference_ = 0, limit_ = 0, fewest_turns_ = 1;
};

std::string reason_words(const std::string& key) {
    for (const auto& t : reason_text) {
        if (key == t.key) return t.words;
    }
    return "the models' domain";
}

// A YAML double-quoted scalar.
std::string yaml_quoted(const std::string& text) {
    std::string o = "\"";
    for (char ch : text) {
        if (ch == '"' || ch == '\\') o += '\\';
        o += ch == '\n' ? ' ' : ch;
    }
    return o + "\"";
}

}  // namespace

std::vector<std::string> design_cautions(const Requirement& q, double temperature, double limit) {
    std::vector<std::string> c;
    if (q.supply_voltage > 50) {
        c.push_back("The supply (" + format_quantity(q.supply_voltage, Dimension::voltage) +
                    ") is above extra-low voltage (50 V AC, 120 V ripple-free DC; IEC 61140). Build in an earthed "
                    "enclosure with wire, former and terminals rated for it, with the creepage and clearance your "
                    "standard asks for, and have a qualified person check it. Local codes and licensed practice come first.");
    }
    if (q.rf_power > 0) {
        c.push_back("RF power (" + format_quantity(q.rf_power, Dimension::power) +
                    ") is given: a coil near resonance can carry high voltage and its field burns deep and painlessly. "
                    "Never touch it energised; rate nearby parts and the former for the voltage.");
    }
    if (temperature > 0 && limit > 0 && temperature > limit - near_limit) {
        c.push_back("The winding is estimated at " + format_quantity(temperature, Dimension::temperature) + ", within " +
                    detail::fixed(near_limit, 0) + " K of its limit (" + format_quantity(limit, Dimension::temperature) +
                    "). The estimate is for still air with no enclosure; measure the real part under load.");
    }
    return c;
}

DesignResult design(const Requirement& q, const DesignOptions& options) {
    require_positive("target.inductance", q.inductance);
    if (q.wires.empty()) throw InputError("search.wires", "the list is empty");
    // The grid is enumerated by index, never stored: candidate i is (wire, diameter, ratio) in row-major order.
    const std::vector<double> diameters = q.form_diameter.values(), ratios = q.pitch_ratio.values();
    const std::size_t per_wire = diameters.size() * ratios.size(), total = q.wires.size() * per_wire;
    const auto candidate = [&](std::size_t i) {
        return Candidate{i / per_wire, diameters[(i % per_wire) / ratios.size()], ratios[i % ratios.size()]};
    };
    const Evaluator ev(q);
    unsigned threads = options.threads ? options.threads : std::max(1u, std::thread::hardware_concurrency());
    threads = static_cast<unsigned>(std::min<std::size_t>(threads, std::max<std::size_t>(1, total / 64 + 1)));
    std::vector<Tally> tallies(threads, Tally{Archive(ev.ceiling())});
    // Workers take chunks from a shared counter; the calling thread works too and reports progress.
    constexpr std::size_t chunk = 256;
    std::atomic<std::size_t> next{0}, done{0};
    const auto work = [&](unsigned k, bool report) {
        auto last = std::chrono::steady_clock::now();
        for (std::size_t start; (start = next.fetch_add(chunk)) < total;) {
            const std::size_t end = std::min(total, start + chunk);
            for (std::size_t i = start; i < end; ++i) ev.evaluate(candidate(i), tallies[k]);
            done.fetch_add(end - start);
            if (report && std::chrono::steady_clock::now() - last > std::chrono::milliseconds(200)) {
                options.progress(done.load(), total);
                last = std::chrono::steady_clock::now();
            }
        }
    };
    std::vector<std::thread> pool;
    for (unsigned k = 1; k < threads; ++k) pool.emplace_back(work, k, false);
    work(0, static_cast<bool>(options.progress));
    for (auto& t : pool) t.join();
    if (options.progress) options.progress(total, total);

    DesignResult out;
    out.candidates_evaluated = total;
    out.notes = q.notes;
    Archive archive(ev.ceiling());
    for (auto& t : tallies) {
        out.feasible += t.feasible;
        for (std::size_t r = 0; r < t.rejected.size(); ++r) {
            if (t.rejected[r] > 0) out.rejected_by_reason[reason_text[r].key] += t.rejected[r];
        }
        for (const auto& d : t.front.designs()) archive.add(d);
        if (t.closest && (!out.closest || t.closest->excess < out.closest->excess)) out.closest = t.closest;
    }
    std::vector<DesignFigures> front = archive.take();
    for (auto& d : front) d.wire_label = q.wires[d.wire_index].wire.label;
    if (front.empty()) {
        std::string top_reason;
        std::size_t most = 0;
        for (const auto& [r, n] : out.rejected_by_reason) {
            if (n > most) {
                most = n;
                top_reason = r;
            }
        }
        out.binding = "No candidate meets the requirement. Most were stopped by " + reason_words(top_reason) + " (" +
                      std::to_string(most) + " of " + std::to_string(total) + ").";
        if (out.closest) {
            out.binding += " The closest attempt, " + out.closest->detail + ", misses " + reason_words(out.closest->reason) +
                           " by " + detail::fixed((out.closest->excess - 1) * 100, 1) + " %.";
        }
        out.cautions = design_cautions(q, 0, 0);
        return out;
    }
    // Score relative to the best of each figure.
    double best_loss = front[0].loss_metric(), best_vol = front[0].volume, best_srf = front[0].srf_metric(ev.ceiling());
    for (const auto& d : front) {
        best_loss = std::min(best_loss, d.loss_metric());
        best_vol = std::min(best_vol, d.volume);
        best_srf = std::min(best_srf, d.srf_metric(ev.ceiling()));
    }
    for (auto& d : front) {
        d.score = q.objective.loss * d.loss_metric() / best_loss + q.objective.size * d.volume / best_vol +
                  q.objective.srf * d.srf_metric(ev.ceiling()) / best_srf;
    }
    // Ties (equal scores) fall to the grid order, so that the ranking never depends on the threads.
    std::sort(front.begin(), front.end(), [](const auto& a, const auto& b) {
        return std::tie(a.score, a.wire_index, a.form_diameter, a.pitch_before_trim) <
               std::tie(b.score, b.wire_index, b.form_diameter, b.pitch_before_trim);
    });
    out.pareto = std::move(front);

    // Re-analyse the leaders in full; the first that passes is chosen.
    const std::size_t tries = std::min<std::size_t>(out.pareto.size(), std::max<std::size_t>(options.top, 1));
    for (std::size_t i = 0; i < tries; ++i) {
        const DesignFigures& d = out.pareto[i];
        std::optional<Analysis> a;
        try {
            a = analyze(design_spec(q, d));
        } catch (const std::exception& e) {  // InputError or DomainError from the full models
            out.warnings.push_back("design " + std::to_string(i + 1) + " could not be re-analysed (" + e.what() +
                                   "); the next one is taken");
            continue;
        }
        const double l_full = a->shield ? a->shield->result.perfect_conductor : a->inductance.recommended;
        const bool l_ok = std::fabs(l_full / q.inductance - 1) <= q.tolerance;
        const bool band_ok = !a->band || a->band->pass;
        if (l_ok && band_ok) {
            out.chosen = i;
            out.chosen_analysis = std::move(a);
            break;
        }
        out.warnings.push_back("design " + std::to_string(i + 1) + " passed the search's screening but not the full " +
                               std::string(l_ok ? "band check" : "inductance check") + "; the next one is taken");
    }
    if (out.chosen) {
        const DesignFigures& d = out.pareto[*out.chosen];
        std::ostringstream why;
        why << "lowest weighted score " << detail::fixed(d.score, 3) << " (weights: loss " << q.objective.loss << ", size "
            << q.objective.size << ", SRF " << q.objective.srf << "): its loss is " << detail::fixed(d.loss_metric() / best_loss, 2)
            << " x the best feasible, its volume " << detail::fixed(d.volume / best_vol, 2) << " x the smallest, and its "
            << (ev.ceiling() > 0 ? "ceiling / SRF " : "1 MHz / SRF ") << detail::fixed(d.srf_metric(ev.ceiling()) / best_srf, 2)
            << " x the best";
        out.why_chosen = why.str();
        out.cautions = design_cautions(q, d.temperature, d.temperature_limit);
        if (options.spread) {
            const Solenoid s(Solenoid::Params{d.mean_diameter, d.turns, d.pitch, q.wires[d.wire_index].wire, q.lead_length});
            const FormerDielectric fd = q.former ? q.former->dielectric(d.form_diameter) : FormerDielectric{};
            out.spread = tolerance_spread(s, q.inductance, q.tolerance, fd, q.surroundings, q.tolerances, options.samples,
                                          options.seed);
            if (!q.tolerances_given) {
                out.notes.push_back("no tolerances given: the spread uses typical printing and winding values "
                                    "(form diameter 0.1 mm, pitch 0.02 mm, wire 0.5 %, turns 0.1, one standard deviation each)");
            }
        }
    } else {
        out.cautions = design_cautions(q, 0, 0);
    }
    return out;
}

CoilSpec design_spec(const Requirement& q, const DesignFigures& d) {
    const Wire& w = q.wires[d.wire_index].wire;
    CoilSpec s{q.name.empty() ? "design" : q.name, "", Solenoid(Solenoid::Params{d.mean_diameter, d.turns, d.pitch, w, q.lead_length}),
               q.conductor, {}, q.former, q.surroundings, q.band, {}, q.shield};
    s.description = "Designed by libcoil for " + format_quantity(q.inductance, Dimension::inductance) + " within " +
                    detail::fixed(q.tolerance * 100, 2) + " %";
    Operating op;
    if (q.band) op.frequencies = {q.band->low, q.band->ceiling};
    if (q.current_frequency && *q.current_frequency > 0) op.frequencies.push_back(*q.current_frequency);
    std::sort(op.frequencies.begin(), op.frequencies.end());
    op.frequencies.erase(std::unique(op.frequencies.begin(), op.frequencies.end()), op.frequencies.end());
    op.temperature = d.temperature > 0 ? d.temperature : q.ambient;
    op.temperature_given = true;
    op.current = q.current;
    s.operating = op;
    return s;
}

std::string coil_spec_yaml(const CoilSpec& s, const WireChoice& wc) {
    const auto q = [](double v, const char* unit, double scale) { return detail::significant(v * scale, 10) + " " + unit; };
    const auto hz = [&](double f) { return f >= 1e6 ? q(f, "MHz", 1e-6) : f >= 1e3 ? q(f, "kHz", 1e-3) : q(f, "Hz", 1); };
    std::ostringstream o;
    o << "# libcoil design spec: coil analyze, coil sweep and the former generator accept it unchanged.\n";
    o << "name: " << yaml_quoted(s.name) << "\n";
    if (!s.description.empty()) o << "description: " << yaml_quoted(s.description) << "\n";
    const Solenoid& c = s.solenoid;
    o << "coil:\n";
    o << "  form_diameter: " << q(c.form_diameter(), "mm", 1e3) << "\n";
    o << "  turns: " << detail::significant(c.turns(), 12) << "\n";
    o << "  pitch: " << q(c.pitch(), "mm", 1e3) << "\n";
    if (c.lead_length() > 0) o << "  lead_length: " << q(c.lead_length(), "mm", 1e3) << "\n";
    o << "  wire:\n";
    if (wc.gauge) {
        o << "    gauge: AWG " << *wc.gauge << "\n";
    } else {
        o << "    diameter: " << q(c.wire().bare_diameter, "mm", 1e3) << "\n";
    }
    if (wc.enamel_grade) {
        o << "    enamel: grade " << *wc.enamel_grade << "\n";
    } else {
        o << "    insulation: " << q(c.wire().insulation, "mm", 1e3) << "\n";
    }
    o << "  conductor: " << s.conductor.name << "\n";
    const Operating& op = s.operating;
    o << "operating:\n";
    if (!op.frequencies.empty()) {
        o << "  frequencies: [";
        for (std::size_t i = 0; i < op.frequencies.size(); ++i) o << (i ? ", " : "") << hz(op.frequencies[i]);
        o << "]\n";
    }
    o << "  temperature: " << detail::fixed(op.temperature - zero_celsius, 2) << " degC\n";
    if (op.current > 0) o << "  current: " << detail::significant(op.current, 10) << " A\n";
    if (s.former) {
        const FormerSpec& f = *s.former;
        o << "former:\n  material: " << f.material.name << "\n  kind: " << former_kind_name(f.kind) << "\n  wall: "
          << q(f.wall, "mm", 1e3) << "\n";
        if (f.kind == FormerKind::ribbed) {
            o << "  ribs: " << f.ribs << "\n  rib_width: " << q(f.rib_width, "mm", 1e3) << "\n  hub_wall: " << q(f.hub_wall, "mm", 1e3)
              << "\n";
        }
        if (f.ends) o << "  ends: " << q(*f.ends, "mm", 1e3) << "\n";
        const GrooveSpec& g = f.groove;
        o << "  groove: {profile: " << (g.profile == GrooveProfile::vee ? "vee" : "round");
        if (g.depth) o << ", depth: " << q(*g.depth, "mm", 1e3);
        o << ", clearance: " << q(g.clearance, "mm", 1e3);
        if (g.profile == GrooveProfile::vee) o << ", angle_deg: " << detail::significant(g.angle * 180 / pi, 10);
        o << "}\n";
        if (f.flange) o << "  flange: {diameter: " << q(f.flange->diameter, "mm", 1e3) << ", thickness: " << q(f.flange->thickness, "mm", 1e3) << "}\n";
        o << "  min_wall: " << q(f.min_wall, "mm", 1e3) << "\n";
        if (f.bore_oversize > 0) o << "  bore_oversize: " << q(f.bore_oversize, "mm", 1e3) << "\n";
    }
    if (s.shield) {
        const ShieldSpec& h = *s.shield;
        o << "shield:\n  inner_diameter: " << q(h.inner_diameter, "mm", 1e3) << "\n  length: " << q(h.length, "mm", 1e3) << "\n  thickness: "
          << q(h.thickness, "mm", 1e3) << "\n  material: " << h.material.name << "\n  end_discs: " << (h.end_discs ? "true" : "false") << "\n";
        if (h.axial_offset != 0) o << "  axial_offset: " << q(h.axial_offset, "mm", 1e3) << "\n";
    }
    o << "surroundings:\n  relative_permittivity: " << detail::significant(s.surroundings.relative_permittivity, 10)
      << "\n  mounting: " << mounting_name(s.surroundings.mounting) << "\n";
    if (s.band) {
        const BandSpec& b = *s.band;
        o << "band:\n  low: " << hz(b.low) << "\n  ceiling: " << hz(b.ceiling) << "\n";
        if (b.srf_margin) o << "  srf_margin: " << detail::significant(*b.srf_margin, 10) << "\n";
        if (b.max_deviation) o << "  max_deviation: " << detail::significant(*b.max_deviation * 100, 10) << " %\n";
        if (b.min_impedance) o << "  min_impedance: " << detail::significant(*b.min_impedance, 10) << " ohm\n";
    }
    return o.str();
}

}  // namespace libcoil
