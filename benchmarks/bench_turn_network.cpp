// The turn network (PEEC): building it, its resonances, and Z(f) over a sweep, against the number of turns.
#include <benchmark/benchmark.h>

#include <cmath>
#include <vector>

#include "libcoil/models/turn_network.hpp"
#include "libcoil/models/wire.hpp"

namespace {

libcoil::Solenoid coil_of(int turns) {
    return libcoil::Solenoid(libcoil::Solenoid::Params{20e-3, static_cast<double>(turns), 2e-3, libcoil::Wire{1e-3, 0.03e-3, "1 mm"}, 0});
}

// Network built, three resonances, and Z at 400 log-spaced frequencies: what a sweep costs.
void BM_TurnNetworkSweep400(benchmark::State& s) {
    const libcoil::Solenoid coil = coil_of(static_cast<int>(s.range(0)));
    std::vector<double> f(400);
    for (std::size_t i = 0; i < f.size(); ++i) f[i] = 1e5 * std::pow(1e4, static_cast<double>(i) / 399);
    for (auto _ : s) {
        const libcoil::TurnNetwork n(coil);
        benchmark::DoNotOptimize(n.resonances(3));
        for (double x : f) benchmark::DoNotOptimize(n.impedance(x, 0.2, 1e-3));
    }
}
BENCHMARK(BM_TurnNetworkSweep400)->Arg(50)->Arg(100)->Arg(200)->ArgName("turns")->Unit(benchmark::kMillisecond);

// Built and solved for its first resonance only: what a design search's re-analysis costs.
void BM_TurnNetworkResonance(benchmark::State& s) {
    const libcoil::Solenoid coil = coil_of(static_cast<int>(s.range(0)));
    for (auto _ : s) benchmark::DoNotOptimize(libcoil::TurnNetwork(coil).resonances(1));
}
BENCHMARK(BM_TurnNetworkResonance)->Arg(10)->Arg(50)->Arg(200)->ArgName("turns")->Unit(benchmark::kMillisecond);

}  // namespace

namespace {

// A design search's confirmation of a new geometry: the first resonance of a turn network whose near-field
// section is not yet remembered (the pitch moves by a nanometre each time). The coil is one the dense grid's
// search confirms (benchmarks/bench_design.cpp): 23.75 mm, 19.25 turns at 1.494 mm of 1.25 mm wire.
void BM_TurnNetworkNewGeometry(benchmark::State& s) {
    const libcoil::Wire wire{1.25e-3, libcoil::enamel_build(1.25e-3, 2), "1.25 mm grade 2"};
    double pitch = 1.494e-3;
    for (auto _ : s) {
        pitch += 1e-9;
        const libcoil::Solenoid coil(libcoil::Solenoid::Params{23.75e-3, 19.25, pitch, wire, 0});
        benchmark::DoNotOptimize(libcoil::TurnNetwork(coil).resonances(1));
    }
}
BENCHMARK(BM_TurnNetworkNewGeometry)->Unit(benchmark::kMillisecond);

}  // namespace
