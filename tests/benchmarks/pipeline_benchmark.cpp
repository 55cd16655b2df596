// One evaluation of the SFG demo: trace both colours, propagate both planes, the numbers at
// the target (design budget: ≤ 2 µs median without the drawing envelope, as the solvers run
// it: DemoEvaluateEdited).
//
// Reproduce the docs/performance.md figure:
//   build/release/tests/benchmarks/rendezvous_benchmarks --benchmark_filter=Demo
//     --benchmark_repetitions=15 --benchmark_report_aggregates_only=true
#include <benchmark/benchmark.h>

#include "analysis/target_summary.hpp"
#include "benchmarks/demo_solver_edit.hpp"
#include "io/layout_reader.hpp"
#include "trace/propagate.hpp"
#include "trace/trace.hpp"

namespace {

const rv::Layout& demo() {
    static const rv::Layout layout = *rv::read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout;
    return layout;
}

void run(benchmark::State& state, bool envelope) {
    const rv::Layout& layout = demo();
    const rv::MaterialLibrary library = rv::material_library_for(layout);
    rv::PropagationOptions options;
    options.sample_envelope = envelope;
    for (auto _ : state) {
        const std::vector<rv::Path> paths = rv::trace_layout(layout, library);
        rv::BeamAtTarget at[2];
        for (size_t b = 0; b < paths.size(); ++b)
            at[b] = rv::beam_at_target(layout, paths[b], rv::propagate_path(layout, paths[b], options));
        benchmark::DoNotOptimize(rv::mismatch_at_target(at[0], at[1]));
    }
}

void DemoEvaluate(benchmark::State& state) { run(state, false); }
void DemoEvaluateWithEnvelope(benchmark::State& state) { run(state, true); }
BENCHMARK(DemoEvaluate);
BENCHMARK(DemoEvaluateWithEnvelope);

// The solvers' case: the same layout evaluated again and again with a trace cache, each time
// after DemoSolverEdit (a lens and the crystal changed): the retrace keeps the pump up to the
// crystal and the signal up to its first lens. `named`: told which optics the edit changes, the
// retrace compares only those, as the solvers run it (telescope.cpp lists its moved lenses);
// else it compares every element.
void run_solver_edit(benchmark::State& state, bool named) {
    rv::bench::DemoSolverEdit edit;
    const rv::MaterialLibrary library = rv::material_library_for(edit.layout);
    rv::TraceCache cache;
    long k = 0;
    for (auto _ : state) {
        edit.apply(k++);
        const std::vector<rv::BeamAtTarget> at = named
                                                     ? rv::evaluate_beams_at_target(edit.layout, library, cache, edit.edited)
                                                     : rv::evaluate_beams_at_target(edit.layout, library, &cache);
        benchmark::DoNotOptimize(rv::mismatch_at_target(at[0], at[1]));
    }
    state.counters["searched_steps"] = static_cast<double>(cache.counters.searched_steps);
}
void DemoEvaluateCached(benchmark::State& state) { run_solver_edit(state, false); }
void DemoEvaluateEdited(benchmark::State& state) { run_solver_edit(state, true); }
BENCHMARK(DemoEvaluateCached);
BENCHMARK(DemoEvaluateEdited);

// The Monte Carlo's case: every optic moved (±0.2 mm along x, ±0.1 mrad) on every evaluation,
// evaluated as the Monte Carlo does, without the retrace's comparison (it could keep nothing).
void DemoEvaluateAllMoved(benchmark::State& state) {
    rv::Layout layout = demo();
    const rv::Layout nominal = layout;
    const rv::MaterialLibrary library = rv::material_library_for(layout);
    rv::TraceCache cache;
    int k = 0;
    for (auto _ : state) {
        const double sign = (k++ & 1) ? 1.0 : -1.0;
        for (size_t i = 0; i < layout.elements.size(); ++i) {
            layout.elements[i].at_mm = nominal.elements[i].at_mm + rv::Vec2(0.2 * sign, 0);
            layout.elements[i].normal_deg = nominal.elements[i].normal_deg + sign * 0.1e-3 * 180 / 3.141592653589793;
        }
        const std::vector<rv::BeamAtTarget> at = rv::evaluate_beams_at_target(layout, library, &cache, false);
        benchmark::DoNotOptimize(rv::mismatch_at_target(at[0], at[1]));
    }
}
BENCHMARK(DemoEvaluateAllMoved);

}  // namespace
