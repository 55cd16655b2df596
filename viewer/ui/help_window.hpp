#pragma once
// The help window (F1, Help ▸ Shortcuts): every shortcut and mouse gesture, generated from the
// table the key handling dispatches from (ui/shortcuts.hpp).
#include <string>
#include <vector>

namespace rv::ui {

struct ViewerState;

struct HelpRow {
    std::string keys;  // "Ctrl+Z", or a mouse gesture
    std::string what;
};
// The rows the window shows: the shortcuts in the table's order, then the mouse gestures.
std::vector<HelpRow> help_rows();

// Draws the window while state.show_help is set (its close box clears it).
void draw_help_window(ViewerState& state);

}  // namespace rv::ui
