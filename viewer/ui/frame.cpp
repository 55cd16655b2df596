#include "ui/frame.hpp"

#include <imgui.h>

#include "ui/report_panel.hpp"
#include "ui/table_view.hpp"

namespace rv::ui {

void draw_frame(const RendezvousReport& report, const scene::Scene& scene) {
    const ImGuiViewport* vp = ImGui::GetMainViewport();
    ImGui::SetNextWindowPos(vp->Pos);
    ImGui::SetNextWindowSize(vp->Size);
    ImGui::Begin("Rendezvous", nullptr,
                 ImGuiWindowFlags_NoDecoration | ImGuiWindowFlags_NoMove | ImGuiWindowFlags_NoSavedSettings |
                     ImGuiWindowFlags_NoBringToFrontOnFocus);
    ImGui::Text("%s", scene.title.c_str());
    const float panel = 380;
    const ImVec2 avail = ImGui::GetContentRegionAvail();
    ImGui::BeginChild("table", ImVec2(avail.x - panel, avail.y), true);
    const ImVec2 origin = ImGui::GetCursorScreenPos();
    const ImVec2 size = ImGui::GetContentRegionAvail();
    draw_table(ImGui::GetWindowDrawList(), scene, fit_view(origin, size, scene.width_mm, scene.height_mm));
    ImGui::EndChild();
    ImGui::SameLine();
    ImGui::BeginChild("report", ImVec2(0, avail.y), true);
    draw_report_panel(report);
    ImGui::EndChild();
    ImGui::End();
}

}  // namespace rv::ui
