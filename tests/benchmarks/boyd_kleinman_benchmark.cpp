// Boyd–Kleinman focusing: h_m over σ for one (ξ, B), and the optimum over ξ for one B, as the
// report's focusing section computes them for each beam (report_focusing.cpp).
//
//   build/release/tests/benchmarks/rendezvous_benchmarks --benchmark_filter=BoydKleinman
//     --benchmark_repetitions=15 --benchmark_report_aggregates_only=true
#include <benchmark/benchmark.h>

#include "nonlinear/boyd_kleinman.hpp"

namespace {

// h_m at the demo's ξ and B (layouts/sfg-bbo.json's pump: ξ = 0.16, B = 3.14), at the B = 0
// optimum, and in the strong-focusing range (ξ = 300 and 10⁴, where the σ grids are densest).
void BoydKleinmanOptimum(benchmark::State& state) {
    const double xi = state.range(0) / 100.0, b = state.range(1) / 100.0;
    for (auto _ : state) benchmark::DoNotOptimize(rv::boyd_kleinman_optimum(xi, b));
}
BENCHMARK(BoydKleinmanOptimum)->Args({16, 314})->Args({284, 0})->Args({30000, 0})->Args({1000000, 300});

void BoydKleinmanBestFocus(benchmark::State& state) {
    const double b = state.range(0) / 100.0;
    for (auto _ : state) benchmark::DoNotOptimize(rv::boyd_kleinman_best_focus(b));
}
BENCHMARK(BoydKleinmanBestFocus)->Arg(0)->Arg(314)->Arg(870);

}  // namespace
