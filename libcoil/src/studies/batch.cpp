#include "libcoil/studies/batch.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <limits>
#include <optional>
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

// A few coils at a time, stage by stage: every coil's geometry, then every coil's L, its R, its SRF. Each stage
// is a chain of dependent operations (a table lookup, a division, another lookup) that one coil alone leaves
// mostly waiting; consecutive calls of one stage are independent, so the processor overlaps them. One coil
// after another, whole, each chain waited on the last.
constexpr std::size_t group = 8;

struct Slot {
    Solenoid::Params params;
    std::optional<Solenoid> coil;
    const Conductor* conductor = nullptr;
    double temperature = 0, frequency = 0;
    Figures out{};
    BatchStatus status = BatchStatus::ok;
    std::string* message = nullptr;  // where the failure's text goes, when asked for
};

// Runs `step` on every slot still ok; an exception marks its slot (and keeps its message when asked).
template <class Step>
void stage(std::span<Slot> slots, const Step& step) {
    for (Slot& slot : slots) {
        if (slot.status != BatchStatus::ok) continue;
        try {
            step(slot);
        } catch (const InputError& e) {
            slot.status = BatchStatus::bad_input;
            if (slot.message) *slot.message = e.what();
        } catch (const std::exception& e) {  // DomainError, and anything a model lets through
            slot.status = BatchStatus::outside_domain;
            if (slot.message) *slot.message = e.what();
        }
    }
}

// Elements begin .. begin + slots.size(), as the models compute them (InputError or DomainError per slot).
void evaluate_group(const BatchInput& in, std::size_t begin, std::span<Slot> slots, BatchChain chain) {
    for (std::size_t j = 0; j < slots.size(); ++j) {
        const std::size_t i = begin + j;
        Slot& slot = slots[j];
        slot.status = BatchStatus::ok;
        slot.conductor = &in.conductors[in.conductor.empty() ? 0 : in.conductor.size() == 1 ? in.conductor[0] : in.conductor[i]];
        slot.temperature = at(in.temperature, i);
        slot.frequency = at(in.frequency, i);
        slot.coil.reset();
        Solenoid::Params& p = slot.params;
        p.mean_diameter = at(in.mean_diameter, i);
        p.turns = at(in.turns, i);
        p.pitch = at(in.pitch, i);
        p.wire.bare_diameter = at(in.wire_diameter, i);
        p.wire.insulation = at(in.insulation, i);
    }
    // The coils in a loop of their own: read straight after the figures were written, one by one, the
    // Solenoid's copy of them waited on the stores.
    stage(slots, [](Slot& x) {
        x.coil.emplace(x.params);
        require_non_negative("frequency", x.frequency);
    });
    if (chain == BatchChain::light) {
        stage(slots, [](Slot& x) {
            const Solenoid& s = *x.coil;
            const double rho = x.conductor->resistivity_at(x.temperature);
            x.out.dc_resistance = rho * resistance_per_resistivity(s.wire().bare_diameter, s.wire_length());
            x.out.inductance = rosa_inductance(s.mean_diameter(), s.turns(), s.pitch(), s.wire().bare_diameter);
            // x = sqrt(2) r / delta, delta = sqrt(rho / (pi f mu0 mu_r)) (skin_effect.hpp), by its tables.
            const double xs = s.wire().radius() * std::sqrt(2 * pi * x.frequency * mu0 * x.conductor->relative_permeability / rho);
            x.out.resistance = x.out.dc_resistance * detail::wire_skin_resistance(xs);
            const double c_self = medhurst_capacitance_formula(s.mean_diameter(), s.winding_length());
            x.out.self_resonance = 1 / (2 * pi * std::sqrt(x.out.inductance * c_self));
        });
    } else {
        stage(slots, [](Slot& x) { x.out.inductance = recommended_inductance(*x.coil); });
        stage(slots, [](Slot& x) {
            const AcResistance ac = ac_resistance(*x.coil, *x.conductor, x.temperature, x.frequency);
            x.out.dc_resistance = ac.dc;
            x.out.resistance = ac.resistance;
        });
        // The SRFs side by side where the tabulated helical line holds, the rest one by one.
        std::array<const Solenoid*, group> coils{};
        std::array<double, group> srf{};
        for (std::size_t j = 0; j < slots.size(); ++j) coils[j] = slots[j].status == BatchStatus::ok ? &*slots[j].coil : nullptr;
        try {
            bare_helical_line_frequencies(std::span(coils.data(), slots.size()), search_tolerance, std::span(srf.data(), slots.size()));
        } catch (const std::exception&) {  // nothing it should raise; if it does, each coil goes its own way and says why
            srf.fill(std::numeric_limits<double>::quiet_NaN());
        }
        stage(slots, [&](Slot& x) {
            const double f = srf[static_cast<std::size_t>(&x - slots.data())];
            x.out.self_resonance = std::isnan(f) ? fast_self_resonance(*x.coil, x.out.inductance) : f;
        });
    }
    stage(slots, [](Slot& x) {
        x.out.q_factor = 2 * pi * x.frequency * x.out.inductance / x.out.resistance;
        for (double v : {x.out.inductance, x.out.dc_resistance, x.out.resistance, x.out.q_factor, x.out.self_resonance}) finite_result("batch figure", v);
    });
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
    constexpr std::size_t chunk_size = 512;
    const auto work = [&](std::size_t chunk, char /*state*/) {
        std::array<Slot, group> slots;
        for (std::size_t begin = chunk * chunk_size, end = std::min(n, begin + chunk_size); begin < end; begin += group) {
            const std::span<Slot> g(slots.data(), std::min(group, end - begin));
            evaluate_group(in, begin, g, chain);
            for (std::size_t j = 0; j < g.size(); ++j) {
                const std::size_t i = begin + j;
                const bool ok = g[j].status == BatchStatus::ok;
                out.status[i] = g[j].status;
                out.inductance[i] = ok ? g[j].out.inductance : nan;
                out.dc_resistance[i] = ok ? g[j].out.dc_resistance : nan;
                out.resistance[i] = ok ? g[j].out.resistance : nan;
                out.q_factor[i] = ok ? g[j].out.q_factor : nan;
                out.self_resonance[i] = ok ? g[j].out.self_resonance : nan;
            }
        }
    };
    // The core count once: glibc reads it from sysfs on every call (10 us on this VM, half of a one-coil call).
    static const unsigned cores = std::max(1u, std::thread::hardware_concurrency());
    unsigned k = threads ? threads : cores;
    k = static_cast<unsigned>(std::min<std::size_t>(k, std::max<std::size_t>(1, n / 256)));
    // Chunks of 512 coils (about 0.1 ms) from a shared counter: a core that runs slower, as a VM's second
    // core often does, takes fewer of them, where halves fixed in advance left the faster one waiting.
    std::vector<char> state(k);
    detail::parallel_chunks((n + chunk_size - 1) / chunk_size, state, work, {}, 1);
}

std::string batch_message(const BatchInput& in, std::size_t i, BatchChain chain) {
    check_batch(in);
    if (i >= in.size()) throw InputError("index", std::to_string(i) + " is past the batch");
    std::string message;
    Slot slot;
    slot.message = &message;
    evaluate_group(in, i, std::span<Slot>(&slot, 1), chain);
    return message;
}

}  // namespace libcoil
