#include "render/headless.hpp"

#include <imgui.h>

#include "ui/frame.hpp"

namespace rv::render {

void load_fonts(ImGuiIO& io) {
    // DejaVu Sans from Debian's fonts-dejavu-core, with Greek, super- and subscripts, arrows and
    // mathematical operators (θ, ², −, →); ImGui's built-in font when the file is missing.
    static const ImWchar ranges[] = {0x0020, 0x00FF, 0x0370, 0x03FF, 0x2010, 0x205E, 0x2070, 0x209F,
                                     0x2190, 0x21FF, 0x2200, 0x22FF, 0};
    if (!io.Fonts->AddFontFromFileTTF(kUiFontPath, 15.0f, nullptr, ranges)) io.Fonts->AddFontDefault();
}

void configure_context(Texture& font) {
    ImGuiIO& io = ImGui::GetIO();
    io.IniFilename = nullptr;
    io.BackendFlags |= ImGuiBackendFlags_RendererHasVtxOffset;
    ImGui::StyleColorsLight();
    ImGui::GetStyle().AntiAliasedLinesUseTex = false;  // lines as polygons: no bilinear sampling needed
    load_fonts(io);
    unsigned char* pixels = nullptr;
    io.Fonts->GetTexDataAsRGBA32(&pixels, &font.width, &font.height);
    font.rgba = pixels;
    io.Fonts->SetTexID(&font);
}

Framebuffer render_frame(const Layout& layout, const RendezvousReport& report, const scene::Scene& scene,
                         int width, int height, int threads) {
    ImGuiContext* previous = ImGui::GetCurrentContext();
    ImGuiContext* context = ImGui::CreateContext();
    ImGui::SetCurrentContext(context);
    Texture font;
    configure_context(font);
    ImGuiIO& io = ImGui::GetIO();
    io.DisplaySize = ImVec2(static_cast<float>(width), static_cast<float>(height));
    io.DeltaTime = 1.0f / 60.0f;
    for (int frame = 0; frame < 2; ++frame) {
        ImGui::NewFrame();
        ui::draw_frame(layout, report, scene);
        ImGui::Render();
    }
    Framebuffer fb(width, height);
    fb.clear(255, 255, 255);
    rasterize(*ImGui::GetDrawData(), fb, {threads});
    ImGui::DestroyContext(context);
    ImGui::SetCurrentContext(previous);
    return fb;
}

}  // namespace rv::render
