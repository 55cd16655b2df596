#pragma once
// What each shortcut of ui/shortcuts.hpp does to the window's state, and the per-frame
// dispatch from that table (the only place keys become actions).
#include "ui/frame.hpp"
#include "ui/shortcuts.hpp"

namespace rv::ui {

// Performs one action on the state's document (an action that edits is refused while a
// solution is previewed, and every action but Escape while an optic is dragged).
void perform(Action action, ViewerState& state);

// Performs the shortcut pressed in this frame, if any (recorded in state.last_action).
void dispatch_shortcuts(ViewerState& state);

// "Quit without saving": the recovery file of the unsaved edits is removed, then the window quits.
void quit_without_saving(ViewerState& state);
// Ctrl+Q and the close box: quits now, or asks first when there are unsaved changes.
void request_quit(ViewerState& state);

}  // namespace rv::ui
