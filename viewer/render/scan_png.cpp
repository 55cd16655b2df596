#include "render/scan_png.hpp"

#include <imgui.h>

#include "render/headless.hpp"
#include "ui/scan_map.hpp"

namespace rv::render {

Framebuffer render_scan_map(const ScanResult& result, int width, int height) {
    ImGuiContext* previous = ImGui::GetCurrentContext();
    ImGuiContext* context = ImGui::CreateContext();
    ImGui::SetCurrentContext(context);
    Texture font;
    configure_context(font);
    ImGuiIO& io = ImGui::GetIO();
    io.DisplaySize = ImVec2(static_cast<float>(width), static_cast<float>(height));
    io.DeltaTime = 1.0f / 60.0f;
    ImGui::NewFrame();
    ui::draw_scan_map(ImGui::GetBackgroundDrawList(), ImVec2(0, 0), io.DisplaySize, result);
    ImGui::Render();
    Framebuffer fb(width, height);
    fb.clear(255, 255, 255);
    rasterize(*ImGui::GetDrawData(), fb);
    ImGui::DestroyContext(context);
    ImGui::SetCurrentContext(previous);
    return fb;
}

}  // namespace rv::render
