#include "libcoil/studies/spread.hpp"

#include <algorithm>
#include <cmath>

#include <boost/random/mersenne_twister.hpp>
#include <boost/random/normal_distribution.hpp>

#include "libcoil/core/error.hpp"
#include "libcoil/models/inductance.hpp"

namespace libcoil {

namespace {

struct Inputs {
    double form_diameter, pitch, wire_diameter, turns;
};

// The coil built with these inputs: the enamel build scales with the bare diameter.
Solenoid build(const Solenoid& nominal, const Inputs& in) {
    Wire w = nominal.wire();
    const double scale = in.wire_diameter / w.bare_diameter;
    w.bare_diameter = in.wire_diameter;
    w.insulation *= scale;
    return Solenoid(Solenoid::Params{in.form_diameter + w.insulated_diameter(), in.turns, in.pitch, w, nominal.lead_length()});
}

struct Figures {
    double inductance, self_resonance;
};

Figures evaluate(const Solenoid& nominal, const Inputs& in, const FormerDielectric& former, const Surroundings& env) {
    const Solenoid s = build(nominal, in);
    const double L = recommended_inductance(s);
    return {L, self_resonance(s, L, former, env, false).frequency};
}

SpreadStatistics statistics(std::vector<double> v, double nominal) {
    SpreadStatistics s;
    s.nominal = nominal;
    if (v.empty()) return s;
    double sum = 0;
    for (double x : v) sum += x;
    s.mean = sum / static_cast<double>(v.size());
    double ss = 0;
    for (double x : v) ss += (x - s.mean) * (x - s.mean);
    s.standard_deviation = v.size() > 1 ? std::sqrt(ss / static_cast<double>(v.size() - 1)) : 0;
    std::sort(v.begin(), v.end());
    const auto quantile = [&](double q) {
        const double pos = q * static_cast<double>(v.size() - 1);
        const auto i = static_cast<std::size_t>(std::floor(pos));
        const double t = pos - static_cast<double>(i);
        return i + 1 < v.size() ? v[i] * (1 - t) + v[i + 1] * t : v[i];
    };
    s.low = quantile(0.025);
    s.high = quantile(0.975);
    return s;
}

}  // namespace

Spread tolerance_spread(const Solenoid& coil, double target, double tolerance, const FormerDielectric& former,
                        const Surroundings& surroundings, const BuildTolerances& t, std::size_t samples,
                        std::uint64_t seed) {
    require_positive("target", target);
    require_positive("tolerance", tolerance);
    if (samples < 10 || samples > 10'000'000) throw InputError("samples", std::to_string(samples) + "; expected 10 .. 10000000");
    const Inputs nominal{coil.form_diameter(), coil.pitch(), coil.wire().bare_diameter, coil.turns()};
    validate_tolerances(t, coil);
    const Figures f0 = evaluate(coil, nominal, former, surroundings);

    Spread out;
    out.seed = seed;
    out.tolerances = t;
    boost::random::mt19937_64 rng(seed);
    boost::random::normal_distribution<double> normal(0.0, 1.0);
    std::vector<double> ls, fs;
    ls.reserve(samples);
    fs.reserve(samples);
    std::size_t within = 0;
    for (std::size_t i = 0; i < samples; ++i) {
        // Four draws per sample, always, so that the stream does not depend on which samples fail.
        const Inputs in{nominal.form_diameter + t.form_diameter * normal(rng), nominal.pitch + t.pitch * normal(rng),
                        nominal.wire_diameter * (1 + t.wire_diameter * normal(rng)), nominal.turns + t.turns * normal(rng)};
        try {
            const Figures f = evaluate(coil, in, former, surroundings);
            ls.push_back(f.inductance);
            fs.push_back(f.self_resonance);
            within += std::fabs(f.inductance / target - 1) <= tolerance;
        } catch (const InputError&) {
            ++out.left_out;  // overlapping turns, and the like
        } catch (const DomainError&) {
            ++out.left_out;
        }
    }
    out.samples = ls.size();
    if (ls.empty()) {
        throw InputError("tolerances", "every one of the " + std::to_string(samples) +
                                           " samples was left out (overlapping turns and the like); expected tolerances the coil can be built to");
    }
    out.inductance = statistics(ls, f0.inductance);
    out.self_resonance = statistics(fs, f0.self_resonance);
    out.within_tolerance = ls.empty() ? 0 : static_cast<double>(within) / static_cast<double>(ls.size());

    // First-order sensitivities by central differences of 0.1 %.
    const double h = 1e-3;
    double var = 0;
    const auto sensitivity = [&](const char* name, double Inputs::*field, double sigma) {
        Inputs up = nominal, down = nominal;
        up.*field *= 1 + h;
        down.*field *= 1 - h;
        Sensitivity s{name, 0, 0};
        try {
            const Figures a = evaluate(coil, up, former, surroundings), b = evaluate(coil, down, former, surroundings);
            s.inductance = (a.inductance - b.inductance) / (2 * h * f0.inductance);
            s.self_resonance = (a.self_resonance - b.self_resonance) / (2 * h * f0.self_resonance);
        } catch (const InputError&) {
            // At a limit of the geometry (touching turns): one-sided.
            const Figures a = evaluate(coil, up, former, surroundings);
            s.inductance = (a.inductance - f0.inductance) / (h * f0.inductance);
            s.self_resonance = (a.self_resonance - f0.self_resonance) / (h * f0.self_resonance);
        }
        const double rel = sigma / (nominal.*field);
        var += s.inductance * s.inductance * rel * rel;
        out.sensitivities.push_back(s);
    };
    sensitivity("form_diameter", &Inputs::form_diameter, t.form_diameter);
    sensitivity("pitch", &Inputs::pitch, t.pitch);
    sensitivity("wire_diameter", &Inputs::wire_diameter, t.wire_diameter * nominal.wire_diameter);
    sensitivity("turns", &Inputs::turns, t.turns);
    out.first_order_inductance_deviation = std::sqrt(var) * f0.inductance;
    return out;
}

}  // namespace libcoil
