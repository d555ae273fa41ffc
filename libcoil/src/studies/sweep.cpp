#include "libcoil/studies/sweep.hpp"

#include <algorithm>
#include <cmath>

#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/models/losses.hpp"
#include "libcoil/models/turn_network.hpp"

namespace libcoil {

std::vector<double> frequency_grid(double from, double to, int points, Spacing spacing) {
    const struct {
        const char *from = "from", *to = "to", *points = "points";
    } n;
    require_non_negative(n.from, from);
    require_positive(n.to, to);
    if (!(to > from)) {
        throw InputError(n.to, format_quantity(to, Dimension::frequency) + " is not above the first frequency (" +
                                   format_quantity(from, Dimension::frequency) + ")");
    }
    if (points < 2 || points > 1000000) throw InputError(n.points, std::to_string(points) + "; expected 2 .. 1000000");
    const bool log = spacing == Spacing::logarithmic;
    if (log && !(from > 0)) throw InputError(n.from, "a log sweep must start above 0 Hz");
    std::vector<double> f(static_cast<std::size_t>(points));
    for (int i = 0; i < points; ++i) {
        const double t = static_cast<double>(i) / (points - 1);
        f[static_cast<std::size_t>(i)] = log ? from * std::pow(to / from, t) : from + (to - from) * t;
    }
    f.back() = to;
    return f;
}

namespace {

// Z(f) by the turn network (turn_network.hpp): every resonance of the coupled turns, with the winding's
// closed-form R(f) spread over the turns (and in a shield, the ring model's wall loss with it). The former is
// in the network (its polarisation charge); its loss tangent acts on the share of the capacitance it
// brings, 1 - (f_former / f_air)^2 by the network's SRFs. A shield is in the network too (turn_network.hpp).
void network_sweep(const Analysis& a, const std::vector<double>& f, Sweep& s) {
    const SelfResonance& sr = a.self_resonance;
    if (!sr.network.available) throw InputError("model", "network: the turn network is not built for this coil (over 600 turns)");
    const Solenoid& coil = a.spec.solenoid;
    TurnNetworkOptions o;
    o.mounting = a.spec.surroundings.mounting;
    o.relative_permittivity = a.spec.surroundings.relative_permittivity;
    double tan_d = 0;
    if (a.spec.former) {
        const double in_air = TurnNetwork(coil, o).first_resonance();
        o.former = a.spec.former->dielectric(coil.form_diameter());
        const double ratio = std::min(1.0, sr.network.frequency / in_air);
        tan_d = a.spec.former->material.loss_tangent * (1 - ratio * ratio);
    }
    if (a.spec.shield) o.shield = *a.spec.shield;
    const TurnNetwork net(coil, o);
    const auto wire = coil_at_frequencies(coil, a.spec.conductor, a.spec.operating.temperature, a.inductance.recommended, f);
    for (std::size_t i = 0; i < f.size(); ++i) {
        ImpedancePoint p;
        p.frequency = f[i];
        // In a shield the network holds the perfect conductor's change to L; below the frequencies where the
        // wall is that, the ring model's own change differs, and its wall loss adds to the wire's.
        double r = wire[i].resistance, extra_l = 0;
        if (a.shield && f[i] > 0) {
            r += a.shield->table.added_resistance(f[i]);
            extra_l = a.shield->table.inductance_change(f[i]) - (a.shield->result.perfect_conductor - a.inductance.recommended);
        }
        p.wire_resistance = r;
        p.wire_inductance = wire[i].inductance + (a.shield && f[i] > 0 ? a.shield->table.inductance_change(f[i]) : 0.0);
        p.impedance = f[i] > 0 ? net.impedance(f[i], r, tan_d, extra_l) : std::complex<double>(wire[i].resistance, 0);
        p.apparent_inductance = f[i] > 0 ? p.impedance.imag() / (2 * 3.141592653589793 * f[i]) : wire[i].inductance;
        p.q_factor = p.impedance.imag() / p.impedance.real();
        s.points.push_back(p);
    }
    s.nominal_inductance = a.shield ? a.shield->result.perfect_conductor : a.inductance.recommended;
    s.self_resonance = a.shield ? a.shield->self_resonance : sr.network.frequency;
}

}  // namespace

Sweep sweep_study(const Analysis& a, const SweepRequest& q) {
    const SelfResonance& sr = a.self_resonance;
    const FrequencySpan span = default_span(a);
    Sweep s;
    s.title = a.spec.name;
    // By default the model of the recommended SRF: the network where it gives it (in the shield too) for
    // coils it sweeps in seconds, else the helical line.
    const bool network_default = sr.method == "network" && (!a.shield || a.shield->by_network) &&
                                 a.spec.solenoid.turns() <= max_default_network_turns;
    const ImpedanceModel model = q.model.value_or(network_default ? ImpedanceModel::network : ImpedanceModel::helical_line);
    s.model = model;
    s.capacitance = q.capacitance;
    s.mounting = a.spec.surroundings.mounting;
    s.spacing = q.spacing;
    s.temperature = a.spec.operating.temperature;
    std::vector<double> f = q.frequencies;
    if (f.empty()) {
        f = frequency_grid(q.from.value_or(span.low), q.to.value_or(span.high), q.points, q.spacing);
    } else {
        if (f.size() > 10000000) throw InputError("frequencies", std::to_string(f.size()) + " frequencies; expected at most 10000000");
        for (std::size_t i = 0; i < f.size(); ++i) {
            require_non_negative("frequencies", f[i]);
            if (i > 0 && !(f[i] > f[i - 1])) throw InputError("frequencies", "not in ascending order at index " + std::to_string(i));
        }
    }
    s.from = f.front();
    s.to = f.back();
    double c = 0;  // the recommended C
    if (q.capacitance == CapacitanceSource::medhurst) {
        if (model != ImpedanceModel::lumped) throw InputError("capacitance", "medhurst applies to the lumped model only");
        if (!sr.medhurst.available) throw InputError("capacitance", "this coil is outside Medhurst's table");
        c = sr.medhurst.capacitance;
    }
    if (model == ImpedanceModel::network) {
        network_sweep(a, f, s);
    } else {
        const double lowest = f.front() > 0 ? f.front() : (f.size() > 1 ? f[1] : f.back());
        const CoilImpedance zc = coil_impedance(a, lowest > 0 ? lowest : span.low, std::max(f.back(), span.low));
        s.points = zc.sweep(f, model, c);
        s.nominal_inductance = zc.nominal_inductance();
        s.self_resonance = zc.resonance();
    }
    if (c > 0) {  // Medhurst's C with the shield's capacitance, and the nominal L
        const double c_total = c + (a.shield ? a.shield->terminal_capacitance : 0);
        s.self_resonance = 1 / (2 * 3.141592653589793 * std::sqrt(s.nominal_inductance * c_total));
    }
    if (a.spec.band) {
        s.band_low = a.spec.band->low;
        s.band_ceiling = a.spec.band->ceiling;
    }
    if (a.spec.shield) s.shield = shield_words(*a.spec.shield);
    return s;
}

}  // namespace libcoil
