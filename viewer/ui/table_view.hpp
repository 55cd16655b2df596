#pragma once
#include <imgui.h>

#include "scene/scene.hpp"
#include "ui/view.hpp"

namespace rv::ui {

// Draws the scene: table, holes, elements, envelopes, beams, markers, labels, legend, scale bar.
void draw_table(ImDrawList* draw, const scene::Scene& scene, const View& view);

}  // namespace rv::ui
