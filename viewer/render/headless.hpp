#pragma once
// Rendering the viewer frame with no display and no GL: an ImGui context of its own, the font
// atlas as a CPU texture, two frames (ImGui sizes new windows in the first), then the CPU
// rasterizer. Never calls glfwInit.
#include "analysis/report.hpp"
#include "render/cpu_rasterizer.hpp"
#include "scene/scene.hpp"

struct ImGuiIO;
struct ImGuiContext;

namespace rv::render {

inline constexpr const char* kUiFontPath = "/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf";

// Adds the viewer's font to the atlas (before it is built).
void load_fonts(ImGuiIO& io);

// Sets up the current ImGui context as the viewer uses it: no ini file, vertex offsets for
// large meshes, the light style, lines as polygons, the font atlas baked into `font` and
// handed to ImGui as its texture (`font` must outlive the context).
void configure_context(Texture& font);

// An ImGui context of its own for one drawing of width x height pixels with no display: made
// current and configured (configure_context, the display size, a 60 Hz frame step) on
// construction; destroyed, with the context that was current before restored, on destruction.
class HeadlessContext {
public:
    HeadlessContext(int width, int height);
    ~HeadlessContext();
    HeadlessContext(const HeadlessContext&) = delete;
    HeadlessContext& operator=(const HeadlessContext&) = delete;

private:
    ImGuiContext* previous_;
    ImGuiContext* context_;
    Texture font_;  // the font atlas the context draws with; outlives it (destroyed after)
};

Framebuffer render_frame(const Layout& layout, const RendezvousReport& report, const scene::Scene& scene,
                         int width, int height, int threads = 1);

}  // namespace rv::render
