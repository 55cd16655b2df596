#include "render/headless.hpp"

#include <imgui.h>

#include <utility>

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
    // Menus, popups and dialogs answer the arrow keys, Space and Enter as well as the mouse.
    io.ConfigFlags |= ImGuiConfigFlags_NavEnableKeyboard;
    ImGui::StyleColorsLight();
    ImGui::GetStyle().AntiAliasedLinesUseTex = false;  // lines as polygons: no bilinear sampling needed
    // GLFW's key codes as key indices, as the GLFW backend sets them (ui/keys.hpp), so that a
    // headless frame reads the same keys as the window.
    const std::pair<ImGuiKey, int> keymap[] = {
        {ImGuiKey_Tab, 258},      {ImGuiKey_LeftArrow, 263}, {ImGuiKey_RightArrow, 262}, {ImGuiKey_UpArrow, 265},
        {ImGuiKey_DownArrow, 264}, {ImGuiKey_PageUp, 266},   {ImGuiKey_PageDown, 267},   {ImGuiKey_Home, 268},
        {ImGuiKey_End, 269},      {ImGuiKey_Insert, 260},    {ImGuiKey_Delete, 261},     {ImGuiKey_Backspace, 259},
        {ImGuiKey_Space, 32},     {ImGuiKey_Enter, 257},     {ImGuiKey_Escape, 256},     {ImGuiKey_KeyPadEnter, 335},
        {ImGuiKey_A, 'A'},        {ImGuiKey_C, 'C'},         {ImGuiKey_V, 'V'},          {ImGuiKey_X, 'X'},
        {ImGuiKey_Y, 'Y'},        {ImGuiKey_Z, 'Z'}};
    for (const auto& [key, code] : keymap) io.KeyMap[key] = code;
    load_fonts(io);
    unsigned char* pixels = nullptr;
    io.Fonts->GetTexDataAsRGBA32(&pixels, &font.width, &font.height);
    font.rgba = pixels;
    io.Fonts->SetTexID(&font);
}

HeadlessContext::HeadlessContext(int width, int height)
    : previous_(ImGui::GetCurrentContext()), context_(ImGui::CreateContext()) {
    ImGui::SetCurrentContext(context_);
    configure_context(font_);
    ImGuiIO& io = ImGui::GetIO();
    io.DisplaySize = ImVec2(static_cast<float>(width), static_cast<float>(height));
    io.DeltaTime = 1.0f / 60.0f;
}

HeadlessContext::~HeadlessContext() {
    ImGui::DestroyContext(context_);
    ImGui::SetCurrentContext(previous_);
}

Framebuffer render_frame(const Layout& layout, const RendezvousReport& report, const scene::Scene& scene,
                         int width, int height, int threads) {
    const HeadlessContext context(width, height);
    for (int frame = 0; frame < 2; ++frame) {
        ImGui::NewFrame();
        ui::draw_frame(layout, report, scene);
        ImGui::Render();
    }
    Framebuffer fb(width, height);
    fb.clear(255, 255, 255);
    rasterize(*ImGui::GetDrawData(), fb, {threads});
    return fb;
}

}  // namespace rv::render
