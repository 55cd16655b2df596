// The scan plan and a 200 × 200 map of the SFG demo (issue 16: `scan` on a 200 × 200 grid ≤ 1 s),
// as `rendezvous scan layouts/sfg-bbo.json --points 200x200` computes it (without reading the
// file and drawing the PNG; check_budgets times the whole command).
//
//   build/release/tests/benchmarks/rendezvous_benchmarks --benchmark_filter=Scan
#include <benchmark/benchmark.h>

#include "analysis/scan.hpp"
#include "io/layout_reader.hpp"

namespace {

void ScanDemo200x200(benchmark::State& state) {
    const rv::Layout l = *rv::read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout;
    const rv::MaterialLibrary lib = rv::material_library_for(l);
    for (auto _ : state)
        benchmark::DoNotOptimize(rv::plan_scan(l, lib, rv::ScanRequest{.stage_points = 200, .rotation_points = 200}));
}
BENCHMARK(ScanDemo200x200)->Unit(benchmark::kMillisecond);

}  // namespace
