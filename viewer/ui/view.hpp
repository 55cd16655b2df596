#pragma once
// The table view's transform: table millimetres (y up) to screen pixels (y down).
#include <imgui.h>

#include "layout/layout.hpp"

namespace rv::ui {

struct View {
    ImVec2 origin_px{0, 0};  // top-left corner of the canvas on screen
    ImVec2 size_px{1, 1};
    Vec2 centre_mm{0, 0};    // the table point at the canvas centre
    double px_per_mm = 1;

    ImVec2 to_screen(const Vec2& p) const {
        return {static_cast<float>(origin_px.x + size_px.x / 2 + (p.x() - centre_mm.x()) * px_per_mm),
                static_cast<float>(origin_px.y + size_px.y / 2 - (p.y() - centre_mm.y()) * px_per_mm)};
    }
    Vec2 to_table(const ImVec2& s) const {
        return {centre_mm.x() + (s.x - origin_px.x - size_px.x / 2) / px_per_mm,
                centre_mm.y() - (s.y - origin_px.y - size_px.y / 2) / px_per_mm};
    }
};

// A view that shows the whole table in the canvas with a small margin.
View fit_view(const ImVec2& origin_px, const ImVec2& size_px, double width_mm, double height_mm);

}  // namespace rv::ui
