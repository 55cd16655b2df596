// A large layout read from text, traced and reported (issue #7 target: ≤ 100 ms for 2 000
// elements), with the memory it takes.
//
// Two generated tables of N elements (our own invented scenarios):
// * LongPath: each beam runs a serpentine of N/2 optics — rows of ideal lenses and normal-
//   incidence plates between pairs of 45° fold mirrors — so every optic lies on a beam. The
//   trace stops each beam after kMaxHitsPerBeam (64) hits with a "too-many-hits" finding, so
//   neither beam reaches the target: the report of a long path is the report of its first 64 hits.
// * Reaching: each beam meets 20 optics on its way to the shared target (the beams counter-
//   propagate through it); the other N − 41 optics stand on the table away from the beams, and
//   every one of them is still tested at every hit of the trace.
// Memory: every operator new of the process is counted; per iteration the benchmark reports
// the bytes allocated and the peak of live heap bytes above what was live before it.
//
//   build/release/tests/hardening/hardening_benchmarks --benchmark_repetitions=5
//       --benchmark_report_aggregates_only=true
#include <benchmark/benchmark.h>
#include <malloc.h>

#include <atomic>
#include <cstdio>
#include <cstdlib>
#include <new>
#include <nlohmann/json.hpp>
#include <string>

#include "analysis/report.hpp"
#include "io/layout_reader.hpp"

namespace {
std::atomic<long long> g_live_bytes{0}, g_peak_bytes{0}, g_allocated_bytes{0};
}  // namespace

void* operator new(std::size_t n) {
    void* p = std::malloc(n ? n : 1);
    if (!p) throw std::bad_alloc();
    const long long size = static_cast<long long>(malloc_usable_size(p));
    g_allocated_bytes += size;
    const long long live = g_live_bytes += size;
    long long peak = g_peak_bytes.load();
    while (live > peak && !g_peak_bytes.compare_exchange_weak(peak, live)) {
    }
    return p;
}
void operator delete(void* p) noexcept {
    if (!p) return;
    g_live_bytes -= static_cast<long long>(malloc_usable_size(p));
    std::free(p);
}
void operator delete(void* p, std::size_t) noexcept {
    operator delete(p);
}

