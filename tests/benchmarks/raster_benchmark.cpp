// One 1600 × 1000 frame of the viewer on the SFG demo rasterized on the CPU (design budget:
// ≤ 8 ms median on one core), and one drag step (≤ 16 ms). The workloads are in
// frame_cases.hpp, shared with frame_loop (the instruction counts of check_budgets).
//
// Reproduce: build/release/tests/benchmarks/rendezvous_benchmarks --benchmark_filter='Raster|Drag'
//     --benchmark_repetitions=9 --benchmark_report_aggregates_only=true
#include <benchmark/benchmark.h>

#include "benchmarks/frame_cases.hpp"

namespace {

void RasterFrame1600x1000(benchmark::State& state) {
    rv::bench::RasterCase c(static_cast<int>(state.range(0)));
    for (auto _ : state) {
        c.step();
        benchmark::DoNotOptimize(c.pixels());
    }
    state.counters["vertices"] = c.vertices();
}
BENCHMARK(RasterFrame1600x1000)->Arg(1)->Arg(2)->Unit(benchmark::kMillisecond);

// One drag step of the viewer (design budget: ≤ 16 ms): the dragged lens moves by 1 mm, the
// document re-traces and rebuilds the report and the scene, the ImGui frame is built and
// rasterized at 1600 × 1000 on one thread.
void DragStep1600x1000(benchmark::State& state) {
    rv::bench::DragCase c;
    for (auto _ : state) {
        c.step();
        benchmark::DoNotOptimize(c.pixels());
    }
}
BENCHMARK(DragStep1600x1000)->Unit(benchmark::kMillisecond);

}  // namespace
