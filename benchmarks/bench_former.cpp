// The printable former: a long coil's mesh must build in well under a few seconds, and the triangle count
// grow linearly in turns (tests/cpp/test_former.cpp checks the count; the time is measured here).
#include <benchmark/benchmark.h>

#include <string>

#include "libcoil/models/former.hpp"
#include "libcoil/models/mesh.hpp"
#include "libcoil/outputs/stl.hpp"
#include "libcoil/spec/spec.hpp"

namespace {

libcoil::FormerGeometry long_coil(int turns, bool ribbed) {
    const std::string yaml = "coil:\n  form_diameter: 30 mm\n  turns: " + std::to_string(turns) +
                             "\n  pitch: 1.0 mm\n  wire: {gauge: AWG 20, enamel: grade 2}\nformer:\n  material: PETG\n" +
                             (ribbed ? "  kind: ribbed\n  wall: 3 mm\n  ribs: 12\n  rib_width: 3 mm\n" : "  kind: grooved-tube\n  wall: 3 mm\n");
    return libcoil::former_geometry(libcoil::parse_coil_spec(yaml));
}

// Mesh, then the full check (edges, fans, areas, volume) that every build runs.
void BM_FormerMesh(benchmark::State& s) {
    const auto g = long_coil(static_cast<int>(s.range(0)), s.range(1) == 1);
    std::size_t triangles = 0;
    for (auto _ : s) {
        const libcoil::TriangleMesh m = libcoil::former_mesh(g, 0.01e-3);
        const libcoil::MeshCheck c = libcoil::check_mesh(m);
        benchmark::DoNotOptimize(c.volume);
        triangles = m.triangles.size();
    }
    s.counters["triangles"] = static_cast<double>(triangles);
}
BENCHMARK(BM_FormerMesh)->Args({50, 0})->Args({200, 0})->Args({200, 1})->ArgNames({"turns", "ribbed"})->Unit(benchmark::kMillisecond);

void BM_FormerBinarySTL(benchmark::State& s) {
    const libcoil::TriangleMesh m = libcoil::former_mesh(long_coil(200, false), 0.01e-3);
    for (auto _ : s) benchmark::DoNotOptimize(libcoil::stl_binary(m, "bench").size());
}
BENCHMARK(BM_FormerBinarySTL)->Unit(benchmark::kMillisecond);

}  // namespace
