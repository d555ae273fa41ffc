#include "libcoil/studies/sweep.hpp"

#include <algorithm>
#include <cmath>

#include "libcoil/core/error.hpp"
#include "libcoil/core/units.hpp"
#include "libcoil/models/losses.hpp"
#include "studies/mounted_network.hpp"

namespace libcoil {

std::vector<double> frequency_grid(double from, double to, int points, Spacing spacing) {
    const struct {
        const char *from = "from", *to = "to", *points = "points";
    } n;
    require_non_negative(n.from, from);
    require_frequency(n.to, to);
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
            if (f[i] > 0) require_frequency("frequencies", f[i]);
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
        detail::MountedNetwork net(a, f);
        const detail::NetworkTerms terms = detail::spec_terms(a.spec);
        s.points = net.points(terms);
        s.nominal_inductance = (a.shield ? a.shield->result.perfect_conductor : a.inductance.recommended) + terms.lead_inductance;
        s.self_resonance = net.self_resonance(terms);
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
