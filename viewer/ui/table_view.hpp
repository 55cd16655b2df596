#pragma once
#include <imgui.h>

#include "scene/label_placement.hpp"
#include "scene/scene.hpp"
#include "ui/view.hpp"

namespace rv::ui {

// The labels' boxes for the current font at this view's zoom (scene/label_placement.hpp), a
// gap of kLabelGapPx kept around each.
inline constexpr double kLabelGapPx = 2;
std::vector<scene::PlacedLabel> place_view_labels(const scene::Scene& scene, const View& view);

// The legend and scale bar's backing, in screen pixels for the current font: in the canvas
// corner where it covers the fewest of the table's outlines. Drawn over the table, so the
// labels keep out of it.
struct ScreenRect {
    ImVec2 min, max;
};
inline constexpr float kLegendRowPx = 18;
ScreenRect legend_rect(const scene::Scene& scene, const View& view);

// Draws the scene: table, holes, elements, envelopes, beams, markers, labels, legend, scale bar.
void draw_table(ImDrawList* draw, const scene::Scene& scene, const View& view);

}  // namespace rv::ui
