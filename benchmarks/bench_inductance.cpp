// Inductance models per call. The design search (a later verb) evaluates the recommended inductance for
// every candidate, so recommended_inductance is the number to watch.
#include <benchmark/benchmark.h>

#include "libcoil/models/coaxial_mutual.hpp"
#include "libcoil/models/filament.hpp"
#include "libcoil/models/inductance.hpp"
#include "libcoil/models/nagaoka.hpp"
#include "libcoil/models/rosa.hpp"

namespace {

void BM_Nagaoka(benchmark::State& s) {
    double rho = 0.37;
    for (auto _ : s) {
        benchmark::DoNotOptimize(libcoil::nagaoka_coefficient(rho));
        rho = rho < 30 ? rho * 1.07 : 0.01;  // sweep the table and the elliptic integrals beyond it
    }
}
BENCHMARK(BM_Nagaoka);

// The table's range, D/l = 0.01 .. 9, the public value and slope against the elliptic integrals
// themselves: what the table saves the design search.
void BM_NagaokaAndSlopeInTable(benchmark::State& s) {
    const bool table = s.range(0) == 1;
    double rho = 0.37;
    for (auto _ : s) {
        benchmark::DoNotOptimize(table ? libcoil::nagaoka_coefficient_and_slope(rho)
                                       : libcoil::detail::nagaoka_by_elliptic_integrals(rho));
        rho = rho < 9 ? rho * 1.07 : 0.01;
    }
}
BENCHMARK(BM_NagaokaAndSlopeInTable)->Arg(0)->Arg(1)->ArgName("table");

void BM_RecommendedInductance(benchmark::State& s) {
    const libcoil::Wire w{1e-3, 0.04e-3, "1 mm"};
    double n = 5;
    for (auto _ : s) {
        const libcoil::Solenoid c(libcoil::Solenoid::Params{25e-3, n, 1.5e-3, w, 0});
        benchmark::DoNotOptimize(libcoil::recommended_inductance(c));
        n = n < 60 ? n + 0.25 : 5;
    }
}
BENCHMARK(BM_RecommendedInductance);

void BM_Maxwell(benchmark::State& s) {
    double z = 1e-3;
    for (auto _ : s) {
        benchmark::DoNotOptimize(libcoil::coaxial_mutual_inductance(0.01, 0.01, z));
        z = z < 0.1 ? z * 1.1 : 1e-3;
    }
}
BENCHMARK(BM_Maxwell);

void BM_FilamentSum(benchmark::State& s) {
    const double n = static_cast<double>(s.range(0));
    for (auto _ : s) benchmark::DoNotOptimize(libcoil::filament_inductance(25e-3, n, 1.5e-3, 1e-3));
    s.SetComplexityN(s.range(0));
}
BENCHMARK(BM_FilamentSum)->RangeMultiplier(10)->Range(10, 10000)->Complexity(benchmark::oN);

}  // namespace
