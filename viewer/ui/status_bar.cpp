#include "ui/status_bar.hpp"

#include <imgui.h>

#include <cstdio>
#include <limits>

#include "analysis/breadboard_holes.hpp"
#include "ui/frame.hpp"

namespace rv::ui {

namespace {

std::string signed_mm(double v_mm) {
    char text[32];
    std::snprintf(text, sizeof text, "%s%.1f", v_mm < 0 ? "−" : "+", std::abs(v_mm));
    return text;
}

std::string bar_text(const ViewerState& st) {
    std::string text = st.cursor_mm && st.doc ? cursor_readout(st.doc->layout().table, *st.cursor_mm) : std::string();
    if (!st.status_line.text.empty()) text += (text.empty() ? "" : "     ") + st.status_line.text;
    return text;
}

}  // namespace

std::string cursor_readout(const Table& table, const Vec2& p_mm) {
    if (!p_mm.allFinite()) return "";
    char text[96];
    std::snprintf(text, sizeof text, "x %.1f mm, y %.1f mm", p_mm.x(), p_mm.y());
    std::string out = text;
    const std::optional<HoleLocation> hole = hole_of(table, p_mm);
    if (!hole || !hole->on_table) return out + " · off the table";
    return out + " · hole row " + std::to_string(hole->row) + ", column " + std::to_string(hole->column) + " (" +
           signed_mm(hole->offset_mm.x()) + ", " + signed_mm(hole->offset_mm.y()) + " mm)";
}

void update_status_line(ViewerState& st) {
    const double now_s = ImGui::GetTime();
    const unsigned revision = st.doc ? st.doc->revision() : 0;
    if (!st.editor.status.empty()) {
        st.status_line = {st.editor.status, now_s, revision};
        st.editor.status.clear();
    } else if (!st.status_line.text.empty() &&
               (revision != st.status_line.revision || now_s - st.status_line.since_s >= kStatusSeconds)) {
        st.status_line = {};
    }
}

double status_seconds_left(const ViewerState& st) {
    if (st.status_line.text.empty()) return std::numeric_limits<double>::infinity();
    return std::max(0.0, st.status_line.since_s + kStatusSeconds - ImGui::GetTime());
}

float status_bar_height(const ViewerState& st, float width_px) {
    const std::string text = bar_text(st);
    const float line = ImGui::GetTextLineHeight();
    const float h = text.empty() ? line : ImGui::CalcTextSize(text.c_str(), nullptr, false, width_px).y;
    return h + ImGui::GetStyle().ItemSpacing.y;
}

void draw_status_bar(const ViewerState& st) {
    // Wrapped: a long message (a refused edit's diagnostic) is shown whole.
    ImGui::TextUnformatted(bar_text(st).c_str());  // wrapped at the caller's wrap position
}

}  // namespace rv::ui
