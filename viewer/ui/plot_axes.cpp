#include "ui/plot_axes.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace rv::ui {

double nice_step(double span, int count) {
    const double raw = span / std::max(count, 1);
    const double p = std::pow(10.0, std::floor(std::log10(raw)));
    for (double m : {1.0, 2.0, 5.0, 10.0})
        if (m * p >= raw) return m * p;
    return 10 * p;
}

std::vector<long long> tick_indices(double lo, double hi, double step) {
    std::vector<long long> out;
    if (!(step > 0) || !std::isfinite(lo) || !std::isfinite(hi)) return out;
    const double first = std::ceil(lo / step), last = std::floor((hi + 1e-9 * step) / step);
    // More than kMaxTicks means the values no longer differ in a double: no ticks at all.
    if (!std::isfinite(first) || !std::isfinite(last) || last - first > kMaxTicks || std::abs(first) > 1e15 ||
        std::abs(last) > 1e15)
        return out;
    for (double k = first; k <= last; ++k) out.push_back(static_cast<long long>(k));
    return out;
}

PlotAxes draw_axes(ImDrawList* draw, ImVec2 origin, ImVec2 size, double x0, double x1, double y0, double y1,
                   const std::string& x_label, const std::string& y_label, const std::string& title) {
    const ImU32 ink = IM_COL32(40, 40, 50, 255), grid = IM_COL32(220, 222, 226, 255);
    PlotAxes a{ImVec2(origin.x + 52, origin.y + 22), ImVec2(origin.x + size.x - 12, origin.y + size.y - 34), x0, x1, y0, y1};
    draw->AddRectFilled(origin, ImVec2(origin.x + size.x, origin.y + size.y), IM_COL32(255, 255, 255, 255));
    draw->AddText(ImVec2(origin.x + 8, origin.y + 3), ink, title.c_str());
    char buf[32];
    // As many x ticks as their labels fit side by side (at most 6): the widest label is about
    // that of an end of the range at the step for 6 ticks.
    auto label_width = [&](double v, double step) {
        std::snprintf(buf, sizeof buf, "%g", std::round(v / step) * step);
        return ImGui::CalcTextSize(buf).x;
    };
    const double s6 = nice_step(x1 - x0, 6);
    const float widest = std::max(label_width(x0, s6), label_width(x1, s6)) + 12;
    const int fit = std::clamp(static_cast<int>((a.max_px.x - a.min_px.x) / widest), 1, 6);
    const double sx = nice_step(x1 - x0, fit), sy = nice_step(y1 - y0, 4);
    // Ticks counted first, then placed at k·step: stepping x += sx never ended when the span
    // was below the spacing of doubles at x0 (a Rayleigh range of 1e-13 mm at s = 900 mm).
    for (const long long k : tick_indices(x0, x1, sx)) {
        const double x = k * sx;
        const ImVec2 p = a.to_screen(x, y0);
        draw->AddLine(ImVec2(p.x, a.min_px.y), ImVec2(p.x, a.max_px.y), grid);
        std::snprintf(buf, sizeof buf, "%g", std::abs(x) < 1e-12 * sx ? 0.0 : x);
        draw->AddText(ImVec2(p.x - ImGui::CalcTextSize(buf).x / 2, a.max_px.y + 3), ink, buf);
    }
    for (const long long k : tick_indices(y0, y1, sy)) {
        const double y = k * sy;
        const ImVec2 p = a.to_screen(x0, y);
        draw->AddLine(ImVec2(a.min_px.x, p.y), ImVec2(a.max_px.x, p.y), grid);
        std::snprintf(buf, sizeof buf, "%g", y);
        draw->AddText(ImVec2(origin.x + 4, p.y - 7), ink, buf);
    }
    draw->AddRect(a.min_px, a.max_px, ink);
    // Right-aligned under the axis, never left of the frame (a narrow panel's label would spill
    // onto its neighbour).
    const float label_x = std::max(origin.x + 4, a.max_px.x - ImGui::CalcTextSize(x_label.c_str()).x);
    draw->AddText(ImVec2(label_x, a.max_px.y + 16), ink, x_label.c_str());
    draw->AddText(ImVec2(a.min_px.x + 4, a.min_px.y + 2), ink, y_label.c_str());
    return a;
}

}  // namespace rv::ui
