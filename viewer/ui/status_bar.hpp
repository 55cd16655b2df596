#pragma once
// The status bar under the table: the cursor's table position in mm and its breadboard hole
// (analysis/breadboard_holes.hpp: row and column from 0, as the build sheet counts them), and
// the last action's message. A message is shown until the layout changes again or for
// kStatusSeconds, whichever comes first.
#include <string>

#include "layout/layout.hpp"

namespace rv::ui {

struct ViewerState;

inline constexpr double kStatusSeconds = 8.0;

// "x 312.4 mm, y 498.7 mm · hole row 19, column 12 (+0.1, −1.3 mm)"; "· off the table" beyond it.
std::string cursor_readout(const Table& table, const Vec2& p_mm);

// Moves a message the editor set (state.editor.status) into the status line, and clears the
// line once the layout changed after it was shown or it is older than kStatusSeconds (ImGui's
// clock). Call once a frame, before anything can set a new message.
void update_status_line(ViewerState& state);
// Seconds until the shown message expires (the window wakes then); none without a message.
double status_seconds_left(const ViewerState& state);

// The bar's height for the state's text at a width, and the bar itself (at the cursor).
float status_bar_height(const ViewerState& state, float width_px);
void draw_status_bar(const ViewerState& state);

}  // namespace rv::ui
