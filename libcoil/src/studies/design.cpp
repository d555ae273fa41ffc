#include "libcoil/studies/design.hpp"

#include <algorithm>
#include <atomic>
#include <map>
#include <cmath>
#include <sstream>
#include <thread>
#include <tuple>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/models/thermal.hpp"
#include "libcoil/studies/band_check.hpp"
#include "libcoil/studies/cautions.hpp"
#include "core/text_format.hpp"
#include "studies/design_search.hpp"
#include "studies/parallel.hpp"

namespace libcoil {

namespace {

// The one limit whose change, alone, makes a design feasible: the criteria in the order of their least
// excess, each relaxed to 2 % past what its closest candidate needed (then 40, 100 and 300 %; a screen that is optimistic,
// as the fixture's and the SRF's with the sheath helix are, can need more), and the search
// run again with it; the first that yields a design is the answer, its factor narrowed by two halvings.
std::string one_change(const Requirement& q, const DesignOptions& options, const std::map<std::string, double>& best) {
    std::vector<std::pair<double, std::string>> order;
    for (const auto& [reason, excess] : best) {
        if (std::isfinite(excess) && excess > 0) order.emplace_back(excess, reason);
    }
    std::sort(order.begin(), order.end());
    DesignOptions again = options;
    again.seek_one_change = false;
    again.spread = false;
    again.progress = nullptr;
    again.top = std::min<std::size_t>(options.top, 3);  // only whether a design exists matters (three tries at the full check)
    // The requirement with one limit relaxed by the factor e (over that criterion's least excess), and its words.
    const auto relaxed = [&](const std::string& reason, double e, Requirement& r, std::string& words) {
        r = q;
        const auto length = [](double v) { return format_quantity(v, Dimension::length, 3); };
        if (reason == "outer_diameter") {
            r.max_outer_diameter *= e;
            words = "raise limits.max_outer_diameter from " + length(q.max_outer_diameter) + " to " + length(r.max_outer_diameter);
        } else if (reason == "length") {
            r.max_length *= e;
            words = "raise limits.max_length from " + length(q.max_length) + " to " + length(r.max_length);
        } else if (reason == "wire_length" && q.max_wire_length) {
            *r.max_wire_length *= e;
            words = "raise limits.max_wire_length from " + length(*q.max_wire_length) + " to " + length(*r.max_wire_length);
        } else if (reason == "thermal" && q.current > 0) {
            r.current /= std::sqrt(e);
            words = "lower operating.current from " + format_quantity(q.current, Dimension::current, 3) + " to " +
                    format_quantity(r.current, Dimension::current, 3);
        } else if (reason == "srf_margin" && q.band && required_srf_margin(*q.band) / e >= 1) {
            r.band->srf_margin = required_srf_margin(*q.band) / e;
            words = "lower band.srf_margin from " + detail::significant(required_srf_margin(*q.band), 3) + " to " +
                    detail::significant(*r.band->srf_margin, 3);
        } else if (reason == "max_deviation" && q.band && q.band->max_deviation) {
            *r.band->max_deviation *= e;
            words = "raise band.max_deviation from " + detail::significant(100 * *q.band->max_deviation, 3) + " % to " +
                    detail::significant(100 * *r.band->max_deviation, 3) + " %";
        } else if (reason == "fixture" && q.fixture) {
            double& t = r.fixture->reference->tolerance;
            t *= e;
            const auto words_of = [&](double v) {
                return q.fixture->reference->in_db ? detail::significant(v, 3) + " dB" : detail::significant(100 * v, 3) + " %";
            };
            words = "raise the fixture's reference.tolerance from " + words_of(q.fixture->reference->tolerance) + " to " + words_of(t);
        } else if (reason == "min_impedance" && q.band && q.band->min_impedance) {
            *r.band->min_impedance /= e;
            words = "lower band.min_impedance from " + format_quantity(*q.band->min_impedance, Dimension::resistance, 3) + " to " +
                    format_quantity(*r.band->min_impedance, Dimension::resistance, 3);
        } else {
            return false;
        }
        return true;
    };
    const auto feasible = [&](const Requirement& r) {
        try {
            return design(r, again).chosen.has_value();
        } catch (const InputError&) {
            return false;
        }
    };
    double below = 1;
    for (const double step : {1.02, 1.4, 2.0, 4.0}) {
        for (const auto& [excess, reason] : order) {
            Requirement r = q;
            std::string words;
            if (!relaxed(reason, excess * step, r, words) || !feasible(r)) continue;
            // Found: narrow the factor between the last step that failed and this one (two halvings).
            double lo = below, hi = step;
            for (int k = 0; k < 2; ++k) {
                const double mid = std::sqrt(lo * hi);
                Requirement t = q;
                std::string w;
                if (relaxed(reason, excess * mid, t, w) && feasible(t)) {
                    hi = mid;
                    words = w;
                } else {
                    lo = mid;
                }
            }
            return words;
        }
        below = step;
    }
    return "";
}

// Fields that contradict each other whatever the coil, found before the search. A minimum |Z| over the band
// is bounded at its low edge: there |Z| <= w L / (1 - (f / f0)^2) for any coil resonating at f0 (lumped,
// lossless; losses only lower the peak), with f0 at least the SRF margin times the ceiling, or |Z| <= (1 +
// max_deviation) w L where the deviation is bounded; L at most the target and its tolerance. A 5 % allowance
// covers the models' L(f) and the shield, so that only a sure contradiction stops the search.
// Thermal: the winding sheds its loss from its outer cylinder (winding_heat.hpp). Per metre of wire that
// cylinder has at most (D_out / D_mean)(p + d) square metres, largest on the grid's smallest form and largest
// pitch (a winding of N p + d, one turn's end allowance counted whole), and still air takes at most what the
// smallest such cylinder sheds per square metre at the limit temperature (natural convection's coefficient
// falls as the diameter grows). The loss per metre is at least the DC one, I^2 rho(T_limit) / A. Where every
// wire needs more than 1.05 x that, no coil of the grid carries the current.
void check_thermal(const Requirement& q) {
    if (!(q.current > 0) || q.wires.empty()) return;
    double limit = q.enamel_class;
    std::string by = "limits.enamel_class (" + detail::fixed(q.enamel_class - 273.15, 0) + " degC)";
    if (q.former && q.former->material.max_service_temperature < limit) {
        limit = q.former->material.max_service_temperature;
        by = "the former's service temperature (" + detail::fixed(limit - 273.15, 0) + " degC)";
    }
    const double form = q.form_diameter.min;
    if (!(form > 0) || !(limit > q.ambient)) return;
    double best = 0;  // the most any wire could shed over what it dissipates
    std::string best_wire;
    for (const auto& w : q.wires) {
        const double d = w.wire.insulated_diameter(), area = pi / 4 * w.wire.bare_diameter * w.wire.bare_diameter;
        const double pitch = q.turns ? q.max_length / *q.turns : q.pitch_ratio.max * d;
        const double cylinder_per_metre = (form + 2 * d) / (form + d) * (pitch + d);
        const ThermalSurface surface{form + 2 * d, 1.0, 0.85, CoilAxis::horizontal};
        const double flux = (convected_power(surface, limit, q.ambient) + radiated_power(surface, limit, q.ambient)) / (pi * (form + 2 * d));
        const double need = q.current * q.current * q.conductor.resistivity_at(limit) / area;
        const double ratio = flux * cylinder_per_metre / need;
        if (ratio > best) {
            best = ratio;
            best_wire = w.wire.label;
        }
    }
    if (best * 1.05 >= 1) return;
    throw InputError("operating.current", format_quantity(q.current, Dimension::current) + " cannot be carried within " + by + " by any wire of search.wires: the best, " +
                                              best_wire + ", dissipates " + detail::significant(1 / best, 3) + " x what still air can take from the largest winding surface the grid allows (search.pitch_ratio.max, search.form_diameter.min); lower operating.current, add a thicker wire to search.wires, or raise the temperature limit");
}

void check_conflicts(const Requirement& q) {
    check_thermal(q);
    if (!q.band || !q.band->min_impedance) return;
    const BandSpec& b = *q.band;
    const double margin = required_srf_margin(b);
    double rise = INFINITY;
    std::string by;
    if (margin > 0) {
        const double x = b.low / (margin * b.ceiling);
        rise = 1 / (1 - x * x);
        by = "the SRF margin (band.srf_margin " + detail::significant(margin, 3) + ")";
    }
    if (b.max_deviation && 1 + *b.max_deviation < rise) {
        rise = 1 + *b.max_deviation;
        by = "band.max_deviation (" + detail::significant(100 * *b.max_deviation, 3) + " %)";
    }
    if (!std::isfinite(rise)) return;
    const double most = 2 * pi * b.low * q.inductance * (1 + q.tolerance) * rise;
    if (*b.min_impedance > 1.05 * most) {
        throw InputError("band.min_impedance", format_quantity(*b.min_impedance, Dimension::resistance) + " cannot be met at band.low (" +
                                                   format_quantity(b.low, Dimension::frequency) + "): a coil of target.inductance " +
                                                   format_quantity(q.inductance, Dimension::inductance) + " (+" +
                                                   detail::significant(100 * q.tolerance, 3) + " %) has at most " +
                                                   format_quantity(most, Dimension::resistance) + " there under " + by +
                                                   "; lower band.min_impedance, raise band.low or the target");
    }
}

// Why the chosen design passes in its fixture, in words, and what a coil-only SRF margin would have said.
std::string fixture_words(const Requirement& q, const FixtureResult& fx, double srf) {
    const FixtureVerdict& v = *fx.verdict;
    const auto dev = [&](double x) { return v.in_db ? detail::fixed(x, 2) + " dB" : (x >= 0 ? "+" : "") + detail::fixed(100 * x, 1) + " %"; };
    const auto f = [](double x) { return format_quantity(x, Dimension::frequency, 4); };
    std::string w = "In the fixture (" + (q.fixture->name.empty() ? q.fixture_source : q.fixture->name) + ", the design as " + q.fixture_part +
                    ") the port stays within " + (v.in_db ? detail::significant(v.tolerance, 3) + " dB" : "+/-" + detail::significant(100 * v.tolerance, 3) + " %") +
                    " of its reference from " + f(v.band_low) + " to " + f(v.band_high) + ": worst " + dev(v.worst_deviation) + " at " + f(v.worst_frequency) + ".";
    if (srf < v.band_high) {
        w += " The coil resonates at " + f(srf) + ", inside that band: a coil-only SRF margin would reject it, yet the port, which is "
             "what the circuit needs, stays within its tolerance through the resonance (the parts that share the port with the coil "
             "set its impedance there).";
    } else {
        w += " The coil resonates at " + f(srf) + ", " + detail::fixed(srf / v.band_high, 2) + " x the band's top.";
    }
    if (!v.dominant_part.empty()) w += " The worst deviation is mostly due to " + v.dominant_part + ".";
    return w;
}

}  // namespace

DesignResult design(const Requirement& q, const DesignOptions& options) {
    require_positive("target.inductance", q.inductance);
    if (q.wires.empty()) throw InputError("search.wires", "the list is empty");
    check_conflicts(q);
    const detail::Evaluator ev(q);
    const std::size_t total = detail::grid_size(q);
    unsigned threads = options.threads ? options.threads : std::max(1u, std::thread::hardware_concurrency());
    threads = static_cast<unsigned>(std::min<std::size_t>(threads, std::max<std::size_t>(1, total / 64 + 1)));
    std::vector<detail::Tally> tallies = detail::screen_grid(q, ev, threads, options.progress);

    DesignResult out;
    out.candidates_evaluated = total;
    out.notes = q.notes;
    detail::Archive archive(ev.ceiling());
    for (auto& t : tallies) {
        out.feasible += t.feasible;
        for (std::size_t r = 0; r < t.rejected.size(); ++r) {
            if (t.rejected[r] > 0) out.rejected_by_reason[detail::reason_text[r].key] += t.rejected[r];
        }
        for (const auto& d : t.front.designs()) archive.add(d);
        if (t.closest && (!out.closest || t.closest->excess < out.closest->excess)) out.closest = t.closest;
        for (std::size_t r = 0; r < t.best_excess.size(); ++r) {
            if (!std::isfinite(t.best_excess[r])) continue;
            auto [it, fresh] = out.best_excess_by_reason.emplace(detail::reason_text[r].key, t.best_excess[r]);
            if (!fresh) it->second = std::min(it->second, t.best_excess[r]);
        }
    }
    std::vector<DesignFigures> front = archive.take();
    // Where no design is left, after the words on what bound the search: the one limit whose relaxing alone
    // makes a design feasible (where asked), and the cautions the inputs call for.
    const auto nothing_feasible = [&] {
        if (options.seek_one_change) {
            out.one_change = one_change(q, options, out.best_excess_by_reason);
            out.binding += out.one_change.empty() ? " No single limit, relaxed alone, makes a design feasible."
                                                  : " One change that makes a design feasible (found by searching again): " + out.one_change + ".";
        }
        out.cautions = safety_cautions(q.supply_voltage, q.rf_power, 0, 0);
    };
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
        out.binding = "No candidate meets the requirement. Most were stopped by " + detail::reason_words(top_reason) + " (" +
                      std::to_string(most) + " of " + std::to_string(total) + ").";
        if (out.closest) {
            const double by = (out.closest->excess - 1) * 100;
            out.binding += " The closest attempt, " + out.closest->detail + ", misses " + detail::reason_words(out.closest->reason) +
                           (by < 0.05 ? " by less than 0.1 %." : " by " + detail::fixed(by, 1) + " %.");
        }
        nothing_feasible();
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
    // The ranked designs with the turn network's SRF, the recommended one (the search screened with the
    // sheath helix's, an upper bound): confirmed in rank order until `top` pass; one whose band fails
    // with it leaves the list and counts under its reason. The network costs milliseconds for each new
    // geometry (the near-field section and the former's charge; docs/models.md), so only the ranked
    // designs pay it, and the screen's bound (network_srf_bound) keeps out those it surely rejects.
    out.front_size = front.size();
    const std::size_t wanted = std::max<std::size_t>(options.top, 1);
    std::size_t dropped = 0;
    std::vector<std::optional<FixtureResult>> fixture_checks;  // with out.pareto
    struct Checked {
        DesignFigures design;
        std::optional<BandMiss> miss;
        std::optional<FixtureResult> fixture;
    };
    // `stopped`: the loop below has its designs, and this check's result will be discarded.
    const auto check = [&](DesignFigures d, const std::atomic<bool>& stopped) {
        Checked c{std::move(d), std::nullopt, std::nullopt};
        try {
            // The search met the target with a quick estimate of L's fall at the target frequency: a design
            // the turn network confirms is trimmed to meet it by the wire-harmonic solver and confirmed again.
            c.miss = ev.confirm(c.design, false);
            if (!c.miss && stopped) return c;
            if (!c.miss) c.miss = ev.retarget(c.design) ? ev.confirm(c.design, true) : BandMiss{"inductance_out_of_reach", 1 + q.tolerance, 0, 0};
            if (!c.miss && stopped) return c;
            if (!c.miss) ev.reference_losses(c.design);
        } catch (const std::exception&) {
            c.miss = BandMiss{"model_domain", 10, 0, 0};
        }
        // In its fixture by the full study (the coil by its full analysis and sweep): the screen's port is the
        // helical-line impedance's at 25 points, which can miss what the turn network shows near resonance.
        if (!c.miss && q.fixture && !stopped) {
            try {
                c.fixture = fixture_study(with_coil(*q.fixture, q.fixture_part, design_spec(q, c.design)));
                const FixtureVerdict& v = *c.fixture->verdict;
                if (!v.pass) c.miss = BandMiss{"fixture", std::fabs(v.worst_deviation) / v.tolerance, v.worst_frequency, v.worst_deviation};
            } catch (const std::exception&) {
                c.miss = BandMiss{"model_domain", 10, 0, 0};
            }
        }
        return c;
    };
    // In rank order on `threads` threads, each taking the next design; the checks are taken in rank order
    // until `top` have passed, and those past that point are discarded: the outcome is the one-thread one.
    detail::in_order_until<Checked>(front.size(), threads, [&](std::size_t i, const std::atomic<bool>& stopped) { return check(front[i], stopped); }, [&](std::size_t, Checked&& c) {
        if (!c.miss) {
            out.pareto.push_back(std::move(c.design));
            fixture_checks.push_back(std::move(c.fixture));
        } else {
            ++dropped;
            --out.feasible;
            ++out.rejected_by_reason[c.miss->criterion];
        }
        return out.pareto.size() < wanted;
    });
    if (dropped > 0) {
        out.notes.push_back(std::to_string(dropped) + " of the best-ranked designs (screened with an upper bound on the turn network's SRF "
                            "from the sheath helix's" + std::string(q.fixture ? ", and the fixture's port at 25 points" : "") +
                            ") failed the band with the turn network's SRF and its band (the model's error and the build's spread)" +
                            std::string(q.fixture ? " or the full fixture study" : "") + " and were dropped");
    }
    if (out.pareto.empty()) {
        out.binding = "No candidate meets the requirement: every design the search kept (" + std::to_string(front.size()) +
                      (q.fixture ? ") fails the band with the turn network's self-resonance, the recommended one, or the full fixture study."
                                 : ") fails the band with the turn network's self-resonance, the recommended one.");
        nothing_feasible();
        return out;
    }
    for (std::size_t i = 0; i < std::min(out.pareto.size(), std::max<std::size_t>(options.top, 1)); ++i) {
        out.specs.push_back(design_spec(q, out.pareto[i]));
    }

    // Re-analyse the leaders in full; the first that passes is chosen.
    const std::size_t tries = std::min<std::size_t>(out.pareto.size(), std::max<std::size_t>(options.top, 1));
    for (std::size_t i = 0; i < tries; ++i) {
        std::optional<Analysis> a;
        try {
            AnalysisOptions o;
            o.threads = threads;  // the figures the same to the bit whatever the threads
            a = analyze(out.specs[i], o);
        } catch (const std::exception& e) {  // InputError or DomainError from the full models
            out.warnings.push_back("design " + std::to_string(i + 1) + " could not be re-analysed (" + e.what() +
                                   "); the next one is taken");
            continue;
        }
        const double l_full = inductance_at_target(*a, target_frequency(q));
        const bool l_ok = std::fabs(l_full / q.inductance - 1) <= q.tolerance;
        const bool band_ok = !a->band || a->band->pass;
        std::optional<FixtureResult>& fx = fixture_checks[i];
        const bool fixture_ok = !fx || fx->verdict->pass;
        if (l_ok && band_ok && fixture_ok) {
            out.chosen = i;
            out.chosen_analysis = std::move(a);
            out.fixture_check = std::move(fx);
            break;
        }
        out.warnings.push_back("design " + std::to_string(i + 1) + " passed the search's screening but not the full " +
                               std::string(!l_ok ? "inductance check" : !band_ok ? "band check" : "fixture check") + "; the next one is taken");
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
        if (out.fixture_check) out.fixture_words = fixture_words(q, *out.fixture_check, out.chosen_analysis->self_resonance_as_mounted);
        out.cautions = safety_cautions(q.supply_voltage, q.rf_power, d.temperature, d.temperature_limit);
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
        out.cautions = safety_cautions(q.supply_voltage, q.rf_power, 0, 0);
    }
    return out;
}

double inductance_at_target(const Analysis& a, double frequency) {
    if (frequency <= 0) return coil_impedance(a).nominal_inductance();
    for (const auto& p : a.at_frequency) {
        // (a spec written with ten digits gives the frequency back to 1e-10)
        if (std::fabs(p.frequency / frequency - 1) <= 1e-9) return p.inductance + (a.shield ? a.shield->table.inductance_change(p.frequency) : 0.0);
    }
    return coil_impedance(a).at(frequency).wire_inductance;
}

CoilSpec design_spec(const Requirement& q, const DesignFigures& d) {
    const Wire& w = q.wires[d.wire_index].wire;
    CoilSpec s{.name = q.name.empty() ? "design" : q.name,
               .description = "",
               .solenoid = Solenoid(Solenoid::Params{d.mean_diameter, d.turns, d.pitch, w, q.lead_length}),
               .conductor = q.conductor};
    s.description = "Designed by libcoil for " + format_quantity(q.inductance, Dimension::inductance) + " within " +
                    detail::fixed(q.tolerance * 100, 2) + " %";
    s.former = q.former;
    s.surroundings = q.surroundings;
    s.band = q.band;
    s.shield = q.shield;
    s.enamel_class = q.enamel_class;
    s.tolerances = q.tolerances;
    s.tolerances_given = q.tolerances_given;
    Operating op;
    if (q.band) op.frequencies = {q.band->low, q.band->ceiling};
    if (q.current_frequency && *q.current_frequency > 0) op.frequencies.push_back(*q.current_frequency);
    if (const double ft = target_frequency(q); ft > 0) op.frequencies.push_back(ft);
    std::sort(op.frequencies.begin(), op.frequencies.end());
    op.frequencies.erase(std::unique(op.frequencies.begin(), op.frequencies.end()), op.frequencies.end());
    // With a current the analysis finds the winding's temperature itself, as the search did; without one
    // the wire sits at ambient.
    op.current = q.current;
    op.current_frequency = q.current_frequency;
    op.ambient = q.ambient;
    op.supply_voltage = q.supply_voltage;
    op.rf_power = q.rf_power;
    if (!(q.current > 0)) {
        op.temperature = q.ambient;
        op.temperature_given = true;
    }
    s.operating = op;
    return s;
}

}  // namespace libcoil
