#include "ui/table_view.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "scene/clip_segment.hpp"
#include "units/clamped_int.hpp"

namespace rv::ui {

namespace {

ImU32 col(const scene::Colour& c) { return IM_COL32(c.r, c.g, c.b, c.a); }

// The most dashes one segment gets: a clipped segment is at most the canvas's diagonal plus the
// margin long (far fewer dashes); the cap holds whatever the caller passes.
constexpr int kMaxDashes = 4096;

// Counted first, then stepped by an integer: a float s += 13 px stops growing near 2^28 px and
// never passed the length of a segment 1e15 px long (a table of 1e-9 mm; issue 19).
void dashed_line(ImDrawList* draw, ImVec2 a, ImVec2 b, ImU32 c, float width) {
    const float dx = b.x - a.x, dy = b.y - a.y, len = std::sqrt(dx * dx + dy * dy);
    const float dash = 8, gap = 5;
    if (!(len > 0) || !std::isfinite(len)) return;
    const int dashes = clamped_int(std::ceil(len / (dash + gap)), 0, kMaxDashes);
    for (int k = 0; k < dashes; ++k) {
        const float s = k * (dash + gap), e = std::min(len, s + dash);
        draw->AddLine(ImVec2(a.x + dx * s / len, a.y + dy * s / len), ImVec2(a.x + dx * e / len, a.y + dy * e / len), c, width);
    }
}

// The table area the canvas shows, in mm, with a margin of `margin_px` pixels.
scene::Box visible_mm(const View& v, float margin_px) {
    const Vec2 a = v.to_table(ImVec2(v.origin_px.x - margin_px, v.origin_px.y - margin_px));
    const Vec2 b = v.to_table(ImVec2(v.origin_px.x + v.size_px.x + margin_px, v.origin_px.y + v.size_px.y + margin_px));
    return {a.cwiseMin(b), a.cwiseMax(b)};
}

bool inside(const scene::Box& box, const Vec2& p) {
    return p.x() >= box.min.x() && p.x() <= box.max.x() && p.y() >= box.min.y() && p.y() <= box.max.y();
}

}  // namespace

ScreenRect legend_rect(const scene::Scene& s, const View& v) {
    float width = 0;
    for (const scene::LegendEntry& e : s.legend) width = std::max(width, ImGui::CalcTextSize(e.text.c_str()).x);
    const float scale_text = ImGui::CalcTextSize("100 mm   (envelopes x 10)").x + 100;  // the bar and its words
    const float w = std::max(width + 44, scale_text) + 8, h = kLegendRowPx * static_cast<float>(s.legend.size() + 2);
    // The canvas corner where the legend covers the least of the table: the fewest outline
    // segments (beams, symbols, envelopes) crossing it; the lower left when it ties.
    ScreenRect best{};
    int best_count = -1;
    for (int corner = 0; corner < 4 && best_count != 0; ++corner) {
        const bool right = corner % 2 == 1, top = corner >= 2;
        const float x0 = right ? v.origin_px.x + v.size_px.x - 6 - w : v.origin_px.x + 6;
        const float y0 = top ? v.origin_px.y + 4 : v.origin_px.y + v.size_px.y - 4 - h;
        const ScreenRect r{ImVec2(x0, y0), ImVec2(x0 + w, y0 + h)};
        const Vec2 a = v.to_table(r.min), b = v.to_table(r.max);
        const scene::Box box{a.cwiseMin(b), a.cwiseMax(b)};
        int count = 0;
        for (const scene::Polyline& p : s.shapes) {
            const size_t n = p.points_mm.size();
            for (size_t i = 0; i + 1 < n + (p.closed ? 1 : 0); ++i)
                count += scene::clip_segment(p.points_mm[i], p.points_mm[(i + 1) % n], box).has_value();
        }
        if (best_count < 0 || count < best_count) best = r, best_count = count;
    }
    return best;
}

std::vector<scene::PlacedLabel> place_view_labels(const scene::Scene& s, const View& v) {
    const double mm_per_px = 1 / v.px_per_mm;
    // The legend drawn in the canvas's corner is a keep-out for the labels.
    const ScreenRect legend = legend_rect(s, v);
    const Vec2 a = v.to_table(legend.min), b = v.to_table(legend.max);
    return scene::place_labels(
        s,
        [mm_per_px](const scene::Label& l) {
            const ImVec2 e = ImGui::CalcTextSize(l.text.c_str());
            return scene::LabelSizeMm{e.x * mm_per_px, e.y * mm_per_px};
        },
        kLabelGapPx * mm_per_px, {scene::Box{a.cwiseMin(b), a.cwiseMax(b)}});
}

View fit_view(const ImVec2& origin, const ImVec2& size, double w_mm, double h_mm) {
    View v;
    v.origin_px = origin;
    v.size_px = size;
    v.centre_mm = Vec2(w_mm / 2, h_mm / 2);
    v.px_per_mm = 0.94 * std::min(size.x / w_mm, size.y / h_mm);
    return v;
}

void draw_table(ImDrawList* draw, const scene::Scene& s, const View& v) {
    const scene::Box near = visible_mm(v, 64);  // what may be drawn: the canvas and a margin
    draw->PushClipRect(v.origin_px, ImVec2(v.origin_px.x + v.size_px.x, v.origin_px.y + v.size_px.y), true);
    draw->AddRectFilled(v.origin_px, ImVec2(v.origin_px.x + v.size_px.x, v.origin_px.y + v.size_px.y), IM_COL32(250, 250, 252, 255));
    const ImVec2 t0 = v.to_screen(Vec2(0, s.height_mm)), t1 = v.to_screen(Vec2(s.width_mm, 0));
    draw->AddRectFilled(t0, t1, col(s.table_colour));
    draw->AddRect(t0, t1, IM_COL32(144, 152, 160, 255));
    if (s.grid_mm * v.px_per_mm >= 6)
        for (const Vec2& h : s.holes_mm) {
            if (!inside(near, h)) continue;
            const ImVec2 p = v.to_screen(h);
            draw->AddRectFilled(ImVec2(p.x - 1, p.y - 1), ImVec2(p.x + 1, p.y + 1), IM_COL32(184, 190, 198, 255));
        }
    // Shapes are drawn as they are when every point lies within a million pixels of the canvas
    // (far within float's range: every shape of a table drawn whole, or zoomed in); otherwise
    // an outline is drawn clipped in mm, segment by segment, and an area not at all. A dashed
    // segment is always clipped to the canvas first, so its dashes are few.
    const scene::Box far = scene::grown(near, 1e6 / v.px_per_mm);
    auto dashed = [&](const Vec2& a, const Vec2& b, ImU32 c, float width) {
        if (inside(near, a) && inside(near, b)) dashed_line(draw, v.to_screen(a), v.to_screen(b), c, width);
        else if (const auto part = scene::clip_segment(a, b, near))
            dashed_line(draw, v.to_screen(part->first), v.to_screen(part->second), c, width);
    };
    for (const scene::Polyline& p : s.shapes) {
        if (p.points_mm.size() < 2) continue;
        const float width = std::max(1.0f, static_cast<float>(p.width_mm * v.px_per_mm));
        const size_t n = p.points_mm.size();
        if (!p.band && !p.filled && p.dashed) {
            for (size_t i = 0; i + 1 < n; ++i) dashed(p.points_mm[i], p.points_mm[i + 1], col(p.colour), width);
            continue;
        }
        if (!std::all_of(p.points_mm.begin(), p.points_mm.end(), [&](const Vec2& q) { return inside(far, q); })) {
            if (p.band || p.filled) continue;
            for (size_t i = 0; i + 1 < n + (p.closed ? 1 : 0); ++i)
                if (const auto part = scene::clip_segment(p.points_mm[i], p.points_mm[(i + 1) % n], near))
                    draw->AddLine(v.to_screen(part->first), v.to_screen(part->second), col(p.colour), width);
            continue;
        }
        std::vector<ImVec2> pts;
        for (const Vec2& q : p.points_mm) pts.push_back(v.to_screen(q));
        if (p.band) {
            const size_t half = pts.size() / 2;
            for (size_t i = 0; i + 1 < half; ++i)
                draw->AddQuadFilled(pts[i], pts[i + 1], pts[pts.size() - 2 - i], pts[pts.size() - 1 - i], col(p.colour));
        } else if (p.filled) {
            draw->AddConvexPolyFilled(pts.data(), static_cast<int>(pts.size()), col(p.colour));
            draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), IM_COL32(80, 90, 102, 255), ImDrawFlags_Closed, 1.0f);
        } else {
            draw->AddPolyline(pts.data(), static_cast<int>(pts.size()), col(p.colour),
                              p.closed ? ImDrawFlags_Closed : ImDrawFlags_None, width);
        }
    }
    // Labels where the placement pass puts them for this font and zoom, leader lines first.
    const std::vector<scene::PlacedLabel> placed = place_view_labels(s, v);
    for (size_t i = 0; i < placed.size(); ++i) {
        const scene::Box& b = placed[i].box_mm;
        if (!inside(near, b.min) || !inside(near, b.max)) continue;
        if (placed[i].leader)
            draw->AddLine(v.to_screen(placed[i].leader->first), v.to_screen(placed[i].leader->second),
                          IM_COL32(120, 124, 132, 255), 1.0f);
        draw->AddText(v.to_screen(Vec2(b.min.x(), b.max.y())), col(s.labels[i].colour), s.labels[i].text.c_str());
    }
    // Legend and scale bar in the canvas corner that hides least (legend_rect), on a light
    // backing so that the table under it does not cross its words (labels keep out of it).
    const ScreenRect backing = legend_rect(s, v);
    draw->AddRectFilled(backing.min, backing.max, IM_COL32(255, 255, 255, 160), 3.0f);
    float y = backing.min.y + 4;
    const float x = backing.min.x + 6;
    for (const scene::LegendEntry& e : s.legend) {
        if (e.dashed) dashed_line(draw, ImVec2(x, y + 7), ImVec2(x + 30, y + 7), col(e.colour), 2.5f);
        else draw->AddLine(ImVec2(x, y + 7), ImVec2(x + 30, y + 7), col(e.colour), 2.5f);
        draw->AddText(ImVec2(x + 38, y), IM_COL32(30, 30, 40, 255), e.text.c_str());
        y += kLegendRowPx;
    }
    // At most a few canvases long (a table of 1e-9 mm gives 1e14 px per 100 mm).
    const float bar = static_cast<float>(std::min(100 * v.px_per_mm, 4.0 * v.size_px.x));
    draw->AddLine(ImVec2(x, y + 10), ImVec2(x + bar, y + 10), IM_COL32(30, 30, 40, 255), 2.0f);
    char text[96];
    std::snprintf(text, sizeof text, "100 mm   (envelopes x %.0f)", s.envelope_exaggeration);
    draw->AddText(ImVec2(x + bar + 8, y + 3), IM_COL32(30, 30, 40, 255), text);
    draw->PopClipRect();
}

}  // namespace rv::ui
