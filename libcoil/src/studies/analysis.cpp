#include "libcoil/studies/analysis.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "libcoil/core/constants.hpp"
#include "libcoil/models/dc_resistance.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/skin_effect.hpp"
#include "libcoil/core/units.hpp"
#include "core/text_format.hpp"

namespace libcoil {

CoilImpedance coil_impedance(const Analysis& a) {
    return CoilImpedance(a.spec.solenoid, a.spec.conductor, a.spec.operating.temperature, a.inductance.recommended,
                         a.self_resonance);
}

namespace {

std::string three_digits(double v) { return detail::significant(v, 3); }

void add_self_resonance(Analysis& a) {
    const CoilSpec& spec = a.spec;
    const Solenoid& s = spec.solenoid;
    const FormerDielectric former = spec.former ? spec.former->dielectric(s.form_diameter()) : FormerDielectric{};
    a.self_resonance = self_resonance(s, a.inductance.recommended, former, spec.surroundings);
    const SelfResonance& sr = a.self_resonance;
    for (const auto& w : sr.warnings) a.warnings.push_back(w);
    for (const auto& n : sr.notes) a.notes.push_back(n);
    const CoilImpedance zc = coil_impedance(a);
    for (const auto& p : a.at_frequency) {
        // With this analysis's R and L, which may come from the cross-section solver.
        a.impedance.push_back(zc.with_wire(p.frequency, p.resistance, p.inductance));
        if (p.frequency >= sr.frequency) {
            a.warnings.push_back("at " + format_quantity(p.frequency, Dimension::frequency) +
                                 " the coil is above its self-resonance (" + format_quantity(sr.frequency, Dimension::frequency) +
                                 "): it is capacitive there");
        }
    }
    if (spec.band) {
        a.band = check_band(*spec.band, zc);
        for (const auto& c : a.band->criteria) {
            if (c.name != "srf_margin" || !sr.medhurst.available) continue;
            a.band_srf_by_medhurst = check_srf_margin(sr.medhurst.frequency, a.band->ceiling, c.required);
            if (a.band_srf_by_medhurst->pass != c.pass) {
                a.warnings.push_back(std::string("the SRF margin ") + (c.pass ? "passes" : "fails") +
                                     " by the helical line but " + (c.pass ? "fails" : "passes") +
                                     " by Medhurst's measured capacitance (SRF " +
                                     format_quantity(sr.medhurst.frequency, Dimension::frequency) +
                                     ", one end grounded); near grounded metal expect the lower figure");
            }
        }
    }
}

}  // namespace

std::vector<double> frequency_grid(double from, double to, int points, bool logarithmic) {
    require_non_negative("--from", from);
    require_positive("--to", to);
    if (!(to > from)) throw InputError("--to", format_value(to) + " Hz is not above --from (" + format_value(from) + " Hz)");
    if (points < 2 || points > 1000000) throw InputError("--points", std::to_string(points) + "; expected 2 .. 1000000");
    if (logarithmic && !(from > 0)) throw InputError("--from", "a log sweep must start above 0 Hz");
    std::vector<double> f(points);
    for (int i = 0; i < points; ++i) {
        const double t = static_cast<double>(i) / (points - 1);
        f[i] = logarithmic ? from * std::pow(to / from, t) : from + (to - from) * t;
    }
    f.back() = to;
    return f;
}

namespace {

Analysis analyze_losses(const CoilSpec& spec, const AnalysisOptions& options) {
    Analysis a{spec, inductance(spec.solenoid), 0, {}, "closed-form", {}, {}, {}, {}, {}, {}, spec.notes, {}};
    a.warnings = a.inductance.warnings;
    const Solenoid& s = spec.solenoid;
    const Operating& op = spec.operating;
    a.dc_resistance = dc_resistance(spec.conductor, s.wire().bare_diameter, s.wire_length(), op.temperature);
    if (op.frequencies.empty()) return a;

    if (options.solver == LossSolver::filaments) {
        a.loss_method = "filaments";
        a.subdivision = options.subdivision;
        const double f_max = *std::max_element(op.frequencies.begin(), op.frequencies.end());
        if (options.auto_subdivision && f_max > 0) {
            a.subdivision = subdivision_for(s.wire().radius(), skin_depth(spec.conductor.resistivity_at(op.temperature), f_max));
        }
        a.at_frequency = coil_at_frequencies_numerical(s, spec.conductor, op.temperature, a.inductance.recommended,
                                                       op.frequencies, a.subdivision, options.progress);
        for (const auto& p : a.at_frequency) {
            if (!p.resolved) {
                a.warnings.push_back("at " + format_quantity(p.frequency, Dimension::frequency) +
                                     " the cross-section subdivision does not resolve the skin depth to 1 %; refine it");
            }
        }
    } else {
        a.at_frequency = coil_at_frequencies(s, spec.conductor, op.temperature, a.inductance.recommended, op.frequencies);
        // The closed-form proximity model holds to 3 % for p/d >= 2.5; closer turns at x > 3 spread wider
        // (proximity.hpp, docs/models.md). There the solver takes over when it is small enough.
        const double rho = spec.conductor.resistivity_at(op.temperature);
        double worst_x = 0;
        std::vector<double> outside;
        for (double f : op.frequencies) {
            if (f <= 0) continue;
            const double x = std::sqrt(2.0) * s.wire().radius() / skin_depth(rho, f);
            worst_x = std::max(worst_x, x);
            if (s.pitch_to_wire() < 2.5 && x > 3) outside.push_back(f);
        }
        bool fell_back = false;
        if (!outside.empty()) {
            const double f_max = *std::max_element(outside.begin(), outside.end());
            const Subdivision sub = subdivision_for(s.wire().radius(), skin_depth(rho, f_max));
            const double turns = std::max(1.0, std::round(s.turns()));
            const double estimate = turns * (1 + (sub.layers - 1) * sub.sectors) / 2;
            if (estimate <= static_cast<double>(options.fallback_unknowns)) {
                const auto numeric = coil_at_frequencies_numerical(s, spec.conductor, op.temperature,
                                                                   a.inductance.recommended, outside, sub, options.progress);
                std::string at;
                for (auto& p : a.at_frequency) {
                    for (const auto& q : numeric) {
                        if (q.frequency == p.frequency) p = q;
                    }
                }
                for (double f : outside) at += (at.empty() ? "" : ", ") + format_quantity(f, Dimension::frequency);
                a.warnings.push_back("close-wound turns (pitch " + three_digits(s.pitch_to_wire()) +
                                     " wire diameters): at " + at + " the closed-form proximity model is outside its "
                                     "3 % domain, so those points come from the cross-section solver (marked *)");
                a.subdivision = sub;
                fell_back = true;
            }
        }
        if (!outside.empty() && !fell_back) {
            a.warnings.push_back("close-wound turns (pitch " + three_digits(s.pitch_to_wire()) +
                                 " wire diameters) at wire diameter / skin depth up to " + three_digits(worst_x * std::sqrt(2.0)) +
                                 ": for such coils the closed-form proximity model was measured between -22 % and "
                                 "+12 % of the numerical solver (for wire diameter / skin depth up to 42); run with "
                                 "--solver filaments to check");
        }
    }
    return a;
}

}  // namespace

// The shielded coil: the ring model at the operating frequencies, and the SRF with the shield's
// capacitance, lumped: f = 1 / (2 pi sqrt(L_hf (C + C_t))), L_hf the perfect-conductor limit (at the SRF the
// wall is many skin depths thick for any practical shield).
void add_shield(Analysis& a) {
    const CoilSpec& spec = a.spec;
    if (!spec.shield) return;
    std::vector<double> f;
    for (const auto& p : a.at_frequency) {
        if (p.frequency > 0) f.push_back(p.frequency);
    }
    Analysis::Shielded sh;
    sh.result = shielded_coil(spec.solenoid, a.inductance.recommended, *spec.shield, f);
    sh.terminal_capacitance = shield_terminal_capacitance(sh.result.capacitance_to_shield, spec.surroundings.mounting == Mounting::grounded_end);
    sh.self_resonance = shielded_self_resonance(a.self_resonance.frequency, a.inductance.recommended, sh.result.perfect_conductor,
                                                sh.terminal_capacitance);
    a.shield = sh;
    const ShieldSpec& x = *spec.shield;
    const double reach = x.length / 2 - std::fabs(x.axial_offset) - spec.solenoid.winding_length() / 2;
    if (reach < 0.5 * x.inner_diameter / 2) {
        a.warnings.push_back("the shield reaches only " + format_quantity(std::max(0.0, reach), Dimension::length) +
                             " past the winding's end: the closed form (a long tube) does not hold there; the ring model's figures do");
    }
    a.notes.push_back("shielded SRF: a lumped estimate from the high-frequency L and the self-capacitance plus the capacitance to the shield; "
                      "the band check and the impedance are of the unshielded coil");
}

Analysis analyze(const CoilSpec& spec, const AnalysisOptions& options) {
    Analysis a = analyze_losses(spec, options);
    add_self_resonance(a);
    add_shield(a);
    return a;
}

}  // namespace libcoil
