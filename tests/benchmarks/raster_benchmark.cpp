// One 1600 × 1000 frame of the viewer on the SFG demo rasterized on the CPU (design budget:
// ≤ 8 ms median on one core). Building the ImGui frame is outside the timed loop.
//
// Reproduce: build/release/tests/benchmarks/rendezvous_benchmarks --benchmark_filter=Raster
//     --benchmark_repetitions=9 --benchmark_report_aggregates_only=true
#include <benchmark/benchmark.h>
#include <imgui.h>

#include "analysis/report.hpp"
#include "io/layout_reader.hpp"
#include "render/cpu_rasterizer.hpp"
#include "render/headless.hpp"
#include "scene/scene.hpp"
#include "edit/document.hpp"
#include "ui/frame.hpp"

namespace {

void RasterFrame1600x1000(benchmark::State& state) {
    const rv::Layout layout = *rv::read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout;
    const rv::RendezvousReport report = rv::build_report(layout, rv::material_library_for(layout));
    const rv::scene::Scene scene = rv::scene::build_scene(layout, report);
    ImGui::CreateContext();
    rv::render::Texture font;
    rv::render::configure_context(font);
    ImGui::GetIO().DisplaySize = ImVec2(1600, 1000);
    for (int f = 0; f < 2; ++f) {
        ImGui::NewFrame();
        rv::ui::draw_frame(layout, report, scene);
        ImGui::Render();
    }
    rv::render::Framebuffer fb(1600, 1000);
    const int threads = static_cast<int>(state.range(0));
    for (auto _ : state) {
        fb.clear(255, 255, 255);
        rv::render::rasterize(*ImGui::GetDrawData(), fb, {threads});
        benchmark::DoNotOptimize(fb.rgba.data());
    }
    state.counters["vertices"] = ImGui::GetDrawData()->TotalVtxCount;
    ImGui::DestroyContext();
}
BENCHMARK(RasterFrame1600x1000)->Arg(1)->Arg(2)->Unit(benchmark::kMillisecond);

}  // namespace

namespace {

// One drag step of the viewer (design budget: ≤ 16 ms): the dragged lens moves by 1 mm, the
// document re-traces and rebuilds the report and the scene, the ImGui frame is built and
// rasterized at 1600 × 1000 on one thread.
void DragStep1600x1000(benchmark::State& state) {
    rv::edit::Document doc(*rv::read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout);
    ImGui::CreateContext();
    rv::render::Texture font;
    rv::render::configure_context(font);
    ImGui::GetIO().DisplaySize = ImVec2(1600, 1000);
    rv::ui::ViewerState viewer;
    viewer.doc = &doc;
    size_t lens = 0;
    while (doc.layout().elements[lens].id != "L2_S") ++lens;
    rv::render::Framebuffer fb(1600, 1000);
    int k = 0;
    for (auto _ : state) {
        rv::Layout next = doc.layout();
        next.elements[lens].at_mm.x() += (k++ & 1) ? 1.0 : -1.0;
        doc.preview(std::move(next));
        ImGui::NewFrame();
        rv::ui::draw_document_frame(viewer);
        ImGui::Render();
        fb.clear(255, 255, 255);
        rv::render::rasterize(*ImGui::GetDrawData(), fb, {1});
        benchmark::DoNotOptimize(fb.rgba.data());
    }
    ImGui::DestroyContext();
}
BENCHMARK(DragStep1600x1000)->Unit(benchmark::kMillisecond);

}  // namespace
