#include "libcoil/models/losses.hpp"

#include <algorithm>
#include <cmath>

#include "libcoil/core/constants.hpp"
#include "libcoil/models/dc_resistance.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/proximity.hpp"
#include "libcoil/models/skin_effect.hpp"
#include "libcoil/models/wire_harmonics.hpp"

namespace libcoil {

namespace {

double q_of(double f, double l, double r) { return f > 0 ? 2 * pi * f * l / r : 0.0; }

void check_frequencies(const std::vector<double>& fs) {
    // The field's name is built only for a bad value (a design screen checks nine frequencies a coil).
    for (std::size_t i = 0; i < fs.size(); ++i) {
        if (!(fs[i] >= 0) || !std::isfinite(fs[i])) require_non_negative("frequencies[" + std::to_string(i) + "]", fs[i]);
    }
}

}  // namespace

WireAtFrequency wire_at_frequency(const Wire& w, const Conductor& cond, double temperature, double f) {
    require_positive("wire.diameter", w.bare_diameter);
    require_non_negative("frequency", f);
    WireAtFrequency out;
    out.bare_diameter = w.bare_diameter;
    out.insulated_diameter = w.insulated_diameter();
    out.dc_resistance_per_length = dc_resistance_per_length(cond, w.bare_diameter, temperature);
    out.frequency = f;
    const double rho = cond.resistivity_at(temperature);
    if (f > 0) {
        out.skin_depth = skin_depth(rho, f, cond.relative_permeability);
        out.skin_ratio = skin_ratios(std::sqrt(2.0) * w.radius() / out.skin_depth).resistance;
    }
    // R_ac / R_dc = 1.1 at x = 2.13695 (the root of skin_ratios, found once by bisection); then
    // delta = sqrt(2) r / x and f = rho / (pi mu0 mu_r delta^2).
    static const double x_onset = [] {
        double lo = 1.0, hi = 4.0;
        for (int i = 0; i < 200; ++i) {
            const double mid = (lo + hi) / 2;
            (skin_ratios(mid).resistance < 1.1 ? lo : hi) = mid;
        }
        return (lo + hi) / 2;
    }();
    const double delta = std::sqrt(2.0) * w.radius() / x_onset;
    out.skin_onset_frequency = rho / (pi * mu0 * cond.relative_permeability * delta * delta);
    return out;
}

std::vector<CoilAtFrequency> coil_at_frequencies(const Solenoid& c, const Conductor& cond, double temperature,
                                                 double l_dc, const std::vector<double>& fs) {
    check_frequencies(fs);
    require_positive("dc_inductance", l_dc);
    const bool any_ac = std::any_of(fs.begin(), fs.end(), [](double f) { return f > 0; });
    return coil_at_frequencies(c, cond, temperature, l_dc, fs, any_ac ? mean_square_field_per_ampere(c) : 0.0);
}

std::vector<CoilAtFrequency> coil_at_frequencies(const Solenoid& c, const Conductor& cond, double temperature,
                                                 double l_dc, const std::vector<double>& fs, double field) {
    check_frequencies(fs);
    require_positive("dc_inductance", l_dc);
    require_non_negative("mean_square_field", field);
    const double l_int_dc = mu0 * cond.relative_permeability / (8 * pi) * c.helix_length();
    std::vector<CoilAtFrequency> out;
    out.reserve(fs.size());
    for (double f : fs) {
        const AcResistance r = ac_resistance(c, cond, temperature, f, field);
        CoilAtFrequency p;
        p.frequency = f;
        p.resistance = r.resistance;
        p.skin_ratio = r.skin_ratio;
        p.proximity_ratio = r.proximity_ratio;
        p.inductance = l_dc - l_int_dc * (1 - r.internal_inductance_ratio);
        p.q_factor = q_of(f, p.inductance, p.resistance);
        out.push_back(p);
    }
    return out;
}

std::vector<CoilAtFrequency> coil_at_frequencies_numerical(const Solenoid& c, const Conductor& cond, double temperature,
                                                           double l_dc, const std::vector<double>& fs,
                                                           const Subdivision& sub,
                                                           const std::function<void(std::size_t, std::size_t)>& progress,
                                                           const ShieldSpec* shield) {
    check_frequencies(fs);
    require_positive("dc_inductance", l_dc);
    const double rho = cond.resistivity_at(temperature);
    const CrossSectionSolver solver(c, rho, sub, shield ? std::optional<ShieldSpec>(*shield) : std::nullopt);
    const RingImpedance dc = solver.solve(0);
    // As coil_at_frequencies_harmonic: the rings' R(f) / R(0) on the helix's DC resistance, so that f = 0
    // gives the DC resistance exactly (a fat wire's torus has its own DC R: 1.4 % off rho l / A at D/d 4.2).
    const double per_m = dc_resistance_per_length(cond, c.wire().bare_diameter, temperature);
    const double helix_dc = per_m * c.helix_length();
    std::vector<CoilAtFrequency> out;
    for (std::size_t i = 0; i < fs.size(); ++i) {
        const double f = fs[i];
        const RingImpedance z = f > 0 ? solver.solve(f) : dc;
        const double skin = f > 0 ? wire_skin_ratios(c.wire().radius(), rho, f, cond.relative_permeability).resistance : 1.0;
        CoilAtFrequency p;
        p.frequency = f;
        p.resolved = z.resolved;
        p.numerical = true;
        p.resistance = helix_dc * (z.resistance - z.wall_resistance) / dc.resistance + per_m * c.lead_length() * skin;
        p.skin_ratio = skin;
        p.proximity_ratio = (z.resistance - z.wall_resistance) / dc.resistance - skin;
        p.inductance = l_dc + (z.inductance - z.wall_inductance - dc.inductance);
        p.q_factor = q_of(f, p.inductance, p.resistance);
        out.push_back(p);
        if (progress) progress(i + 1, fs.size());
    }
    return out;
}

std::vector<CoilAtFrequency> coil_at_frequencies_harmonic(const Solenoid& c, const Conductor& cond, double temperature,
                                                          double l_dc, const std::vector<double>& fs, const ShieldSpec* shield,
                                                          unsigned threads) {
    check_frequencies(fs);
    require_positive("dc_inductance", l_dc);
    if (cond.relative_permeability != 1) throw DomainError("the wire-harmonic solver takes non-magnetic wire only");
    const double rho = cond.resistivity_at(temperature);
    const WireHarmonicSolver solver(c, rho, 0, shield ? std::optional<ShieldSpec>(*shield) : std::nullopt);
    // DC first, then every frequency, in one call that shares the kernel's geometry between them.
    std::vector<double> solved{0.0};
    for (double f : fs) {
        if (f > 0) solved.push_back(f);
    }
    const std::vector<RingImpedance> zs = solver.solve(solved, threads);
    const RingImpedance& dc = zs.front();
    // The rings' R relative to their DC value, applied to the helix's DC resistance (so that f = 0 gives the
    // DC resistance exactly; the torus's own curvature changes its DC R by (r / R)^2 / 8, 3e-4 at R / r = 20).
    const double per_m = dc_resistance_per_length(cond, c.wire().bare_diameter, temperature);
    const double helix_dc = per_m * c.helix_length();
    std::vector<CoilAtFrequency> out;
    std::size_t next = 1;
    for (double f : fs) {
        const RingImpedance& z = f > 0 ? zs[next++] : dc;
        const double skin = f > 0 ? wire_skin_ratios(c.wire().radius(), rho, f, cond.relative_permeability).resistance : 1.0;
        CoilAtFrequency p;
        p.frequency = f;
        p.numerical = true;
        p.resistance = f > 0 ? helix_dc * (z.resistance - z.wall_resistance) / dc.resistance + per_m * c.lead_length() * skin
                             : helix_dc + per_m * c.lead_length();
        p.skin_ratio = skin;
        p.proximity_ratio = (z.resistance - z.wall_resistance) / dc.resistance - skin;
        p.inductance = f > 0 ? l_dc + (z.inductance - z.wall_inductance - dc.inductance) : l_dc;
        p.q_factor = q_of(f, p.inductance, p.resistance);
        out.push_back(p);
    }
    return out;
}

WireLossTable::WireLossTable(const Solenoid& c, const Conductor& cond, double temperature, double l_dc, double low, double high,
                             const ShieldSpec* shield, int per_decade, unsigned threads) {
    require_positive("low", low);
    require_positive("high", high);
    if (per_decade < 1 || per_decade > 50) throw InputError("per_decade", std::to_string(per_decade) + " is outside 1 .. 50");
    // Where d / delta = 0.7 (x = 0.5): below it skin and proximity change R by under 1e-4.
    const double rho = cond.resistivity_at(temperature);
    const double d = c.wire().bare_diameter;
    const double onset = rho / (pi * mu0 * cond.relative_permeability * std::pow(d / 0.7, 2));
    low = std::max(low, onset);
    if (high <= low || fat_wire(c) || cond.relative_permeability != 1) return;
    // Only where the solve is affordable (wire_harmonics_apply); above, the last point's correction holds.
    // Big systems take 3 points a decade.
    if (wire_harmonic_unknowns(c, rho, high) > default_max_harmonic_unknowns / 2) per_decade = std::min(per_decade, 3);
    const int n = std::max(2, static_cast<int>(std::ceil(std::log10(high / low) * per_decade)) + 1);
    for (int i = 0; i < n; ++i) {
        const double f = low * std::pow(high / low, static_cast<double>(i) / (n - 1));
        if (wire_harmonic_unknowns(c, rho, f) <= default_max_harmonic_unknowns) f_.push_back(f);
    }
    if (f_.empty()) return;
    const int m = static_cast<int>(f_.size());
    const auto h = coil_at_frequencies_harmonic(c, cond, temperature, l_dc, f_, shield, threads);
    const auto closed = coil_at_frequencies(c, cond, temperature, l_dc, f_);
    for (int i = 0; i < m; ++i) {
        ratio_.push_back(h[static_cast<std::size_t>(i)].resistance / closed[static_cast<std::size_t>(i)].resistance);
        offset_.push_back(h[static_cast<std::size_t>(i)].inductance - closed[static_cast<std::size_t>(i)].inductance);
    }
}

namespace {

double interpolate_log(const std::vector<double>& f, const std::vector<double>& v, double x, double empty) {
    if (f.empty()) return empty;
    if (x <= f.front()) return v.front();
    if (x >= f.back()) return v.back();
    const auto it = std::upper_bound(f.begin(), f.end(), x);
    const std::size_t k = static_cast<std::size_t>(it - f.begin());
    if (x == f[k - 1]) return v[k - 1];  // on a grid point (the design screen's tables): what t = 0 gives, without the logarithms
    const double t = std::log(x / f[k - 1]) / std::log(f[k] / f[k - 1]);
    return v[k - 1] + t * (v[k] - v[k - 1]);
}

}  // namespace

WireLossTable::WireLossTable(std::vector<double> frequencies, std::vector<double> resistance_ratio, std::vector<double> inductance_offset)
    : f_(std::move(frequencies)), ratio_(std::move(resistance_ratio)), offset_(std::move(inductance_offset)) {
    if (ratio_.size() != f_.size() || offset_.size() != f_.size()) throw InputError("wire loss table", "needs a ratio and an offset at each frequency");
    for (std::size_t i = 0; i < f_.size(); ++i) {
        require_positive("wire loss table frequency", f_[i]);
        if (i > 0 && !(f_[i] > f_[i - 1])) throw InputError("wire loss table frequency", "must rise");
        require_positive("wire loss table resistance ratio", ratio_[i]);
        require_finite("wire loss table inductance offset", offset_[i]);
    }
}

double WireLossTable::resistance_ratio(double f) const {
    // Below the grid the two agree at DC; the first point's ratio holds down to it.
    return interpolate_log(f_, ratio_, f, 1.0);
}

double WireLossTable::inductance_offset(double f) const { return interpolate_log(f_, offset_, f, 0.0); }

void WireLossTable::correct(std::vector<CoilAtFrequency>& points) const {
    if (empty()) return;
    for (auto& p : points) {
        if (p.frequency <= 0) continue;
        p.resistance *= resistance_ratio(p.frequency);
        p.inductance += inductance_offset(p.frequency);
        p.q_factor = q_of(p.frequency, p.inductance, p.resistance);
    }
}

namespace {

// subdivision_for at `f` (at least 1 Hz: below, the DC subdivision).
Subdivision subdivision_at(const Solenoid& c, double rho, double f) {
    return subdivision_for(c.wire().radius(), skin_depth(rho, std::max(f, 1.0)));
}

}  // namespace

double cross_section_cells(const Solenoid& c, double rho, double f) {
    const Subdivision sub = subdivision_at(c, rho, f);
    return std::max(1.0, std::round(c.turns())) * (1 + (sub.layers - 1) * sub.sectors);
}

LossSolver default_loss_solver(const Solenoid& c, const Conductor& cond, double temperature, double highest,
                               std::size_t max_harmonic_unknowns) {
    if (wire_harmonics_apply(c, cond, temperature, highest, max_harmonic_unknowns)) return LossSolver::harmonics;
    if (fat_wire(c) && cond.relative_permeability == 1 && cross_section_cells(c, cond.resistivity_at(temperature), highest) <= max_fat_wire_cells) {
        return LossSolver::filaments;
    }
    return LossSolver::closed_form;
}

std::vector<CoilAtFrequency> coil_at_frequencies_by(LossSolver solver, const Solenoid& c, const Conductor& cond, double temperature,
                                                    double l_dc, const std::vector<double>& fs, double highest,
                                                    const ShieldSpec* shield) {
    switch (solver) {
        case LossSolver::harmonics: return coil_at_frequencies_harmonic(c, cond, temperature, l_dc, fs, shield);
        case LossSolver::filaments: {
            return coil_at_frequencies_numerical(c, cond, temperature, l_dc, fs, subdivision_at(c, cond.resistivity_at(temperature), highest),
                                                 {}, shield);
        }
        case LossSolver::closed_form: break;
    }
    return coil_at_frequencies(c, cond, temperature, l_dc, fs);
}

}  // namespace libcoil
