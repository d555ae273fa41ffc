// The design search: candidates per second on one thread, through the whole call (the screen, then the ranked
// designs confirmed with the turn network and the chosen one analysed), and through the screen alone (turns
// root, snapping and pitch trim, thermal balance, self-resonance with a former, the band's |Z| criteria, R_ac).
// The goal is 2 M candidates/s on one core; docs/models.md records where it stands.
#include <benchmark/benchmark.h>

#include "libcoil/studies/design.hpp"
#include "libcoil/spec/requirement.hpp"
#include "studies/design_search.hpp"

namespace {

// A dense grid where a third of the candidates are feasible (each feasible one costs the whole chain).
const char* dense = R"(
target: {inductance: 5 uH, tolerance: 2 %}
band: {low: 150 kHz, ceiling: 30 MHz, srf_margin: 2.5}
operating: {current: 6 A, ambient: 35 degC}
limits: {max_outer_diameter: 40 mm, max_length: 60 mm, max_wire_length: 3 m}
search:
  wires: [AWG 14, AWG 16, AWG 18, 1.25 mm grade 2]
  form_diameter: {min: 15 mm, max: 35 mm, step: 0.5 mm}
  pitch_ratio: {min: 1.05, max: 2.5, step: 0.025}
former: {material: PETG, kind: grooved-tube, wall: 3 mm}
)";

// A typical requirement: 12 uH for a 6 A supply network, forms 10 .. 45 mm; a fifth are feasible.
const char* typical = R"(
target: {inductance: 12 uH, tolerance: 2 %}
band: {low: 150 kHz, ceiling: 30 MHz, srf_margin: 1.5}
operating: {current: 6 A, ambient: 30 degC, supply_voltage: 24 V}
limits: {max_outer_diameter: 50 mm, max_length: 90 mm, max_wire_length: 5 m}
search:
  wires: [AWG 16, AWG 18, AWG 20, 1.2 mm]
  form_diameter: {min: 10 mm, max: 45 mm, step: 1 mm}
  pitch_ratio: {min: 1.1, max: 3.0, step: 0.05}
former: {material: PETG, kind: grooved-tube}
)";

void BM_DesignSearchOneThread(benchmark::State& s) {
    const libcoil::Requirement q = libcoil::parse_requirement(s.range(0) ? typical : dense);
    libcoil::DesignOptions o;
    o.threads = 1;
    o.top = 1;
    std::size_t n = 0, feasible = 0;
    for (auto _ : s) {
        const auto r = libcoil::design(q, o);
        n += r.candidates_evaluated;
        feasible = r.feasible;
    }
    s.SetItemsProcessed(static_cast<int64_t>(n));
    s.counters["feasible_share"] = static_cast<double>(feasible) / static_cast<double>(n / s.iterations());
}
BENCHMARK(BM_DesignSearchOneThread)->Arg(0)->Arg(1)->ArgName("typical")->Unit(benchmark::kMillisecond);

// The screen alone, as design() runs it before it confirms the ranked designs, on one and two threads: the dense grid
// that benchmarks/side_by_side.py times whole (dense-grid-requirement.yaml: 117 384 candidates, every band criterion
// on; four pitch ratios of a row snap to each count of turns, and the screen checks that coil once), and the two
// grids above (steps of 0.025 and 0.05 in the pitch ratio: one to two ratios a count).
void BM_DesignScreen(benchmark::State& s) {
    const libcoil::Requirement q = s.range(0) == 0 ? libcoil::load_requirement(LIBCOIL_BENCH_DIR "/dense-grid-requirement.yaml")
                                                   : libcoil::parse_requirement(s.range(0) == 1 ? dense : typical);
    std::size_t n = 0, feasible = 0;
    for (auto _ : s) {
        const libcoil::detail::Evaluator ev(q);
        const auto tallies = libcoil::detail::screen_grid(q, ev, static_cast<unsigned>(s.range(1)), {});
        n += libcoil::detail::grid_size(q);
        feasible = 0;
        for (const auto& t : tallies) feasible += t.feasible;
    }
    s.SetItemsProcessed(static_cast<int64_t>(n));
    s.counters["feasible_share"] = static_cast<double>(feasible) / static_cast<double>(n / s.iterations());
}
BENCHMARK(BM_DesignScreen)->ArgsProduct({{0, 1, 2}, {1, 2}})->ArgNames({"grid", "threads"})->Unit(benchmark::kMillisecond)->UseRealTime();

}  // namespace
