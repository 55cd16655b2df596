#pragma once
// A small plotting frame on an ImDrawList (Debian 12 packages no plotting library for Dear
// ImGui): a data rectangle, "nice" ticks with labels, and the data-to-screen mapping.
#include <imgui.h>

#include <string>
#include <vector>

namespace rv::ui {

struct PlotAxes {
    ImVec2 min_px, max_px;  // the data rectangle on screen
    double x0, x1, y0, y1;  // data ranges

    ImVec2 to_screen(double x, double y) const {
        return {static_cast<float>(min_px.x + (x - x0) / (x1 - x0) * (max_px.x - min_px.x)),
                static_cast<float>(max_px.y - (y - y0) / (y1 - y0) * (max_px.y - min_px.y))};
    }
};

// Draws the frame, ticks and labels inside [origin, origin + size) and returns the mapping.
PlotAxes draw_axes(ImDrawList* draw, ImVec2 origin, ImVec2 size, double x0, double x1, double y0, double y1,
                   const std::string& x_label, const std::string& y_label, const std::string& title);

// A round step giving about `count` ticks over `span` (1, 2 or 5 × 10^k).
double nice_step(double span, int count);

// The ticks k·step in [lo, hi] as their indices k, counted before any is listed: none when the
// step is not positive, a bound is not finite, or there would be more than kMaxTicks (a span
// below the spacing of doubles at lo, where k·step no longer differ).
inline constexpr double kMaxTicks = 100;
std::vector<long long> tick_indices(double lo, double hi, double step);

}  // namespace rv::ui
