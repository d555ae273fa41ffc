// Many coils at once (studies/batch.hpp), in C++ without Python: the per-coil cost of each chain on one
// thread and on all cores, over coils drawn as benchmarks/side_by_side.py draws them (spaced and
// close-wound, 10-40 mm, 3-40 turns, 100 kHz - 30 MHz), into outputs that stay mapped between runs.
#include <benchmark/benchmark.h>

#include <algorithm>
#include <cmath>
#include <random>
#include <vector>

#include "libcoil/models/materials.hpp"
#include "libcoil/studies/batch.hpp"

namespace {

struct Coils {
    std::vector<double> mean, turns, pitch, wire, insulation, temperature, frequency;
    explicit Coils(std::size_t n) {
        std::mt19937_64 rng(1);
        std::uniform_real_distribution<double> u(0, 1);
        for (std::size_t i = 0; i < n; ++i) {
            const double d = 0.3e-3 + 1.2e-3 * u(rng), dm = 10e-3 + 30e-3 * u(rng);
            const double p = std::min(d * (1.1 + 1.9 * u(rng)), 0.39 * dm / 2);
            wire.push_back(d);
            mean.push_back(dm);
            pitch.push_back(p);
            turns.push_back(std::max(std::round((3 + 37 * u(rng)) * 4) / 4, 0.12 * dm / p));
            frequency.push_back(std::exp(std::log(1e5) + u(rng) * (std::log(3e7) - std::log(1e5))));
        }
        insulation = {0.0};
        temperature = {293.15};
    }
};

void run(benchmark::State& s, libcoil::BatchChain chain) {
    const auto n = static_cast<std::size_t>(s.range(0));
    const auto threads = static_cast<unsigned>(s.range(1));
    const Coils c(n);
    libcoil::BatchInput in;
    in.mean_diameter = c.mean;
    in.turns = c.turns;
    in.pitch = c.pitch;
    in.wire_diameter = c.wire;
    in.insulation = c.insulation;
    in.temperature = c.temperature;
    in.frequency = c.frequency;
    in.conductors = {libcoil::conductor("copper")};
    std::vector<double> l(n), rdc(n), r(n), q(n), srf(n);
    std::vector<libcoil::BatchStatus> status(n);
    const libcoil::BatchOutputView out{l, rdc, r, q, srf, status};
    for (auto _ : s) {
        libcoil::evaluate_batch(in, out, chain, threads);
        benchmark::DoNotOptimize(l.data());
    }
    if (std::count(status.begin(), status.end(), libcoil::BatchStatus::ok) != static_cast<long>(n)) s.SkipWithError("a coil was refused");
    s.SetItemsProcessed(static_cast<std::int64_t>(s.iterations() * n));
}

void BM_EvaluateLight(benchmark::State& s) { run(s, libcoil::BatchChain::light); }
void BM_EvaluateFull(benchmark::State& s) { run(s, libcoil::BatchChain::full); }
BENCHMARK(BM_EvaluateLight)->Args({100000, 1})->Args({100000, 2})->UseRealTime()->Unit(benchmark::kMillisecond);
BENCHMARK(BM_EvaluateFull)->Args({100000, 1})->Args({100000, 2})->UseRealTime()->Unit(benchmark::kMillisecond);

}  // namespace
