#include "ui/canvas_readouts.hpp"

#include <algorithm>

#include "scene/beam_probe.hpp"
#include "units/number_text.hpp"

namespace rv::ui {

namespace {

void text_box(ImDrawList* draw, ImVec2 at, ImU32 ink, const std::string& text) {
    const ImVec2 extent = ImGui::CalcTextSize(text.c_str());
    draw->AddRectFilled(at, ImVec2(at.x + extent.x + 6, at.y + extent.y + 4), IM_COL32(255, 255, 255, 225));
    draw->AddText(ImVec2(at.x + 3, at.y + 2), ink, text.c_str());
}

// The chief ray of one beam between path lengths s0 ≤ s1, as screen polyline pieces.
void draw_path_between(ImDrawList* draw, const ReportBeam& beam, double s0, double s1, const View& view, ImU32 c) {
    double start = 0;
    for (const TraceSegment& seg : beam.path.segments) {
        const double end = start + seg.length_mm;
        if (seg.length_mm > 0 && end >= s0 && start <= s1) {
            const Vec2 d = (seg.to_mm - seg.from_mm) / seg.length_mm;
            const Vec2 a = seg.from_mm + (std::max(s0, start) - start) * d;
            const Vec2 b = seg.from_mm + (std::min(s1, end) - start) * d;
            draw->AddLine(view.to_screen(a), view.to_screen(b), c, 4.0f);
        }
        start = end;
    }
}

}  // namespace

void draw_hover_readout(ImDrawList* draw, const edit::Document& doc, const EditorState& editor, const View& view,
                        const std::optional<Vec2>& cursor_mm) {
    if (!cursor_mm || editor.drag || editor.measuring || ImGui::IsAnyMouseDown()) return;
    const RendezvousReport& report = doc.report();
    // An optic first (its symbol sits on the beam), then a beam.
    if (const std::optional<size_t> e = element_at(doc, *cursor_mm, view.px_per_mm);
        e && !std::holds_alternative<Stage>(doc.layout().elements[*e].kind)) {
        ImGui::BeginTooltip();
        ImGui::TextUnformatted(scene::optic_summary_text(doc.layout(), report, *e).c_str());
        ImGui::EndTooltip();
        return;
    }
    const std::optional<scene::BeamPoint> p = scene::nearest_beam_point(report, *cursor_mm, kBeamPickPx / view.px_per_mm);
    if (!p) return;
    draw->AddCircle(view.to_screen(p->at_mm), 5, IM_COL32(20, 20, 30, 255), 16, 1.5f);
    ImGui::BeginTooltip();
    ImGui::TextUnformatted(scene::beam_readout_text(scene::read_beam_at(doc.layout(), report, *p)).c_str());
    ImGui::EndTooltip();
}

void draw_ruler_along_beams(ImDrawList* draw, const edit::Document& doc, const EditorState::Ruler& r, const View& view) {
    const ImVec2 a = view.to_screen(r.from_mm), b = view.to_screen(r.to_mm);
    const ImU32 c = IM_COL32(20, 90, 200, 255);
    std::string text = ruler_text(r);
    const double reach_mm = 8.0 / view.px_per_mm;
    const RendezvousReport& report = doc.report();
    const std::optional<scene::BeamPoint> from = scene::nearest_beam_point(report, r.from_mm, reach_mm);
    if (from) {
        const std::optional<scene::BeamPoint> to = scene::nearest_beam_point(report, r.to_mm, reach_mm, from->beam);
        if (to && (r.to_mm - r.from_mm).norm() > reach_mm) {
            const double s0 = std::min(from->s_mm, to->s_mm), s1 = std::max(from->s_mm, to->s_mm);
            draw_path_between(draw, report.beams[from->beam], s0, s1, view, IM_COL32(20, 90, 200, 120));
            text += " · along " + report.beams[from->beam].id + " " + format_number("%.1f", s1 - s0) + " mm";
        }
    }
    draw->AddLine(a, b, c, 2.0f);
    draw->AddCircleFilled(a, 3, c);
    draw->AddCircleFilled(b, 3, c);
    text_box(draw, ImVec2((a.x + b.x) / 2 + 6, (a.y + b.y) / 2 - 18), c, text);
}

}  // namespace rv::ui
