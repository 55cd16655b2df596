// One evaluation of the SFG demo: trace both colours, propagate both planes, the numbers at
// the target (design budget: ≤ 2 µs median without the drawing envelope).
//
// Reproduce the README figure:
//   build/release/tests/benchmarks/rendezvous_benchmarks --benchmark_filter=Demo
//     --benchmark_repetitions=15 --benchmark_report_aggregates_only=true
#include <benchmark/benchmark.h>

#include "analysis/target_summary.hpp"
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

}  // namespace
