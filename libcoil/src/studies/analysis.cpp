#include "libcoil/studies/analysis.hpp"

#include <algorithm>
#include <cmath>
#include <optional>
#include <string>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/models/dc_resistance.hpp"
#include "libcoil/models/proximity.hpp"
#include "libcoil/models/shield.hpp"
#include "libcoil/models/skin_effect.hpp"
#include "libcoil/studies/cautions.hpp"
#include "libcoil/studies/winding_heat.hpp"
#include "core/text_format.hpp"
#include "studies/mounted_network.hpp"

namespace libcoil {

namespace {

std::string three_digits(double v) { return detail::significant(v, 3); }
std::string hz(double f) { return format_quantity(f, Dimension::frequency); }

// The winding's temperature under the operating current. Unless the spec fixes the wire temperature, the
// losses are then taken at this one.
void add_thermal(Analysis& a, const AnalysisOptions& options) {
    Operating& op = a.spec.operating;
    if (!(op.current > 0)) return;
    const std::optional<FormerMaterial> former = a.spec.former ? std::optional(a.spec.former->material) : std::nullopt;
    double limit = a.spec.enamel_class;
    if (former && former->max_service_temperature > 0) limit = std::min(limit, former->max_service_temperature);
    // With a solver as the loss model, the winding heats with its R_ac / R_dc (the closed forms read
    // close-wound turns up to 28 % low).
    std::optional<double> ratio;
    if (options.solver != LossSolver::closed_form && op.current_frequency && *op.current_frequency > 0) {
        ratio = ac_ratio_by(options.solver, a.spec.solenoid, a.spec.conductor, op.ambient, *op.current_frequency);
    }
    const WindingHeat heat = winding_heat(a.spec.solenoid, a.spec.conductor, op.current, op.current_frequency, op.ambient, limit, ratio);
    const WindingTemperature w = settle_winding(heat, 3e-11, true);
    ThermalEstimate t{op.current, op.current_frequency, op.ambient, w.temperature, w.rise, w.power, limit,
                      winding_limit_source(a.spec.enamel_class, former), w.over_limit, w.runaway, false};
    if (w.runaway) {
        a.warnings.push_back("at " + format_quantity(op.current, Dimension::current) +
                             " the winding finds no balance below 500 \u00b0C: it would run away thermally");
    } else if (w.over_limit) {
        a.warnings.push_back("at " + format_quantity(op.current, Dimension::current) + " the winding settles at " +
                             format_quantity(w.temperature, Dimension::temperature) + ", above its limit (" + t.limit_source + ")");
    }
    if (!op.temperature_given) {
        // Runaway: the losses at the limit, the hottest temperature the build is meant to see.
        op.temperature = w.runaway ? limit : w.temperature;
        t.sets_wire_temperature = true;
    } else if (!w.runaway && std::fabs(op.temperature - w.temperature) > 5) {
        a.warnings.push_back("operating.temperature (" + format_quantity(op.temperature, Dimension::temperature) +
                             ") is taken for the losses, but the thermal estimate for the current is " +
                             format_quantity(w.temperature, Dimension::temperature));
    }
    a.thermal = t;
}

void add_losses(Analysis& a, const AnalysisOptions& options) {
    const CoilSpec& spec = a.spec;
    const Solenoid& s = spec.solenoid;
    const Operating& op = spec.operating;
    a.dc_resistance = dc_resistance(spec.conductor, s.wire().bare_diameter, s.wire_length(), op.temperature);
    if (op.frequencies.empty()) return;

    const double rho = spec.conductor.resistivity_at(op.temperature);
    if (options.solver == LossSolver::harmonics) {
        a.loss_method = LossSolver::harmonics;
        a.at_frequency = coil_at_frequencies_harmonic(s, spec.conductor, op.temperature, a.inductance.recommended, op.frequencies,
                                                      spec.shield ? &*spec.shield : nullptr, options.threads);
        return;
    }
    if (options.solver == LossSolver::filaments) {
        a.loss_method = LossSolver::filaments;
        a.subdivision = options.subdivision;
        const double f_max = *std::max_element(op.frequencies.begin(), op.frequencies.end());
        if (options.auto_subdivision && f_max > 0) a.subdivision = subdivision_for(s.wire().radius(), skin_depth(rho, f_max));
        a.at_frequency = coil_at_frequencies_numerical(s, spec.conductor, op.temperature, a.inductance.recommended,
                                                       op.frequencies, a.subdivision, options.progress,
                                                       spec.shield ? &*spec.shield : nullptr);
        for (const auto& p : a.at_frequency) {
            if (!p.resolved) {
                a.warnings.push_back("at " + hz(p.frequency) +
                                     " the cross-section subdivision's outer layer is thicker than a sixth of the skin depth, "
                                     "where R was measured within 0.5 %; refine it");
            }
        }
        return;
    }
    a.loss_method = LossSolver::closed_form;
    a.at_frequency = coil_at_frequencies(s, spec.conductor, op.temperature, a.inductance.recommended, op.frequencies);
    // Where the closed-form proximity model is outside its domain, the solver takes over when it is small enough.
    double worst_x = 0;
    std::vector<double> outside;
    for (double f : op.frequencies) {
        if (f <= 0) continue;
        const double x = std::sqrt(2.0) * s.wire().radius() / skin_depth(rho, f);
        worst_x = std::max(worst_x, x);
        if (!closed_form_proximity_holds(s.pitch_to_wire(), x)) outside.push_back(f);
    }
    if (outside.empty()) return;
    const double f_max = *std::max_element(outside.begin(), outside.end());
    const Subdivision sub = subdivision_for(s.wire().radius(), skin_depth(rho, f_max));
    const double estimate = cross_section_cells(s, rho, f_max) / 2;  // the mirror-halved dense count
    if (estimate > static_cast<double>(options.fallback_unknowns)) {
        a.warnings.push_back("close-wound turns (pitch " + three_digits(s.pitch_to_wire()) +
                             " wire diameters) at wire diameter / skin depth up to " + three_digits(worst_x * std::sqrt(2.0)) +
                             ": for such coils the closed-form proximity model was measured between -22 % and "
                             "+12 % of the numerical solver (for wire diameter / skin depth up to 42); to check it, rerun with the "
                             "solver set to filaments (the cross-section solver)");
        return;
    }
    const auto numeric = coil_at_frequencies_numerical(s, spec.conductor, op.temperature, a.inductance.recommended, outside, sub,
                                                       options.progress, spec.shield ? &*spec.shield : nullptr);
    std::string at;
    for (auto& p : a.at_frequency) {
        for (const auto& q : numeric) {
            if (q.frequency == p.frequency) p = q;
        }
    }
    for (double f : outside) at += (at.empty() ? "" : ", ") + hz(f);
    a.warnings.push_back("close-wound turns (pitch " + three_digits(s.pitch_to_wire()) + " wire diameters): at " + at +
                         " the closed-form proximity model is outside its 3 % domain, so those points come from the "
                         "cross-section solver (marked *)");
    a.subdivision = sub;
}

// The SRF's ratio with the former to without it, whose complement 1 - ratio^2 is the former's share of the
// capacitance's field energy (the share its loss tangent acts on): by the sheath helix, or where the helix has
// no slow wave on the former (steep pitch angles: the former's permittivity inside lifts the wave above the
// light line), by the turn network, with a warning; where neither holds, none, and the former's dielectric loss
// is left out, with a warning.
std::optional<double> former_frequency_ratio(Analysis& a, const FormerDielectric& former) {
    const Solenoid& s = a.spec.solenoid;
    std::string helix_failure;
    try {
        return sheath_helix_former_ratio(s, former, a.spec.surroundings);
    } catch (const DomainError& e) {
        helix_failure = e.what();
    }
    try {
        const auto on = network_resonance(s, former, a.spec.surroundings);
        const auto bare = on ? network_resonance(s, FormerDielectric{}, a.spec.surroundings) : std::nullopt;
        if (on && bare) {
            a.warnings.push_back("the former's dielectric loss takes the turn network's SRF ratio with and without the former (the sheath "
                                 "helix's does not hold: " + helix_failure + ")");
            return std::min(1.0, on->frequency / bare->frequency);
        }
    } catch (const DomainError&) {
    }
    a.warnings.push_back("the former's dielectric loss is left out: neither the sheath helix (" + helix_failure +
                         ") nor the turn network gives the SRF's ratio with and without the former for this coil; Q may read high");
    return std::nullopt;
}

void add_self_resonance(Analysis& a) {
    const CoilSpec& spec = a.spec;
    const Solenoid& s = spec.solenoid;
    const FormerDielectric former = spec.former ? spec.former->dielectric(s.form_diameter()) : FormerDielectric{};
    a.self_resonance = self_resonance(s, a.inductance.recommended, former, spec.surroundings);
    // The build's spread joins the band: two standard deviations either side (first order, the same model).
    std::string largest;
    const double spread = srf_build_spread(s, former, spec.surroundings, spec.tolerances, nullptr, &largest);
    if (spread > 0) {
        SelfResonance& sr = a.self_resonance;
        sr.frequency_low *= 1 - 2 * spread;
        sr.frequency_high *= 1 + 2 * spread;
        const BuildTolerances& t = spec.tolerances;
        sr.band_reasons.push_back("the build's tolerances (" + std::string(spec.tolerances_given ? "the spec's" : "typical") + ": form " +
                                  format_quantity(t.form_diameter, Dimension::length) + ", pitch " +
                                  format_quantity(t.pitch, Dimension::length) + ", wire " + detail::significant(100 * t.wire_diameter, 2) +
                                  " %, " + detail::significant(t.turns, 2) + " turn, one standard deviation each): ±2σ = ±" +
                                  detail::significant(200 * spread, 2) + " %, most from the " + largest);
    }
    for (const auto& w : a.self_resonance.warnings) a.warnings.push_back(w);
    for (const auto& n : a.self_resonance.notes) a.notes.push_back(n);
    a.self_resonance_as_mounted = a.self_resonance.frequency;
    if (spec.former && spec.former->material.loss_tangent > 0) {
        if (const std::optional<double> ratio = former_frequency_ratio(a, former)) {
            a.dielectric_loss_tangent = spec.former->material.loss_tangent * (1 - *ratio * *ratio);
        }
    }
}

// The shielded coil: the ring model at the operating frequencies and over the span, and the SRF with the
// shield's capacitance, lumped: f = 1 / (2 pi sqrt(L_hf (C + C_t))), L_hf the perfect-conductor limit (at
// the SRF the wall is many skin depths thick for any practical shield).
void add_shield(Analysis& a) {
    const CoilSpec& spec = a.spec;
    if (!spec.shield) return;
    std::vector<double> f;
    for (const auto& p : a.at_frequency) {
        if (p.frequency > 0) f.push_back(p.frequency);
    }
    Analysis::Shielded sh;
    const double l0 = a.inductance.recommended;
    sh.result = shielded_coil(spec.solenoid, l0, *spec.shield, f);
    sh.terminal_capacitance = shield_terminal_capacitance(spec.solenoid, *spec.shield, spec.surroundings.mounting == Mounting::grounded_end);
    sh.self_resonance = shielded_self_resonance(a.self_resonance.frequency, l0, sh.result.perfect_conductor, sh.terminal_capacitance);
    if (a.self_resonance.method == "network") {
        // The network holds the shield itself: its wall a grounded conductor, its currents' change to L.
        try {
            const FormerDielectric former = spec.former ? spec.former->dielectric(spec.solenoid.form_diameter()) : FormerDielectric{};
            if (const auto n = network_resonance(spec.solenoid, former, spec.surroundings, &*spec.shield)) {
                sh.self_resonance = n->frequency;
                sh.by_network = true;
            }
        } catch (const DomainError& e) {
            a.warnings.push_back(std::string("the turn network gave no resonance in the shield (") + e.what() + "); the lumped estimate stands");
        }
    }
    a.self_resonance_as_mounted = sh.self_resonance;
    a.shield = sh;
    const FrequencySpan span = default_span(a);
    a.shield->table = ShieldTable(spec.solenoid, l0, *spec.shield, span.low, span.high);
    const ShieldSpec& x = *spec.shield;
    const double reach = x.length / 2 - std::fabs(x.axial_offset) - spec.solenoid.winding_length() / 2;
    if (reach < 0.5 * x.inner_diameter / 2) {
        a.warnings.push_back("the shield reaches only " + format_quantity(std::max(0.0, reach), Dimension::length) +
                             " past the winding's end: the closed form (a long tube) does not hold there; the ring model's figures do");
    }
    a.notes.push_back(std::string("in the shield: its L(f) and wall loss come from the ring model, and the SRF ") +
                      (a.shield->by_network ? "from the turn network in the shield (its wall a grounded conductor, its currents' "
                                              "change to the partial inductances)"
                                            : "is a lumped estimate from the high-frequency L and the self-capacitance plus "
                                              "the capacitance to the shield") +
                      "; the impedance and the band check are of the shielded coil" +
                      (spec.surroundings.mounting == Mounting::grounded_end ? "; the grounded end is taken as joined to the shield" : ""));
}

// A bench section's terms (records.hpp): a capacitance across the terminals lowers the first resonance as
// mounted (the turn network with that capacitor where it gives the SRF; else the lumped shift
// f / sqrt(1 + C_s / C), C = 1 / (w0^2 L)); the leads' inductance and the R factor act in the impedance.
void add_bench(Analysis& a) {
    if (!a.spec.bench) return;
    const BenchCorrections& b = *a.spec.bench;
    std::string said = "bench corrections from " + b.source + ":";
    if (b.former_permittivity) said += " former permittivity " + three_digits(*b.former_permittivity) + ",";
    if (b.former_loss_tangent) said += " loss tangent " + detail::significant(*b.former_loss_tangent, 2) + ",";
    said += " stray capacitance " + format_quantity(b.stray_capacitance, Dimension::capacitance, 3) + ", lead inductance " +
            format_quantity(b.lead_inductance, Dimension::inductance, 3) + ", R factor " + three_digits(b.resistance_scale);
    a.notes.push_back(said);
    if (!(b.stray_capacitance > 0)) return;
    const double f0 = a.self_resonance_as_mounted;
    const bool network = a.self_resonance.method == "network" && (!a.shield || a.shield->by_network);
    if (network) {
        a.self_resonance_as_mounted = detail::MountedNetwork(a, {}).self_resonance(detail::spec_terms(a.spec));
    } else {
        const double l = a.shield ? a.shield->result.perfect_conductor : a.inductance.recommended;
        const double c = 1 / (std::pow(2 * pi * f0, 2) * l);
        a.self_resonance_as_mounted = f0 / std::sqrt(1 + b.stray_capacitance / c);
    }
}

TerminalTerms terminal_terms(const Analysis& a) {
    if (!a.spec.bench) return {};
    const BenchCorrections& b = *a.spec.bench;
    const double own = a.shield ? a.shield->self_resonance : a.self_resonance.frequency;
    return {b.stray_capacitance, b.lead_inductance, b.resistance_scale, a.self_resonance_as_mounted != own ? a.self_resonance_as_mounted : 0.0};
}

void add_impedance_and_band(Analysis& a) {
    const CoilSpec& spec = a.spec;
    const CoilImpedance zc = coil_impedance(a);
    a.self_resonance_low_as_mounted = zc.resonance_low();
    a.self_resonance_high_as_mounted = a.self_resonance_as_mounted * a.self_resonance.frequency_high / a.self_resonance.frequency;
    if (a.shield) {
        const double ratio = shield_radius_ratio(spec.solenoid, *spec.shield);
        const ShieldBandTerm t = shield_band_term(a.shield->self_resonance, a.self_resonance.frequency, a.shield->by_network, ratio);
        a.self_resonance_high_as_mounted *= t.high;
        const ShieldShiftError& e = network_shield_shift_error;
        std::string why = std::string("in the shield, ") + (a.shield->by_network ? "the turn network's" : "the lumped estimate's") + " shift (" +
                          detail::significant(100 * (a.shield->self_resonance / a.self_resonance.frequency - 1), 2) + " %)";
        const std::string range = "b/a " + detail::significant(e.radius_ratio_low, 2) + " .. " + detail::significant(e.radius_ratio_high, 2);
        if (t.measured) {
            why += ": its error against NEC2 in shields of " + range + ", " + detail::fixed(100 * e.low, 2) + " .. +" +
                   detail::fixed(100 * e.high, 2) + " %, and " + detail::fixed(100 * e.nec_grid, 1) + " % for NEC's grid";
        } else if (a.shield->by_network) {
            why += ", its shield outside the NEC2 reference's " + range + " (here " + detail::significant(ratio, 2) + "): half of it either side";
        } else {
            why += ", not checked against an outside reference: half of it more below";
        }
        a.self_resonance.band_reasons.push_back(why);
    }
    for (const auto& p : a.at_frequency) {
        // With this analysis's R and L, which may come from the cross-section solver.
        a.impedance.push_back(zc.with_wire(p.frequency, p.resistance, p.inductance));
        if (p.frequency >= a.self_resonance_as_mounted) {
            a.warnings.push_back("at " + hz(p.frequency) + " the coil is above its self-resonance (" + hz(a.self_resonance_as_mounted) +
                                 "): it is capacitive there");
        }
    }
    if (!spec.band) return;
    a.band = check_band(*spec.band, zc);
    const SelfResonance& sr = a.self_resonance;
    for (const auto& c : a.band->criteria) {
        if (c.name != "srf_margin" || !sr.medhurst.available) continue;
        double medhurst = sr.medhurst.frequency;
        if (a.shield) {
            medhurst = shielded_self_resonance(medhurst, a.inductance.recommended, a.shield->result.perfect_conductor,
                                               a.shield->terminal_capacitance);
        }
        if (spec.bench && spec.bench->stray_capacitance > 0) {  // the bench's capacitance across the terminals, lumped
            const double l = a.shield ? a.shield->result.perfect_conductor : a.inductance.recommended;
            medhurst /= std::sqrt(1 + spec.bench->stray_capacitance * std::pow(2 * pi * medhurst, 2) * l);
        }
        a.band_srf_by_medhurst = check_srf_margin(medhurst, a.band->ceiling, c.required);  // Medhurst's figure as it stands
        if (a.band_srf_by_medhurst->pass != c.pass) {
            a.warnings.push_back(std::string("the SRF margin ") + (c.pass ? "passes" : "fails") + " by the helical line but " +
                                 (c.pass ? "fails" : "passes") + " by Medhurst's measured capacitance (SRF " + hz(medhurst) +
                                 "); near grounded metal expect the lower figure");
        }
    }
}

ShieldLoad shield_load(const Analysis& a, ShieldTable table) {
    return ShieldLoad{std::move(table), a.shield->terminal_capacitance, a.shield->self_resonance, a.shield->result.perfect_conductor,
                      a.shield->by_network, shield_radius_ratio(a.spec.solenoid, *a.spec.shield)};
}

}  // namespace

std::string shield_words(const ShieldSpec& x) {
    return x.material.name + " shield, inner diameter " + format_quantity(x.inner_diameter, Dimension::length) + ", length " +
           format_quantity(x.length, Dimension::length) + ", wall " + format_quantity(x.thickness, Dimension::length) +
           (x.end_discs ? ", closed ends" : ", open ends");
}

FrequencySpan default_span(const Analysis& a) {
    const double srf = a.self_resonance_as_mounted;
    const auto& band = a.spec.band;
    FrequencySpan s{band ? band->low / 2 : srf / 1000, std::max(3 * srf, band ? 2 * band->ceiling : 0.0)};
    for (double f : a.spec.operating.frequencies) {
        if (f > 0) {
            s.low = std::min(s.low, f);
            s.high = std::max(s.high, f);
        }
    }
    return s;
}

CoilImpedance coil_impedance(const Analysis& a) {
    std::optional<ShieldLoad> load;
    if (a.shield) load = shield_load(a, a.shield->table);
    CoilImpedance zc(a.spec.solenoid, a.spec.conductor, a.spec.operating.temperature, a.inductance.recommended, a.self_resonance,
                     std::move(load), a.wire_table);
    zc.set_terminal_terms(terminal_terms(a));
    zc.set_dielectric_loss(a.dielectric_loss_tangent);
    return zc;
}

CoilImpedance coil_impedance(const Analysis& a, double low, double high) {
    if (!a.shield || (low >= a.shield->table.low() && high <= a.shield->table.high())) return coil_impedance(a);
    const ShieldTable wider(a.spec.solenoid, a.inductance.recommended, *a.spec.shield, std::min(low, a.shield->table.low()),
                            std::max(high, a.shield->table.high()));
    CoilImpedance zc(a.spec.solenoid, a.spec.conductor, a.spec.operating.temperature, a.inductance.recommended, a.self_resonance,
                     shield_load(a, wider), a.wire_table);
    zc.set_terminal_terms(terminal_terms(a));
    zc.set_dielectric_loss(a.dielectric_loss_tangent);
    return zc;
}

Analysis analyze(const CoilSpec& spec, const AnalysisOptions& options) {
    AnalysisOptions resolved = options;
    if (!resolved.auto_subdivision && resolved.subdivision.sectors == 0) resolved.subdivision.sectors = 2 * resolved.subdivision.layers;
    if (!resolved.auto_subdivision) {
        const Subdivision& d = resolved.subdivision;
        if (d.layers < 1 || d.layers > 200) throw InputError("layers", std::to_string(d.layers) + "; expected 1 .. 200");
        if (d.sectors < 1 || d.sectors > 400) throw InputError("sectors", std::to_string(d.sectors) + "; expected 1 .. 400");
        require_positive("grading", d.grading);
        if (options.solver != LossSolver::filaments) {
            throw InputError("layers", "applies to the filaments solver only");
        }
    }
    Analysis a{.spec = spec};
    a.inductance = inductance(spec.solenoid);
    a.warnings = a.inductance.warnings;
    if (resolved.solver == LossSolver::harmonics) {
        // The wire-harmonic solver where it is affordable, at the highest frequency the analysis asks for.
        double top = spec.operating.current_frequency.value_or(0.0);
        for (double f : spec.operating.frequencies) top = std::max(top, f);
        const double rho = spec.conductor.resistivity_at(spec.operating.temperature);
        const Solenoid& s = spec.solenoid;
        const bool fat = fat_wire(s);
        resolved.solver = default_loss_solver(s, spec.conductor, spec.operating.temperature, top, resolved.max_harmonic_unknowns);
        if (resolved.solver == LossSolver::filaments) {
            a.warnings.push_back("R and L(f) from the cross-section solver: the wire is fat (mean diameter " +
                                 three_digits(s.mean_radius() / s.wire().radius()) + " wire diameters, under " +
                                 three_digits(min_harmonic_diameter_ratio) + "), where the wire-harmonic solver reads R up to 2.4 % high");
        } else if (resolved.solver == LossSolver::closed_form) {
            a.warnings.push_back(spec.conductor.relative_permeability != 1
                                     ? std::string("R and L(f) from the closed forms: the wire-harmonic solver takes non-magnetic wire only")
                                 : fat ? std::string("R and L(f) from the closed forms: the wire is fat (mean diameter under ") +
                                             three_digits(min_harmonic_diameter_ratio) + " wire diameters) and the cross-section solver would take " +
                                             three_digits(cross_section_cells(s, rho, top)) + " cells, more than " +
                                             three_digits(max_fat_wire_cells)
                                       : "R and L(f) from the closed forms: the wire-harmonic solver would take " +
                                             std::to_string(wire_harmonic_unknowns(spec.solenoid, rho, top)) + " unknowns for this coil, more than the " +
                                             std::to_string(resolved.max_harmonic_unknowns) +
                                             " it is allowed by default (the closed forms read close-wound turns up to 28 % low)");
        }
    }
    a.notes = spec.notes;
    add_thermal(a, resolved);
    add_losses(a, resolved);
    add_self_resonance(a);
    add_shield(a);
    add_bench(a);
    if (a.loss_method == LossSolver::harmonics) {
        const FrequencySpan span = default_span(a);
        a.wire_table = WireLossTable(spec.solenoid, spec.conductor, a.spec.operating.temperature, a.inductance.recommended, span.low,
                                     span.high, spec.shield ? &*spec.shield : nullptr, 5, options.threads);
    }
    add_impedance_and_band(a);
    const Operating& op = a.spec.operating;
    double hottest = 0;  // a winding that runs away is past any limit
    if (a.thermal) hottest = a.thermal->runaway ? default_max_temperature : a.thermal->temperature;
    a.cautions = safety_cautions(op.supply_voltage, op.rf_power, hottest, a.thermal ? a.thermal->limit : 0);
    return a;
}

}  // namespace libcoil
