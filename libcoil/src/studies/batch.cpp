#include "libcoil/studies/batch.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <thread>

#include "libcoil/core/constants.hpp"
#include "libcoil/core/error.hpp"
#include "libcoil/models/dc_resistance.hpp"
#include "libcoil/models/inductance.hpp"
#include "libcoil/models/medhurst.hpp"
#include "libcoil/models/proximity.hpp"
#include "libcoil/models/rosa.hpp"
#include "libcoil/models/self_resonance.hpp"
#include "libcoil/models/skin_effect.hpp"
#include "libcoil/models/solenoid.hpp"
#include "models/wire_kernels.hpp"
#include "studies/parallel.hpp"

namespace libcoil {

namespace {

struct Figures {
    double inductance, dc_resistance, resistance, q_factor, self_resonance;
};

// Element i of an array of length n or 1.
inline double at(std::span<const double> a, std::size_t i) { return a.size() == 1 ? a[0] : a[i]; }

// self_resonance's fast path (cross_checks false): the helical line's frequency where it holds. Asked first
// here, it spares the full record (strings and lists) of every element; where it has no slow wave,
// self_resonance itself decides (Medhurst's capacitance, or a DomainError).
double fast_self_resonance(const Solenoid& s, double inductance) {
    try {
        return helical_line_resonance(s, {}, {}, search_tolerance).frequency;
    } catch (const DomainError&) {
        return self_resonance(s, inductance, {}, {}, false).frequency;
    }
}

// One element; throws InputError or DomainError as the models do.
Figures element(const BatchInput& in, std::size_t i, BatchChain chain) {
    const Conductor& c = in.conductors[in.conductor.empty() ? 0 : in.conductor.size() == 1 ? in.conductor[0] : in.conductor[i]];
    const Solenoid s(Solenoid::Params{at(in.mean_diameter, i), at(in.turns, i), at(in.pitch, i), Wire{at(in.wire_diameter, i), at(in.insulation, i), {}}, 0});
    const double t = at(in.temperature, i), f = at(in.frequency, i);
    require_non_negative("frequency", f);
    const double rho = c.resistivity_at(t), r = s.wire().radius();
    Figures out{};
    if (chain == BatchChain::light) {
        out.dc_resistance = rho * resistance_per_resistivity(s.wire().bare_diameter, s.wire_length());
        out.inductance = rosa_inductance(s.mean_diameter(), s.turns(), s.pitch(), s.wire().bare_diameter);
        // x = sqrt(2) r / delta, delta = sqrt(rho / (pi f mu0 mu_r)) (skin_effect.hpp), by its tables.
        const double x = r * std::sqrt(2 * pi * f * mu0 * c.relative_permeability / rho);
        out.resistance = out.dc_resistance * detail::wire_skin_resistance(x);
        const double c_self = medhurst_capacitance_formula(s.mean_diameter(), s.winding_length());
        out.self_resonance = 1 / (2 * pi * std::sqrt(out.inductance * c_self));
    } else {
        out.inductance = recommended_inductance(s);
        const AcResistance ac = ac_resistance(s, c, t, f);
        out.dc_resistance = ac.dc;
        out.resistance = ac.resistance;
        out.self_resonance = fast_self_resonance(s, out.inductance);
    }
    out.q_factor = 2 * pi * f * out.inductance / out.resistance;
    for (double v : {out.inductance, out.dc_resistance, out.resistance, out.q_factor, out.self_resonance}) finite_result("batch figure", v);
    return out;
}

}  // namespace

std::size_t BatchInput::size() const {
    std::size_t n = 0;
    for (const auto* a : {&mean_diameter, &turns, &pitch, &wire_diameter, &insulation, &temperature, &frequency}) n = std::max(n, a->size());
    return std::max(n, conductor.size());
}

// The batch as a whole: every array of length n or 1, a conductor table, indices within it.
static void check_batch(const BatchInput& in) {
    const std::size_t n = in.size();
    for (const auto* a : {&in.mean_diameter, &in.turns, &in.pitch, &in.wire_diameter, &in.insulation, &in.temperature, &in.frequency}) {
        if (a->size() != n && a->size() != 1) {
            throw InputError("batch", "an array of " + std::to_string(a->size()) + " elements among arrays of " + std::to_string(n) + "; expected " +
                                          std::to_string(n) + " or 1");
        }
    }
    if (in.conductors.empty()) throw InputError("conductor", "no conductor given");
    if (!in.conductor.empty()) {
        if (in.conductor.size() != n && in.conductor.size() != 1) throw InputError("conductor", "the index array differs in length from the others");
        for (const std::uint16_t k : in.conductor) {
            if (k >= in.conductors.size()) throw InputError("conductor", "index " + std::to_string(k) + " past the table");
        }
    }
}

BatchOutput evaluate_batch(const BatchInput& in, BatchChain chain, unsigned threads) {
    check_batch(in);
    const std::size_t n = in.size();
    BatchOutput out;
    for (auto* v : {&out.inductance, &out.dc_resistance, &out.resistance, &out.q_factor, &out.self_resonance}) v->resize(n);
    out.status.resize(n);
    evaluate_batch(in, BatchOutputView{out.inductance, out.dc_resistance, out.resistance, out.q_factor, out.self_resonance, out.status}, chain, threads);
    return out;
}

void evaluate_batch(const BatchInput& in, const BatchOutputView& out, BatchChain chain, unsigned threads) {
    check_batch(in);
    const std::size_t n = in.size();
    for (const std::size_t m : {out.inductance.size(), out.dc_resistance.size(), out.resistance.size(), out.q_factor.size(), out.self_resonance.size(),
                                out.status.size()}) {
        if (m != n) throw InputError("batch", "an output of " + std::to_string(m) + " elements for " + std::to_string(n));
    }
    const double nan = std::numeric_limits<double>::quiet_NaN();
    const auto work = [&](std::size_t i, char /*state*/) {
        try {
            const Figures f = element(in, i, chain);
            out.inductance[i] = f.inductance;
            out.dc_resistance[i] = f.dc_resistance;
            out.resistance[i] = f.resistance;
            out.q_factor[i] = f.q_factor;
            out.self_resonance[i] = f.self_resonance;
            out.status[i] = BatchStatus::ok;
        } catch (const InputError&) {
            out.status[i] = BatchStatus::bad_input;
        } catch (const std::exception&) {  // DomainError, and anything a model lets through
            out.status[i] = BatchStatus::outside_domain;
        }
        if (out.status[i] != BatchStatus::ok) {
            for (auto* v : {&out.inductance, &out.dc_resistance, &out.resistance, &out.q_factor, &out.self_resonance}) (*v)[i] = nan;
        }
    };
    // The core count once: glibc reads it from sysfs on every call (10 us on this VM, half of a one-coil call).
    static const unsigned cores = std::max(1u, std::thread::hardware_concurrency());
    unsigned k = threads ? threads : cores;
    k = static_cast<unsigned>(std::min<std::size_t>(k, std::max<std::size_t>(1, n / 256)));
    // Chunks of 512 coils (about 0.1 ms) from a shared counter: a core that runs slower, as a VM's second
    // core often does, takes fewer of them, where halves fixed in advance left the faster one waiting.
    std::vector<char> state(k);
    detail::parallel_chunks(n, state, work, {}, 512);
}

std::string batch_message(const BatchInput& in, std::size_t i, BatchChain chain) {
    check_batch(in);
    if (i >= in.size()) throw InputError("index", std::to_string(i) + " is past the batch");
    try {
        element(in, i, chain);
    } catch (const std::exception& e) {
        return e.what();
    }
    return "";
}

}  // namespace libcoil
