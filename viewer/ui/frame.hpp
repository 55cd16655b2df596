#pragma once
// One frame of the viewer: the table view on the left, the report panel on the right. The
// window (later) and the headless renderer both call this between NewFrame and Render.
#include <optional>

#include "analysis/report.hpp"
#include "scene/scene.hpp"
#include "ui/view.hpp"

namespace rv::ui {

// What the window remembers between frames (not part of the layout): the view of the table
// once the user has panned or zoomed (none: fit the table).
struct ViewerState {
    std::optional<View> view;
};

// Draws one frame; with a state, the table view pans (drag), zooms about the cursor (wheel)
// and fits again on F or a double click.
void draw_frame(const Layout& layout, const RendezvousReport& report, const scene::Scene& scene,
                ViewerState* state = nullptr);

}  // namespace rv::ui
