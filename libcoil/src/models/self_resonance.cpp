#include "libcoil/models/self_resonance.hpp"

#include "libcoil/models/turn_network.hpp"

#include <algorithm>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <limits>
#include <vector>

#include <boost/math/tools/roots.hpp>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/medhurst.hpp"
#include "libcoil/core/units.hpp"
#include "core/text_format.hpp"

namespace libcoil {


namespace {

double equivalent_capacitance(double f, double inductance) {
    const double w = 2 * pi * f;
    return 1 / (w * w * inductance);
}

// Kandoian & Sichak's resonance: f = v(f) / (2 l) or v(f) / (4 l), with v = c VF / sqrt(e) and the
// wavelength in the medium. f - v(f) / (m l) rises through zero once on (0, c / (m l sqrt e)].
double kandoian_sichak_resonance(const Solenoid& s, double waves, double eps) {
    const double l = s.winding_length(), D = s.mean_diameter(), c = speed_of_light / std::sqrt(eps);
    const auto h = [&](double f) { return f - kandoian_sichak_velocity_factor(D, s.pitch(), c / f) * c / (waves * l); };
    const double hi = c / (waves * l), lo = hi * 1e-9;
    std::uintmax_t it = 200;
    const auto r = boost::math::tools::toms748_solve(h, lo, hi, h(lo), h(hi), boost::math::tools::eps_tolerance<double>(44), it);
    return 0.5 * (r.first + r.second);
}

}  // namespace

namespace {

double check_media(const FormerDielectric& former, const Surroundings& surroundings) {
    const double eps_out = require_at_least("surroundings.relative_permittivity",
                                            require_finite("surroundings.relative_permittivity",
                                                           surroundings.relative_permittivity),
                                            1.0, "a relative permittivity");
    require_non_negative("former.wall", former.wall);
    if (former.wall > 0) {
        require_at_least("former.relative_permittivity", require_finite("former.relative_permittivity",
                                                                        former.relative_permittivity),
                         1.0, "a relative permittivity");
        if (!(former.fill > 0 && former.fill <= 1)) {
            throw InputError("former.fill", format_value(former.fill) + "; expected a share in (0, 1]");
        }
    }
    return eps_out;
}

double resonance_waves(Mounting m) { return m == Mounting::floating ? 2.0 : 4.0; }  // l = lambda / 2 or / 4

// The axial wavenumber of the first resonance: l = lambda / 2 or / 4.
double resonance_beta(const Solenoid& s, Mounting m) { return 2 * pi / (resonance_waves(m) * s.winding_length()); }

}  // namespace

void bare_helical_line_frequencies(std::span<const Solenoid* const> coils, double tolerance, std::span<double> frequency) {
    if (frequency.size() != coils.size()) throw InputError("frequency", "an output of another length than the coils");
    constexpr std::size_t block = 8;
    for (std::size_t begin = 0; begin < coils.size(); begin += block) {
        const std::size_t count = std::min(block, coils.size() - begin);
        thread_local std::vector<SheathHelix> helices;  // kept, so that no block allocates
        helices.clear();
        double beta[block], k[block];
        std::size_t lane_of[block];
        for (std::size_t j = 0; j < count; ++j) {
            const Solenoid* s = coils[begin + j];
            frequency[begin + j] = std::numeric_limits<double>::quiet_NaN();
            if (!s) continue;
            const double tangent = s->pitch_tangent();
            if (!(tangent > 0 && std::isfinite(tangent))) continue;  // with_pitch_tangent's checks: left to the caller
            lane_of[helices.size()] = j;
            beta[helices.size()] = resonance_beta(*s, Mounting::floating);
            helices.push_back(SheathHelix::with_pitch_tangent(s->mean_radius(), tangent, {1.0, 1.0}));
        }
        SheathHelix::tabulated_wavenumbers(helices, std::span(beta, helices.size()), tolerance, std::span(k, helices.size()));
        for (std::size_t m = 0; m < helices.size(); ++m) {
            const double f = speed_of_light * k[m] / (2 * pi);  // as helical_line_resonance; NaN stays NaN
            if (std::isfinite(f)) frequency[begin + lane_of[m]] = f;
        }
    }
}

HelicalLineResonance helical_line_resonance(const Solenoid& s, const FormerDielectric& former,
                                            const Surroundings& surroundings, double tolerance) {
    const double eps_out = check_media(former, surroundings);
    const double beta = resonance_beta(s, surroundings.mounting);
    const double a = s.mean_radius(), tangent = s.pitch_tangent();
    HelicalLineResonance r;
    r.medium = {eps_out, eps_out};
    const double rise = former.wall > 0 ? (former.relative_permittivity - eps_out) * former.fill : 0.0;
    double k = 0;
    if (rise == 0) {
        const SheathHelix helix = SheathHelix::with_pitch_tangent(a, tangent, r.medium);
        k = helix.wavenumber_for(beta, 0, tolerance);
    } else {
        // The former shell enters the inner permittivity by its share of the mode's inner field energy,
        // which itself depends on the mode: the fixed point e = T(e). T is a weak contraction; secant
        // steps on T(e) - e reach it to 1e-12 in three or four evaluations.
        const double form_radius = s.form_diameter() / 2, shell_in = std::max(0.0, form_radius - former.wall);
        const auto share = [&](double gamma) { return sheath_inner_energy_share(a, shell_in, form_radius, gamma, beta); };
        const auto solve_wavenumber = [&](double e) {  // the mode's k at inner permittivity e
            const SheathHelix helix = SheathHelix::with_pitch_tangent(a, tangent, {e, eps_out});
            k = helix.wavenumber_for(beta, k, tolerance);
        };
        const auto excess = [&](double e) {  // T(e) - e, leaving the mode's k behind
            solve_wavenumber(e);
            return eps_out + rise * share(std::sqrt(beta * beta - e * k * k)) - e;
        };
        // Start from the slow-wave share (gamma = beta), which the mode's share differs from by O((v/c)^2).
        double e0 = eps_out + rise * share(beta), g0 = excess(e0);
        double e = e0;  // where k was last solved
        double e1 = e0 + g0;
        // One fixed-point step leaves an error of about |T'| |g0|, and |T'| is itself of the order of
        // |g0| / e: both come from the mode's departure from the slow wave, e k^2 / beta^2 (measured on
        // the demo's candidates: g0 / e ~ -4e-5, T' ~ -2.5e-5). Where (g0 / e)^2 is below a tenth of the
        // tolerance, e1 is within it, and only its wavenumber is needed (the test
        // SelfResonance.SearchToleranceAgreesWithTheFullSolve checks the result against the full solve).
        const double step = g0 / e0;
        if (std::fabs(step) > tolerance && step * step <= 0.1 * tolerance) {
            solve_wavenumber(e1);
            e = e1;
            g0 = 0;
        }
        for (int i = 0; i < 50 && std::fabs(g0) > tolerance * e0 && e1 != e0; ++i) {
            const double g1 = excess(e1);
            e = e1;
            if (std::fabs(g1) <= tolerance * e1 || g1 == g0) break;
            const double e2 = e1 - g1 * (e1 - e0) / (g1 - g0);
            e0 = e1;
            g0 = g1;
            e1 = std::isfinite(e2) ? e2 : e1 + g1;
        }
        r.medium.inner = e;
    }
    r.frequency = finite_result("helical line", speed_of_light * k / (2 * pi));
    r.phase_velocity = speed_of_light * k / beta;
    return r;
}

namespace {

// Each model's error against NEC2 on its reference set (f / f_NEC2 - 1), floating and with one end
// grounded: measured, and enforced by tests/python/test_turn_network.py.
struct MeasuredError {
    double floating_low, floating_high, grounded_low, grounded_high;
};
constexpr MeasuredError network_error{-0.0128, 0.0134, -0.0176, -0.0045};  // coils of p/d >= 3
// The near-field correction against the wire-surface reference (p/d 1.08 .. 3, 10 .. 40 turns, bare and
// enamelled, floating and grounded; tests/cpp/test_turn_network.cpp), and the former's discretisation.
constexpr double near_field_error_low = -0.027, near_field_error_high = 0.004;
constexpr double former_discretisation = 0.003;
constexpr MeasuredError helical_line_error{0.160, 0.468, -0.117, 0.180};
constexpr MeasuredError kandoian_sichak_error{0.004, 0.316, -0.152, 0.018};
constexpr MeasuredError medhurst_error{-0.500, -0.291, -0.336, -0.067};

void set_error(SelfResonanceMethod& m, const MeasuredError& e, Mounting mounting) {
    const bool grounded = mounting == Mounting::grounded_end;
    m.error_low = grounded ? e.grounded_low : e.floating_low;
    m.error_high = grounded ? e.grounded_high : e.floating_high;
}

}  // namespace

SrfBand srf_band(double f, const std::string& method, Mounting mounting, double pitch_to_wire, const FormerDielectric& former,
                 double former_ratio, bool with_reasons) {
    require_positive("frequency", f);
    const bool grounded = mounting == Mounting::grounded_end;
    constexpr double nec_residual = 0.005;
    double err_lo = 0, err_hi = 0;  // the model's error f / f_true - 1, measured
    SrfBand b;
    // Each reason's words only where asked for (`why` makes them).
    const auto explain = [&](const auto& why) {
        if (with_reasons) b.reasons.push_back(why());
    };
    const bool solid_former = former.wall > 0 && former.relative_permittivity > 1 && !(former.fill > 0 && former.fill < 1);
    if (method == "network") {
        err_lo = grounded ? network_error.grounded_low : network_error.floating_low;
        err_hi = grounded ? network_error.grounded_high : network_error.floating_high;
        explain([&] {
            return std::string("the turn network's error against NEC2, ") + (grounded ? "-1.76 .. -0.45 %" : "-1.28 .. +1.34 %") +
                   ", and 0.5 % for NEC's own convergence";
        });
        if (pitch_to_wire < 3) {
            err_lo += near_field_error_low;
            err_hi += near_field_error_high;
            explain([&] {
                return "turns " + detail::significant(pitch_to_wire, 3) +
                       " wire diameters apart: the near-field correction against the wire-surface reference, -2.7 .. +0.4 %";
            });
        }
        if (solid_former && former_ratio == 1) {
            err_lo -= former_discretisation;
            err_hi += former_discretisation;
            explain([] { return std::string("the former's polarisation charge, 0.3 % (its discretisation)"); });
        }
    } else if (method == "helical_line") {
        err_lo = grounded ? helical_line_error.grounded_low : helical_line_error.floating_low;
        err_hi = grounded ? helical_line_error.grounded_high : helical_line_error.floating_high;
        explain([&] { return std::string("the sheath helix's error against NEC2, ") + (grounded ? "-12 .. +18 %" : "+16 .. +47 %"); });
    } else {
        err_lo = -0.25;
        err_hi = 0.25;
        explain([] { return std::string("Medhurst's table, taken as good to 25 % outside his arrangement (an assumption)"); });
    }
    b.low = f / (1 + err_hi + nec_residual);
    b.high = f / (1 + err_lo - nec_residual);
    if (former_ratio < 1) {
        const double half_shift = 0.5 * (1 - former_ratio);
        b.low *= 1 - half_shift;
        b.high *= 1 + half_shift;
        const bool ribs = former.fill > 0 && former.fill < 1;
        explain([&] {
            return std::string(method == "network" && ribs ? "the ribs taken as a tube of their averaged permittivity"
                                                           : "the former's dielectric by the sheath helix's share of the field") +
                   " (" + detail::significant(100 * (1 - former_ratio), 2) + " % lower), not checked: half that shift either side";
        });
    }
    return b;
}

ShieldBandTerm shield_band_term(double shielded, double bare, bool by_network, double radius_ratio) {
    require_positive("shielded_self_resonance", shielded);
    require_positive("bare_self_resonance", bare);
    require_non_negative("radius_ratio", radius_ratio);
    const ShieldShiftError& e = network_shield_shift_error;
    const double shift = 1 - shielded / bare;
    ShieldBandTerm t;
    if (by_network && radius_ratio >= e.radius_ratio_low && radius_ratio <= e.radius_ratio_high) {
        t.low = 1 / (1 + e.high + e.nec_grid);
        t.high = 1 / (1 + e.low - e.nec_grid);
        t.measured = true;
    } else if (by_network) {
        t.low = 1 - 0.5 * std::fabs(shift);
        t.high = 1 + 0.5 * std::fabs(shift);
    } else {
        t.low = 1 - 0.5 * std::max(0.0, shift);
    }
    return t;
}

double sheath_helix_former_ratio(const Solenoid& s, const FormerDielectric& former, const Surroundings& surroundings) {
    return std::min(1.0, helical_line_resonance(s, former, surroundings, search_tolerance).frequency /
                             helical_line_resonance(s, FormerDielectric{}, surroundings, search_tolerance).frequency);
}

std::optional<NetworkResonance> network_resonance(const Solenoid& s, const FormerDielectric& former, const Surroundings& surroundings,
                                                  const ShieldSpec* shield) {
    if (static_cast<int>(std::ceil(s.turns() - 1e-9)) > max_network_turns) return std::nullopt;
    TurnNetworkOptions o;
    o.mounting = surroundings.mounting;
    o.relative_permittivity = surroundings.relative_permittivity;
    if (shield) o.shield = *shield;
    NetworkResonance r;
    const bool dielectric = former.wall > 0 && former.relative_permittivity > surroundings.relative_permittivity;
    if (dielectric && s.turns() > max_former_charge_turns) {
        // Long coils: the former's charge solve grows as the cube of its panels (600 turns: 4 s); take the
        // former by the sheath helix's ratio instead (its SRF on the former over without, which long coils
        // suit; within 0.1 .. 1.2 % of the charge solve on shorter coils), and widen the band by half of it.
        r.modes = TurnNetwork(s, o).resonances(3);
        if (r.modes.empty()) throw DomainError("turn network: no resonance between the terminals");
        const double ratio = sheath_helix_former_ratio(s, former, surroundings);
        for (double& m : r.modes) m *= ratio;
        r.frequency = finite_result("turn network", r.modes.front());
        r.former_ratio = ratio;
        return r;
    }
    o.former = former;
    r.modes = TurnNetwork(s, o).resonances(3);
    if (r.modes.empty()) throw DomainError("turn network: no resonance between the terminals (a single turn, or no finite mode)");
    r.frequency = finite_result("turn network", r.modes.front());
    const bool ribs = former.wall > 0 && former.fill > 0 && former.fill < 1 && former.relative_permittivity > surroundings.relative_permittivity;
    if (ribs) {
        o.former = FormerDielectric{};
        r.former_ratio = std::min(1.0, r.frequency / TurnNetwork(s, o).first_resonance());
    }
    return r;
}

double srf_build_spread(const Solenoid& s, const FormerDielectric& former, const Surroundings& surroundings,
                        const BuildTolerances& t, const ShieldSpec* shield, std::string* largest, double stop_above) {
    require_non_negative("tolerances.form_diameter", t.form_diameter);
    require_non_negative("tolerances.pitch", t.pitch);
    require_non_negative("tolerances.wire_diameter", t.wire_diameter);
    require_non_negative("tolerances.turns", t.turns);
    // The network up to max_spread_network_turns (a few tenths of a second each), the sheath helix above.
    const bool by_network = s.turns() <= max_spread_network_turns;
    const auto srf = [&](const Solenoid& c) {
        if (by_network) {
            if (const auto n = network_resonance(c, former, surroundings, shield)) return n->frequency;
        }
        return helical_line_resonance(c, former, surroundings, search_tolerance).frequency;
    };
    const double f0 = srf(s);
    const Wire w0 = s.wire();
    struct Step {
        const char* name;
        double form, pitch, wire, turns;  // the moves
    };
    const Step steps[] = {{"form diameter", t.form_diameter, 0, 0, 0},
                          {"pitch", 0, t.pitch, 0, 0},
                          {"wire diameter", 0, 0, t.wire_diameter * w0.bare_diameter, 0},
                          {"turns", 0, 0, 0, t.turns}};
    double sum = 0, worst = 0;
    for (const Step& st : steps) {
        if (st.form == 0 && st.pitch == 0 && st.wire == 0 && st.turns == 0) continue;
        double shift = 0;
        for (const double sign : {1.0, -1.0}) {  // up, or down where up is no coil (turns that would touch)
            try {
                Wire w = w0;
                w.bare_diameter += sign * st.wire;
                const Solenoid c(Solenoid::Params{s.form_diameter() + sign * st.form + w.insulated_diameter(), s.turns() + sign * st.turns,
                                                  s.pitch() + sign * st.pitch, w, s.lead_length()});
                shift = srf(c) / f0 - 1;
                break;
            } catch (const InputError&) {
            }
        }
        sum += shift * shift;
        if (std::fabs(shift) > worst) {
            worst = std::fabs(shift);
            if (largest) *largest = st.name;
        }
        if (std::sqrt(sum) > stop_above) break;
    }
    return finite_result("SRF build spread", std::sqrt(sum));
}

SelfResonance self_resonance(const Solenoid& s, double inductance, const FormerDielectric& former,
                             const Surroundings& surroundings, bool cross_checks) {
    require_positive("inductance", inductance);
    check_media(former, surroundings);
    SelfResonance r;
    r.inductance = inductance;
    r.mounting = surroundings.mounting;
    r.winding_length = s.winding_length();
    r.pitch_angle = s.pitch_angle();
    r.radius = s.mean_radius();
    r.half_wave_wire_frequency = speed_of_light / (2 * s.helix_length());
    const double waves = resonance_waves(surroundings.mounting);
    r.resonance_wavenumber = resonance_beta(s, surroundings.mounting);
    const double eps_out = surroundings.relative_permittivity;
    HelixMedium medium{eps_out, eps_out};
    std::string line_failure;
    try {
        const HelicalLineResonance h = helical_line_resonance(s, former, surroundings, cross_checks ? 1e-12 : search_tolerance);
        medium = h.medium;
        r.phase_velocity = h.phase_velocity;
        r.helical_line.available = true;
        r.helical_line.frequency = h.frequency;
        r.helical_line.capacitance = equivalent_capacitance(r.helical_line.frequency, inductance);
        r.low_frequency_capacitance = pi * pi / 12 * r.helical_line.capacitance;
    } catch (const DomainError& e) {
        line_failure = e.what();
    }
    r.medium = medium;

    if (cross_checks) try {
        r.kandoian_sichak.frequency = kandoian_sichak_resonance(s, waves, 0.5 * (medium.inner + medium.outer));
        r.kandoian_sichak.capacitance = equivalent_capacitance(r.kandoian_sichak.frequency, inductance);
        r.kandoian_sichak.available = true;
    } catch (const DomainError&) {
        r.warnings.push_back("Kandoian & Sichak's velocity gave no resonance for this coil");
    }

    // Medhurst's table: a cross-check, and the fallback where the helical line has no slow wave.
    const double ratio = s.winding_length() / s.mean_diameter();
    if (!cross_checks && r.helical_line.available) {
        r.frequency = r.helical_line.frequency;
        r.capacitance = r.helical_line.capacitance;
        r.frequency_low = r.frequency_high = r.frequency;  // the search sets the band where it needs it
        return r;  // the fast path: no cross-check and no notes
    }
    if (ratio >= medhurst_min_ratio && ratio <= medhurst_max_ratio) {
        r.medhurst.available = true;
        r.medhurst.capacitance = medhurst_capacitance(s.mean_diameter(), s.winding_length());
        r.medhurst.frequency = 1 / (2 * pi * std::sqrt(inductance * r.medhurst.capacitance));
    } else {
        r.warnings.push_back("l/D = " + format_value(ratio) +
                             " is outside Medhurst's table (0.1 .. 50): no empirical cross-check of the self-capacitance");
    }

    // The turn network (turn_network.hpp), recommended where it is computed: within 2 % of NEC2 where the
    // sheath helix reads 16 .. 47 % high.
    double former_ratio = 1;
    try {
        if (const auto n = network_resonance(s, former, surroundings)) {
            r.network.available = true;
            r.network.frequency = n->frequency;
            r.network.capacitance = equivalent_capacitance(n->frequency, inductance);
            r.network_modes = n->modes;
            former_ratio = n->former_ratio;
            if (former_ratio < 1) {
                r.notes.push_back("the turn network takes the former's ribs as a tube of their averaged permittivity (an "
                                  "equivalent, not checked against a reference)");
            }
        } else {
            r.notes.push_back("the turn network is not built for this coil (over " + std::to_string(max_network_turns) +
                              " turns); the next model gives the SRF");
        }
    } catch (const DomainError& e) {
        r.warnings.push_back(std::string("the turn network gave no resonance (") + e.what() + ")");
    }

    if (r.network.available) {
        r.method = "network";
        r.frequency = r.network.frequency;
        r.capacitance = r.network.capacitance;
        r.low_frequency_capacitance = pi * pi / 12 * r.capacitance;
    } else if (r.helical_line.available) {
        r.frequency = r.helical_line.frequency;
        r.capacitance = r.helical_line.capacitance;
    } else if (r.medhurst.available) {
        // Outside the sheath helix's domain, Medhurst's measured capacitance is the model that holds.
        r.method = "medhurst";
        r.frequency = r.medhurst.frequency;
        r.capacitance = r.medhurst.capacitance;
        r.low_frequency_capacitance = r.medhurst.capacitance;
        r.warnings.push_back(line_failure + "; the self-resonance comes from Medhurst's capacitance instead, and the "
                             "impedance from the lumped model");
    } else {
        throw DomainError(line_failure + ", and l/D is outside Medhurst's table: no self-resonance model holds");
    }
    set_error(r.network, network_error, surroundings.mounting);
    set_error(r.helical_line, helical_line_error, surroundings.mounting);
    set_error(r.kandoian_sichak, kandoian_sichak_error, surroundings.mounting);
    set_error(r.medhurst, medhurst_error, surroundings.mounting);
    {
        if (r.method != "network" && former.wall > 0 && former.relative_permittivity != eps_out && r.helical_line.available) {
            former_ratio = sheath_helix_former_ratio(s, former, surroundings);
        }
        const SrfBand b = srf_band(r.frequency, r.method, surroundings.mounting, s.pitch_to_wire(), former, former_ratio, cross_checks);
        r.frequency_low = b.low;
        r.frequency_high = b.high;
        r.band_reasons = b.reasons;
    }
    if (cross_checks && former.wall > 0 && former.relative_permittivity != eps_out) {
        r.notes.push_back("the former raises the inner permittivity the helical line sees to " +
                          detail::significant(medium.inner, 3) + " (its share of the inner field energy)");
    }
    if (cross_checks && s.pitch_to_wire() < 1.5 && r.method != "network") {
        r.notes.push_back("close-wound turns: the turn-to-turn capacitance, which only the turn network holds, lowers the "
                          "self-resonance further");
    }
    return r;
}

}  // namespace libcoil
