#pragma once
// One frame of the viewer: the table view on the left, the report panel on the right. The
// window (later) and the headless renderer both call this between NewFrame and Render.
#include "analysis/report.hpp"
#include "scene/scene.hpp"

namespace rv::ui {

void draw_frame(const RendezvousReport& report, const scene::Scene& scene);

}  // namespace rv::ui
