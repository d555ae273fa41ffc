// The design screen's fall of L from DC to a frequency (design_search.hpp's Evaluator::screen_fall_estimate,
// fitted_wire): the fit of the wire-harmonic solver's (inductance_fall_screen.hpp) where the analysis takes
// that solver, else the closed form's internal inductance.
#include <algorithm>
#include <cmath>

#include "libcoil/core/constants.hpp"
#include "libcoil/models/skin_effect.hpp"
#include "libcoil/models/wire_harmonics.hpp"
#include "studies/design_search.hpp"

namespace libcoil::detail {

// Per wire option, at the ambient temperature (the winding's own, which the analysis takes, is not known
// before the turns are): the closed form's fall per metre, the fit at the target frequency and at the band's
// screen points, and d / delta at the top frequency.
void Evaluator::prepare_fall() {
    const double rho = q_.conductor.resistivity_at(q_.ambient), mu = q_.conductor.relative_permeability;
    const bool fitted = !q_.shield && mu == 1;
    if (q_.band && fitted) {
        for (int i = 0; i < screen_points; ++i) band_points_.push_back(q_.band->low * std::pow(q_.band->ceiling / q_.band->low, i / (screen_points - 1.0)));
    }
    for (const WireOption& wo : q_.wires) {
        const auto x_at = [&](double f) { return std::sqrt(2.0) * wo.wire.radius() / skin_depth(rho, f, mu); };
        double fall = 0;
        std::optional<InductanceFallFit> fit;
        if (target_frequency_ > 0) {
            const double x = x_at(target_frequency_), internal = skin_ratios(x).internal_inductance;
            fall = -dc_internal_inductance_per_length(mu) * (1 - internal);
            if (fitted) fit.emplace(x, internal);
        }
        screen_fall_per_length_.push_back(fall);
        fall_fit_.push_back(fit);
        top_d_over_delta_.push_back(top_frequency() > 0 ? wo.wire.bare_diameter / skin_depth(rho, top_frequency(), mu) : 0.0);
        // harmonic_unknowns_for's count, (n + 1) / 2 rings of 2 M + 2 unknowns, is largest at the closest
        // pitch (M grows as the gap closes, to its ceiling at a gap of a hundredth of d and below).
        const auto per_ring = static_cast<long>(2 * harmonics_for(1.001, top_d_over_delta_.back()) + 2);
        solver_takes_any_pitch_.push_back(2 * (static_cast<long>(default_max_harmonic_unknowns) / per_ring));
        std::vector<InductanceFallFit> band;
        for (const double f : band_points_) band.emplace_back(x_at(f), skin_ratios(x_at(f)).internal_inductance);
        band_fall_fit_.push_back(std::move(band));
    }
}

bool Evaluator::solver_takes(std::size_t wire, double turns, double pitch) const {
    if (std::lround(turns) <= solver_takes_any_pitch_[wire]) return true;
    return harmonic_unknowns_for(turns, pitch / unlabelled_[wire].bare_diameter, top_d_over_delta_[wire]) <= default_max_harmonic_unknowns;
}

namespace {

// The fit's rows a thread took last: the screen takes one wire on one form for a run of pitch ratios, and its
// solve asks for the fall at several turns and pitches of each. A row is a function of its key alone (the
// fit's weights and D / d), so the row found here is the row that would be built.
struct RowMemo {
    FallShapes weights{};
    double diameter = -1;
    FallAtDiameter<1> row;
};
struct ShapesMemo {
    double diameter = -1;
    FallAtDiameter<inductance_fall_fit::shapes> row;
};

}  // namespace

FallEstimate Evaluator::screen_fall_estimate(std::size_t wire, double mean, double turns, double pitch) const {
    if (fixed_offset_) return {*fixed_offset_, 0};
    if (const auto& fit = fall_fit_[wire]; fit && solver_takes(wire, turns, pitch)) {
        const double d = unlabelled_[wire].bare_diameter, diameter = mean / d;
        thread_local RowMemo memo;
        if (memo.diameter != diameter || memo.weights != fit->weights()) memo = {fit->weights(), diameter, fit->at_diameter(diameter)};
        // (A fall of half of L lies far outside what the sample held: the closed form then.)
        if (const auto r = memo.row.at(pitch / d, turns); r && (*r)[0] / diameter < 0.5) return {0, (*r)[0] / diameter};
    }
    return {screen_fall_per_length_[wire] * turns * pi * mean, 0};
}

WireLossTable Evaluator::fitted_wire(std::size_t wire, const Solenoid& s, double temperature, double l_dc) const {
    if (band_points_.empty() || !fall_fit_[wire] || !solver_takes(wire, s.turns(), s.pitch())) return {};
    const double d = s.wire().bare_diameter, diameter = s.mean_diameter() / d;
    thread_local ShapesMemo memo;
    if (memo.diameter != diameter) memo = {diameter, fall_shapes_at(diameter)};
    const auto at = memo.row.at(s.pitch_to_wire(), s.turns());
    if (!at) return {};
    const FallShapes& shapes = *at;
    // The closed forms' L(f) at the winding's temperature (losses.hpp's coil_at_frequencies): L_dc less the
    // internal inductance the skin effect removes; the offset moves it onto L_dc (1 - the fitted ratio).
    const double rho = q_.conductor.resistivity_at(temperature), l_int_dc = dc_internal_inductance_per_length() * s.helix_length();
    std::vector<double> f, ratio, offset;
    f.reserve(band_points_.size());
    ratio.reserve(band_points_.size());
    offset.reserve(band_points_.size());
    for (std::size_t i = 0; i < band_points_.size(); ++i) {
        const InductanceFallFit& fit = band_fall_fit_[wire][i];
        if (!fit.in_range()) continue;
        const double closed = l_int_dc * (1 - wire_skin_ratios(s.wire().radius(), rho, band_points_[i]).internal_inductance);
        f.push_back(band_points_[i]);
        ratio.push_back(1.0);
        offset.push_back(closed - fit.ratio(shapes, diameter) * l_dc);
    }
    return f.empty() ? WireLossTable{} : WireLossTable(std::move(f), std::move(ratio), std::move(offset));
}

}  // namespace libcoil::detail
