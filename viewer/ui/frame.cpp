#include "ui/frame.hpp"

#include <imgui.h>

#include <cmath>

#include "ui/plots.hpp"
#include "ui/report_panel.hpp"
#include "ui/table_view.hpp"

namespace rv::ui {

namespace {

// Pan and zoom through an invisible button over the canvas (the Dear ImGui canvas idiom).
View interact(const View& fitted, ViewerState& state) {
    View v = state.view.value_or(fitted);
    v.origin_px = fitted.origin_px;
    v.size_px = fitted.size_px;
    ImGui::SetCursorScreenPos(v.origin_px);
    ImGui::InvisibleButton("canvas", v.size_px, ImGuiButtonFlags_MouseButtonLeft | ImGuiButtonFlags_MouseButtonRight);
    const ImGuiIO& io = ImGui::GetIO();
    if (ImGui::IsItemActive() && (io.MouseDelta.x != 0 || io.MouseDelta.y != 0)) {
        v.centre_mm += Vec2(-io.MouseDelta.x / v.px_per_mm, io.MouseDelta.y / v.px_per_mm);
        state.view = v;
    }
    if (ImGui::IsItemHovered() && io.MouseWheel != 0) {
        const Vec2 anchor = v.to_table(io.MousePos);  // the table point under the cursor stays put
        v.px_per_mm *= std::pow(1.2, io.MouseWheel);
        const Vec2 moved = v.to_table(io.MousePos);
        v.centre_mm += anchor - moved;
        state.view = v;
    }
    if ((ImGui::IsItemHovered() && ImGui::IsMouseDoubleClicked(ImGuiMouseButton_Left)) ||
        (ImGui::IsWindowFocused() && ImGui::IsKeyPressed(70 /* GLFW_KEY_F, the index the GLFW backend uses */, false))) {
        state.view.reset();
        v = fitted;
    }
    return v;
}

}  // namespace

void draw_frame(const Layout& layout, const RendezvousReport& report, const scene::Scene& scene, ViewerState* state) {
    const ImGuiViewport* vp = ImGui::GetMainViewport();
    ImGui::SetNextWindowPos(vp->Pos);
    ImGui::SetNextWindowSize(vp->Size);
    ImGui::Begin("Rendezvous", nullptr,
                 ImGuiWindowFlags_NoDecoration | ImGuiWindowFlags_NoMove | ImGuiWindowFlags_NoSavedSettings |
                     ImGuiWindowFlags_NoBringToFrontOnFocus);
    ImGui::Text("%s", scene.title.c_str());
    const float panel = 380;
    const ImVec2 avail = ImGui::GetContentRegionAvail();
    ImGui::BeginGroup();
    const float plots = std::floor(avail.y * 0.3f);
    ImGui::BeginChild("table", ImVec2(avail.x - panel, avail.y - plots), true);
    const ImVec2 origin = ImGui::GetCursorScreenPos();
    const ImVec2 size = ImGui::GetContentRegionAvail();
    const View fitted = fit_view(origin, size, scene.width_mm, scene.height_mm);
    draw_table(ImGui::GetWindowDrawList(), scene, state ? interact(fitted, *state) : fitted);
    ImGui::EndChild();
    ImGui::BeginChild("plots", ImVec2(avail.x - panel, 0), true);
    const ImVec2 p0 = ImGui::GetCursorScreenPos();
    const ImVec2 ps = ImGui::GetContentRegionAvail();
    const float half = std::floor(ps.x / 2);
    draw_caustic_plot(ImGui::GetWindowDrawList(), p0, ImVec2(half - 4, ps.y), report);
    draw_timing_plot(ImGui::GetWindowDrawList(), ImVec2(p0.x + half + 4, p0.y), ImVec2(ps.x - half - 4, ps.y), layout, report);
    ImGui::EndChild();
    ImGui::EndGroup();
    ImGui::SameLine();
    ImGui::BeginChild("report", ImVec2(0, avail.y), true);
    draw_report_panel(report);
    ImGui::EndChild();
    ImGui::End();
}

}  // namespace rv::ui
