// Self-resonance and impedance: what the band check and a sweep cost per coil.
#include <benchmark/benchmark.h>

#include "libcoil/studies/analysis.hpp"
#include "libcoil/studies/sweep.hpp"
#include "libcoil/studies/band_check.hpp"
#include "libcoil/models/impedance.hpp"
#include "libcoil/models/inductance.hpp"
#include "libcoil/models/medhurst.hpp"
#include "libcoil/models/self_resonance.hpp"

namespace {

const libcoil::Solenoid demo_coil{libcoil::Solenoid::Params{26.4e-3, 18, 1.9e-3, libcoil::Wire{1.29e-3, 0.05e-3, "AWG 16"}, 0}};

void BM_Medhurst(benchmark::State& s) {
    double r = 0.1;
    for (auto _ : s) {
        benchmark::DoNotOptimize(libcoil::medhurst_h(r));
        r = r * 1.07 < 50 ? r * 1.07 : 0.1;
    }
}
BENCHMARK(BM_Medhurst);

void BM_SelfResonance(benchmark::State& s) {
    const double L = libcoil::inductance(demo_coil).recommended;
    const libcoil::FormerDielectric former{2.9, s.range(0) ? 3e-3 : 0.0, 1.0};
    for (auto _ : s) benchmark::DoNotOptimize(libcoil::self_resonance(demo_coil, L, former));
}
BENCHMARK(BM_SelfResonance)->Arg(0)->Arg(1)->ArgName("former")->Unit(benchmark::kMicrosecond);

// The search's fast path: the helical line alone, with the former's fixed point.
void BM_HelicalLineResonance(benchmark::State& s) {
    const libcoil::FormerDielectric former{2.9, s.range(0) ? 3e-3 : 0.0, 1.0};
    for (auto _ : s) benchmark::DoNotOptimize(libcoil::helical_line_resonance(demo_coil, former));
}
BENCHMARK(BM_HelicalLineResonance)->Arg(0)->Arg(1)->ArgName("former")->Unit(benchmark::kMicrosecond);

void BM_ImpedanceSweep401(benchmark::State& s) {
    const double L = libcoil::inductance(demo_coil).recommended;
    const libcoil::CoilImpedance z(demo_coil, libcoil::conductor("copper"), 293.15, L, libcoil::self_resonance(demo_coil, L));
    const auto f = libcoil::frequency_grid(75e3, 3.2e8, 401, libcoil::Spacing::logarithmic);
    for (auto _ : s) benchmark::DoNotOptimize(z.sweep(f));
}
BENCHMARK(BM_ImpedanceSweep401)->Unit(benchmark::kMillisecond);

void BM_BandCheck(benchmark::State& s) {
    const double L = libcoil::inductance(demo_coil).recommended;
    const libcoil::CoilImpedance z(demo_coil, libcoil::conductor("copper"), 293.15, L, libcoil::self_resonance(demo_coil, L));
    const libcoil::BandSpec band{150e3, 30e6, 2.0, 0.1, 50.0};
    for (auto _ : s) benchmark::DoNotOptimize(libcoil::check_band(band, z));
}
BENCHMARK(BM_BandCheck)->Unit(benchmark::kMillisecond);

}  // namespace
