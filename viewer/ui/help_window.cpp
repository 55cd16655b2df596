#include "ui/help_window.hpp"

#include <imgui.h>

#include "ui/frame.hpp"
#include "ui/shortcuts.hpp"

namespace rv::ui {

std::vector<HelpRow> help_rows() {
    std::vector<HelpRow> rows;
    for (const Shortcut& s : shortcuts()) rows.push_back({keys_text(s), s.description});
    for (const MouseGesture& g : mouse_gestures()) rows.push_back({g.gesture, g.description});
    return rows;
}

void draw_help_window(ViewerState& st) {
    if (!st.show_help) return;
    const ImGuiViewport* vp = ImGui::GetMainViewport();
    ImGui::SetNextWindowPos(ImVec2(vp->Pos.x + vp->Size.x / 2, vp->Pos.y + vp->Size.y / 2), ImGuiCond_Appearing,
                            ImVec2(0.5f, 0.5f));
    if (ImGui::Begin("Shortcuts and mouse", &st.show_help,
                     ImGuiWindowFlags_AlwaysAutoResize | ImGuiWindowFlags_NoSavedSettings | ImGuiWindowFlags_NoCollapse)) {
        const size_t keys = shortcuts().size();
        const std::vector<HelpRow> rows = help_rows();
        if (ImGui::BeginTable("help", 2, ImGuiTableFlags_RowBg | ImGuiTableFlags_BordersInnerV)) {
            ImGui::TableSetupColumn("keys or mouse");
            ImGui::TableSetupColumn("what it does");
            ImGui::TableHeadersRow();
            for (size_t i = 0; i < rows.size(); ++i) {
                if (i == keys) {  // the mouse gestures under their own heading
                    ImGui::TableNextRow();
                    ImGui::TableSetColumnIndex(0);
                    ImGui::TextDisabled("mouse");
                }
                ImGui::TableNextRow();
                ImGui::TableSetColumnIndex(0);
                ImGui::TextUnformatted(rows[i].keys.c_str());
                ImGui::TableSetColumnIndex(1);
                ImGui::TextUnformatted(rows[i].what.c_str());
            }
            ImGui::EndTable();
        }
    }
    ImGui::End();
}

}  // namespace rv::ui
