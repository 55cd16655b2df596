#include "render/scan_png.hpp"

#include <imgui.h>

#include "render/headless.hpp"
#include "ui/scan_map.hpp"

namespace rv::render {

Framebuffer render_scan_map(const ScanResult& result, int width, int height) {
    const HeadlessContext context(width, height);
    ImGui::NewFrame();
    ui::draw_scan_map(ImGui::GetBackgroundDrawList(), ImVec2(0, 0), ImGui::GetIO().DisplaySize, result);
    ImGui::Render();
    Framebuffer fb(width, height);
    fb.clear(255, 255, 255);
    rasterize(*ImGui::GetDrawData(), fb);
    return fb;
}

}  // namespace rv::render
