// The loss chain: the closed form per coil (what a design search evaluates per candidate) and one
// cross-section solve at the subdivision that holds 1 % for x <= 10; the wire-harmonic solver (bare and in a
// can), and a whole default analysis of a close-wound coil (issue 17: well under a second at four
// frequencies), bare and in a can.
#include <benchmark/benchmark.h>

#include <cmath>

#include "libcoil/models/cross_section.hpp"
#include "libcoil/models/losses.hpp"
#include "libcoil/models/materials.hpp"
#include "libcoil/models/proximity.hpp"
#include "libcoil/models/shield.hpp"
#include "libcoil/models/skin_effect.hpp"
#include "libcoil/models/wire_harmonics.hpp"
#include "libcoil/spec/spec.hpp"
#include "libcoil/studies/analysis.hpp"

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

// The cross-section solver's block form with subdivision_for on close-wound turns (p/d 1.1): N turns at
// d / delta = range(1) (1 mm wire), build and one solve. Issue 17 asked 64 turns within seconds and 1 GB.
void BM_CrossSectionBlocks(benchmark::State& s) {
    const double d = 1e-3, rho = 1.7241e-8, dd = static_cast<double>(s.range(1));
    const double f = rho / (M_PI * 4e-7 * M_PI * (d / dd) * (d / dd));
    const libcoil::Solenoid c(libcoil::Solenoid::Params{20e-3, static_cast<double>(s.range(0)), 1.1e-3, libcoil::Wire{d, 0, "1 mm"}, 0});
    const libcoil::Subdivision sub = libcoil::subdivision_for(d / 2, libcoil::skin_depth(rho, f));
    for (auto _ : s) {
        const libcoil::CrossSectionSolver solver(c, rho, sub);
        benchmark::DoNotOptimize(solver.solve(f));
    }
    s.counters["cells"] = static_cast<double>(libcoil::CrossSectionSolver(c, rho, sub).filaments());
}
BENCHMARK(BM_CrossSectionBlocks)->Args({15, 30})->Args({64, 10})->Args({64, 30})->Unit(benchmark::kMillisecond)->Iterations(1);

// The wire-harmonic solver on a close-wound coil (p/d 1.1) at d / delta = 30 (1 mm wire at 7.8 MHz).
void BM_WireHarmonicSolve(benchmark::State& s) {
    const libcoil::Solenoid c(libcoil::Solenoid::Params{20e-3, static_cast<double>(s.range(0)), 1.1e-3,
                                                        libcoil::Wire{1e-3, 0, "1 mm"}, 0});
    for (auto _ : s) {
        const libcoil::WireHarmonicSolver solver(c, 1.7241e-8);
        benchmark::DoNotOptimize(solver.solve(7.8e6));
    }
}
BENCHMARK(BM_WireHarmonicSolve)->Arg(15)->Arg(64)->Arg(200)->Unit(benchmark::kMillisecond);

// The same 15 turns in a copper can (40 mm bore, 0.3 mm wall, 60 mm long) at 1 MHz: the wall's currents
// driven by the turns' net currents, then by their dipoles too, in three or four passes on one wall
// (built and factored once, its mutual inductances with the wires taken once).
void BM_WireHarmonicSolveInCan(benchmark::State& s) {
    const libcoil::Solenoid c(libcoil::Solenoid::Params{20e-3, 15, 1.1e-3, libcoil::Wire{1e-3, 0, "1 mm"}, 0});
    libcoil::ShieldSpec can;
    can.inner_diameter = 40e-3;
    can.length = 60e-3;
    can.thickness = 0.3e-3;
    can.material = libcoil::conductor("copper");
    for (auto _ : s) {
        const libcoil::WireHarmonicSolver solver(c, 1.7241e-8, 0, can);
        benchmark::DoNotOptimize(solver.solve(1e6));
    }
}
BENCHMARK(BM_WireHarmonicSolveInCan)->Unit(benchmark::kMillisecond);

// `coil analyze` with its defaults on a close-wound 15-turn coil at four frequencies: every section
// (inductance, the wire-harmonic losses and their table over the span, the turn network's SRF, the
// impedance rows).
void BM_AnalyzeCloseWound15Turns(benchmark::State& s) {
    const libcoil::CoilSpec spec = libcoil::parse_coil_spec(
        "coil: {form_diameter: 20 mm, turns: 15, pitch: 1.15 mm, wire: {diameter: 1 mm}}\n"
        "operating: {frequencies: [150 kHz, 1 MHz, 10 MHz, 30 MHz]}\n",
        "bench.yaml");
    for (auto _ : s) benchmark::DoNotOptimize(libcoil::analyze(spec));
}
BENCHMARK(BM_AnalyzeCloseWound15Turns)->Unit(benchmark::kMillisecond);

// The same analysis of the coil in its can (the bundled in-can example's can), its loss table's frequencies
// on one or two threads (AnalysisOptions::threads; the figures the same to the bit).
void BM_AnalyzeInCan(benchmark::State& s) {
    const libcoil::CoilSpec spec = libcoil::parse_coil_spec(
        "coil: {form_diameter: 20 mm, turns: 15, pitch: 1.15 mm, wire: {diameter: 1 mm}}\n"
        "operating: {frequencies: [150 kHz, 1 MHz, 10 MHz, 30 MHz]}\n"
        "shield: {inner_diameter: 40 mm, length: 80 mm, thickness: 0.3 mm, material: copper}\n",
        "bench.yaml");
    libcoil::AnalysisOptions o;
    o.threads = static_cast<unsigned>(s.range(0));
    for (auto _ : s) benchmark::DoNotOptimize(libcoil::analyze(spec, o));
}
BENCHMARK(BM_AnalyzeInCan)->Arg(1)->Arg(2)->ArgName("threads")->UseRealTime()->Unit(benchmark::kMillisecond);

}  // namespace