namespace {

using nlohmann::json;

json lens(const std::string& id, double x_mm, double y_mm, double normal_deg, double f_mm) {
    return {{"id", id},
            {"type", "lens"},
            {"at_mm", {x_mm, y_mm}},
            {"normal_deg", normal_deg},
            {"focal_length_mm", f_mm}};
}
json plate(const std::string& id, double x_mm, double y_mm, double normal_deg) {
    return {{"id", id},
            {"type", "plate"},
            {"at_mm", {x_mm, y_mm}},
            {"normal_deg", normal_deg},
            {"material", "N-BK7"},
            {"thickness_mm", 3}};
}
json mirror(const std::string& id, double x_mm, double y_mm, double normal_deg) {
    return {{"id", id}, {"type", "mirror"}, {"at_mm", {x_mm, y_mm}}, {"normal_deg", normal_deg}};
}
json beam(const std::string& id, double nm, double x_mm, double y_mm, double direction_deg) {
    return {{"id", id},
            {"wavelength_nm", nm},
            {"start_mm", {x_mm, y_mm}},
            {"direction_deg", direction_deg},
            {"waist_um", 900},
            {"pulse_fwhm_fs", 120}};
}
json inline_optic(const std::string& id, int k, double x_mm, double y_mm, double axis_deg) {
    // Weak alternating lenses (a relay that keeps the beam finite) and plates.
    if (k % 2 == 0) return lens(id, x_mm, y_mm, axis_deg, k % 4 == 0 ? 4000.0 : -4000.0);
    return plate(id, x_mm, y_mm, axis_deg);
}

// A serpentine of `count` optics starting at (x0, y0) going +x: rows of 18 inline optics
// 40 mm apart, then two 45° mirrors that fold the beam 50 mm up and back.
void serpentine(const std::string& prefix, double x0_mm, double y0_mm, int count, json& elements) {
    constexpr int kPerRow = 18;
    constexpr double kPitch_mm = 40, kRow_mm = 50;
    int made = 0;
    for (int row = 0; made < count; ++row) {
        const bool forward = row % 2 == 0;
        const double y = y0_mm + row * kRow_mm;
        for (int k = 0; k < kPerRow && made < count; ++k, ++made) {
            const double x =
                forward ? x0_mm + (k + 1) * kPitch_mm : x0_mm + (kPerRow - k) * kPitch_mm;
            elements.push_back(
                inline_optic(prefix + std::to_string(made), made, x, y, forward ? 0 : 180));
        }
        const double xm = forward ? x0_mm + (kPerRow + 1) * kPitch_mm : x0_mm;
        // In along ±x, out along +y, then back along ∓x: normals on the bisectors.
        if (made < count)
            elements.push_back(mirror(prefix + std::to_string(made++), xm, y, forward ? 135 : 45));
        if (made < count)
            elements.push_back(
                mirror(prefix + std::to_string(made++), xm, y + kRow_mm, forward ? 225 : 315));
    }
}

// Optics that no beam meets, on a grid far from the beams.
void clutter(int count, json& elements) {
    for (int i = 0; i < count; ++i) {
        const double x = 100 + (i % 60) * 95.0, y = 3000 + (i / 60) * 80.0;
        const std::string id = "C" + std::to_string(i);
        elements.push_back(i % 3 == 0   ? lens(id, x, y, 90, 500)
                           : i % 3 == 1 ? plate(id, x, y, 30)
                                        : mirror(id, x, y, 45));
    }
}

// The layout as text; aborts if it does not read (a benchmark of a refused layout measures
// nothing).
rv::Layout read_or_abort(const std::string& text) {
    rv::LayoutReadResult r = rv::read_layout(text);
    if (!r.layout) {
        for (const rv::Diagnostic& d : r.diagnostics)
            std::fprintf(stderr, "%s\n", rv::format_diagnostic(d, "generated").c_str());
        std::abort();
    }
    return std::move(*r.layout);
}

std::string layout_text(int elements_wanted, bool long_path) {
    json elements = json::array();
    json beams = json::array();
    if (long_path) {
        const int per_beam = (elements_wanted - 1) / 2;
        beams.push_back(beam("A", 1030, 100, 100, 0));
        beams.push_back(beam("B", 780, 3000, 100, 0));
        serpentine("A", 100, 100, per_beam, elements);
        serpentine("B", 3000, 100, elements_wanted - 1 - per_beam, elements);
        elements.push_back({{"id", "X"}, {"type", "target"}, {"at_mm", {2000, 5900}}});
    } else {
        beams.push_back(beam("A", 1030, 100, 1000, 0));
        beams.push_back(beam("B", 780, 5900, 1000, 180));
        for (int k = 0; k < 20; ++k) {
            elements.push_back(inline_optic("A" + std::to_string(k), k, 200 + k * 120.0, 1000, 0));
            elements.push_back(
                inline_optic("B" + std::to_string(k), k, 5800 - k * 120.0, 1000, 180));
        }
        elements.push_back({{"id", "X"}, {"type", "target"}, {"at_mm", {3000, 1000}}});
        clutter(elements_wanted - 41, elements);
    }
    const json doc = {{"format", "rendezvous-layout"},
                      {"version", 1},
                      {"name", long_path ? "long path" : "reaching"},
                      {"table", {{"size_mm", {6000, 6000}}}},
                      {"beams", beams},
                      {"elements", elements},
                      {"target", "X"}};
    return doc.dump(1);
}

void load_trace_report(benchmark::State& state, bool long_path) {
    const std::string text = layout_text(static_cast<int>(state.range(0)), long_path);
    long long allocated = 0, peak = 0;
    size_t hits = 0, reached = 0, elements = 0;
    for (auto _ : state) {
        const long long allocated_before = g_allocated_bytes.load();
        const long long live_before = g_live_bytes.load();
        g_peak_bytes = live_before;
        const rv::Layout layout = read_or_abort(text);
        const rv::RendezvousReport report =
            rv::build_report(layout, rv::material_library_for(layout));
        benchmark::DoNotOptimize(report.verdict.space.met);
        allocated = g_allocated_bytes.load() - allocated_before;
        peak = g_peak_bytes.load() - live_before;
        elements = layout.elements.size();
        hits = report.beams[0].path.hits.size() + report.beams[1].path.hits.size();
        reached = report.beams[0].at_target.reached + report.beams[1].at_target.reached;
    }
    state.counters["elements"] = static_cast<double>(elements);
    state.counters["text_bytes"] = static_cast<double>(text.size());
    state.counters["hits"] = static_cast<double>(hits);
    state.counters["beams_at_target"] = static_cast<double>(reached);
    state.counters["allocated_bytes"] = static_cast<double>(allocated);
    state.counters["peak_live_bytes"] = static_cast<double>(peak);
}

void LargeLayoutLongPath(benchmark::State& state) {
    load_trace_report(state, true);
}
void LargeLayoutReaching(benchmark::State& state) {
    load_trace_report(state, false);
}

// Reading alone, and the report alone, of the 2 000-element long path.
void LargeLayoutReadOnly(benchmark::State& state) {
    const std::string text = layout_text(static_cast<int>(state.range(0)), true);
    for (auto _ : state) benchmark::DoNotOptimize(read_or_abort(text).elements.size());
}
void LargeLayoutReportOnly(benchmark::State& state) {
    const rv::Layout layout = read_or_abort(layout_text(static_cast<int>(state.range(0)), true));
    const rv::MaterialLibrary library = rv::material_library_for(layout);
    for (auto _ : state)
        benchmark::DoNotOptimize(rv::build_report(layout, library).verdict.space.met);
}

BENCHMARK(LargeLayoutLongPath)->Arg(500)->Arg(1000)->Arg(2000)->Unit(benchmark::kMillisecond);
BENCHMARK(LargeLayoutReaching)->Arg(500)->Arg(1000)->Arg(2000)->Unit(benchmark::kMillisecond);
BENCHMARK(LargeLayoutReadOnly)->Arg(2000)->Unit(benchmark::kMillisecond);
BENCHMARK(LargeLayoutReportOnly)->Arg(2000)->Unit(benchmark::kMillisecond);

}  // namespace

BENCHMARK_MAIN();
