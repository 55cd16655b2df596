#pragma once
// The two viewer workloads the benchmarks time and check_budgets counts (raster_benchmark.cpp,
// frame_loop.cpp), set up once here so both measure the same thing:
// * RasterCase: one 1600 × 1000 frame of the SFG demo rasterized on the CPU (the ImGui frame
//   is built once, outside the step).
// * DragCase: one drag step of the viewer: the signal arm's second lens moves by ±1 mm, the
//   document re-traces and rebuilds the report and the scene, and the frame is built and
//   rasterized at 1600 × 1000 on one thread.
// Each owns an ImGui context for its lifetime: make one at a time.
#include <imgui.h>

#include "analysis/report.hpp"
#include "edit/document.hpp"
#include "io/layout_reader.hpp"
#include "render/cpu_rasterizer.hpp"
#include "render/headless.hpp"
#include "scene/scene.hpp"
#include "ui/frame.hpp"

namespace rv::bench {

inline Layout demo_layout() { return *read_layout_file(RV_SOURCE_DIR "/layouts/sfg-bbo.json").layout; }

class FrameContext {
public:
    FrameContext() {
        ImGui::CreateContext();
        render::configure_context(font_);
        ImGui::GetIO().DisplaySize = ImVec2(1600, 1000);
    }
    ~FrameContext() { ImGui::DestroyContext(); }
    FrameContext(const FrameContext&) = delete;
    FrameContext& operator=(const FrameContext&) = delete;

private:
    render::Texture font_;
};

class RasterCase {
public:
    explicit RasterCase(int threads) : threads_(threads) {
        for (int f = 0; f < 2; ++f) {  // the second frame has ImGui's settled layout
            ImGui::NewFrame();
            ui::draw_frame(layout_, report_, scene_);
            ImGui::Render();
        }
    }
    void step() {
        fb_.clear(255, 255, 255);
        render::rasterize(*ImGui::GetDrawData(), fb_, {threads_});
    }
    const unsigned char* pixels() const { return fb_.rgba.data(); }
    int vertices() const { return ImGui::GetDrawData()->TotalVtxCount; }

private:
    FrameContext context_;
    Layout layout_ = demo_layout();
    RendezvousReport report_ = build_report(layout_, material_library_for(layout_));
    scene::Scene scene_ = scene::build_scene(layout_, report_);
    render::Framebuffer fb_{1600, 1000};
    int threads_;
};

class DragCase {
public:
    DragCase() {
        viewer_.doc = &doc_;
        while (doc_.layout().elements[lens_].id != "L2_S") ++lens_;
    }
    void step() {
        Layout next = doc_.layout();
        next.elements[lens_].at_mm.x() += (k_++ & 1) ? 1.0 : -1.0;
        doc_.preview(std::move(next));
        ImGui::NewFrame();
        ui::draw_document_frame(viewer_);
        ImGui::Render();
        fb_.clear(255, 255, 255);
        render::rasterize(*ImGui::GetDrawData(), fb_, {1});
    }
    const unsigned char* pixels() const { return fb_.rgba.data(); }

private:
    FrameContext context_;
    edit::Document doc_{demo_layout()};
    ui::ViewerState viewer_;
    size_t lens_ = 0;
    render::Framebuffer fb_{1600, 1000};
    long k_ = 0;
};

}  // namespace rv::bench
