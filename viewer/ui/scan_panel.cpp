#include "ui/scan_panel.hpp"

#include <imgui.h>

#include <algorithm>

#include "io/layout_reader.hpp"
#include "ui/scan_map.hpp"

namespace rv::ui {

void draw_scan_panel(const edit::Document& doc, ScanState& st) {
    st.open = ImGui::CollapsingHeader("Scan plan");
    st.header_min = ImGui::GetItemRectMin();
    st.header_max = ImGui::GetItemRectMax();
    if (!st.open) return;
    if (!st.result || st.revision != doc.revision()) {
        st.result = plan_scan(doc.layout(), material_library_for(doc.layout()));
        st.revision = doc.revision();
    }
    const ScanResult& r = *st.result;
    if (r.refusal) {
        ImGui::TextWrapped("%s", scan_refusal_text(*r.refusal).c_str());
        return;
    }
    for (const std::string& line : scan_plan_lines(r)) ImGui::TextWrapped("%s", line.c_str());
    const float w = ImGui::GetContentRegionAvail().x;
    const ImVec2 size(w, std::max(220.0f, w * 0.7f));
    const ImVec2 origin = ImGui::GetCursorScreenPos();
    draw_scan_map(ImGui::GetWindowDrawList(), origin, size, r);
    ImGui::Dummy(size);
}

}  // namespace rv::ui
