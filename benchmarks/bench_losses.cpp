// The loss chain: the closed form per coil (what a design search evaluates per candidate) and one
// cross-section solve at the subdivision that holds 1 % for x <= 10.
#include <benchmark/benchmark.h>

#include "libcoil/models/cross_section.hpp"
#include "libcoil/models/losses.hpp"
#include "libcoil/models/materials.hpp"
#include "libcoil/models/proximity.hpp"

namespace {

void BM_ClosedFormAcResistance(benchmark::State& s) {
    const libcoil::Conductor& cu = libcoil::conductor("copper");
    const libcoil::Solenoid c(libcoil::Solenoid::Params{25e-3, static_cast<double>(s.range(0)), 1.6e-3,
                                                        libcoil::Wire{1e-3, 0.04e-3, "1 mm"}, 0.05});
    double f = 1e5;
    for (auto _ : s) {
        benchmark::DoNotOptimize(libcoil::ac_resistance(c, cu, 313.15, f));
        f = f < 3e7 ? f * 1.3 : 1e5;
    }
}
BENCHMARK(BM_ClosedFormAcResistance)->Arg(10)->Arg(30)->Arg(100);

void BM_CrossSectionSolve(benchmark::State& s) {
    const libcoil::Solenoid c(libcoil::Solenoid::Params{20e-3, static_cast<double>(s.range(0)), 1.2e-3,
                                                        libcoil::Wire{1e-3, 0, "1 mm"}, 0});
    for (auto _ : s) {
        const libcoil::CrossSectionSolver solver(c, 1.7241e-8, libcoil::Subdivision{8, 1.3, 16});
        benchmark::DoNotOptimize(solver.solve(1e6));
    }
    s.counters["filaments"] = static_cast<double>(libcoil::CrossSectionSolver(c, 1.7241e-8).filaments());
}
BENCHMARK(BM_CrossSectionSolve)->Arg(4)->Arg(10)->Unit(benchmark::kMillisecond);

}  // namespace
