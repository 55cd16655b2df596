// The telescope search of `rendezvous solve` over a 60-lens catalog for both arms (budget:
// ≤ 1 s on 2 cores): the SFG demo with the first lens of each arm's telescope swapped for any
// of the first 60 lenses of layouts/lenses.json, the second lens of each telescope free to move
// ±20 mm, aim: waists at the target centre with 40 µm (pump) and 30 µm (signal) radii.
//
// Reproduce the docs/performance.md figure:
//   build/release/tests/benchmarks/rendezvous_benchmarks --benchmark_filter=Solve
#include <benchmark/benchmark.h>

#include "io/layout_reader.hpp"
#include "io/lens_catalog.hpp"
#include "solve/telescope.hpp"

namespace {

void SolveTwoArms60Lenses(benchmark::State& state) {
    rv::Layout layout = *rv::read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout;
    const rv::MaterialLibrary library = rv::material_library_for(layout);
    std::vector<rv::CatalogLens> catalog =
        rv::read_lens_catalog(RV_SOURCE_DIR "/layouts/lenses.json", library).lenses;
    catalog.resize(std::min<size_t>(catalog.size(), 60));
    rv::SolveGoals goals;
    goals.aim = rv::SolveGoals::Aim::Waist;
    goals.swap = {"L1_P", "L1_S"};
    goals.move = {{"L2_P", {-20, 20}}, {"L2_S", {-20, 20}}};
    layout.goals.solve = goals;
    layout.goals.waist_um = {{"pump", 40.0}, {"signal", 30.0}};
    layout.goals.verdict.max_waist_ratio = 1.5;  // goals 40/30 µm: allowed, or solve refuses them
    rv::SolveOptions options;
    options.threads = 2;
    size_t combinations = 0;
    for (auto _ : state) {
        const rv::SolveResult r = rv::solve_telescopes(layout, library, catalog, options);
        if (!r.error.empty()) {  // a refused problem measures nothing
            state.SkipWithError(r.error.c_str());
            break;
        }
        combinations = r.combinations;
        benchmark::DoNotOptimize(r.solutions.data());
    }
    state.counters["combinations"] = static_cast<double>(combinations);
    state.counters["catalog"] = static_cast<double>(catalog.size());
}
BENCHMARK(SolveTwoArms60Lenses)->Unit(benchmark::kMillisecond)->UseRealTime();

}  // namespace
