#include "ui/table_view.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace rv::ui {

namespace {

ImU32 col(const scene::Colour& c) { return IM_COL32(c.r, c.g, c.b, c.a); }

void dashed_line(ImDrawList* draw, ImVec2 a, ImVec2 b, ImU32 c, float width) {
    const float dx = b.x - a.x, dy = b.y - a.y, len = std::sqrt(dx * dx + dy * dy);
    const float dash = 8, gap = 5;
    for (float s = 0; s < len; s += dash + gap) {
        const float e = std::min(len, s + dash);
        draw->AddLine(ImVec2(a.x + dx * s / len, a.y + dy * s / len), ImVec2(a.x + dx * e / len, a.y + dy * e / len), c, width);
    }
}

}  // namespace

View fit_view(const ImVec2& origin, const ImVec2& size, double w_mm, double h_mm) {
    View v;
    v.origin_px = origin;
    v.size_px = size;
    v.centre_mm = Vec2(w_mm / 2, h_mm / 2);
    v.px_per_mm = 0.94 * std::min(size.x / w_mm, size.y / h_mm);
    return v;
}

void draw_table(ImDrawList* draw, const scene::Scene& s, const View& v) {
    draw->PushClipRect(v.origin_px, ImVec2(v.origin_px.x + v.size_px.x, v.origin_px.y + v.size_px.y), true);
    draw->AddRectFilled(v.origin_px, ImVec2(v.origin_px.x + v.size_px.x, v.origin_px.y + v.size_px.y), IM_COL32(250, 250, 252, 255));
    const ImVec2 t0 = v.to_screen(Vec2(0, s.height_mm)), t1 = v.to_screen(Vec2(s.width_mm, 0));
    draw->AddRectFilled(t0, t1, col(s.table_colour));
    draw->AddRect(t0, t1, IM_COL32(144, 152, 160, 255));
    if (s.grid_mm * v.px_per_mm >= 6)
        for (const Vec2& h : s.holes_mm) {
            const ImVec2 p = v.to_screen(h);
            draw->AddRectFilled(ImVec2(p.x - 1, p.y - 1), ImVec2(p.x + 1, p.y + 1), IM_COL32(184, 190, 198, 255));
        }
    for (const scene::Polyline& p : s.shapes) {
        if (p.points_mm.size() < 2) continue;
        std::vector<ImVec2> pts;
        for (const Vec2& q : p.points_mm) pts.push_back(v.to_screen(q));
        const float width = std::max(1.0f, static_cast<float>(p.width_mm * v.px_per_mm));
        if (p.band) {
            const size_t n = pts.size() / 2;
            for (size_t i = 0; i + 1 < n; ++i)
                draw->AddQuadFilled(pts[i], pts[i + 1], pts[pts.size() - 2 - i], pts[pts.size() - 1 - i], col(p.colour));
        } else if (p.filled) {
            draw->AddConvexPolyFilled(pts.data(), static_cast<int>(pts.size()), col(p.colour));
            draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), IM_COL32(80, 90, 102, 255), ImDrawFlags_Closed, 1.0f);
        } else if (p.dashed) {
            for (size_t i = 0; i + 1 < pts.size(); ++i) dashed_line(draw, pts[i], pts[i + 1], col(p.colour), width);
        } else {
            draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), col(p.colour),
                              p.closed ? ImDrawFlags_Closed : ImDrawFlags_None, width);
        }
    }
    for (const scene::Label& l : s.labels) draw->AddText(v.to_screen(l.at_mm), col(l.colour), l.text.c_str());
    // Legend and scale bar in the canvas's lower left corner.
    float y = v.origin_px.y + v.size_px.y - 18.0f * (s.legend.size() + 2);
    const float x = v.origin_px.x + 12;
    for (const scene::LegendEntry& e : s.legend) {
        if (e.dashed) dashed_line(draw, ImVec2(x, y + 7), ImVec2(x + 30, y + 7), col(e.colour), 2.5f);
        else draw->AddLine(ImVec2(x, y + 7), ImVec2(x + 30, y + 7), col(e.colour), 2.5f);
        draw->AddText(ImVec2(x + 38, y), IM_COL32(30, 30, 40, 255), e.text.c_str());
        y += 18;
    }
    const float bar = static_cast<float>(100 * v.px_per_mm);
    draw->AddLine(ImVec2(x, y + 10), ImVec2(x + bar, y + 10), IM_COL32(30, 30, 40, 255), 2.0f);
    char text[96];
    std::snprintf(text, sizeof text, "100 mm   (envelopes x %.0f)", s.envelope_exaggeration);
    draw->AddText(ImVec2(x + bar + 8, y + 3), IM_COL32(30, 30, 40, 255), text);
    draw->PopClipRect();
}

}  // namespace rv::ui
